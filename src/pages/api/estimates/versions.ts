import { z } from "zod";
import { safe } from "../../../lib/schema-parts.ts";
import { parseQuery, requireActor, route } from "../../../lib/server/http.ts";
import { measureVersions, parseScope } from "../../../lib/server/services/estimates.ts";

const query = z.object({ measureId: safe(z.string().min(1).max(100)), scope: safe(z.string().max(800)).default("") });
export const GET = route(async ({ locals, url }) => {
  const q = parseQuery(url, query);
  return measureVersions(requireActor(locals, "chamber:read"), q.measureId, parseScope(q.scope));
});

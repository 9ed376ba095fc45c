import { z } from "zod";
import { parseQuery, requireActor, route } from "../../../../lib/server/http.ts";
import { versionCoverage } from "../../../../lib/server/services/chamber-text.ts";

const querySchema = z.object({ text: z.uuid({ message: "must be the id of an upload of the chamber's rules" }).optional() });

export const GET = route(async ({ locals, params, url }) => {
  const q = parseQuery(url, querySchema);
  return versionCoverage(requireActor(locals, "chamber:read"), params.id ?? "", q.text ?? null);
});

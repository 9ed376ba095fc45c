import { z } from "zod";
import { queryInt } from "../../../lib/schema-parts.ts";
import { parseQuery, requireActor, route } from "../../../lib/server/http.ts";
import { getEstimate } from "../../../lib/server/services/estimates.ts";

export const GET = route(async ({ locals, params, url }) => getEstimate(requireActor(locals, "chamber:read"), params.id ?? "", parseQuery(url, z.object({ version: queryInt().min(1).optional() })).version));

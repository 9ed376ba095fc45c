import { parseQuery, requireActor, route } from "../../../../../lib/server/http.ts";
import { orderQuerySchema, walkOrder } from "../../../../../lib/server/services/analysis.ts";

export const GET = route(async ({ locals, params, url }) => walkOrder(requireActor(locals, "chamber:read"), params.id ?? "", parseQuery(url, orderQuerySchema).order));

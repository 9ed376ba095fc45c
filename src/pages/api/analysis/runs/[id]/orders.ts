import { parseQuery, requireActor, route } from "../../../../../lib/server/http.ts";
import { listOrders, ordersQuerySchema } from "../../../../../lib/server/services/analysis.ts";

export const GET = route(async ({ locals, params, url }) => listOrders(requireActor(locals, "chamber:read"), params.id ?? "", parseQuery(url, ordersQuerySchema)));

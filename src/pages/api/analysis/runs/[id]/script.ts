import { parseQuery, requireActor, route } from "../../../../../lib/server/http.ts";
import { orderQuerySchema, scriptFor } from "../../../../../lib/server/services/analysis.ts";

export const GET = route(async ({ locals, params, url }) => {
  const q = parseQuery(url, orderQuerySchema);
  return scriptFor(requireActor(locals, "chamber:read"), params.id ?? "", q.order, q.format, { sitting: q.sitting, date: q.date });
});

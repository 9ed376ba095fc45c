import { parseQuery, requireActor, route } from "../../../lib/server/http.ts";
import { compareQuerySchema, compareVersions } from "../../../lib/server/services/rulebooks.ts";

export const GET = route(async ({ locals, url }) => {
  const actor = requireActor(locals, "chamber:read");
  const q = parseQuery(url, compareQuerySchema);
  return compareVersions(actor, q.from, q.to);
});

import { parseQuery, requireActor, route } from "../../../lib/server/http.ts";
import { csvTemplate, templateQuerySchema } from "../../../lib/server/services/estimates.ts";

export const GET = route(async ({ locals, url }) => {
  const t = await csvTemplate(requireActor(locals, "chamber:read"), parseQuery(url, templateQuerySchema));
  return new Response(t.text, { headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="${t.filename}"`, "cache-control": "no-store" } });
});

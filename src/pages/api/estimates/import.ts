import { parseQuery, requireActor, route } from "../../../lib/server/http.ts";
import { importCsv, importQuerySchema } from "../../../lib/server/services/estimates.ts";

export const POST = route(async ({ locals, request, url }) => {
  const actor = requireActor(locals, "estimate:create");
  const out = await importCsv(actor, request, parseQuery(url, importQuerySchema));
  return Response.json(out, { status: out.preview ? 200 : 201 });
});

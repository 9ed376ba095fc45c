import { parseQuery, requireActor, route } from "../../../lib/server/http.ts";
import { importCsv, importQuerySchema } from "../../../lib/server/services/estimates.ts";
import { readCsvUpload } from "../../../lib/server/uploads.ts";

export const POST = route(async ({ locals, request, url }) => {
  const actor = requireActor(locals, "estimate:create");
  const query = parseQuery(url, importQuerySchema);
  const out = await importCsv(actor, await readCsvUpload(request), query);
  return Response.json(out, { status: out.preview ? 200 : 201 });
});

import { json, requireActor, route } from "../../../lib/server/http.ts";
import { createMeasureFromUpload } from "../../../lib/server/services/measures.ts";
import { readMultipart } from "../../../lib/server/uploads.ts";

// multipart/form-data: file (.txt, .md, .pdf, .docx) plus number, title, committee, subjects, sponsors, sittingAt.
export const POST = route(async ({ locals, request }) => {
  const actor = requireActor(locals, "measure:edit");
  return json(await createMeasureFromUpload(actor, await readMultipart(request)), 201);
});

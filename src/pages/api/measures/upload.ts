import { json, requireActor, route } from "../../../lib/server/http.ts";
import { createMeasureFromUpload } from "../../../lib/server/services/measures.ts";

// multipart/form-data: file (.txt, .md, .pdf, .docx) plus number, title, committee, subjects, sponsors, sittingAt.
export const POST = route(async ({ locals, request }) => json(await createMeasureFromUpload(requireActor(locals, "measure:edit"), request), 201));

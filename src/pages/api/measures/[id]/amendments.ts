import { json, readJson, requireActor, route } from "../../../../lib/server/http.ts";
import { amendmentFileSchema } from "../../../../lib/measures/measure-schemas.ts";
import { fileAmendment, fileAmendmentFromUpload, listAmendments } from "../../../../lib/server/services/amendments.ts";
import { readMultipart } from "../../../../lib/server/uploads.ts";

export const GET = route(async ({ locals, params }) => listAmendments(requireActor(locals, "chamber:read"), params.id ?? ""));

// JSON (the form) or multipart/form-data (an uploaded document with the same fields).
export const POST = route(async ({ locals, request, params }) => {
  const actor = requireActor(locals, "amendment:file");
  const multipart = /^multipart\/form-data\b/i.test(request.headers.get("content-type") ?? "");
  const out = multipart ? await fileAmendmentFromUpload(actor, params.id ?? "", await readMultipart(request)) : await fileAmendment(actor, params.id ?? "", await readJson(request, amendmentFileSchema, "amendment"));
  return json(out, 201);
});

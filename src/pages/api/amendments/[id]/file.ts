import { readJson, requireActor, route } from "../../../../lib/server/http.ts";
import { draftFilingSchema } from "../../../../lib/measures/measure-schemas.ts";
import { fileDraft } from "../../../../lib/server/services/amendments.ts";

// File a draft amendment: it gets the measure's next number and the filer a receipt.
export const POST = route(async ({ locals, request, params }) => {
  const actor = requireActor(locals, "amendment:file");
  return fileDraft(actor, params.id ?? "", await readJson(request, draftFilingSchema, "filing"));
});

import { readJson, requireActor, route } from "../../../../lib/server/http.ts";
import { amendmentUpdateSchema } from "../../../../lib/measures/measure-schemas.ts";
import { getAmendment, updateAmendment } from "../../../../lib/server/services/amendments.ts";

export const GET = route(async ({ locals, params }) => getAmendment(requireActor(locals, "chamber:read"), params.id ?? ""));

// Clerks edit any amendment; the member who filed one may edit or withdraw it while filed (checked in the service).
export const PATCH = route(async ({ locals, request, params }) => {
  const actor = requireActor(locals, "amendment:file");
  return updateAmendment(actor, params.id ?? "", await readJson(request, amendmentUpdateSchema, "amendment"));
});

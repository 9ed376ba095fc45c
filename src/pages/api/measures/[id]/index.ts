import { readJson, requireActor, route } from "../../../../lib/server/http.ts";
import { measureUpdateSchema } from "../../../../lib/measures/measure-schemas.ts";
import { getMeasure, updateMeasure } from "../../../../lib/server/services/measures.ts";

export const GET = route(async ({ locals, params }) => getMeasure(requireActor(locals, "chamber:read"), params.id ?? ""));

export const PATCH = route(async ({ locals, request, params }) => {
  const actor = requireActor(locals, "measure:edit");
  return updateMeasure(actor, params.id ?? "", await readJson(request, measureUpdateSchema, "measure"));
});

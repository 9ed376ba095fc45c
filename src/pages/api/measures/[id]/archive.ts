import { readJson, requireActor, route } from "../../../../lib/server/http.ts";
import { versionOnlySchema } from "../../../../lib/measures/measure-schemas.ts";
import { archiveMeasure } from "../../../../lib/server/services/measures.ts";

// Clerks archive a measure (a mistake, a duplicate): it leaves the lists, stays readable, takes no changes.
export const POST = route(async ({ locals, request, params }) => {
  const actor = requireActor(locals, "measure:edit");
  return archiveMeasure(actor, params.id ?? "", await readJson(request, versionOnlySchema, "archiving"));
});

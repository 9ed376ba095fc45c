import { json, readJson, requireActor, route } from "../../../../../lib/server/http.ts";
import { overrideCreateSchema } from "../../../../../lib/measures/measure-schemas.ts";
import { recordOverride } from "../../../../../lib/server/services/trees.ts";

export const POST = route(async ({ locals, request, params }) => {
  const actor = requireActor(locals, "tree:override");
  return json(await recordOverride(actor, params.id ?? "", await readJson(request, overrideCreateSchema, "override")), 201);
});

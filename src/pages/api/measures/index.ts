import { json, readJson, requireActor, route } from "../../../lib/server/http.ts";
import { measureCreateSchema } from "../../../lib/measures/measure-schemas.ts";
import { createMeasure, listMeasures } from "../../../lib/server/services/measures.ts";

export const GET = route(async ({ locals }) => listMeasures(requireActor(locals, "chamber:read")));

export const POST = route(async ({ locals, request }) => {
  const actor = requireActor(locals, "measure:edit");
  const input = await readJson(request, measureCreateSchema, "measure");
  return json(await createMeasure(actor, input), 201);
});

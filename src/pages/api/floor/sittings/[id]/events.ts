import { json, readJson, requireActor, route } from "../../../../../lib/server/http.ts";
import { recordEvent, recordSchema } from "../../../../../lib/server/services/floor.ts";

export const POST = route(async ({ locals, request, params }) => {
  const actor = requireActor(locals, "floor:record");
  return json(await recordEvent(actor, params.id ?? "", await readJson(request, recordSchema, "floor event")), 201);
});

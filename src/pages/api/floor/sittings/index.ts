import { json, readJson, requireActor, route } from "../../../../lib/server/http.ts";
import { listSittings, openSitting, openSittingSchema } from "../../../../lib/server/services/floor.ts";

export const GET = route(async ({ locals }) => listSittings(requireActor(locals, "chamber:read")));

export const POST = route(async ({ locals, request }) => {
  const actor = requireActor(locals, "floor:record");
  return json(await openSitting(actor, await readJson(request, openSittingSchema, "sitting")), 201);
});

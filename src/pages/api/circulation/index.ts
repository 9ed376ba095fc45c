import { json, readJson, requireActor, route } from "../../../lib/server/http.ts";
import { circulateRuling, listCirculations, sendSchema } from "../../../lib/server/services/circulation.ts";

export const prerender = false;

/** Recent sendings with their delivery counts by status. */
export const GET = route(async ({ locals }) => listCirculations(requireActor(locals, "circulation:send")));

/** Circulate an issued ruling to a distribution list (staff and clerks). */
export const POST = route(async ({ locals, request }) => {
  const actor = requireActor(locals, "circulation:send");
  return json(await circulateRuling(actor, await readJson(request, sendSchema, "circulation")), 201);
});

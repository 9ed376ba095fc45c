import { json, readJson, requireActor, route } from "../../../../lib/server/http.ts";
import { reviseRuling, reviseSchema } from "../../../../lib/server/services/rulings.ts";

export const prerender = false;

/** Correct an issued ruling: a new revision; the earlier ones stay in the history. */
export const POST = route(async ({ locals, params, request }) => {
  const actor = requireActor(locals, "ruling:issue");
  return json(await reviseRuling(actor, params.id ?? "", await readJson(request, reviseSchema, "correction")), 201);
});

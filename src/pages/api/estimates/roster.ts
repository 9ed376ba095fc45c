import { readJson, requireActor, route } from "../../../lib/server/http.ts";
import { createRosterDraft, rosterDraftSchema } from "../../../lib/server/services/estimates.ts";

/** Start an estimate from the chamber's roster: an unfilled draft, filled in on the estimate's page. */
export const POST = route(async ({ locals, request }) => {
  const actor = requireActor(locals, "estimate:create");
  return Response.json(await createRosterDraft(actor, await readJson(request, rosterDraftSchema, "estimate")), { status: 201 });
});

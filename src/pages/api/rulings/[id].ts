import { readJson, requireActor, route } from "../../../lib/server/http.ts";
import { getRuling, updateDraft, updateDraftSchema } from "../../../lib/server/services/rulings.ts";

export const prerender = false;

/** One ruling with its revision history (and, for those who circulate, its deliveries). */
export const GET = route(async ({ locals, params }) => {
  const actor = requireActor(locals, "chamber:read");
  return getRuling(actor, params.id ?? "");
});

/** Edit a draft (optimistic: send the version you read). Issued rulings answer 409. */
export const PUT = route(async ({ locals, params, request }) => {
  const actor = requireActor(locals, "ruling:draft");
  return updateDraft(actor, params.id ?? "", await readJson(request, updateDraftSchema, "ruling"));
});

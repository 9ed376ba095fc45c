import { readJson, requireActor, route } from "../../../../lib/server/http.ts";
import { issueRuling, issueSchema } from "../../../../lib/server/services/rulings.ts";

export const prerender = false;

/** Issue a draft; with circulateTo, its messages are queued in the same transaction. */
export const POST = route(async ({ locals, params, request }) => {
  const actor = requireActor(locals, "ruling:issue");
  return issueRuling(actor, params.id ?? "", await readJson(request, issueSchema, "issue"));
});

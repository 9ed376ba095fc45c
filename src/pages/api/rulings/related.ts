import { parseQuery, requireActor, route } from "../../../lib/server/http.ts";
import { relatedPrecedents, relatedSchema } from "../../../lib/server/services/rulings.ts";

export const prerender = false;

/**
 * Related precedents: issued rulings citing the same rule (?rule= rule id, ?citation= citation
 * text) or sharing words with ?text= (a draft, or a tree finding's message). ?exclude= an id.
 */
export const GET = route(async ({ locals, url }) => {
  const actor = requireActor(locals, "chamber:read");
  return relatedPrecedents(actor, parseQuery(url, relatedSchema));
});

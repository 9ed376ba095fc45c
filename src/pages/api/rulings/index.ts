import { json, parseQuery, readJson, requireActor, route } from "../../../lib/server/http.ts";
import { createDraft, createDraftSchema, searchRulings, searchSchema } from "../../../lib/server/services/rulings.ts";

export const prerender = false;

/** Precedent search over the chamber's rulings: ?q= (web-search syntax), rule, measure, motion, from, to, status. */
export const GET = route(async ({ locals, url }) => {
  const actor = requireActor(locals, "chamber:read");
  return searchRulings(actor, parseQuery(url, searchSchema));
});

/** Record a new draft ruling (clerks). */
export const POST = route(async ({ locals, request }) => {
  const actor = requireActor(locals, "ruling:draft");
  return json(await createDraft(actor, await readJson(request, createDraftSchema, "ruling")), 201);
});

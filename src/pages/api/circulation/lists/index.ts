import { json, readJson, requireActor, route } from "../../../../lib/server/http.ts";
import { createList, listInputSchema, listLists } from "../../../../lib/server/services/circulation.ts";

export const prerender = false;

export const GET = route(async ({ locals }) => listLists(requireActor(locals, "circulation:send")));

export const POST = route(async ({ locals, request }) => {
  const actor = requireActor(locals, "lists:edit");
  return json(await createList(actor, await readJson(request, listInputSchema, "list")), 201);
});

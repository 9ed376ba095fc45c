import { readJson, requireActor, route } from "../../../../lib/server/http.ts";
import { deleteList, getList, listUpdateSchema, updateList } from "../../../../lib/server/services/circulation.ts";

export const prerender = false;

/** A list with the recipients it reaches today (and who has unsubscribed). */
export const GET = route(async ({ locals, params }) => getList(requireActor(locals, "circulation:send"), params.id ?? ""));

export const PUT = route(async ({ locals, params, request }) => {
  const actor = requireActor(locals, "lists:edit");
  return updateList(actor, params.id ?? "", await readJson(request, listUpdateSchema, "list"));
});

export const DELETE = route(async ({ locals, params }) => deleteList(requireActor(locals, "lists:edit"), params.id ?? ""));

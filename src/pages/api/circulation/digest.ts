import { json, readJson, requireActor, route } from "../../../lib/server/http.ts";
import { digestSchema, sendFloorDigest } from "../../../lib/server/services/circulation.ts";

export const prerender = false;

/**
 * Queue a floor-day digest (findings and proposed order, given as input) to the clerks' list, or
 * to the chamber's distribution list named by the optional `listId` (another chamber's list: 422
 * on `listId`). Body: { sitting, date, measure?, findings?, proposedOrder?, note?, listId? }.
 */
export const POST = route(async ({ locals, request }) => {
  const actor = requireActor(locals, "circulation:send");
  return json(await sendFloorDigest(actor, await readJson(request, digestSchema, "digest")), 201);
});

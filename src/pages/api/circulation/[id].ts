import { requireActor, route } from "../../../lib/server/http.ts";
import { getCirculation } from "../../../lib/server/services/circulation.ts";

export const prerender = false;

/** One sending and the delivery status of each recipient's message. */
export const GET = route(async ({ locals, params }) => getCirculation(requireActor(locals, "circulation:send"), params.id ?? ""));

import { requireActor, route } from "../../../../../lib/server/http.ts";
import { retryMessage } from "../../../../../lib/server/services/circulation.ts";

export const prerender = false;

/** Requeue a failed or uncertain message (same Message-ID). */
export const POST = route(async ({ locals, params }) => retryMessage(requireActor(locals, "circulation:send"), params.id ?? ""));

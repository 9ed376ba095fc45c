import { parseQuery, readJson, route } from "../../../lib/server/http.ts";
import { describeUnsubscribe, unsubscribe, unsubscribeSchema } from "../../../lib/server/services/circulation.ts";

export const prerender = false;

/** What a signed unsubscribe link refers to. No sign-in: the signature is the authority. */
export const GET = route(async ({ url }) => describeUnsubscribe(parseQuery(url, unsubscribeSchema).token));

/** Honour the link: later sendings to that list skip the address. */
export const POST = route(async ({ request }) => unsubscribe((await readJson(request, unsubscribeSchema, "unsubscribe")).token));

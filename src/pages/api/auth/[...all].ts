import type { APIRoute } from "astro";
import { auth } from "../../../lib/server/auth.ts";
import { withClientAddress } from "../../../lib/server/client-address.ts";

export const prerender = false;
// The client address better-auth limits by is the connection's peer (scripts/serve.mjs passes it
// in locals), or the right-most untrusted X-Forwarded-For hop behind a TRUSTED_PROXIES proxy.
export const ALL: APIRoute = (ctx) => auth.handler(withClientAddress(ctx.request, ctx.locals.peerAddress));

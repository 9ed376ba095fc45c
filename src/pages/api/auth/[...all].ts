import type { APIRoute } from "astro";
import { auth } from "../../../lib/server/auth.ts";
import { errorResponse, refuseBadText } from "../../../lib/server/http.ts";
import { withClientAddress } from "../../../lib/server/client-address.ts";

export const prerender = false;

/**
 * better-auth stores names, e-mail addresses and tokens as they come; a NUL character or half a
 * surrogate pair would reach PostgreSQL and come back as a 500. Refuse them here, naming the field
 * (src/lib/schema-parts.ts); everything else is better-auth's.
 */
async function badText(request: Request): Promise<Response | null> {
  try {
    const url = new URL(request.url);
    refuseBadText(Object.fromEntries(url.searchParams), "query");
    if (/^application\/json\b/i.test(request.headers.get("content-type") ?? "")) {
      let value: unknown;
      try {
        value = JSON.parse(await request.clone().text());
      } catch {
        return null; // better-auth answers malformed JSON itself
      }
      refuseBadText(value, "request body");
    }
    return null;
  } catch (e) {
    return errorResponse(e);
  }
}

// The client address better-auth limits by is the connection's peer (scripts/serve.mjs passes it
// in locals), or the right-most untrusted X-Forwarded-For hop behind a TRUSTED_PROXIES proxy.
export const ALL: APIRoute = async (ctx) => (await badText(ctx.request)) ?? auth.handler(withClientAddress(ctx.request, ctx.locals.peerAddress));

import { defineMiddleware } from "astro:middleware";
import { randomUUID } from "node:crypto";
import { ensureMigrated } from "./lib/server/db.ts";
import { contextFor, forgetAccessAfter } from "./lib/server/context.ts";
import { startOutboxWorker } from "./lib/server/mail.ts";
import { errorResponse, isDatabaseUnavailable } from "./lib/server/http.ts";
import { describeError } from "./lib/server/log-safe.ts";
import { baseUrl } from "./lib/server/auth.ts";
import { crossSiteRefusal } from "./lib/server/origin-check.ts";
import { contentSecurityPolicy } from "./lib/server/csp.ts";

const SECURITY_HEADERS: Record<string, string> = {
  "x-content-type-options": "nosniff",
  "referrer-policy": "same-origin",
  "x-frame-options": "DENY",
  "permissions-policy": "camera=(), microphone=(), geolocation=()",
  // Scripts without 'unsafe-inline': Astro's own inline scripts by hash (src/lib/server/csp.ts).
  "content-security-policy": contentSecurityPolicy(),
};

export const onRequest = defineMiddleware(async (ctx, next) => {
  ctx.locals.requestId = randomUUID();
  const path = ctx.url.pathname;
  const isAsset = path.startsWith("/_astro/") || path === "/favicon.svg";
  // Same-origin writes only, before any work is done (origin-check.ts).
  const crossSite = crossSiteRefusal(ctx.request, path, [new URL(baseUrl()).origin, ctx.url.origin]);
  if (crossSite) return withSecurityHeaders(errorResponse(crossSite), ctx.url);
  if (!isAsset) {
    try {
      await ensureMigrated();
      startOutboxWorker();
      if (!path.startsWith("/api/auth/")) Object.assign(ctx.locals, await contextFor(ctx.request.headers));
      else Object.assign(ctx.locals, { user: null, session: null, chamber: null, role: null, chambers: [] });
    } catch (e) {
      // Only a database outage is a 503 (retry shortly); anything else is a bug: a logged 500.
      if (path.startsWith("/api/")) return errorResponse(e);
      if (isDatabaseUnavailable(e)) {
        console.error("[request] database unavailable:", describeError(e));
        return new Response("Gavelwright cannot reach its database just now. Nothing was changed. Try again in a moment.", { status: 503, headers: { "content-type": "text/plain; charset=utf-8", "retry-after": "5" } });
      }
      console.error("[request] unexpected error:", describeError(e));
      return new Response("Something went wrong on the server. Nothing was changed.", { status: 500, headers: { "content-type": "text/plain; charset=utf-8" } });
    }
  }
  const res = await next();
  forgetAccessAfter(ctx.request.method, path);
  return withSecurityHeaders(res, ctx.url);
});

function withSecurityHeaders(res: Response, url: URL): Response {
  for (const [k, v] of Object.entries(SECURITY_HEADERS)) if (!res.headers.has(k)) res.headers.set(k, v);
  if (url.protocol === "https:") res.headers.set("strict-transport-security", "max-age=31536000; includeSubDomains");
  return res;
}

/**
 * Cross-site request refusal for every state-changing API route (the middleware calls this before
 * anything else runs). A browser always sends `Origin` with a POST, PUT, PATCH or DELETE from a
 * page, so a request that names another origin (or "null", as sandboxed frames and some
 * redirects do) did not come from one of this app's pages and is refused with 403. A request
 * without `Origin` is not from a cross-site page (command-line tools, a mail provider's one-click
 * unsubscribe) and is let through unless `Sec-Fetch-Site` says it is cross-site. better-auth
 * checks its own routes (/api/auth/…) against `trustedOrigins` as well.
 * (OWASP Cross-Site Request Forgery Prevention Cheat Sheet, "Verifying Origin with standard
 * headers" and "Fetch Metadata headers", paraphrase.)
 */
import { GavelError } from "../errors.ts";

const STATE_CHANGING = new Set(["POST", "PUT", "PATCH", "DELETE"]);

/** A GavelError("forbidden") if `request` to `path` is a cross-site write; null when it may go on. */
export function crossSiteRefusal(request: Request, path: string, sameOrigins: readonly string[]): GavelError | null {
  if (!STATE_CHANGING.has(request.method.toUpperCase()) || !path.startsWith("/api/")) return null;
  const origin = request.headers.get("origin");
  const site = request.headers.get("sec-fetch-site");
  const refuse = () => new GavelError("forbidden", "This request comes from another site. Changes are accepted only from Gavelwright's own pages.");
  if (origin !== null) return sameOrigins.includes(origin) ? null : refuse();
  if (site !== null && site !== "same-origin" && site !== "none") return refuse();
  return null;
}

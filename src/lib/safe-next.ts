/**
 * Where to send someone after signing in or up (`?next=`): only a page of this app, on this
 * app's origin. Shared by the sign-in and sign-up pages (server) and AccountForm (browser), so
 * the value is checked where it is read and again just before `location.assign`.
 *
 * The value is resolved against the app's origin the way a browser would resolve it, and kept
 * only if the result stays on that origin and its path is one the app serves as a page. What is
 * returned is the re-serialised path (never the raw input), so what was checked is what the
 * browser is sent to. Anything else gives the fallback.
 */

/** Page paths the app serves (src/pages, without the API, sign-in and sign-up). Ids are slugs or UUIDs. */
const ID = "[A-Za-z0-9_-]{1,80}";
const PAGES: RegExp[] = [
  "/",
  "/chambers",
  "/people",
  "/people/log",
  "/circulation",
  "/dev/mail",
  "/floor",
  "/floor/moves",
  `/floor/${ID}`,
  `/floor/${ID}/journal`,
  "/forgot-password",
  `/invitations/${ID}`,
  "/measures",
  `/measures/${ID}`,
  `/measures/${ID}/(?:tree|print)`,
  "/orders",
  `/orders/${ID}`,
  `/orders/${ID}/script`,
  "/rulebooks",
  `/rulebooks/${ID}`,
  "/rulings",
  `/rulings/${ID}`,
].map((p) => new RegExp(`^${p}/?$`));

/** Longest `next` worth considering (a page path with its query). */
const MAX_LENGTH = 2048;

/** True when `pathname` (as a URL serialises it) is a page this app serves. */
export function isAppPage(pathname: string): boolean {
  return PAGES.some((re) => re.test(pathname));
}

/**
 * `next` if it names a page of this app on `origin`, as a path (`/measures/abc?tab=tree`);
 * otherwise `fallback`.
 */
export function safeNext(next: string | null | undefined, origin: string, fallback = "/"): string {
  if (typeof next !== "string" || next.length === 0 || next.length > MAX_LENGTH) return fallback;
  // Browsers drop tabs and newlines from a URL and read "\" as "/", so "/\evil.example" or
  // "/\t/evil.example" would leave the origin: refuse control characters and backslashes outright.
  if (/[\u0000-\u001f\u007f\\]/.test(next)) return fallback;
  // Only a path: not a scheme ("javascript:", "https:"), not protocol-relative ("//host").
  if (!next.startsWith("/") || next.startsWith("//")) return fallback;
  let base: URL;
  let url: URL;
  try {
    base = new URL(origin);
    url = new URL(next, base);
  } catch {
    return fallback;
  }
  if (url.origin !== base.origin || url.username || url.password) return fallback;
  if (!isAppPage(url.pathname)) return fallback;
  return url.pathname + url.search + url.hash;
}

/**
 * The one door of every page that needs a chamber (decision 0008):
 *
 * - not signed in: redirect to /sign-in, back here after;
 * - signed in but in no chamber: redirect to /chambers;
 * - signed in but not permitted (`permission` not held by the role): the page /not-permitted is
 *   rendered in place (status 403, inside the app's layout, saying which roles may open it, with
 *   a way back), the same answer on every page;
 * - otherwise the actor.
 *
 * `guardPage` is the door of a list or form page; `guardDetailPage` also loads the record in the
 * actor's chamber, where another chamber's record, or none, answers 404 as its API does.
 */
import type { AstroGlobal } from "astro";
import { isGavelError, type GavelError } from "../errors.ts";
import { NAV } from "../navigation.ts";
import { can, type Permission } from "../permissions.ts";
import type { Actor } from "./http.ts";

type PageContext = Pick<AstroGlobal, "locals" | "url" | "redirect" | "response" | "rewrite">;

interface PageGuardOptions {
  /** Checked on the actor (omit for any role of the chamber). */
  permission?: Permission;
  /** Keep the query string in the sign-in `next` link (pages addressed by their query). */
  nextWithSearch?: boolean;
}

/** The answer to "signed in but not permitted": /not-permitted rendered in place, status 403. */
export function notPermitted(astro: PageContext, permission: Permission): Promise<Response> {
  const q = new URLSearchParams({ from: astro.url.pathname, need: permission });
  return astro.rewrite(`/not-permitted?${q}`);
}

/**
 * A page that cannot be shown (no such record, a damaged link): /404 rendered in place inside the
 * app's layout, with a title, the message in words and a way back. `back` defaults to the area the
 * address belongs to (its list page), else the desk.
 */
export function answerPage(astro: PageContext, answer: { message: string; status?: number; title?: string; back?: { href: string; label: string } }): Promise<Response> {
  const status = answer.status ?? 404;
  const area = NAV.find((i) => i.href !== "/" && astro.url.pathname.startsWith(i.href + "/"));
  const back = answer.back ?? (area ? { href: area.href, label: area.label } : undefined);
  astro.locals.pageAnswer = { status, title: answer.title ?? (status === 404 ? "Not found" : "This link cannot be opened"), message: answer.message, back };
  return astro.rewrite("/404");
}

/** The door of a page: a Response to return at once (redirect or refusal), or who is asking. */
export async function guardPage(astro: PageContext, options: PageGuardOptions = {}): Promise<Response | { actor: Actor }> {
  const { user, chamber, role } = astro.locals;
  if (!user) return astro.redirect(`/sign-in?next=${encodeURIComponent(astro.url.pathname + (options.nextWithSearch ? astro.url.search : ""))}`);
  if (!chamber || !role) return astro.redirect("/chambers");
  if (options.permission && !can(role, options.permission)) return notPermitted(astro, options.permission);
  return { actor: { user, chamber, role } };
}

interface GuardOptions<T> extends PageGuardOptions {
  /** Loads the record for the actor; throws GavelError "not-found" when the chamber has none. */
  load: (actor: Actor) => Promise<T>;
  /** Other GavelErrors (bad query input) answer 400 with their message instead of failing the page. */
  badInputAs400?: boolean;
}

interface Guarded<T> {
  actor: Actor;
  data: T;
}

/**
 * `notFound`: the message of the not-found page (answerPage) (or a function of the error giving it), or
 * "render" to render the page itself with status 404 and `data: null`.
 */
export async function guardDetailPage<T>(astro: PageContext, options: GuardOptions<T> & { notFound: "render" }): Promise<Response | Guarded<T | null>>;
export async function guardDetailPage<T>(astro: PageContext, options: GuardOptions<T> & { notFound: string | ((e: GavelError) => string) }): Promise<Response | Guarded<T>>;
export async function guardDetailPage<T>(astro: PageContext, options: GuardOptions<T> & { notFound: string | ((e: GavelError) => string) }): Promise<Response | Guarded<T | null>> {
  const door = await guardPage(astro, options);
  if (door instanceof Response) return door;
  const { actor } = door;
  try {
    return { actor, data: await options.load(actor) };
  } catch (e) {
    if (!isGavelError(e)) throw e;
    if (e.code === "not-found") {
      if (options.notFound === "render") {
        astro.response.status = 404;
        return { actor, data: null };
      }
      return answerPage(astro, { message: typeof options.notFound === "function" ? options.notFound(e) : options.notFound });
    }
    // The details name fields of the address (developer words): the reader is told in plain words.
    if (options.badInputAs400) return answerPage(astro, { status: 400, message: "The link to this page is incomplete or damaged. Open the page again from where you found it." });
    throw e;
  }
}

/**
 * The door of a detail page (/measures/[id], /rulings/[id] …): sign in first (back here after),
 * work in a chamber, then load the record in the actor's chamber. A record of another chamber,
 * or none, answers 404 as its API does, never an empty page.
 */
import type { AstroGlobal } from "astro";
import { isGavelError, type GavelError } from "../errors.ts";
import type { Permission } from "../permissions.ts";
import { requireActor, type Actor } from "./http.ts";

type PageContext = Pick<AstroGlobal, "locals" | "url" | "redirect" | "response">;

interface GuardOptions<T> {
  /** Loads the record for the actor; throws GavelError "not-found" when the chamber has none. */
  load: (actor: Actor) => Promise<T>;
  /** Checked on the actor before loading (omit for any role of the chamber). */
  permission?: Permission;
  /** Keep the query string in the sign-in `next` link (pages addressed by their query). */
  nextWithSearch?: boolean;
  /** Other GavelErrors (bad query input) answer 400 with their message instead of failing the page. */
  badInputAs400?: boolean;
}

interface Guarded<T> {
  actor: Actor;
  data: T;
}

/**
 * `notFound`: the text of the plain 404 answer (or a function of the error giving it), or
 * "render" to render the page itself with status 404 and `data: null`.
 */
export async function guardDetailPage<T>(astro: PageContext, options: GuardOptions<T> & { notFound: "render" }): Promise<Response | Guarded<T | null>>;
export async function guardDetailPage<T>(astro: PageContext, options: GuardOptions<T> & { notFound: string | ((e: GavelError) => string) }): Promise<Response | Guarded<T>>;
export async function guardDetailPage<T>(astro: PageContext, options: GuardOptions<T> & { notFound: string | ((e: GavelError) => string) }): Promise<Response | Guarded<T | null>> {
  const { user, chamber, role } = astro.locals;
  if (!user) return astro.redirect(`/sign-in?next=${encodeURIComponent(astro.url.pathname + (options.nextWithSearch ? astro.url.search : ""))}`);
  if (!chamber || !role) return astro.redirect("/chambers");
  const actor = requireActor(astro.locals, options.permission);
  try {
    return { actor, data: await options.load(actor) };
  } catch (e) {
    if (!isGavelError(e)) throw e;
    if (e.code === "not-found") {
      if (options.notFound === "render") {
        astro.response.status = 404;
        return { actor, data: null };
      }
      return new Response(typeof options.notFound === "function" ? options.notFound(e) : options.notFound, { status: 404 });
    }
    if (options.badInputAs400) return new Response(e.message, { status: 400 });
    throw e;
  }
}

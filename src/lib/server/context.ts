/** Who is asking, and in which chamber: loaded once per request by the middleware. */
import { and, asc, eq } from "drizzle-orm";
import { auth } from "./auth.ts";
import { db } from "./db.ts";
import { member, organization, session as sessionTable } from "../db/schema/auth.ts";
import { isChamberRole, type ChamberRole } from "../permissions.ts";
import { caughtUp, isListening, onListenChange, onNotice } from "./notices.ts";

export interface RequestContext {
  user: App.Locals["user"];
  session: App.Locals["session"];
  chamber: App.Locals["chamber"];
  role: ChamberRole | null;
  chambers: App.Locals["chambers"];
}

export async function chambersOf(userId: string): Promise<App.Locals["chambers"]> {
  const rows = await db
    .select({ id: organization.id, name: organization.name, slug: organization.slug, timeZone: organization.timeZone, role: member.role })
    .from(member)
    .innerJoin(organization, eq(member.organizationId, organization.id))
    .where(eq(member.userId, userId))
    .orderBy(asc(organization.name));
  return rows.filter((r) => isChamberRole(r.role)).map((r) => ({ ...r, role: r.role as ChamberRole }));
}

export async function loadContext(headers: Headers): Promise<RequestContext> {
  const s = await auth.api.getSession({ headers });
  if (!s) return { user: null, session: null, chamber: null, role: null, chambers: [] };
  const chambers = await chambersOf(s.user.id);
  let active = chambers.find((c) => c.id === s.session.activeOrganizationId) ?? null;
  if (!active && chambers.length > 0) {
    // No (or a stale) active chamber: fall back to the first, and remember it.
    active = chambers[0];
    await db.update(sessionTable).set({ activeOrganizationId: active.id }).where(and(eq(sessionTable.id, s.session.id)));
  }
  return {
    user: s.user,
    session: s.session,
    chamber: active ? { id: active.id, name: active.name, slug: active.slug, timeZone: active.timeZone } : null,
    role: active?.role ?? null,
    chambers,
  };
}

/*
 * Who is asking, remembered per session cookie for a few seconds, so that a busy desk does not
 * ask PostgreSQL the same three questions on every call. Safe because it is forgotten as soon as
 * anything it rests on changes: triggers on the session, member, user and organization tables
 * send NOTIFY gw_access (drizzle/0006_change_notices.sql) to every server, and this process
 * also forgets everything after any request that changes sign-ins or roles (forgetAccess). It is
 * used only while LISTEN is in place (a server that might miss a notice keeps nothing) and only
 * once this process has heard every notice committed before the request (caughtUp), an entry
 * loaded while a notice arrived is not kept, and nothing lives longer than ACCESS_TTL_MS or past
 * its session's expiry. Set GAVELWRIGHT_ACCESS_CACHE_MS=0 to turn it off.
 */
export const ACCESS_CHANNEL = "gw_access";
const ACCESS_TTL_MS = Math.max(0, Number(process.env.GAVELWRIGHT_ACCESS_CACHE_MS ?? 15_000) || 0);
const ACCESS_MAX_ENTRIES = 10_000;
const SESSION_COOKIES = new Set(["better-auth.session_token", "__Secure-better-auth.session_token"]);

const remembered = new Map<string, { at: number; ctx: RequestContext }>();
let generation = 0;
let subscribed: Promise<unknown> | null = null;
// Whatever was remembered while LISTEN was down may have missed a notice: forget it all.
onListenChange(() => forgetAccess());

/** The session cookie exactly as sent (name=value), or null when there is none. */
export function sessionCookieOf(headers: Headers): string | null {
  const header = headers.get("cookie");
  if (!header) return null;
  for (const part of header.split(";")) {
    const eq = part.indexOf("=");
    if (eq > 0 && SESSION_COOKIES.has(part.slice(0, eq).trim())) return part.trim();
  }
  return null;
}

/** Forget what was remembered of `userId`, or of everyone. */
export function forgetAccess(userId?: string): void {
  generation++;
  if (!userId) return remembered.clear();
  for (const [key, e] of remembered) if (e.ctx.user?.id === userId) remembered.delete(key);
}

function subscribe() {
  subscribed ??= onNotice(ACCESS_CHANNEL, (payload) => forgetAccess(payload === "*" ? undefined : payload)).catch(() => {
    subscribed = null; // the database is unreachable: try again on a later request
  });
}

/** loadContext, answered from memory while that is known to be current (see above). */
export async function contextFor(headers: Headers): Promise<RequestContext> {
  const key = ACCESS_TTL_MS > 0 ? sessionCookieOf(headers) : null;
  if (!key) return loadContext(headers);
  subscribe();
  // Only after hearing every notice committed before now (a sign-out or role change on any server).
  if (remembered.has(key) && (await caughtUp())) {
    const now = Date.now();
    const hit = remembered.get(key);
    if (hit && now - hit.at < ACCESS_TTL_MS && hit.ctx.session && new Date(hit.ctx.session.expiresAt).getTime() > now) return { ...hit.ctx };
    remembered.delete(key);
  }
  const now = Date.now();
  const before = generation;
  const ctx = await loadContext(headers);
  if (ctx.user && before === generation && isListening()) {
    if (remembered.size >= ACCESS_MAX_ENTRIES) remembered.delete(remembered.keys().next().value!);
    remembered.set(key, { at: now, ctx });
  }
  return { ...ctx };
}

/** After a request: sign-in, sign-out, chamber switches and role changes clear this server's access memory at once. */
export function forgetAccessAfter(method: string, path: string): void {
  if (method !== "GET" && method !== "HEAD" && (path.startsWith("/api/auth/") || path.startsWith("/api/people/"))) forgetAccess();
}

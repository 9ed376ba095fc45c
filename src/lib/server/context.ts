/** Who is asking, and in which chamber: loaded once per request by the middleware. */
import { and, asc, eq } from "drizzle-orm";
import { auth } from "./auth.ts";
import { db } from "./db.ts";
import { member, organization, session as sessionTable } from "../db/schema/auth.ts";
import { isChamberRole, type ChamberRole } from "../permissions.ts";

export interface RequestContext {
  user: App.Locals["user"];
  session: App.Locals["session"];
  chamber: App.Locals["chamber"];
  role: ChamberRole | null;
  chambers: App.Locals["chambers"];
}

export async function chambersOf(userId: string): Promise<App.Locals["chambers"]> {
  const rows = await db
    .select({ id: organization.id, name: organization.name, slug: organization.slug, role: member.role })
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
    chamber: active ? { id: active.id, name: active.name, slug: active.slug } : null,
    role: active?.role ?? null,
    chambers,
  };
}

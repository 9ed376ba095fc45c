/** Who belongs to a chamber: members, roles and invitations. */
import { and, asc, desc, eq, gt } from "drizzle-orm";
import { z } from "zod";
import { auth } from "../auth.ts";
import { fromAuthError } from "../auth-errors.ts";
import { db, type Tx } from "../db.ts";
import { invitation, member, user } from "../../db/schema/auth.ts";
import { peopleAudit } from "../../db/schema/people-audit.ts";
import { GavelError } from "../../errors.ts";
import { CHAMBER_ROLES, can, isChamberRole, type ChamberRole } from "../../permissions.ts";
import { emailSchema } from "../../account-schemas.ts";
import type { Actor } from "../http.ts";

export const inviteSchema = z.object({ email: emailSchema, role: z.enum(CHAMBER_ROLES) });
export const roleChangeSchema = z.object({ role: z.enum(CHAMBER_ROLES) });

export async function listPeople(actor: Actor) {
  const members = await db
    .select({ id: member.id, userId: user.id, name: user.name, email: user.email, role: member.role, since: member.createdAt })
    .from(member)
    .innerJoin(user, eq(member.userId, user.id))
    .where(eq(member.organizationId, actor.chamber.id))
    .orderBy(asc(user.name));
  // Addresses go only to those who may see them (chief clerk and clerks); others get null.
  const seeEmail = can(actor.role, "people:see-email");
  const people = members.map((m) => ({ ...m, email: seeEmail ? m.email : null }));
  const invitations = can(actor.role, "people:invite")
    ? await db
        .select({ id: invitation.id, email: invitation.email, role: invitation.role, status: invitation.status, expiresAt: invitation.expiresAt })
        .from(invitation)
        .where(and(eq(invitation.organizationId, actor.chamber.id), eq(invitation.status, "pending"), gt(invitation.expiresAt, new Date())))
        .orderBy(asc(invitation.email))
    : [];
  return { members: people, invitations };
}

export async function invite(actor: Actor, headers: Headers, input: z.output<typeof inviteSchema>) {
  const [existing] = await db
    .select({ id: member.id })
    .from(member)
    .innerJoin(user, eq(member.userId, user.id))
    .where(and(eq(member.organizationId, actor.chamber.id), eq(user.email, input.email.toLowerCase())));
  if (existing) throw new GavelError("conflict", `${input.email} already belongs to ${actor.chamber.name}.`, { issues: [{ path: "email", message: "already a member of this chamber" }] });
  try {
    const inv = await auth.api.createInvitation({ headers, body: { email: input.email, role: input.role, organizationId: actor.chamber.id, resend: true } });
    return { id: inv.id, email: inv.email, role: inv.role, expiresAt: inv.expiresAt };
  } catch (e) {
    throw fromAuthError(e);
  }
}

export async function cancelInvitation(actor: Actor, headers: Headers, invitationId: string) {
  const [inv] = await db.select({ id: invitation.id }).from(invitation).where(and(eq(invitation.id, invitationId), eq(invitation.organizationId, actor.chamber.id)));
  if (!inv) throw new GavelError("not-found", "No such invitation in this chamber.");
  try {
    await auth.api.cancelInvitation({ headers, body: { invitationId } });
  } catch (e) {
    throw fromAuthError(e);
  }
}

type Q = Tx | typeof db;

async function nameOf(q: Q, userId: string): Promise<string> {
  const [u] = await q.select({ name: user.name }).from(user).where(eq(user.id, userId));
  return u?.name ?? "(former account)";
}

/** The chamber's members, locked for the change (role changes and removals are serialised per chamber). */
async function lockedMembers(tx: Tx, chamberId: string) {
  return tx.select({ id: member.id, userId: member.userId, role: member.role }).from(member).where(eq(member.organizationId, chamberId)).for("update");
}

const LAST_CHIEF = "A chamber needs at least one chief clerk. Make someone else chief clerk first.";

/** Change a member's role; the change and its line in the people log commit together. */
export async function changeRole(actor: Actor, memberId: string, role: ChamberRole) {
  return db.transaction(async (tx) => {
    const rows = await lockedMembers(tx, actor.chamber.id);
    const target = rows.find((r) => r.id === memberId);
    if (!target) throw new GavelError("not-found", "No such member in this chamber.");
    const chiefs = rows.filter((r) => r.role === "chief-clerk");
    if (target.role === "chief-clerk" && role !== "chief-clerk" && chiefs.length === 1) throw new GavelError("unprocessable", LAST_CHIEF, { issues: [{ path: "role", message: "would leave the chamber without a chief clerk" }] });
    if (target.role === role) return { id: memberId, role };
    await tx.update(member).set({ role }).where(eq(member.id, memberId));
    await tx.insert(peopleAudit).values({ chamberId: actor.chamber.id, actorId: actor.user.id, actorName: await nameOf(tx, actor.user.id), subjectId: target.userId, subjectName: await nameOf(tx, target.userId), action: "role-changed", fromRole: target.role, toRole: role });
    return { id: memberId, role };
  });
}

/** Remove a person from the chamber (their account stays; a chief clerk may restore them). Never the last chief clerk. */
export async function removeMember(actor: Actor, memberId: string) {
  return db.transaction(async (tx) => {
    const rows = await lockedMembers(tx, actor.chamber.id);
    const target = rows.find((r) => r.id === memberId);
    if (!target) throw new GavelError("not-found", "No such member in this chamber.");
    if (target.role === "chief-clerk" && rows.filter((r) => r.role === "chief-clerk").length === 1) throw new GavelError("unprocessable", `${LAST_CHIEF.split(".")[0]}; the last one cannot be removed.`, { issues: [{ path: "(member)", message: "the chamber's last chief clerk" }] });
    await tx.delete(member).where(eq(member.id, memberId));
    await tx.insert(peopleAudit).values({ chamberId: actor.chamber.id, actorId: actor.user.id, actorName: await nameOf(tx, actor.user.id), subjectId: target.userId, subjectName: await nameOf(tx, target.userId), action: "removed", fromRole: target.role, toRole: null });
    return { userId: target.userId, removed: true };
  });
}

/** People removed from the chamber and not back since: each with the role they held. */
async function removedPeople(q: Q, chamberId: string) {
  const log = await q.select().from(peopleAudit).where(eq(peopleAudit.chamberId, chamberId)).orderBy(desc(peopleAudit.at), desc(peopleAudit.id));
  const current = new Set((await q.select({ userId: member.userId }).from(member).where(eq(member.organizationId, chamberId))).map((r) => r.userId));
  const seen = new Set<string>();
  const out: Array<{ userId: string; name: string; role: string; removedAt: string; removedBy: string }> = [];
  for (const e of log) {
    if (!e.subjectId || seen.has(e.subjectId)) continue;
    seen.add(e.subjectId);
    if (e.action === "removed" && !current.has(e.subjectId)) out.push({ userId: e.subjectId, name: e.subjectName, role: e.fromRole ?? "observer", removedAt: e.at.toISOString(), removedBy: e.actorName });
  }
  return out;
}

export async function listRemoved(actor: Actor) {
  return { removed: await removedPeople(db, actor.chamber.id) };
}

/** Bring back a removed person with the role they held. */
export async function restoreMember(actor: Actor, userId: string) {
  return db.transaction(async (tx) => {
    await lockedMembers(tx, actor.chamber.id);
    const gone = (await removedPeople(tx, actor.chamber.id)).find((r) => r.userId === userId);
    if (!gone) throw new GavelError("not-found", "No one removed from this chamber by that account.");
    const role = isChamberRole(gone.role) ? gone.role : "observer";
    const [row] = await tx.insert(member).values({ id: crypto.randomUUID(), organizationId: actor.chamber.id, userId, role, createdAt: new Date() }).returning({ id: member.id });
    await tx.insert(peopleAudit).values({ chamberId: actor.chamber.id, actorId: actor.user.id, actorName: await nameOf(tx, actor.user.id), subjectId: userId, subjectName: gone.name, action: "restored", fromRole: null, toRole: role });
    return { id: row.id, userId, role };
  });
}

/** The people log, newest first: who changed whose role, removed or restored whom, and when. */
export async function peopleLog(actor: Actor) {
  const rows = await db.select().from(peopleAudit).where(eq(peopleAudit.chamberId, actor.chamber.id)).orderBy(desc(peopleAudit.at), desc(peopleAudit.id)).limit(500);
  return { entries: rows.map((r) => ({ id: r.id, at: r.at.toISOString(), actor: r.actorName, subject: r.subjectName, action: r.action, fromRole: r.fromRole, toRole: r.toRole })) };
}

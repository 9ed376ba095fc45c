/** Who belongs to a chamber: members, roles and invitations. */
import { and, asc, eq, gt } from "drizzle-orm";
import { z } from "zod";
import { auth } from "../auth.ts";
import { fromAuthError } from "../auth-errors.ts";
import { db } from "../db.ts";
import { invitation, member, user } from "../../db/schema/auth.ts";
import { GavelError } from "../../errors.ts";
import { CHAMBER_ROLES, can, type ChamberRole } from "../../permissions.ts";
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

export async function changeRole(actor: Actor, headers: Headers, memberId: string, role: ChamberRole) {
  const rows = await db.select({ id: member.id, role: member.role }).from(member).where(eq(member.organizationId, actor.chamber.id));
  const target = rows.find((r) => r.id === memberId);
  if (!target) throw new GavelError("not-found", "No such member in this chamber.");
  const chiefs = rows.filter((r) => r.role === "chief-clerk");
  if (target.role === "chief-clerk" && role !== "chief-clerk" && chiefs.length === 1)
    throw new GavelError("unprocessable", "A chamber needs at least one chief clerk. Make someone else chief clerk first.", { issues: [{ path: "role", message: "would leave the chamber without a chief clerk" }] });
  try {
    await auth.api.updateMemberRole({ headers, body: { memberId, role, organizationId: actor.chamber.id } });
  } catch (e) {
    throw fromAuthError(e);
  }
  return { id: memberId, role };
}

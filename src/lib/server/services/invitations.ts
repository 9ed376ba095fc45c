/** Reading an invitation for its landing page (the id is an unguessable token sent by e-mail). */
import { eq } from "drizzle-orm";
import { db } from "../db.ts";
import { invitation, organization } from "../../db/schema/auth.ts";

export type InvitationState = "pending" | "expired" | "accepted" | "rejected" | "canceled" | "missing";

export async function invitationForLanding(id: string) {
  const [row] = await db
    .select({ id: invitation.id, email: invitation.email, role: invitation.role, status: invitation.status, expiresAt: invitation.expiresAt, chamber: organization.name })
    .from(invitation)
    .innerJoin(organization, eq(invitation.organizationId, organization.id))
    .where(eq(invitation.id, id));
  if (!row) return { state: "missing" as InvitationState, invitation: null };
  const state: InvitationState = row.status === "pending" && row.expiresAt < new Date() ? "expired" : (row.status as InvitationState);
  return { state, invitation: row };
}

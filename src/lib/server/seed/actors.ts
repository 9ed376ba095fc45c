/** The demo accounts as the services see them (an Actor), for the seed steps that write through the services. */
import { and, eq } from "drizzle-orm";
import { db } from "../db.ts";
import { member, organization, user } from "../../db/schema/auth.ts";
import { isChamberRole, type ChamberRole } from "../../permissions.ts";
import type { Actor } from "../http.ts";
import { DEMO_ACCOUNTS, DEMO_CHAMBERS } from "./demo-data.ts";

/** The demo account holding `role` in the demo chamber, as an Actor; null while the foundation is not seeded. */
export async function demoActor(chamberKey: keyof typeof DEMO_CHAMBERS, role: ChamberRole): Promise<Actor | null> {
  const account = DEMO_ACCOUNTS.find((a) => a.chamber === chamberKey && a.role === role);
  if (!account) return null;
  const [row] = await db
    .select({ user, chamber: { id: organization.id, name: organization.name, slug: organization.slug, timeZone: organization.timeZone }, role: member.role })
    .from(user)
    .innerJoin(member, eq(member.userId, user.id))
    .innerJoin(organization, eq(member.organizationId, organization.id))
    .where(and(eq(user.email, account.email), eq(organization.slug, DEMO_CHAMBERS[chamberKey].slug)));
  if (!row || !isChamberRole(row.role)) return null;
  return { user: row.user as Actor["user"], chamber: row.chamber, role: row.role };
}

/** Seed accounts, chambers and the roster. Idempotent: running it twice changes nothing. */
import { eq } from "drizzle-orm";
import { auth } from "../auth.ts";
import { db } from "../db.ts";
import { member, organization, user } from "../../db/schema/auth.ts";
import { legislators } from "../../db/schema/chamber.ts";
import { DEMO_ACCOUNTS, DEMO_CHAMBERS, harrowmereRoster } from "./demo-data.ts";

async function ensureUser(email: string, name: string, password: string): Promise<string> {
  const [existing] = await db.select({ id: user.id }).from(user).where(eq(user.email, email));
  if (existing) return existing.id;
  const r = await auth.api.signUpEmail({ body: { email, name, password } });
  return r.user.id;
}

async function ensureChamber(key: keyof typeof DEMO_CHAMBERS, ownerId: string): Promise<string> {
  const c = DEMO_CHAMBERS[key];
  const [existing] = await db.select({ id: organization.id }).from(organization).where(eq(organization.slug, c.slug));
  if (existing) return existing.id;
  const org = await auth.api.createOrganization({ body: { name: c.name, slug: c.slug, userId: ownerId, keepCurrentActiveOrganization: true } });
  if (!org) throw new Error(`could not create chamber ${c.name}`);
  return org.id;
}

export async function seedFoundation(): Promise<{ chambers: Record<string, string>; users: Record<string, string> }> {
  const users: Record<string, string> = {};
  for (const a of DEMO_ACCOUNTS) users[a.email] = await ensureUser(a.email, a.name, a.password);
  const chambers: Record<string, string> = {};
  for (const key of Object.keys(DEMO_CHAMBERS) as Array<keyof typeof DEMO_CHAMBERS>) {
    const owner = DEMO_ACCOUNTS.find((a) => a.chamber === key && a.role === "chief-clerk")!;
    chambers[key] = await ensureChamber(key, users[owner.email]);
  }
  for (const a of DEMO_ACCOUNTS) {
    const orgId = chambers[a.chamber];
    const [m] = await db.select({ id: member.id }).from(member).where(eq(member.userId, users[a.email])).limit(1);
    if (!m) await auth.api.addMember({ body: { userId: users[a.email], role: a.role, organizationId: orgId } });
  }
  const [anyLegislator] = await db.select({ id: legislators.id }).from(legislators).where(eq(legislators.chamberId, chambers.harrowmere)).limit(1);
  if (!anyLegislator) {
    const roster = harrowmereRoster();
    const memberAccount = DEMO_ACCOUNTS.find((a) => a.role === "member" && a.chamber === "harrowmere")!;
    await db.insert(legislators).values(
      roster.map((r, i) => ({ chamberId: chambers.harrowmere, ...r, userId: i === 5 ? users[memberAccount.email] : null, name: i === 5 ? memberAccount.name : r.name })),
    );
  }
  return { chambers, users };
}

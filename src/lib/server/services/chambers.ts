/**
 * Registering a chamber as the operator (`npm run chamber:create`, scripts/chamber-create.ts).
 * With GAVELWRIGHT_OPEN_SIGNUP off (the default) this is the only way a chamber comes to exist:
 * the chief clerk named here becomes its first member, and invites everyone else.
 */
import { eq } from "drizzle-orm";
import { z } from "zod";
import { auth } from "../auth.ts";
import { db } from "../db.ts";
import { member, organization, user } from "../../db/schema/auth.ts";
import { GavelError, parseWith } from "../../errors.ts";
import { emailSchema } from "../../account-schemas.ts";

/** Whether `tz` is an IANA time zone this Node.js knows ("Europe/London", "UTC"). */
function isTimeZone(tz: string): boolean {
  try {
    new Intl.DateTimeFormat("en", { timeZone: tz });
    return /^[A-Za-z][A-Za-z0-9_+\-/]*$/.test(tz);
  } catch {
    return false;
  }
}

/** The short name used in links, from the full name when none is given. */
export function slugFrom(name: string): string {
  return name
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 40)
    .replace(/-+$/g, "");
}

export const newChamberSchema = z.object({
  name: z
    .string()
    .trim()
    .min(3, "give the chamber's full name (at least 3 characters)")
    .max(120)
    .refine((s) => !/[\u0000-\u001f\u007f]/.test(s), "no control characters"),
  slug: z
    .string()
    .trim()
    .regex(/^[a-z0-9](?:[a-z0-9-]{0,38}[a-z0-9])?$/, "lower-case letters, digits and hyphens, 1–40 characters")
    .optional(),
  timeZone: z.string().trim().max(64).refine(isTimeZone, "an IANA time zone such as Europe/London or UTC"),
  chiefClerk: emailSchema,
});
export type NewChamber = z.input<typeof newChamberSchema>;

export interface CreatedChamber {
  id: string;
  name: string;
  slug: string;
  timeZone: string;
  chiefClerk: { userId: string; email: string };
}

export async function createChamber(input: unknown): Promise<CreatedChamber> {
  const data = parseWith(newChamberSchema, input, "chamber");
  const slug = data.slug ?? slugFrom(data.name);
  if (!/^[a-z0-9](?:[a-z0-9-]{0,38}[a-z0-9])?$/.test(slug))
    throw new GavelError("invalid-input", "chamber: slug: give a short name (lower-case letters, digits and hyphens)", { issues: [{ path: "slug", message: "give a short name (lower-case letters, digits and hyphens)" }] });
  const email = data.chiefClerk.trim().toLowerCase();
  const [clerk] = await db.select({ id: user.id, email: user.email }).from(user).where(eq(user.email, email));
  if (!clerk)
    throw new GavelError("unprocessable", `chamber: chiefClerk: no account uses ${email}; ask them to create one (Create an account, /sign-up), then run this again`, {
      issues: [{ path: "chiefClerk", message: "no account uses this e-mail address yet" }],
    });
  const [taken] = await db.select({ id: organization.id }).from(organization).where(eq(organization.slug, slug));
  if (taken) throw new GavelError("conflict", `chamber: slug: "${slug}" is already used by another chamber`, { issues: [{ path: "slug", message: "already used by another chamber" }] });
  // A system action (no session, the owner named by id): allowed whatever GAVELWRIGHT_OPEN_SIGNUP says.
  const org = await auth.api.createOrganization({
    body: { name: data.name, slug, userId: clerk.id, keepCurrentActiveOrganization: true },
  });
  if (!org) throw new Error("the chamber was not created");
  // The chamber's clock (dates on every page, e-mail and export) is its own column, not sign-in input.
  await db.update(organization).set({ timeZone: data.timeZone }).where(eq(organization.id, org.id));
  const [m] = await db.select({ role: member.role }).from(member).where(eq(member.organizationId, org.id));
  if (m?.role !== "chief-clerk") throw new Error(`the chamber's first member has role ${m?.role}, not chief-clerk`);
  return { id: org.id, name: org.name, slug: org.slug, timeZone: data.timeZone, chiefClerk: { userId: clerk.id, email: clerk.email } };
}

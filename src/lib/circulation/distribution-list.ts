/**
 * A distribution list as staff and clerks keep it: chamber roles (everyone holding the role),
 * named people of the chamber, and outside addresses. Shared by the API and the page.
 */
import { z } from "zod";
import { safe } from "../schema-parts.ts";
import { CHAMBER_ROLES } from "../permissions.ts";

export const listEntrySchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("role"), role: z.enum(CHAMBER_ROLES) }),
  z.object({ kind: z.literal("user"), userId: safe(z.string().trim().min(1).max(100)), name: safe(z.string().trim().max(200)).default("") }),
  z.object({ kind: z.literal("address"), email: safe(z.string().trim().toLowerCase()).pipe(z.email("must be an e-mail address")), name: safe(z.string().trim().max(200)).default("") }),
]);
export type ListEntry = z.output<typeof listEntrySchema>;

export const distributionListSchema = z.object({
  name: safe(z.string().trim().min(1, "must not be empty").max(120)),
  description: safe(z.string().trim().max(500)).default(""),
  purpose: z.enum(["clerks"]).nullable().default(null),
  entries: z.array(listEntrySchema).max(500).default([]),
});
export type DistributionListInput = z.output<typeof distributionListSchema>;

import { sql } from "drizzle-orm";
import { check, index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { organization, user } from "./auth.ts";

/**
 * Every saved rulebook of a chamber, one row per save: a save never overwrites, it adds the
 * next `number`. `basedOn` names the version the editor started from, which is how a stale
 * save is detected (optimistic concurrency). `document` is the rulebook JSON as submitted
 * and validated (precedence chains kept as written), so an export gives back what was saved.
 */
export const rulebookVersions = pgTable(
  "rulebook_versions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    chamberId: text("chamber_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    number: integer("number").notNull(),
    basedOn: uuid("based_on"),
    title: text("title").notNull(),
    document: jsonb("document").$type<Record<string, unknown>>().notNull(),
    /** How the version came to be: "edit", "import" or "template:<id>". */
    origin: text("origin").notNull().default("edit"),
    note: text("note").notNull().default(""),
    authorId: text("author_id").references(() => user.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("rulebook_versions_chamber_number_uq").on(t.chamberId, t.number), check("rulebook_versions_number_positive", sql`${t.number} > 0`)],
);

/**
 * Adoptions: the chamber adopted version X with effect from a date. The version in force is
 * the latest adoption whose effective date has come; earlier adoptions stay as history.
 */
export const rulebookAdoptions = pgTable(
  "rulebook_adoptions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    chamberId: text("chamber_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    versionId: uuid("version_id").notNull().references(() => rulebookVersions.id, { onDelete: "restrict" }),
    effectiveFrom: timestamp("effective_from", { withTimezone: true }).notNull(),
    note: text("note").notNull().default(""),
    adoptedBy: text("adopted_by").references(() => user.id, { onDelete: "set null" }),
    adoptedAt: timestamp("adopted_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("rulebook_adoptions_chamber_idx").on(t.chamberId, t.effectiveFrom)],
);

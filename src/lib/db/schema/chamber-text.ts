import { sql } from "drizzle-orm";
import { check, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { organization, user } from "./auth.ts";

/**
 * The chamber's own rules as uploaded (PDF, DOCX, plain text, Markdown), one row per upload: an upload
 * never overwrites, it adds the next `number`, beside the rulebook's versions. `text` is the extracted
 * text; `clauses` its split into numbered clauses (src/lib/chamber-text/split-clauses.ts), which the
 * rulebook's `clause` links point into by key.
 */
export const chamberTexts = pgTable(
  "chamber_texts",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    chamberId: text("chamber_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    number: integer("number").notNull(),
    title: text("title").notNull(),
    filename: text("filename").notNull(),
    kind: text("kind").notNull(),
    size: integer("size").notNull(),
    sha256: text("sha256").notNull(),
    text: text("text").notNull(),
    clauses: jsonb("clauses").notNull(),
    preamble: text("preamble").notNull().default(""),
    note: text("note").notNull().default(""),
    authorId: text("author_id").references(() => user.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("chamber_texts_chamber_number_uq").on(t.chamberId, t.number), check("chamber_texts_number_positive", sql`${t.number} > 0`)],
);

/**
 * The chamber's bench of test scenarios (src/lib/procedure/scenarios.ts), one row per scenario, kept
 * with the chamber's rulebook and run against every version saved. `scenarioId` is the scenario's own
 * id (unique in the chamber); `document` the scenario as validated; `position` its place in the bench.
 */
export const rulebookScenarios = pgTable(
  "rulebook_scenarios",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    chamberId: text("chamber_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    scenarioId: text("scenario_id").notNull(),
    position: integer("position").notNull(),
    document: jsonb("document").notNull(),
    authorId: text("author_id").references(() => user.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("rulebook_scenarios_chamber_scenario_uq").on(t.chamberId, t.scenarioId)],
);

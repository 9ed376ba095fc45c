import { index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { organization, user } from "./auth.ts";
import { sittings } from "./floor.ts";

/**
 * The approved journal of a sitting, as a record: entry 1 is the approval, every later entry a
 * correction (with the reason); rows are never updated or deleted. `content` is the journal as
 * approved or as corrected (the generated Journal), `text` its words for the precedent search.
 */
export const journalEntries = pgTable(
  "journal_entries",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    sittingId: uuid("sitting_id").notNull().references(() => sittings.id, { onDelete: "cascade" }),
    chamberId: text("chamber_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    seq: integer("seq").notNull(),
    kind: text("kind", { enum: ["approved", "correction"] }).notNull(),
    reason: text("reason").notNull().default(""),
    /** The floor record's revision the journal was generated from. */
    floorRevision: integer("floor_revision").notNull(),
    content: jsonb("content").notNull(),
    text: text("text").notNull(),
    actorId: text("actor_id").references(() => user.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("journal_entries_sitting_seq_uq").on(t.sittingId, t.seq), index("journal_entries_chamber_idx").on(t.chamberId)],
);

import { index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { organization, user } from "./auth.ts";
import { rulebookVersions } from "./rulebooks.ts";

/**
 * A sitting of the chamber and its live floor: `state` is the pending-question stack and the
 * floor facts as recorded so far; `revision` counts recorded events, so a clerk's write based
 * on an older board is refused (409) instead of silently reordering the stack.
 */
export const sittings = pgTable(
  "sittings",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    chamberId: text("chamber_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    title: text("title").notNull(),
    status: text("status", { enum: ["open", "closed"] }).notNull().default("open"),
    /** The rulebook version the floor is judged by; null = the version in force at each moment. */
    rulebookVersionId: uuid("rulebook_version_id").references(() => rulebookVersions.id, { onDelete: "set null" }),
    state: jsonb("state").notNull(),
    revision: integer("revision").notNull().default(0),
    openedBy: text("opened_by").references(() => user.id, { onDelete: "set null" }),
    openedAt: timestamp("opened_at", { withTimezone: true }).notNull().defaultNow(),
    closedAt: timestamp("closed_at", { withTimezone: true }),
  },
  (t) => [index("sittings_chamber_idx").on(t.chamberId, t.status)],
);

/** The sitting's history: every recorded event in order, never edited. */
export const floorEvents = pgTable(
  "floor_events",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    sittingId: uuid("sitting_id").notNull().references(() => sittings.id, { onDelete: "cascade" }),
    chamberId: text("chamber_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    seq: integer("seq").notNull(),
    kind: text("kind").notNull(),
    payload: jsonb("payload").notNull(),
    summary: text("summary").notNull(),
    actorId: text("actor_id").references(() => user.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("floor_events_sitting_seq_uq").on(t.sittingId, t.seq)],
);

import { doublePrecision, index, integer, jsonb, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { organization, user } from "./auth.ts";
import { measures } from "./measures.ts";
import type { EstimateContent } from "../../estimates/estimate-content.ts";

/**
 * Preference estimates: an author's projection of how the chamber ranks the versions of one
 * measure (weighted ranked ballots) or where its members stand (spatial ideal points). Private to
 * the author unless shared with roles or named people of the chamber. The content lives in
 * `estimate_versions`, one row per save: a save never overwrites.
 */
export const estimates = pgTable(
  "estimates",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    chamberId: text("chamber_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    measureId: uuid("measure_id").notNull().references(() => measures.id, { onDelete: "cascade" }),
    title: text("title").notNull(),
    kind: text("kind", { enum: ["ballots", "spatial"] }).notNull(),
    authorId: text("author_id").references(() => user.id, { onDelete: "set null" }),
    /** Roles of the chamber that may read it (e.g. ["clerk", "member"]). */
    sharedRoles: jsonb("shared_roles").$type<string[]>().notNull().default([]),
    /** User ids of the chamber that may read it. */
    sharedUsers: jsonb("shared_users").$type<string[]>().notNull().default([]),
    latestVersion: integer("latest_version").notNull().default(1),
    duplicatedFrom: uuid("duplicated_from"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("estimates_chamber_measure_idx").on(t.chamberId, t.measureId)],
);

export const estimateVersions = pgTable(
  "estimate_versions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    chamberId: text("chamber_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    estimateId: uuid("estimate_id").notNull().references(() => estimates.id, { onDelete: "cascade" }),
    number: integer("number").notNull(),
    /** Tree keys of the pending amendments the estimate considers (its versions follow from them). */
    scope: jsonb("scope").$type<string[]>().notNull(),
    /** Ballots or spatial content, as validated by src/lib/estimates/estimate-content.ts. */
    content: jsonb("content").$type<EstimateContent>().notNull(),
    note: text("note").notNull().default(""),
    authorId: text("author_id").references(() => user.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("estimate_versions_number_uq").on(t.estimateId, t.number)],
);

/**
 * Finished analyses keyed by a content hash of (tree, rulebook version, estimate content). A row
 * is written only when a run succeeds, in one statement, so a cancelled or crashed run leaves none.
 */
export const analysisCache = pgTable(
  "analysis_cache",
  {
    chamberId: text("chamber_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    hash: text("hash").notNull(),
    result: jsonb("result").notNull(),
    durationMs: integer("duration_ms").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.chamberId, t.hash] })],
);

/** Requests to analyse: their progress while a worker runs, and how they ended. */
export const analysisRuns = pgTable(
  "analysis_runs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    chamberId: text("chamber_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    estimateId: uuid("estimate_id").notNull().references(() => estimates.id, { onDelete: "cascade" }),
    estimateVersion: integer("estimate_version").notNull(),
    rulebookVersionId: uuid("rulebook_version_id"),
    rulebookLabel: text("rulebook_label").notNull(),
    hash: text("hash").notNull(),
    status: text("status", { enum: ["running", "done", "failed", "cancelled"] }).notNull(),
    cached: integer("cached").notNull().default(0),
    phase: text("phase"),
    progress: doublePrecision("progress").notNull().default(0),
    error: jsonb("error"),
    requestedBy: text("requested_by").references(() => user.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    finishedAt: timestamp("finished_at", { withTimezone: true }),
    /** Touched every few seconds by the server process running it: a stale one means that process is gone. */
    heartbeatAt: timestamp("heartbeat_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("analysis_runs_estimate_idx").on(t.chamberId, t.estimateId)],
);

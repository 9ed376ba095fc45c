import { sql } from "drizzle-orm";
import { customType, date, index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { organization, user } from "./auth.ts";
import { legislators } from "./chamber.ts";
import { amendments, measures } from "./measures.ts";
import { sittings } from "./floor.ts";
import type { AppealTally, Citation } from "../../rulings/ruling-content.ts";

const tsvector = customType<{ data: string }>({ dataType: () => "tsvector" });

/**
 * Rulings on points of order. The row holds the current text (the draft, or the latest issued
 * revision) so that search and filters read one table; every issued text is also kept,
 * immutable, in `ruling_revisions`. An issued ruling changes only by adding a revision.
 *
 * Measures, amendments and sittings are linked by foreign key (set null if they go) and also
 * kept as a label, so the ruling stays readable; a motion or tree finding is a typed
 * reference (kind + ref + label). Rule citations name a rulebook version id and rule id.
 */
export const rulings = pgTable(
  "rulings",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    chamberId: text("chamber_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    /** Per-chamber serial number ("Ruling 12"), allocated at drafting. */
    number: integer("number").notNull(),
    status: text("status", { enum: ["draft", "issued"] }).notNull().default("draft"),
    /** 0 while a draft; 1 once issued; +1 per correction. */
    revision: integer("revision").notNull().default(0),
    /** Optimistic concurrency: bumped on every write. */
    version: integer("version").notNull().default(1),
    raisedById: uuid("raised_by_id").references(() => legislators.id, { onDelete: "set null" }),
    raisedByName: text("raised_by_name").notNull(),
    targetKind: text("target_kind", { enum: ["motion", "amendment", "finding", "measure", "other"] }).notNull(),
    targetRef: text("target_ref"),
    targetLabel: text("target_label").notNull(),
    measureId: uuid("measure_id").references(() => measures.id, { onDelete: "set null" }),
    measureLabel: text("measure_label"),
    amendmentId: uuid("amendment_id").references(() => amendments.id, { onDelete: "set null" }),
    /** Catalogue id of the motion the point concerns (e.g. "previous-question"). */
    motion: text("motion"),
    question: text("question").notNull(),
    decision: text("decision", { enum: ["sustained", "not-sustained", "other"] }),
    decisionNote: text("decision_note"),
    reasoning: text("reasoning").notNull().default(""),
    /** [{kind:"rule", rulebookVersionId, ruleId, citation} | {kind:"ruling", rulingId, label}] */
    citations: jsonb("citations").$type<Citation[]>().notNull().default([]),
    /** Lower-cased rule ids and rule citations, for the exact "by rule" filter. */
    citationKeys: text("citation_keys").array().notNull().default(sql`'{}'::text[]`),
    /** Rule citations as plain text, weighted high in the search vector. */
    citationText: text("citation_text").notNull().default(""),
    appeal: jsonb("appeal").$type<AppealTally | null>(),
    sittingId: uuid("sitting_id").references(() => sittings.id, { onDelete: "set null" }),
    sitting: text("sitting").notNull().default(""),
    sittingDate: date("sitting_date", { mode: "string" }),
    createdBy: text("created_by").references(() => user.id, { onDelete: "set null" }),
    issuedBy: text("issued_by").references(() => user.id, { onDelete: "set null" }),
    issuedAt: timestamp("issued_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
    search: tsvector("search").generatedAlwaysAs(
      sql`setweight(to_tsvector('english'::regconfig, coalesce(question, '') || ' ' || coalesce(citation_text, '')), 'A') || setweight(to_tsvector('english'::regconfig, coalesce(target_label, '') || ' ' || coalesce(measure_label, '') || ' ' || coalesce(motion, '') || ' ' || coalesce(decision_note, '')), 'B') || setweight(to_tsvector('english'::regconfig, coalesce(reasoning, '')), 'C') || setweight(to_tsvector('english'::regconfig, coalesce(raised_by_name, '') || ' ' || coalesce(sitting, '')), 'D')`,
    ),
  },
  (t) => [
    uniqueIndex("rulings_chamber_number_uq").on(t.chamberId, t.number),
    index("rulings_chamber_date_idx").on(t.chamberId, t.sittingDate),
    index("rulings_search_idx").using("gin", t.search),
    index("rulings_citation_keys_idx").using("gin", t.citationKeys),
  ],
);

/** Every issued text of a ruling, never updated: revision 1 is the ruling as issued, later ones corrections. */
export const rulingRevisions = pgTable(
  "ruling_revisions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    rulingId: uuid("ruling_id").notNull().references(() => rulings.id, { onDelete: "cascade" }),
    chamberId: text("chamber_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    revision: integer("revision").notNull(),
    /** The ruling as issued, in the shape the API answers with (toRuling in services/rulings.ts). */
    content: jsonb("content").$type<Record<string, unknown>>().notNull(),
    /** Why this revision was made ("As issued", or the correction note). */
    note: text("note").notNull(),
    issuedBy: text("issued_by").references(() => user.id, { onDelete: "set null" }),
    issuedByName: text("issued_by_name").notNull(),
    issuedAt: timestamp("issued_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("ruling_revisions_uq").on(t.rulingId, t.revision)],
);

import { customType, index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { AMENDMENT_STATUSES, MEASURE_STATUSES } from "../../measures/measure-schemas.ts";
import { organization, user } from "./auth.ts";

/** Raw file bytes kept in PostgreSQL (uploads are small and must travel with backups). */
const bytea = customType<{ data: Buffer; driverData: Buffer }>({ dataType: () => "bytea" });

/** One section of a measure's text, stored in the measure row (the core's sectionSchema shape). */
export interface StoredSection {
  id: string;
  heading?: string;
  text?: string;
  subjects: string[];
  lines?: number;
  status: "open" | "adopted" | "struck";
}

/** An uploaded document (PDF, DOCX, text): its bytes and the text extracted from it. */
export const measureAttachments = pgTable(
  "measure_attachments",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    chamberId: text("chamber_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    filename: text("filename").notNull(),
    mediaType: text("media_type").notNull(),
    size: integer("size").notNull(),
    sha256: text("sha256").notNull(),
    bytes: bytea("bytes").notNull(),
    extractedText: text("extracted_text"),
    uploadedBy: text("uploaded_by").references(() => user.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("measure_attachments_chamber_idx").on(t.chamberId)],
);

export const measures = pgTable(
  "measures",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    chamberId: text("chamber_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    number: text("number").notNull(),
    title: text("title").notNull(),
    committee: text("committee"),
    status: text("status", { enum: MEASURE_STATUSES }).notNull().default("introduced"),
    subjects: jsonb("subjects").$type<string[]>().notNull().default([]),
    sections: jsonb("sections").$type<StoredSection[]>().notNull().default([]),
    /** Legislator ids. */
    sponsors: jsonb("sponsors").$type<string[]>().notNull().default([]),
    /** When the measure is due on the floor: the filing deadline counts back from here. */
    sittingAt: timestamp("sitting_at", { withTimezone: true }),
    attachmentId: uuid("attachment_id").references(() => measureAttachments.id, { onDelete: "set null" }),
    /** The last amendment number handed out; bumped in the filing transaction, so numbers are gap-free. */
    amendmentCounter: integer("amendment_counter").notNull().default(0),
    version: integer("version").notNull().default(1),
    /** Set when a clerk archives the measure (a mistake, a duplicate): it leaves the lists and takes no changes, but stays readable. */
    archivedAt: timestamp("archived_at", { withTimezone: true }),
    archivedBy: text("archived_by").references(() => user.id, { onDelete: "set null" }),
    createdBy: text("created_by").references(() => user.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("measures_chamber_number_uq").on(t.chamberId, t.number)],
);

export const amendments = pgTable(
  "amendments",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    chamberId: text("chamber_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    measureId: uuid("measure_id").notNull().references(() => measures.id, { onDelete: "cascade" }),
    /** Filing order within the measure; null while a draft. */
    number: integer("number"),
    title: text("title"),
    form: text("form").notNull(),
    /** What it amends: "measure", a section id of the measure, or "amendment". */
    targetKind: text("target_kind", { enum: ["measure", "section", "amendment"] }).notNull(),
    targetSection: text("target_section"),
    targetAmendmentId: uuid("target_amendment_id"),
    lineFrom: integer("line_from"),
    lineTo: integer("line_to"),
    text: text("text").notNull().default(""),
    subjects: jsonb("subjects").$type<string[]>().notNull().default([]),
    /** Legislator ids. */
    sponsors: jsonb("sponsors").$type<string[]>().notNull().default([]),
    committee: text("committee"),
    status: text("status", { enum: AMENDMENT_STATUSES }).notNull().default("filed"),
    filedAt: timestamp("filed_at", { withTimezone: true }),
    filedBy: text("filed_by").references(() => user.id, { onDelete: "set null" }),
    attachmentId: uuid("attachment_id").references(() => measureAttachments.id, { onDelete: "set null" }),
    version: integer("version").notNull().default(1),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("amendments_measure_number_uq").on(t.measureId, t.number), index("amendments_chamber_measure_idx").on(t.chamberId, t.measureId)],
);

/** A clerk's override of one finding, resting on a ruling of the chair. */
export const treeOverrides = pgTable(
  "tree_overrides",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    chamberId: text("chamber_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    measureId: uuid("measure_id").notNull().references(() => measures.id, { onDelete: "cascade" }),
    amendmentId: uuid("amendment_id").notNull().references(() => amendments.id, { onDelete: "cascade" }),
    code: text("code").notNull(),
    /** A free-text reference to the ruling ("Ruling 2031-07, the Chair, 3 March"). */
    rulingRef: text("ruling_ref").notNull(),
    /** The ruling's id in the rulings register, when it is recorded there. */
    rulingId: uuid("ruling_id"),
    note: text("note"),
    createdBy: text("created_by").references(() => user.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("tree_overrides_finding_uq").on(t.amendmentId, t.code), index("tree_overrides_measure_idx").on(t.measureId)],
);

/** Every change to a measure, its amendments and overrides: who, when, before, after. */
export const measureAudit = pgTable(
  "measure_audit",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    chamberId: text("chamber_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    measureId: uuid("measure_id").notNull().references(() => measures.id, { onDelete: "cascade" }),
    entity: text("entity", { enum: ["measure", "amendment", "override"] }).notNull(),
    entityId: uuid("entity_id").notNull(),
    action: text("action").notNull(),
    /** The entity's version after the change (0 for a deletion). */
    version: integer("version").notNull(),
    actorId: text("actor_id").references(() => user.id, { onDelete: "set null" }),
    actorName: text("actor_name").notNull(),
    before: jsonb("before").$type<Record<string, unknown> | null>(),
    after: jsonb("after").$type<Record<string, unknown> | null>(),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("measure_audit_measure_idx").on(t.measureId, t.at), index("measure_audit_entity_idx").on(t.entityId, t.version)],
);

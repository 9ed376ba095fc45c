import { index, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { organization, user } from "./auth.ts";

/**
 * Who changed whose place in a chamber, and when: role changes, removals and restorations.
 * Rows are only added (in the same transaction as the change), never updated or deleted; names
 * are kept as they were, so the log still reads after an account is gone.
 */
export const peopleAudit = pgTable(
  "people_audit",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    chamberId: text("chamber_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    actorId: text("actor_id").references(() => user.id, { onDelete: "set null" }),
    actorName: text("actor_name").notNull(),
    subjectId: text("subject_id").references(() => user.id, { onDelete: "set null" }),
    subjectName: text("subject_name").notNull(),
    action: text("action", { enum: ["role-changed", "removed", "restored"] }).notNull(),
    fromRole: text("from_role"),
    toRole: text("to_role"),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("people_audit_chamber_at_idx").on(t.chamberId, t.at), index("people_audit_subject_idx").on(t.chamberId, t.subjectId)],
);

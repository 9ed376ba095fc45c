import { index, integer, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { organization, user } from "./auth.ts";

/**
 * The chamber's roster: the legislators who vote, grouped in blocs, some holding an office.
 * Distinct from user accounts: a legislator may or may not have a Gavelwright account.
 */
export const legislators = pgTable(
  "legislators",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    chamberId: text("chamber_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    bloc: text("bloc").notNull(),
    constituency: text("constituency"),
    office: text("office"),
    votes: integer("votes").notNull().default(1),
    userId: text("user_id").references(() => user.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("legislators_chamber_idx").on(t.chamberId, t.bloc)],
);

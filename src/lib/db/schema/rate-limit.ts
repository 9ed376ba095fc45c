// better-auth's rate-limit counters (rateLimit.storage = "database" in src/lib/server/auth.ts),
// shared by every app server so that a limit holds however many processes answer. Field names
// are better-auth's model (key, count, lastRequest in milliseconds since the epoch).
import { bigint, integer, pgTable, text } from "drizzle-orm/pg-core";

export const rateLimit = pgTable("rate_limit", {
  id: text("id").primaryKey(),
  key: text("key").notNull().unique(),
  count: integer("count").notNull(),
  lastRequest: bigint("last_request", { mode: "number" }).notNull(),
});

import { index, integer, jsonb, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";

/** Transactional outbox: a message is written with the change that causes it, then delivered. */
export const outbox = pgTable(
  "outbox",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    kind: text("kind").notNull(),
    ref: text("ref"),
    to: text("to").notNull(),
    subject: text("subject").notNull(),
    text: text("text").notNull(),
    html: text("html"),
    headers: jsonb("headers").notNull().default({}),
    status: text("status", { enum: ["queued", "sent", "failed"] }).notNull().default("queued"),
    attempts: integer("attempts").notNull().default(0),
    nextAttemptAt: timestamp("next_attempt_at", { withTimezone: true }).notNull().defaultNow(),
    lastError: text("last_error"),
    smtpResponse: text("smtp_response"),
    sentAt: timestamp("sent_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("outbox_due_idx").on(t.status, t.nextAttemptAt), index("outbox_ref_idx").on(t.ref)],
);

/** What the local fake SMTP server received (development and tests only). */
export const caughtMail = pgTable("caught_mail", {
  id: uuid("id").primaryKey().defaultRandom(),
  messageId: text("message_id"),
  from: text("from").notNull(),
  to: text("to").notNull(),
  subject: text("subject").notNull(),
  text: text("text"),
  html: text("html"),
  receivedAt: timestamp("received_at", { withTimezone: true }).notNull().defaultNow(),
});

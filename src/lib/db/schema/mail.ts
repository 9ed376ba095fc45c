import { index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { organization, user } from "./auth.ts";
import { rulings } from "./rulings.ts";
import type { ListEntry } from "../../circulation/distribution-list.ts";

/**
 * Transactional outbox: one row per message and recipient, written in the same transaction as
 * the change that causes it, then delivered by a worker (src/lib/server/mail.ts).
 * States: queued → sending (claimed under a lease) → sent | queued (retry) | failed;
 * a lease that expires while `sending` becomes `uncertain`, never resent blindly.
 */
export const outbox = pgTable(
  "outbox",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    kind: text("kind").notNull(),
    ref: text("ref"),
    chamberId: text("chamber_id").references(() => organization.id, { onDelete: "cascade" }),
    circulationId: uuid("circulation_id").references(() => circulations.id, { onDelete: "cascade" }),
    /** Idempotency key: a second enqueue with the same key is a no-op. */
    dedupeKey: text("dedupe_key"),
    to: text("to").notNull(),
    subject: text("subject").notNull(),
    text: text("text").notNull(),
    html: text("html"),
    headers: jsonb("headers").$type<Record<string, string>>().notNull().default({}),
    /** Stable RFC 5322 Message-ID, the same on every attempt, so receivers can drop a repeat. */
    messageId: text("message_id"),
    status: text("status", { enum: ["queued", "sending", "sent", "failed", "uncertain"] }).notNull().default("queued"),
    attempts: integer("attempts").notNull().default(0),
    nextAttemptAt: timestamp("next_attempt_at", { withTimezone: true }).notNull().defaultNow(),
    claimToken: uuid("claim_token"),
    leaseUntil: timestamp("lease_until", { withTimezone: true }),
    lastError: text("last_error"),
    smtpResponse: text("smtp_response"),
    sentAt: timestamp("sent_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("outbox_due_idx").on(t.status, t.nextAttemptAt),
    index("outbox_ref_idx").on(t.ref),
    index("outbox_circulation_idx").on(t.circulationId),
    uniqueIndex("outbox_dedupe_uq").on(t.dedupeKey),
  ],
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

/** A chamber's distribution list; `purpose: "clerks"` marks the list floor-day digests go to. */
export const distributionLists = pgTable(
  "distribution_lists",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    chamberId: text("chamber_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    description: text("description").notNull().default(""),
    purpose: text("purpose", { enum: ["clerks"] }),
    /** [{kind:"role", role} | {kind:"user", userId, name} | {kind:"address", email, name}] */
    entries: jsonb("entries").$type<ListEntry[]>().notNull().default([]),
    version: integer("version").notNull().default(1),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("distribution_lists_name_uq").on(t.chamberId, t.name)],
);

/** Addresses that asked to stop receiving a list's mail (list null = every list of the chamber). */
export const mailSuppressions = pgTable(
  "mail_suppressions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    chamberId: text("chamber_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    listId: uuid("list_id").references(() => distributionLists.id, { onDelete: "cascade" }),
    email: text("email").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("mail_suppressions_uq").on(t.chamberId, t.email, t.listId)],
);

/** One sending of a ruling (or a digest) to a list; its messages are the outbox rows pointing here. */
export const circulations = pgTable(
  "circulations",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    chamberId: text("chamber_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    kind: text("kind", { enum: ["ruling", "floor-digest"] }).notNull(),
    rulingId: uuid("ruling_id").references(() => rulings.id, { onDelete: "cascade" }),
    rulingRevision: integer("ruling_revision"),
    listId: uuid("list_id").references(() => distributionLists.id, { onDelete: "set null" }),
    listName: text("list_name").notNull(),
    subject: text("subject").notNull(),
    /** Recipients left out because they unsubscribed. */
    skipped: jsonb("skipped").$type<Array<{ email: string; reason: string }>>().notNull().default([]),
    sentBy: text("sent_by").references(() => user.id, { onDelete: "set null" }),
    sentByName: text("sent_by_name").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("circulations_chamber_idx").on(t.chamberId, t.createdAt), index("circulations_ruling_idx").on(t.rulingId)],
);

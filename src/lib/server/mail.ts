/**
 * Outgoing mail through a transactional outbox. Every message (one row per recipient) is first
 * written to `outbox`, in the caller's transaction when there is one, so it commits or rolls
 * back with the change that causes it. `deliverOutbox` then delivers due messages with retries
 * and backoff. SMTP settings come from the environment (SMTP_HOST, SMTP_PORT, SMTP_SECURE,
 * SMTP_USER, SMTP_PASS, MAIL_FROM); in development and tests a local fake SMTP server receives
 * everything (src/lib/server/dev/mail-catcher.ts).
 *
 * Delivery guarantee (stated honestly):
 * - A message is never lost: it stays in the table until the SMTP server accepts it, or until
 *   it fails permanently (a 5xx reply, or MAX_ATTEMPTS transient failures), which is recorded.
 * - Claiming is a short transaction (FOR UPDATE SKIP LOCKED) that sets status `sending`, a
 *   random claim token and a lease; the SMTP conversation happens outside any transaction; the
 *   result is written only if the claim token still matches. Two workers never send one
 *   message at the same time.
 * - Each message has a stable Message-ID, identical on every attempt.
 * - The one window that cannot be closed over SMTP: the server accepted the message and the
 *   process died before writing `sent`. Such a message is found with an expired lease and is
 *   marked `uncertain`, never resent automatically; a person may requeue it (same Message-ID,
 *   so a receiver that drops repeated Message-IDs still sees it once). So delivery is
 *   exactly-once except across that crash window, where it is at-most-once until a person decides.
 * - `enqueueMail` with a `dedupeKey` is idempotent: a repeated enqueue adds nothing.
 */
import nodemailer, { type Transporter } from "nodemailer";
import { randomUUID } from "node:crypto";
import { and, asc, desc, eq, inArray, isNull, lte, or, sql as dsql } from "drizzle-orm";
import { db, type Tx } from "./db.ts";
import { caughtMail, outbox } from "../db/schema/mail.ts";

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
  kind: string;
  /** Links the message to what caused it (a ruling id, an invitation id…). */
  ref?: string;
  headers?: Record<string, string>;
  chamberId?: string;
  circulationId?: string;
  /** Idempotency key: enqueueing the same key twice queues one message. */
  dedupeKey?: string;
}

export function mailFrom(): string {
  return process.env.MAIL_FROM ?? "Gavelwright <no-reply@gavelwright.invalid>";
}

/** The domain part of Message-IDs: the sender's domain. */
function messageIdDomain(): string {
  const m = /@([^>\s]+)>?\s*$/.exec(mailFrom());
  return m?.[1] ?? "gavelwright.invalid";
}

let transport: Transporter | null = null;
export function smtpTransport(): Transporter {
  transport ??= nodemailer.createTransport({
    host: process.env.SMTP_HOST ?? "127.0.0.1",
    port: Number(process.env.SMTP_PORT ?? 2525),
    secure: process.env.SMTP_SECURE === "true",
    ignoreTLS: process.env.SMTP_SECURE !== "true" && !process.env.SMTP_USER,
    auth: process.env.SMTP_USER ? { user: process.env.SMTP_USER, pass: process.env.SMTP_PASS ?? "" } : undefined,
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
    socketTimeout: 10_000,
  });
  return transport;
}

/** Queue a message; it commits or rolls back with `tx`. Returns the outbox id (the existing one for a repeated dedupeKey). */
export async function enqueueMail(mail: OutgoingMail, tx: Tx | typeof db = db): Promise<string> {
  const id = randomUUID();
  const rows = await tx
    .insert(outbox)
    .values({
      id,
      kind: mail.kind,
      ref: mail.ref ?? null,
      chamberId: mail.chamberId ?? null,
      circulationId: mail.circulationId ?? null,
      dedupeKey: mail.dedupeKey ?? null,
      to: mail.to,
      subject: mail.subject,
      text: mail.text,
      html: mail.html ?? null,
      headers: mail.headers ?? {},
      messageId: `<${id}@${messageIdDomain()}>`,
    })
    .onConflictDoNothing({ target: outbox.dedupeKey })
    .returning({ id: outbox.id });
  if (rows[0]) return rows[0].id;
  const [existing] = await tx.select({ id: outbox.id }).from(outbox).where(eq(outbox.dedupeKey, mail.dedupeKey!));
  return existing.id;
}

const BACKOFF_SECONDS = [5, 30, 120, 600, 1800, 3600];
export const MAX_ATTEMPTS = 12;
/** How long a claimed message may stay `sending` before it is presumed abandoned. */
export const LEASE_SECONDS = 120;

/** Expired leases: the worker died mid-send; whether the server accepted the message is unknown. */
async function markAbandoned(): Promise<number> {
  const rows = await db
    .update(outbox)
    .set({ status: "uncertain", claimToken: null, lastError: "The sending worker stopped before recording the result; the SMTP server may or may not have accepted this message. Requeue it to send again." })
    .where(and(eq(outbox.status, "sending"), lte(outbox.leaseUntil, dsql`now()`)))
    .returning({ id: outbox.id });
  return rows.length;
}

type Claimed = typeof outbox.$inferSelect;

async function claimOne(): Promise<Claimed | null> {
  return db.transaction(async (tx) => {
    const [msg] = await tx
      .select()
      .from(outbox)
      .where(and(eq(outbox.status, "queued"), lte(outbox.nextAttemptAt, dsql`now()`)))
      .orderBy(asc(outbox.nextAttemptAt), asc(outbox.createdAt))
      .limit(1)
      .for("update", { skipLocked: true });
    if (!msg) return null;
    const token = randomUUID();
    const [claimed] = await tx
      .update(outbox)
      .set({ status: "sending", claimToken: token, leaseUntil: dsql`now() + make_interval(secs => ${LEASE_SECONDS})`, attempts: msg.attempts + 1 })
      .where(eq(outbox.id, msg.id))
      .returning();
    return claimed;
  });
}

function isPermanent(e: unknown): boolean {
  const code = (e as { responseCode?: number }).responseCode;
  return typeof code === "number" && code >= 500 && code < 600;
}

/**
 * Deliver due messages, one claim at a time; several servers may run this at once. Stops the
 * round at the first transient failure (the SMTP server is likely down). Returns counts.
 */
export async function deliverOutbox(limit = 20): Promise<{ sent: number; failed: number; uncertain: number }> {
  const uncertain = await markAbandoned();
  let sent = 0;
  let failed = 0;
  for (let i = 0; i < limit; i++) {
    const msg = await claimOne();
    if (!msg) break;
    const mine = and(eq(outbox.id, msg.id), eq(outbox.claimToken, msg.claimToken!));
    try {
      const info = await smtpTransport().sendMail({
        from: mailFrom(),
        to: msg.to,
        subject: msg.subject,
        text: msg.text,
        html: msg.html ?? undefined,
        messageId: msg.messageId ?? `<${msg.id}@${messageIdDomain()}>`,
        headers: msg.headers as Record<string, string>,
      });
      await db.update(outbox).set({ status: "sent", sentAt: new Date(), claimToken: null, leaseUntil: null, lastError: null, smtpResponse: String(info.response ?? "").slice(0, 500) }).where(mine);
      sent++;
    } catch (e) {
      const permanent = isPermanent(e);
      const wait = BACKOFF_SECONDS[Math.min(msg.attempts - 1, BACKOFF_SECONDS.length - 1)];
      await db
        .update(outbox)
        .set({
          status: permanent || msg.attempts >= MAX_ATTEMPTS ? "failed" : "queued",
          claimToken: null,
          leaseUntil: null,
          lastError: String((e as Error).message ?? e).slice(0, 500),
          nextAttemptAt: new Date(Date.now() + wait * 1000),
        })
        .where(mine);
      failed++;
      if (!permanent) break;
    }
  }
  return { sent, failed, uncertain };
}

/** Put failed or uncertain messages back in the queue (a person's decision; same Message-ID). */
export async function requeueMail(ids: string[], tx: Tx | typeof db = db): Promise<number> {
  if (ids.length === 0) return 0;
  const rows = await tx
    .update(outbox)
    .set({ status: "queued", nextAttemptAt: new Date(), lastError: null })
    .where(and(inArray(outbox.id, ids), or(eq(outbox.status, "failed"), eq(outbox.status, "uncertain"))))
    .returning({ id: outbox.id });
  return rows.length;
}

/**
 * What the local fake SMTP server received for one chamber, newest first (development only).
 * A caught message is matched to its outbox row by its Message-ID. Mail the chamber sent (the
 * outbox row carries its id: circulations, digests, invitations, filing receipts) is its own;
 * mail that belongs to no chamber (password resets) is shown when addressed to a person of the
 * chamber, someone it invited, or an outside address on one of its lists. Mail another chamber
 * sent, and anything the outbox does not know, is not shown.
 */
export async function listCaughtMail(chamberId: string, limit = 200) {
  const address = dsql`lower(coalesce(substring(${outbox.to} from '<([^<>]+)>\s*$'), trim(${outbox.to})))`;
  const chamberAddresses = dsql`(
    SELECT lower(u.email) FROM member m JOIN "user" u ON u.id = m.user_id WHERE m.organization_id = ${chamberId}
    UNION SELECT lower(i.email) FROM invitation i WHERE i.organization_id = ${chamberId}
    UNION SELECT lower(e->>'email') FROM distribution_lists d CROSS JOIN LATERAL jsonb_array_elements(d.entries) e WHERE d.chamber_id = ${chamberId} AND e->>'kind' = 'address'
  )`;
  const rows = await db
    .select({ caught: caughtMail })
    .from(caughtMail)
    .innerJoin(outbox, eq(outbox.messageId, caughtMail.messageId))
    .where(or(eq(outbox.chamberId, chamberId), and(isNull(outbox.chamberId), dsql`${address} IN ${chamberAddresses}`)))
    .orderBy(desc(caughtMail.receivedAt))
    .limit(limit);
  return rows.map((r) => r.caught);
}

let timer: NodeJS.Timeout | null = null;
/** Start the background delivery loop once per process (not in tests, which call deliverOutbox). */
export function startOutboxWorker(intervalMs = 2_000): void {
  if (timer || process.env.GAVELWRIGHT_MAIL_MODE === "test") return;
  let running = false;
  timer = setInterval(() => {
    if (running) return;
    running = true;
    // A tick drains a backlog (e.g. a burst of filing receipts) up to 500 messages, not just 20.
    deliverOutbox(500)
      .catch((e) => console.error("[outbox]", (e as Error).message))
      .finally(() => {
        running = false;
      });
  }, intervalMs);
  timer.unref();
}

/**
 * Outgoing mail. Every message is first written to the `outbox` table (in the caller's
 * transaction when there is one), then delivered by `deliverOutbox`, which retries with
 * backoff. SMTP settings come from the environment; in development and tests a local fake
 * SMTP server (scripts/mail-catcher.ts) receives everything.
 */
import nodemailer from "nodemailer";
import { and, asc, eq, lte, sql as dsql } from "drizzle-orm";
import { db, type Tx } from "./db.ts";
import { outbox } from "../db/schema/mail.ts";

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
  kind: string;
  /** Links the message to what caused it (a ruling id, an invitation id…). */
  ref?: string;
  headers?: Record<string, string>;
}

export function mailFrom(): string {
  return process.env.MAIL_FROM ?? "Gavelwright <no-reply@gavelwright.invalid>";
}

let transport: nodemailer.Transporter | null = null;
export function smtpTransport(): nodemailer.Transporter {
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

/** Queue a message; it commits or rolls back with `tx`. */
export async function enqueueMail(mail: OutgoingMail, tx: Tx | typeof db = db): Promise<string> {
  const [row] = await tx
    .insert(outbox)
    .values({ kind: mail.kind, ref: mail.ref ?? null, to: mail.to, subject: mail.subject, text: mail.text, html: mail.html ?? null, headers: mail.headers ?? {} })
    .returning({ id: outbox.id });
  return row.id;
}

const BACKOFF_SECONDS = [5, 30, 120, 600, 1800, 3600];
export const MAX_ATTEMPTS = 12;

/**
 * Deliver due messages. Each message is claimed with FOR UPDATE SKIP LOCKED, so several
 * servers can run this at once without sending a message twice. Returns how many were sent.
 */
export async function deliverOutbox(limit = 20): Promise<{ sent: number; failed: number }> {
  let sent = 0;
  let failed = 0;
  for (let i = 0; i < limit; i++) {
    const done = await db.transaction(async (tx) => {
      const [msg] = await tx
        .select()
        .from(outbox)
        .where(and(eq(outbox.status, "queued"), lte(outbox.nextAttemptAt, dsql`now()`)))
        .orderBy(asc(outbox.createdAt))
        .limit(1)
        .for("update", { skipLocked: true });
      if (!msg) return null;
      try {
        const info = await smtpTransport().sendMail({
          from: mailFrom(),
          to: msg.to,
          subject: msg.subject,
          text: msg.text,
          html: msg.html ?? undefined,
          messageId: `<${msg.id}@gavelwright.invalid>`,
          headers: msg.headers as Record<string, string>,
        });
        await tx.update(outbox).set({ status: "sent", sentAt: new Date(), attempts: msg.attempts + 1, lastError: null, smtpResponse: String(info.response ?? "") }).where(eq(outbox.id, msg.id));
        return "sent" as const;
      } catch (e) {
        const attempts = msg.attempts + 1;
        const wait = BACKOFF_SECONDS[Math.min(attempts - 1, BACKOFF_SECONDS.length - 1)];
        await tx
          .update(outbox)
          .set({
            attempts,
            lastError: String((e as Error).message ?? e).slice(0, 500),
            status: attempts >= MAX_ATTEMPTS ? "failed" : "queued",
            nextAttemptAt: new Date(Date.now() + wait * 1000),
          })
          .where(eq(outbox.id, msg.id));
        return "failed" as const;
      }
    });
    if (done === null) break;
    if (done === "sent") sent++;
    else {
      failed++;
      break; // the SMTP server is likely down: stop this round, retry later
    }
  }
  return { sent, failed };
}

let timer: NodeJS.Timeout | null = null;
/** Start the background delivery loop once per process (not in tests, which call deliverOutbox). */
export function startOutboxWorker(intervalMs = 2_000): void {
  if (timer || process.env.GAVELWRIGHT_MAIL_MODE === "test") return;
  let running = false;
  timer = setInterval(() => {
    if (running) return;
    running = true;
    deliverOutbox()
      .catch((e) => console.error("[outbox]", (e as Error).message))
      .finally(() => {
        running = false;
      });
  }, intervalMs);
  timer.unref();
}

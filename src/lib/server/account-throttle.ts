/**
 * Limits per account, next to better-auth's limits per client address (src/lib/server/auth.ts):
 *
 * - **Failed sign-ins for one e-mail address, from any address.** The first FREE_FAILURES
 *   failures in a row cost nothing; the n-th after them locks sign-in for that account for
 *   BASE_LOCK_SECONDS × 2^(n − 1), at most MAX_LOCK_SECONDS (30 s, 1 min, 2 min … 15 min). While locked,
 *   no password is checked (not even the right one) and the answer is 429 with Retry-After.
 *   A successful sign-in clears the count; a day without failures starts it again from zero.
 *   Rotating client addresses therefore gains nothing, and one noisy address locks out only the
 *   accounts it guesses at, for minutes, never anyone else.
 * - **Password-reset e-mails to one recipient**: at most RESET_MAIL_MAX in RESET_MAIL_WINDOW;
 *   further requests answer as usual (so they reveal nothing) but send no mail.
 *
 * Counted in PostgreSQL (table auth_throttle), so the limits hold across server processes.
 * `GAVELWRIGHT_RATE_LIMIT=off` turns these off together with the per-address limits (tests only).
 */
import { createHash } from "node:crypto";
import { sql } from "./db.ts";

export const FREE_FAILURES = 5;
export const BASE_LOCK_SECONDS = 30;
export const MAX_LOCK_SECONDS = 15 * 60;
export const FAILURE_MEMORY_SECONDS = 24 * 60 * 60;
export const RESET_MAIL_MAX = 3;
export const RESET_MAIL_WINDOW_SECONDS = 60 * 60;

/** Whether the sign-in and reset limits apply (read per request, so a test can switch them on). */
export function limitsEnabled(): boolean {
  return process.env.GAVELWRIGHT_RATE_LIMIT !== "off";
}

/** How long sign-in stays locked after the `failures`-th failure in a row (0: not locked). Pure. */
export function lockSeconds(failures: number): number {
  if (failures <= FREE_FAILURES) return 0;
  return Math.min(MAX_LOCK_SECONDS, BASE_LOCK_SECONDS * 2 ** Math.min(30, failures - FREE_FAILURES - 1));
}

/** The key for an e-mail address: SHA-256 of its trimmed, lower-cased form. */
export function subjectOf(email: string): string {
  return createHash("sha256").update(email.trim().toLowerCase()).digest("hex");
}

/** Seconds until sign-in for `email` is allowed again (0: allowed now). */
export async function signInLockedFor(email: string): Promise<number> {
  const [row] = await sql<{ wait: number }[]>`
    SELECT ceil(extract(epoch FROM locked_until - now()))::int AS wait
    FROM auth_throttle WHERE kind = 'sign-in' AND subject = ${subjectOf(email)} AND locked_until > now()`;
  return row ? Math.max(1, row.wait) : 0;
}

/** Count one failed sign-in for `email`; returns the failures in a row and the lock it earned. */
export async function recordSignInFailure(email: string): Promise<{ failures: number; lockedFor: number }> {
  const subject = subjectOf(email);
  return sql.begin(async (tx) => {
    const [row] = await tx<{ count: number }[]>`
      INSERT INTO auth_throttle (kind, subject, count, window_started_at, last_at)
      VALUES ('sign-in', ${subject}, 1, now(), now())
      ON CONFLICT (kind, subject) DO UPDATE SET
        count = CASE WHEN auth_throttle.last_at < now() - make_interval(secs => ${FAILURE_MEMORY_SECONDS}) THEN 1 ELSE auth_throttle.count + 1 END,
        window_started_at = CASE WHEN auth_throttle.last_at < now() - make_interval(secs => ${FAILURE_MEMORY_SECONDS}) THEN now() ELSE auth_throttle.window_started_at END,
        last_at = now()
      RETURNING count`;
    const failures = row!.count;
    const lockedFor = lockSeconds(failures);
    if (lockedFor > 0) await tx`UPDATE auth_throttle SET locked_until = now() + make_interval(secs => ${lockedFor}) WHERE kind = 'sign-in' AND subject = ${subject}`;
    return { failures, lockedFor };
  });
}

/** Forget the failures of `email` (after a successful sign-in or a password reset). */
export async function clearSignInFailures(email: string): Promise<void> {
  await sql`DELETE FROM auth_throttle WHERE kind = 'sign-in' AND subject = ${subjectOf(email)}`;
}

/** Count one reset e-mail to `email`; true if it may be sent (at most RESET_MAIL_MAX per window). */
export async function allowResetMail(email: string): Promise<boolean> {
  const [row] = await sql<{ count: number }[]>`
    INSERT INTO auth_throttle (kind, subject, count, window_started_at, last_at)
    VALUES ('reset-mail', ${subjectOf(email)}, 1, now(), now())
    ON CONFLICT (kind, subject) DO UPDATE SET
      count = CASE WHEN auth_throttle.window_started_at < now() - make_interval(secs => ${RESET_MAIL_WINDOW_SECONDS}) THEN 1 ELSE auth_throttle.count + 1 END,
      window_started_at = CASE WHEN auth_throttle.window_started_at < now() - make_interval(secs => ${RESET_MAIL_WINDOW_SECONDS}) THEN now() ELSE auth_throttle.window_started_at END,
      last_at = now()
    RETURNING count`;
  return row!.count <= RESET_MAIL_MAX;
}

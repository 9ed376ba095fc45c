// Per-account limits on sign-in and password-reset mail (src/lib/server/account-throttle.ts),
// kept in PostgreSQL so they hold across every server process, whatever address a request comes
// from. `subject` is the SHA-256 of the normalised e-mail address, so the table keeps no address
// that was merely guessed.
import { integer, pgTable, primaryKey, text, timestamp } from "drizzle-orm/pg-core";

export const authThrottle = pgTable(
  "auth_throttle",
  {
    /** "sign-in" (failed sign-ins for an account) or "reset-mail" (reset e-mails sent to a recipient). */
    kind: text("kind").notNull(),
    subject: text("subject").notNull(),
    count: integer("count").notNull(),
    windowStartedAt: timestamp("window_started_at", { withTimezone: true }).notNull().defaultNow(),
    lastAt: timestamp("last_at", { withTimezone: true }).notNull().defaultNow(),
    /** Sign-in: no attempt for this account is checked before this moment. */
    lockedUntil: timestamp("locked_until", { withTimezone: true }),
  },
  (t) => [primaryKey({ columns: [t.kind, t.subject] })],
);

/**
 * Sign-in and chamber membership (better-auth). A chamber is a better-auth organization;
 * a user's role in it is one of CHAMBER_ROLES. Server-only.
 */
import { betterAuth } from "better-auth";
import { APIError, createAuthMiddleware, isAPIError } from "better-auth/api";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { organization } from "better-auth/plugins";
import { db } from "./db.ts";
import * as schema from "../db/schema/index.ts";
import { ac, roles } from "./access-control.ts";
import { enqueueMail } from "./mail.ts";
import { ROLE_LABELS, isChamberRole } from "../permissions.ts";
import { escapeHtml } from "../text/escape-html.ts";
import { describeError } from "./log-safe.ts";
import { CLIENT_ADDRESS_HEADER } from "./client-address.ts";
import { allowResetMail, clearSignInFailures, limitsEnabled, recordSignInFailure, signInLockedFor } from "./account-throttle.ts";

export function baseUrl(): string {
  return process.env.BETTER_AUTH_URL ?? `http://${process.env.HOST ?? "127.0.0.1"}:${process.env.PORT ?? 4321}`;
}

/**
 * Whether anyone who signs up may register a chamber (GAVELWRIGHT_OPEN_SIGNUP=on). Off by default:
 * the operator creates chambers with `npm run chamber:create`, and people join by invitation.
 * Read per request, so the setting is the environment's at that moment.
 */
export function openSignup(): boolean {
  return ["on", "1", "true", "yes"].includes((process.env.GAVELWRIGHT_OPEN_SIGNUP ?? "").trim().toLowerCase());
}

/** The e-mail of a sign-in request body, if it has one. */
function emailOf(body: unknown): string | null {
  const email = (body as { email?: unknown } | undefined)?.email;
  return typeof email === "string" && email.length > 0 && email.length <= 320 ? email : null;
}

export const auth = betterAuth({
  appName: "Gavelwright",
  secret: process.env.BETTER_AUTH_SECRET,
  baseURL: baseUrl(),
  trustedOrigins: [baseUrl()],
  database: drizzleAdapter(db, { provider: "pg", schema }),
  telemetry: { enabled: false },
  // Reset tokens (and every other verification identifier) are stored as their SHA-256, so a
  // copy of the database does not hold a usable reset link.
  verification: { storeIdentifier: "hashed" },
  // better-auth logs failed queries with their parameters (a session token, an e-mail): log them without.
  logger: { log: (level, message, ...args) => console[level === "error" ? "error" : level === "warn" ? "warn" : "log"](`[auth] ${level}: ${message}`, ...args.map((a) => (a instanceof Error ? describeError(a) : a))) },
  emailAndPassword: {
    enabled: true,
    minPasswordLength: 10,
    maxPasswordLength: 128,
    resetPasswordTokenExpiresIn: 60 * 60,
    revokeSessionsOnPasswordReset: true,
    async onPasswordReset({ user }) {
      await clearSignInFailures(user.email);
    },
    async sendResetPassword({ user, url }) {
      // At most a few reset e-mails per recipient an hour, whatever address asks (account-throttle.ts).
      if (limitsEnabled() && !(await allowResetMail(user.email))) {
        console.warn("[auth] password-reset e-mail not sent: too many for this recipient in the last hour");
        return;
      }
      await enqueueMail({
        kind: "password-reset",
        ref: user.id,
        to: user.email,
        subject: "Reset your Gavelwright password",
        text: `Someone asked to reset the password of your Gavelwright account (${user.email}).\n\nTo choose a new password, open this link within one hour:\n${url}\n\nIf you did not ask for this, ignore this message; your password stays as it is.`,
        html: `<p>Someone asked to reset the password of your Gavelwright account (${escapeHtml(user.email)}).</p><p><a href="${escapeHtml(url)}">Choose a new password</a> (the link works for one hour).</p><p>If you did not ask for this, ignore this message; your password stays as it is.</p>`,
      });
    },
  },
  rateLimit: {
    enabled: process.env.GAVELWRIGHT_RATE_LIMIT !== "off",
    // Counted in PostgreSQL, so a limit holds across every server process (table rate_limit).
    storage: "database",
    window: 60,
    max: 200,
    customRules: {
      "/sign-in/email": { window: 60, max: 10 },
      "/request-password-reset": { window: 300, max: 5 },
      "/sign-up/email": { window: 60, max: 10 },
    },
  },
  // Per-account back-off on failed sign-ins, whatever address they come from (account-throttle.ts).
  hooks: {
    before: createAuthMiddleware(async (ctx) => {
      if (ctx.path !== "/sign-in/email" || !limitsEnabled()) return;
      const email = emailOf(ctx.body);
      if (!email) return;
      const wait = await signInLockedFor(email);
      if (wait > 0)
        throw new APIError("TOO_MANY_REQUESTS", { code: "ACCOUNT_LOCKED_FOR_NOW", message: `Too many failed sign-ins for this account. Try again in ${wait} s.` }, { "Retry-After": String(wait), "X-Retry-After": String(wait) });
    }),
    after: createAuthMiddleware(async (ctx) => {
      if (ctx.path !== "/sign-in/email" || !limitsEnabled()) return;
      const email = emailOf(ctx.body);
      if (!email) return;
      const returned = ctx.context.returned;
      if (isAPIError(returned)) {
        if (returned.statusCode === 401) await recordSignInFailure(email);
      } else if (returned !== undefined) await clearSignInFailures(email);
    }),
  },
  advanced: {
    useSecureCookies: baseUrl().startsWith("https://"),
    // Only the address the auth route writes from the connection's peer (client-address.ts);
    // never a header the client controls.
    ipAddress: { ipAddressHeaders: [CLIENT_ADDRESS_HEADER] },
  },
  plugins: [
    organization({
      ac,
      roles,
      creatorRole: "chief-clerk",
      // Registering a chamber from the app is a deployment setting; the operator's command
      // (scripts/chamber-create.ts) and the demo seed create chambers as system actions.
      allowUserToCreateOrganization: () => openSignup(),
      invitationExpiresIn: 7 * 24 * 60 * 60,
      cancelPendingInvitationsOnReInvite: true,
      // The chamber's time zone, in which every date is shown (src/lib/text/dates.ts); not settable through the auth API.
      schema: { organization: { additionalFields: { timeZone: { type: "string", required: false, defaultValue: "UTC", input: false } } } },
      async sendInvitationEmail(data) {
        const url = `${baseUrl()}/invitations/${data.id}`;
        const roleLabel = isChamberRole(data.role) ? ROLE_LABELS[data.role] : data.role;
        await enqueueMail({
          kind: "invitation",
          ref: data.id,
          chamberId: data.organization.id,
          to: data.email,
          subject: `Invitation to ${data.organization.name} on Gavelwright`,
          text: `${data.inviter.user.name} invites you to join ${data.organization.name} on Gavelwright as ${roleLabel}.\n\nAccept the invitation (sign in or create an account with this e-mail address first):\n${url}\n\nThe invitation expires in seven days.`,
          html: `<p>${escapeHtml(data.inviter.user.name)} invites you to join <strong>${escapeHtml(data.organization.name)}</strong> on Gavelwright as ${escapeHtml(roleLabel)}.</p><p><a href="${escapeHtml(url)}">Accept the invitation</a> (sign in or create an account with this e-mail address first).</p><p>The invitation expires in seven days.</p>`,
        });
      },
    }),
  ],
});

export type AuthSession = typeof auth.$Infer.Session;

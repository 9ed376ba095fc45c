// Sign-in and password-reset limits (issue 17, item 1). Two kinds, both counted in PostgreSQL so
// that they hold across server processes (here several processes, one after the other, share them):
// - per client address (better-auth's rate limit, src/lib/server/auth.ts): 10 sign-ins a minute,
//   5 reset requests in five minutes. The address is the connection's peer (scripts/serve.mjs
//   passes it to the app), never a header the client writes (src/lib/server/client-address.ts);
// - per account (src/lib/server/account-throttle.ts): after 5 failed sign-ins in a row for one
//   e-mail, from any address, sign-in for that account is locked for 30 s, doubling to 15 min;
//   at most 3 reset e-mails an hour to one recipient.
// The probe's cases: rotating X-Forwarded-For gave 40 wrong passwords in a row with no 429 and
// then a sign-in with the right one, and unlimited reset e-mails to a victim; without the header
// every client shared one counter, so ten bad sign-ins locked everyone out.
// Common practice (OWASP Authentication Cheat Sheet, "Protect against automated attacks";
// OWASP Forgot Password Cheat Sheet, paraphrase), no source for the particular numbers, which are ours.
import { beforeAll, describe, expect, it } from "vitest";
import { DEMO_ACCOUNTS } from "../../../src/lib/server/seed/demo-data.ts";
import { sql } from "../../../src/lib/server/db.ts";
import { subjectOf } from "../../../src/lib/server/account-throttle.ts";
import { seedChambers } from "../../support/fixtures.ts";
import { runFixture } from "./fixtures/run-fixture.ts";
import type { Attempt } from "./fixtures/auth-attempts.ts";

const member = DEMO_ACCOUNTS.find((a) => a.chamber === "harrowmere" && a.role === "member")!;
const clerk = DEMO_ACCOUNTS.find((a) => a.chamber === "harrowmere" && a.role === "clerk")!;
const staff = DEMO_ACCOUNTS.find((a) => a.chamber === "harrowmere" && a.role === "staff")!;

/** One server process making these attempts; the statuses it got. */
function run(attempts: Attempt[]): number[] {
  return runFixture("auth-attempts.ts", [JSON.stringify(attempts)], { GAVELWRIGHT_RATE_LIMIT: "on", NODE_ENV: "production" });
}
const signIn = (email: string, password: string, peer: string, forged?: number): Attempt => ({
  path: "/sign-in/email",
  body: { email, password },
  peer,
  ...(forged !== undefined ? { forwardedFor: `198.51.100.${forged}`, forgedAddress: `192.0.2.${forged}` } : {}),
});
/** `n` wrong sign-ins from `peer`, each for a different (unknown) account, so only the address is counted. */
const wrongFrom = (peer: string, n: number, tag: string, forge = false): Attempt[] =>
  Array.from({ length: n }, (_, i) => signIn(`nobody-${tag}-${i}@example.org`, "not-the-password", peer, forge ? i + 1 : undefined));

beforeAll(async () => {
  await seedChambers();
});

describe("per-address limits use the connection's address", () => {
  it("refuses the 11th sign-in in a minute from one address, counted across two server processes", () => {
    expect(run(wrongFrom("203.0.113.10", 6, "a"))).toEqual([401, 401, 401, 401, 401, 401]);
    expect(run(wrongFrom("203.0.113.10", 6, "b"))).toEqual([401, 401, 401, 401, 429, 429]);
    // Another address is counted on its own, and the right password still works from there.
    expect(run([signIn(member.email, member.password, "203.0.113.11")])).toEqual([200]);
  });

  it("a forged X-Forwarded-For or client-address header does not give a fresh counter (the probe's rotation)", () => {
    const statuses = run(wrongFrom("203.0.113.30", 12, "rot", true));
    expect(statuses.slice(0, 10)).toEqual(Array(10).fill(401));
    expect(statuses.slice(10)).toEqual([429, 429]);
  });

  it("one noisy address does not lock out anyone else (no shared counter)", () => {
    const statuses = run([
      ...wrongFrom("203.0.113.40", 12, "noisy"),
      signIn(clerk.email, clerk.password, "203.0.113.41"),
      // IPv6 peers too, each its own /64.
      signIn(staff.email, staff.password, "2001:db8:1::5"),
    ]);
    expect(statuses.slice(10)).toEqual([429, 429, 200, 200]);
  });

  it("behind a listed proxy, the right-most untrusted X-Forwarded-For hop is the client", () => {
    const viaProxy = (forwardedFor: string, tag: string, n: number): Attempt[] =>
      wrongFrom("10.0.0.2", n, tag).map((a) => ({ ...a, forwardedFor }));
    const statuses = runFixture<number[]>("auth-attempts.ts", [JSON.stringify([
      // The client prepends addresses of its own; the proxy appends the real one (203.0.113.50).
      ...viaProxy("1.1.1.1, 203.0.113.50", "p1", 5),
      ...viaProxy("2.2.2.2, 203.0.113.50", "p2", 5),
      ...viaProxy("3.3.3.3, 203.0.113.50", "p3", 1),
      // Another client behind the same proxy has its own counter.
      signIn(clerk.email, clerk.password, "10.0.0.2"),
    ].map((a, i, all) => (i === all.length - 1 ? { ...a, forwardedFor: "203.0.113.51" } : a)))], { GAVELWRIGHT_RATE_LIMIT: "on", NODE_ENV: "production", TRUSTED_PROXIES: "10.0.0.0/8" });
    expect(statuses.slice(0, 10)).toEqual(Array(10).fill(401));
    expect(statuses[10]).toBe(429);
    expect(statuses[11]).toBe(200);
  });
});

describe("per-account back-off, whatever the address", () => {
  it("locks an account after 5 failures from rotating addresses, even for the right password, then lets it in once the lock has run", async () => {
    const email = member.email;
    const failures = Array.from({ length: 7 }, (_, i) => signIn(email, `wrong-password-${i}`, `203.0.113.${100 + i}`));
    // 5 free failures; the 6th locks the account for 30 s, so the 7th is refused unchecked.
    expect(run(failures)).toEqual([401, 401, 401, 401, 401, 401, 429]);
    // The right password, from an address never seen before: still refused while locked.
    expect(run([signIn(email, member.password, "203.0.113.120")])).toEqual([429]);
    const [row] = await sql<{ count: number; lock: number }[]>`SELECT count, extract(epoch FROM locked_until - now())::int AS lock FROM auth_throttle WHERE kind = 'sign-in' AND subject = ${subjectOf(email)}`;
    expect(row!.count).toBe(6);
    expect(row!.lock).toBeGreaterThan(20);
    expect(row!.lock).toBeLessThanOrEqual(30);
    // The lock runs out (moved into the past here instead of waiting): the right password works
    // and clears the count.
    await sql`UPDATE auth_throttle SET locked_until = now() - interval '1 second' WHERE kind = 'sign-in' AND subject = ${subjectOf(email)}`;
    expect(run([signIn(email.toUpperCase(), member.password, "203.0.113.121")])).toEqual([200]);
    expect(await sql`SELECT 1 FROM auth_throttle WHERE kind = 'sign-in' AND subject = ${subjectOf(email)}`).toHaveLength(0);
  });

  it("each further failure doubles the lock", async () => {
    const email = "doubling@example.org";
    expect(run(Array.from({ length: 6 }, (_, i) => signIn(email, "nope-nope-nope", `203.0.113.${130 + i}`))).at(-1)).toBe(401);
    await sql`UPDATE auth_throttle SET locked_until = now() - interval '1 second' WHERE subject = ${subjectOf(email)}`;
    expect(run([signIn(email, "nope-nope-nope", "203.0.113.140")])).toEqual([401]);
    const [row] = await sql<{ count: number; lock: number }[]>`SELECT count, extract(epoch FROM locked_until - now())::int AS lock FROM auth_throttle WHERE kind = 'sign-in' AND subject = ${subjectOf(email)}`;
    expect(row!.count).toBe(7);
    expect(row!.lock).toBeGreaterThan(50);
    expect(row!.lock).toBeLessThanOrEqual(60);
  });
});

describe("password-reset requests", () => {
  it("refuses the 6th password-reset request in five minutes from one address", () => {
    const statuses = run(Array.from({ length: 6 }, (_, i) => ({ path: "/request-password-reset", body: { email: `nobody-reset-${i}@example.org`, redirectTo: "/reset-password" }, peer: "203.0.113.20" })));
    expect(statuses.slice(0, 5).every((s) => s === 200)).toBe(true);
    expect(statuses[5]).toBe(429);
  });

  it("sends at most 3 reset e-mails an hour to one recipient, from however many addresses", async () => {
    const before = await sql<{ n: number }[]>`SELECT count(*)::int AS n FROM outbox WHERE kind = 'password-reset' AND "to" = ${staff.email}`;
    const statuses = run(Array.from({ length: 6 }, (_, i) => ({ path: "/request-password-reset", body: { email: staff.email, redirectTo: "/reset-password" }, peer: `203.0.113.${200 + i}` })));
    // Every request answers alike (nothing tells whether mail went out) …
    expect(statuses).toEqual([200, 200, 200, 200, 200, 200]);
    // … but only three e-mails are queued.
    const after = await sql<{ n: number }[]>`SELECT count(*)::int AS n FROM outbox WHERE kind = 'password-reset' AND "to" = ${staff.email}`;
    expect(after[0]!.n - before[0]!.n).toBe(3);
  });
});

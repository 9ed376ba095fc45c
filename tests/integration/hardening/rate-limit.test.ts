// Sign-in and password-reset attempts are limited per client address (src/lib/server/auth.ts:
// 10 sign-ins a minute, 5 reset requests in five minutes), and the count is kept in PostgreSQL,
// so the limit holds across server processes: here two processes, one after the other, share it.
// Common practice (OWASP Authentication Cheat Sheet, "Protect against automated attacks"), no source
// for the particular numbers, which are ours.
import { beforeAll, describe, expect, it } from "vitest";
import { DEMO_ACCOUNTS } from "../../../src/lib/server/seed/demo-data.ts";
import { seedChambers } from "../../support/fixtures.ts";
import { runFixture } from "./fixtures/run-fixture.ts";

const member = DEMO_ACCOUNTS.find((a) => a.chamber === "harrowmere" && a.role === "member")!;

/** One server process making `n` attempts at `path` from address `ip`; the statuses it got. */
function attempts(path: string, body: unknown, n: number, ip: string): number[] {
  return runFixture("auth-attempts.ts", [path, JSON.stringify(body), String(n), ip], { GAVELWRIGHT_RATE_LIMIT: "on", NODE_ENV: "production" });
}

beforeAll(async () => {
  await seedChambers();
});

describe("rate limits on sign-in and password reset", () => {
  it("refuses the 11th sign-in in a minute from one address, counted across two server processes", () => {
    const wrong = { email: member.email, password: "not-the-password" };
    const first = attempts("/sign-in/email", wrong, 6, "203.0.113.10");
    const second = attempts("/sign-in/email", wrong, 6, "203.0.113.10");
    expect(first).toEqual([401, 401, 401, 401, 401, 401]);
    expect(second).toEqual([401, 401, 401, 401, 429, 429]);
    // Another address is counted on its own, and the right password still works from there.
    expect(attempts("/sign-in/email", { email: member.email, password: member.password }, 1, "203.0.113.11")).toEqual([200]);
  });

  it("refuses the 6th password-reset request in five minutes from one address", () => {
    const statuses = attempts("/request-password-reset", { email: member.email, redirectTo: "/reset-password" }, 6, "203.0.113.20");
    expect(statuses.slice(0, 5).every((s) => s === 200)).toBe(true);
    expect(statuses[5]).toBe(429);
  });
});

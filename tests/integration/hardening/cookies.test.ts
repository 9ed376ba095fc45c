// Session cookies: HttpOnly and SameSite=Lax always; Secure (with the __Secure- prefix) when the
// public origin is https, so they never travel over plain HTTP behind a TLS proxy.
// Common practice (OWASP session management; RFC 6265bis cookie prefixes), no source.
import { beforeAll, describe, expect, it } from "vitest";
import { DEMO_ACCOUNTS } from "../../../src/lib/server/seed/demo-data.ts";
import { seedChambers } from "../../support/fixtures.ts";
import { runFixture } from "./fixtures/run-fixture.ts";

const observer = DEMO_ACCOUNTS.find((a) => a.chamber === "harrowmere" && a.role === "observer")!;

function signInUnder(origin: string): { status: number; cookies: string[] } {
  return runFixture("sign-in-cookies.ts", [observer.email, observer.password], { BETTER_AUTH_URL: origin });
}

beforeAll(async () => {
  await seedChambers();
});

describe("session cookies", () => {
  it("under http: HttpOnly, SameSite=Lax, not Secure", () => {
    const { status, cookies } = signInUnder("http://127.0.0.1:4399");
    expect(status).toBe(200);
    const session = cookies.find((c) => c.includes("session_token="))!;
    expect(session).toMatch(/;\s*HttpOnly/i);
    expect(session).toMatch(/;\s*SameSite=Lax/i);
    expect(session).not.toMatch(/;\s*Secure/i);
  });

  it("under https: every cookie Secure and __Secure- prefixed, still HttpOnly and SameSite=Lax", () => {
    const { status, cookies } = signInUnder("https://desk.harrowmere.example");
    expect(status).toBe(200);
    expect(cookies.length).toBeGreaterThan(0);
    for (const c of cookies) {
      expect(c).toMatch(/^__Secure-/);
      expect(c).toMatch(/;\s*Secure/i);
      expect(c).toMatch(/;\s*HttpOnly/i);
      expect(c).toMatch(/;\s*SameSite=Lax/i);
    }
  });
});

// Sign-up, sign-in, password reset and invitations against the real PostgreSQL.
// Behaviour checked is the product's own contract (common practice, no source).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { auth } from "../../../src/lib/server/auth.ts";
import { db } from "../../../src/lib/server/db.ts";
import { deliverOutbox } from "../../../src/lib/server/mail.ts";
import { outbox } from "../../../src/lib/db/schema/mail.ts";
import { member, user } from "../../../src/lib/db/schema/auth.ts";
import { startMailCatcher, type CaughtMessage, type MailCatcher } from "../../../src/lib/server/dev/mail-catcher.ts";
import * as people from "../../../src/pages/api/people/index.ts";
import * as invitations from "../../../src/pages/api/people/invitations/index.ts";
import * as memberRoute from "../../../src/pages/api/people/members/[id].ts";
import { call, signIn, signUp } from "../../support/app.ts";
import { tableCounts } from "../../support/db.ts";
import { seedChambers, type Seeded } from "../../support/fixtures.ts";

let catcher: MailCatcher;
const inbox: CaughtMessage[] = [];
let s: Seeded;

beforeAll(async () => {
  catcher = await startMailCatcher({ port: Number(process.env.SMTP_PORT), onMessage: (m) => void inbox.push(m) });
  s = await seedChambers();
});
afterAll(async () => {
  await catcher.close();
});

describe("sign-up and sign-in", () => {
  it("rejects an invalid e-mail and a short password, creating no user", async () => {
    const before = await tableCounts();
    await expect(auth.api.signUpEmail({ body: { email: "not-an-address", password: "long-enough-pass", name: "X" } })).rejects.toMatchObject({ statusCode: 400 });
    await expect(auth.api.signUpEmail({ body: { email: "short@example.org", password: "short", name: "X" } })).rejects.toMatchObject({ statusCode: 400 });
    expect(await tableCounts()).toEqual(before);
  });

  it("refuses a duplicate account and keeps the first", async () => {
    await signUp("dup@example.org");
    const before = await tableCounts();
    await expect(auth.api.signUpEmail({ body: { email: "dup@example.org", password: "another-password", name: "Y" } })).rejects.toMatchObject({ statusCode: 422 });
    expect(await tableCounts()).toEqual(before);
  });

  it("signs in with the right password only; a new user belongs to no chamber", async () => {
    await signUp("alone@example.org", "right-password-1");
    await expect(signIn("alone@example.org", "wrong-password-1")).rejects.toThrow(/401/);
    const ses = await signIn("alone@example.org", "right-password-1");
    const r = await call(people.GET, "GET", "/api/people", { as: ses });
    expect(r.status).toBe(403);
  });

  it("resets a password by e-mail, once", async () => {
    await signUp("forgetful@example.org", "old-password-1");
    await auth.api.requestPasswordReset({ body: { email: "forgetful@example.org", redirectTo: "/reset-password" } });
    const [queued] = await db.select().from(outbox).where(eq(outbox.to, "forgetful@example.org"));
    expect(queued.kind).toBe("password-reset");
    await deliverOutbox();
    const mail = inbox.find((m) => m.to.includes("forgetful@example.org"));
    expect(mail?.subject).toMatch(/Reset/);
    const token = /reset-password\/([^?\s]+)/.exec(mail!.text!)?.[1] ?? /token=([^&\s]+)/.exec(mail!.text!)?.[1];
    expect(token).toBeTruthy();
    await auth.api.resetPassword({ body: { newPassword: "new-password-22", token: token! } });
    await expect(signIn("forgetful@example.org", "old-password-1")).rejects.toThrow();
    await signIn("forgetful@example.org", "new-password-22");
    await expect(auth.api.resetPassword({ body: { newPassword: "third-password-3", token: token! } })).rejects.toMatchObject({ statusCode: 400 });
  });
});

describe("chamber roles", () => {
  it("lists the chamber's people to each role; invitations only to the chief clerk", async () => {
    for (const role of ["chief-clerk", "clerk", "member", "staff", "observer"] as const) {
      const r = await call(people.GET, "GET", "/api/people", { as: s.as[role] });
      expect(r.status, role).toBe(200);
      expect(r.body.members.length).toBe(5);
    }
    const other = await call(people.GET, "GET", "/api/people", { as: s.outsider });
    expect(other.body.members.map((m: { email: string }) => m.email)).toEqual(["chief.clerk@saltreach.example"]);
  });

  it("lets the chief clerk invite, validates the input, and mails the invitation (other roles: tests/access)", async () => {
    const bad = await call(invitations.POST, "POST", "/api/people/invitations", { as: s.as["chief-clerk"], body: { email: "nope", role: "speaker" } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues.map((i: { path: string }) => i.path).sort()).toEqual(["email", "role"]);
    const dup = await call(invitations.POST, "POST", "/api/people/invitations", { as: s.as["chief-clerk"], body: { email: "clerk@harrowmere.example", role: "member" } });
    expect(dup.status).toBe(409);
    const ok = await call(invitations.POST, "POST", "/api/people/invitations", { as: s.as["chief-clerk"], body: { email: "newcomer@example.org", role: "staff" } });
    expect(ok.status).toBe(201);
    await deliverOutbox();
    const mail = inbox.find((m) => m.to.includes("newcomer@example.org"));
    expect(mail?.subject).toContain("Harrowmere County Assembly");
    expect(mail?.text).toContain(`/invitations/${ok.body.id}`);
  });

  it("accepts an invitation once, for the invited address only; an expired one is refused", async () => {
    const inv = await call(invitations.POST, "POST", "/api/people/invitations", { as: s.as["chief-clerk"], body: { email: "joiner@example.org", role: "member" } });
    const stranger = await signUp("stranger@example.org");
    await expect(auth.api.acceptInvitation({ headers: new Headers({ cookie: stranger.cookie }), body: { invitationId: inv.body.id } })).rejects.toMatchObject({ statusCode: 403 });
    const joiner = await signUp("joiner@example.org");
    await auth.api.acceptInvitation({ headers: new Headers({ cookie: joiner.cookie }), body: { invitationId: inv.body.id } });
    const rows = await db.select().from(member).where(eq(member.userId, joiner.userId));
    expect(rows.map((r) => r.role)).toEqual(["member"]);
    await expect(auth.api.acceptInvitation({ headers: new Headers({ cookie: joiner.cookie }), body: { invitationId: inv.body.id } })).rejects.toMatchObject({ statusCode: 400 });

    const late = await call(invitations.POST, "POST", "/api/people/invitations", { as: s.as["chief-clerk"], body: { email: "late@example.org", role: "member" } });
    const { invitation } = await import("../../../src/lib/db/schema/auth.ts");
    await db.update(invitation).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(invitation.id, late.body.id));
    const lateUser = await signUp("late@example.org");
    await expect(auth.api.acceptInvitation({ headers: new Headers({ cookie: lateUser.cookie }), body: { invitationId: late.body.id } })).rejects.toMatchObject({ statusCode: 400 });
    expect(await db.select().from(member).where(eq(member.userId, lateUser.userId))).toEqual([]);
  });

  it("lets the chief clerk change roles, never leaving the chamber without one (other roles: tests/access)", async () => {
    const list = await call(people.GET, "GET", "/api/people", { as: s.as["chief-clerk"] });
    const obs = list.body.members.find((m: { email: string }) => m.email === "observer@harrowmere.example");
    const chief = list.body.members.find((m: { email: string }) => m.email === "chief.clerk@harrowmere.example");
    // Another chamber's chief clerk cannot even see this member: 404, not 403.
    expect((await call(memberRoute.PATCH, "PATCH", `/api/people/members/${obs.id}`, { as: s.outsider, params: { id: obs.id }, body: { role: "clerk" } })).status).toBe(404);
    const last = await call(memberRoute.PATCH, "PATCH", `/api/people/members/${chief.id}`, { as: s.as["chief-clerk"], params: { id: chief.id }, body: { role: "clerk" } });
    expect(last.status).toBe(422);
    const ok = await call(memberRoute.PATCH, "PATCH", `/api/people/members/${obs.id}`, { as: s.as["chief-clerk"], params: { id: obs.id }, body: { role: "member" } });
    expect(ok.status).toBe(200);
    const [row] = await db.select().from(member).where(eq(member.id, obs.id));
    expect(row.role).toBe("member");
    const [u] = await db.select().from(user).where(eq(user.email, "observer@harrowmere.example"));
    expect(u).toBeTruthy();
  });
});

// People of a chamber: role changes, removal and restoration, each with its line in the people log
// written in the same transaction; never the last chief clerk; another chamber's people are a 404.
// Refusals by role and for anonymous callers: tests/access (route inventory). Common practice, no source.
import { beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { db } from "../../../src/lib/server/db.ts";
import { member, user } from "../../../src/lib/db/schema/auth.ts";
import { peopleAudit } from "../../../src/lib/db/schema/people-audit.ts";
import * as people from "../../../src/pages/api/people/index.ts";
import * as memberRoute from "../../../src/pages/api/people/members/[id].ts";
import * as removedList from "../../../src/pages/api/people/removed/index.ts";
import * as restoreRoute from "../../../src/pages/api/people/removed/[id].ts";
import * as logRoute from "../../../src/pages/api/people/log.ts";
import { call, signIn } from "../../support/app.ts";
import { tableCounts } from "../../support/db.ts";
import { seedChambers, type Seeded } from "../../support/fixtures.ts";

let s: Seeded;
const chief = () => s.as["chief-clerk"];

async function memberOf(email: string) {
  const [m] = await db.select({ id: member.id, userId: member.userId, role: member.role }).from(member).innerJoin(user, eq(member.userId, user.id)).where(and(eq(member.organizationId, s.chambers.harrowmere), eq(user.email, email)));
  return m;
}

beforeAll(async () => {
  s = await seedChambers();
});

describe("people log", () => {
  it("records who changed whose role, from what to what, and when; an unchanged role records nothing", async () => {
    const staff = await memberOf("staff@harrowmere.example");
    const r = await call(memberRoute.PATCH, "PATCH", "/x", { as: chief(), params: { id: staff.id }, body: { role: "observer" } });
    expect(r.status).toBe(200);
    const log = await call(logRoute.GET, "GET", "/api/people/log", { as: chief() });
    expect(log.body.entries[0]).toMatchObject({ actor: "Odile Fenwright", subject: "Priya Kettleborough", action: "role-changed", fromRole: "staff", toRole: "observer" });
    expect(Date.now() - Date.parse(log.body.entries[0].at)).toBeLessThan(60_000);
    const before = await tableCounts();
    expect((await call(memberRoute.PATCH, "PATCH", "/x", { as: chief(), params: { id: staff.id }, body: { role: "observer" } })).status).toBe(200);
    expect(await tableCounts()).toEqual(before);
    await call(memberRoute.PATCH, "PATCH", "/x", { as: chief(), params: { id: staff.id }, body: { role: "staff" } });
  });

  it("refuses to demote or remove the last chief clerk, writing nothing", async () => {
    const c = await memberOf("chief.clerk@harrowmere.example");
    const before = await tableCounts();
    const demote = await call(memberRoute.PATCH, "PATCH", "/x", { as: chief(), params: { id: c.id }, body: { role: "clerk" } });
    expect(demote.status).toBe(422);
    const remove = await call(memberRoute.DELETE, "DELETE", "/x", { as: chief(), params: { id: c.id } });
    expect(remove.status).toBe(422);
    expect(await tableCounts()).toEqual(before);
  });

  it("removes a person (access ends at once, the account stays) and restores them with the role they held", async () => {
    const obs = await memberOf("observer@harrowmere.example");
    const observer = await signIn("observer@harrowmere.example", "demo-observer-pass");
    expect((await call(people.GET, "GET", "/api/people", { as: observer })).status).toBe(200);
    const gone = await call(memberRoute.DELETE, "DELETE", "/x", { as: chief(), params: { id: obs.id } });
    expect(gone.status).toBe(200);
    expect(await memberOf("observer@harrowmere.example")).toBeUndefined();
    expect((await db.select().from(user).where(eq(user.id, obs.userId))).length).toBe(1);
    // The removed person no longer reads the chamber.
    expect([401, 403]).toContain((await call(people.GET, "GET", "/api/people", { as: observer })).status);
    const removed = await call(removedList.GET, "GET", "/x", { as: chief() });
    expect(removed.body.removed).toEqual([expect.objectContaining({ userId: obs.userId, role: obs.role, removedBy: "Odile Fenwright" })]);
    // Removing again: no such member.
    expect((await call(memberRoute.DELETE, "DELETE", "/x", { as: chief(), params: { id: obs.id } })).status).toBe(404);

    const back = await call(restoreRoute.POST, "POST", "/x", { as: chief(), params: { id: obs.userId } });
    expect(back.status).toBe(200);
    expect((await memberOf("observer@harrowmere.example")).role).toBe(obs.role);
    expect((await call(removedList.GET, "GET", "/x", { as: chief() })).body.removed).toEqual([]);
    // Restoring someone who is not removed: 404, nothing written.
    const before = await tableCounts();
    expect((await call(restoreRoute.POST, "POST", "/x", { as: chief(), params: { id: obs.userId } })).status).toBe(404);
    expect(await tableCounts()).toEqual(before);
    const actions = (await db.select().from(peopleAudit).where(eq(peopleAudit.subjectId, obs.userId))).map((e) => e.action).sort();
    expect(actions).toEqual(["removed", "restored"]);
  });

  it("keeps the other chamber out: its chief clerk gets 404 and sees none of this chamber's log", async () => {
    const obs = await memberOf("observer@harrowmere.example");
    const before = await tableCounts();
    expect((await call(memberRoute.DELETE, "DELETE", "/x", { as: s.outsider, params: { id: obs.id } })).status).toBe(404);
    expect((await call(restoreRoute.POST, "POST", "/x", { as: s.outsider, params: { id: obs.userId } })).status).toBe(404);
    expect(await tableCounts()).toEqual(before);
    const theirs = await call(logRoute.GET, "GET", "/x", { as: s.outsider });
    expect(JSON.stringify(theirs.body)).not.toContain("Harrowmere");
    expect(theirs.body.entries.every((e: { subject: string }) => !/Oakhurst|Kettleborough/.test(e.subject))).toBe(true);
  });
});

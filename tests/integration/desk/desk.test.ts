// The desk (src/lib/server/services/desk.ts) against the seeded Harrowmere chamber: what each role
// sees today. The filing deadline is the adopted rulebook's (Harrowmere Standing Orders, fictional,
// SO 64: amendments filed 48 hours before the sitting) counted back from the measure's sitting;
// everything else is the product's own contract (issue 15, item 10), common practice, no source.
import { beforeAll, describe, expect, it } from "vitest";
import { and, eq, isNull } from "drizzle-orm";
import { db } from "../../../src/lib/server/db.ts";
import { loadContext } from "../../../src/lib/server/context.ts";
import { requireActor, type Actor } from "../../../src/lib/server/http.ts";
import { deskOf, DEADLINE_WINDOW_DAYS } from "../../../src/lib/server/services/desk.ts";
import { treeOf } from "../../../src/lib/server/services/trees.ts";
import { adoptedRulebookOf } from "../../../src/lib/server/measure-rulebook.ts";
import { seedDemo } from "../../../src/lib/server/seed/index.ts";
import { measures } from "../../../src/lib/db/schema/measures.ts";
import { analysisRuns, estimates } from "../../../src/lib/db/schema/estimates.ts";
import { outbox } from "../../../src/lib/db/schema/mail.ts";
import { sittings } from "../../../src/lib/db/schema/floor.ts";
import * as measureIndex from "../../../src/pages/api/measures/index.ts";
import * as filing from "../../../src/pages/api/measures/[id]/amendments.ts";
import * as archiveRoute from "../../../src/pages/api/measures/[id]/archive.ts";
import { legislators } from "../../../src/lib/db/schema/chamber.ts";
import * as rulingIndex from "../../../src/pages/api/rulings/index.ts";
import * as rulingIssue from "../../../src/pages/api/rulings/[id]/issue.ts";
import * as sittingIndex from "../../../src/pages/api/floor/sittings/index.ts";
import { call, type Session } from "../../support/app.ts";
import { seedChambers, type Seeded } from "../../support/fixtures.ts";
import { harrowmereLegislators, rulingBody } from "../rulings/helpers.ts";

let s: Seeded;
const HOUR = 3_600_000;

async function actorOf(session: Session): Promise<Actor> {
  const ctx = await loadContext(new Headers({ cookie: session.cookie }));
  return requireActor({ ...ctx, requestId: "test" } as App.Locals);
}

async function newMeasure(number: string, sittingAt: Date | null, status = "on-floor") {
  const r = await call(measureIndex.POST, "POST", "/api/measures", { as: s.as.clerk, body: { number, title: `Desk test ${number}`, status, subjects: ["harbour"], sittingAt: sittingAt?.toISOString() ?? null, text: "## Section 1 — Test\nSubjects: harbour\nA line." } });
  expect(r.status, JSON.stringify(r.body)).toBe(201);
  return r.body.id as string;
}

beforeAll(async () => {
  s = await seedChambers();
  await seedDemo();
}, 120_000);

describe("the desk", () => {
  it("shows the next sitting with every measure due that day, and not a closed or past one", async () => {
    const clerk = await actorOf(s.as.clerk);
    const due = await db.select({ id: measures.id, sittingAt: measures.sittingAt }).from(measures).where(and(eq(measures.chamberId, s.chambers.harrowmere), eq(measures.number, "HCA 12")));
    const at = due[0].sittingAt!;
    const sameDay = await newMeasure("DESK 1", new Date(at.getTime() + HOUR));
    const past = await newMeasure("DESK 2", new Date(Date.now() - 2 * HOUR));
    const closed = await newMeasure("DESK 3", new Date(at.getTime() - HOUR), "passed");
    const desk = await deskOf(clerk);
    expect(desk.nextSitting?.at).toBe(at.toISOString());
    const ids = desk.nextSitting!.measures.map((m) => m.id);
    expect(ids).toEqual(expect.arrayContaining([due[0].id, sameDay]));
    expect(ids).not.toContain(past);
    expect(ids).not.toContain(closed);
    // Every role reads the same sitting.
    for (const role of ["member", "staff", "observer"] as const) expect((await deskOf(await actorOf(s.as[role]))).nextSitting?.at).toBe(at.toISOString());
  });

  it("lists filing deadlines running out: the rulebook's hours counted back from the sitting, within the window", async () => {
    const clerk = await actorOf(s.as.clerk);
    const rule = (await adoptedRulebookOf(s.chambers.harrowmere)).rulebook.amendments.filingDeadline!;
    expect(rule.hoursBefore).toBeGreaterThan(0);
    const soon = new Date(Date.now() + (rule.hoursBefore + 5) * HOUR);
    const passedDeadline = new Date(Date.now() + (rule.hoursBefore - 1) * HOUR);
    const farOff = new Date(Date.now() + (rule.hoursBefore + 24 * (DEADLINE_WINDOW_DAYS + 1)) * HOUR);
    const a = await newMeasure("DESK 4", soon);
    const b = await newMeasure("DESK 5", passedDeadline);
    const c = await newMeasure("DESK 6", farOff);
    const desk = await deskOf(clerk);
    const mine = desk.deadlines.find((d) => d.id === a);
    expect(mine?.deadline).toBe(new Date(soon.getTime() - rule.hoursBefore * HOUR).toISOString());
    expect(mine?.citation).toBe(rule.citation);
    expect(desk.deadlines.map((d) => d.id)).not.toContain(b);
    expect(desk.deadlines.map((d) => d.id)).not.toContain(c);
    expect(desk.deadlines.map((d) => d.deadline)).toEqual([...desk.deadlines.map((d) => d.deadline)].sort());
  });

  it("shows a member their own drafts and the pending amendments they filed or sponsor, nobody else's, on open measures only", async () => {
    const member = await actorOf(s.as.member);
    const [own] = await db.select({ id: legislators.id }).from(legislators).where(and(eq(legislators.chamberId, s.chambers.harrowmere), eq(legislators.userId, member.user.id)));
    const [other] = await db.select({ id: legislators.id }).from(legislators).where(and(eq(legislators.chamberId, s.chambers.harrowmere), eq(legislators.name, (await harrowmereLegislators(s.chambers.harrowmere)).find((l) => l.id !== own.id)!.name)));
    const m = await newMeasure("DESK 7", null);
    const file = async (as: Session, body: Record<string, unknown>, measureId = m) => {
      const r = await call(filing.POST, "POST", "/x", { as, params: { id: measureId }, body: { form: "insert", target: "s1", text: "A line.", subjects: ["harbour"], sponsors: [], ...body } });
      expect(r.status, JSON.stringify(r.body)).toBe(201);
      return r.body.id as string;
    };
    const draft = await file(s.as.member, { title: "Mine, a draft", draft: true, sponsors: [own.id] });
    const filedByMe = await file(s.as.member, { title: "Mine, filed", sponsors: [own.id] });
    const sponsored = await file(s.as.clerk, { title: "Sponsored by me", sponsors: [own.id, other.id] });
    const notMine = await file(s.as.clerk, { title: "Someone else's", sponsors: [other.id] });
    const clerkDraft = await file(s.as.clerk, { title: "The clerk's draft", draft: true, sponsors: [own.id] });
    const gone = await newMeasure("DESK 8", null);
    const onArchived = await file(s.as.member, { title: "On a measure archived later", sponsors: [own.id] }, gone);
    expect((await call(archiveRoute.POST, "POST", "/x", { as: s.as.clerk, params: { id: gone }, body: { version: 1 } })).status).toBeLessThan(300);

    const desk = await deskOf(member);
    const ids = desk.ownAmendments!.map((a) => a.id);
    expect(ids).toEqual(expect.arrayContaining([draft, filedByMe, sponsored]));
    for (const id of [notMine, clerkDraft, onArchived]) expect(ids).not.toContain(id);
    const byId = new Map(desk.ownAmendments!.map((a) => [a.id, a]));
    expect(byId.get(draft)).toMatchObject({ status: "draft", words: "A draft amendment to section 1 of DESK 7" });
    expect(byId.get(filedByMe)).toMatchObject({ status: "filed", words: expect.stringMatching(/^Amendment A\d+ to section 1 of DESK 7$/) });
    // Those who do not file amendments have no such list.
    expect((await deskOf(await actorOf(s.as.staff))).ownAmendments).toBeNull();
    expect((await deskOf(await actorOf(s.as.observer))).ownAmendments).toBeNull();
  });

  it("lists exactly the open measures (not archived) whose tree check has open errors, with their count", async () => {
    const desk = await deskOf(await actorOf(s.as.member));
    const open = await db.select({ id: measures.id, status: measures.status }).from(measures).where(and(eq(measures.chamberId, s.chambers.harrowmere), isNull(measures.archivedAt)));
    const clerk = await actorOf(s.as.clerk);
    const expected = [];
    for (const m of open.filter((x) => !["passed", "failed", "withdrawn"].includes(x.status))) {
      const n = (await treeOf(clerk, m.id)).counts.error;
      if (n > 0) expected.push({ id: m.id, errors: n });
    }
    expect(expected.length).toBeGreaterThan(0);
    expect(desk.treeErrors.map((t) => ({ id: t.id, errors: t.errors })).sort((x, y) => x.id.localeCompare(y.id))).toEqual(expected.sort((x, y) => x.id.localeCompare(y.id)));
  });

  it("shows a ruling just issued first among the recent rulings, to every role; drafts never", async () => {
    const [raiser] = await harrowmereLegislators(s.chambers.harrowmere);
    const d = await call(rulingIndex.POST, "POST", "/api/rulings", { as: s.as.clerk, body: rulingBody(raiser.id) });
    expect(d.status).toBe(201);
    const draftDesk = await deskOf(await actorOf(s.as.observer));
    expect(draftDesk.recentRulings.map((r) => r.id)).not.toContain(d.body.id);
    const r = await call(rulingIssue.POST, "POST", "/x", { as: s.as.clerk, params: { id: d.body.id }, body: { version: d.body.version } });
    expect(r.status).toBe(200);
    for (const role of ["clerk", "observer"] as const) expect((await deskOf(await actorOf(s.as[role]))).recentRulings[0]?.id).toBe(d.body.id);
  });

  it("shows an open floor sitting", async () => {
    const rb = await call(sittingIndex.POST, "POST", "/api/floor/sittings", { as: s.as.clerk, body: { title: "Desk test sitting" } });
    expect(rb.status, JSON.stringify(rb.body)).toBe(201);
    const desk = await deskOf(await actorOf(s.as.member));
    expect(desk.openSittings.map((x) => x.title)).toContain("Desk test sitting");
    await db.update(sittings).set({ status: "closed", closedAt: new Date() }).where(eq(sittings.id, rb.body.id));
    expect((await deskOf(await actorOf(s.as.member))).openSittings.map((x) => x.title)).not.toContain("Desk test sitting");
  });

  it("shows analyses running only to those who may read the estimate", async () => {
    const clerk = await actorOf(s.as.clerk);
    const [e] = await db.select().from(estimates).where(eq(estimates.chamberId, s.chambers.harrowmere)).limit(1);
    await db.update(estimates).set({ authorId: clerk.user.id, sharedRoles: ["clerk"], sharedUsers: [] }).where(eq(estimates.id, e.id));
    const [run] = await db.insert(analysisRuns).values({ chamberId: s.chambers.harrowmere, estimateId: e.id, estimateVersion: e.latestVersion, rulebookLabel: "test", hash: "desk-test", status: "running", progress: 0.25 }).returning();
    try {
      const seen = (await deskOf(clerk)).analysesRunning.find((a) => a.id === run.id);
      expect(seen?.estimateTitle).toBe(e.title);
      expect(seen?.progress).toBe(0.25);
      expect((await deskOf(await actorOf(s.as.member))).analysesRunning.map((a) => a.id)).not.toContain(run.id);
    } finally {
      await db.update(analysisRuns).set({ status: "cancelled", finishedAt: new Date() }).where(eq(analysisRuns.id, run.id));
    }
    expect((await deskOf(clerk)).analysesRunning.map((a) => a.id)).not.toContain(run.id);
  });

  it("shows mail not delivered to the chief clerk and clerks only", async () => {
    const [failed] = await db.insert(outbox).values({ kind: "test", chamberId: s.chambers.harrowmere, to: "nobody@harrowmere.example", subject: "Desk test notice", text: "x", status: "failed", attempts: 5, lastError: "550 no such mailbox" }).returning();
    const [sent] = await db.insert(outbox).values({ kind: "test", chamberId: s.chambers.harrowmere, to: "somebody@harrowmere.example", subject: "Desk test delivered", text: "x", status: "sent", attempts: 1, sentAt: new Date() }).returning();
    for (const role of ["chief-clerk", "clerk"] as const) {
      const mail = (await deskOf(await actorOf(s.as[role]))).undeliveredMail;
      expect(mail?.map((m) => m.id), role).toContain(failed.id);
      expect(mail?.map((m) => m.id), role).not.toContain(sent.id);
    }
    for (const role of ["member", "staff", "observer"] as const) expect((await deskOf(await actorOf(s.as[role]))).undeliveredMail, role).toBeNull();
    // The other chamber's desk never shows Harrowmere's mail.
    expect((await deskOf(await actorOf(s.outsider))).undeliveredMail?.map((m) => m.id)).not.toContain(failed.id);
  });
});

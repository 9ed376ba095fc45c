// Rulings on points of order: drafting, issuing, revisions, precedent search, related
// precedents, and every route's role / anonymous / other-chamber checks, against PostgreSQL.
// Product contract unless a source is named beside the check.
import { beforeAll, describe, expect, it } from "vitest";
import { seedRulebooks } from "../../../src/lib/server/seed/rulebooks.ts";
import { and, eq } from "drizzle-orm";
import { db } from "../../../src/lib/server/db.ts";
import { rulingRevisions } from "../../../src/lib/db/schema/rulings.ts";
import { rulebookVersions } from "../../../src/lib/db/schema/rulebooks.ts";
import * as index from "../../../src/pages/api/rulings/index.ts";
import * as one from "../../../src/pages/api/rulings/[id].ts";
import * as issue from "../../../src/pages/api/rulings/[id]/issue.ts";
import * as revisions from "../../../src/pages/api/rulings/[id]/revisions.ts";
import * as related from "../../../src/pages/api/rulings/related.ts";
import * as options from "../../../src/pages/api/rulings/options.ts";
import { call } from "../../support/app.ts";
import { tableCounts } from "../../support/db.ts";
import { seedChambers, type Seeded } from "../../support/fixtures.ts";
import { harrowmereLegislators, rulingBody } from "./helpers.ts";

let s: Seeded;
let raiser: { id: string; name: string };
let saltreachChamber: string;

beforeAll(async () => {
  s = await seedChambers();
  // Harrowmere adopts its demo rulebook (rulebooks/demo-chamber.json), whose motion names the rulings read.
  await seedRulebooks();
  [raiser] = await harrowmereLegislators(s.chambers.harrowmere);
  saltreachChamber = s.chambers.saltreach;
});

async function issued(body = rulingBody(raiser.id)) {
  const d = await call(index.POST, "POST", "/api/rulings", { as: s.as.clerk, body });
  expect(d.status).toBe(201);
  const r = await call(issue.POST, "POST", `/api/rulings/${d.body.id}/issue`, { as: s.as.clerk, params: { id: d.body.id }, body: { version: d.body.version } });
  expect(r.status).toBe(200);
  return r.body.ruling;
}

describe("drafting", () => {
  it("refuses bad input with path-precise issues and writes nothing", async () => {
    const before = await tableCounts();
    const bad = await call(index.POST, "POST", "/api/rulings", { as: s.as.clerk, body: { raisedById: "nope", target: { kind: "speech", label: "" }, question: "", sittingDate: "2026-02-30", citations: [{ kind: "rule", citation: "" }] } });
    expect(bad.status).toBe(400);
    const paths = bad.body.error.issues.map((i: { path: string }) => i.path);
    expect(paths).toEqual(expect.arrayContaining(["raisedById", "target.kind", "target.label", "question", "sittingDate", "citations.0.citation"]));
    const notJson = await call(index.POST, "POST", "/api/rulings", { as: s.as.clerk, rawBody: "{", headers: { "content-type": "application/json" } });
    expect(notJson.status).toBe(400);
    expect(await tableCounts()).toEqual(before);
  });

  it("lets clerks and the chief clerk draft (other roles and anonymous: tests/access)", async () => {
    for (const role of ["clerk", "chief-clerk"] as const) {
      const r = await call(index.POST, "POST", "/api/rulings", { as: s.as[role], body: rulingBody(raiser.id) });
      expect(r.status, role).toBe(201);
      expect(r.body.status).toBe("draft");
      expect(r.body.raisedByName).toBe(raiser.name);
    }
  });

  it("refuses a legislator of another chamber (422) and the other chamber's rulebook version", async () => {
    const before = await tableCounts();
    const other = await call(index.POST, "POST", "/api/rulings", { as: s.outsider, body: rulingBody(raiser.id) });
    expect(other.status).toBe(422);
    expect(other.body.error.issues[0].path).toBe("raisedById");
    const [v] = await db
      .insert(rulebookVersions)
      .values({ chamberId: saltreachChamber, number: 1, title: "Saltreach standing orders", document: { motions: [{ id: "amend", name: "Amend", citation: "SO 12" }], rules: [] } })
      .returning();
    const foreign = await call(index.POST, "POST", "/api/rulings", { as: s.as.clerk, body: rulingBody(raiser.id, { citations: [{ kind: "rule", rulebookVersionId: v.id, ruleId: "amend", citation: "SO 12" }] }) });
    expect(foreign.status).toBe(422);
    expect(foreign.body.error.issues[0].path).toBe("citations.0.rulebookVersionId");
    await db.delete(rulebookVersions).where(eq(rulebookVersions.id, v.id));
    expect(await tableCounts()).toEqual(before);
  });

  it("checks cited rule ids against the rulebook version", async () => {
    const [v] = await db
      .insert(rulebookVersions)
      .values({ chamberId: s.chambers.harrowmere, number: 99, title: "Harrowmere standing orders", document: { motions: [{ id: "previous-question", name: "Previous question", citation: "RONR (1915) §29" }], rules: [{ id: "amendment-degree", citation: "RONR (1915) §33" }] } })
      .returning();
    const unknown = await call(index.POST, "POST", "/api/rulings", { as: s.as.clerk, body: rulingBody(raiser.id, { citations: [{ kind: "rule", rulebookVersionId: v.id, ruleId: "no-such-rule", citation: "SO 99" }] }) });
    expect(unknown.status).toBe(422);
    expect(unknown.body.error.issues[0].path).toBe("citations.0.ruleId");
    const ok = await call(index.POST, "POST", "/api/rulings", { as: s.as.clerk, body: rulingBody(raiser.id, { citations: [{ kind: "rule", rulebookVersionId: v.id, ruleId: "amendment-degree", citation: "RONR (1915) §33" }] }) });
    expect(ok.status).toBe(201);
    expect(ok.body.citations[0].rulebookVersionId).toBe(v.id);
  });

  it("edits a draft only with the current version (409 when stale)", async () => {
    const d = await call(index.POST, "POST", "/api/rulings", { as: s.as.clerk, body: rulingBody(raiser.id) });
    const ok = await call(one.PUT, "PUT", `/api/rulings/${d.body.id}`, { as: s.as.clerk, params: { id: d.body.id }, body: { version: d.body.version, content: rulingBody(raiser.id, { question: "Was the previous question carried at all?" }) } });
    expect(ok.status).toBe(200);
    expect(ok.body.version).toBe(d.body.version + 1);
    const stale = await call(one.PUT, "PUT", `/api/rulings/${d.body.id}`, { as: s.as["chief-clerk"], params: { id: d.body.id }, body: { version: d.body.version, content: rulingBody(raiser.id) } });
    expect(stale.status).toBe(409);
    expect(stale.body.error.details.currentVersion).toBe(ok.body.version);
    expect((await call(one.PUT, "PUT", `/api/rulings/${d.body.id}`, { as: s.outsider, params: { id: d.body.id }, body: { version: ok.body.version, content: rulingBody(raiser.id) } })).status).toBe(404);
  });
});

describe("issuing and revisions", () => {
  it("will not issue an incomplete draft (422 naming each missing field)", async () => {
    const d = await call(index.POST, "POST", "/api/rulings", { as: s.as.clerk, body: rulingBody(raiser.id, { decision: null, reasoning: "", sitting: "", sittingDate: null }) });
    const r = await call(issue.POST, "POST", `/api/rulings/${d.body.id}/issue`, { as: s.as.clerk, params: { id: d.body.id }, body: { version: d.body.version } });
    expect(r.status).toBe(422);
    expect(r.body.error.issues.map((i: { path: string }) => i.path).sort()).toEqual(["decision", "reasoning", "sitting", "sittingDate"]);
  });

  it("lets clerks and the chief clerk issue; drafts are hidden from other roles until issued", async () => {
    const d = await call(index.POST, "POST", "/api/rulings", { as: s.as.clerk, body: rulingBody(raiser.id) });
    const p = { id: d.body.id };
    for (const role of ["member", "staff", "observer"] as const) expect((await call(one.GET, "GET", `/api/rulings/${p.id}`, { as: s.as[role], params: p })).status, role).toBe(404);
    expect((await call(issue.POST, "POST", `/api/rulings/${p.id}/issue`, { as: s.outsider, params: p, body: { version: 1 } })).status).toBe(404);
    const ok = await call(issue.POST, "POST", `/api/rulings/${p.id}/issue`, { as: s.as["chief-clerk"], params: p, body: { version: d.body.version } });
    expect(ok.status).toBe(200);
    expect(ok.body.ruling).toMatchObject({ status: "issued", revision: 1 });
    for (const role of ["member", "staff", "observer"] as const) expect((await call(one.GET, "GET", `/api/rulings/${p.id}`, { as: s.as[role], params: p })).status, role).toBe(200);
    expect((await call(one.GET, "GET", `/api/rulings/${p.id}`, { as: s.outsider, params: p })).status).toBe(404);
    expect((await call(issue.POST, "POST", `/api/rulings/${p.id}/issue`, { as: s.as.clerk, params: p, body: { version: ok.body.ruling.version } })).status).toBe(409);
  });

  it("never edits an issued ruling in place: corrections are revisions, history kept", async () => {
    const r = await issued();
    const p = { id: r.id };
    const inPlace = await call(one.PUT, "PUT", `/api/rulings/${r.id}`, { as: s.as.clerk, params: p, body: { version: r.version, content: rulingBody(raiser.id, { question: "Rewritten" }) } });
    expect(inPlace.status).toBe(409);
    expect((await call(revisions.POST, "POST", `/api/rulings/${r.id}/revisions`, { as: s.outsider, params: p, body: { revision: 1, note: "x", content: rulingBody(raiser.id) } })).status).toBe(404);
    const noNote = await call(revisions.POST, "POST", `/api/rulings/${r.id}/revisions`, { as: s.as.clerk, params: p, body: { revision: 1, note: "", content: rulingBody(raiser.id) } });
    expect(noNote.status).toBe(400);
    expect(noNote.body.error.issues[0].path).toBe("note");
    const fixed = await call(revisions.POST, "POST", `/api/rulings/${r.id}/revisions`, {
      as: s.as.clerk,
      params: p,
      body: { revision: 1, note: "Corrected the tally in the reasoning", content: rulingBody(raiser.id, { reasoning: "The division (twenty-six to thirteen) superseded the show of hands." }) },
    });
    expect(fixed.status).toBe(201);
    expect(fixed.body.revision).toBe(2);
    const stale = await call(revisions.POST, "POST", `/api/rulings/${r.id}/revisions`, { as: s.as["chief-clerk"], params: p, body: { revision: 1, note: "again", content: rulingBody(raiser.id) } });
    expect(stale.status).toBe(409);
    expect(stale.body.error.details.currentRevision).toBe(2);
    const got = await call(one.GET, "GET", `/api/rulings/${r.id}`, { as: s.as.observer, params: p });
    expect(got.body.revisions.map((x: { revision: number }) => x.revision)).toEqual([2, 1]);
    expect(got.body.revisions[1].content.reasoning).toBe(r.reasoning);
    expect(got.body.revisions[0].note).toBe("Corrected the tally in the reasoning");
    expect(got.body.ruling.reasoning).toContain("twenty-six to thirteen");
    const rows = await db.select().from(rulingRevisions).where(and(eq(rulingRevisions.rulingId, r.id), eq(rulingRevisions.revision, 1)));
    expect((rows[0].content as { reasoning: string }).reasoning).toBe(r.reasoning);
  });

  it("records an appeal: a tie sustains the chair", async () => {
    // Robert's Rules of Order Revised (1915) §21: the decision of the chair is reversed only by a majority in the negative; a tie sustains the chair.
    const tie = await issued(rulingBody(raiser.id, { appeal: { ayes: 19, noes: 19, abstentions: 2 } }));
    expect(tie.appeal.outcome).toBe("chair-sustained");
    const reversed = await issued(rulingBody(raiser.id, { appeal: { ayes: 18, noes: 20 } }));
    expect(reversed.appeal.outcome).toBe("chair-overruled");
    const bad = await call(index.POST, "POST", "/api/rulings", { as: s.as.clerk, body: rulingBody(raiser.id, { appeal: { ayes: -1, noes: 2.5 } }) });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues.map((i: { path: string }) => i.path).sort()).toEqual(["appeal.ayes", "appeal.noes"]);
  });

  it("cites earlier issued rulings (labelled), never drafts or itself", async () => {
    const earlier = await issued();
    const draft = await call(index.POST, "POST", "/api/rulings", { as: s.as.clerk, body: rulingBody(raiser.id) });
    const citesDraft = await call(index.POST, "POST", "/api/rulings", { as: s.as.clerk, body: rulingBody(raiser.id, { citations: [{ kind: "ruling", rulingId: draft.body.id }] }) });
    expect(citesDraft.status).toBe(422);
    expect(citesDraft.body.error.issues[0].path).toBe("citations.0.rulingId");
    const ok = await call(index.POST, "POST", "/api/rulings", { as: s.as.clerk, body: rulingBody(raiser.id, { citations: [{ kind: "ruling", rulingId: earlier.id }] }) });
    expect(ok.status).toBe(201);
    expect(ok.body.citations[0].label).toBe(`Ruling ${earlier.number}`);
    const self = await call(one.PUT, "PUT", `/api/rulings/${ok.body.id}`, { as: s.as.clerk, params: { id: ok.body.id }, body: { version: ok.body.version, content: rulingBody(raiser.id, { citations: [{ kind: "ruling", rulingId: ok.body.id }] }) } });
    expect(self.status).toBe(422);
  });
});

describe("precedent search", () => {
  let target: { id: string };
  beforeAll(async () => {
    target = await issued(
      rulingBody(raiser.id, {
        target: { kind: "amendment", ref: null, label: "Amendment to the secondary amendment on ferry tolls" },
        motion: "amend",
        question: "May the secondary amendment itself be amended?",
        decision: "sustained",
        reasoning: "An amendment of the third degree is inadmissible; the tolls may be reached by defeating the secondary amendment.",
        citations: [{ kind: "rule", ruleId: "amendment-degree", citation: "Standing Order 31(2)" }],
        sittingDate: "2026-05-06",
      }),
    );
  });

  const search = (as: Seeded["as"][keyof Seeded["as"]] | null, query: Record<string, string>) => call(index.GET, "GET", "/api/rulings", { as, query });

  it("finds a ruling by a word in its reasoning (stemmed) and by its rule citation", async () => {
    const byWord = await search(s.as.observer, { q: "inadmissible" });
    expect(byWord.status).toBe(200);
    expect(byWord.body.results.map((r: { id: string }) => r.id)).toEqual([target.id]);
    expect(byWord.body.results[0].snippet).toContain("⟦inadmissible⟧");
    const stem = await search(s.as.member, { q: "defeated tolls" });
    expect(stem.body.results.map((r: { id: string }) => r.id)).toContain(target.id);
    const byCitation = await search(s.as.member, { q: '"Standing Order 31(2)"' });
    expect(byCitation.body.results.map((r: { id: string }) => r.id)).toEqual([target.id]);
    const byRuleFilter = await search(s.as.staff, { rule: "amendment-degree" });
    expect(byRuleFilter.body.results.map((r: { id: string }) => r.id)).toEqual([target.id]);
    const byCitationFilter = await search(s.as.staff, { rule: "standing order 31(2)" });
    expect(byCitationFilter.body.results.map((r: { id: string }) => r.id)).toEqual([target.id]);
    const negated = await search(s.as.staff, { q: "inadmissible -tolls" });
    expect(negated.body.results).toEqual([]);
  });

  it("filters by motion and date, and shows only issued rulings to non-clerks", async () => {
    const byMotion = await search(s.as.observer, { motion: "amend" });
    expect(byMotion.body.results.map((r: { id: string }) => r.id)).toEqual([target.id]);
    // A person writes the motion as the chamber's rulebook names it: Harrowmere's adopted rulebook
    // (rulebooks/demo-chamber.json, our own demo) calls previous-question "Close debate".
    await issued();
    const byId = await search(s.as.observer, { motion: "previous-question" });
    const byName = await search(s.as.observer, { motion: "close debate" });
    expect(byId.body.results.length).toBeGreaterThan(0);
    expect(byName.body.results.map((r: { id: string }) => r.id)).toEqual(byId.body.results.map((r: { id: string }) => r.id));
    expect(byName.body.results.every((r: { motion: string; motionName: string }) => r.motion === "previous-question" && r.motionName === "Close debate")).toBe(true);
    const inMay = await search(s.as.observer, { from: "2026-05-01", to: "2026-05-31" });
    expect(inMay.body.results.map((r: { id: string }) => r.id)).toEqual([target.id]);
    const all = await search(s.as.observer, {});
    expect(all.body.results.every((r: { status: string }) => r.status === "issued")).toBe(true);
    expect((await search(s.as.staff, { status: "draft" })).status).toBe(403);
    const drafts = await search(s.as.clerk, { status: "draft" });
    expect(drafts.body.results.length).toBeGreaterThan(0);
    expect((await search(s.as.clerk, { from: "May" })).status).toBe(400);
  });

  it("shows the other chamber nothing", async () => {
    const other = await search(s.outsider, { q: "inadmissible" });
    expect(other.status).toBe(200);
    expect(other.body.results).toEqual([]);
  });

  it("suggests related precedents by rule id or by the words of a draft or finding", async () => {
    const byRule = await call(related.GET, "GET", "/api/rulings/related", { as: s.as.member, query: { rule: "amendment-degree" } });
    expect(byRule.status).toBe(200);
    expect(byRule.body.results[0].id).toBe(target.id);
    const byText = await call(related.GET, "GET", "/api/rulings/related", { as: s.as.clerk, query: { text: "third-degree amendment offered to the ferry toll amendment" } });
    expect(byText.body.results[0].id).toBe(target.id);
    const excluded = await call(related.GET, "GET", "/api/rulings/related", { as: s.as.clerk, query: { rule: "amendment-degree", exclude: target.id } });
    expect(excluded.body.results.map((r: { id: string }) => r.id)).not.toContain(target.id);
    expect((await call(related.GET, "GET", "/api/rulings/related", { as: s.as.clerk, query: {} })).body.results).toEqual([]);
    expect((await call(related.GET, "GET", "/api/rulings/related", { as: s.outsider, query: { rule: "amendment-degree" } })).body.results).toEqual([]);
  });
});

describe("drafting options", () => {
  it("gives clerks the chamber's legislators, own chamber only (other roles and anonymous: tests/access)", async () => {
    const r = await call(options.GET, "GET", "/api/rulings/options", { as: s.as.clerk });
    expect(r.status).toBe(200);
    expect(r.body.legislators).toHaveLength(40);
    // Motions are offered by the names the adopted rulebook gives them.
    expect(r.body.rulebook.motions).toContainEqual({ id: "previous-question", name: "Close debate" });
    const other = await call(options.GET, "GET", "/api/rulings/options", { as: s.outsider });
    expect(other.body.legislators.some((l: { id: string }) => l.id === raiser.id)).toBe(false);
  });
});

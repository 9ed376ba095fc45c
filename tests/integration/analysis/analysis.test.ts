// Order analyses through the API: started off the request path in a worker thread, cached by a
// content hash, cancelled without a trace, read back as summary, orders (paged, filtered, CSV),
// walk-through and chair's script. Roles, anonymous and the other chamber.
// Check values: the seeded estimate's majority cycle is the product's own demo (common practice,
// no source); outcomes per order are the engine's (tested against DOMAIN §4 in tests/unit/voting).
import { beforeAll, describe, expect, it } from "vitest";
import * as runs from "../../../src/pages/api/analysis/runs/index.ts";
import * as run from "../../../src/pages/api/analysis/runs/[id].ts";
import * as orders from "../../../src/pages/api/analysis/runs/[id]/orders.ts";
import * as walk from "../../../src/pages/api/analysis/runs/[id]/walk.ts";
import * as script from "../../../src/pages/api/analysis/runs/[id]/script.ts";
import * as list from "../../../src/pages/api/estimates/index.ts";
import * as rulebooks from "../../../src/pages/api/rulebooks/index.ts";
import * as template from "../../../src/pages/api/rulebooks/templates/[id].ts";
import { launchRun, runFinished } from "../../../src/lib/server/analysis/runner.ts";
import { seedMeasures } from "../../../src/lib/server/seed/measures.ts";
import { seedEstimates } from "../../../src/lib/server/seed/estimates.ts";
import { sql } from "../../../src/lib/server/db.ts";
import { call } from "../../support/app.ts";
import { seedChambers, type Seeded } from "../../support/fixtures.ts";

let s: Seeded;
let seeded: { ballotsId: string; spatialId: string };
let measureId: string;
const V = ["Q", "measure", "measure+A1", "measure+A7", "measure+A1+A2"];

const start = (estimateId: string, as = s.as.clerk) => call(runs.POST, "POST", "/api/analysis/runs", { as, body: { estimateId } });
const cacheRows = async () => Number((await sql`SELECT count(*)::int AS n FROM analysis_cache`)[0].n);

async function finished(runId: string, as = s.as.clerk) {
  await runFinished(runId);
  return (await call(run.GET, "GET", "/x", { as, params: { id: runId } })).body;
}

beforeAll(async () => {
  s = await seedChambers();
  measureId = (await seedMeasures())!.measureId;
  seeded = (await seedEstimates())!;
});

describe("running and caching", () => {
  it("runs the analysis in a worker and writes the cache; the second run hits the cache", async () => {
    expect(await cacheRows()).toBe(0);
    const first = await start(seeded.ballotsId);
    expect(first.status).toBe(202);
    expect(first.body.cached).toBe(false);
    const done = await finished(first.body.runId);
    expect(done.run.status).toBe("done");
    expect(done.analysis.orders).toBe(3);
    expect(done.analysis.majority.condorcetWinner).toBeNull();
    expect(done.analysis.majority.topCycle).toHaveLength(3);
    expect(done.findings.map((f: { id: string }) => f.id)).toEqual(expect.arrayContaining(["order-decides", "cycle", "strategic"]));
    for (const f of done.findings) expect(f.caution).toMatch(/projection/i);
    expect(await cacheRows()).toBe(1);
    const second = await start(seeded.ballotsId, s.as.observer);
    expect(second.body.cached).toBe(true);
    expect(second.body.status).toBe("done");
    expect(await cacheRows()).toBe(1);
    const again = (await call(run.GET, "GET", "/x", { as: s.as.observer, params: { id: second.body.runId } })).body;
    expect(again.analysis).toEqual(done.analysis);
  });

  it("a run cancelled before it finishes writes no cache row", async () => {
    // A fresh estimate (different content, so a different hash).
    const created = await call(list.POST, "POST", "/api/estimates", { as: s.as.member, body: { measureId, title: "To cancel", scope: ["A1", "A2", "A7"], content: { kind: "ballots", rows: [{ member: "all", weight: 40, ranking: ["measure", "Q"] }] } } });
    const before = await cacheRows();
    const r = await start(created.body.id, s.as.member);
    expect(r.body.cached).toBe(false);
    expect((await call(run.DELETE, "DELETE", "/x", { as: s.as.observer, params: { id: r.body.runId } })).status).toBe(404); // not visible to the observer (clerks may cancel any run: budget.test.ts)
    const c = await call(run.DELETE, "DELETE", "/x", { as: s.as.member, params: { id: r.body.runId } });
    expect(c.status).toBe(200);
    expect(c.body.run.status).toBe("cancelled");
    expect(await cacheRows()).toBe(before);
    expect((await call(orders.GET, "GET", "/x", { as: s.as.member, params: { id: r.body.runId } })).status).toBe(409);
  });

  it("analyses a tree with no amendments (final passage only: one order)", async () => {
    // Weight 13: the demo chamber's quorum (13 of 40) must be present for any outcome (decision 0008).
    const created = await call(list.POST, "POST", "/api/estimates", { as: s.as.clerk, body: { measureId, title: "Spatial, passage only", scope: [], content: { kind: "spatial", dimensions: ["x"], statusQuo: [0], measure: [1], members: [{ member: "a", ideal: [1], weight: 13 }] } } });
    expect(created.status).toBe(201);
    const done = await finished((await start(created.body.id)).body.runId);
    expect(done.run.status).toBe("done");
    expect(done.analysis.orders).toBe(1);
    expect(done.analysis.quorum).toMatchObject({ required: 13, present: 13, met: true });
    expect(done.analysis.thresholds).toMatchObject({ passage: "majority", passageFrom: "main-motion", members: 40, membersFrom: "chamber.members" });
  });

  it("an estimate whose attending weight is below the quorum gets no outcomes, and says why (RONR 1915 §64 p. 260: \"no question can be decided in the absence of a quorum\")", async () => {
    const created = await call(list.POST, "POST", "/api/estimates", { as: s.as.clerk, body: { measureId, title: "Too few present", scope: [], content: { kind: "ballots", rows: [{ member: "a", weight: 12, ranking: ["measure", "Q"] }] } } });
    expect(created.status).toBe(201);
    const done = await finished((await start(created.body.id)).body.runId);
    expect(done.run.status).toBe("failed");
    expect(done.run.error.code).toBe("unprocessable");
    expect(done.run.error.message).toMatch(/no quorum/);
    expect(done.analysis).toBeUndefined();
  });

  it("a run that fails inside the worker is recorded as failed and writes no cache row", async () => {
    const before = await cacheRows();
    const [estimate] = await sql`SELECT id, chamber_id FROM estimates LIMIT 1`;
    const [row] = await sql`INSERT INTO analysis_runs (chamber_id, estimate_id, estimate_version, rulebook_label, hash, status) VALUES (${estimate.chamber_id}, ${estimate.id}, 1, 'test', 'broken-input', 'running') RETURNING id`;
    await launchRun({ id: row.id, chamberId: estimate.chamber_id, hash: "broken-input" }, { rulebook: {}, measure: null }, {});
    const [after] = await sql`SELECT status, error FROM analysis_runs WHERE id = ${row.id}`;
    expect(after.status).toBe("failed");
    expect(after.error.code).toBe("invalid-input");
    expect(await cacheRows()).toBe(before);
  });

  it("refuses the other chamber and estimates the actor cannot see (anonymous: tests/access)", async () => {
    expect((await start(seeded.ballotsId, s.outsider)).status).toBe(404);
    const priv = await call(list.POST, "POST", "/api/estimates", { as: s.as.member, body: { measureId, title: "Private", scope: [], content: { kind: "ballots", rows: [{ member: "a", ranking: ["Q"] }] } } });
    expect((await start(priv.body.id, s.as.clerk)).status).toBe(404);
    const r = await start(seeded.ballotsId);
    await runFinished(r.body.runId);
    expect((await call(run.GET, "GET", "/x", { as: s.outsider, params: { id: r.body.runId } })).status).toBe(404);
  });
});

describe("reading an analysis", () => {
  let runId: string;
  beforeAll(async () => {
    runId = (await start(seeded.ballotsId)).body.runId;
    await runFinished(runId);
  });

  it("pages and filters orders by outcome, and exports CSV", async () => {
    const all = (await call(orders.GET, "GET", "/x", { as: s.as.staff, params: { id: runId } })).body;
    expect(all.total).toBe(3);
    expect(all.complete).toBe(true);
    const outcome = all.orders[0].sincere as string;
    expect(V).toContain(outcome);
    const filtered = (await call(orders.GET, "GET", "/x", { as: s.as.staff, params: { id: runId }, query: { outcome } })).body;
    expect(filtered.orders.every((o: { sincere: string }) => o.sincere === outcome)).toBe(true);
    expect(filtered.total).toBeLessThan(3);
    const paged = (await call(orders.GET, "GET", "/x", { as: s.as.staff, params: { id: runId }, query: { pageSize: "2", page: "2" } })).body;
    expect(paged.orders).toHaveLength(1);
    expect((await call(orders.GET, "GET", "/x", { as: s.as.staff, params: { id: runId }, query: { outcome: "B+Z" } })).status).toBe(400);
    const csv = await call(orders.GET, "GET", "/x", { as: s.as.staff, params: { id: runId }, query: { format: "csv" } });
    expect(csv.response.headers.get("content-type")).toMatch(/text\/csv/);
    expect((csv.body as string).trim().split("\r\n")).toHaveLength(4);
  });

  it("walks one order vote by vote with tallies summing to at most the 40 members", async () => {
    const w = (await call(walk.GET, "GET", "/x", { as: s.as.member, params: { id: runId }, query: { order: "A2,A1,A7,passage" } })).body.walk;
    expect(w.sincere.steps[0]).toMatchObject({ question: "A2", put: true });
    for (const st of w.sincere.steps.filter((x: { put: boolean }) => x.put)) expect(st.for + st.against).toBeLessThanOrEqual(40);
    expect(V).toContain(w.sophisticated.outcome);
    const illegal = await call(walk.GET, "GET", "/x", { as: s.as.member, params: { id: runId }, query: { order: "A1,A2,A7,passage" } });
    expect(illegal.status).toBe(422);
    expect((await call(walk.GET, "GET", "/x", { as: s.as.member, params: { id: runId }, query: { order: "A1,passage" } })).status).toBe(400);
  });

  it("writes the chair's script as JSON and Markdown", async () => {
    const j = (await call(script.GET, "GET", "/x", { as: s.as.clerk, params: { id: runId }, query: { order: "A2 A1 A7 passage" } })).body.script;
    expect(j.steps.map((x: { question: string }) => x.question)).toEqual(["A2", "A1", "A7", "passage"]);
    expect(j.advisory).toMatch(/prevail/);
    const md = await call(script.GET, "GET", "/x", { as: s.as.clerk, params: { id: runId }, query: { order: "A2 A1 A7 passage", format: "md" } });
    expect(md.response.headers.get("content-disposition")).toMatch(/attachment/);
    expect(md.body as string).toMatch(/^# Chair's script/);
    expect((await call(script.GET, "GET", "/x", { as: s.outsider, params: { id: runId }, query: { order: "A2 A1 A7 passage" } })).status).toBe(404);
  });
});

describe("under a successive-procedure rulebook version", () => {
  it("the walk-through and the chair's script carry tallies for every vote put, and agree with the run's outcomes", async () => {
    // The chamber's rules as the analysis reads them (the demo template here), voted successively.
    const books = (await call(rulebooks.GET, "GET", "/x", { as: s.as.clerk })).body;
    const doc = (await call(template.GET, "GET", "/x", { as: s.as.clerk, params: { id: "demo-chamber" } })).body.document;
    const trial = await call(rulebooks.POST, "POST", "/x", { as: s.as.clerk, body: { basedOn: books.latest?.id ?? null, note: "Successive trial", document: { ...doc, voting: { ...doc.voting, procedure: "successive" } } } });
    expect(trial.status).toBe(201);
    const started = await call(runs.POST, "POST", "/api/analysis/runs", { as: s.as.clerk, body: { estimateId: seeded.ballotsId, rulebookVersionId: trial.body.id } });
    expect(started.status).toBe(202);
    const done = await finished(started.body.runId);
    expect(done.analysis.procedure).toBe("successive");
    const listed = (await call(orders.GET, "GET", "/x", { as: s.as.clerk, params: { id: started.body.runId } })).body.orders as Array<{ questions: string[]; sincere: string; sophisticated: string }>;
    expect(listed.length).toBe(3);
    for (const o of listed) {
      const w = (await call(walk.GET, "GET", "/x", { as: s.as.member, params: { id: started.body.runId }, query: { order: o.questions.join(",") } })).body.walk;
      expect([w.sincere.outcome, w.sophisticated.outcome]).toEqual([o.sincere, o.sophisticated]);
      for (const st of [...w.sincere.steps, ...w.sophisticated.steps].filter((x: { put: boolean }) => x.put)) {
        expect(Number.isInteger(st.for) && Number.isInteger(st.against)).toBe(true);
        expect(st.for + st.against).toBeLessThanOrEqual(40);
      }
      for (const st of w.sincere.steps.filter((x: { put: boolean }) => x.put)) {
        if (st.question === "passage") expect(st.withinReach).toBeUndefined();
        else expect(st.withinReach).toContain("Q");
      }
      const md = await call(script.GET, "GET", "/x", { as: s.as.clerk, params: { id: started.body.runId }, query: { order: o.questions.join(" "), format: "md" } });
      expect(md.body as string).not.toMatch(/no tally/);
      expect((md.body as string).match(/\*Projected: (adopted|rejected) \(\d+ for, \d+ against\)/g)?.length).toBe(w.sincere.steps.filter((x: { put: boolean }) => x.put).length);
    }
  });
});

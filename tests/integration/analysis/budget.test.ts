// Analysis budget and fairness (issue 17): an identical run in flight is joined, not started again;
// one chamber holds at most its share of the worker pool; a worker over its time or memory limit is
// stopped and its run recorded as "stopped: over the limit" with the limit and what to narrow; the
// chief clerk and clerks cancel any run of their chamber. Workers are held at their start with a
// shared gate (runner.ts holdWorkersForTests) so a run is deterministically in flight; no test waits
// on a clock. Common practice (resource limits per tenant, least surprise), no source.
import { afterEach, beforeAll, describe, expect, it } from "vitest";
import * as runs from "../../../src/pages/api/analysis/runs/index.ts";
import * as run from "../../../src/pages/api/analysis/runs/[id].ts";
import * as list from "../../../src/pages/api/estimates/index.ts";
import { activeCount, holdWorkersForTests, launchRun, runFinished } from "../../../src/lib/server/analysis/runner.ts";
import { seedMeasures } from "../../../src/lib/server/seed/measures.ts";
import { seedEstimates } from "../../../src/lib/server/seed/estimates.ts";
import { sql } from "../../../src/lib/server/db.ts";
import { call } from "../../support/app.ts";
import { seedChambers, type Seeded } from "../../support/fixtures.ts";

let s: Seeded;
let measureId: string;
let gate: Int32Array | null = null;

const start = (estimateId: string, as = s.as.clerk) => call(runs.POST, "POST", "/api/analysis/runs", { as, body: { estimateId } });
const cancel = (runId: string, as: Seeded["as"][keyof Seeded["as"]]) => call(run.DELETE, "DELETE", "/x", { as, params: { id: runId } });
const view = async (runId: string, as = s.as.clerk) => (await call(run.GET, "GET", "/x", { as, params: { id: runId } })).body;
let n = 0;
async function estimate(as = s.as.member, shared = false) {
  n++;
  const r = await call(list.POST, "POST", "/api/estimates", { as, body: { measureId, title: `Budget ${n}`, scope: ["A1", "A2", "A7"], content: { kind: "ballots", rows: [{ member: "all", weight: 10 + n, ranking: ["measure", "Q"] }] }, ...(shared ? { sharedRoles: ["chief-clerk", "clerk", "member", "staff", "observer"] } : {}) } });
  expect(r.status, JSON.stringify(r.body)).toBe(201);
  return r.body.id as string;
}
function hold() {
  const buf = new SharedArrayBuffer(4);
  gate = new Int32Array(buf);
  holdWorkersForTests(buf);
}
function release() {
  holdWorkersForTests(null);
  if (gate) {
    Atomics.store(gate, 0, 1);
    Atomics.notify(gate, 0);
  }
  gate = null;
}

beforeAll(async () => {
  s = await seedChambers();
  measureId = (await seedMeasures())!.measureId;
  await seedEstimates();
});
afterEach(() => release());

describe("identical runs in flight", () => {
  it("a second identical request joins the running one: one worker, both answered from one result", async () => {
    const id = await estimate(s.as.clerk);
    hold();
    const first = await start(id);
    const second = await start(id, s.as.clerk);
    expect(first.status).toBe(202);
    expect(second.status).toBe(202);
    expect(second.body.joined).toBe(true);
    expect(second.body.runId).not.toBe(first.body.runId);
    expect(activeCount()).toBe(1);
    release();
    await Promise.all([runFinished(first.body.runId), runFinished(second.body.runId)]);
    const [a, b] = [await view(first.body.runId), await view(second.body.runId)];
    expect([a.run.status, b.run.status]).toEqual(["done", "done"]);
    expect(b.analysis).toEqual(a.analysis);
    expect(Number((await sql`SELECT count(*)::int AS n FROM analysis_cache`)[0].n)).toBeGreaterThan(0);
  });

  it("cancelling one of two joined runs leaves the other running to its result", async () => {
    const id = await estimate(s.as.clerk);
    hold();
    const first = await start(id);
    const second = await start(id);
    expect((await cancel(first.body.runId, s.as.clerk)).body.run.status).toBe("cancelled");
    expect(activeCount()).toBe(1);
    release();
    await runFinished(second.body.runId);
    expect((await view(second.body.runId)).run.status).toBe("done");
    expect((await view(first.body.runId)).run.status).toBe("cancelled");
  });
});

describe("a chamber's share of the pool", () => {
  it("with two workers, one chamber holds one at a time: its second distinct run is 429, naming the share", async () => {
    const [a, b] = [await estimate(s.as.clerk), await estimate(s.as.clerk)];
    hold();
    const first = await start(a);
    expect(first.status).toBe(202);
    const second = await start(b);
    expect(second.status).toBe(429);
    expect(second.body.error.code).toBe("rate-limited");
    expect(second.body.error.details.chamberShare).toBe(1);
    expect(await sql`SELECT id FROM analysis_runs WHERE estimate_id = ${b}`).toHaveLength(0);
    release();
    await runFinished(first.body.runId);
    const third = await start(b);
    expect(third.status).toBe(202);
    await runFinished(third.body.runId);
  });
});

describe("cancelling", () => {
  it("the chief clerk and a clerk cancel a member's run, even on the member's private estimate; an observer may not", async () => {
    for (const who of ["chief-clerk", "clerk"] as const) {
      const id = await estimate(s.as.member);
      hold();
      const r = await start(id, s.as.member);
      expect(r.status).toBe(202);
      expect((await cancel(r.body.runId, s.as.observer)).status).toBe(404);
      const c = await cancel(r.body.runId, s.as[who]);
      expect(c.status, `${who}: ${JSON.stringify(c.body)}`).toBe(200);
      expect(c.body.run.status).toBe("cancelled");
      expect(activeCount()).toBe(0);
      release();
    }
  });

  it("on a shared estimate a member who did not start the run may not cancel it (403)", async () => {
    const id = await estimate(s.as.clerk, true);
    hold();
    const r = await start(id, s.as.clerk);
    const c = await cancel(r.body.runId, s.as.member);
    expect(c.status).toBe(403);
    expect((await view(r.body.runId)).run.status).toBe("running");
    release();
    await runFinished(r.body.runId);
  });
});

describe("limits per run", () => {
  async function launched(limits: { timeMs: number; memoryMb: number }, input: unknown) {
    const [e] = await sql`SELECT id, chamber_id FROM estimates LIMIT 1`;
    const hash = `limit-test-${Math.random()}`;
    const [row] = await sql`INSERT INTO analysis_runs (chamber_id, estimate_id, estimate_version, rulebook_label, hash, status) VALUES (${e.chamber_id}, ${e.id}, 1, 'test', ${hash}, 'running') RETURNING id`;
    await launchRun({ id: row.id, chamberId: e.chamber_id, hash }, input, {}, limits);
    const [after] = await sql`SELECT status, error FROM analysis_runs WHERE id = ${row.id}`;
    return { after, cache: await sql`SELECT 1 FROM analysis_cache WHERE hash = ${hash}` };
  }

  it("a worker over its time limit is stopped; the run says so, shows the limit and what to narrow, and stores nothing", async () => {
    hold(); // the worker never gets past its start: only the time limit ends it
    const { after, cache } = await launched({ timeMs: 200, memoryMb: 512 }, {});
    expect(after.status).toBe("failed");
    expect(after.error).toMatchObject({ code: "limit-exceeded", stopped: "over-the-limit", limit: { kind: "time", value: 0.2, unit: "s" } });
    expect(after.error.message).toMatch(/^Stopped: over the limit/);
    expect(after.error.message).toMatch(/fewer amendments/);
    expect(after.error.message).toMatch(/blocs/);
    expect(cache).toHaveLength(0);
  });

  it("a worker over its memory limit is stopped and recorded the same way", async () => {
    const { after, cache } = await launched({ timeMs: 600_000, memoryMb: 4 }, { rulebook: {}, measure: null });
    expect(after.status).toBe("failed");
    expect(after.error).toMatchObject({ code: "limit-exceeded", stopped: "over-the-limit", limit: { kind: "memory", value: 4, unit: "MB" } });
    expect(cache).toHaveLength(0);
  });
});

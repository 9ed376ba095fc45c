// "Start from the roster" makes an unfilled draft that the analysis refuses (with a message naming
// what is missing) until every row is filled in or marked unranked; out-of-order amendments are not
// offered. The product's own contract (issue 15), except the rule that a third-degree amendment is
// out of order: Robert's Rules of Order Revised (1915), §33 p. 135 (paraphrase: an amendment of the
// third degree is not in order; the clause is quoted in src/lib/voting/amendment-versions.ts).
import { beforeAll, describe, expect, it } from "vitest";
import * as one from "../../../src/pages/api/estimates/[id].ts";
import * as versions from "../../../src/pages/api/estimates/[id]/versions.ts";
import * as roster from "../../../src/pages/api/estimates/roster.ts";
import * as versionList from "../../../src/pages/api/estimates/versions.ts";
import * as runs from "../../../src/pages/api/analysis/runs/index.ts";
import { seedMeasures } from "../../../src/lib/server/seed/measures.ts";
import { call } from "../../support/app.ts";
import { tableCounts } from "../../support/db.ts";
import { seedChambers, type Seeded } from "../../support/fixtures.ts";

let s: Seeded;
let measureId: string;

beforeAll(async () => {
  s = await seedChambers();
  measureId = (await seedMeasures())!.measureId;
});

describe("estimates started from the roster", () => {
  it("are unfilled drafts, labelled as such, that the analysis refuses until every row is filled or marked unranked", async () => {
    const made = await call(roster.POST, "POST", "/api/estimates/roster", { as: s.as.clerk, body: { measureId, title: "Roster draft", scope: ["A1", "A7"], partial: "bottom" } });
    expect(made.status).toBe(201);
    const got = (await call(one.GET, "GET", "/x", { as: s.as.clerk, params: { id: made.body.id } })).body;
    expect(got.version.note).toMatch(/^Started from the roster \(\d+ blocs\); rankings not filled in yet$/);
    expect(got.version.note).not.toContain("CSV");
    const rows = got.version.content.rows as Array<{ member: string; weight: number; ranking: unknown[] }>;
    expect(rows.length).toBeGreaterThan(1);
    expect(rows.every((r) => r.ranking.length === 0)).toBe(true);

    const before = await tableCounts();
    const refused = await call(runs.POST, "POST", "/api/analysis/runs", { as: s.as.clerk, body: { estimateId: made.body.id } });
    expect(refused.status).toBe(422);
    expect(refused.body.error.message).toContain(`${rows.length} of ${rows.length} rows have no ranking yet`);
    expect(refused.body.error.message).toContain(rows[0].member);
    expect(await tableCounts()).toEqual(before);

    // Fill all but the last row; that one still blocks the analysis.
    const filled = rows.map((r, i) => ({ ...r, ranking: i === rows.length - 1 ? [] : i % 2 ? ["measure+A1", "Q"] : ["measure", "measure+A7"] }));
    const v2 = await call(versions.POST, "POST", "/x", { as: s.as.clerk, params: { id: made.body.id }, body: { basedOn: 1, scope: ["A1", "A7"], content: { kind: "ballots", partial: "bottom", rows: filled } } });
    expect(v2.status).toBe(201);
    const still = await call(runs.POST, "POST", "/api/analysis/runs", { as: s.as.clerk, body: { estimateId: made.body.id } });
    expect(still.status).toBe(422);
    expect(still.body.error.message).toContain(`1 of ${rows.length} rows has no ranking yet (“${rows[rows.length - 1].member}”)`);

    // Marked unranked: the analysis starts.
    filled[rows.length - 1] = { ...filled[rows.length - 1], unranked: true } as (typeof filled)[number];
    const v3 = await call(versions.POST, "POST", "/x", { as: s.as.clerk, params: { id: made.body.id }, body: { basedOn: 2, scope: ["A1", "A7"], content: { kind: "ballots", partial: "bottom", rows: filled } } });
    expect(v3.status).toBe(201);
    const started = await call(runs.POST, "POST", "/api/analysis/runs", { as: s.as.clerk, body: { estimateId: made.body.id } });
    expect(started.status, JSON.stringify(started.body)).toBeLessThan(300);
    expect(started.body.runId).toMatch(/^[0-9a-f-]{36}$/);
  });

  it("a spatial roster draft has placeholder positions and is refused until positions are saved", async () => {
    const made = await call(roster.POST, "POST", "/api/estimates/roster", { as: s.as.clerk, body: { measureId, title: "Spatial draft", scope: [], kind: "spatial", dimensions: ["Lighting", "Cost"] } });
    expect(made.status).toBe(201);
    const got = (await call(one.GET, "GET", "/x", { as: s.as.clerk, params: { id: made.body.id } })).body;
    expect(got.version.note).toContain("positions are placeholders");
    expect(got.version.content.draft).toBe(true);
    const refused = await call(runs.POST, "POST", "/api/analysis/runs", { as: s.as.clerk, body: { estimateId: made.body.id } });
    expect(refused.status).toBe(422);
    expect(refused.body.error.message).toMatch(/placeholders/);
    const { draft: _d, ...content } = got.version.content;
    void _d;
    const saved = await call(versions.POST, "POST", "/x", { as: s.as.clerk, params: { id: made.body.id }, body: { basedOn: 1, scope: [], content } });
    expect(saved.status).toBe(201);
    expect((await call(runs.POST, "POST", "/api/analysis/runs", { as: s.as.clerk, body: { estimateId: made.body.id } })).status).toBeLessThan(300);
  });

  it("refuses observers and bad input, storing nothing", async () => {
    const before = await tableCounts();
    expect((await call(roster.POST, "POST", "/x", { as: s.as.observer, body: { measureId, title: "x", scope: [] } })).status).toBe(403);
    const bad = await call(roster.POST, "POST", "/x", { as: s.as.clerk, body: { measureId, title: "", scope: [] } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues[0].path).toBe("title");
    expect(await tableCounts()).toEqual(before);
  });
});

describe("amendments offered for an estimate", () => {
  it("marks the third-degree amendment out of order and offers the rest", async () => {
    const r = await call(versionList.GET, "GET", "/x", { as: s.as.clerk, query: { measureId, scope: "" } });
    const pending = r.body.pending as Array<{ key: string; target: string; outOfOrder: string | null }>;
    const byKey = new Map(pending.map((p) => [p.key, p]));
    // The seed files A8 against A2, itself an amendment of A1 (which amends section 2): third degree.
    const third = pending.filter((p) => p.outOfOrder);
    expect(third.map((p) => p.outOfOrder)).toEqual(["an amendment of the third degree is out of order"]);
    const t = third[0];
    const parent = byKey.get(t.target)!;
    expect(byKey.get(parent.target)?.target).toMatch(/^s\d+$/);
    expect(byKey.get("A1")?.outOfOrder).toBeNull();
    expect(byKey.get("A2")?.outOfOrder).toBeNull();
  });
});

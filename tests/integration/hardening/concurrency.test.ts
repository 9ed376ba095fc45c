// Parallel writers never lose an update: N edits based on the same version of one measure, one
// amendment (tree), one rulebook, one floor board, one estimate and one draft ruling: exactly
// one wins, the others get 409 and nothing of theirs is stored. Parallel filing of drafts gets
// unique gap-free numbers (parallel direct filing is covered in tests/integration/measures/amendments.test.ts).
// Common practice (optimistic concurrency control; lost-update anomaly), no source.
import type { APIRoute } from "astro";
import { beforeAll, describe, expect, it } from "vitest";
import { sql } from "../../../src/lib/server/db.ts";
import { call } from "../../support/app.ts";
import type { Seeded } from "../../support/fixtures.ts";
import type { Samples } from "../../access/route-inventory.ts";
import { rulingBody, seedSamples } from "../../access/samples.ts";

const N = 10;
let s: Seeded;
let samples: Samples;
const route = async (p: string, m: string) => ((await import(/* @vite-ignore */ `../../../src/pages/${p}`)) as Record<string, APIRoute>)[m];

beforeAll(async () => {
  ({ s, samples } = await seedSamples());
}, 120_000);

function oneWinner(statuses: number[], ok: number) {
  expect(statuses.filter((x) => x === ok)).toHaveLength(1);
  expect(statuses.filter((x) => x === 409)).toHaveLength(statuses.length - 1);
}

describe("parallel edits of one record", () => {
  it("measure: one of ten edits from the same version wins; the stored title is the winner's", async () => {
    const patch = await route("api/measures/[id]/index.ts", "PATCH");
    const [{ version }] = await sql`SELECT version FROM measures WHERE id = ${samples.measure}`;
    const audit = async () => Number((await sql`SELECT count(*)::int AS n FROM measure_audit`)[0].n);
    const before = await audit();
    const res = await Promise.all(Array.from({ length: N }, (_, i) => call(patch, "PATCH", "/x", { as: i % 2 ? s.as.clerk : s.as["chief-clerk"], params: { id: samples.measure }, body: { version, title: `Parallel title ${i}` } })));
    oneWinner(res.map((r) => r.status), 200);
    const winner = res.findIndex((r) => r.status === 200);
    const [row] = await sql`SELECT title, version FROM measures WHERE id = ${samples.measure}`;
    expect(row.title).toBe(`Parallel title ${winner}`);
    expect(row.version).toBe(version + 1);
    expect(await audit()).toBe(before + 1);
  });

  it("amendment tree: one of ten edits of an amendment from the same version wins", async () => {
    const patch = await route("api/amendments/[id]/index.ts", "PATCH");
    const [{ version }] = await sql`SELECT version FROM amendments WHERE id = ${samples.amendment}`;
    const res = await Promise.all(Array.from({ length: N }, (_, i) => call(patch, "PATCH", "/x", { as: s.as.clerk, params: { id: samples.amendment }, body: { version, text: `Parallel text ${i}` } })));
    oneWinner(res.map((r) => r.status), 200);
    const winner = res.findIndex((r) => r.status === 200);
    const [row] = await sql`SELECT text, version FROM amendments WHERE id = ${samples.amendment}`;
    expect([row.text, row.version]).toEqual([`Parallel text ${winner}`, version + 1]);
  });

  it("rulebook: one of ten versions saved from the same base wins; the others are refused", async () => {
    const post = await route("api/rulebooks/index.ts", "POST");
    const [{ id: latest }] = await sql`SELECT id FROM rulebook_versions WHERE chamber_id = ${s.chambers.harrowmere} ORDER BY number DESC LIMIT 1`;
    const count = async () => Number((await sql`SELECT count(*)::int AS n FROM rulebook_versions WHERE chamber_id = ${s.chambers.harrowmere}`)[0].n);
    const before = await count();
    const res = await Promise.all(Array.from({ length: N }, (_, i) => call(post, "POST", "/x", { as: s.as.clerk, body: { basedOn: latest, note: `parallel ${i}`, document: samples.rulebookDocument } })));
    oneWinner(res.map((r) => r.status), 201);
    expect(await count()).toBe(before + 1);
  });

  it("floor board: one of ten events recorded at the same revision wins", async () => {
    const post = await route("api/floor/sittings/[id]/events.ts", "POST");
    const open = await call(await route("api/floor/sittings/index.ts", "POST"), "POST", "/x", { as: s.as.clerk, body: { title: "Parallel sitting" } });
    const id = open.body.id ?? open.body.sitting.id;
    const res = await Promise.all(Array.from({ length: N }, (_, i) => call(post, "POST", "/x", { as: s.as.clerk, params: { id }, body: { revision: 0, event: { kind: "made", motion: "main", text: `Motion ${i}` } } })));
    oneWinner(res.map((r) => r.status), 201);
    const [row] = await sql`SELECT revision FROM sittings WHERE id = ${id}`;
    expect(row.revision).toBe(1);
    expect(Number((await sql`SELECT count(*)::int AS n FROM floor_events WHERE sitting_id = ${id}`)[0].n)).toBe(1);
  });

  it("estimate: one of ten versions saved from the same base wins", async () => {
    const post = await route("api/estimates/[id]/versions.ts", "POST");
    const created = await call(await route("api/estimates/index.ts", "POST"), "POST", "/x", { as: s.as.member, body: { measureId: samples.measure, title: "Parallel estimate", scope: [], content: { kind: "ballots", rows: [{ member: "all", weight: 40, ranking: ["measure", "Q"] }] } } });
    const res = await Promise.all(Array.from({ length: N }, (_, i) => call(post, "POST", "/x", { as: s.as.member, params: { id: created.body.id }, body: { basedOn: 1, scope: [], content: { kind: "ballots", rows: [{ member: "all", weight: 40 - i, ranking: ["Q", "measure"] }] } } })));
    oneWinner(res.map((r) => r.status), 201);
    expect(Number((await sql`SELECT count(*)::int AS n FROM estimate_versions WHERE estimate_id = ${created.body.id}`)[0].n)).toBe(2);
  });

  it("draft ruling: one of ten edits from the same version wins", async () => {
    const put = await route("api/rulings/[id].ts", "PUT");
    const draft = await call(await route("api/rulings/index.ts", "POST"), "POST", "/x", { as: s.as.clerk, body: rulingBody(samples.legislator) });
    const res = await Promise.all(Array.from({ length: N }, (_, i) => call(put, "PUT", "/x", { as: s.as.clerk, params: { id: draft.body.id }, body: { version: draft.body.version ?? 1, content: rulingBody(samples.legislator, { question: `Parallel question ${i}?` }) } })));
    oneWinner(res.map((r) => r.status), 200);
  });
});

describe("parallel filing of drafts", () => {
  it("ten drafts filed at once get the next ten numbers, unique and without gaps", async () => {
    const fileDraft = await route("api/amendments/[id]/file.ts", "POST");
    const post = await route("api/measures/[id]/amendments.ts", "POST");
    const created = await call(await route("api/measures/index.ts", "POST"), "POST", "/x", { as: s.as.clerk, body: { number: "PAR 1", title: "Parallel filing", text: "Section 1. Text." } });
    const drafts = [];
    for (let i = 0; i < N; i++) drafts.push((await call(post, "POST", "/x", { as: s.as.member, params: { id: created.body.id }, body: { form: "insert", target: "measure", text: `Draft ${i}`, draft: true } })).body);
    await call(post, "POST", "/x", { as: s.as.clerk, params: { id: created.body.id }, body: { form: "insert", target: "measure", text: "Filed first" } });
    const res = await Promise.all(drafts.map((d) => call(fileDraft, "POST", "/x", { as: s.as.member, params: { id: d.id }, body: { version: d.version } })));
    expect(res.map((r) => r.status)).toEqual(Array(N).fill(200));
    const numbers = res.map((r) => r.body.number).sort((a: number, b: number) => a - b);
    expect(numbers).toEqual(Array.from({ length: N }, (_, i) => i + 2));
  });
});

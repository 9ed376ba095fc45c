// HTML and script in every free-text field: stored as the text it is (read back unchanged),
// never interpreted, and escaped in the e-mail HTML the services build (ruling circulation,
// floor digest). The pages are checked over HTTP in tests/browser/access.test.ts.
// Common practice (OWASP XSS prevention: output encoding), no source.
import type { APIRoute } from "astro";
import { beforeAll, describe, expect, it } from "vitest";
import { sql } from "../../src/lib/server/db.ts";
import { call } from "../support/app.ts";
import type { Seeded } from "../support/fixtures.ts";
import type { Samples } from "../access/route-inventory.ts";
import { rulingBody, seedSamples } from "../access/samples.ts";

const XSS = `<script>alert("gw")</script><img src=x onerror="alert(1)"> & "quotes" 'too'`;
let s: Seeded;
let samples: Samples;
const route = async (p: string, m: string) => ((await import(/* @vite-ignore */ `../../src/pages/${p}`)) as Record<string, APIRoute>)[m];

beforeAll(async () => {
  ({ s, samples } = await seedSamples());
}, 120_000);

function expectEscaped(html: string) {
  expect(html).not.toMatch(/<script|<img[^>]*onerror/i);
  expect(html).toContain("&lt;script&gt;");
}

describe("HTML and script in text fields", () => {
  it("measure title, committee, section heading and text come back exactly as sent", async () => {
    const created = await call(await route("api/measures/index.ts", "POST"), "POST", "/x", { as: s.as.clerk, body: { number: "XSS 1", title: XSS, committee: XSS, sections: [{ heading: XSS, text: XSS }] } });
    expect(created.status).toBe(201);
    const got = (await call(await route("api/measures/[id]/index.ts", "GET"), "GET", "/x", { as: s.as.observer, params: { id: created.body.id } })).body;
    expect(got.title).toBe(XSS);
    expect(got.committee).toBe(XSS);
    expect(JSON.stringify(got.sections)).toContain(JSON.stringify(XSS).slice(1, -1));
  });

  it("amendment title and text, sitting title, list name and description, estimate title and note: read back unchanged", async () => {
    const a = await call(await route("api/measures/[id]/amendments.ts", "POST"), "POST", "/x", { as: s.as.member, params: { id: samples.measure }, body: { form: "insert", target: "measure", title: XSS, text: XSS } });
    expect(a.status).toBe(201);
    const back = (await call(await route("api/amendments/[id]/index.ts", "GET"), "GET", "/x", { as: s.as.observer, params: { id: a.body.id } })).body;
    expect([back.title, back.text]).toEqual([XSS, XSS]);

    const sit = await call(await route("api/floor/sittings/index.ts", "POST"), "POST", "/x", { as: s.as.clerk, body: { title: XSS } });
    expect(sit.status).toBe(201);
    expect((await call(await route("api/floor/sittings/[id].ts", "GET"), "GET", "/x", { as: s.as.observer, params: { id: sit.body.id ?? sit.body.sitting?.id } })).body.sitting?.title ?? sit.body.title).toBe(XSS);

    const list = await call(await route("api/circulation/lists/index.ts", "POST"), "POST", "/x", { as: s.as.staff, body: { name: XSS.slice(0, 120), description: XSS, entries: [] } });
    expect(list.status).toBe(201);
    const lb = (await call(await route("api/circulation/lists/[id].ts", "GET"), "GET", "/x", { as: s.as.staff, params: { id: list.body.id } })).body;
    expect(JSON.stringify(lb)).toContain(JSON.stringify(XSS).slice(1, -1));

    const est = await call(await route("api/estimates/index.ts", "POST"), "POST", "/x", { as: s.as.member, body: { measureId: samples.measure, title: XSS, note: XSS, scope: [], content: { kind: "ballots", rows: [{ member: "all", weight: 40, ranking: ["measure", "Q"] }] } } });
    expect(est.status).toBe(201);
    const eb = (await call(await route("api/estimates/[id].ts", "GET"), "GET", "/x", { as: s.as.member, params: { id: est.body.id } })).body;
    expect(eb.estimate.title).toBe(XSS);
  });

  it("a ruling's question, reasoning and target label are escaped in the circulated e-mail's HTML (and plain in its text)", async () => {
    const draft = await call(await route("api/rulings/index.ts", "POST"), "POST", "/x", { as: s.as.clerk, body: rulingBody(samples.legislator, { question: XSS, reasoning: XSS, target: { kind: "motion", ref: "previous-question", label: XSS } }) });
    expect(draft.status).toBe(201);
    const got = (await call(await route("api/rulings/[id].ts", "GET"), "GET", "/x", { as: s.as.clerk, params: { id: draft.body.id } })).body;
    expect(JSON.stringify(got)).toContain(JSON.stringify(XSS).slice(1, -1));
    const issued = await call(await route("api/rulings/[id]/issue.ts", "POST"), "POST", "/x", { as: s.as.clerk, params: { id: draft.body.id }, body: { version: draft.body.version ?? 1, circulateTo: [samples.list] } });
    expect(issued.status).toBe(200);
    const mails = await sql<{ html: string; text: string }[]>`SELECT o.html, o.text FROM outbox o JOIN circulations c ON c.id = o.circulation_id WHERE c.ruling_id = ${draft.body.id}`;
    expect(mails.length).toBeGreaterThan(0);
    for (const m of mails) {
      expectEscaped(m.html);
      expect(m.text).toContain(XSS);
    }
  });

  it("a floor digest's sitting, findings and note are escaped in the e-mail's HTML", async () => {
    const sent = await call(await route("api/circulation/digest.ts", "POST"), "POST", "/x", { as: s.as.staff, body: { sitting: XSS, date: "2026-04-02", measure: XSS, findings: [{ severity: "error", message: XSS, subject: XSS }], proposedOrder: [{ label: XSS, note: XSS }], note: XSS } });
    expect(sent.status).toBe(201);
    const mails = await sql<{ html: string }[]>`SELECT html FROM outbox WHERE kind = 'floor-digest'`;
    expect(mails.length).toBeGreaterThan(0);
    for (const m of mails) expectEscaped(m.html);
  });
});

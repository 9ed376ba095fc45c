// Issue 17's probe, the findings not covered by the corpus (corpus.ts holds the NUL, int4 and
// impossible-date cases): NUL through better-auth's own routes (update-user, sign-up), and CSV
// formula injection in the spatial template's header cells. Sources: PostgreSQL manual §8.3
// (paraphrase: the character with code zero cannot be stored in text); OWASP "CSV Injection"
// (paraphrase: neutralise cells beginning with = + - @, tab or carriage return).
import Papa from "papaparse";
import { beforeAll, describe, expect, it } from "vitest";
import { ALL } from "../../src/pages/api/auth/[...all].ts";
import * as template from "../../src/pages/api/estimates/template.ts";
import { call } from "../support/app.ts";
import { tableCounts } from "../support/db.ts";
import type { Seeded } from "../support/fixtures.ts";
import type { Samples } from "../access/route-inventory.ts";
import { seedSamples } from "../access/samples.ts";

let s: Seeded;
let samples: Samples;

beforeAll(async () => {
  ({ s, samples } = await seedSamples());
}, 120_000);

describe("NUL through the account routes", () => {
  it("update-user with a NUL in the name: 400 naming the field, the name unchanged", async () => {
    const before = await tableCounts();
    const r = await call(ALL, "POST", "/api/auth/update-user", { as: s.as.member, body: { name: "Member\u0000" } });
    expect(r.status, JSON.stringify(r.body)).toBe(400);
    expect(r.body.error.code).toBe("invalid-input");
    expect(r.body.error.issues.map((i: { path: string }) => i.path)).toContain("name");
    expect(await tableCounts()).toEqual(before);
    const session = await call(ALL, "GET", "/api/auth/get-session", { as: s.as.member });
    expect(session.body.user.name).not.toContain("\u0000");
  });

  it("sign-up with half a surrogate pair in the name: 400 naming the field, no user", async () => {
    const before = await tableCounts();
    const r = await call(ALL, "POST", "/api/auth/sign-up/email", { rawBody: '{"email":"surrogate@harrowmere.example","password":"correct-horse-battery","name":"A \\ud800"}', headers: { "content-type": "application/json" } });
    expect(r.status).toBe(400);
    expect(r.body.error.issues.map((i: { path: string }) => i.path)).toContain("name");
    expect(await tableCounts()).toEqual(before);
  });
});

describe("CSV formula injection", () => {
  it("GET /api/estimates/template?kind=spatial: dimension names that look like formulas are neutralised", async () => {
    const hostile = ['=HYPERLINK("http://evil.example/x";"open")', "@SUM(1+1)", "+cmd|' /C calc'!A0", "-2+3"];
    const r = await call(template.GET, "GET", "/x", { as: s.as.observer, query: { measureId: samples.measure, kind: "spatial", dimensions: hostile.join(","), per: "member" } });
    expect(r.status, String(r.body).slice(0, 300)).toBe(200);
    const text = String(r.body);
    const cells = Papa.parse<string[]>(text, { skipEmptyLines: true }).data.flat();
    expect(cells.length).toBeGreaterThan(4);
    for (const c of cells) expect(c, JSON.stringify(c)).not.toMatch(/^[=+\-@\t\r]/);
    for (const h of ["@SUM(1+1)", "-2+3"]) expect(cells).toContain(`'${h}`);
  });
});

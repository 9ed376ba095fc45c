// What the measure page's editors send: a measure's fields and sections edited with its version
// (a stale save is 409 and names who changed what), a measure created with sponsors and status,
// an amendment edited by a clerk or by the member who filed it while it is filed, and a tree
// override resting on a picked issued ruling, then revoked. Product contract (common practice,
// no source).
import { beforeAll, describe, expect, it } from "vitest";
import { seedMeasures } from "../../../src/lib/server/seed/measures.ts";
import { seedRulings } from "../../../src/lib/server/seed/rulings.ts";
import * as measuresRoute from "../../../src/pages/api/measures/index.ts";
import * as measureOne from "../../../src/pages/api/measures/[id]/index.ts";
import * as upload from "../../../src/pages/api/measures/upload.ts";
import * as filing from "../../../src/pages/api/measures/[id]/amendments.ts";
import * as treeRoute from "../../../src/pages/api/measures/[id]/tree.ts";
import * as overrides from "../../../src/pages/api/measures/[id]/overrides/index.ts";
import * as overrideOne from "../../../src/pages/api/measures/[id]/overrides/[oid].ts";
import * as amendment from "../../../src/pages/api/amendments/[id]/index.ts";
import * as rulingsRoute from "../../../src/pages/api/rulings/index.ts";
import { call } from "../../support/app.ts";
import { tableCounts } from "../../support/db.ts";
import { seedChambers, type Seeded } from "../../support/fixtures.ts";
import { legislatorIds, multipart, multipartBody } from "./helpers.ts";

let s: Seeded;
let L: string[];
let demo: string;

type Section = { id: string; heading?: string; text?: string; subjects: string[]; lines?: number; status: string };
type MeasureBody = { id: string; version: number; title: string; status: string; sponsors: Array<{ id: string }>; sections: Section[] };

beforeAll(async () => {
  s = await seedChambers();
  demo = (await seedMeasures())!.measureId;
  await seedRulings();
  L = await legislatorIds(s.chambers.harrowmere);
});

async function newMeasure(number: string) {
  const r = await call(measuresRoute.POST, "POST", "/api/measures", { as: s.as.clerk, body: { number, title: `Measure ${number}`, text: "## Section 1\nSubjects: lighting\nOne.\nTwo.\n## Section 2\nSubjects: finance\nThree." } });
  expect(r.status).toBe(201);
  return r.body as MeasureBody;
}
const patch = (id: string, body: Record<string, unknown>, as = s.as.clerk) => call(measureOne.PATCH, "PATCH", `/api/measures/${id}`, { as, params: { id }, body });

describe("creating a measure from the page", () => {
  it("keeps typed text's sponsors and status, and an upload's sponsors and status", async () => {
    const typed = await call(measuresRoute.POST, "POST", "/api/measures", { as: s.as.clerk, body: { number: "ED 1", title: "Typed", status: "in-committee", sponsors: [L[0], L[1]], text: "Section 1.\nOne line." } });
    expect(typed.status).toBe(201);
    expect((typed.body as MeasureBody).status).toBe("in-committee");
    expect((typed.body as MeasureBody).sponsors.map((x) => x.id)).toEqual([L[0], L[1]]);
    const fd = multipart({ number: "ED 2", title: "Uploaded", status: "draft", sponsors: `${L[2]},${L[3]}` }, { name: "ed2.txt", bytes: Buffer.from("Section 1.\nUploaded line."), type: "text/plain" });
    const up = await call(upload.POST, "POST", "/api/measures/upload", { as: s.as.clerk, ...(await multipartBody(fd)) });
    expect(up.status).toBe(201);
    expect((up.body as MeasureBody).status).toBe("draft");
    expect((up.body as MeasureBody).sponsors.map((x) => x.id)).toEqual([L[2], L[3]]);
  });
});

describe("editing a measure's fields and sections", () => {
  it("refuses the other chamber (404) and bad sections (400), changing nothing (other roles and anonymous: tests/access)", async () => {
    const m = await newMeasure("ED 3");
    const before = await tableCounts();
    const body = { version: m.version, title: "New" };
    expect((await patch(m.id, body, s.outsider)).status).toBe(404);
    expect((await patch(m.id, { version: m.version, sections: [{ id: "s1", text: "a" }, { id: "s1", text: "b" }] })).status).toBe(400);
    expect((await patch(m.id, { version: m.version, sections: [{ id: "bad id!", text: "a" }] })).status).toBe(400);
    expect(await tableCounts()).toEqual(before);
  });

  it("edits a section's text and tags, removes one and adds one, keeping ids and counting lines", async () => {
    const m = await newMeasure("ED 4");
    const [s1] = m.sections;
    const r = await patch(m.id, { version: m.version, title: "Edited title", committee: "Works", status: "reported", subjects: ["harbour"], sponsors: [L[4]], sections: [{ id: s1.id, heading: "Lights", text: "First.\nSecond.\nThird.", subjects: ["lighting", "safety"] }, { text: "A new section.", subjects: ["signs"] }] });
    expect(r.status).toBe(200);
    const out = r.body as MeasureBody;
    expect(out.version).toBe(m.version + 1);
    expect(out.title).toBe("Edited title");
    expect(out.sponsors.map((x) => x.id)).toEqual([L[4]]);
    expect(out.sections.map((x) => [x.id, x.heading ?? null, x.lines, x.subjects])).toEqual([
      [s1.id, "Lights", 3, ["lighting", "safety"]],
      [expect.any(String), null, 1, ["signs"]],
    ]);
    expect(out.sections[1].id).not.toBe(s1.id);
  });

  it("answers a stale save with 409 naming who changed which fields since", async () => {
    const m = await newMeasure("ED 5");
    expect((await patch(m.id, { version: m.version, sections: [{ id: "s1", text: "Chief clerk's text." }] }, s.as["chief-clerk"])).status).toBe(200);
    const before = await tableCounts();
    const stale = await patch(m.id, { version: m.version, sections: [{ id: "s1", text: "Clerk's text." }] });
    expect(stale.status).toBe(409);
    const err = (stale.body as { error: { code: string; details: { changes: Array<{ by: string; fields: string[] }> } } }).error;
    expect(err.code).toBe("conflict");
    expect(err.details.changes).toHaveLength(1);
    expect(err.details.changes[0].fields).toContain("sections");
    expect(err.details.changes[0].by.length).toBeGreaterThan(0);
    expect(await tableCounts()).toEqual(before);
  });
});

describe("editing an amendment", () => {
  it("lets the member who filed it edit every field while filed, refuses others, and refuses the filer once it is decided", async () => {
    const m = await newMeasure("ED 6");
    const filed = await call(filing.POST, "POST", "/x", { as: s.as.member, params: { id: m.id }, body: { form: "insert", target: "s1", sponsors: [L[0]], subjects: ["lighting"], text: "Add a lamp." } });
    expect(filed.status).toBe(201);
    const a = filed.body as { id: string; version: number };
    const edit = { version: a.version, form: "strike-and-insert", target: "s2", lines: [1, 1], title: "Lamps", text: "Strike and insert lamps.", subjects: ["finance"], sponsors: [L[0], L[1]] };
    const before = await tableCounts();
    expect((await call(amendment.PATCH, "PATCH", "/x", { as: s.outsider, params: { id: a.id }, body: edit })).status).toBe(404);
    expect((await call(amendment.PATCH, "PATCH", "/x", { as: s.as.member, params: { id: a.id }, body: { ...edit, lines: [1, 9] } })).status).toBe(422);
    expect(await tableCounts()).toEqual(before);

    const ok = await call(amendment.PATCH, "PATCH", "/x", { as: s.as.member, params: { id: a.id }, body: edit });
    expect(ok.status).toBe(200);
    const v = ok.body as { version: number; form: string; target: string; lines: number[]; text: string; subjects: string[]; sponsors: Array<{ id: string }> };
    expect([v.form, v.target, v.lines, v.text, v.subjects, v.sponsors.map((x) => x.id)]).toEqual(["strike-and-insert", "s2", [1, 1], edit.text, ["finance"], [L[0], L[1]]]);
    const stale = await call(amendment.PATCH, "PATCH", "/x", { as: s.as.clerk, params: { id: a.id }, body: { ...edit, version: a.version } });
    expect(stale.status).toBe(409);

    const adopted = await call(amendment.PATCH, "PATCH", "/x", { as: s.as.clerk, params: { id: a.id }, body: { version: v.version, status: "adopted" } });
    expect(adopted.status).toBe(200);
    expect((await call(amendment.PATCH, "PATCH", "/x", { as: s.as.member, params: { id: a.id }, body: { version: v.version + 1, text: "Late change." } })).status).toBe(403);
    expect((await call(amendment.PATCH, "PATCH", "/x", { as: s.as.clerk, params: { id: a.id }, body: { version: v.version + 1, text: "Clerk's correction." } })).status).toBe(200);
  });
});

describe("overriding a finding with a picked ruling", () => {
  it("finds an issued ruling by words, records the override with its id, and revokes it", async () => {
    const found = await call(rulingsRoute.GET, "GET", "/api/rulings", { as: s.as.clerk, query: { status: "issued", limit: "100" } });
    expect(found.status).toBe(200);
    const results = (found.body as { results: Array<{ id: string; number: number; question: string }> }).results;
    expect(results.length).toBeGreaterThan(0);
    const ruling = results[0];
    const word = ruling.question.split(/\W+/).find((w) => w.length > 5)!;
    const byWords = await call(rulingsRoute.GET, "GET", "/api/rulings", { as: s.as.clerk, query: { status: "issued", q: word } });
    expect((byWords.body as { results: Array<{ id: string }> }).results.map((r) => r.id)).toContain(ruling.id);

    const tree = (await call(treeRoute.GET, "GET", "/x", { as: s.as.clerk, params: { id: demo } })).body as { findings: Array<{ code: string; amendmentId: string | null; overridden?: boolean; overrideId?: string | null; overrideRulingId?: string | null; overrideNote?: string | null }>; nodes: Array<{ id: string | null; version: number | null }> };
    const f = tree.findings.find((x) => x.amendmentId && !x.overridden)!;
    const version = tree.nodes.find((n) => n.id === f.amendmentId)!.version!;
    const made = await call(overrides.POST, "POST", "/x", { as: s.as.clerk, params: { id: demo }, body: { amendmentId: f.amendmentId, code: f.code, version, rulingRef: `Ruling ${ruling.number}`, rulingId: ruling.id, note: "Germane in substance." } });
    expect(made.status).toBe(201);
    expect((made.body as { rulingId: string }).rulingId).toBe(ruling.id);
    const after = (await call(treeRoute.GET, "GET", "/x", { as: s.as.clerk, params: { id: demo } })).body as typeof tree;
    const o = after.findings.find((x) => x.amendmentId === f.amendmentId && x.code === f.code)!;
    expect(o.overridden).toBe(true);
    expect([o.overrideRulingId, o.overrideNote]).toEqual([ruling.id, "Germane in substance."]);

    expect((await call(overrideOne.DELETE, "DELETE", "/x", { as: s.outsider, params: { id: demo, oid: o.overrideId! } })).status).toBe(404);
    expect((await call(overrideOne.DELETE, "DELETE", "/x", { as: s.as.clerk, params: { id: demo, oid: o.overrideId! } })).status).toBe(200);
    const last = (await call(treeRoute.GET, "GET", "/x", { as: s.as.clerk, params: { id: demo } })).body as typeof tree;
    expect(last.findings.find((x) => x.amendmentId === f.amendmentId && x.code === f.code)!.overridden ?? false).toBe(false);
  });
});

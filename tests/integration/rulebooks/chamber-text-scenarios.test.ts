// The chamber's own rules clause by clause, and the bench of scenarios, through the API (issue 16,
// items 3 and 4): upload (PDF, DOCX, text, Markdown) → clauses, versions; clause links saved as a new
// rulebook version; coverage; scenarios added, imported, exported, run on every save; adoption asks
// for a note when a scenario changes verdict. Bad input → 400 naming the field; nothing half-written.
// The standing orders are the demo chamber's fictional ones; the verdicts are those of the
// demo-chamber template (fictional SO 20, after Robert's Rules of Order Revised, 1915, §33 p. 134).
import { readFileSync } from "node:fs";
import { beforeAll, describe, expect, it } from "vitest";
import * as list from "../../../src/pages/api/rulebooks/index.ts";
import * as adopt from "../../../src/pages/api/rulebooks/[id]/adopt.ts";
import * as coverage from "../../../src/pages/api/rulebooks/[id]/coverage.ts";
import * as links from "../../../src/pages/api/rulebooks/[id]/links.ts";
import * as bench from "../../../src/pages/api/rulebooks/[id]/scenarios.ts";
import * as texts from "../../../src/pages/api/rulebooks/text/index.ts";
import * as scenarios from "../../../src/pages/api/rulebooks/scenarios/index.ts";
import * as oneScenario from "../../../src/pages/api/rulebooks/scenarios/[sid].ts";
import { seedRulebooks } from "../../../src/lib/server/seed/rulebooks.ts";
import { call } from "../../support/app.ts";
import { tableCounts } from "../../support/db.ts";
import { seedChambers, type Seeded } from "../../support/fixtures.ts";
import { docxBytes, multipart, pdfBytes } from "../measures/helpers.ts";

const ORDERS = "# Standing Orders of the Harrowmere Assembly\n\n## SO 20 Precedence of motions\nWhen a question is under debate, no motion shall be received except:\n1. to adjourn;\n2. to lay on the table;\n3. to amend.\n\n## SO 42 Suspension\n(1) Standing orders may be suspended by a majority of all members.\n\n## SO 50 Reconsideration\nA vote may be reconsidered on the same or the next day.\n";

let s: Seeded;
const latest = async () => (await call(list.GET, "GET", "/api/rulebooks", { as: s.as.clerk })).body.latest as { id: string; number: number };
const uploadText = (name: string, bytes: Buffer, fields: Record<string, string> = {}, as = s.as.clerk) => call(texts.POST, "POST", "/api/rulebooks/text", { as, rawBody: multipart(fields, { name, bytes }) });

const amendOverPI = {
  id: "amend-over-pi",
  kind: "floor",
  title: "With postpone indefinitely pending, amend is in order",
  source: "Harrowmere Assembly Standing Orders (fictional), SO 20",
  state: { pending: [{ motion: "main" }, { motion: "postpone-indefinitely" }] },
  expect: { motions: { amend: { inOrder: true } } },
};

beforeAll(async () => {
  s = await seedChambers();
  await seedRulebooks();
});

describe("the chamber's text", () => {
  it("refuses a missing file, a file of another kind and a text without numbered clauses, naming the field and storing nothing", async () => {
    const before = await tableCounts();
    const none = await call(texts.POST, "POST", "/api/rulebooks/text", { as: s.as.clerk, rawBody: multipart({ note: "x" }) });
    expect([none.status, none.body.error.issues[0].path]).toEqual([400, "file"]);
    const gif = await uploadText("orders.pdf", Buffer.from("GIF89a not a pdf"));
    expect([gif.status, gif.body.error.issues[0].path]).toEqual([400, "file"]);
    const flat = await uploadText("orders.txt", Buffer.from("These orders have no numbers.\nNone at all."));
    expect([flat.status, flat.body.error.issues[0].path]).toEqual([400, "file"]);
    expect(await tableCounts()).toEqual(before);
  });

  it("members may read but not upload; another chamber sees nothing", async () => {
    expect((await uploadText("orders.md", Buffer.from(ORDERS), {}, s.as.member)).status).toBe(403);
    expect((await call(texts.POST, "POST", "/api/rulebooks/text", { as: null, rawBody: multipart({}, { name: "orders.md", bytes: Buffer.from(ORDERS) }) })).status).toBe(401);
  });

  it("splits an upload (Markdown, plain text, PDF, DOCX) into clauses and keeps every upload as a version", async () => {
    const pdf = await uploadText("orders.pdf", pdfBytes("SO 7 Quorum"));
    expect(pdf.status, JSON.stringify(pdf.body)).toBe(201);
    const docx = await uploadText("orders.docx", await docxBytes(["Rule 1 Sittings", "1. The Assembly sits on Tuesdays.", "2. Sittings are public."]));
    expect([docx.status, docx.body.clauses]).toEqual([201, 3]);
    const txt = await uploadText("orders.txt", Buffer.from("1. Meetings are monthly.\n(a) The chair calls them."));
    expect(txt.body.clauses).toBe(2);
    const md = await uploadText("orders.md", Buffer.from(ORDERS), { note: "Standing orders as amended" });
    expect(md.status).toBe(201);
    expect(md.body).toMatchObject({ number: 4, title: "Standing Orders of the Harrowmere Assembly", clauses: 7 });
    const all = await call(texts.GET, "GET", "/api/rulebooks/text", { as: s.as.observer });
    expect(all.body.texts.map((t: { number: number }) => t.number)).toEqual([4, 3, 2, 1]);
    const now = (await call(texts.GET, "GET", "/api/rulebooks/text", { as: s.as.member })).body.text;
    expect(now.clauses.map((c: { label: string }) => c.label)).toEqual(["SO 20", "SO 20, paragraph 1", "SO 20, paragraph 2", "SO 20, paragraph 3", "SO 42", "SO 42(1)", "SO 50"]);
    expect((await call(texts.GET, "GET", "/x", { as: s.as.member, query: { id: docx.body.id } })).body.text.number).toBe(2);
    expect((await call(texts.GET, "GET", "/x", { as: s.outsider, query: { id: md.body.id } })).status).toBe(404);
    expect((await call(texts.GET, "GET", "/x", { as: s.outsider })).body).toEqual({ texts: [], text: null });
    const badId = await call(texts.GET, "GET", "/x", { as: s.as.member, query: { id: "nope" } });
    expect([badId.status, badId.body.error.issues[0].path]).toEqual([400, "id"]);
  });
});

describe("clause links and coverage", () => {
  it("coverage lists every clause as uncited and every motion and rule as citing none before any link", async () => {
    const v = await latest();
    const r = await call(coverage.GET, "GET", "/x", { as: s.as.member, params: { id: v.id } });
    expect(r.status).toBe(200);
    expect(r.body.coverage.uncitedClauses.length).toBe(7);
    expect(r.body.coverage.itemsWithoutClause.length).toBeGreaterThan(10);
  });

  it("refuses a link to a clause the text lacks or an item the version lacks, naming each, saving nothing", async () => {
    const v = await latest();
    const before = await tableCounts();
    const bad = await call(links.POST, "POST", "/x", { as: s.as.clerk, params: { id: v.id }, body: { links: [{ path: "motions.0.clause", clause: "so-99" }, { path: "motions.999.clause", clause: "so-20" }] } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues.map((i: { path: string }) => i.path)).toEqual(["links.0.clause", "links.1.path"]);
    const shape = await call(links.POST, "POST", "/x", { as: s.as.clerk, params: { id: v.id }, body: { links: [{ path: "motions.0.clause", clause: "SO 20" }] } });
    expect([shape.status, shape.body.error.issues[0].path]).toEqual([400, "links.0.clause"]);
    expect((await call(links.POST, "POST", "/x", { as: s.as.member, params: { id: v.id }, body: { links: [{ path: "motions.0.clause", clause: "so-20" }] } })).status).toBe(403);
    expect(await tableCounts()).toEqual(before);
  });

  it("saves links as a new version; coverage then lists only the clauses no item cites", async () => {
    const v = await latest();
    const doc = JSON.parse(readFileSync("rulebooks/demo-chamber.json", "utf8"));
    const suspend = doc.motions.findIndex((m: { id: string }) => m.id === "suspend-rules");
    const rank = doc.rules.findIndex((r: { id: string }) => r.id === "rank-precedence");
    const r = await call(links.POST, "POST", "/x", { as: s.as.clerk, params: { id: v.id }, body: { links: [{ path: `motions.${suspend}.clause`, clause: "so-42/1" }, { path: `rules.${rank}.clause`, clause: "so-20" }] } });
    expect(r.status, JSON.stringify(r.body)).toBe(201);
    expect(r.body.number).toBe(v.number + 1);
    const c = (await call(coverage.GET, "GET", "/x", { as: s.as.clerk, params: { id: r.body.id } })).body.coverage;
    expect(c.uncitedClauses.map((x: { label: string }) => x.label)).toEqual(["SO 50"]);
    expect(c.linked.map((x: { clauseLabel: string }) => x.clauseLabel)).toEqual(["SO 42(1)", "SO 20"]);
  });
});

describe("scenarios", () => {
  it("refuses a bad scenario naming the field, a duplicate id, and a bad import, changing nothing", async () => {
    const before = await tableCounts();
    const noSource = await call(scenarios.POST, "POST", "/x", { as: s.as.clerk, body: { ...amendOverPI, source: undefined } });
    expect([noSource.status, noSource.body.error.issues[0].path]).toEqual([400, "source"]);
    const badImport = await call(scenarios.PUT, "PUT", "/x", { as: s.as.clerk, body: { format: "gavelwright.scenarios", formatVersion: 1, scenarios: [amendOverPI, { ...amendOverPI, id: "b", expect: { motions: { amend: {} } } }] } });
    expect([badImport.status, badImport.body.error.issues[0].path]).toEqual([400, "scenarios.1.expect.motions.amend"]);
    expect((await call(scenarios.POST, "POST", "/x", { as: s.as.member, body: amendOverPI })).status).toBe(403);
    expect(await tableCounts()).toEqual(before);
  });

  it("imports the template's bench, adds one, exports them in the documented format, removes one", async () => {
    const shipped = JSON.parse(readFileSync("rulebooks/demo-chamber.scenarios.json", "utf8"));
    const imp = await call(scenarios.PUT, "PUT", "/x", { as: s.as.clerk, body: shipped });
    expect(imp.body).toEqual({ imported: shipped.scenarios.length, mode: "replace" });
    expect((await call(scenarios.POST, "POST", "/x", { as: s.as.clerk, body: amendOverPI })).status).toBe(201);
    const dup = await call(scenarios.POST, "POST", "/x", { as: s.as.clerk, body: amendOverPI });
    expect([dup.status, dup.body.error.issues[0].path]).toEqual([400, "id"]);
    const out = (await call(scenarios.GET, "GET", "/x", { as: s.as.observer })).body;
    expect(out).toMatchObject({ format: "gavelwright.scenarios", formatVersion: 1 });
    expect(out.scenarios.map((x: { id: string }) => x.id)).toEqual([...shipped.scenarios.map((x: { id: string }) => x.id), "amend-over-pi"]);
    expect((await call(scenarios.GET, "GET", "/x", { as: s.outsider })).body.scenarios).toEqual([]);
    expect((await call(oneScenario.DELETE, "DELETE", "/x", { as: s.as.clerk, params: { sid: "suspend-majority-of-members" } })).status).toBe(200);
    expect((await call(oneScenario.DELETE, "DELETE", "/x", { as: s.as.clerk, params: { sid: "suspend-majority-of-members" } })).status).toBe(404);
  });

  it("runs on every save; a version that changes a verdict is shown against the version in force and adopted only with a note", async () => {
    const v = await latest();
    const passing = (await call(bench.GET, "GET", "/x", { as: s.as.member, params: { id: v.id } })).body;
    expect(passing.failed).toBe(0);
    // Rank postpone indefinitely above amend: against SO 20 (and RONR 1915 §33 p. 134), amend is then out of order beneath it.
    const doc = JSON.parse(readFileSync("rulebooks/demo-chamber.json", "utf8"));
    doc.precedence = doc.precedence.map((chain: string[]) => {
      const i = chain.indexOf("amend");
      const j = chain.indexOf("postpone-indefinitely");
      if (i < 0 || j < 0) return chain;
      const c = [...chain];
      [c[i], c[j]] = [c[j]!, c[i]!];
      return c;
    });
    const saved = await call(list.POST, "POST", "/api/rulebooks", { as: s.as.clerk, body: { basedOn: v.id, note: "re-rank", document: doc } });
    expect(saved.status, JSON.stringify(saved.body)).toBe(201);
    expect(saved.body.scenarios.failed).toBeGreaterThan(0);
    expect(saved.body.scenarios.changed).toBeGreaterThan(0);
    const report = (await call(bench.GET, "GET", "/x", { as: s.as.clerk, params: { id: saved.body.id } })).body;
    expect(report.inForce).not.toBeNull();
    expect(report.changed.map((c: { id: string }) => c.id)).toContain("amend-over-pi");
    expect(report.changed.find((c: { id: string }) => c.id === "amend-over-pi").changes).toContainEqual({ path: "motions.amend.inOrder", before: true, after: false });
    const before = await tableCounts();
    const noNote = await call(adopt.POST, "POST", "/x", { as: s.as.clerk, params: { id: saved.body.id }, body: {} });
    expect([noNote.status, noNote.body.error.issues[0].path]).toEqual([400, "note"]);
    expect(noNote.body.error.details.changed.length).toBe(report.changed.length);
    expect(await tableCounts()).toEqual(before);
    const withNote = await call(adopt.POST, "POST", "/x", { as: s.as.clerk, params: { id: saved.body.id }, body: { note: "The Assembly ranks postpone indefinitely above amend from today (resolution 12)." } });
    expect(withNote.status).toBe(201);
    expect(withNote.body.scenariosChanged).toContain("amend-over-pi");
  });
});

// Rulebook versions through the API: list, save (optimistic concurrency), import, export,
// compare, adopt, templates. Roles, anonymous and the other chamber for every route.
// The behaviour checked is the product's own contract (common practice, no source).
import { readFileSync } from "node:fs";
import { beforeAll, describe, expect, it } from "vitest";
import * as list from "../../../src/pages/api/rulebooks/index.ts";
import * as one from "../../../src/pages/api/rulebooks/[id].ts";
import * as exportRoute from "../../../src/pages/api/rulebooks/[id]/export.ts";
import * as adopt from "../../../src/pages/api/rulebooks/[id]/adopt.ts";
import * as importRoute from "../../../src/pages/api/rulebooks/import.ts";
import * as compare from "../../../src/pages/api/rulebooks/compare.ts";
import * as template from "../../../src/pages/api/rulebooks/templates/[id].ts";
import { seedRulebooks } from "../../../src/lib/server/seed/rulebooks.ts";
import { loadRulebook } from "../../../src/lib/server/services/rulebooks.ts";
import { sql } from "../../../src/lib/server/db.ts";
import { call } from "../../support/app.ts";
import { tableCounts } from "../../support/db.ts";
import { seedChambers, type Seeded } from "../../support/fixtures.ts";

const ROLES = ["chief-clerk", "clerk", "member", "staff", "observer"] as const;
const demo = JSON.parse(readFileSync("rulebooks/demo-chamber.json", "utf8")) as Record<string, any>;

let s: Seeded;
const latest = async () => (await call(list.GET, "GET", "/api/rulebooks", { as: s.as.clerk })).body.latest as { id: string; number: number };

function upload(name: string, content: BlobPart, type = "application/json", fields: Record<string, string> = {}): FormData {
  const f = new FormData();
  f.set("file", new File([content], name, { type }));
  for (const [k, v] of Object.entries(fields)) f.set(k, v);
  return f;
}

beforeAll(async () => {
  s = await seedChambers();
  await seedRulebooks();
});

describe("GET /api/rulebooks", () => {
  it("shows every role the chamber's versions, the one in force and the templates", async () => {
    for (const role of ROLES) {
      const r = await call(list.GET, "GET", "/api/rulebooks", { as: s.as[role] });
      expect(r.status, role).toBe(200);
      expect(r.body.versions.length).toBe(1);
      expect(r.body.inForce.versionId).toBe(r.body.versions[0].id);
      expect(r.body.templates.map((t: { id: string }) => t.id)).toEqual(expect.arrayContaining(["continental", "demo-chamber", "general-parliamentary-law", "us-house", "us-senate", "westminster"]));
      // A former id resolves but is not listed twice (issue 14: old ids keep working as aliases).
      expect(r.body.templates.map((t: { id: string }) => t.id)).not.toContain("four-amendment-legislature");
    }
  });
  it("keeps chambers apart", async () => {
    const r = await call(list.GET, "GET", "/api/rulebooks", { as: s.outsider });
    expect(r.body.versions).toEqual([]);
    expect(r.body.inForce).toBeNull();
    const mine = await latest();
    expect((await call(one.GET, "GET", `/api/rulebooks/${mine.id}`, { as: s.outsider, params: { id: mine.id } })).status).toBe(404);
    expect((await call(exportRoute.GET, "GET", `/api/rulebooks/${mine.id}/export`, { as: s.outsider, params: { id: mine.id } })).status).toBe(404);
    expect((await call(compare.GET, "GET", "/api/rulebooks/compare", { as: s.outsider, query: { from: mine.id, to: mine.id } })).status).toBe(404);
    const before = await tableCounts();
    expect((await call(adopt.POST, "POST", `/api/rulebooks/${mine.id}/adopt`, { as: s.outsider, params: { id: mine.id }, body: {} })).status).toBe(404);
    const save = await call(list.POST, "POST", "/api/rulebooks", { as: s.outsider, body: { basedOn: mine.id, document: demo } });
    expect(save.status).toBe(404);
    expect(await tableCounts()).toEqual(before);
  });
});

describe("GET /api/rulebooks/:id and export", () => {
  it("returns the document to every role; unknown and malformed ids are 404", async () => {
    const v = await latest();
    for (const role of ROLES) {
      const r = await call(one.GET, "GET", `/api/rulebooks/${v.id}`, { as: s.as[role], params: { id: v.id } });
      expect(r.status, role).toBe(200);
      expect(r.body.document.id).toBe(demo.id);
      expect(r.body.inForce).toBe(true);
    }
    expect((await call(one.GET, "GET", "/api/rulebooks/x", { as: s.as.clerk, params: { id: "x" } })).status).toBe(404);
    expect((await call(one.GET, "GET", "/api/rulebooks/00000000-0000-4000-8000-000000000000", { as: s.as.clerk, params: { id: "00000000-0000-4000-8000-000000000000" } })).status).toBe(404);
  });
  it("exports a download that imports back unchanged", async () => {
    const v = await latest();
    const r = await call(exportRoute.GET, "GET", `/api/rulebooks/${v.id}/export`, { as: s.as.observer, params: { id: v.id } });
    expect(r.status).toBe(200);
    expect(r.response.headers.get("content-disposition")).toMatch(/attachment; filename=".+-v1\.json"/);
    expect(r.body).toEqual(demo);
  });
  it("serves a template to any role", async () => {
    const r = await call(template.GET, "GET", "/api/rulebooks/templates/general-parliamentary-law", { as: s.as.member, params: { id: "general-parliamentary-law" } });
    expect(r.status).toBe(200);
    expect(r.body.document.id).toBe("general-parliamentary-law");
    expect((await call(template.GET, "GET", "/api/rulebooks/templates/nope", { as: s.as.member, params: { id: "nope" } })).status).toBe(404);
  });
  it("serves a template under its old id (alias) and lists each template's source and verify-before-use points (issue 14)", async () => {
    const r = await call(template.GET, "GET", "/api/rulebooks/templates/continental-successive", { as: s.as.member, params: { id: "continental-successive" } });
    expect(r.status).toBe(200);
    expect(r.body.id).toBe("continental");
    expect(r.body.aliases).toEqual(["continental-successive"]);
    const lib = (await call(list.GET, "GET", "/api/rulebooks", { as: s.as.member })).body;
    const ep = lib.templates.find((t: { id: string }) => t.id === "continental");
    expect(ep.source.title).toBe("Rules of Procedure of the European Parliament");
    expect(ep.source.date).toMatch(/2019/);
    expect(ep.verify.length).toBeGreaterThan(0);
    expect(lib.templates.map((t: { id: string }) => t.id)).not.toContain("continental-successive");
  });
  it("serves the House template under its former id four-amendment-legislature (issue 14 alias)", async () => {
    const r = await call(template.GET, "GET", "/api/rulebooks/templates/four-amendment-legislature", { as: s.as.member, params: { id: "four-amendment-legislature" } });
    expect(r.status).toBe(200);
    expect([r.body.id, r.body.document.id]).toEqual(["us-house", "us-house"]);
    expect(r.body.aliases).toEqual(["four-amendment-legislature"]);
    expect(r.body.verify.length).toBeGreaterThan(0);
  });
});

describe("POST /api/rulebooks (save a new version)", () => {

  it("rejects a rulebook with an unknown operator, naming the exact path, storing nothing", async () => {
    const v = await latest();
    const bad = structuredClone(demo);
    bad.rules[0].conditions.all[0].operator = "sortOf";
    const before = await tableCounts();
    const r = await call(list.POST, "POST", "/api/rulebooks", { as: s.as.clerk, body: { basedOn: v.id, document: bad } });
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe("invalid-input");
    expect(r.body.error.issues.map((i: { path: string }) => i.path)).toContain("rules.0.conditions.all.0.operator");
    expect(await tableCounts()).toEqual(before);
  });

  it("rejects wrong types with their paths", async () => {
    const v = await latest();
    const bad = structuredClone(demo);
    bad.motions[2].rank = "high";
    bad.voting.procedure = "lottery";
    const before = await tableCounts();
    const r = await call(list.POST, "POST", "/api/rulebooks", { as: s.as["chief-clerk"], body: { basedOn: v.id, document: bad } });
    expect(r.status).toBe(400);
    const paths = r.body.error.issues.map((i: { path: string }) => i.path);
    expect(paths).toEqual(expect.arrayContaining(["motions.2.rank", "voting.procedure"]));
    expect(await tableCounts()).toEqual(before);
  });

  it("saves a new version (never overwriting) and refuses a stale save with what changed", async () => {
    const v1 = await latest();
    const edited = structuredClone(demo);
    const amend = edited.motions.find((m: { id: string }) => m.id === "amend");
    amend.vote = amend.vote === "two-thirds" ? "majority" : "two-thirds";
    const ok = await call(list.POST, "POST", "/api/rulebooks", { as: s.as.clerk, body: { basedOn: v1.id, note: "Amend by two-thirds", document: edited } });
    expect(ok.status).toBe(201);
    expect(ok.body.number).toBe(v1.number + 1);
    const old = await call(one.GET, "GET", `/api/rulebooks/${v1.id}`, { as: s.as.clerk, params: { id: v1.id } });
    expect(old.body.document).toEqual(demo);

    const other = structuredClone(demo);
    other.rules = other.rules.slice(1);
    const before = await tableCounts();
    const stale = await call(list.POST, "POST", "/api/rulebooks", { as: s.as["chief-clerk"], body: { basedOn: v1.id, document: other } });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe("conflict");
    expect(stale.body.error.details.latest.id).toBe(ok.body.id);
    const motions = stale.body.error.details.changes.sections.find((x: { section: string }) => x.section === "motions");
    expect(motions.changes).toEqual([expect.objectContaining({ kind: "changed", id: "amend", fields: [expect.objectContaining({ field: "vote" })] })]);
    // The same in plain words, which the stale-save notice shows the clerk.
    expect(stale.body.error.details.plainChanges).toEqual([expect.objectContaining({ section: "motions", kind: "changed", what: "Amend — vote required" })]);
    expect(await tableCounts()).toEqual(before);
    // A first save needs basedOn null only while the chamber has no version.
    expect((await call(list.POST, "POST", "/api/rulebooks", { as: s.as.clerk, body: { basedOn: null, document: demo } })).status).toBe(409);
  });
});

describe("a version saved before reconsiderable named the result (rulebook format, December 2026 revision)", () => {
  it("is stored as written and loads migrated: true reads as \"both\", false as \"neither\"", async () => {
    const v = await latest();
    const older = structuredClone(demo);
    for (const m of older.motions) m.reconsiderable = m.reconsiderable !== "neither";
    const saved = await call(list.POST, "POST", "/api/rulebooks", { as: s.as.clerk, body: { basedOn: v.id, note: "As saved by an earlier version", document: older } });
    expect(saved.status).toBe(201);
    const stored = await call(one.GET, "GET", `/api/rulebooks/${saved.body.id}`, { as: s.as.clerk, params: { id: saved.body.id } });
    expect(stored.body.document.motions.map((m: { reconsiderable: unknown }) => typeof m.reconsiderable)).toEqual(older.motions.map(() => "boolean"));
    const loaded = await loadRulebook(s.chambers.harrowmere, saved.body.id);
    const byId = Object.fromEntries(loaded.rulebook.motions.map((m) => [m.id, m.reconsiderable]));
    expect(byId.main).toBe("both");
    expect(byId.adjourn).toBe("neither");
  });
});

describe("POST /api/rulebooks/import", () => {
  it("imports a valid file as a new version", async () => {
    const v = await latest();
    const body = JSON.stringify({ ...demo, title: "Harrowmere standing orders (imported)" });
    const r = await call(importRoute.POST, "POST", "/api/rulebooks/import", { as: s.as.clerk, rawBody: upload("standing-orders.json", body, "application/json", { basedOn: v.id }) });
    expect(r.status).toBe(201);
    expect(r.body.title).toBe("Harrowmere standing orders (imported)");
  });

  it("refuses a 5 MB junk upload, a non-JSON file, broken JSON and an unknown operator, storing nothing", async () => {
    const v = await latest();
    const before = await tableCounts();
    const junk = new Uint8Array(5 * 1024 * 1024).map((_, i) => (i * 7919) % 251);
    const big = await call(importRoute.POST, "POST", "/api/rulebooks/import", { as: s.as.clerk, rawBody: upload("junk.json", junk, "application/json", { basedOn: v.id }) });
    expect(big.status).toBe(413);
    expect(big.body.error.code).toBe("too-large");
    const pdf = await call(importRoute.POST, "POST", "/api/rulebooks/import", { as: s.as.clerk, rawBody: upload("rules.pdf", "%PDF-1.4", "application/pdf", { basedOn: v.id }) });
    expect(pdf.status).toBe(400);
    const broken = await call(importRoute.POST, "POST", "/api/rulebooks/import", { as: s.as.clerk, rawBody: upload("broken.json", "{ \"format\": ", "application/json", { basedOn: v.id }) });
    expect(broken.status).toBe(400);
    const bad = structuredClone(demo);
    bad.rules[1].conditions.all[0].operator = "resembles";
    const op = await call(importRoute.POST, "POST", "/api/rulebooks/import", { as: s.as.clerk, rawBody: upload("bad.json", JSON.stringify(bad), "application/json", { basedOn: v.id }) });
    expect(op.status).toBe(400);
    expect(op.body.error.issues.map((i: { path: string }) => i.path)).toContain("rules.1.conditions.all.0.operator");
    const notForm = await call(importRoute.POST, "POST", "/api/rulebooks/import", { as: s.as.clerk, body: demo });
    expect(notForm.status).toBe(400);
    const noFile = new FormData();
    noFile.set("basedOn", v.id);
    expect((await call(importRoute.POST, "POST", "/api/rulebooks/import", { as: s.as.clerk, rawBody: noFile })).status).toBe(400);
    expect(await tableCounts()).toEqual(before);
  });
});

describe("GET /api/rulebooks/compare", () => {
  it("describes the difference by motion, rule and section", async () => {
    const r0 = await call(list.GET, "GET", "/api/rulebooks", { as: s.as.member });
    const [v1, v2] = [...r0.body.versions].sort((a: { number: number }, b: { number: number }) => a.number - b.number);
    const r = await call(compare.GET, "GET", "/api/rulebooks/compare", { as: s.as.member, query: { from: v1.id, to: v2.id } });
    expect(r.status).toBe(200);
    expect(r.body.diff.identical).toBe(false);
    expect(r.body.diff.summary.join(" ")).toMatch(/motions: changed amend \(vote\)/);
    // The same in plain words, with the motion's name, old → new and the citation.
    const amendVote = r.body.changes.find((c: { what: string }) => c.what === "Amend — vote required");
    expect(amendVote).toMatchObject({ section: "motions", kind: "changed" });
    expect(typeof amendVote.citation).toBe("string");
    expect(amendVote.from).not.toBe(amendVote.to);
    const same = await call(compare.GET, "GET", "/api/rulebooks/compare", { as: s.as.member, query: { from: v1.id, to: v1.id } });
    expect(same.body.diff.identical).toBe(true);
    expect(same.body.changes).toEqual([]);
    expect((await call(compare.GET, "GET", "/api/rulebooks/compare", { as: s.as.member, query: { from: "x" } })).status).toBe(400);
  });
});

describe("POST /api/rulebooks/:id/adopt", () => {
  it("lets clerks adopt with an effective date; the latest effective adoption is in force; history kept", async () => {
    const v = await latest();
    const before = await tableCounts();
    expect((await call(adopt.POST, "POST", `/api/rulebooks/${v.id}/adopt`, { as: s.as.clerk, params: { id: v.id }, body: { effectiveFrom: "tomorrow" } })).status).toBe(400);
    expect(await tableCounts()).toEqual(before);

    const future = await call(adopt.POST, "POST", `/api/rulebooks/${v.id}/adopt`, { as: s.as.clerk, params: { id: v.id }, body: { effectiveFrom: "2999-01-01" } });
    expect(future.status).toBe(201);
    expect(future.body.inForce).toBe(false);
    const now = await call(adopt.POST, "POST", `/api/rulebooks/${v.id}/adopt`, { as: s.as["chief-clerk"], params: { id: v.id }, body: { note: "Adopted today" } });
    expect(now.status).toBe(201);
    expect(now.body.inForce).toBe(true);
    const r = await call(list.GET, "GET", "/api/rulebooks", { as: s.as.observer });
    expect(r.body.inForce.versionId).toBe(v.id);
    expect(r.body.adoptions.length).toBe(3);
  });

  it("an adoption with effect from today supersedes one made earlier today with effect from its moment", async () => {
    const v = await latest();
    const first = await call(adopt.POST, "POST", `/api/rulebooks/${v.id}/adopt`, { as: s.as.clerk, params: { id: v.id }, body: { note: "With effect now" } });
    expect(first.body.inForce).toBe(true);
    const doc = (await call(one.GET, "GET", `/api/rulebooks/${v.id}`, { as: s.as.clerk, params: { id: v.id } })).body.document;
    const next = await call(list.POST, "POST", "/api/rulebooks", { as: s.as.clerk, body: { basedOn: v.id, note: "Retitled", document: { ...doc, title: `${doc.title} (retitled)` } } });
    expect(next.status).toBe(201);
    const [{ time_zone: timeZone }] = await sql`SELECT time_zone FROM organization WHERE id = ${s.chambers.harrowmere}`;
    const chamberToday = new Intl.DateTimeFormat("en-CA", { timeZone, year: "numeric", month: "2-digit", day: "2-digit" }).format(new Date());
    const today = await call(adopt.POST, "POST", `/api/rulebooks/${next.body.id}/adopt`, { as: s.as.clerk, params: { id: next.body.id }, body: { effectiveFrom: chamberToday, note: "With effect from today" } });
    expect(today.status).toBe(201);
    expect(today.body.inForce).toBe(true);
    expect((await call(list.GET, "GET", "/api/rulebooks", { as: s.as.member })).body.inForce.versionId).toBe(next.body.id);
  });
});

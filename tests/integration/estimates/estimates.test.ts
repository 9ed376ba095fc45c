// Preference estimates through the API: create, list, read, save versions (optimistic concurrency),
// duplicate, share, CSV template and upload (row-precise errors, nothing stored on error).
// Roles, anonymous and the other chamber for every route. The behaviour checked is the product's
// own contract (common practice, no source).
import { beforeAll, describe, expect, it } from "vitest";
import * as list from "../../../src/pages/api/estimates/index.ts";
import * as one from "../../../src/pages/api/estimates/[id].ts";
import * as versions from "../../../src/pages/api/estimates/[id]/versions.ts";
import * as duplicate from "../../../src/pages/api/estimates/[id]/duplicate.ts";
import * as sharing from "../../../src/pages/api/estimates/[id]/sharing.ts";
import * as importRoute from "../../../src/pages/api/estimates/import.ts";
import * as template from "../../../src/pages/api/estimates/template.ts";
import * as versionList from "../../../src/pages/api/estimates/versions.ts";
import * as filing from "../../../src/pages/api/measures/[id]/amendments.ts";
import { seedMeasures } from "../../../src/lib/server/seed/measures.ts";
import { seedEstimates } from "../../../src/lib/server/seed/estimates.ts";
import { call } from "../../support/app.ts";
import { tableCounts } from "../../support/db.ts";
import { seedChambers, type Seeded } from "../../support/fixtures.ts";

const ROLES = ["chief-clerk", "clerk", "member", "staff", "observer"] as const;
const CREATORS = new Set(["chief-clerk", "clerk", "member", "staff"]);
const SCOPE = ["A1", "A2", "A7"];
const V = ["Q", "measure", "measure+A1", "measure+A7", "measure+A1+A2"];

let s: Seeded;
let measureId: string;
let seeded: { ballotsId: string; spatialId: string };

const content = (rows = [{ member: "Moorland Union", bloc: "Moorland Union", weight: 14, ranking: V }]) => ({ kind: "ballots" as const, partial: "abstain" as const, rows });
const create = (as: keyof Seeded["as"], extra: Record<string, unknown> = {}) => call(list.POST, "POST", "/api/estimates", { as: s.as[as], body: { measureId, title: `Estimate by ${as}`, scope: SCOPE, content: content(), ...extra } });
const csv = (text: string | Uint8Array<ArrayBuffer>, query: Record<string, string>, as = s.as.clerk) => call(importRoute.POST, "POST", "/api/estimates/import", { as, rawBody: text, headers: { "content-type": "text/csv" }, query: { measureId, scope: SCOPE.join(","), ...query } });

beforeAll(async () => {
  s = await seedChambers();
  measureId = (await seedMeasures())!.measureId;
  seeded = (await seedEstimates())!;
});

describe("create and read", () => {
  it("refuses bad input (400, 422) without storing anything (roles and anonymous: tests/access)", async () => {
    const before = await tableCounts();
    expect((await create("clerk", { title: "" })).status).toBe(400);
    expect((await create("clerk", { scope: ["A99"] })).status).toBe(422);
    expect((await create("clerk", { content: content([{ member: "x", bloc: "", weight: 1, ranking: ["B+Z"] }]) })).status).toBe(422);
    expect((await create("clerk", { content: content([{ member: "x", bloc: "", weight: 1, ranking: ["Q", "Q"] }]) })).status).toBe(400);
    expect(await tableCounts()).toEqual(before);
  });

  it("lets each role that may create estimates create one; the other chamber cannot see the measure", async () => {
    for (const r of ROLES.filter((x) => CREATORS.has(x))) {
      const res = await create(r);
      expect(res.status, r).toBe(201);
    }
    const out = await call(list.POST, "POST", "/api/estimates", { as: s.outsider, body: { measureId, title: "x", scope: [], content: content([{ member: "x", bloc: "", weight: 1, ranking: ["Q"] }]) } });
    expect(out.status).toBe(404);
  });

  it("keeps a private estimate invisible to other people of the chamber, even the chief clerk", async () => {
    const mine = (await create("member", { title: "Member's private count" })).body.id as string;
    expect((await call(one.GET, "GET", `/api/estimates/${mine}`, { as: s.as.member, params: { id: mine } })).status).toBe(200);
    for (const r of ["chief-clerk", "clerk", "staff", "observer"] as const) {
      expect((await call(one.GET, "GET", `/api/estimates/${mine}`, { as: s.as[r], params: { id: mine } })).status, r).toBe(404);
      const listed = (await call(list.GET, "GET", "/api/estimates", { as: s.as[r] })).body.estimates as Array<{ id: string }>;
      expect(listed.some((e) => e.id === mine), r).toBe(false);
    }
    expect((await call(one.GET, "GET", `/api/estimates/${mine}`, { as: s.outsider, params: { id: mine } })).status).toBe(404);
  });

  it("shows the seeded estimate, shared with the chamber, to every role but not to the other chamber", async () => {
    for (const r of ROLES) expect((await call(one.GET, "GET", "/x", { as: s.as[r], params: { id: seeded.ballotsId } })).status, r).toBe(200);
    expect((await call(one.GET, "GET", "/x", { as: s.outsider, params: { id: seeded.ballotsId } })).status).toBe(404);
    const body = (await call(one.GET, "GET", "/x", { as: s.as.observer, params: { id: seeded.ballotsId } })).body;
    expect(body.versions.map((v: { id: string }) => v.id)).toEqual(V);
    expect(body.canEdit).toBe(false);
    expect(body.canDuplicate).toBe(false);
  });
});

describe("versions, duplicates and sharing", () => {
  it("saves new versions, never overwriting, and refuses a stale save with 409", async () => {
    const id = (await create("staff", { title: "Staff what-if" })).body.id as string;
    const save = (basedOn: number, as = s.as.staff) => call(versions.POST, "POST", "/x", { as, params: { id }, body: { basedOn, scope: SCOPE, content: content([{ member: "All", bloc: "", weight: 40, ranking: ["measure", "Q"] }]) } });
    expect((await save(1)).body.version).toBe(2);
    const before = await tableCounts();
    expect((await save(1)).status).toBe(409);
    expect(await tableCounts()).toEqual(before);
    const v1 = (await call(one.GET, "GET", "/x", { as: s.as.staff, params: { id }, query: { version: "1" } })).body;
    expect(v1.version.content.rows[0].weight).toBe(14);
    expect(v1.history.map((h: { number: number }) => h.number)).toEqual([2, 1]);
    // Only the author saves; others (even when it is shared) get 403 or 404.
    expect((await save(2, s.as.clerk)).status).toBe(404);
    await call(sharing.PUT, "PUT", "/x", { as: s.as.staff, params: { id }, body: { sharedRoles: ["clerk"], sharedUsers: [] } });
    expect((await save(2, s.as.clerk)).status).toBe(403);
    expect((await save(2, s.as.observer)).status).toBe(403);
  });

  it("shares with named people of the chamber only, and only by the author", async () => {
    const id = (await create("member", { title: "To share" })).body.id as string;
    const staffId = s.as.staff.userId;
    expect((await call(sharing.PUT, "PUT", "/x", { as: s.as.member, params: { id }, body: { sharedRoles: [], sharedUsers: [s.outsider.userId] } })).status).toBe(422);
    expect((await call(sharing.PUT, "PUT", "/x", { as: s.as.member, params: { id }, body: { sharedRoles: [], sharedUsers: [staffId] } })).status).toBe(200);
    expect((await call(one.GET, "GET", "/x", { as: s.as.staff, params: { id } })).status).toBe(200);
    expect((await call(one.GET, "GET", "/x", { as: s.as.clerk, params: { id } })).status).toBe(404);
    expect((await call(sharing.PUT, "PUT", "/x", { as: s.as.staff, params: { id }, body: { sharedRoles: ["observer"], sharedUsers: [] } })).status).toBe(403);
  });

  it("duplicates a visible estimate into a private copy of the duplicator", async () => {
    const res = await call(duplicate.POST, "POST", "/x", { as: s.as.member, params: { id: seeded.ballotsId }, body: { title: "My variant" } });
    expect(res.status).toBe(201);
    const copy = (await call(one.GET, "GET", "/x", { as: s.as.member, params: { id: res.body.id } })).body;
    expect(copy.estimate.private).toBe(true);
    expect(copy.version.content.rows).toHaveLength(40);
    expect((await call(one.GET, "GET", "/x", { as: s.as.clerk, params: { id: res.body.id } })).status).toBe(404);
  });
});

describe("CSV template and upload", () => {
  it("offers a template whose header and versions round-trip through the upload preview", async () => {
    const t = await call(template.GET, "GET", "/x", { as: s.as.clerk, query: { measureId, scope: SCOPE.join(",") } });
    expect(t.status).toBe(200);
    expect(t.response.headers.get("content-type")).toMatch(/text\/csv/);
    const text = t.body as string;
    expect(text.split("\r\n")[0]).toBe("member,bloc,weight,ranking");
    const p = await csv(text, { preview: "1" });
    expect(p.status).toBe(200);
    expect(p.body.content.rows.map((r: { member: string }) => r.member).sort()).toEqual(["Civic Reform", "Harbour Progressives", "Independents", "Moorland Union"]);
    expect(p.body.content.rows.reduce((a: number, r: { weight: number }) => a + r.weight, 0)).toBe(40);
    expect((await call(template.GET, "GET", "/x", { as: s.outsider, query: { measureId } })).status).toBe(404);
  });

  it("lists the versions of a scope for the editor", async () => {
    const r = await call(versionList.GET, "GET", "/x", { as: s.as.observer, query: { measureId, scope: "A1,A7" } });
    expect(r.body.versions.map((v: { id: string }) => v.id)).toEqual(["Q", "measure", "measure+A1", "measure+A7"]);
  });

  it("creates an estimate from a good upload, and nothing from a bad one", async () => {
    const good = "member,bloc,weight,ranking\nMoorland Union,MU,14,measure+A1 > measure+A7 = Q\nCivic Reform,CR,9,measure > Q\n";
    const ok = await csv(good, { title: "Uploaded" });
    expect(ok.status).toBe(201);
    const body = (await call(one.GET, "GET", "/x", { as: s.as.clerk, params: { id: ok.body.id } })).body;
    expect(body.version.content.rows[0].ranking).toEqual(["measure+A1", ["measure+A7", "Q"]]);

    const before = await tableCounts();
    const cases: Array<[string, string | Uint8Array<ArrayBuffer>, string]> = [
      ["wrong columns", "name,ranking\nA,Q\n", "header"],
      ["unknown version", "member,weight,ranking\na,1,Q\nb,1,Q\nc,1,Q\nd,1,Q\ne,1,Q\nf,1,measure+Z > Q\n", "rows.7.ranking"],
      ["bad weight", "member,weight,ranking\na,x,Q\n", "rows.2.weight"],
      ["bad encoding", new Uint8Array([0x6d, 0x65, 0x6d, 0x62, 0x65, 0x72, 0x2c, 0x72, 0x61, 0x6e, 0x6b, 0x69, 0x6e, 0x67, 0x0a, 0xe9, 0x2c, 0x51, 0x0a]), "file"],
      ["empty", "", "file"],
    ];
    for (const [what, body, path] of cases) {
      const r = await csv(body, { title: "Bad" });
      expect(r.status, what).toBe(400);
      expect(r.body.error.code, what).toBe("invalid-input");
      expect(r.body.error.issues[0].path, what).toBe(path);
    }
    expect((await csv(good, { title: "x" }, s.outsider)).status).toBe(404);
    expect((await call(importRoute.POST, "POST", "/x", { as: s.as.clerk, rawBody: good, headers: { "content-type": "application/json" }, query: { measureId, title: "x" } })).status).toBe(400);
    expect(await tableCounts()).toEqual(before);
  });

  it("uploads ideal points for a spatial estimate", async () => {
    const r = await csv("member,bloc,weight,cost,reach\nA,X,3,1.5,-2\nB,Y,2,4,0\n", { kind: "spatial", dimensions: "Cost,Reach", title: "Spatial upload" });
    expect(r.status).toBe(201);
    const bad = await csv("member,bloc,weight,cost,reach\nA,X,3,1,5,-2\n", { kind: "spatial", dimensions: "Cost,Reach", title: "x" });
    expect(bad.status).toBe(400);
    const bad2 = await csv("member,cost,reach\nA,1,two\n", { kind: "spatial", dimensions: "Cost,Reach", title: "x" });
    expect(bad2.body.error.issues[0].path).toBe("rows.2.reach");
  });
});

describe("a draft in the scope", () => {
  it("reads as “Draft”, never as its internal key, in the editor's list and in the versions' names", async () => {
    const made = await call(filing.POST, "POST", `/api/measures/${measureId}/amendments`, { as: s.as.clerk, params: { id: measureId }, body: { draft: true, form: "insert", target: "s1", sponsors: [], subjects: ["lighting"], text: "Lamps at every bollard.", title: "Bollard lamps" } });
    expect(made.status).toBe(201);
    const offered = await call(versionList.GET, "GET", "/x", { as: s.as.clerk, query: { measureId, scope: "A1" } });
    const draft = offered.body.pending.find((p: { title: string | null }) => p.title === "Bollard lamps");
    expect(draft.label).toBe("Draft");
    expect(draft.key).not.toBe("Draft");
    const r = await call(versionList.GET, "GET", "/x", { as: s.as.clerk, query: { measureId, scope: `A1,${draft.key}` } });
    expect(r.status).toBe(200);
    const withDraft = r.body.versions.find((v: { amendments: string[] }) => v.amendments.includes(draft.key) && v.amendments.length === 1);
    expect(withDraft.short).toBe("HCA 12 + Draft");
    expect(withDraft.words).toBe("HCA 12 as amended by Draft (Bollard lamps)");
    expect(JSON.stringify(r.body.versions)).not.toContain(`+ ${draft.key}`);
  });
});

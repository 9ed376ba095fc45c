// What the estimate page's editors send: ballots edited in the table (ties, blanks) saved as a new
// version; a spatial estimate's dimensions (names and ranges) and positions (status quo, measure,
// amendments' effects) saved as a new version; a CSV uploaded as a new version of an existing
// estimate; the roster template per bloc that "start from the roster" imports. The author only, and
// not the other chamber, for each (roles and anonymous: the route-inventory suite in tests/access,
// decision 0006). Product contract (common practice, no source).
import { beforeAll, describe, expect, it } from "vitest";
import * as list from "../../../src/pages/api/estimates/index.ts";
import * as one from "../../../src/pages/api/estimates/[id].ts";
import * as versions from "../../../src/pages/api/estimates/[id]/versions.ts";
import * as importRoute from "../../../src/pages/api/estimates/import.ts";
import * as template from "../../../src/pages/api/estimates/template.ts";
import { seedMeasures } from "../../../src/lib/server/seed/measures.ts";
import { parseIdealCsv } from "../../../src/lib/estimates/ideal-csv.ts";
import { addDimension, removeDimension } from "../../../src/lib/estimates/dimension-edits.ts";
import { call } from "../../support/app.ts";
import { tableCounts } from "../../support/db.ts";
import { seedChambers, type Seeded } from "../../support/fixtures.ts";

const SCOPE = ["A1", "A2", "A7"];
const V = ["Q", "measure", "measure+A1", "measure+A7", "measure+A1+A2"];
let s: Seeded;
let measureId: string;

const spatial = (extra: Record<string, unknown> = {}) => ({ kind: "spatial" as const, dimensions: ["Lighting", "Cost"], statusQuo: [0, 0], measure: [5, 5], effects: {}, members: [{ member: "North", bloc: "North", weight: 3, ideal: [1, 2] }, { member: "South", bloc: "South", weight: 2, ideal: [6, 6] }], ...extra });
const ballots = (rows: unknown[]) => ({ kind: "ballots" as const, partial: "abstain" as const, rows });
async function create(title: string, content: unknown, as = s.as.member) {
  const r = await call(list.POST, "POST", "/api/estimates", { as, body: { measureId, title, scope: SCOPE, content } });
  expect(r.status).toBe(201);
  return (r.body as { id: string }).id;
}
const save = (id: string, body: Record<string, unknown>, as = s.as.member) => call(versions.POST, "POST", "/x", { as, params: { id }, body: { scope: SCOPE, ...body } });
const read = async (id: string, as = s.as.member) => (await call(one.GET, "GET", "/x", { as, params: { id } })).body as { estimate: { latestVersion: number }; version: { number: number; content: Record<string, unknown> } };

beforeAll(async () => {
  s = await seedChambers();
  measureId = (await seedMeasures())!.measureId;
});

describe("ballots edited in the table", () => {
  it("saves tied and partly ranked rows as the next version; refuses a stale base, other people and bad rankings", async () => {
    const id = await create("Table ballots", ballots([{ member: "North", bloc: "North", weight: 14, ranking: V }]));
    const rows = [
      { member: "North", bloc: "North", weight: 14, ranking: [["measure+A1", "measure+A7"], "Q"] },
      { member: "Ms Fenwick", bloc: "Independents", weight: 1, ranking: ["measure"] },
    ];
    const before = await tableCounts();
    expect((await save(id, { basedOn: 1, content: ballots(rows) }, s.as.clerk)).status).toBe(404); // private to its author
    expect((await save(id, { basedOn: 1, content: ballots(rows) }, s.outsider)).status).toBe(404);
    expect((await save(id, { basedOn: 1, content: ballots([{ member: "x", bloc: "", weight: 1, ranking: [["Q", "measure"], "Q"] }]) })).status).toBe(400);
    expect(await tableCounts()).toEqual(before);

    const ok = await save(id, { basedOn: 1, content: ballots(rows), note: "Ballots edited in the table" });
    expect(ok.status).toBe(201);
    expect((ok.body as { version: number }).version).toBe(2);
    const v = await read(id);
    expect(v.version.content.rows).toEqual(rows);
    expect((await save(id, { basedOn: 1, content: ballots(rows) })).status).toBe(409);
  });
});

describe("spatial dimensions and positions", () => {
  it("saves renamed dimensions, their ranges, the status quo, the measure and amendments' effects as a new version", async () => {
    const id = await create("Spatial edit", spatial());
    const edited = spatial({ dimensions: ["Lighting standard", "Spending"], ranges: [[0, 10], [-5, 5]], statusQuo: [1, 1], measure: [4, 3], effects: { A1: { position: [7, 2] }, A7: { shift: [0, -1] } } });
    const ok = await save(id, { basedOn: 1, content: edited });
    expect(ok.status).toBe(201);
    const v = await read(id);
    expect(v.version.number).toBe(2);
    expect(v.version.content).toMatchObject({ dimensions: ["Lighting standard", "Spending"], ranges: [[0, 10], [-5, 5]], statusQuo: [1, 1], measure: [4, 3], effects: { A1: { position: [7, 2] }, A7: { shift: [0, -1] } } });
  });

  it("refuses ranges that do not match the dimensions or run backwards, dimensions named twice or not at all, and effects of amendments outside the scope", async () => {
    const id = await create("Spatial bad", spatial());
    const before = await tableCounts();
    const one = await save(id, { basedOn: 1, content: spatial({ ranges: [[0, 10]] }) });
    expect(one.status).toBe(400);
    expect((one.body as { error: { issues: Array<{ path: string }> } }).error.issues[0].path).toBe("content.ranges");
    expect((await save(id, { basedOn: 1, content: spatial({ ranges: [[0, 10], [5, 5]] }) })).status).toBe(400);
    expect((await save(id, { basedOn: 1, content: spatial({ effects: { A3: { position: [1, 1] } } }) })).status).toBe(422);
    expect((await save(id, { basedOn: 1, content: spatial({ statusQuo: [1] }) })).status).toBe(400);
    const twice = await save(id, { basedOn: 1, content: spatial({ dimensions: ["Cost", "cost"] }) });
    expect(twice.status).toBe(400);
    expect((twice.body as { error: { issues: Array<{ path: string }> } }).error.issues[0].path).toBe("content.dimensions.1");
    expect((await save(id, { basedOn: 1, content: spatial({ dimensions: ["Cost", ""] }) })).status).toBe(400);
    expect(await tableCounts()).toEqual(before);
  });

  it("a dimension added on the page, then removed, saves as two new versions; more than the engine accepts, a stale base and the other chamber are refused", async () => {
    const id = await create("Spatial dimensions", spatial({ ranges: [[0, 10], [-5, 5]], effects: { A1: { position: [7, 2] }, A7: { shift: [0, -1] } } }));
    const v1 = (await read(id)).version.content as Parameters<typeof addDimension>[0];
    const added = addDimension(v1, "Harbour access");
    const before = await tableCounts();
    expect((await save(id, { basedOn: 1, content: added }, s.outsider)).status).toBe(404);
    let nine = added;
    for (let i = 3; i < 8; i++) nine = addDimension(nine, `D${i}`);
    expect((await save(id, { basedOn: 1, content: { ...nine, dimensions: [...nine.dimensions, "D8"], statusQuo: [...nine.statusQuo, 0] } })).status).toBe(400);
    expect(await tableCounts()).toEqual(before);

    expect((await save(id, { basedOn: 1, content: added, note: "Dimensions and positions edited" })).status).toBe(201);
    const v2 = await read(id);
    expect(v2.version.content).toMatchObject({ dimensions: ["Lighting", "Cost", "Harbour access"], ranges: [[0, 10], [-5, 5], [0, 10]], statusQuo: [0, 0, 0], effects: { A1: { position: [7, 2, 0] }, A7: { shift: [0, -1, 0] } } });
    // A second tab still on version 1 is told the estimate moved on.
    expect((await save(id, { basedOn: 1, content: removeDimension(added, 0) })).status).toBe(409);

    const removed = removeDimension(v2.version.content as Parameters<typeof addDimension>[0], 0);
    expect((await save(id, { basedOn: 2, content: removed })).status).toBe(201);
    const v3 = await read(id);
    expect(v3.version.number).toBe(3);
    expect(v3.version.content).toMatchObject({ dimensions: ["Cost", "Harbour access"], ranges: [[-5, 5], [0, 10]], measure: [5, 0], members: [{ ideal: [2, 0] }, { ideal: [6, 0] }], effects: { A1: { position: [2, 0] }, A7: { shift: [-1, 0] } } });
  });
});

describe("a CSV uploaded as a new version", () => {
  const upload = (query: Record<string, string>, text: string, as = s.as.member) => call(importRoute.POST, "POST", "/x", { as, rawBody: text, headers: { "content-type": "text/csv" }, query: { scope: SCOPE.join(","), ...query } });

  it("adds a version to the author's ballots estimate; others are refused and a bad file stores nothing", async () => {
    const id = await create("CSV versions", ballots([{ member: "North", bloc: "North", weight: 14, ranking: V }]));
    const good = "member,bloc,weight,ranking\nNorth,North,14,measure > Q\nSouth,South,12,Q > measure = measure+A1\n";
    const before = await tableCounts();
    expect((await upload({ estimateId: id, basedOn: "1" }, good, s.as.clerk)).status).toBe(404);
    expect((await upload({ estimateId: id, basedOn: "1" }, good, s.outsider)).status).toBe(404);
    const bad = await upload({ estimateId: id, basedOn: "1" }, "member,bloc,weight,ranking\nNorth,North,14,measure > Z\n");
    expect(bad.status).toBe(400);
    expect((bad.body as { error: { issues: Array<{ path: string }> } }).error.issues[0].path).toBe("rows.2.ranking");
    expect(await tableCounts()).toEqual(before);

    const ok = await upload({ estimateId: id, basedOn: "1" }, good);
    expect(ok.status).toBe(201);
    expect((ok.body as { version: number }).version).toBe(2);
    expect(((await read(id)).version.content.rows as unknown[]).length).toBe(2);
    expect((await upload({ estimateId: id, basedOn: "1" }, good)).status).toBe(409);
  });

  it("keeps a spatial estimate's ranges and positions when new ideal points are uploaded", async () => {
    const id = await create("CSV spatial", spatial({ ranges: [[0, 10], [0, 10]], statusQuo: [2, 2], measure: [6, 6] }));
    const ok = await upload({ estimateId: id, basedOn: "1", kind: "spatial", dimensions: "Lighting,Cost" }, "member,bloc,weight,lighting,cost\nNorth,North,3,9,9\n");
    expect(ok.status).toBe(201);
    expect((await read(id)).version.content).toMatchObject({ ranges: [[0, 10], [0, 10]], statusQuo: [2, 2], measure: [6, 6], members: [{ member: "North", ideal: [9, 9] }] });
  });
});

describe("the roster template per bloc", () => {
  it("gives one ideal point per bloc, weighted by its size and spread apart, that uploads back", async () => {
    const t = await call(template.GET, "GET", "/x", { as: s.as.member, query: { measureId, scope: SCOPE.join(","), kind: "spatial", dimensions: "Lighting,Cost", per: "bloc" } });
    expect(t.status).toBe(200);
    const rows = parseIdealCsv(t.body as string, ["Lighting", "Cost"]);
    expect(rows.reduce((a, r) => a + r.weight, 0)).toBe(40); // the demo roster (DOMAIN: 40 legislators in four blocs)
    expect(rows).toHaveLength(4);
    expect(new Set(rows.map((r) => r.ideal.join(","))).size).toBe(4);
    const perMember = await call(template.GET, "GET", "/x", { as: s.as.member, query: { measureId, kind: "spatial", dimensions: "Lighting,Cost", per: "member" } });
    expect(parseIdealCsv(perMember.body as string, ["Lighting", "Cost"])).toHaveLength(40);
    expect((await call(template.GET, "GET", "/x", { as: s.outsider, query: { measureId, kind: "spatial", dimensions: "a,b" } })).status).toBe(404);
  });
});

// Archiving a measure filed by mistake: clerks only (other roles and anonymous: tests/access),
// the measure leaves the lists and the forms that offer measures, stays readable, and every
// change to it or its amendments answers 409 "archived" with nothing written. Common practice, no source.
import { beforeAll, describe, expect, it } from "vitest";
import * as measuresRoute from "../../../src/pages/api/measures/index.ts";
import * as measureOne from "../../../src/pages/api/measures/[id]/index.ts";
import * as archiveRoute from "../../../src/pages/api/measures/[id]/archive.ts";
import * as filing from "../../../src/pages/api/measures/[id]/amendments.ts";
import * as amendment from "../../../src/pages/api/amendments/[id]/index.ts";
import * as fileDraft from "../../../src/pages/api/amendments/[id]/file.ts";
import * as treeRoute from "../../../src/pages/api/measures/[id]/tree.ts";
import * as estimateOptions from "../../../src/pages/api/estimates/options.ts";
import * as rulingOptions from "../../../src/pages/api/rulings/options.ts";
import { call } from "../../support/app.ts";
import { tableCounts } from "../../support/db.ts";
import { seedChambers, type Seeded } from "../../support/fixtures.ts";
import { legislatorIds } from "./helpers.ts";

let s: Seeded;
let L: string[];

beforeAll(async () => {
  s = await seedChambers();
  L = await legislatorIds(s.chambers.harrowmere);
});

async function newMeasure(number: string) {
  const r = await call(measuresRoute.POST, "POST", "/api/measures", { as: s.as.clerk, body: { number, title: `Measure ${number}`, subjects: ["harbour"], text: "## Section 1\nSubjects: lighting\nOne.\nTwo." } });
  expect(r.status).toBe(201);
  return r.body as { id: string; version: number };
}

describe("archiving a measure", () => {
  it("takes it out of the lists and option forms, keeps it readable, and refuses every change with 409 archived", async () => {
    const m = await newMeasure("HCA 300");
    const filed = await call(filing.POST, "POST", "/x", { as: s.as.member, params: { id: m.id }, body: { form: "insert", target: "s1", sponsors: [L[0]], subjects: ["lighting"], text: "Add a line." } });
    const draft = await call(filing.POST, "POST", "/x", { as: s.as.member, params: { id: m.id }, body: { form: "insert", target: "s1", text: "A draft.", draft: true } });
    // A stale version is refused like any other write.
    expect((await call(archiveRoute.POST, "POST", "/x", { as: s.as.clerk, params: { id: m.id }, body: { version: m.version + 5 } })).status).toBe(409);
    const out = await call(archiveRoute.POST, "POST", "/x", { as: s.as.clerk, params: { id: m.id }, body: { version: m.version } });
    expect(out.status).toBe(200);
    expect(out.body.archivedAt).toBeTruthy();

    const list = await call(measuresRoute.GET, "GET", "/api/measures", { as: s.as.member });
    expect(list.body.measures.map((x: { number: string }) => x.number)).not.toContain("HCA 300");
    expect((await call(estimateOptions.GET, "GET", "/x", { as: s.as.member })).body.measures.map((x: { id: string }) => x.id)).not.toContain(m.id);
    expect((await call(rulingOptions.GET, "GET", "/x", { as: s.as.clerk })).body.measures.map((x: { id: string }) => x.id)).not.toContain(m.id);
    // Still readable, with its tree.
    expect((await call(measureOne.GET, "GET", "/x", { as: s.as.observer, params: { id: m.id } })).status).toBe(200);
    expect((await call(treeRoute.GET, "GET", "/x", { as: s.as.observer, params: { id: m.id } })).status).toBe(200);

    const before = await tableCounts();
    const refusals = [
      await call(measureOne.PATCH, "PATCH", "/x", { as: s.as.clerk, params: { id: m.id }, body: { version: out.body.version, title: "Renamed" } }),
      await call(archiveRoute.POST, "POST", "/x", { as: s.as.clerk, params: { id: m.id }, body: { version: out.body.version } }),
      await call(filing.POST, "POST", "/x", { as: s.as.member, params: { id: m.id }, body: { form: "insert", target: "s1", text: "Another." } }),
      await call(amendment.PATCH, "PATCH", "/x", { as: s.as.member, params: { id: filed.body.id }, body: { version: filed.body.version, status: "withdrawn" } }),
      await call(fileDraft.POST, "POST", "/x", { as: s.as.member, params: { id: draft.body.id }, body: { version: draft.body.version } }),
    ];
    for (const r of refusals) {
      expect(r.status).toBe(409);
      expect(r.body.error.code).toBe("archived");
    }
    expect(await tableCounts()).toEqual(before);
  });

  it("keeps the other chamber out (404, nothing written)", async () => {
    const m = await newMeasure("HCA 301");
    const before = await tableCounts();
    expect((await call(archiveRoute.POST, "POST", "/x", { as: s.outsider, params: { id: m.id }, body: { version: m.version } })).status).toBe(404);
    expect(await tableCounts()).toEqual(before);
  });
});

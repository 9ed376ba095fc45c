// The journal of a sitting (issue 19 item 2): generated from the floor record, approved as a
// record, then never edited — changed only by a correction entry with its reason — and
// downloadable as PDF and DOCX (checked by parsing the files), searchable with the precedents.
// What a journal holds: "what is done, and not what is said" (paraphrase of Robert's Rules of
// Order Revised, 1915, §59 "Minutes"): motions and their movers, questions put with their
// results and counts, recorded votes by name.
import { beforeAll, beforeEach, describe, expect, it } from "vitest";
import JSZip from "jszip";
import { PDFParse } from "pdf-parse";
import type { APIContext, APIRoute } from "astro";
import * as sittingsRoute from "../../../src/pages/api/floor/sittings/index.ts";
import * as eventsRoute from "../../../src/pages/api/floor/sittings/[id]/events.ts";
import * as journalRoute from "../../../src/pages/api/floor/sittings/[id]/journal/index.ts";
import * as correctionsRoute from "../../../src/pages/api/floor/sittings/[id]/journal/corrections.ts";
import * as rulingsRoute from "../../../src/pages/api/rulings/index.ts";
import * as rosterRoute from "../../../src/pages/api/measures/sponsors.ts";
import { seedRulebooks } from "../../../src/lib/server/seed/rulebooks.ts";
import { loadContext } from "../../../src/lib/server/context.ts";
import { BASE, call, type Session } from "../../support/app.ts";
import { tableCounts } from "../../support/db.ts";
import { seedChambers, type Seeded } from "../../support/fixtures.ts";

let s: Seeded;
let id: string;
let revision: number;
let members: Array<{ id: string; name: string }>;

const rec = (event: unknown) => call(eventsRoute.POST, "POST", `/api/floor/sittings/${id}/events`, { as: s.as.clerk, params: { id }, body: { revision, event } });
async function ok(event: unknown) {
  const r = await rec(event);
  expect(r.status, JSON.stringify(r.body)).toBe(201);
  revision = r.body.revision;
  return r.body;
}
async function move(motion: string, ref: string, text: string, mover = "") {
  await ok({ kind: "made", motion, ref, text, mover });
  await ok({ kind: "seconded" });
  await ok({ kind: "stated" });
}
const journal = async (as: Session = s.as.member) => (await call(journalRoute.GET, "GET", `/api/floor/sittings/${id}/journal`, { as, params: { id } })).body;

/** A download as bytes (the shared `call` reads bodies as text). */
async function download(format: string) {
  const url = new URL(`/api/floor/sittings/${id}/journal?format=${format}`, BASE);
  const headers = new Headers({ origin: BASE, cookie: s.as.member.cookie });
  const locals = { ...(await loadContext(headers)), requestId: "test" } as App.Locals;
  const response = await (journalRoute.GET as APIRoute)({ request: new Request(url, { headers }), url, params: { id }, locals } as unknown as APIContext);
  return { status: response.status, type: response.headers.get("content-type"), disposition: response.headers.get("content-disposition"), bytes: Buffer.from(await response.arrayBuffer()) };
}

beforeAll(async () => {
  s = await seedChambers();
  await seedRulebooks();
  members = (await call(rosterRoute.GET, "GET", "/api/measures/sponsors", { as: s.as.clerk })).body.legislators;
  expect(members.length).toBe(40);
});

beforeEach(async () => {
  const r = await call(sittingsRoute.POST, "POST", "/api/floor/sittings", { as: s.as.clerk, body: { title: `Sitting of the Quillbrook Assembly ${Date.now()}` } });
  id = r.body.id;
  revision = 0;
  await move("main", "M1", "That the Assembly approve the Quillbrook Ferry Ordinance", "Ms Arden");
  await move("amend", "A1", "Insert 'and its landing stages'", "Mr Bellweather");
});

describe("the journal of a sitting", () => {
  it("is generated from the record: motions with movers, questions put in order with counts, the recorded vote by name, corrections shown as corrections", async () => {
    // A1: a recorded vote, 21 yea, 12 nay, 3 present; the other 4 did not vote.
    const roll = members.slice(0, 36).map((m, i) => ({ member: m.id, position: i < 21 ? "yea" : i < 33 ? "nay" : "present" }));
    await ok({ kind: "voted", result: "adopted", method: "recorded", roll, demandedBy: 8 });
    await ok({ kind: "voted", result: "adopted", method: "division", tally: { yes: 30, no: 5, abstain: 0 } });
    const wrongVote = revision;
    await ok({ kind: "strike", entry: wrongVote, reason: "The count was misheard: 25 to 10.", replacement: { kind: "voted", result: "adopted", method: "division", tally: { yes: 25, no: 10, abstain: 0 } } });
    const j = (await journal()).draft;
    expect(j.questionsPut).toBe(2);
    const texts = j.items.map((i: { text: string }) => i.text);
    expect(texts[0]).toBe("Ms Arden moved: Main motion M1 — “That the Assembly approve the Quillbrook Ferry Ordinance”.");
    expect(texts[1]).toBe("Mr Bellweather moved: Amendment A1 to Main motion M1 — “Insert 'and its landing stages'”.");
    const a1 = j.items[2];
    expect(a1.question).toMatchObject({ number: 1, result: "adopted", count: "on a recorded vote, yeas 21, nays 12, 3 present" });
    expect(a1.roll.yea).toHaveLength(21);
    expect(a1.roll.nay).toHaveLength(12);
    expect(a1.roll.present).toHaveLength(3);
    expect(a1.roll["not-voting"]).toHaveLength(4);
    // The struck count is kept, struck, with the correction that struck it; the correction follows.
    const struck = j.items.find((i: { entry: number }) => i.entry === wrongVote);
    expect(struck.struck).toMatchObject({ reason: "The count was misheard: 25 to 10." });
    expect(struck.text).toContain("30 in favour, 5 against");
    const correction = j.items.find((i: { kind: string }) => i.kind === "correction");
    expect(correction.text).toContain("Reason: The count was misheard: 25 to 10.");
    expect(correction.text).toContain("25 in favour, 10 against");
  });

  it("is approved as a record, is never edited after, and changes only by a correction entry with its reason", async () => {
    await ok({ kind: "voted", result: "rejected", method: "division", tally: { yes: 12, no: 20, abstain: 3 } });
    const before = await journal();
    expect(before.approved).toBeNull();
    // A member cannot approve; a stale review is refused.
    expect((await call(journalRoute.POST, "POST", `/api/floor/sittings/${id}/journal`, { as: s.as.member, params: { id }, body: { revision } })).status).toBe(403);
    expect((await call(journalRoute.POST, "POST", `/api/floor/sittings/${id}/journal`, { as: s.as.clerk, params: { id }, body: { revision: revision - 1 } })).status).toBe(409);
    const approved = await call(journalRoute.POST, "POST", `/api/floor/sittings/${id}/journal`, { as: s.as.clerk, params: { id }, body: { revision } });
    expect(approved.status, JSON.stringify(approved.body)).toBe(201);
    const after = await journal();
    expect(after.approved.items.map((i: { text: string }) => i.text)).toEqual(before.draft.items.map((i: { text: string }) => i.text));
    expect(after.approval).toMatch(/^Approved .* by /);

    // Edits are refused and store nothing: no second approval, no PUT.
    const counts = await tableCounts();
    const again = await call(journalRoute.POST, "POST", `/api/floor/sittings/${id}/journal`, { as: s.as.clerk, params: { id }, body: { revision } });
    expect(again.status).toBe(409);
    expect(again.body.error.message).toContain("record a correction");
    const put = await call(journalRoute.PUT, "PUT", `/api/floor/sittings/${id}/journal`, { as: s.as.clerk, params: { id }, body: { items: [] } });
    expect(put.status).toBe(409);
    expect(await tableCounts()).toEqual(counts);

    // The floor record is corrected; the approved journal stays as approved until a correction entry.
    await ok({ kind: "strike", entry: revision, reason: "Wrong tally read out: it was 20 to 12.", replacement: { kind: "voted", result: "adopted", method: "division", tally: { yes: 20, no: 12, abstain: 3 } } });
    const stale = await journal();
    expect(stale.recordChanged).toBe(true);
    expect(stale.approved.items.some((i: { kind: string }) => i.kind === "correction")).toBe(false);
    const noReason = await call(correctionsRoute.POST, "POST", `/api/floor/sittings/${id}/journal/corrections`, { as: s.as.clerk, params: { id }, body: { revision, reason: " " } });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.issues[0].path).toBe("reason");
    const corrected = await call(correctionsRoute.POST, "POST", `/api/floor/sittings/${id}/journal/corrections`, { as: s.as.clerk, params: { id }, body: { revision, reason: "The count on Amendment A1 was corrected on the floor." } });
    expect(corrected.status, JSON.stringify(corrected.body)).toBe(201);
    const now = await journal();
    expect(now.entries.map((e: { kind: string }) => e.kind)).toEqual(["approved", "correction"]);
    expect(now.recordChanged).toBe(false);
    expect(now.approval).toContain("The count on Amendment A1 was corrected on the floor.");
    expect(now.approved.items.some((i: { kind: string; text: string }) => i.kind === "correction" && i.text.includes("Wrong tally read out"))).toBe(true);
  });

  it("downloads as PDF and DOCX with the right content type, and the files hold the journal's words", async () => {
    await ok({ kind: "voted", result: "rejected", method: "division", tally: { yes: 12, no: 20, abstain: 3 } });
    const pdf = await download("pdf");
    expect(pdf.status).toBe(200);
    expect(pdf.type).toBe("application/pdf");
    expect(pdf.disposition).toMatch(/attachment; filename="journal-sitting-of-the-quillbrook-assembly-\d+\.pdf"/);
    const parser = new PDFParse({ data: new Uint8Array(pdf.bytes) });
    const text = (await parser.getText()).text.replace(/\s+/g, " ");
    await parser.destroy();
    expect(text).toContain("Ms Arden moved: Main motion M1");
    expect(text).toContain("on a division, 12 in favour, 20 against, 3 abstaining");
    expect(text).toMatch(/page 1 of 1/);
    const docx = await download("docx");
    expect(docx.type).toBe("application/vnd.openxmlformats-officedocument.wordprocessingml.document");
    const zip = await JSZip.loadAsync(docx.bytes);
    const xml = await zip.file("word/document.xml")!.async("string");
    expect(xml).toContain("Mr Bellweather moved: Amendment A1 to Main motion M1");
    expect(xml).toContain("not agreed to on a division, 12 in favour, 20 against, 3 abstaining");
    const footers = Object.keys(zip.files).filter((f) => /^word\/footer\d*\.xml$/.test(f));
    expect(footers.length).toBeGreaterThan(0);
    expect(await zip.file(footers[0])!.async("string")).toContain("PAGE");
  });

  it("is found by the precedent search once approved", async () => {
    await ok({ kind: "voted", result: "rejected", method: "division", tally: { yes: 12, no: 20, abstain: 3 } });
    const search = async () => (await call(rulingsRoute.GET, "GET", "/api/rulings", { as: s.as.member, query: { q: "landing stages" } })).body.journals as Array<{ sittingId: string; snippet: string }>;
    expect((await search()).some((j) => j.sittingId === id)).toBe(false);
    expect((await call(journalRoute.POST, "POST", `/api/floor/sittings/${id}/journal`, { as: s.as.clerk, params: { id }, body: { revision } })).status).toBe(201);
    const hit = (await search()).find((j) => j.sittingId === id);
    expect(hit?.snippet).toContain("⟦landing⟧");
  });
});

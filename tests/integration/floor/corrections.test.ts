// The floor record right the first time and corrected on the record (issue 15 item 1; issue 16
// item 6): a vote names the question it disposes of and is refused for any other; the count a
// threshold needs is required and checked; an entry is never edited — a correction strikes it
// with a reason and the board is recomputed as if it had never been recorded; a sitting judged by
// a superseded rulebook version moves to the version in force by an entry.
// Sources: a tie or fewer ayes than noes loses, a majority being of the votes cast (Robert's Rules
// of Order Revised, 1915, §46 pp. 191–192); two-thirds is two-thirds of the votes cast (§48 p. 204);
// "The ayes have it" for a vote by voice (§46 p. 190). The demo rulebook (fictional Harrowmere
// Standing Orders) gives the motion to suspend the rules a majority of all 40 members.
import { beforeAll, beforeEach, describe, expect, it } from "vitest";
import * as sittingsRoute from "../../../src/pages/api/floor/sittings/index.ts";
import * as sittingRoute from "../../../src/pages/api/floor/sittings/[id].ts";
import * as eventsRoute from "../../../src/pages/api/floor/sittings/[id]/events.ts";
import * as versionsRoute from "../../../src/pages/api/rulebooks/index.ts";
import * as versionRoute from "../../../src/pages/api/rulebooks/[id].ts";
import * as adoptRoute from "../../../src/pages/api/rulebooks/[id]/adopt.ts";
import { seedRulebooks } from "../../../src/lib/server/seed/rulebooks.ts";
import { call } from "../../support/app.ts";
import { tableCounts } from "../../support/db.ts";
import { seedChambers, type Seeded } from "../../support/fixtures.ts";

let s: Seeded;
let id: string;
let revision: number;

type Pending = { key: string; motion: string; ref: string; degree: number | null };
type HistoryLine = { seq: number; kind: string; summary: string; by: string | null; struck: { entry: number; reason: string; by: string | null } | null; strikes: number | null };

const rec = (event: unknown, as = s.as.clerk, rev = revision) => call(eventsRoute.POST, "POST", `/api/floor/sittings/${id}/events`, { as, params: { id }, body: { revision: rev, event } });
const read = async () => (await call(sittingRoute.GET, "GET", `/api/floor/sittings/${id}`, { as: s.as.member, params: { id } })).body;
async function ok(event: unknown) {
  const r = await rec(event);
  expect(r.status, JSON.stringify(r.body)).toBe(201);
  revision = r.body.revision;
  return r.body as { revision: number; summary: string; board: { pending: Pending[]; lastVote: unknown } };
}
/** A question made, seconded and stated. */
async function move(motion: string, ref: string, text = "") {
  await ok({ kind: "made", motion, ref, text });
  await ok({ kind: "seconded" });
  await ok({ kind: "stated" });
}
/** The same refusal leaves every table and the stored board as they were. */
async function refused(event: unknown, status: number) {
  const counts = await tableCounts();
  const before = await read();
  const r = await rec(event);
  expect(r.status, JSON.stringify(r.body)).toBe(status);
  expect(await tableCounts()).toEqual(counts);
  const after = await read();
  expect(after.board).toEqual(before.board);
  expect(after.sitting.revision).toBe(before.sitting.revision);
  return r.body.error as { code: string; message: string; issues: Array<{ path: string; message: string }>; details?: Record<string, unknown> };
}

beforeAll(async () => {
  s = await seedChambers();
  await seedRulebooks();
});

beforeEach(async () => {
  const r = await call(sittingsRoute.POST, "POST", "/api/floor/sittings", { as: s.as.clerk, body: { title: `Corrections ${Date.now()}` } });
  id = r.body.id;
  revision = 0;
  await move("main", "M1", "That the Assembly approve the Moorland Footpaths Ordinance");
  await move("amend", "A1", "Strike out 'footpaths' and insert 'bridleways'");
  await move("amend", "A2", "Insert 'and byways' after 'bridleways'");
});

describe("recording a vote", () => {
  it("names the question in the record and refuses a vote meant for another question", async () => {
    const b = await read();
    expect(b.question.name).toBe("Amendment A2 to Amendment A1 — “Insert 'and byways' after 'bridleways'”");
    const a1 = b.board.pending.find((p: Pending) => p.ref === "A1").key;
    const wrong = await refused({ kind: "voted", question: a1, result: "rejected", method: "division", tally: { yes: 12, no: 20, abstain: 3 } }, 409);
    expect(wrong.issues[0].path).toBe("event.question");
    expect(wrong.message).toContain("Amendment A2 to Amendment A1");
    const top = b.question.key;
    const v = await ok({ kind: "voted", question: top, result: "rejected", method: "division", tally: { yes: 12, no: 20, abstain: 3 } });
    expect(v.summary).toBe("Voted: Amendment A2 to Amendment A1 — “Insert 'and byways' after 'bridleways'” — rejected, 12–20, 3 abstaining");
    expect(v.board.pending.map((p) => p.ref)).toEqual(["M1", "A1"]);
  });

  it("requires the count a counted vote needs and refuses a count that is not a whole number, naming the field", async () => {
    const noTally = await refused({ kind: "voted", result: "rejected", method: "division" }, 400);
    expect(noTally.issues.map((i) => i.path)).toEqual(["event.tally"]);
    const abc = await refused({ kind: "voted", result: "rejected", method: "division", tally: { yes: 12, no: 20, abstain: "abc" } }, 400);
    expect(abc.issues.map((i) => i.path)).toEqual(["event.tally.abstain"]);
    const noResult = await refused({ kind: "voted", method: "voice" }, 400);
    expect(noResult.issues.map((i) => i.path)).toEqual(["event.result"]);
  });

  it("checks the count against the question's threshold: a tie loses; two-thirds of the votes cast", async () => {
    // A tie under a majority: "On a tie vote the motion is lost" (RONR 1915 §46 pp. 191–192).
    const tie = await refused({ kind: "voted", result: "adopted", method: "division", tally: { yes: 16, no: 16 } }, 422);
    expect(tie.issues[0].path).toBe("event.result");
    expect(tie.details?.countGives).toBe("rejected");
    // The clerk may still record what the chair declared; the history says so.
    const declared = await ok({ kind: "voted", result: "adopted", method: "division", tally: { yes: 16, no: 16 }, againstCount: true });
    expect(declared.summary).toContain("as the chair declared it");
    // Close debate (previous question) needs two-thirds of the votes cast (§48 p. 204): 20–12 is short (20 < 21.33).
    await move("previous-question", "");
    const short = await refused({ kind: "voted", result: "adopted", method: "division", tally: { yes: 20, no: 12 } }, 422);
    expect(short.message).toContain("two-thirds of those voting");
    await ok({ kind: "voted", result: "adopted", method: "division", tally: { yes: 22, no: 11 } });
  });

  it("refuses a vote by voice where the threshold needs a count (a majority of all the members)", async () => {
    await ok({ kind: "made", motion: "suspend-rules", overrule: true });
    await ok({ kind: "seconded" });
    await ok({ kind: "stated" });
    const voice = await refused({ kind: "voted", result: "adopted", method: "voice" }, 400);
    expect(voice.issues[0].path).toBe("event.method");
    expect(voice.message).toContain("a majority of the members");
    // 20 of 40 is not more than half of the members; 21 is.
    await refused({ kind: "voted", result: "adopted", method: "division", tally: { yes: 20, no: 2 } }, 422);
    await ok({ kind: "voted", result: "adopted", method: "division", tally: { yes: 21, no: 2 } });
  });
});

describe("corrections", () => {
  it("strikes a vote with a reason and records the right one in its place; the history keeps both, struck through with who and why", async () => {
    const v = await ok({ kind: "voted", result: "rejected", method: "division", tally: { yes: 12, no: 20, abstain: 3 } });
    const voteEntry = v.revision;
    const noReason = await refused({ kind: "strike", entry: voteEntry, reason: "  " }, 400);
    expect(noReason.issues.map((i) => i.path)).toEqual(["event.reason"]);
    const missingReason = await refused({ kind: "strike", entry: voteEntry }, 400);
    expect(missingReason.issues.map((i) => i.path)).toEqual(["event.reason"]);
    // The replacement is checked like any vote: 12–20 does not adopt.
    const bad = await refused({ kind: "strike", entry: voteEntry, reason: "Tellers' count transposed", replacement: { kind: "voted", result: "adopted", method: "division", tally: { yes: 12, no: 20 } } }, 422);
    expect(bad.issues[0].path).toBe("event.result");

    const c = await ok({ kind: "strike", entry: voteEntry, reason: "Tellers' count transposed", replacement: { kind: "voted", result: "adopted", method: "division", tally: { yes: 20, no: 12, abstain: 3 } } });
    expect(c.summary).toContain(`Struck out entry ${voteEntry}`);
    expect(c.summary).toContain("Reason: Tellers' count transposed");
    expect(c.summary).toContain("recorded instead: Amendment A2 to Amendment A1");
    expect(c.board.lastVote).toMatchObject({ result: "adopted", tally: { yes: 20, no: 12, abstain: 3 } });
    const b = await read();
    const lines: HistoryLine[] = b.history;
    const struck = lines.find((h) => h.seq === voteEntry)!;
    expect(struck.summary).toContain("rejected, 12–20, 3 abstaining");
    expect(struck.struck).toMatchObject({ entry: c.revision, reason: "Tellers' count transposed", by: expect.any(String) });
    expect(lines.find((h) => h.seq === c.revision)).toMatchObject({ kind: "strike", strikes: voteEntry, struck: null });
    expect(b.board.pending.map((p: Pending) => p.ref)).toEqual(["M1", "A1"]);

    // The same entry is not struck twice, and a correction is not itself struck.
    expect((await refused({ kind: "strike", entry: voteEntry, reason: "again" }, 409)).issues[0].path).toBe("event.entry");
    expect((await refused({ kind: "strike", entry: c.revision, reason: "undo" }, 422)).issues[0].path).toBe("event.entry");
    expect((await refused({ kind: "strike", entry: 999, reason: "none" }, 400)).issues[0].path).toBe("event.entry");
  });

  it("recomputes the board as if the struck entry never happened: the question comes back and is voted again", async () => {
    const v = await ok({ kind: "voted", result: "rejected", method: "voice" });
    expect(v.board.pending.map((p) => p.ref)).toEqual(["M1", "A1"]);
    const c = await ok({ kind: "strike", entry: v.revision, reason: "Recorded against the wrong question; the chair had not put it" });
    expect(c.board.pending.map((p) => p.ref)).toEqual(["M1", "A1", "A2"]);
    expect(c.board.lastVote).toBeNull();
    const b = await read();
    expect(b.question.name).toMatch(/^Amendment A2 to Amendment A1/);
    expect(b.board).toEqual(c.board);
    const again = await ok({ kind: "voted", question: b.question.key, result: "adopted", method: "division", tally: { yes: 21, no: 19 } });
    expect(again.board.pending.map((p) => p.ref)).toEqual(["M1", "A1"]);
  });

  it("refuses, storing nothing, a correction that would leave a later entry without its question", async () => {
    const a2 = await ok({ kind: "voted", result: "rejected", method: "voice" });
    await ok({ kind: "voted", result: "adopted", method: "voice" }); // A1, now pending
    const e = await refused({ kind: "strike", entry: a2.revision, reason: "Wrong question" }, 422);
    expect(e.issues[0].path).toBe("event.entry");
    expect(e.message).toContain(`Entry ${a2.revision + 1}`);
    // Striking the later vote first, then the earlier one, is consistent.
    await ok({ kind: "strike", entry: a2.revision + 1, reason: "Recorded before the chair put it" });
    const c = await ok({ kind: "strike", entry: a2.revision, reason: "Wrong question" });
    expect(c.board.pending.map((p) => p.ref)).toEqual(["M1", "A1", "A2"]);
  });

  it("strikes a withdrawal: the questions withdrawn are pending again", async () => {
    const b = await read();
    const a1 = b.board.pending.find((p: Pending) => p.ref === "A1").key;
    const w = await ok({ kind: "withdrawn", key: a1 });
    expect(w.summary).toBe("Withdrawn: Amendment A1 to Main motion M1 — “Strike out 'footpaths' and insert 'bridleways'” (with the question adhering to it)");
    expect(w.board.pending.map((p) => p.ref)).toEqual(["M1"]);
    const c = await ok({ kind: "strike", entry: w.revision, reason: "The mover did not withdraw; she asked to speak" });
    expect(c.board.pending.map((p) => p.ref)).toEqual(["M1", "A1", "A2"]);
  });

  it("is for clerks only", async () => {
    const v = await ok({ kind: "voted", result: "rejected", method: "voice" });
    const counts = await tableCounts();
    for (const role of ["member", "staff", "observer"] as const) expect((await rec({ kind: "strike", entry: v.revision, reason: "x" }, s.as[role])).status, role).toBe(403);
    expect((await rec({ kind: "strike", entry: v.revision, reason: "x" }, s.outsider)).status).toBe(404);
    expect(await tableCounts()).toEqual(counts);
  });
});

describe("a sitting judged by a superseded rulebook version", () => {
  it("says so, and moves to the version in force by an entry on the record", async () => {
    const first = await read();
    expect(first.superseded).toBe(false);
    // A new version adopted with effect today (copy of the version in force, retitled).
    const current = await call(versionRoute.GET, "GET", `/api/rulebooks/${first.rulebook.versionId}`, { as: s.as.clerk, params: { id: first.rulebook.versionId } });
    const document = { ...current.body.document, title: `${current.body.document.title} (revised)` };
    const saved = await call(versionsRoute.POST, "POST", "/api/rulebooks", { as: s.as.clerk, body: { basedOn: first.rulebook.versionId, note: "Revised", document } });
    expect(saved.status, JSON.stringify(saved.body)).toBe(201);
    const adopted = await call(adoptRoute.POST, "POST", `/api/rulebooks/${saved.body.id}/adopt`, { as: s.as["chief-clerk"], params: { id: saved.body.id }, body: { note: "With effect today" } });
    expect(adopted.status).toBe(201);

    const b = await read();
    expect(b.superseded).toBe(true);
    expect(b.rulebook.versionId).toBe(first.rulebook.versionId);
    expect(b.inForce.versionId).toBe(saved.body.id);

    expect((await refused({ kind: "rulebook", version: first.rulebook.versionId }, 409)).issues[0].path).toBe("event.version");
    const sw = await ok({ kind: "rulebook", version: saved.body.id });
    expect(sw.summary).toContain(`rulebook version ${b.inForce.number}`);
    expect(sw.summary).toContain(`in place of version ${first.rulebook.number}`);
    const after = await read();
    expect(after.superseded).toBe(false);
    expect(after.rulebook.versionId).toBe(saved.body.id);
    expect(after.board).toEqual(b.board);
    expect(after.history.at(-1)).toMatchObject({ kind: "rulebook", summary: sw.summary });
    expect((await refused({ kind: "rulebook", version: saved.body.id }, 409)).issues[0].path).toBe("event.version");
    expect((await refused({ kind: "strike", entry: sw.revision, reason: "Undo" }, 422)).issues[0].path).toBe("event.entry");

    // Corrections after the switch replay the earlier entries by the earlier version.
    const v = await ok({ kind: "voted", result: "rejected", method: "voice" });
    const c = await ok({ kind: "strike", entry: v.revision, reason: "Wrong question" });
    expect(c.board.pending.map((p) => p.ref)).toEqual(["M1", "A1", "A2"]);
  });
});

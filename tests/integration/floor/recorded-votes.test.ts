// Recorded votes on the floor (issue 19 item 1): each member's answer from the roster, the count,
// the quorum and the threshold checked against the rulebook, the demand that orders a recorded
// vote, corrections as entries, and the chamber's recorded votes read back as {id, yea, nay}.
// Sources: the demo rulebook's fictional Standing Orders set a quorum of 13 and order a recorded
// vote at the demand of one fifth of those present, modelled on the US Constitution, art. I §5
// cl. 3 ("the Yeas and Nays of the Members of either House on any question shall, at the Desire of
// one fifth of those Present, be entered on the Journal"); a majority is of the votes cast and a
// tie loses (Robert's Rules of Order Revised, 1915, §46 pp. 191–192).
import { beforeAll, beforeEach, describe, expect, it } from "vitest";
import * as sittingsRoute from "../../../src/pages/api/floor/sittings/index.ts";
import * as eventsRoute from "../../../src/pages/api/floor/sittings/[id]/events.ts";
import * as votesRoute from "../../../src/pages/api/floor/recorded-votes.ts";
import * as rosterRoute from "../../../src/pages/api/measures/sponsors.ts";
import * as sittingRoute from "../../../src/pages/api/floor/sittings/[id].ts";
import * as versionsRoute from "../../../src/pages/api/rulebooks/index.ts";
import * as versionRoute from "../../../src/pages/api/rulebooks/[id].ts";
import * as adoptRoute from "../../../src/pages/api/rulebooks/[id]/adopt.ts";
import { seedRulebooks } from "../../../src/lib/server/seed/rulebooks.ts";
import { call } from "../../support/app.ts";
import { tableCounts } from "../../support/db.ts";
import { seedChambers, type Seeded } from "../../support/fixtures.ts";

let s: Seeded;
let members: string[];
let id: string;
let revision: number;

const rec = (event: unknown, as = s.as.clerk) => call(eventsRoute.POST, "POST", `/api/floor/sittings/${id}/events`, { as, params: { id }, body: { revision, event } });
async function ok(event: unknown) {
  const r = await rec(event);
  expect(r.status, JSON.stringify(r.body)).toBe(201);
  revision = r.body.revision;
  return r.body as { revision: number; summary: string; board: { pending: Array<{ ref: string }>; lastVote: unknown } };
}
async function refused(event: unknown, status: number) {
  const counts = await tableCounts();
  const r = await rec(event);
  expect(r.status, JSON.stringify(r.body)).toBe(status);
  expect(await tableCounts()).toEqual(counts);
  return r.body.error as { issues: Array<{ path: string }>; message: string; details?: Record<string, unknown> };
}
/** A roll: the first `yea` members yea, the next `nay` nay, then present, then not voting; the rest left out. */
function roll(yea: number, nay: number, present = 0, notVoting = 0) {
  const positions = [...Array(yea).fill("yea"), ...Array(nay).fill("nay"), ...Array(present).fill("present"), ...Array(notVoting).fill("not-voting")];
  return positions.map((position, i) => ({ member: members[i], position }));
}
const votes = async (as = s.as.observer, sitting?: string) => (await call(votesRoute.GET, "GET", "/api/floor/recorded-votes", { as, ...(sitting ? { query: { sitting } } : {}) })).body.votes as Array<{ id: string; sittingId: string; entry: number; question: string; result: string; yea: string[]; nay: string[]; present: string[]; notVoting: string[] }>;

beforeAll(async () => {
  s = await seedChambers();
  await seedRulebooks();
  members = (await call(rosterRoute.GET, "GET", "/api/measures/sponsors", { as: s.as.clerk })).body.legislators.map((l: { id: string }) => l.id);
  expect(members.length).toBe(40);
});

beforeEach(async () => {
  const r = await call(sittingsRoute.POST, "POST", "/api/floor/sittings", { as: s.as.clerk, body: { title: `Roll calls ${Date.now()}` } });
  id = r.body.id;
  revision = 0;
  for (const [motion, ref] of [["main", "M1"], ["amend", "A1"]]) {
    await ok({ kind: "made", motion, ref, text: motion === "main" ? "That the Assembly approve the Kestrel Lane scheme" : "Insert 'and seating'" });
    await ok({ kind: "seconded" });
    await ok({ kind: "stated" });
  }
});

describe("a recorded vote", () => {
  it("records each member's answer; the count, the summary and the board follow the roll", async () => {
    const v = await ok({ kind: "voted", result: "adopted", method: "recorded", roll: roll(21, 12, 3, 4), demandedBy: 8 });
    expect(v.summary).toBe("Voted: Amendment A1 to Main motion M1 — “Insert 'and seating'” — adopted, 21–12, 3 present, 4 not voting (recorded vote)");
    expect(v.board.lastVote).toMatchObject({ result: "adopted", tally: { yes: 21, no: 12, abstain: 3 } });
    const [vote] = (await votes()).filter((x) => x.sittingId === id && x.entry === v.revision);
    expect(vote.question).toBe("Amendment A1 to Main motion M1 — “Insert 'and seating'”");
    expect(vote.yea).toEqual(members.slice(0, 21));
    expect(vote.nay).toEqual(members.slice(21, 33));
    expect(vote.present).toEqual(members.slice(33, 36));
    expect(vote.notVoting).toEqual(members.slice(36, 40));
  });

  it("refuses a roll naming someone not on the roster, a member twice, or no one, naming the entry", async () => {
    const stranger = await refused({ kind: "voted", result: "adopted", method: "recorded", roll: [{ member: "00000000-0000-4000-8000-000000000000", position: "yea" }, ...roll(20, 5).slice(1)] }, 400);
    expect(stranger.issues[0].path).toBe("event.roll.0.member");
    const twice = await refused({ kind: "voted", result: "adopted", method: "recorded", roll: [...roll(20, 5), { member: members[0], position: "nay" }] }, 400);
    expect(twice.issues[0].path).toBe("event.roll.25.member");
    expect((await refused({ kind: "voted", result: "adopted", method: "recorded", roll: [] }, 400)).issues[0].path).toBe("event.roll");
    expect((await refused({ kind: "voted", result: "adopted", method: "recorded", roll: [{ member: members[0], position: "aye" }] }, 400)).issues[0].path).toBe("event.roll.0.position");
  });

  it("checks the quorum (13 in the demo rulebook) and the threshold against the roll", async () => {
    // 12 answer: no quorum.
    const noQuorum = await refused({ kind: "voted", result: "adopted", method: "recorded", roll: roll(7, 5, 0, 28) }, 422);
    expect(noQuorum.details?.noQuorum).toBe(true);
    expect(noQuorum.message).toContain("the quorum is 13");
    // A tie loses (RONR 1915 §46 pp. 191–192).
    const tie = await refused({ kind: "voted", result: "adopted", method: "recorded", roll: roll(10, 10) }, 422);
    expect(tie.details?.countGives).toBe("rejected");
    // No casting vote under the demo rulebook's tie rule.
    expect((await refused({ kind: "voted", result: "adopted", method: "recorded", roll: roll(10, 10), casting: "yea" }, 400)).issues[0].path).toBe("event.casting");
    await ok({ kind: "voted", result: "rejected", method: "recorded", roll: roll(10, 10) });
  });

  it("checks the demand against one fifth of those present", async () => {
    // 36 answer (yea, nay or present): one fifth is 7.2, so 8 members must demand it.
    const short = await refused({ kind: "voted", result: "adopted", method: "recorded", roll: roll(21, 12, 3, 4), demandedBy: 7 }, 400);
    expect(short.issues[0].path).toBe("event.demandedBy");
    expect(short.message).toContain("8 of the 36 present");
  });

  it("is corrected by an entry: the struck roll call leaves the chamber's recorded votes, the one recorded in its place joins them", async () => {
    const v = await ok({ kind: "voted", result: "adopted", method: "recorded", roll: roll(21, 12) });
    const before = await votes(s.as.observer, id);
    expect(before.every((x) => x.sittingId === id)).toBe(true);
    expect(before.some((x) => x.entry === v.revision)).toBe(true);
    const c = await ok({ kind: "strike", entry: v.revision, reason: "Two members' answers were entered against the wrong names", replacement: { kind: "voted", result: "adopted", method: "recorded", roll: roll(22, 11) } });
    expect(c.summary).toContain("recorded instead:");
    const after = await votes(s.as.observer, id);
    expect(after.some((x) => x.entry === v.revision)).toBe(false);
    const fixed = after.find((x) => x.entry === c.revision)!;
    expect(fixed.yea.length).toBe(22);
    expect(fixed.nay.length).toBe(11);
  });

  it("is read by every role of the chamber and by no one else", async () => {
    await ok({ kind: "voted", result: "adopted", method: "recorded", roll: roll(21, 12) });
    for (const role of ["chief-clerk", "clerk", "member", "staff", "observer"] as const) expect((await call(votesRoute.GET, "GET", "/x", { as: s.as[role] })).status, role).toBe(200);
    expect((await call(votesRoute.GET, "GET", "/x", { as: null })).status).toBe(401);
    expect(await votes(s.outsider)).toEqual([]);
  });

  it("takes the chair's casting vote on an equal division where the rulebook gives one (US Constitution art. I §3 cl. 4: \"shall have no Vote, unless they be equally divided\")", async () => {
    const b = (await call(sittingRoute.GET, "GET", "/x", { as: s.as.clerk, params: { id } })).body;
    const current = (await call(versionRoute.GET, "GET", "/x", { as: s.as.clerk, params: { id: b.rulebook.versionId } })).body;
    const document = { ...current.document, voting: { ...current.document.voting, tieRule: "chair-casting-vote" } };
    const saved = await call(versionsRoute.POST, "POST", "/api/rulebooks", { as: s.as.clerk, body: { basedOn: b.rulebook.versionId, note: "Casting vote", document } });
    expect(saved.status, JSON.stringify(saved.body)).toBe(201);
    expect((await call(adoptRoute.POST, "POST", "/x", { as: s.as.clerk, params: { id: saved.body.id }, body: {} })).status).toBe(201);
    await ok({ kind: "rulebook", version: saved.body.id });
    expect((await refused({ kind: "voted", result: "adopted", method: "recorded", roll: roll(11, 10), casting: "yea" }, 400)).issues[0].path).toBe("event.casting");
    // Equally divided, the chair votes nay: the amendment is lost.
    expect((await refused({ kind: "voted", result: "adopted", method: "recorded", roll: roll(10, 10), casting: "nay" }, 422)).details?.countGives).toBe("rejected");
    const v = await ok({ kind: "voted", result: "adopted", method: "recorded", roll: roll(10, 10), casting: "yea" });
    expect(v.summary).toContain("adopted, 10–10 (recorded vote; the chair's casting vote: yea)");
    const [vote] = (await votes(s.as.observer, id)).filter((x) => x.entry === v.revision);
    expect(vote).toMatchObject({ result: "adopted", casting: "yea" });
  });
});

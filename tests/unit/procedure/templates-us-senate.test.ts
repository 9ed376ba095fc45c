/**
 * Worked examples for the US Senate template (rulebooks/us-senate.json), each taken from the
 * source's own text: the Standing Rules of the Senate as printed in the Senate Manual (110th Cong.,
 * S. Doc. 110-1, pp. 20-21), CRS Report 98-853 (The Amending Process in the Senate, 2003) and
 * Riddick's Senate Procedure (1992). Quotations are exact; anything else says "paraphrase".
 */
import { describe, expect, it } from "vitest";
import type { AmendmentInput, MeasureInput } from "../../../src/lib/amendments/case-schema.ts";
import { validateTree, type Finding } from "../../../src/lib/amendments/validate-tree.ts";
import { legalMoves, type MotionVerdict } from "../../../src/lib/procedure/legal-moves.ts";
import { template } from "./fixtures.ts";

const senate = template("us-senate");
const MAIN = { motion: "main" };

async function moves(pending: Array<{ motion: string }>, floor: Record<string, unknown> = {}) {
  const list = await legalMoves(senate, { pending, floor });
  return Object.fromEntries(list.map((v) => [v.motion, v])) as Record<string, MotionVerdict>;
}
const inOrder = async (pending: Array<{ motion: string }>) => Object.fromEntries(Object.values(await moves(pending)).map((v) => [v.motion, v.inOrder]));

/**
 * Rule XXII cl. 1: "When a question is pending, no motion shall be received but— To adjourn. To
 * adjourn to a day certain, or that when the Senate adjourn it shall be to a day certain. To take a
 * recess. To proceed to the consideration of executive business. To lay on the table. To postpone
 * indefinitely. To postpone to a day certain. To commit. To amend. Which several motions shall have
 * precedence as they stand arranged".
 */
const RULE_XXII_1 = ["adjourn", "fix-time-to-adjourn", "recess", "executive-business", "lay-on-table", "postpone-indefinitely", "postpone-definitely", "commit", "amend"];

describe("US Senate: Rule XXII cl. 1, the motions \"shall have precedence as they stand arranged\"", () => {
  it("the catalogue's ranks follow the rule's list, highest first", () => {
    const rank = (id: string) => senate.motions.find((m) => m.id === id)!.rank!;
    for (let i = 1; i < RULE_XXII_1.length; i++) expect(rank(RULE_XXII_1[i - 1]), `${RULE_XXII_1[i - 1]} above ${RULE_XXII_1[i]}`).toBeGreaterThan(rank(RULE_XXII_1[i]));
  });

  it("each motion is in order while any motion arranged after it is immediately pending", async () => {
    for (let j = 1; j < RULE_XXII_1.length; j++) {
      const state = await inOrder([MAIN, { motion: RULE_XXII_1[j] }]);
      for (let i = 0; i < j; i++) expect(state[RULE_XXII_1[i]], `${RULE_XXII_1[i]} over ${RULE_XXII_1[j]}`).toBe(true);
    }
  });

  it("no motion arranged later is in order while an earlier one is immediately pending, except an amendment of an amendable motion", async () => {
    for (let i = 0; i < RULE_XXII_1.length - 1; i++) {
      const top = RULE_XXII_1[i];
      const state = await inOrder([MAIN, { motion: top }]);
      const amendable = senate.motions.find((m) => m.id === top)!.amendable;
      for (const lower of RULE_XXII_1.slice(i + 1)) expect(state[lower], `${lower} under ${top}`).toBe(lower === "amend" && amendable);
    }
  });

  it("postpone indefinitely stands above postpone to a day certain, commit and amend (the reverse of general parliamentary law)", async () => {
    for (const pendingId of ["postpone-definitely", "commit", "amend"]) {
      expect((await inOrder([MAIN, { motion: pendingId }]))["postpone-indefinitely"], pendingId).toBe(true);
    }
    const gpl = await legalMoves(template("general-parliamentary-law"), { pending: [MAIN, { motion: "amend" }] });
    expect(gpl.find((v) => v.motion === "postpone-indefinitely")!.inOrder).toBe(false);
  });

  it("\"the motions relating to adjournment, to take a recess, to proceed to the consideration of executive business, to lay on the table, shall be decided without debate\"; the others are debatable", async () => {
    const m = await moves([MAIN]);
    for (const id of ["adjourn", "fix-time-to-adjourn", "recess", "executive-business", "lay-on-table"]) expect(m[id].debatable, id).toBe(false);
    // Riddick's Senate Procedure (1992), "Postpone, Motion To": "Both motions are debatable".
    for (const id of ["postpone-indefinitely", "postpone-definitely", "commit", "amend"]) expect(m[id].debatable, id).toBe(true);
  });
});

describe("US Senate: reconsider under Rule XIII cl. 1 (paraphrase: the same day or either of the next two days of actual session)", () => {
  it("the window is two days of actual session after the day of the vote", async () => {
    const vote = { motion: "main", result: "rejected", day: 10 };
    const at = async (day: number) => (await moves([], { day, votes: [vote] })).reconsider;
    expect((await at(12)).inOrder).toBe(true);
    expect((await at(13)).reasons.map((r) => r.rule)).toEqual(["reconsider-time-limit"]);
  });
});

describe("US Senate: no previous question; cloture under Rule XXII cl. 2", () => {
  it("the previous question is never received: it is not among Rule XXII cl. 1's motions (\"the Senate rules not recognizing the above motions\", Pocket Manual of Rules of Order, 1876, §37 note)", async () => {
    for (const pending of [[], [MAIN], [MAIN, { motion: "amend" }]]) {
      const v = (await moves(pending))["previous-question"];
      expect(v.inOrder).toBe(false);
      expect(v.reasons.map((r) => r.rule)).toContain("not-entertained");
    }
  });

  it("cloture is adopted by \"three-fifths of the Senators duly chosen and sworn\" (Rule XXII cl. 2 as restated in S. Res. 67, 114th Cong.), by two-thirds of those present and voting on a rules change", async () => {
    const v = (await moves([MAIN])).cloture;
    expect(v.vote).toBe("three-fifths-of-members");
    const cloture = senate.motions.find((m) => m.id === "cloture")!;
    expect(cloture.voteAlternatives?.map((a) => [a.kind, a.vote])).toEqual([["instead", "two-thirds"]]);
  });

  it("a cloture motion brings \"to a close the debate upon any measure, motion, other matter pending before the Senate\": it needs a pending question, and the question on it is put \"without debate\"", async () => {
    expect((await moves([])).cloture.inOrder).toBe(false);
    const v = (await moves([MAIN, { motion: "amend" }])).cloture;
    expect([v.inOrder, v.debatable, v.amendable]).toEqual([true, false, false]);
  });
});

describe("US Senate: quorum and the chair", () => {
  it("\"a Majority of each [House] shall constitute a Quorum to do Business; but a smaller Number may adjourn from day to day\" (U.S. Const. art. I §5): without a quorum only adjourn is in order", async () => {
    const state = await moves([MAIN], { quorumPresent: false });
    expect(Object.values(state).filter((v) => v.inOrder).map((v) => v.motion)).toEqual(["adjourn"]);
  });
  it("the Vice President \"shall have no Vote, unless they be equally divided\" (U.S. Const. art. I §3 cl. 4): the tie rule is the chair's casting vote", () => {
    expect(senate.voting.tieRule).toBe("chair-casting-vote");
  });
});

const measure: MeasureInput = {
  id: "S-3",
  subjects: ["harbours"],
  committee: "Commerce",
  sections: [
    { id: "sec1", subjects: ["harbours"], lines: 20 },
    { id: "sec2", subjects: ["audit"], lines: 8 },
  ],
};
let n = 0;
const am = (target: string, extra: Partial<AmendmentInput> = {}): AmendmentInput => ({ id: `S${++n}`, target, form: "insert", sponsors: ["Senator A"], subjects: ["harbours"], ...extra });
const findings = async (amendments: AmendmentInput[]) => (await validateTree({ rulebook: senate, measure, amendments })).findings;
const codes = (fs: Finding[], id: string) => fs.filter((f) => f.amendment === id).map((f) => f.code);

describe("US Senate: the amendment tree", () => {
  it("CRS 98-853: \"Third degree amendments are not allowed.\"", async () => {
    const a = am("sec1");
    const b = am(a.id);
    const c = am(b.id);
    expect(codes(await findings([a, b, c]), c.id)).toEqual(["degree-exceeded"]);
  });

  it("a perfecting amendment and a substitute may both be pending against a first-degree amendment (Riddick's Senate Procedure, Amendments: \"a substitute counts as one degree of amendment\"; CRS 98-853: \"three to 11 amendments before the Senate has to vote on any of them\")", async () => {
    const a = am("sec1", { status: "pending" });
    const perfecting = am(a.id, { status: "pending" });
    const substitute = am(a.id, { form: "substitute", status: "pending" });
    const fs = await findings([a, perfecting, substitute]);
    expect(fs.filter((f) => f.severity === "error")).toEqual([]);
    expect(codes(fs, substitute.id)).not.toContain("degree-exceeded");
    // Riddick: "a substitute counts as one degree of amendment": a substitute for a first-degree amendment is of the second degree.
    const { tree } = await validateTree({ rulebook: senate, measure, amendments: [a, perfecting, substitute] });
    expect(tree.nodes[substitute.id].degree).toBe(2);
  });

  it("\"A perfecting amendment (and an amendment to it) has precedence over a substitute amendment (and an amendment to it)\" (CRS 98-853 as reproduced): the substitute for the bill is voted after the perfecting amendment", async () => {
    const s = am("S-3", { form: "in-nature-of-substitute", status: "pending" });
    const p = am("sec1", { status: "pending" });
    expect((await findings([s, p])).find((f) => f.code === "voted-after-perfecting")).toMatchObject({ amendment: s.id, related: [p.id] });
  });

  it("germaneness is not required outside cloture, appropriations and consent agreements (CRS 98-853: \"The Senate only requires that amendments be germane when\" …): an amendment on another subject is not flagged", async () => {
    const offSubject = am("sec1", { subjects: ["fisheries"] });
    expect(codes(await findings([offSubject]), offSubject.id)).toEqual([]);
  });
});

/**
 * Thresholds per question kind, membership thresholds, the quorum and the chair's vote
 * (issue 13 item 4; procedure review F27–F29; docs/decisions/0008-thresholds-quorum-chair.md).
 * Each check names its source; quoted words are the source's own, read from the address given.
 *  - RONR 1915 = Robert's Rules of Order Revised, 4th ed. (1915), public domain; pages as printed
 *    (https://en.wikisource.org/wiki/Page:Robert%27s_Rules_of_Order_-_1915.djvu/<printed page + 6>).
 */
import { describe, expect, it } from "vitest";
import { GavelError } from "../../../src/lib/errors.ts";
import { estimateContentSchema } from "../../../src/lib/estimates/estimate-content.ts";
import { parseBallotCsv } from "../../../src/lib/estimates/ballot-csv.ts";
import { walkThrough } from "../../../src/lib/estimates/walk-through.ts";
import { buildFindings } from "../../../src/lib/estimates/findings.ts";
import { votingSectionSchema } from "../../../src/lib/procedure/voting-section.ts";
import { analyseOrders } from "../../../src/lib/voting/analyse-orders.ts";
import { majorityGraph } from "../../../src/lib/voting/majority-graph.ts";
import { profileFromRankings } from "../../../src/lib/voting/profile.ts";
import { adopts, decides } from "../../../src/lib/voting/vote-threshold.ts";
import { quorumStatus, voteRules } from "../../../src/lib/voting/vote-rules.ts";

function gavelError(f: () => unknown): GavelError {
  try {
    f();
  } catch (e) {
    if (e instanceof GavelError) return e;
    throw e;
  }
  throw new Error("expected a GavelError");
}

describe("vote thresholds (src/lib/voting/vote-threshold.ts)", () => {
  // RONR 1915 §48 p. 204 (djvu/210): "Suppose 14 members vote on a question in a meeting of a society where
  // 20 are present out of a total membership of 70. a two-thirds vote would be 10; a two-thirds vote of the
  // members present would be 14; and a vote of two-thirds of the members would be 47."
  const base = { members: 70, present: 20 };
  it("RONR 1915 §48 p. 204, worked example: two-thirds of the votes cast is 10 of 14", () => {
    expect(adopts(10, 4, base, "two-thirds")).toBe(true);
    expect(adopts(9, 5, base, "two-thirds")).toBe(false);
  });
  it("RONR 1915 §48 p. 204, worked example: two-thirds of the members present is 14 of 20", () => {
    expect(adopts(14, 0, base, "two-thirds-of-present")).toBe(true);
    expect(adopts(13, 1, base, "two-thirds-of-present")).toBe(false);
  });
  it("RONR 1915 §48 p. 204, worked example: two-thirds of the members is 47 of 70 (§68 p. 270: \"two-thirds of the entire membership\")", () => {
    expect(adopts(47, 0, base, "two-thirds-of-members")).toBe(true);
    expect(adopts(46, 0, base, "two-thirds-of-members")).toBe(false);
  });
  it("F28: with 30 ballots in a 40-seat chamber, a majority of the members is 21, not 16 (the membership, not the ballots: RONR 1915 §64 p. 260 note, \"a majority of the total membership\"; procedure review F28)", () => {
    const f28 = { members: 40, present: 30 };
    expect(adopts(16, 14, f28, "majority-of-members")).toBe(false);
    expect(adopts(20, 10, f28, "majority-of-members")).toBe(false);
    expect(adopts(21, 9, f28, "majority-of-members")).toBe(true);
  });
  it("three-fifths of the Senators duly chosen and sworn is 60 of 100 (Standing Rules of the Senate, Rule XXII cl. 2: \"three-fifths of the Senators duly chosen and sworn\", as quoted in S. Res. 67, 114th Congress)", () => {
    expect(adopts(60, 40, { members: 100, present: 100 }, "three-fifths-of-members")).toBe(true);
    expect(adopts(59, 0, { members: 100, present: 59 }, "three-fifths-of-members")).toBe(false);
    // With one vacancy the rule counts 99 Senators duly chosen and sworn: 3/5 of 99 = 59.4, so 60 are still needed.
    expect(adopts(59, 0, { members: 99, present: 99 }, "three-fifths-of-members")).toBe(false);
  });
  it("a majority is a majority of the votes cast (RONR 1915 §46 p. 191: \"a majority vote, that is a majority of the votes cast, ignoring blanks\")", () => {
    expect(adopts(95, 99, { members: 500, present: 300 }, "majority")).toBe(false); // §46 p. 191's announced example: 95 to 99, lost
    expect(adopts(3, 2, { members: 500, present: 300 }, "majority")).toBe(true);
  });
  it("a fixed number needs that many votes for and more for than against (common practice, no source, for the second condition)", () => {
    const five = { kind: "number" as const, value: 5 };
    expect(adopts(5, 3, { members: 9, present: 9 }, five)).toBe(true);
    expect(adopts(4, 0, { members: 9, present: 9 }, five)).toBe(false);
    expect(adopts(5, 5, { members: 12, present: 12 }, five)).toBe(false);
  });
  it("a threshold of the members without a known membership is unprocessable, naming rulebook.chamber.members", () => {
    const e = gavelError(() => adopts(30, 0, { members: null, present: 30 }, "majority-of-members"));
    expect(e.code).toBe("unprocessable");
    expect(e.issues[0].path).toBe("rulebook.chamber.members");
  });
  it("a tie defeats the motion (RONR 1915 §46 pp. 191–192: \"On a tie vote the motion is lost\")", () => {
    expect(decides(5, 5, 10, "majority")).toBe(false);
    expect(decides(5, 5, 10, "majority", "motion-fails", 1)).toBe(false);
  });
  it("a presiding officer with no vote \"unless they be equally divided\" (US Constitution art. I §3 cl. 4) decides a tie, and only a tie", () => {
    expect(decides(50, 50, { members: 100, present: 101 }, "majority", "chair-casting-vote", 1)).toBe(true);
    expect(decides(50, 50, { members: 100, present: 101 }, "majority", "chair-casting-vote", -1)).toBe(false);
    expect(decides(50, 50, { members: 100, present: 101 }, "majority", "chair-casting-vote", 0)).toBe(false);
    expect(decides(49, 51, { members: 100, present: 101 }, "majority", "chair-casting-vote", 1)).toBe(false);
    // Nobody voting is not an equal division (common practice, no source): no casting vote on 0–0.
    expect(decides(0, 0, { members: 100, present: 101 }, "majority", "chair-casting-vote", 1)).toBe(false);
  });
});

describe("the chair's vote in the majority graph", () => {
  // Versions a, b. Three members prefer a, two prefer b; the chair (one ballot, marked) prefers b.
  const ballots = [
    { ranking: [0, 1], weight: 3 },
    { ranking: [1, 0], weight: 2 },
    { ranking: [1, 0], weight: 1, chair: true },
  ];
  const graph = (tieRule: "motion-fails" | "chair-casting-vote" | "chair-votes" | "chair-may-make-or-break-tie") =>
    majorityGraph(profileFromRankings(["a", "b"], ballots, "abstain", { chairApart: tieRule === "chair-casting-vote" }), "majority", { members: 6, tieRule });
  it("a chair who votes only when the votes are equally divided does not vote on 3 to 2 (US Constitution art. I §3 cl. 4)", () => {
    expect(graph("chair-casting-vote").beats[0][1]).toBe(true);
  });
  it("a chair who votes on every question makes it 3 to 3, and a tie defeats the motion either way (RONR 1915 §46 pp. 191–192)", () => {
    const g = graph("chair-votes");
    expect(g.beats[0][1]).toBe(false);
    expect(g.beats[1][0]).toBe(false);
  });
  it("RONR 1915 §46 p. 192: the chair \"may vote to make it a tie\", so a motion carried by one vote is lost", () => {
    expect(graph("chair-may-make-or-break-tie").beats[0][1]).toBe(false);
  });
  it("RONR 1915 §46 p. 192: the chair may break a tie (two to two, the chair for the motion adopts it)", () => {
    const tie = [
      { ranking: [0, 1], weight: 2 },
      { ranking: [1, 0], weight: 2 },
      { ranking: [0, 1], weight: 1, chair: true },
    ];
    const g = majorityGraph(profileFromRankings(["a", "b"], tie, "abstain"), "majority", { members: 5, tieRule: "chair-may-make-or-break-tie" });
    expect(g.beats[0][1]).toBe(true);
    expect(g.beats[1][0]).toBe(false);
    const casting = majorityGraph(profileFromRankings(["a", "b"], tie, "abstain", { chairApart: true }), "majority", { members: 5, tieRule: "chair-casting-vote" });
    expect(casting.beats[0][1]).toBe(true);
    expect(casting.beats[1][0]).toBe(false);
  });
  it("RONR 1915 §46 p. 192: \"The chair cannot, however, vote twice, first to make a tie and then give the casting vote\" — with the chair counted, a 2–2 tie made by the chair stays lost", () => {
    const made = [
      { ranking: [0, 1], weight: 2 },
      { ranking: [1, 0], weight: 1 },
      { ranking: [1, 0], weight: 1, chair: true },
    ];
    const g = majorityGraph(profileFromRankings(["a", "b"], made, "abstain"), "majority", { members: 4, tieRule: "chair-may-make-or-break-tie" });
    expect(g.beats[0][1]).toBe(false);
    expect(g.beats[1][0]).toBe(false);
  });
});

// A fictional measure B with one amendment A (Fictional Chamber Rule 12).
const measure = { id: "B", sections: [{ id: "s1" }] };
const oneAmendment = [{ id: "A", target: "s1", form: "insert" }];
const voting = { procedure: "amendment", citation: "Fictional Chamber Rule 12" };
const mainNeedsTwoThirds = [{ id: "main", class: "main", vote: "two-thirds" }];
// Six members rank B+A > B > Q; four rank B > Q > B+A: the amendment carries 6–4 (a majority, not two-thirds);
// passage of B+A against Q is 6–4 as well; passage of B alone against Q is 10–0.
const profile = {
  ballots: [
    { ranking: ["B+A", "B", "Q"], weight: 6 },
    { ranking: ["B", "Q", "B+A"], weight: 4 },
  ],
};

describe("thresholds per question kind (F27; RONR 1915 §33 p. 134)", () => {
  // RONR 1915 §33 p. 134 (djvu/140): "An amendment of a pending question requires only a majority vote for its
  // adoption, even though the question to be amended requires a two-thirds vote."
  it("the amendment is adopted by a majority although passage needs two-thirds; passage of the amended text then fails", () => {
    const r = analyseOrders({ rulebook: { voting, motions: mainNeedsTwoThirds }, measure, amendments: oneAmendment, profile });
    expect(r.thresholds).toMatchObject({ amendment: "majority", passage: "two-thirds", passageFrom: "main-motion" });
    expect(r.threshold).toBe("majority");
    const [order] = r.page.orders;
    expect(order.questions).toEqual(["A", "passage"]);
    expect(order.sincereSteps).toEqual([
      { question: "A", put: true, adopted: true },
      { question: "passage", put: true, adopted: false },
    ]);
    expect(order.sincere).toBe("Q");
    // Sophisticated voters see that adopting A kills the measure (B+A fails 6–4 under two-thirds, B passes 10–0) and reject A.
    expect(order.sophisticated).toBe("B");
  });
  it("one threshold for both (the earlier behaviour) gives other verdicts: two-thirds everywhere defeats the amendment and passes B", () => {
    const r = analyseOrders({ rulebook: { voting: { ...voting, amendmentThreshold: "two-thirds", passageThreshold: "two-thirds" } }, measure, amendments: oneAmendment, profile });
    expect(r.page.orders[0].sincereSteps[0]).toEqual({ question: "A", put: true, adopted: false });
    expect(r.page.orders[0].sincere).toBe("B");
  });
  it("the finding that an amendment kills the measure is judged under the passage threshold: B+A carries 6–4, short of two-thirds", () => {
    const labels = { measureKey: "B", measureLabel: "Bill 1", amendments: { A: { form: "insert", target: "s1", degree: 1 as const } } };
    const ids = (motions?: object[]) => {
      const a = analyseOrders({ rulebook: { voting, ...(motions ? { motions } : {}) }, measure, amendments: oneAmendment, profile });
      return buildFindings(a, { orders: a.page.orders, complete: true }, labels, "x").map((f) => f.id);
    };
    expect(ids(mainNeedsTwoThirds)).toContain("kills");
    expect(ids([{ id: "main", class: "main", vote: "majority" }])).not.toContain("kills");
  });
  it("voting.passageThreshold overrides the catalogue; without either, passage falls back to the amendment threshold", () => {
    const r = analyseOrders({ rulebook: { voting: { ...voting, passageThreshold: "majority" }, motions: mainNeedsTwoThirds }, measure, amendments: oneAmendment, profile });
    expect(r.thresholds).toMatchObject({ passage: "majority", passageFrom: "voting.passageThreshold" });
    expect(r.page.orders[0].sincere).toBe("B+A");
    const bare = analyseOrders({ rulebook: { voting }, measure, amendments: oneAmendment, profile });
    expect(bare.thresholds).toMatchObject({ passage: "majority", passageFrom: "voting.amendmentThreshold" });
  });
  it("exact counts agree with the listed orders under different thresholds for amendments and passage, and the passage threshold changes them", () => {
    const amendments = [
      { id: "A", target: "s1", form: "insert" },
      { id: "A2", target: "A", form: "insert" },
      { id: "C", target: "s2", form: "insert" },
    ];
    const twoSections = { id: "B", sections: [{ id: "s1" }, { id: "s2" }] };
    // A fictional profile (found by a seeded search for one where the passage threshold matters).
    const ballots = [
      { ranking: ["B+A+A2", "B+C", "B+A", "B", "Q", "B+A+A2+C", "B+A+C"], weight: 4 },
      { ranking: ["B+A+A2+C", "B+C", "B", "B+A", "B+A+A2", "B+A+C", "Q"], weight: 3 },
      { ranking: ["B", "B+A", "B+A+A2+C", "Q", "B+A+A2", "B+A+C", "B+C"], weight: 3 },
    ];
    const run = (vote: string) => analyseOrders({ rulebook: { voting: { procedure: "amendment", constraints: ["passage-last"], citation: "Fictional Chamber Rule 12" }, motions: [{ class: "main", vote }] }, measure: twoSections, amendments, profile: { ballots }, pageSize: 200 });
    const tally = (r: ReturnType<typeof run>, mode: "sincere" | "sophisticated") => {
      const out: Record<string, number> = {};
      for (const o of r.page.orders) out[o[mode]] = (out[o[mode]] ?? 0) + 1;
      return out;
    };
    for (const vote of ["two-thirds", "majority"]) {
      const r = run(vote);
      expect(r.page.orders.length).toBe(r.orders);
      expect(r.sincere).toEqual(tally(r, "sincere"));
      expect(r.sophisticated).toEqual(tally(r, "sophisticated"));
    }
    // Passage by two-thirds: B+A+A2 (7 of 10 against Q) passes, B+A+A2+C (6 of 10) does not.
    expect(run("two-thirds").sincere).toEqual({ Q: 1, "B+C": 5 });
    expect(run("majority").sincere).toEqual({ "B+C": 5, "B+A+A2+C": 1 });
    expect(run("two-thirds").sophisticated).toEqual({ "B+C": 5, "B+A+A2": 1 });
  });
});

describe("majority of the members counts against the membership (F28)", () => {
  // 30 ballots of a 40-seat chamber: 16 prefer B to Q, 14 prefer Q.
  const thirty = { ballots: [{ ranking: ["B", "Q"], weight: 16 }, { ranking: ["Q", "B"], weight: 14 }] };
  const rulebook = (chamber?: object) => ({ voting: { ...voting, passageThreshold: "majority-of-members", quorum: { kind: "none" } }, ...(chamber ? { chamber } : {}) });
  it("16 of 30 ballots do not pass a measure needing a majority of 40 members", () => {
    const r = analyseOrders({ rulebook: rulebook({ name: "Fictional", members: 40 }), measure, profile: thirty });
    expect(r.thresholds).toMatchObject({ passage: "majority-of-members", members: 40, membersFrom: "chamber.members" });
    expect(r.page.orders[0].sincere).toBe("Q");
    expect(r.sincere).toEqual({ Q: 1 });
  });
  it("the roster size is used when the rulebook gives no membership, and nothing else", () => {
    const r = analyseOrders({ rulebook: rulebook(), membership: 40, measure, profile: thirty });
    expect(r.thresholds).toMatchObject({ members: 40, membersFrom: "roster" });
    expect(r.page.orders[0].sincere).toBe("Q");
    const e = gavelError(() => analyseOrders({ rulebook: rulebook(), measure, profile: thirty }));
    expect(e.code).toBe("unprocessable");
    expect(e.issues[0].path).toBe("rulebook.chamber.members");
  });
});

describe("quorum (F28–F29; RONR 1915 §64)", () => {
  it("a majority of the members is more than half: 21 of 40 (RONR 1915 §64 p. 260 note: \"a bare majority of the membership\")", () => {
    expect(quorumStatus({ kind: "majority-of-members" }, 40, 20)).toMatchObject({ required: 21, met: false });
    expect(quorumStatus({ kind: "majority-of-members" }, 41, 21)).toMatchObject({ required: 21, met: true });
  });
  it("a fraction is rounded up: one third of 40 is 14; a fixed number; none; unknown membership is not checked", () => {
    expect(quorumStatus({ kind: "fraction", numerator: 1, denominator: 3 }, 40, 13)).toMatchObject({ required: 14, met: false });
    expect(quorumStatus({ kind: "fraction", numerator: 1, denominator: 3 }, 39, 13)).toMatchObject({ required: 13, met: true });
    expect(quorumStatus({ kind: "number", value: 13 }, 40, 13)).toMatchObject({ required: 13, met: true });
    expect(quorumStatus({ kind: "none" }, 40, 1)).toMatchObject({ required: 0, met: true });
    expect(quorumStatus({ kind: "majority-of-members" }, null, 3)).toMatchObject({ required: null, met: null });
  });
  it("an analysis below quorum says so instead of producing outcomes (RONR 1915 §64 p. 260: \"no question can be decided in the absence of a quorum\")", () => {
    const twelve = { ballots: [{ ranking: ["B", "Q"], weight: 7 }, { ranking: ["Q", "B"], weight: 5 }] };
    const rb = { voting: { ...voting, quorum: { kind: "number", value: 13 } }, chamber: { name: "Fictional", members: 40 } };
    const e = gavelError(() => analyseOrders({ rulebook: rb, measure, profile: twelve }));
    expect(e.code).toBe("unprocessable");
    expect(e.details).toMatchObject({ reason: "no-quorum", quorum: { required: 13, present: 12, met: false } });
    expect(gavelError(() => walkThrough({ rulebook: rb, measure, profile: twelve }, ["passage"])).details).toMatchObject({ reason: "no-quorum" });
    const ok = analyseOrders({ rulebook: rb, measure, profile: { ballots: [...twelve.ballots, { ranking: ["Q"], weight: 1 }] } });
    expect(ok.quorum).toEqual({ kind: "number", required: 13, present: 13, met: true });
  });
  it("the chair's ballot counts toward the quorum even when it votes only on a tie", () => {
    const rb = { voting: { ...voting, tieRule: "chair-casting-vote", quorum: { kind: "number", value: 5 } } };
    const r = analyseOrders({ rulebook: rb, measure, profile: { ballots: [{ ranking: ["B", "Q"], weight: 2 }, { ranking: ["Q", "B"], weight: 2 }, { ranking: ["B", "Q"], chair: true }] } });
    expect(r.quorum).toMatchObject({ present: 5, met: true });
    expect(r.chairBallot).toBe(true);
  });
});

describe("the chair's casting vote in an analysis (F29)", () => {
  // Three members for B, two for Q, and the chair for Q.
  const ballots = [{ ranking: ["B", "Q"], weight: 3 }, { ranking: ["Q", "B"], weight: 2 }, { ranking: ["Q", "B"], chair: true }];
  const outcome = (tieRule: string) => analyseOrders({ rulebook: { voting: { ...voting, tieRule } }, measure, profile: { ballots } }).page.orders[0].sincere;
  it("a chair with no vote unless the votes are equally divided leaves 3–2 for B (US Constitution art. I §3 cl. 4)", () => {
    expect(outcome("chair-casting-vote")).toBe("B");
  });
  it("a chair who votes makes it 3–3 and the measure is lost (RONR 1915 §46 p. 192)", () => {
    expect(outcome("chair-may-make-or-break-tie")).toBe("Q");
    expect(outcome("chair-votes")).toBe("Q");
    expect(outcome("motion-fails")).toBe("Q");
  });
  it("the casting vote decides an equal division, and the walk-through names the tie rule", () => {
    const tie = [{ ranking: ["B", "Q"], weight: 2 }, { ranking: ["Q", "B"], weight: 2 }, { ranking: ["B", "Q"], chair: true }];
    const input = { rulebook: { voting: { ...voting, tieRule: "chair-casting-vote" } }, measure, profile: { ballots: tie } };
    expect(analyseOrders(input).page.orders[0].sincere).toBe("B");
    const w = walkThrough(input, ["passage"]);
    expect(w.tieRule).toBe("chair-casting-vote");
    expect(w.sincere.steps[0]).toMatchObject({ for: 2, against: 2, adopted: true, castingVote: "for" });
    expect(w.sophisticated.steps[0]).toMatchObject({ for: 2, against: 2, adopted: true, castingVote: "for" });
    // Under the default rule the same ballots count the chair as a member: 3–2, no casting vote.
    const plain = walkThrough({ ...input, rulebook: { voting } }, ["passage"]);
    expect(plain.sincere.steps[0]).toMatchObject({ for: 3, against: 2, adopted: true });
    expect(plain.sincere.steps[0].castingVote).toBeUndefined();
  });
  it("the casting vote also decides a successive (yes/no) question", () => {
    const amendments = [{ id: "A", target: "s1", form: "insert" }];
    const ballots2 = [{ ranking: ["B+A", "B", "Q"], weight: 2 }, { ranking: ["B", "B+A", "Q"], weight: 2 }, { ranking: ["B+A", "B", "Q"], chair: true }];
    const run = (tieRule: string) => analyseOrders({ rulebook: { voting: { procedure: "successive", constraints: ["passage-last"], tieRule, citation: "Fictional Chamber Rule 12" } }, measure, amendments, profile: { ballots: ballots2 } }).page.orders[0];
    expect(run("chair-casting-vote").sincereSteps[0]).toEqual({ question: "A", put: true, adopted: true });
    const w = walkThrough({ rulebook: { voting: { procedure: "successive", constraints: ["passage-last"], tieRule: "chair-casting-vote", citation: "Fictional Chamber Rule 12" } }, measure, amendments, profile: { ballots: ballots2 } }, ["A", "passage"]);
    expect(w.sincere.steps[0]).toMatchObject({ for: 2, against: 2, castingVote: "for", adopted: true });
    // Without a ballot marked as the chair's there is no casting vote: 2–2 defeats the amendment.
    const noChair = analyseOrders({ rulebook: { voting: { procedure: "successive", constraints: ["passage-last"], tieRule: "chair-casting-vote", citation: "Fictional Chamber Rule 12" } }, measure, amendments, profile: { ballots: ballots2.slice(0, 2) } }).page.orders[0];
    expect(noChair.sincereSteps[0]).toEqual({ question: "A", put: true, adopted: false });
  });
  it("only one ballot can be the chair's, with weight 1; estimates and CSV say where", () => {
    const two = { ballots: [{ ranking: ["B", "Q"], chair: true }, { ranking: ["Q", "B"], chair: true }] };
    const e = gavelError(() => analyseOrders({ rulebook: { voting }, measure, profile: two }));
    expect(e.code).toBe("invalid-input");
    expect(e.issues[0].path).toBe("profile.ballots.1.chair");
    const heavy = gavelError(() => analyseOrders({ rulebook: { voting }, measure, profile: { ballots: [{ ranking: ["B"], weight: 2, chair: true }] } }));
    expect(heavy.issues[0].path).toBe("profile.ballots.0.weight");
    const content = estimateContentSchema.safeParse({ kind: "ballots", rows: [{ member: "Chair", ranking: ["B"], chair: true }, { member: "Other", ranking: ["Q"], chair: true }] });
    expect(content.success).toBe(false);
    expect(content.error?.issues[0].path).toEqual(["rows", 1, "chair"]);
    const rows = parseBallotCsv("member,weight,ranking,chair\nPresiding,1,B > Q,yes\nBloc,4,Q > B,\n", ["B", "Q"]);
    expect(rows.map((r) => r.chair === true)).toEqual([true, false]);
  });
});

describe("the voting section loads old and new rulebooks", () => {
  it("a voting section saved before these fields existed loads with the defaults (motion-fails; passage from the catalogue)", () => {
    const v = votingSectionSchema.parse({ procedure: "amendment", tieRule: "motion-fails", appealTieRule: "chair-sustained", amendmentThreshold: "majority", quorum: { kind: "majority-of-members" }, citation: "x" });
    expect(v.tieRule).toBe("motion-fails");
    expect(v.passageThreshold).toBeUndefined();
    expect(voteRules({ motions: [{ class: "main", vote: "two-thirds" }] }, v).passage).toBe("two-thirds");
  });
  it("a fraction quorum needs both terms; a fixed threshold needs a positive number", () => {
    expect(votingSectionSchema.safeParse({ procedure: "amendment", quorum: { kind: "fraction", numerator: 1 }, citation: "x" }).success).toBe(false);
    expect(votingSectionSchema.safeParse({ procedure: "amendment", passageThreshold: { kind: "number", value: 0 }, citation: "x" }).success).toBe(false);
    expect(votingSectionSchema.safeParse({ procedure: "amendment", passageThreshold: { kind: "number", value: 16 }, citation: "x" }).success).toBe(true);
  });
});

import { describe, expect, it } from "vitest";
import { analyseAgendas, distinctAgendaCount } from "../../../src/lib/voting/agendas-report.ts";
import { shepsleWeingast, sincereAmendment } from "../../../src/lib/voting/amendment-agenda.ts";
import { corePoint } from "../../../src/lib/voting/core-point.ts";
import { majorityFromInput } from "../../../src/lib/voting/majority-input.ts";
import { majorityReport } from "../../../src/lib/voting/majority-report.ts";
import { precedence } from "../../../src/lib/voting/precedence.ts";
import { scaleSpatial, spatialSchema, spatialTally } from "../../../src/lib/voting/spatial-profile.ts";
import { sincereSuccessive, sophisticatedSuccessive } from "../../../src/lib/voting/successive-agenda.ts";
import { winSet } from "../../../src/lib/voting/win-set.ts";

// Condorcet 1785, the standard paradox (DOMAIN §4).
const condorcet = {
  alternatives: ["a", "b", "c"],
  ballots: [{ ranking: ["a", "b", "c"] }, { ranking: ["b", "c", "a"] }, { ranking: ["c", "a", "b"] }],
};
// Tie rule: Robert's Rules of Order Revised (1915) §46 — a tie defeats the motion (DOMAIN §4).
const tie = { alternatives: ["a", "b", "c"], ballots: [{ ranking: ["a", "b", "c"], weight: 2 }, { ranking: ["b", "c", "a"], weight: 2 }] };
// pref_voting library documentation v1.18.1, four-alternative example (DOMAIN §4).
const four = { alternatives: ["0", "1", "2", "3"], edges: [["0", "2"], ["0", "3"], ["1", "0"], ["2", "1"], ["2", "3"], ["3", "1"]] as Array<[string, string]> };

describe("invalid input is rejected with its code", () => {
  it("unknown alternatives, duplicate rankings and two sources are invalid-input", () => {
    expect(() => majorityFromInput({ alternatives: ["a"], ballots: [{ ranking: ["z"] }] })).toThrow(expect.objectContaining({ code: "invalid-input" }));
    expect(() => majorityFromInput({ alternatives: ["a", "b"], ballots: [{ ranking: ["a", "a"] }] })).toThrow(expect.objectContaining({ code: "invalid-input" }));
    expect(() => majorityFromInput({ alternatives: ["a", "b"], ballots: [], edges: [] })).toThrow(expect.objectContaining({ code: "invalid-input" }));
    expect(() => majorityFromInput({ alternatives: ["a", "b"], margins: { a: { b: 2 }, b: { a: 1 } } })).toThrow(expect.objectContaining({ code: "invalid-input" }));
    expect(() => majorityFromInput({ alternatives: ["a", "b"], edges: [["a", "b"]], quota: "two-thirds" })).toThrow(expect.objectContaining({ code: "invalid-input" }));
  });
  it("cyclic ordering constraints are unprocessable", () => {
    expect(() => analyseAgendas({ ...condorcet, procedure: "amendment", constraints: { before: [["a", "b"], ["b", "a"]] } })).toThrow(expect.objectContaining({ code: "unprocessable" }));
  });
  it("an order that breaks the constraints is invalid-input", () => {
    expect(() => analyseAgendas({ ...condorcet, procedure: "amendment", constraints: { last: "c" }, order: ["c", "a", "b"] })).toThrow(expect.objectContaining({ code: "invalid-input" }));
  });
});

describe("edge cases", () => {
  it("one alternative: it is every set and the only outcome (common practice, no source)", () => {
    const { graph } = majorityFromInput({ alternatives: ["only"], ballots: [{ ranking: ["only"] }] });
    const r = majorityReport(graph);
    expect([r.condorcetWinner, r.topCycle, r.banksSet]).toEqual(["only", ["only"], ["only"]]);
    expect(analyseAgendas({ alternatives: ["only"], ballots: [{ ranking: ["only"] }], procedure: "amendment" })).toMatchObject({ orders: 1, sincere: { only: 1 } });
  });
  it("partial ballots: abstain drops the pair, bottom ranks unranked last (DOMAIN §1, conventions A and B)", () => {
    const input = { alternatives: ["a", "b", "c"], ballots: [{ ranking: ["a"] }, { ranking: ["b", "c"] }] };
    expect(majorityFromInput({ ...input, partial: "abstain" }).graph.margins[0][1]).toBe(0);
    expect(majorityFromInput({ ...input, partial: "bottom" }).graph.margins[0][1]).toBe(0);
    expect(majorityFromInput({ ...input, partial: "abstain" }).graph.margins[1][0]).toBe(0);
    expect(majorityFromInput({ ...input, partial: "abstain" }).graph.margins[0][2]).toBe(0);
    expect(majorityFromInput({ ...input, partial: "bottom" }).graph.margins[0][2]).toBe(0);
    expect(majorityFromInput({ ...input, partial: "bottom" }).graph.margins[1][2]).toBe(1);
    expect(majorityFromInput({ alternatives: ["a", "b", "c"], ballots: [{ ranking: ["a"] }], partial: "bottom" }).graph.margins[0][1]).toBe(1);
    expect(majorityFromInput({ alternatives: ["a", "b", "c"], ballots: [{ ranking: ["a"] }], partial: "abstain" }).graph.margins[0][1]).toBe(0);
  });
  it("a two-thirds quota leaves a 3–2 pair without an edge (Robert's Rules of Order Revised 1915, §48 p. 204: \"A two-thirds vote means two-thirds of the votes cast, ignoring blanks\"; §68 p. 270: \"two-thirds of the votes cast, a quorum being present\")", () => {
    const ballots = [{ ranking: ["a", "b"], weight: 3 }, { ranking: ["b", "a"], weight: 2 }];
    expect(majorityFromInput({ alternatives: ["a", "b"], ballots }).graph.beats[0][1]).toBe(true);
    const g = majorityFromInput({ alternatives: ["a", "b"], ballots, quota: "two-thirds" }).graph;
    expect([g.beats[0][1], g.beats[1][0]]).toEqual([false, false]);
  });
});

describe("Condorcet paradox (Condorcet 1785; DOMAIN §4)", () => {
  const { graph, profile } = majorityFromInput(condorcet);
  it("majority a→b, b→c, c→a; no Condorcet winner; TC = UC = Banks = {a,b,c}", () => {
    expect([graph.beats[0][1], graph.beats[1][2], graph.beats[2][0]]).toEqual([true, true, true]);
    const r = majorityReport(graph);
    expect(r.condorcetWinner).toBeNull();
    expect(r.topCycle).toEqual(["a", "b", "c"]);
    expect(r.uncoveredSet).toEqual(["a", "b", "c"]);
    expect(r.banksSet).toEqual(["a", "b", "c"]);
  });
  it("over all 6 orders each procedure yields each alternative exactly twice", () => {
    const two = { a: 2, b: 2, c: 2 };
    for (const procedure of ["amendment", "successive"] as const) {
      const r = analyseAgendas({ ...condorcet, procedure });
      expect(r.orders).toBe(6);
      expect(r.sincere).toEqual(two);
      expect(r.sophisticated).toEqual(two);
    }
  });
  it("order (a,b,c): sincere amendment c; sophisticated amendment b with chain [c,b]; sophisticated successive a", () => {
    expect(graph.alternatives[sincereAmendment(graph, [0, 1, 2])]).toBe("c");
    expect(shepsleWeingast(graph, [0, 1, 2])).toEqual({ chain: [2, 1], outcome: 1 });
    expect(sophisticatedSuccessive(graph, [0, 1, 2]).outcome).toBe(0);
    expect(analyseAgendas({ ...condorcet, procedure: "amendment", order: ["a", "b", "c"] }).order).toMatchObject({ sincere: "c", sophisticated: "b", chain: ["c", "b"] });
    expect(analyseAgendas({ ...condorcet, procedure: "successive", order: ["a", "b", "c"] }).order).toMatchObject({ sophisticated: "a" });
    // Sincere successive on (a,b,c): a is only one member's top; b is two members' top of {b,c} (definition in successive-agenda.ts).
    expect(sincereSuccessive(profile!, "majority", [0, 1, 2])).toBe(1);
  });
  it("order (c,b,a): sincere a, sophisticated c", () => {
    expect(analyseAgendas({ ...condorcet, procedure: "amendment", order: ["c", "b", "a"] }).order).toMatchObject({ sincere: "a", sophisticated: "c" });
  });
});

describe("tie rule (Robert's Rules of Order Revised 1915, §46; DOMAIN §4)", () => {
  it("a–b and a–c tie, b beats c; order (b,a,c): sincere c, sophisticated b", () => {
    const { graph } = majorityFromInput(tie);
    expect([graph.margins[0][1], graph.margins[0][2], graph.beats[1][2]]).toEqual([0, 0, true]);
    const r = analyseAgendas({ ...tie, procedure: "amendment", order: ["b", "a", "c"] });
    expect(r.order).toMatchObject({ sincere: "c", sophisticated: "b" });
    expect(r.order!.votes.sincere!.map((v) => [v.for, v.against, v.adopted])).toEqual([[2, 2, false], [2, 2, false]]);
  });
});

describe("four alternatives (pref_voting documentation v1.18.1; DOMAIN §4)", () => {
  it("top cycle {0,1,2,3}; uncovered = Banks = {0,1,2}", () => {
    const r = majorityReport(majorityFromInput(four).graph);
    expect(r.topCycle).toEqual(["0", "1", "2", "3"]);
    expect(r.uncoveredSet).toEqual(["0", "1", "2"]);
    expect(r.banksSet).toEqual(["0", "1", "2"]);
  });
  it("over all 24 orders: sincere {0:10,1:6,2:6,3:2}; sophisticated {0:12,1:6,2:6}", () => {
    const r = analyseAgendas({ ...four, procedure: "amendment" });
    expect(r.orders).toBe(24);
    expect(r.sincere).toEqual({ 0: 10, 1: 6, 2: 6, 3: 2 });
    expect(r.sophisticated).toEqual({ 0: 12, 1: 6, 2: 6 });
  });
});

describe("spatial check values (worked by hand, DOMAIN §4)", () => {
  const s = scaleSpatial(spatialSchema.parse({ dimensions: ["x", "y"], members: [{ ideal: [0, 0] }, { ideal: [4, 0] }, { ideal: [0, 3] }], statusQuo: [2, 2] }));
  const pt = (x: number, y: number) => [BigInt(x), BigInt(y)];
  it("(2,0), (1,2) and (2,1) each beat (2,2) by 2–1", () => {
    for (const [x, y] of [[2, 0], [1, 2], [2, 1]]) expect(spatialTally(s, pt(x, y), s.statusQuo)).toEqual({ forP: 2, forQ: 1, indifferent: 0 });
  });
  it("(1,1) ties 1–1 with one member indifferent, so the status quo survives", () => {
    expect(spatialTally(s, pt(1, 1), s.statusQuo)).toEqual({ forP: 1, forQ: 1, indifferent: 1 });
  });
  it("the win set's minimal winning coalitions are the three pairs; no core point for three non-collinear members (Plott 1967)", () => {
    expect(winSet(s, s.statusQuo).coalitions).toEqual([[0, 1], [0, 2], [1, 2]]);
    expect(corePoint(s).exists).toBe(false);
  });
  it("one dimension, ideals {1,3,4,8,10}: 4 is the core (Black 1948)", () => {
    const one = scaleSpatial(spatialSchema.parse({ dimensions: ["x"], members: [1, 3, 4, 8, 10].map((v) => ({ ideal: [v] })), statusQuo: [0] }));
    expect(corePoint(one)).toMatchObject({ exists: true, interval: [4, 4] });
    for (const other of [-5, 0, 2, 3, 5, 7, 8, 12]) {
      const t = spatialTally(one, [4n], [BigInt(other)]);
      expect(t.forP).toBeGreaterThan(t.forQ);
    }
  });
});

describe("counts (DOMAIN §4: amendment agendas n!/2)", () => {
  it("n = 2…6 give 1, 3, 12, 60, 360 distinct agendas", () => {
    expect([2, 3, 4, 5, 6].map((n) => distinctAgendaCount(precedence(n, [])))).toEqual([1, 3, 12, 60, 360]);
  });
});

// The projected tally of each sincere vote on an amendment tree (questionAgenda.sincereTally), read
// back over exactly the set of versions the engine's own decision uses.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { amendmentTreeModel } from "../../../src/lib/voting/amendment-versions.ts";
import { majorityGraph } from "../../../src/lib/voting/majority-graph.ts";
import { profileFromRankings } from "../../../src/lib/voting/profile.ts";
import { questionAgenda, sincereQuestionPath } from "../../../src/lib/voting/question-agenda.ts";
import { adopts, THRESHOLDS } from "../../../src/lib/voting/vote-threshold.ts";
import { range } from "./helpers.ts";

// A fictional bill with two mutually exclusive amendments to overlapping lines of one section:
// versions Q, B, B+A, B+D; questions A = 0, D = 1, passage = 2.
const exclusive = amendmentTreeModel({
  measure: { id: "B", sections: [{ id: "s1" }] },
  amendments: [
    { id: "A", target: "s1", form: "strike-and-insert", lines: [1, 3] },
    { id: "D", target: "s1", form: "strike", lines: [2, 5] },
  ],
});
const names = exclusive.versions.map((v) => v.id);
const at = (id: string) => names.indexOf(id);
const ballots = (w: number) =>
  [
    { ranking: ["B+D", "B+A", "B", "Q"], weight: w },
    { ranking: ["B+A", "B+D", "B", "Q"], weight: 3 },
    { ranking: ["B", "B+D", "Q", "B+A"], weight: 2 },
    { ranking: ["Q"], weight: 1 },
  ].map((b) => ({ ranking: b.ranking.map(at), weight: b.weight }));

function agenda(w: number, procedure: "amendment" | "successive") {
  const profile = profileFromRankings(names, ballots(w), "abstain");
  return questionAgenda(exclusive, majorityGraph(profile), profile, procedure);
}

describe("edge cases", () => {
  it("without a profile there is no tally to show", () => {
    const profile = profileFromRankings(names, ballots(4), "abstain");
    const qa = questionAgenda(exclusive, majorityGraph(profile), null, "successive");
    expect(qa.sincereTally(1, 0, 0)).toBeNull();
  });
  it("a tie on a successive proposal rejects it (Robert's Rules of Order Revised 1915, §46; docs/sources.md §1)", () => {
    const qa = agenda(5, "successive");
    expect(qa.sincereTally(1, 0, 0)).toEqual({ forWeight: 5, againstWeight: 5 });
    expect(qa.sincereAdopts(1, 0, 0)).toBe(false);
  });
});

describe("successive procedure: worked example (hand-computed, no source; sincere definition of docs/sources.md §1 [MEM])", () => {
  // Order D, A, passage. Member groups (weight): 4 rank B+D > B+A > B > Q; 3 rank B+A > B+D > B > Q;
  // 2 rank B > B+D > Q > B+A; 1 ranks only Q (partial ballot, convention A: abstains elsewhere).
  const qa = agenda(4, "successive");

  it("D is weighed against every version still within reach (Q, B, B+A): 4 for, 5 against, rejected", () => {
    expect(qa.successiveField(1, 0, 0).map((v) => names[v]).sort()).toEqual(["B", "B+A", "B+D", "Q"]);
    // Only the first group ranks B+D top; the 3 and the 2 each prefer something still available; the 1 abstains.
    expect(qa.sincereTally(1, 0, 0)).toEqual({ forWeight: 4, againstWeight: 5 });
  });
  it("then A against Q and B only: 7 for (4 + 3), 2 against, adopted; passage B+A over Q by 7 to 2", () => {
    const decided = 1 << 1;
    expect(qa.successiveField(0, decided, 0).map((v) => names[v]).sort()).toEqual(["B", "B+A", "Q"]);
    expect(qa.sincereTally(0, decided, 0)).toEqual({ forWeight: 7, againstWeight: 2 });
    expect(qa.sincereTally(2, decided | 1, 1)).toEqual({ forWeight: 7, againstWeight: 2 });
    const path = sincereQuestionPath(qa, [1, 0, 2]);
    expect(path.steps.map((s) => s.adopted)).toEqual([false, true, true]);
    expect(names[path.outcome]).toBe("B+A");
  });
  it("the same vote on D under the amendment procedure compares only B+D with B: 7 for, 2 against", () => {
    expect(agenda(4, "amendment").sincereTally(1, 0, 0)).toEqual({ forWeight: 7, againstWeight: 2 });
  });
});

// A perfecting amendment A with a second-degree A2, a substitute S, an independent C (docs/sources.md §2 shape).
const tree = amendmentTreeModel({
  measure: { id: "B", sections: [{ id: "s1" }, { id: "s2" }] },
  amendments: [
    { id: "A", target: "s1", form: "strike-and-insert", lines: [1, 3] },
    { id: "A2", target: "A", form: "insert" },
    { id: "S", target: "B", form: "substitute" },
    { id: "C", target: "s2", form: "insert", lines: [4, 4] },
  ],
});
const nv = tree.versions.length;
const qn = tree.amendments.length + 1;

describe("property: the tallies decide every sincere vote the engine reports (common practice, no source)", () => {
  it("each put question is adopted iff its tally meets the threshold; replaying the tallies reaches the engine's outcome", () => {
    const ballot = fc.record({ ranking: fc.shuffledSubarray(range(nv), { minLength: 1, maxLength: nv }), weight: fc.integer({ min: 1, max: 5 }) });
    fc.assert(
      fc.property(
        fc.array(ballot, { minLength: 1, maxLength: 7 }),
        fc.constantFrom("abstain" as const, "bottom" as const),
        fc.constantFrom(...THRESHOLDS),
        fc.constantFrom("amendment" as const, "successive" as const),
        fc.shuffledSubarray(range(qn), { minLength: qn, maxLength: qn }),
        (bs, partial, threshold, procedure, order) => {
          const profile = profileFromRankings(tree.versions.map((v) => v.id), bs, partial);
          const qa = questionAgenda(tree, majorityGraph(profile, threshold), profile, procedure);
          const path = sincereQuestionPath(qa, order);
          let decided = 0;
          let adopted = 0;
          path.steps.forEach((s, i) => {
            const x = order[i];
            expect(s.put).toBe(!qa.falls(x, decided, adopted));
            if (s.put) {
              const t = qa.sincereTally(x, decided, adopted)!;
              expect(t.forWeight + t.againstWeight).toBeLessThanOrEqual(profile.totalWeight);
              const yes = adopts(t.forWeight, t.againstWeight, profile.totalWeight, threshold);
              expect(s.adopted).toBe(yes);
              if (yes) adopted = qa.vote(x, adopted).yesState;
            }
            decided |= 1 << x;
          });
          expect(qa.outcome(adopted)).toBe(path.outcome);
        },
      ),
      { numRuns: 300 },
    );
  });
});

/**
 * Sophisticated counts on amendment trees against enumeration. Sophisticated voting is backward
 * induction on the binary voting tree of each order: a leaf's value is its version, a node's value is
 * the winner, under the question's threshold, between its two children's values (docs/sources.md §1,
 * "Sophisticated voting": Farquharson 1969; McKelvey & Niemi 1978; applied to amendment trees by
 * Ordeshook & Schwartz 1987 and Banks 1989, §2 "Amendment trees are not simple agendas").
 * The count (src/lib/voting/question-counts.ts) never lists the orders; here every permutation of the
 * questions is tried, kept when the chamber's constraints allow it, and solved on its own by
 * `sophisticatedQuestionOutcome`. Wide trees (the House tree beside independent amendments) with random
 * ballots are the case where the count's tables stop merging and it evaluates depth first, so the count
 * is checked at every point where it can switch from tables to depth-first evaluation.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { OrderConstraint } from "../../../src/lib/procedure/voting-section.ts";
import { amendmentTreeModel } from "../../../src/lib/voting/amendment-versions.ts";
import { majorityGraph } from "../../../src/lib/voting/majority-graph.ts";
import { questionPrecedence } from "../../../src/lib/voting/order-constraints.ts";
import { isLegalOrder } from "../../../src/lib/voting/precedence.ts";
import { profileFromRankings } from "../../../src/lib/voting/profile.ts";
import { questionAgenda, sophisticatedQuestionOutcome } from "../../../src/lib/voting/question-agenda.ts";
import { sophisticatedQuestionCounts } from "../../../src/lib/voting/question-counts.ts";
import { permutations, range } from "./helpers.ts";
import { randomTree } from "./tree-arbitrary.ts";

const HOUSE: OrderConstraint[] = ["secondary-before-primary", "perfecting-before-substitute", "passage-last", "primary-contiguous"];
const WITH_F5: OrderConstraint[] = [...HOUSE, "perfecting-after-rejected-substitute"];
const OLD_DEFAULT: OrderConstraint[] = ["secondary-before-primary", "perfecting-before-substitute", "passage-last"];

// The House tree (House Rule XVI cl. 6): amendment A1, its amendment, a substitute for A1 and the substitute's amendment.
const houseTree = [
  { id: "A1", target: "s1", form: "strike-and-insert", lines: [1, 2] },
  { id: "A1x", target: "A1", form: "insert" },
  { id: "S1", target: "A1", form: "substitute" },
  { id: "S1x", target: "S1", form: "strike" },
];
/** The House tree (or part of it) beside `independent` amendments to further sections: many orders, all combinations reachable. */
function wideTree(house: number, independent: number) {
  const sections = 1 + independent;
  return {
    measure: { id: "B", sections: range(sections).map((i) => ({ id: `s${i + 1}` })) },
    amendments: [...houseTree.slice(0, house), ...range(independent).map((i) => ({ id: `A${i + 2}`, target: `s${i + 2}`, form: "insert", lines: [3, 3] }))],
  };
}

/** Random ballots: `members` members, each ranking a random subset of the versions (the rest abstain), seeded. */
function randomBallots(versionIds: string[], members: number, seed: number) {
  let s = seed;
  const rand = (m: number) => ((s = (s * 1103515245 + 12345) % 2147483648), s % m);
  const ballots = range(members).map(() => {
    const r = range(versionIds.length);
    for (let i = r.length - 1; i > 0; i--) {
      const j = rand(i + 1);
      [r[i], r[j]] = [r[j], r[i]];
    }
    return { ranking: r.slice(0, 2 + rand(versionIds.length - 1)), weight: 1 + rand(3) };
  });
  return profileFromRankings(versionIds, ballots, "abstain");
}

function check(tree: { measure: { id: string; sections: Array<{ id: string }> }; amendments: unknown[] }, constraints: OrderConstraint[], seed: number, members: number) {
  const model = amendmentTreeModel(tree as Parameters<typeof amendmentTreeModel>[0]);
  const prec = questionPrecedence(model, constraints);
  const n = model.amendments.length + 1;
  const legal = [...permutations(range(n))].filter((o) => isLegalOrder(prec, o));
  const profile = randomBallots(model.versions.map((v) => v.id), members, seed);
  const qa = questionAgenda(model, majorityGraph(profile), profile, "amendment");
  const expected = new Array<number>(model.versions.length).fill(0);
  for (const o of legal) expected[sophisticatedQuestionOutcome(qa, o)]++;
  expect(expected.reduce((a, b) => a + b, 0)).toBe(legal.length);
  expect(sophisticatedQuestionCounts(qa, prec)).toEqual(expected);
  // Every switch point from interned tables to depth-first evaluation gives the same counts.
  for (let tail = 0; tail <= n; tail++) expect(sophisticatedQuestionCounts(qa, prec, {}, { depthFirstTail: tail })).toEqual(expected);
  return legal.length;
}

describe("sophisticated counts equal backward induction on every legal order, enumerated", () => {
  it("wide trees (House tree beside independent amendments), random ballots, House, House + F5 and the old default", () => {
    let orders = 0;
    for (const [house, independent] of [[4, 2], [4, 3], [2, 4], [0, 6], [1, 5]] as const)
      for (const constraints of [HOUSE, WITH_F5, OLD_DEFAULT])
        for (const seed of [1, 2]) orders += check(wideTree(house, independent), constraints, seed * 7919 + house * 31 + independent, 7 + seed * 10);
    // Guard against a vacuous run: the wide trees do have many legal orders.
    expect(orders).toBeGreaterThan(10_000);
  });
  it("random trees (every shape: substitutes, second-degree amendments, exclusive amendments), random ballots", () => {
    fc.assert(
      fc.property(randomTree(1, 6), fc.constantFrom(HOUSE, WITH_F5, OLD_DEFAULT), fc.nat(100_000), fc.integer({ min: 1, max: 40 }), (amendments, constraints, seed, members) => {
        check({ measure: { id: "B", sections: [{ id: "s1" }, { id: "s2" }, { id: "s3" }] }, amendments }, constraints, seed, members);
      }),
      { numRuns: 60 },
    );
  });
});

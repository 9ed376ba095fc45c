// Legal voting orders of an amendment tree under the rulebook's order constraints (issue 13 item 2):
// one primary amendment pending at a time (F3), the original text perfected before the substitute's
// amendments (F4), perfecting amendments in order again after a rejected substitute (F5), and the
// House tree whose substitute is a substitute for the amendment (F2, voting side). Sources:
//  - Robert's Rules of Order Revised (1915) [RONR], §33, read at
//    https://en.wikisource.org/wiki/Page:Robert%27s_Rules_of_Order_-_1915.djvu/148 (p. 142) and /151 (p. 145),
//    and the 4th ed. scan …/Roberts_Rules_of_Order_Revised_4th_Edition_(1915).djvu/141 (p. 135 and fn. 1);
//  - Robert's Parliamentary Practice (1922) ch. IV, https://en.wikisource.org/wiki/Page:Robert%27s_Parliamentary_Practice.djvu/49;
//  - House Rules Manual annotation to Rule XVI: "It is not in order to offer more than one motion to amend of
//    the same nature at a time (V, 5755; VIII, 2831)" (as quoted in the project's procedure review);
//  - CRS Report 98-613 (Davis, 2008), on the substitute for a first-degree amendment.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { OrderConstraint } from "../../../src/lib/procedure/voting-section.ts";
import { walkThrough } from "../../../src/lib/estimates/walk-through.ts";
import { analyseOrders } from "../../../src/lib/voting/analyse-orders.ts";
import { amendmentTreeModel, type AmendmentTreeModel } from "../../../src/lib/voting/amendment-versions.ts";
import { countLegalOrders } from "../../../src/lib/voting/count-orders.ts";
import { legalOrderPage, legalOrders } from "../../../src/lib/voting/legal-orders.ts";
import { majorityGraph } from "../../../src/lib/voting/majority-graph.ts";
import { questionPrecedence } from "../../../src/lib/voting/order-constraints.ts";
import { profileFromRankings } from "../../../src/lib/voting/profile.ts";
import { questionAgenda, sincereQuestionPath, sophisticatedQuestionOutcome } from "../../../src/lib/voting/question-agenda.ts";
import { sincereQuestionCounts, sophisticatedQuestionCounts } from "../../../src/lib/voting/question-counts.ts";
import { permutations, range } from "./helpers.ts";
import { randomTree } from "./tree-arbitrary.ts";

const HOUSE: OrderConstraint[] = ["secondary-before-primary", "perfecting-before-substitute", "passage-last", "primary-contiguous"];
const WITH_F5: OrderConstraint[] = [...HOUSE, "perfecting-after-rejected-substitute"];
const OLD_DEFAULT: OrderConstraint[] = ["secondary-before-primary", "perfecting-before-substitute", "passage-last"];

const measure = { id: "B", sections: [{ id: "s1" }, { id: "s2" }] };
// The review's example (F3): A amends s1, A2 amends A, C amends s2, S is a substitute for the bill, S2 amends S.
const reviewTree = [
  { id: "A", target: "s1", form: "strike-and-insert", lines: [1, 3] },
  { id: "A2", target: "A", form: "insert" },
  { id: "S", target: "B", form: "substitute" },
  { id: "S2", target: "S", form: "strike" },
  { id: "C", target: "s2", form: "insert", lines: [4, 4] },
];
// The ordinary House tree (House Rule XVI cl. 6): S is "by way of substitute" for the amendment A.
const houseTree = [
  { id: "A", target: "s1", form: "strike-and-insert", lines: [1, 3] },
  { id: "A2", target: "A", form: "insert" },
  { id: "S", target: "A", form: "substitute" },
  { id: "S2", target: "S", form: "strike" },
];

function ordersOf(amendments: unknown[], constraints: OrderConstraint[], ballots = [{ ranking: ["B", "Q"] }]) {
  const r = analyseOrders({ rulebook: { voting: { procedure: "amendment", citation: "Fictional Chamber Rule 12", constraints } }, measure, amendments, profile: { ballots }, pageSize: 200 });
  return { r, orders: r.page.orders.map((o) => o.questions.join(" ")) };
}

describe("one primary amendment pending at a time (F3)", () => {
  it("the review's example under House constraints: only A2 A C S2 S and C A2 A S2 S, then passage", () => {
    // Robert's Parliamentary Practice (1922) ch. IV: "While a primary amendment is pending no other primary
    // amendment of the same motion is in order. After a primary amendment has been voted on another primary
    // amendment is in order". RONR 1915 §33 p. 145: "no other amendment of that degree is in order until this
    // is acted upon". With the substitute voted after the perfecting amendments (RONR §33 p. 142; House Rule
    // XVI cl. 6), only these two orders remain.
    const { r, orders } = ordersOf(reviewTree, HOUSE);
    expect(orders).toEqual(["A2 A C S2 S passage", "C A2 A S2 S passage"]);
    expect(r.orders).toBe(2);
    expect(r.blocks).toEqual([["A", "A2"], ["S", "S2"]]);
  });
  it("without primary-contiguous a second primary is voted while the first is pending (A2 C A …): the old superset", () => {
    // The negative of the same rule: C between A2 and A means C was voted while A was pending.
    const { orders } = ordersOf(reviewTree, OLD_DEFAULT);
    expect(orders).toContain("A2 C A S2 S passage");
    expect(ordersOf(reviewTree, HOUSE).orders).not.toContain("A2 C A S2 S passage");
  });
});

describe("the walk-through refuses an order the rulebook does not allow", () => {
  it("A2 C A …: C voted while A is pending is unprocessable under primary-contiguous; a legal order walks through", () => {
    // Robert's Parliamentary Practice (1922) ch. IV (one primary amendment pending at a time).
    const raw = { rulebook: { voting: { procedure: "amendment", citation: "Fictional Chamber Rule 12", constraints: HOUSE } }, measure, amendments: reviewTree, profile: { ballots: [{ ranking: ["B", "Q"] }] } };
    expect(() => walkThrough(raw, ["A2", "C", "A", "S2", "S", "passage"])).toThrow(expect.objectContaining({ code: "unprocessable" }));
    expect(walkThrough(raw, ["C", "A2", "A", "S2", "S", "passage"]).order).toEqual(["C", "A2", "A", "S2", "S", "passage"]);
  });
});

describe("the original text is perfected before the substitute's amendments (F4)", () => {
  it("no perfecting amendment of the replaced text is voted after an amendment to the substitute and before the substitute", () => {
    // RONR 1915 §33 p. 142: "[amendments] to be struck out, these amendments being of the second degree. After it is
    // perfected by its friends, the chair asks if there are any amendments proposed to the paragraph to be inserted.
    // When both paragraphs have been perfected by amendments the question is put on substituting one paragraph for the other."
    // Without contiguity the rule still holds: S2 follows every perfecting amendment voted before S.
    const { orders } = ordersOf(reviewTree, OLD_DEFAULT);
    for (const o of orders) {
      const q = o.split(" ");
      for (const p of ["A", "A2", "C"]) expect(q.indexOf(p)).toBeLessThan(q.indexOf("S2"));
    }
    expect(orders).not.toContain("S2 A2 A C S passage");
    expect(orders).toHaveLength(3);
  });
});

describe("after a rejected substitute the retained text may be further amended (F5)", () => {
  // RONR 1915 §33 p. 142: "If the motion to substitute is lost, the assembly has only decided that that particular
  // paragraph shall not replace the one specified. It may be willing that it replace some other paragraph, or that
  // it be inserted, or that the paragraph retained in the resolution be further amended, or even struck out."
  it("both 'C before S' and 'C after S' orders are legal; nothing is voted between S2 and S", () => {
    const { r, orders } = ordersOf(reviewTree, WITH_F5);
    expect(orders).toEqual(["A2 A S2 S C passage", "A2 A C S2 S passage", "S2 S A2 A C passage", "S2 S C A2 A passage", "C A2 A S2 S passage", "C S2 S A2 A passage"]);
    expect(r.notBetween).toEqual([{ span: ["S", "S2"], excludes: ["A", "A2", "C"] }]);
  });
  it("after S is adopted the perfecting amendments of the text it replaced fall; after it is rejected they are put", () => {
    // Members who prefer the bill as substituted adopt S: A2, A and C fall (their text is gone).
    const adoptS = ordersOf(reviewTree, WITH_F5, [{ ranking: ["B+S", "B+A", "B+C", "B", "Q"] }]).r.page.orders.find((o) => o.questions.join(" ") === "S2 S A2 A C passage")!;
    expect(adoptS.sincereSteps.map((s) => [s.question, s.put, s.adopted])).toEqual([["S2", true, false], ["S", true, true], ["A2", false, undefined], ["A", false, undefined], ["C", false, undefined], ["passage", true, true]]);
    // Members who reject S then perfect the retained text: A and C are put and adopted.
    const rejectS = ordersOf(reviewTree, WITH_F5, [{ ranking: ["B+A+C", "B+A", "B+C", "B", "B+S", "Q"] }]).r.page.orders.find((o) => o.questions.join(" ") === "S2 S A2 A C passage")!;
    expect(rejectS.sincereSteps.map((s) => [s.question, s.put, s.adopted])).toEqual([["S2", true, false], ["S", true, false], ["A2", true, false], ["A", true, true], ["C", true, true], ["passage", true, true]]);
    expect(rejectS.sincere).toBe("B+A+C");
  });
  it("general parliamentary law, a substitute for a section: perfect the section (P), perfect the substitute (S2), then S — or P after a rejected S", () => {
    // RONR 1915 §33 pp. 140–142 (a substitute for a paragraph; amendments to the paragraph to be struck out first).
    const tree = [
      { id: "P", target: "s1", form: "strike", lines: [2, 2] },
      { id: "S", target: "s1", form: "substitute" },
      { id: "S2", target: "S", form: "insert" },
    ];
    expect(ordersOf(tree, HOUSE).orders).toEqual(["P S2 S passage"]);
    expect(ordersOf(tree, WITH_F5).orders).toEqual(["P S2 S passage", "S2 S P passage"]);
  });
});

describe("the House tree: a substitute for the amendment, with its own amendment (House Rule XVI cl. 6; F2, voting side)", () => {
  // House Rule XIX as quoted in RONR 1915 §33 p. 135 fn. 1: "a motion to amend and a motion to amend that amendment
  // shall be in order, and it shall also be in order to offer a further amendment by way of substitute, to which one
  // amendment may be offered, but which shall not be voted on until the original matter is perfected". CRS 98-613:
  // "Such a substitute is treated as a first-degree amendment … Like the original first-degree amendment, this one
  // also is subject to second-degree amendments."
  it("is accepted, with the substitute at degree 1 in A's substitute slot and S2 at degree 2", () => {
    const model = amendmentTreeModel({ measure, amendments: houseTree });
    expect(model.amendments.map((a) => a.id)).toEqual(["A", "A2", "S", "S2"]);
    expect(model.degree).toEqual([1, 2, 1, 2]);
    expect(model.versions.map((v) => v.id)).toEqual(["Q", "B", "B+A", "B+A+A2", "B+A+S", "B+A+S+S2"]);
    const { r } = ordersOf(houseTree, HOUSE);
    expect(r.questions.find((q) => q.id === "S")).toMatchObject({ degree: 1, substituteFor: "A" });
  });
  it("has one legal order, A2 S2 S A passage; with F5 also S2 S A2 A passage", () => {
    expect(ordersOf(houseTree, HOUSE).orders).toEqual(["A2 S2 S A passage"]);
    expect(ordersOf(houseTree, WITH_F5).orders).toEqual(["A2 S2 S A passage", "S2 S A2 A passage"]);
  });
  it("adopting S replaces A's text as perfected; the question is then on A as amended by S", () => {
    const model = amendmentTreeModel({ measure, amendments: houseTree });
    const g = majorityGraph(profileFromRankings(model.versions.map((v) => v.id), [{ ranking: [4, 3, 2, 1, 0], weight: 1 }], "abstain"));
    const qa = questionAgenda(model, g, null, "amendment");
    const [A, A2, S] = [0, 1, 2];
    // A2 adopted, then S: compares A as amended by S (B+A+S) with A as perfected (B+A+A2).
    const v = qa.vote(S, 1 << A2);
    expect([model.versions[v.yesVersion].id, model.versions[v.noVersion].id]).toEqual(["B+A+S", "B+A+A2"]);
    // Then the question on A compares the measure with A (as amended by S) against the measure without it.
    const w = qa.vote(A, (1 << A2) | (1 << S));
    expect([model.versions[w.yesVersion].id, model.versions[w.noVersion].id]).toEqual(["B+A+S", "B"]);
    // A2 voted after an adopted S (F5 order) falls; after a rejected S it is put.
    expect(qa.falls(A2, (1 << 3) | (1 << S), 1 << S)).toBe(true);
    expect(qa.falls(A2, (1 << 3) | (1 << S), 0)).toBe(false);
  });
  it("an amendment to a second-degree amendment is still third degree and unprocessable (RONR 1915 §33 p. 135)", () => {
    expect(() => amendmentTreeModel({ measure, amendments: [...houseTree, { id: "A3", target: "A2", form: "insert" }] })).toThrow(expect.objectContaining({ code: "unprocessable" }));
    expect(() => amendmentTreeModel({ measure, amendments: [...houseTree, { id: "S3", target: "S2", form: "insert" }] })).toThrow(expect.objectContaining({ code: "unprocessable" }));
  });
  it("an amendment of a substitute whose own target is missing is invalid-input naming the substitute's target", () => {
    const broken = [{ id: "S2", target: "S", form: "strike" }, { id: "S", target: "nowhere", form: "substitute" }];
    expect(() => amendmentTreeModel({ measure, amendments: broken })).toThrow(expect.objectContaining({ code: "invalid-input", issues: [expect.objectContaining({ path: "amendments.1.target" })] }));
  });
  it("version ids of trees without a substitute for an amendment are unchanged", () => {
    expect(amendmentTreeModel({ measure, amendments: reviewTree }).versions.map((v) => v.id)).toEqual(["Q", "B", "B+A", "B+S", "B+C", "B+A+A2", "B+A+C", "B+S+S2", "B+A+A2+C"]);
  });
});

// An independent statement of the rules by positions in the order (not the engine's bitmask availability):
// parent after child; passage last; each amendment and what amends it contiguous; perfecting amendments of a
// substitute's text before the substitute and its amendments, or (F5) anywhere but between them.
function legalByPositions(model: AmendmentTreeModel, order: number[], f5: boolean): boolean {
  const k = model.amendments.length;
  const at = (x: number) => order.indexOf(x);
  if (at(k) !== k) return false;
  for (let a = 0; a < k; a++) {
    if (model.parent[a] >= 0 && at(a) > at(model.parent[a])) return false;
    const block = [a, ...range(k).filter((d) => model.ancestors[d] & (1 << a))].map(at);
    if (Math.max(...block) - Math.min(...block) !== block.length - 1) return false;
    if (!model.isSubstitute[a]) continue;
    const sub = [a, ...range(k).filter((d) => model.ancestors[d] & (1 << a))].map(at);
    for (let p = 0; p < k; p++) {
      if (!(model.supersedes[a] & (1 << p))) continue;
      const before = at(p) < Math.min(...sub);
      const after = at(p) > Math.max(...sub);
      if (!(before || (f5 && after))) return false;
    }
  }
  return true;
}

function profileFor(model: AmendmentTreeModel, seed: number) {
  let s = seed;
  const rand = (m: number) => ((s = (s * 1103515245 + 12345) % 2147483648), s % m);
  const names = model.versions.map((v) => v.id);
  const ballots = range(5).map(() => {
    const r = range(names.length);
    for (let i = r.length - 1; i > 0; i--) {
      const j = rand(i + 1);
      [r[i], r[j]] = [r[j], r[i]];
    }
    return { ranking: r.slice(0, 2 + rand(names.length - 1)), weight: 1 + rand(3) };
  });
  return profileFromRankings(names, ballots, seed % 2 ? "bottom" : "abstain");
}

describe("counting and listing share one availability rule, and equal enumeration (random trees)", () => {
  it("orders, sincere and sophisticated counts equal brute force over every permutation; pages list exactly the legal orders", () => {
    fc.assert(
      fc.property(randomTree(1, 6), fc.boolean(), fc.nat(10_000), (amendments, f5, seed) => {
        const model = amendmentTreeModel({ measure: { id: "B", sections: [{ id: "s1" }, { id: "s2" }, { id: "s3" }] }, amendments });
        const prec = questionPrecedence(model, f5 ? WITH_F5 : HOUSE);
        const k = model.amendments.length;
        // helpers.permutations yields in lexicographic order, as the engine lists.
        const legal = [...permutations(range(k + 1))].filter((o) => legalByPositions(model, o, f5));
        expect(countLegalOrders(prec)).toBe(legal.length);
        const listed = [...legalOrders(prec)];
        expect(listed).toEqual(legal);
        const paged: number[][] = [];
        for (let page = 1; (page - 1) * 4 < legal.length; page++) paged.push(...legalOrderPage(prec, page, 4));
        expect(paged).toEqual(listed);
        const profile = profileFor(model, seed);
        const g = majorityGraph(profile);
        for (const procedure of ["amendment", "successive"] as const) {
          const qa = questionAgenda(model, g, profile, procedure);
          const sinc = new Array(model.versions.length).fill(0);
          const soph = new Array(model.versions.length).fill(0);
          for (const o of legal) {
            sinc[sincereQuestionPath(qa, o).outcome]++;
            soph[sophisticatedQuestionOutcome(qa, o)]++;
          }
          expect(sincereQuestionCounts(qa, prec)).toEqual(sinc);
          expect(sophisticatedQuestionCounts(qa, prec)).toEqual(soph);
        }
      }),
      { numRuns: 40 },
    );
  });
});

import { describe, expect, it } from "vitest";
import { amendmentTreeModel } from "../../../src/lib/voting/amendment-versions.ts";
import { analyseOrders } from "../../../src/lib/voting/analyse-orders.ts";
import { majorityGraph } from "../../../src/lib/voting/majority-graph.ts";
import { precedence } from "../../../src/lib/voting/precedence.ts";
import { profileFromRankings } from "../../../src/lib/voting/profile.ts";
import { questionAgenda, sincereQuestionPath, sophisticatedQuestionOutcome } from "../../../src/lib/voting/question-agenda.ts";
import { sincereQuestionCounts, sophisticatedQuestionCounts } from "../../../src/lib/voting/question-counts.ts";
import { questionConstraints } from "../../../src/lib/voting/order-constraints.ts";
import { sophisticatedValue, twoStageTree } from "../../../src/lib/voting/voting-tree.ts";
import { graphFromPairs, permutations, range, respects } from "./helpers.ts";

const voting = { procedure: "amendment", citation: "Fictional Chamber Rule 12" };
// A fictional bill: perfecting amendment A to section s1 with a second-degree A2, a substitute S with S2,
// and an independent amendment C to section s2 (the Ordeshook & Schwartz 1987 shape, DOMAIN §2).
const measure = { id: "B", sections: [{ id: "s1" }, { id: "s2" }] };
const amendments = [
  { id: "A", target: "s1", form: "strike-and-insert", lines: [1, 3] },
  { id: "A2", target: "A", form: "insert" },
  { id: "S", target: "B", form: "substitute" },
  { id: "S2", target: "S", form: "strike" },
  { id: "C", target: "s2", form: "insert", lines: [4, 4] },
];

describe("invalid trees", () => {
  it("a third-degree amendment is unprocessable (Robert's Rules of Order Revised 1915, §33 p. 135: \"An amendment of the third degree would be too complicated and is not in order\")", () => {
    expect(() => amendmentTreeModel({ measure, amendments: [...amendments, { id: "A3", target: "A2", form: "insert" }] })).toThrow(expect.objectContaining({ code: "unprocessable" }));
  });
  it("an unknown target and a duplicate id are invalid-input", () => {
    expect(() => amendmentTreeModel({ measure, amendments: [{ id: "X", target: "nowhere", form: "insert" }] })).toThrow(expect.objectContaining({ code: "invalid-input" }));
    expect(() => amendmentTreeModel({ measure, amendments: [amendments[0], amendments[0]] })).toThrow(expect.objectContaining({ code: "invalid-input" }));
  });
  it("a rulebook without a valid voting section is invalid-input", () => {
    expect(() => analyseOrders({ rulebook: { voting: { procedure: "plurality" } }, measure, amendments, profile: { ballots: [{ ranking: ["B"] }] } })).toThrow(expect.objectContaining({ code: "invalid-input" }));
  });
});

describe("versions of a measure (DOMAIN §1–2; decision record 0003)", () => {
  it("combinations across different text, a second-degree only with its parent, no substitute with text it replaces", () => {
    const ids = amendmentTreeModel({ measure, amendments }).versions.map((v) => v.id);
    expect(ids).toEqual(["Q", "B", "B+A", "B+S", "B+C", "B+A+A2", "B+A+C", "B+S+S2", "B+A+A2+C"]);
  });
  it("mutually exclusive amendments never combine (overlapping lines of one section)", () => {
    const ids = amendmentTreeModel({ measure, amendments: [amendments[0], { id: "D", target: "s1", form: "strike", lines: [2, 5] }] }).versions.map((v) => v.id);
    expect(ids).toEqual(["Q", "B", "B+A", "B+D"]);
  });
  it("a withdrawn amendment takes no part", () => {
    const ids = amendmentTreeModel({ measure, amendments: [{ ...amendments[4], status: "withdrawn" }] }).versions.map((v) => v.id);
    expect(ids).toEqual(["Q", "B"]);
  });
});

describe("ordering constraints from the rulebook (ORDER_CONSTRAINTS)", () => {
  it("secondary before primary, perfecting before substitute, passage last", () => {
    const model = amendmentTreeModel({ measure, amendments });
    const id = (i: number) => [...model.amendments.map((a) => a.id), "passage"][i];
    const pairs = questionConstraints(model, ["secondary-before-primary", "perfecting-before-substitute", "passage-last"]).map(([a, b]) => `${id(a)}<${id(b)}`);
    for (const p of ["A2<A", "S2<S", "A<S", "A2<S", "C<S", "A<passage", "S<passage"]) expect(pairs).toContain(p);
    expect(pairs).not.toContain("A<C");
  });
  it("furthest-first orders exclusive amendments by distance (European Parliament practice); textual-order by section", () => {
    const model = amendmentTreeModel({ measure, amendments: [{ id: "N", target: "s1", form: "strike", lines: [1, 2], distance: 1 }, { id: "F", target: "s1", form: "strike", lines: [2, 3], distance: 5 }, { id: "T", target: "s2", form: "insert", lines: [1, 1] }] });
    const pairs = questionConstraints(model, ["furthest-first", "textual-order"]);
    expect(pairs).toContainEqual([1, 0]);
    expect(pairs).toContainEqual([0, 2]);
    expect(pairs).toContainEqual([1, 2]);
  });
});

describe("two-stage structure (Banks 1989, AJPS 33:25–43)", () => {
  it("backward induction on the tree: a perfected amendment meets a perfected substitute, then the measure, then Q", () => {
    // Alternatives 0=A, 1=A+A2, 2=S, 3=S+S2, 4=B, 5=Q; a transitive majority 3 > 1 > 4 > 0 > 2 > 5 gives 3.
    const rank = [3, 1, 4, 0, 2, 5];
    const cells: number[] = [];
    for (let i = 0; i < 6; i++) for (let j = i + 1; j < 6; j++) cells.push(rank.indexOf(i) < rank.indexOf(j) ? 1 : -1);
    const g = graphFromPairs(6, cells);
    const tree = twoStageTree({ amendment: 0, amendmentPerfected: 1, substitute: 2, substitutePerfected: 3, measure: 4, statusQuo: 5 }, g.alternatives);
    expect(sophisticatedValue(tree, g)).toBe(3);
  });
});

describe("question orders: the counting DP equals enumeration of every legal order", () => {
  it("random profiles over the versions, both procedures, with and without constraints", () => {
    const model = amendmentTreeModel({ measure, amendments });
    const names = model.versions.map((v) => v.id);
    let seed = 7;
    const rand = (m: number) => ((seed = (seed * 1103515245 + 12345) % 2147483648), seed % m);
    for (let trial = 0; trial < 12; trial++) {
      const ballots = range(5).map(() => {
        const r = range(names.length);
        for (let i = r.length - 1; i > 0; i--) {
          const j = rand(i + 1);
          [r[i], r[j]] = [r[j], r[i]];
        }
        return { ranking: r.slice(0, 3 + rand(names.length - 2)), weight: 1 + rand(3) };
      });
      const profile = profileFromRankings(names, ballots, trial % 2 ? "bottom" : "abstain");
      const g = majorityGraph(profile);
      for (const procedure of ["amendment", "successive"] as const) {
        const qa = questionAgenda(model, g, profile, procedure);
        for (const cons of [[], questionConstraints(model, ["secondary-before-primary", "perfecting-before-substitute", "passage-last"])]) {
          const prec = precedence(qa.k + 1, cons);
          const legal = [...permutations(range(qa.k + 1))].filter((o) => respects(o, cons));
          const sinc = new Array(names.length).fill(0);
          const soph = new Array(names.length).fill(0);
          for (const o of legal) {
            sinc[sincereQuestionPath(qa, o).outcome]++;
            soph[sophisticatedQuestionOutcome(qa, o)]++;
          }
          expect(sincereQuestionCounts(qa, prec)).toEqual(sinc);
          expect(sophisticatedQuestionCounts(qa, prec)).toEqual(soph);
        }
      }
    }
  });
});

describe("analyseOrders", () => {
  const base = {
    rulebook: { voting },
    measure,
    amendments,
    profile: { ballots: [{ ranking: ["B+A+A2", "B+A", "B", "Q"], weight: 3 }, { ranking: ["B+S+S2", "B+S", "B", "Q"], weight: 2 }, { ranking: ["Q", "B+C", "B"], weight: 2 }] },
  };
  it("reports alternatives, sets, counts that add up to the number of orders, and a page", () => {
    // Default constraints: A2, A and C before S2 and S (RONR 1915 §33 p. 142), so 3 orders; page 2 of size 2 holds rank 3.
    const r = analyseOrders({ ...base, page: 2, pageSize: 2 });
    const sum = (c: Record<string, number | string>) => Object.values(c).reduce<number>((a, v) => a + Number(v), 0);
    expect(typeof r.orders).toBe("number");
    expect(sum(r.sincere)).toBe(r.orders);
    expect(sum(r.sophisticated)).toBe(r.orders);
    expect(r.orders).toBe(3);
    expect(r.page.orders.map((o) => o.rank)).toEqual([3]);
    for (const o of r.page.orders) {
      expect(o.questions.at(-1)).toBe("passage");
      expect(o.questions.indexOf("A2")).toBeLessThan(o.questions.indexOf("A"));
    }
    expect(r.alternatives.map((a) => a.id)).toContain("B+A+A2+C");
  });
  it("unknown version ids in ballots name the field", () => {
    expect(() => analyseOrders({ ...base, profile: { ballots: [{ ranking: ["B+Z"] }] } })).toThrow(expect.objectContaining({ code: "invalid-input", issues: [expect.objectContaining({ path: "profile.ballots.0.ranking.0" })] }));
  });
  it("reports progress and stops when cancelled", () => {
    const phases = new Set<string>();
    analyseOrders(base, { onPhase: (p) => phases.add(p) });
    expect([...phases]).toEqual(["orders", "sincere", "sophisticated", "page"]);
    expect(() => analyseOrders(base, { shouldCancel: () => true })).toThrow(expect.objectContaining({ code: "limit-exceeded" }));
  });
  it("spatial profile: versions get positions from set/shift effects; the status quo's win set and core are reported", () => {
    const r = analyseOrders({
      ...base,
      amendments: amendments.slice(0, 2),
      profile: { spatial: { dimensions: ["tax", "spend"], members: [{ ideal: [0, 0] }, { ideal: [4, 0] }, { ideal: [0, 3] }], statusQuo: [2, 2], measure: [2, 1], amendments: { A: { set: { tax: 1 } }, A2: { shift: { spend: -0.5 } } } } },
    });
    expect(r.spatial!.positions).toEqual({ Q: [2, 2], B: [2, 1], "B+A": [1, 1], "B+A+A2": [1, 0.5] });
    expect(r.spatial!.exactPositions["B+A+A2"]).toEqual(["1", "1/2"]);
    expect(r.spatial!.core.exists).toBe(false);
    expect(r.spatial!.statusQuoWinSet.coalitions).toHaveLength(3);
  });
});

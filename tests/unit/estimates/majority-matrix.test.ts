// The majority matrix, its sorting, the cells on the top cycle and the collapse of the majority graph.
// Worked examples: the three-voter cycle a > b > c, b > c > a, c > a > b (Condorcet's paradox,
// Condorcet, "Essai sur l'application de l'analyse à la probabilité des décisions", 1785 — from
// memory, paraphrase); the Copeland score is wins minus losses (A. H. Copeland, "A 'reasonable'
// social welfare function", University of Michigan seminar, 1951 — from memory). The collapse rule
// (more than eight versions → the top cycle) is the product's own (no source). Margins come from the
// voting engine itself (majorityReport), not written by hand.
import { describe, expect, it } from "vitest";
import { parsedMajorityGraph, majorityInputSchema } from "../../../src/lib/voting/majority-input.ts";
import { majorityReport } from "../../../src/lib/voting/majority-report.ts";
import { cycleSentence, graphSelection, margin, matrixRows, onCycle, sortRows, GRAPH_LIMIT } from "../../../src/lib/estimates/majority-matrix.ts";

function report(alternatives: string[], ballots: Array<{ ranking: Array<string | string[]>; weight?: number }>, partial: "abstain" | "bottom" = "bottom") {
  return majorityReport(parsedMajorityGraph(majorityInputSchema.parse({ alternatives, ballots, partial })).graph);
}

// Condorcet's paradox, plus a fourth version d that everyone ranks last.
const paradox = report(["a", "b", "c", "d"], [{ ranking: ["a", "b", "c", "d"] }, { ranking: ["b", "c", "a", "d"] }, { ranking: ["c", "a", "b", "d"] }]);

describe("majority matrix", () => {
  it("counts wins, losses and the Copeland score from the engine's margins", () => {
    const rows = matrixRows(["a", "b", "c", "d"], paradox.margins);
    expect(rows.map((r) => [r.id, r.wins, r.losses, r.ties, r.copeland])).toEqual([
      ["a", 2, 1, 0, 1],
      ["b", 2, 1, 0, 1],
      ["c", 2, 1, 0, 1],
      ["d", 0, 3, 0, -3],
    ]);
    expect(margin(paradox.margins, "a", "b")).toBe(1);
    expect(margin(paradox.margins, "b", "a")).toBe(-1);
  });

  it("sorts by any column, both ways, keeping the listed order among equals", () => {
    const rows = matrixRows(["d", "c", "b", "a"], paradox.margins);
    expect(sortRows(rows, { key: "copeland", descending: true }, paradox.margins).map((r) => r.id)).toEqual(["c", "b", "a", "d"]);
    expect(sortRows(rows, { key: "copeland", descending: false }, paradox.margins).map((r) => r.id)).toEqual(["d", "c", "b", "a"]);
    expect(sortRows(rows, { key: "name", descending: false }, paradox.margins).map((r) => r.id)).toEqual(["a", "b", "c", "d"]);
    expect(sortRows(rows, { key: "name", descending: true }, paradox.margins, (id) => `Version ${id}`).map((r) => r.id)).toEqual(["d", "c", "b", "a"]);
    // By the margin over a: c beats a (+1), b loses to a (−1), d loses to a (−3); a itself goes last.
    expect(sortRows(rows, { key: "beats:a", descending: true }, paradox.margins).map((r) => r.id)).toEqual(["c", "b", "d", "a"]);
    expect(sortRows(rows, { key: "order", descending: false }, paradox.margins).map((r) => r.id)).toEqual(["d", "c", "b", "a"]);
  });

  it("marks exactly the winning cells among the top cycle, and none when there is a Condorcet winner", () => {
    expect(paradox.condorcetWinner).toBeNull();
    expect([...paradox.topCycle].sort()).toEqual(["a", "b", "c"]);
    const hot = ["a", "b", "c", "d"].flatMap((x) => ["a", "b", "c", "d"].filter((y) => onCycle(x, y, paradox.margins, paradox.topCycle, paradox.condorcetWinner)).map((y) => `${x}>${y}`));
    expect(hot.sort()).toEqual(["a>b", "b>c", "c>a"]);
    const clear = report(["a", "b", "c"], [{ ranking: ["a", "b", "c"] }, { ranking: ["a", "c", "b"] }, { ranking: ["b", "a", "c"] }]);
    expect(clear.condorcetWinner).toBe("a");
    expect(["a", "b", "c"].some((x) => ["a", "b", "c"].some((y) => onCycle(x, y, clear.margins, clear.topCycle, clear.condorcetWinner)))).toBe(false);
  });
});

describe("collapsing the majority graph", () => {
  const names = (n: number) => Array.from({ length: n }, (_, i) => `v${String(i + 1).padStart(2, "0")}`);

  it("draws every version up to eight, and the top cycle beyond", () => {
    expect(graphSelection(["a", "b", "c", "d"], paradox.margins, paradox.topCycle)).toEqual({ shown: ["a", "b", "c", "d"], collapsed: false, note: null });
    // Twelve versions: the paradox among the first three, everyone ranks the rest below in listed order.
    const ids = names(12);
    const r = report(ids, [{ ranking: ["v01", "v02", "v03", ...ids.slice(3)] }, { ranking: ["v02", "v03", "v01", ...ids.slice(3)] }, { ranking: ["v03", "v01", "v02", ...ids.slice(3)] }]);
    const sel = graphSelection(ids, r.margins, r.topCycle);
    expect(sel.shown).toEqual(["v01", "v02", "v03"]);
    expect(sel.collapsed).toBe(true);
    expect(sel.note).toContain("12 versions are too many to draw legibly");
    expect(sel.note).toContain("top cycle (3 versions)");
    expect(graphSelection(ids, r.margins, r.topCycle, true).shown).toEqual(ids);
  });

  it("keeps the eight strongest of a top cycle larger than eight", () => {
    // Ten versions in one cycle: voters' rankings are the ten rotations of v01 > … > v10 (a Condorcet
    // cycle through every version), plus one more v01 > … ballot so that the Copeland scores differ.
    const ids = names(10);
    const rot = (k: number) => [...ids.slice(k), ...ids.slice(0, k)];
    const r = report(ids, [...ids.map((_, k) => ({ ranking: rot(k) })), { ranking: ids, weight: 1 }]);
    expect(r.topCycle.length).toBe(10);
    const sel = graphSelection(ids, r.margins, r.topCycle);
    expect(sel.shown.length).toBe(GRAPH_LIMIT);
    const rows = matrixRows(ids, r.margins);
    const worstShown = Math.min(...rows.filter((x) => sel.shown.includes(x.id)).map((x) => x.copeland));
    const bestHidden = Math.max(...rows.filter((x) => !sel.shown.includes(x.id)).map((x) => x.copeland));
    expect(worstShown).toBeGreaterThanOrEqual(bestHidden);
    expect(sel.note).toContain("the top cycle alone has 10");
  });

  it("names a short cycle and counts a long one", () => {
    expect(cycleSentence(["a", "b", "c"], (id) => id.toUpperCase())).toBe("the majorities cycle among A, B and C");
    const many = names(34);
    const s = cycleSentence(many, (id) => id);
    expect(s).toBe("the majorities cycle among 34 versions — see the matrix");
    expect(s).not.toContain("v01");
  });
});

describe("the cycle finding", () => {
  it("names up to four versions of a cycle and counts a longer one", async () => {
    const { buildFindings } = await import("../../../src/lib/estimates/findings.ts");
    const ids = Array.from({ length: 6 }, (_, i) => `v${i + 1}`);
    const rot = (k: number) => [...ids.slice(k), ...ids.slice(0, k)];
    const r = report(ids, ids.map((_, k) => ({ ranking: rot(k) })));
    expect(r.topCycle.length).toBe(6);
    const labels = { measureKey: "measure", measureLabel: "HCA 1", amendments: {} };
    const analysis = { procedure: "amendment" as const, threshold: "majority", alternatives: [], questions: [], constraints: [], majority: r, orders: 1, sincere: {}, sophisticated: {} };
    const findings = buildFindings(analysis as never, { orders: [], count: 0, complete: true } as never, labels, "Test");
    const cycle = findings.find((f) => f.id === "cycle")!;
    expect(cycle.headline).toBe("No version beats all the others: the majority preferences cycle among 6 versions — see the majority matrix.");
    expect(cycle.detail).toMatch(/\(and \d+ more wins within the cycle\)/);
  });
});

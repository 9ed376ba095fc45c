// Plain-language findings and the chair's script, built from the voting engine's own analysis of a
// small tree. Check values: the Condorcet paradox profile (Condorcet 1785; docs/sources.md §4) placed on the
// versions of a one-section measure with two exclusive amendments; the killer-amendment finding is
// the product's own definition (margins against the status quo; common practice, no source).
import { describe, expect, it } from "vitest";
import { analyseOrders } from "../../../src/lib/voting/analyse-orders.ts";
import { buildFindings } from "../../../src/lib/estimates/findings.ts";
import { walkThrough } from "../../../src/lib/estimates/walk-through.ts";
import { chairScript, scriptMarkdown } from "../../../src/lib/estimates/chair-script.ts";
import { versionInWords, versionShort, type TreeLabels } from "../../../src/lib/estimates/version-words.ts";

const voting = { procedure: "amendment", constraints: ["secondary-before-primary", "perfecting-before-substitute", "passage-last"], citation: "test" };
const measure = { id: "measure", number: "HCA 1", title: "Test", subjects: ["x"], sections: [{ id: "s1", subjects: ["x"], status: "open" }] };
const amendments = [
  { id: "A1", target: "s1", form: "strike-and-insert", lines: [1, 2], sponsors: [], subjects: [], status: "filed" },
  { id: "A2", target: "s1", form: "strike-and-insert", lines: [2, 3], sponsors: [], subjects: [], status: "filed" },
];
const labels: TreeLabels = { measureKey: "measure", measureLabel: "HCA 1", amendments: { A1: { title: "Wider", form: "strike-and-insert", target: "s1", targetLabel: "section 1", lines: [1, 2], degree: 1 }, A2: { title: "Narrower", form: "strike-and-insert", target: "s1", lines: [2, 3], degree: 1 } } };
const input = (ballots: Array<{ ranking: string[]; weight: number }>) => ({ rulebook: { voting }, measure, amendments, profile: { ballots } });

function listing(raw: ReturnType<typeof input>) {
  const a = analyseOrders({ ...raw, pageSize: 200 });
  return { a, listing: { orders: a.page.orders, complete: true } };
}

describe("invalid input", () => {
  it("refuses a walk-through order that breaks the rulebook or misses questions", () => {
    const raw = input([{ ranking: ["measure", "Q"], weight: 1 }]);
    expect(() => walkThrough(raw, ["passage", "A1", "A2"])).toThrow(expect.objectContaining({ code: "unprocessable" }));
    expect(() => walkThrough(raw, ["A1", "passage"])).toThrow(expect.objectContaining({ code: "invalid-input" }));
    expect(() => walkThrough(raw, ["A1", "A9", "passage"])).toThrow(expect.objectContaining({ code: "invalid-input" }));
  });
});

describe("version words", () => {
  it("names the status quo, the measure and amended versions", () => {
    expect(versionInWords("Q", labels)).toMatch(/fails and current law stands/);
    expect(versionInWords("measure", labels)).toBe("HCA 1 as introduced, without amendment");
    expect(versionInWords("measure+A1", labels)).toBe("HCA 1 as amended by A1 (Wider)");
    expect(versionShort("measure+A1", labels)).toBe("HCA 1 + A1");
  });
});

describe("findings", () => {
  // Condorcet paradox over three versions (Condorcet 1785; docs/sources.md §4): a>b>c, b>c>a, c>a>b.
  const paradox = input([
    { ranking: ["measure+A1", "measure+A2", "measure", "Q"], weight: 1 },
    { ranking: ["measure+A2", "measure", "measure+A1", "Q"], weight: 1 },
    { ranking: ["measure", "measure+A1", "measure+A2", "Q"], weight: 1 },
  ]);

  it("reports a cycle and that the order decides, each with the caution", () => {
    const { a, listing: l } = listing(paradox);
    const f = buildFindings(a, l, labels, "Paradox");
    const ids = f.map((x) => x.id);
    expect(ids).toContain("cycle");
    expect(ids).toContain("order-decides");
    for (const x of f) expect(x.caution).toContain("“Paradox”");
  });

  it("reports a Condorcet winner that holds under every order, and no strategic difference", () => {
    const { a, listing: l } = listing(input([{ ranking: ["measure", "measure+A1", "measure+A2", "Q"], weight: 3 }]));
    const ids = buildFindings(a, l, labels, "x").map((x) => x.id);
    expect(ids).toEqual(["order-indifferent", "condorcet-holds", "sincere-holds"]);
  });

  it("finds an amendment that would kill the measure, and one that would save it", () => {
    // measure beats Q 2–1; measure+A1 loses to Q 1–2; measure+A2 beats Q.
    const kill = listing(input([
      { ranking: ["measure", "measure+A2", "Q", "measure+A1"], weight: 1 },
      { ranking: ["measure+A1", "measure", "measure+A2", "Q"], weight: 1 },
      { ranking: ["Q", "measure+A2", "measure", "measure+A1"], weight: 1 },
    ]));
    const f = buildFindings(kill.a, kill.listing, labels, "x");
    expect(f.filter((x) => x.id === "kills").map((x) => x.headline)).toEqual([expect.stringContaining("A1 (Wider)")]);
    const save = listing(input([
      { ranking: ["Q", "measure+A1", "measure"], weight: 2 },
      { ranking: ["measure+A1", "measure", "Q"], weight: 3 },
      { ranking: ["Q", "measure"], weight: 2 },
    ]));
    expect(buildFindings(save.a, save.listing, labels, "x").some((x) => x.id === "saves" && x.headline.includes("A1"))).toBe(true);
  });
});

describe("walk-through and chair's script", () => {
  const raw = input([
    { ranking: ["measure+A1", "measure+A2", "measure", "Q"], weight: 1 },
    { ranking: ["measure+A2", "measure", "measure+A1", "Q"], weight: 1 },
    { ranking: ["measure", "measure+A1", "measure+A2", "Q"], weight: 1 },
  ]);

  it("agrees with the engine's outcomes for every legal order, with tallies of the three voters", () => {
    const a = analyseOrders({ ...raw, pageSize: 200 });
    for (const o of a.page.orders) {
      const w = walkThrough(raw, o.questions);
      expect(w.sincere.outcome).toBe(o.sincere);
      expect(w.sophisticated.outcome).toBe(o.sophisticated);
      for (const s of w.sincere.steps.filter((x) => x.put)) expect(s.for! + s.against!).toBeLessThanOrEqual(3);
    }
  });

  it("says which amendment falls when an exclusive one is adopted, and the vote required", () => {
    const w = walkThrough(raw, ["A1", "A2", "passage"]);
    const script = chairScript(w, labels, "majority", "Paradox");
    expect(script.steps[0].heading).toContain("A1 (Wider)");
    expect(script.steps[0].onAdoption).toContain("A2 (Narrower) falls");
    expect(script.steps[0].voteRequired).toMatch(/majority of the votes cast/);
    expect(script.steps[2].heading).toBe("Final passage of HCA 1");
    const md = scriptMarkdown(script);
    expect(md).toMatch(/^# Chair's script: HCA 1/);
    expect(md).toContain(script.advisory);
  });
});

describe("successive procedure: tallies in the walk-through and the chair's script", () => {
  // Hand-computed, no source (sincere successive definition of docs/sources.md §1 [MEM]; sophisticated voting by
  // backward induction, docs/sources.md §2). Groups: 4 rank +A2 > +A1 > measure > Q; 3 rank +A1 > +A2 > measure > Q;
  // 2 rank measure > +A2 > Q > +A1; 1 ranks only Q (abstains on every other comparison).
  const successive = {
    rulebook: { voting: { ...voting, procedure: "successive" } },
    measure,
    amendments,
    profile: {
      ballots: [
        { ranking: ["measure+A2", "measure+A1", "measure", "Q"], weight: 4 },
        { ranking: ["measure+A1", "measure+A2", "measure", "Q"], weight: 3 },
        { ranking: ["measure", "measure+A2", "Q", "measure+A1"], weight: 2 },
        { ranking: ["Q"], weight: 1 },
      ],
    },
  };

  it("sincere: A2 is weighed against Q, the measure and +A1 (4 for, 5 against); A1 then 7–2; passage 7–2", () => {
    const w = walkThrough(successive, ["A2", "A1", "passage"]);
    expect(w.procedure).toBe("successive");
    expect(w.sincere.steps.map((s) => [s.question, s.for, s.against, s.adopted])).toEqual([
      ["A2", 4, 5, false],
      ["A1", 7, 2, true],
      ["passage", 7, 2, true],
    ]);
    expect([...w.sincere.steps[0].withinReach!].sort()).toEqual(["Q", "measure", "measure+A1"]);
    expect([...w.sincere.steps[1].withinReach!].sort()).toEqual(["Q", "measure"]);
    expect(w.sincere.steps[2].withinReach).toBeUndefined();
    expect(w.sincere.outcome).toBe("measure+A1");
  });

  it("sophisticated: A2 (leading to +A2) against the rejection branch (leading to +A1), 6–3, adopted; A1 falls", () => {
    const w = walkThrough(successive, ["A2", "A1", "passage"]);
    expect(w.sophisticated.steps.map((s) => [s.question, s.put, s.for, s.against, s.adopted])).toEqual([
      ["A2", true, 6, 3, true],
      ["A1", false, undefined, undefined, undefined],
      ["passage", true, 9, 0, true],
    ]);
    expect(w.sophisticated.outcome).toBe("measure+A2");
  });

  it("agrees with the engine's outcomes for every legal order", () => {
    const a = analyseOrders({ ...successive, pageSize: 200 });
    expect(a.page.orders.length).toBeGreaterThan(1);
    for (const o of a.page.orders) {
      const w = walkThrough(successive, o.questions);
      expect(w.sincere.outcome).toBe(o.sincere);
      expect(w.sophisticated.outcome).toBe(o.sophisticated);
      for (const s of [...w.sincere.steps, ...w.sophisticated.steps].filter((x) => x.put)) expect(s.for! + s.against!).toBeLessThanOrEqual(10);
    }
  });

  it("the script and its Markdown carry the tally and say what was weighed", () => {
    const script = chairScript(walkThrough(successive, ["A2", "A1", "passage"]), labels, "majority", "Whip count");
    expect(script.steps[0].projection).toContain("rejected (4 for, 5 against)");
    expect(script.steps[0].projection).toContain("Q (no change)");
    expect(script.steps[1].projection).toContain("adopted (7 for, 2 against)");
    expect(script.steps.every((s) => !s.projection.includes("no tally"))).toBe(true);
    const md = scriptMarkdown(script);
    expect(md).toContain("rejected (4 for, 5 against)");
    expect(md).toContain("adopted (7 for, 2 against)");
  });
});

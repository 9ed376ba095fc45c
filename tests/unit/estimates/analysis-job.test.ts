// The analysis job computes the analysis once and lists the orders from the same agenda, instead of
// calling analyseOrders again for every 200-order page (issue 17: 25 recomputations of one tree).
// The listing must equal the engine's own pages, order by order. Check values are the engine's
// (tested against published sources in tests/unit/voting); the tree is fictional: six independent
// first-degree amendments to six sections, so 6! = 720 legal orders of the amendments before
// passage (amendment procedure, amendments voted before the main question: Robert's Rules of
// Order Revised (1915) §33, paraphrase; counting permutations: common knowledge).
import { describe, expect, it, vi } from "vitest";

vi.mock("../../../src/lib/voting/analyse-orders.ts", async (importOriginal) => {
  const m = await importOriginal<typeof import("../../../src/lib/voting/analyse-orders.ts")>();
  return { ...m, analyseOrders: vi.fn(m.analyseOrders) };
});

const { analyseOrders } = await import("../../../src/lib/voting/analyse-orders.ts");
const { runAnalysisJob } = await import("../../../src/lib/server/analysis/analysis-job.ts");

const ids = ["A", "B", "C", "D", "E", "F"];
const input = {
  rulebook: { voting: { procedure: "amendment", citation: "Fictional Chamber Rule 12" } },
  measure: { id: "measure", sections: ids.map((_, i) => ({ id: `s${i + 1}` })) },
  amendments: ids.map((id, i) => ({ id, target: `s${i + 1}`, form: "insert", lines: [1, 1] })),
  profile: { ballots: [{ ranking: ["measure+A", "measure", "Q"], weight: 3 }, { ranking: ["Q", "measure+B+C"], weight: 2 }, { ranking: ["measure+D+E+F", "measure+A+B", "Q"], weight: 2 }] },
};

describe("analysis job", () => {
  it("calls analyseOrders once, whatever the number of orders listed", () => {
    const spy = vi.mocked(analyseOrders);
    spy.mockClear();
    const r = runAnalysisJob(input);
    expect(r.analysis.orders).toBe(720);
    expect(r.listing.orders).toHaveLength(720);
    expect(r.listing.complete).toBe(true);
    expect(spy).toHaveBeenCalledTimes(1);
  });

  it("lists exactly the engine's pages (ranks, orders, sincere and sophisticated outcomes)", () => {
    const r = runAnalysisJob(input);
    const spy = vi.mocked(analyseOrders);
    for (const page of [1, 2, 4]) {
      const p = spy.getMockImplementation()!({ ...input, page, pageSize: 200 }).page.orders;
      expect(r.listing.orders.slice((page - 1) * 200, page * 200)).toEqual(p.map(({ rank, questions, sincere, sophisticated }) => ({ rank, questions, sincere, sophisticated })));
    }
  });

  it("stops at the listing limit and says the listing is incomplete", () => {
    const r = runAnalysisJob(input, { maxListed: 250 });
    expect(r.listing.orders).toHaveLength(250);
    expect(r.listing.complete).toBe(false);
  });

  it("a cancellation asked for while listing stops the job", () => {
    let polls = 0;
    expect(() => runAnalysisJob(input, { shouldCancel: () => ++polls > 3 })).toThrow(expect.objectContaining({ code: "limit-exceeded", details: { cancelled: true } }));
  });
});

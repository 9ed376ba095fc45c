// Places ↔ ranking for the ballot table editor. Common practice, no source: a weak order written
// as ranks, equal ranks tie, a missing rank leaves the version unranked.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { placesFromRanking, rankingFromPlaces } from "../../../src/lib/estimates/ranking-places.ts";

const ORDER = ["Q", "measure", "measure+A1", "measure+A7"];

describe("rankingFromPlaces", () => {
  it("refuses a place that is not a whole number from 1", () => {
    expect(() => rankingFromPlaces({ Q: 0 }, ORDER)).toThrow(RangeError);
    expect(() => rankingFromPlaces({ Q: 1.5 }, ORDER)).toThrow(RangeError);
    expect(() => rankingFromPlaces({ Q: -2 }, ORDER)).toThrow(RangeError);
  });
  it("gives an empty ranking when nothing is placed", () => {
    expect(rankingFromPlaces({}, ORDER)).toEqual([]);
    expect(rankingFromPlaces({ Q: null, measure: undefined }, ORDER)).toEqual([]);
  });
  it("orders by place, groups equal places as ties and leaves blanks unranked", () => {
    expect(rankingFromPlaces({ Q: 3, measure: 1, "measure+A1": 1, "measure+A7": null }, ORDER)).toEqual([["measure", "measure+A1"], "Q"]);
  });
  it("only the order of the numbers matters", () => {
    expect(rankingFromPlaces({ Q: 7, measure: 2, "measure+A1": 2 }, ORDER)).toEqual(rankingFromPlaces({ Q: 3, measure: 1, "measure+A1": 1 }, ORDER));
  });
});

describe("placesFromRanking", () => {
  it("numbers levels from 1, a tie sharing one place", () => {
    expect(placesFromRanking(["measure+A1", ["measure", "Q"], "measure+A7"])).toEqual({ "measure+A1": 1, measure: 2, Q: 2, "measure+A7": 3 });
  });
  it("round-trips any weak order over a subset of the versions", () => {
    const arb = fc.array(fc.option(fc.integer({ min: 1, max: 4 }), { nil: null }), { minLength: ORDER.length, maxLength: ORDER.length });
    fc.assert(
      fc.property(arb, (ps) => {
        const places = Object.fromEntries(ORDER.map((id, i) => [id, ps[i]]));
        const ranking = rankingFromPlaces(places, ORDER);
        expect(rankingFromPlaces(placesFromRanking(ranking), ORDER)).toEqual(ranking);
      }),
      { numRuns: 200 },
    );
  });
});

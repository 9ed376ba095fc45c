// Adding and removing a dimension of a spatial estimate (dimension-edits.ts). Check values: the
// three-member spatial example worked by hand in docs/sources.md §4; the rest is the product's own contract
// (common practice, no source).
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { addDimension, dimensionNameIssue, removeDimension } from "../../../src/lib/estimates/dimension-edits.ts";
import { spatialInput, type EstimateContent } from "../../../src/lib/estimates/estimate-content.ts";
import { majorityGraph } from "../../../src/lib/voting/majority-graph.ts";
import { scaleSpatial, spatialProfile, spatialSchema, spatialTally, versionPosition, MAX_DIMENSIONS } from "../../../src/lib/voting/spatial-profile.ts";

type Spatial = Extract<EstimateContent, { kind: "spatial" }>;
const base: Spatial = {
  kind: "spatial",
  dimensions: ["Lighting", "Cost"],
  ranges: [[0, 10], [-5, 5]],
  statusQuo: [1, 1],
  measure: [4, 3],
  effects: { A1: { position: [7, 2] }, A7: { shift: [0, -1] } },
  members: [
    { member: "North", bloc: "North", weight: 3, ideal: [1, 2] },
    { member: "South", bloc: "South", weight: 2, ideal: [6, 6] },
  ],
};
const code = (f: () => unknown) => {
  try {
    f();
  } catch (e) {
    return (e as { code?: string }).code;
  }
  return "no error";
};

describe("invalid edits", () => {
  it("an empty, blank or too long name, or one already used (ignoring case), is invalid-input", () => {
    expect(code(() => addDimension(base, ""))).toBe("invalid-input");
    expect(code(() => addDimension(base, "   "))).toBe("invalid-input");
    expect(code(() => addDimension(base, "x".repeat(81)))).toBe("invalid-input");
    expect(code(() => addDimension(base, " cost "))).toBe("invalid-input");
    expect(dimensionNameIssue(base.dimensions, "COST")).not.toBeNull();
    expect(dimensionNameIssue(base.dimensions, "Cost", 1)).toBeNull(); // renaming a dimension to itself
  });
  it(`more than the engine's ${MAX_DIMENSIONS} dimensions is limit-exceeded`, () => {
    let c = base;
    for (let i = c.dimensions.length; i < MAX_DIMENSIONS; i++) c = addDimension(c, `D${i}`);
    expect(c.dimensions).toHaveLength(MAX_DIMENSIONS);
    expect(code(() => addDimension(c, "One too many"))).toBe("limit-exceeded");
  });
  it("removing the only dimension, or one that does not exist, is invalid-input", () => {
    const one = removeDimension(base, 1);
    expect(code(() => removeDimension(one, 0))).toBe("invalid-input");
    expect(code(() => removeDimension(base, 2))).toBe("invalid-input");
    expect(code(() => removeDimension(base, -1))).toBe("invalid-input");
  });
});

describe("edge cases", () => {
  it("a new dimension is trimmed, starts at 0 everywhere, and gets a default range only when ranges are kept", () => {
    const c = addDimension(base, "  Harbour access ");
    expect(c.dimensions).toEqual(["Lighting", "Cost", "Harbour access"]);
    expect(c.ranges).toEqual([[0, 10], [-5, 5], [0, 10]]);
    expect(c.statusQuo).toEqual([1, 1, 0]);
    expect(c.measure).toEqual([4, 3, 0]);
    expect(c.effects).toEqual({ A1: { position: [7, 2, 0] }, A7: { shift: [0, -1, 0] } });
    expect(c.members.map((m) => m.ideal)).toEqual([[1, 2, 0], [6, 6, 0]]);
    const { ranges: _, ...noRanges } = base;
    expect(addDimension(noRanges, "Reach").ranges).toBeUndefined();
  });
  it("removing a dimension drops that coordinate from every point, shift and range", () => {
    const c = removeDimension(base, 0);
    expect(c).toEqual({ ...base, dimensions: ["Cost"], ranges: [[-5, 5]], statusQuo: [1], measure: [3], effects: { A1: { position: [2] }, A7: { shift: [-1] } }, members: [{ ...base.members[0], ideal: [2] }, { ...base.members[1], ideal: [6] }] });
  });
});

describe("spatial example worked by hand (docs/sources.md §4)", () => {
  it("removing a third dimension from (0,0,5), (4,0,0), (0,3,0) gives the 2-D example: (2,0) beats (2,2) by 2–1", () => {
    const three: Spatial = { kind: "spatial", dimensions: ["x", "y", "z"], statusQuo: [2, 2, 0], measure: [2, 0, 0], effects: {}, members: [[0, 0, 5], [4, 0, 0], [0, 3, 0]].map((ideal, i) => ({ member: `m${i}`, bloc: "", weight: 1, ideal })) };
    const two = removeDimension(three, 2);
    const s = scaleSpatial(spatialSchema.parse(spatialInput(two)));
    expect(spatialTally(s, s.measure!, s.statusQuo)).toEqual({ forP: 2, forQ: 1, indifferent: 0 });
  });
});

describe("property: adding a dimension changes no majority; removing it again restores the estimate (common practice, no source)", () => {
  const coord = fc.integer({ min: -20, max: 20 });
  const point = fc.tuple(coord, coord).map((p) => [...p]);
  it("random two-dimensional estimates", () => {
    fc.assert(
      fc.property(fc.array(fc.record({ ideal: point, weight: fc.integer({ min: 1, max: 9 }) }), { minLength: 1, maxLength: 7 }), point, point, point, (ms, sq, measure, a1) => {
        const c: Spatial = { kind: "spatial", dimensions: ["Lighting", "Cost"], statusQuo: sq, measure, effects: { A1: { position: a1 } }, members: ms.map((m, i) => ({ member: `m${i}`, bloc: "", ...m })) };
        const graph = (x: Spatial) => {
          const s = scaleSpatial(spatialSchema.parse(spatialInput(x)));
          return majorityGraph(spatialProfile(s, ["Q", "M", "M+A1"], [s.statusQuo, versionPosition(s, []), versionPosition(s, ["A1"])])).margins;
        };
        const added = addDimension(c, "Harbour access");
        expect(graph(added)).toEqual(graph(c));
        expect(removeDimension(added, 2)).toEqual(c);
      }),
      { numRuns: 150 },
    );
  });
});

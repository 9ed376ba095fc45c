// Axis ticks for the spatial plot: steps of 1, 2 or 5 × 10^k with about the asked number of ticks,
// all inside the range — the rule d3-array's `ticks` follows (common practice; d3-array is not a
// dependency here, so the expected ticks below were worked by hand from that rule).
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { axisTicks, niceStep, tickLabel } from "../../../src/lib/estimates/axis-ticks.ts";

describe("axis ticks", () => {
  it("picks 1, 2 or 5 times a power of ten", () => {
    expect(axisTicks(0, 10, 6)).toEqual([0, 2, 4, 6, 8, 10]);
    expect(axisTicks(-0.5, 9.5, 6)).toEqual([0, 2, 4, 6, 8]);
    expect(axisTicks(0, 1, 5)).toEqual([0, 0.2, 0.4, 0.6, 0.8, 1]);
    expect(axisTicks(-3, 3, 6)).toEqual([-3, -2, -1, 0, 1, 2, 3]);
    expect(axisTicks(0, 100, 4)).toEqual([0, 50, 100]);
    expect(axisTicks(5, 5)).toEqual([5]);
    // A range just too short for the first step still gets ticks (found by the property below).
    expect(axisTicks(5e-11, 0.04000000007, 2)).toEqual([0.02, 0.04]);
    expect(niceStep(7, 6)).toBe(2);
    // Floating-point rounding of the span does not change the step (found by the property below).
    expect(niceStep(0.001, 2)).toBe(niceStep(255.99997368562305 + 0.001 - 255.99997368562305, 2));
    expect(tickLabel(-0)).toBe("0");
    expect(tickLabel(0.30000000000000004)).toBe("0.30000000000000004");
    expect(axisTicks(0.1, 0.35, 5)).toEqual([0.1, 0.15, 0.2, 0.25, 0.3, 0.35]);
  });

  it("keeps every tick inside the range, evenly spaced, with a short label", () => {
    fc.assert(
      fc.property(fc.double({ min: -1e4, max: 1e4, noNaN: true }), fc.double({ min: 1e-3, max: 1e4, noNaN: true }), fc.integer({ min: 2, max: 10 }), (lo, span, target) => {
        const hi = lo + span;
        const ticks = axisTicks(lo, hi, target);
        expect(ticks.length).toBeGreaterThanOrEqual(2);
        expect(ticks.length).toBeLessThanOrEqual(target * 4 + 2);
        const step = ticks[1] - ticks[0];
        for (const t of ticks) {
          expect(t).toBeGreaterThanOrEqual(lo - step * 1e-6);
          expect(t).toBeLessThanOrEqual(hi + step * 1e-6);
          expect(tickLabel(t).length).toBeLessThan(16);
        }
        expect([1, 2, 5, 10]).toContain(Number((step / 10 ** Math.floor(Math.log10(step) + 1e-9)).toFixed(6)));
        for (let i = 1; i < ticks.length; i++) expect(Math.abs(ticks[i] - ticks[i - 1] - step)).toBeLessThanOrEqual(step * 1e-6);
      }),
      { numRuns: 2000 },
    );
  });
});

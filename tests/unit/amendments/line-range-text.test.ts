// Reading a typed line reference (the product's own input convention; common practice, no source).
import { describe, expect, it } from "vitest";
import { lineRangeFromText } from "../../../src/lib/amendments/line-range-text.ts";

describe("lineRangeFromText", () => {
  it("rejects what is not a line or a range", () => {
    for (const t of ["x", "3-", "-3", "3-7-9", "3.5", "three"]) expect(lineRangeFromText(t), t).toBe("invalid");
  });
  it("reads nothing as no range, one line as a one-line range, and a range with either dash", () => {
    expect(lineRangeFromText("  ")).toBeNull();
    expect(lineRangeFromText("7")).toEqual([7, 7]);
    expect(lineRangeFromText("3-7")).toEqual([3, 7]);
    expect(lineRangeFromText(" 3 – 7 ")).toEqual([3, 7]);
  });
});

import { describe, expect, it } from "vitest";
import { amendmentsConflict } from "../../src/lib/amendments/conflicts.ts";

describe("conflicts (common practice, no source)", () => {
  it("overlapping line ranges of one section conflict; disjoint ones do not", () => {
    const a = { id: "A1", target: "s1", form: "strike" as const, lines: [2, 4] as [number, number] };
    expect(amendmentsConflict(a, { id: "A2", target: "s1", form: "insert", lines: [4, 5] })).toBe(true);
    expect(amendmentsConflict(a, { id: "A3", target: "s1", form: "insert", lines: [5, 6] })).toBe(false);
    expect(amendmentsConflict(a, { id: "A4", target: "s2", form: "substitute" })).toBe(false);
  });
});

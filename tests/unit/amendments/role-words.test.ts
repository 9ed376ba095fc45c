import { describe, expect, it } from "vitest";
import { TREE_ROLES } from "../../../src/lib/amendments/build-tree.ts";
import { roleWords, slotWords } from "../../../src/components/tree/role-words.ts";

// The words the drawing and the printable outline show for how an amendment counts (docs/rulebook-format.md,
// "Degrees and slots"); our own wording, no source.
describe("role and slot words", () => {
  it("has words for every role buildTree gives, and none for a node without one", () => {
    for (const r of TREE_ROLES) expect(roleWords(r, "S1")).toBeTruthy();
    expect(roleWords(null)).toBeNull();
    expect(roleWords("perfecting-under-substitute", "S1")).toContain("S1");
  });

  it("names the substitute place, the perfecting place, and the place under an amendment", () => {
    expect(slotWords("A/substitute")).toBe("substitute place of A");
    expect(slotWords("HB-12/perfecting")).toBe("perfecting place of HB-12");
    expect(slotWords("A")).toBe("under A");
    expect(slotWords(null)).toBeNull();
  });
});

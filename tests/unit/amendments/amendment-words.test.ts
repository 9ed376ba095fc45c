// How a filed amendment is named in a confirmation or a receipt (common practice, no source).
import { describe, expect, it } from "vitest";
import { draftLabels, filedAmendmentInWords, sectionInWords } from "../../../src/lib/amendments/amendment-words.ts";

describe("filedAmendmentInWords", () => {
  it("names the section by its number, with lines when given", () => {
    expect(filedAmendmentInWords({ key: "A3", measure: "HCA 12", targetKind: "section", section: "s2" })).toBe("Amendment A3 to section 2 of HCA 12");
    expect(filedAmendmentInWords({ key: "A3", measure: "HCA 12", targetKind: "section", section: "s2", lines: [3, 3] })).toBe("Amendment A3 to section 2, line 3, of HCA 12");
    expect(filedAmendmentInWords({ key: "A3", measure: "HCA 12", targetKind: "section", section: "s2", lines: [3, 5] })).toBe("Amendment A3 to section 2, lines 3–5, of HCA 12");
  });
  it("names an amendment to an amendment and one to the whole measure", () => {
    expect(filedAmendmentInWords({ key: "A4", measure: "HCA 12", targetKind: "amendment", targetKey: "A1" })).toBe("Amendment A4 to Amendment A1 to HCA 12");
    expect(filedAmendmentInWords({ key: "A5", measure: "HCA 12", targetKind: "measure" })).toBe("Amendment A5 to HCA 12");
  });
  it("keeps section ids of another shape as written", () => {
    expect(sectionInWords("preamble")).toBe("section preamble");
    expect(sectionInWords("s10")).toBe("section 10");
  });
});

describe("draftLabels", () => {
  it("names drafts in the order they were saved, never by their internal key; numbered amendments are left out", () => {
    const one = draftLabels([{ key: "A1", draft: false }, { key: "D-4d7cf41c", draft: true }]);
    expect([...one]).toEqual([["D-4d7cf41c", "Draft"]]);
    const two = draftLabels([{ key: "D-aa", draft: true }, { key: "A1", draft: false }, { key: "D-bb", draft: true }]);
    expect([...two]).toEqual([["D-aa", "Draft 1"], ["D-bb", "Draft 2"]]);
    expect(draftLabels([{ key: "A1", draft: false }]).size).toBe(0);
  });
});

// How a filed amendment is named in a confirmation or a receipt (common practice, no source).
import { describe, expect, it } from "vitest";
import { filedAmendmentInWords, sectionInWords } from "../../../src/lib/amendments/amendment-words.ts";

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

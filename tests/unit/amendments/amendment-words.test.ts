// How an amendment is named in a confirmation, a receipt, the amendments list and the desk, and how
// a draft is labelled in the tree (common practice, no source).
import { describe, expect, it } from "vitest";
import { amendmentInWords, amendmentLabels, sectionInWords, type AmendmentToName } from "../../../src/lib/amendments/amendment-words.ts";
import { ID_PATTERN } from "../../../src/lib/amendments/case-schema.ts";

const toSection = (number: number | null, lines: [number, number] | null = null): AmendmentToName => ({ number, targetKind: "section", targetSection: "s2", lineFrom: lines?.[0] ?? null, lineTo: lines?.[1] ?? null });
const toAmendment = (number: number | null): AmendmentToName => ({ number, targetKind: "amendment", targetSection: null, lineFrom: null, lineTo: null });

describe("amendmentInWords", () => {
  it("names the section by its number, with lines when given", () => {
    expect(amendmentInWords(toSection(3), "HCA 12")).toBe("Amendment A3 to section 2 of HCA 12");
    expect(amendmentInWords(toSection(3, [3, 3]), "HCA 12")).toBe("Amendment A3 to section 2, line 3, of HCA 12");
    expect(amendmentInWords(toSection(3, [3, 5]), "HCA 12")).toBe("Amendment A3 to section 2, lines 3–5, of HCA 12");
  });
  it("names an amendment to an amendment and one to the whole measure", () => {
    expect(amendmentInWords(toAmendment(4), "HCA 12", { number: 1 })).toBe("Amendment A4 to Amendment A1 to HCA 12");
    expect(amendmentInWords({ number: 5, targetKind: "measure", targetSection: null, lineFrom: null, lineTo: null }, "HCA 12")).toBe("Amendment A5 to HCA 12");
  });
  it("names a draft, which has no number, as a draft — and an amended amendment that is gone or still a draft", () => {
    expect(amendmentInWords(toSection(null, [3, 5]), "HCA 12")).toBe("A draft amendment to section 2, lines 3–5, of HCA 12");
    expect(amendmentInWords(toAmendment(null), "HCA 12", { number: 1 })).toBe("A draft amendment to Amendment A1 to HCA 12");
    expect(amendmentInWords(toAmendment(4), "HCA 12", null)).toBe("Amendment A4 to Amendment (removed) to HCA 12");
    expect(amendmentInWords(toAmendment(4), "HCA 12", { number: null })).toBe("Amendment A4 to a draft amendment to HCA 12");
  });
  it("keeps section ids of another shape as written", () => {
    expect(sectionInWords("preamble")).toBe("section preamble");
    expect(sectionInWords("s10")).toBe("section 10");
  });
});

describe("amendmentLabels", () => {
  it("labels filed amendments by number and drafts in the order they were saved, never by an internal key", () => {
    const one = amendmentLabels([{ id: "u1", number: 1 }, { id: "u2", number: null }]);
    expect([...one]).toEqual([["u1", "A1"], ["u2", "Draft"]]);
    const two = amendmentLabels([{ id: "u3", number: null }, { id: "u1", number: 1 }, { id: "u4", number: null }]);
    expect([...two]).toEqual([["u3", "Draft-1"], ["u1", "A1"], ["u4", "Draft-2"]]);
  });
  it("gives labels that are unique within the measure and valid ids of a tree case", () => {
    const rows = [{ id: "a", number: 1 }, { id: "b", number: null }, { id: "c", number: 12 }, { id: "d", number: null }, { id: "e", number: null }];
    const labels = [...amendmentLabels(rows).values()];
    expect(new Set(labels).size).toBe(rows.length);
    for (const l of labels) expect(l).toMatch(ID_PATTERN);
  });
});

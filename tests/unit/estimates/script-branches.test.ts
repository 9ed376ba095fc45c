// The chair's script for every branch (issue 15 item 6), hand-computed for two small trees.
// Order: the section is perfected before the vote on a substitute for it (Robert's Rules of Order
// Revised, 1915, §33, paraphrase: amendments to the paragraph to be struck out are voted on before
// the motion to substitute; the rulebook constraint "perfecting-before-substitute"); final passage last.
// Exclusive amendments: once text is struck out and inserted it cannot be amended again, so an
// amendment to the same lines falls (paraphrase of the same section's rule on changing matter
// already inserted or struck out; the engine's "falls").
import { describe, expect, it } from "vitest";
import { walkThrough } from "../../../src/lib/estimates/walk-through.ts";
import { chairScript, scriptDocument, scriptMarkdown } from "../../../src/lib/estimates/chair-script.ts";
import { documentText } from "../../../src/lib/documents/model.ts";
import type { TreeLabels } from "../../../src/lib/estimates/version-words.ts";

const voting = { procedure: "amendment", constraints: ["secondary-before-primary", "perfecting-before-substitute", "passage-last"], citation: "test" };
const measure = { id: "measure", number: "HCA 1", title: "Test", subjects: ["x"], sections: [{ id: "s1", subjects: ["x"], status: "open" }] };

describe("a perfecting amendment and a substitute for the same section", () => {
  const amendments = [
    { id: "A1", target: "s1", form: "strike-and-insert", lines: [1, 2], sponsors: [], subjects: [], status: "filed" },
    { id: "S", target: "s1", form: "substitute", sponsors: [], subjects: [], status: "filed" },
  ];
  const labels: TreeLabels = { measureKey: "measure", measureLabel: "HCA 1", amendments: { A1: { title: "Ferry hours", form: "strike-and-insert", target: "s1", targetLabel: "section 1", lines: [1, 2], degree: 1 }, S: { title: "New section", form: "substitute", target: "s1", targetLabel: "section 1", degree: 1 } } };
  // 2 members: +A1 > measure > Q; 1 member: +S > Q. Sincere path: A1 adopted 2–0, S rejected 1–2, passage of +A1.
  const raw = { rulebook: { voting }, measure, amendments, profile: { ballots: [{ ranking: ["measure+A1", "measure", "Q"], weight: 2 }, { ranking: ["measure+S", "Q"], weight: 1 }] } };

  it("refuses to put the substitute before the section is perfected", () => {
    expect(() => walkThrough(raw, ["S", "A1", "passage"])).toThrow(expect.objectContaining({ code: "unprocessable" }));
  });

  it("writes out all seven steps: A1, the substitute after each result of A1, and passage on each of the four texts", () => {
    const w = walkThrough(raw, ["A1", "S", "passage"]);
    // Hand-computed: step 1 A1; 2 = S against +A1 (A1 adopted); 3 = S against the measure (A1 rejected);
    // 4–7 passage of +S, +A1, +S, the measure.
    expect(w.branches.map((b) => [b.id, b.question, b.motion, b.base])).toEqual([
      [1, "A1", "measure+A1", "measure"],
      [2, "S", "measure+S", "measure+A1"],
      [3, "S", "measure+S", "measure"],
      [4, "passage", "measure+S", "Q"],
      [5, "passage", "measure+A1", "Q"],
      [6, "passage", "measure+S", "Q"],
      [7, "passage", "measure", "Q"],
    ]);
    expect(w.branches[0]).toMatchObject({ ifAdopted: { next: 2 }, ifRejected: { next: 3 } });
    expect(w.branches[2]).toMatchObject({ ifAdopted: { next: 6 }, ifRejected: { next: 7 }, from: [{ step: 1, adopted: false }] });
    expect(w.branches[6]).toMatchObject({ ifAdopted: { next: null, outcome: "measure" }, ifRejected: { next: null, outcome: "Q" } });
    expect(w.branches.filter((b) => b.projected).map((b) => b.id)).toEqual([1, 2, 5]);

    const script = chairScript(w, labels, "majority", "Whip count");
    const three = script.branches[2];
    expect(three.reached).toBe("Reached after step 1 is rejected.");
    expect(three.adoptionWords).toBe("The ayes have it, and the amendment is agreed to.");
    expect(three.rejectionWords).toBe("The noes have it, and the amendment is not agreed to.");
    expect(three.onRejection).toContain("Next: step 7, final passage of HCA 1.");
    expect(script.branches[6].onRejection).toMatch(/^HCA 1 is not passed; current law stands\. No question remains\. The result: .*current law stands/);
    expect(script.branches[6].onAdoption).toMatch(/^HCA 1 is passed in the form: HCA 1 as introduced, without amendment\. No question remains\./);
  });

  it("prints the sitting, the date and a tally line for every step; blank lines to fill when not given", () => {
    const script = chairScript(walkThrough(raw, ["A1", "S", "passage"]), labels, "majority", "Whip count");
    const text = documentText(scriptDocument(script, { chamber: "Quillbrook Assembly", sitting: "Sitting of 9 December", date: "9 December 2026" }));
    expect(text).toContain("Sitting of 9 December — 9 December 2026");
    expect(text.match(/Ayes ______ {3}Noes ______ {3}Abstaining ______/g)).toHaveLength(7);
    expect(scriptMarkdown(script)).toContain("Sitting: ______________________ — Date: ______________");
  });
});

describe("two exclusive amendments to the same lines", () => {
  const amendments = [
    { id: "A1", target: "s1", form: "strike-and-insert", lines: [1, 2], sponsors: [], subjects: [], status: "filed" },
    { id: "A2", target: "s1", form: "strike-and-insert", lines: [2, 3], sponsors: [], subjects: [], status: "filed" },
  ];
  const labels: TreeLabels = { measureKey: "measure", measureLabel: "HCA 1", amendments: { A1: { title: "Wider", form: "strike-and-insert", target: "s1", lines: [1, 2], degree: 1 }, A2: { title: "Narrower", form: "strike-and-insert", target: "s1", lines: [2, 3], degree: 1 } } };
  const raw = { rulebook: { voting }, measure, amendments, profile: { ballots: [{ ranking: ["measure+A2", "measure", "Q"], weight: 1 }] } };

  it("says A2 falls when A1 is adopted, and gives A2's words when A1 is rejected (the branch the projection does not take)", () => {
    const script = chairScript(walkThrough(raw, ["A1", "A2", "passage"]), labels, "majority", "x");
    const [one] = script.branches;
    expect(one.onAdoption).toContain("A2 (Narrower) falls and will not be put; the chair announces it. Next: step 2, final passage of HCA 1.");
    expect(one.onRejection).toContain("Next: step 3, amendment A2 (Narrower).");
    const a2 = script.branches.find((b) => b.question === "A2")!;
    expect(a2.reached).toBe("Reached after step 1 is rejected.");
    expect(a2.wording[0]).toContain("The question is on amendment A2 (Narrower)");
    expect(a2.projected).toBe(true);
    expect(one.projected).toBe(true);
  });
});

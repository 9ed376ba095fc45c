/**
 * The clause splitter on snippets laid out as the published texts lay them out (numbering, captions,
 * line breaks of a PDF extraction). The wording is abridged (paraphrase) except where quoted:
 *  - Rules of the House of Representatives, Rule XVI (Motions and Amendments), clauses 1, 4 and 6;
 *  - Standing Orders of the House of Commons (2002), Nos. 31 and 32;
 *  - Robert's Rules of Order Revised (1915), §§33-34, numbered with "§";
 *  - Rules of Procedure of the European Parliament, 8th term, Rule 170 ("Article"-style numbering, paraphrase);
 *  - a Markdown file of fictional standing orders (the demo chamber's style).
 */
import { describe, expect, it } from "vitest";
import { splitClauses, type Clause } from "../../../src/lib/chamber-text/split-clauses.ts";

const byLabel = (cs: Clause[]) => Object.fromEntries(cs.map((c) => [c.label, c]));

const HOUSE = `RULES OF THE HOUSE OF REPRESENTATIVES

RULE XVI
MOTIONS AND AMENDMENTS
Motions
1. Every motion entertained by the Speaker shall be reduced to writing on the demand of a
Member and, if desired by the Speaker, be read before being debated.
Privileged motions
4. (a) When a question is under debate, only the following motions may be entertained (which
have precedence in the following order):
(1) To adjourn.
(2) To lay on the table.
(3) For the previous question.
(b) A motion to adjourn, to lay on the table, or for the previous question shall be decided without
debate.
17
Amendments
6. When an amendment to legislation is pending, a motion to amend and a motion to amend that
amendment shall be in order under paragraph
(a) of clause 4 of this rule.
RULE XVII
DECORUM AND DEBATE
1. (a) A Member shall rise and respectfully address the Speaker.`;

describe("US House rules: Rule, clause, paragraph", () => {
  const { clauses, preamble } = splitClauses(HOUSE);
  const c = byLabel(clauses);

  it("numbers each clause as the House cites it", () => {
    expect(clauses.map((x) => x.label)).toEqual([
      "Rule XVI",
      "Rule XVI, clause 1",
      "Rule XVI, clause 4",
      "Rule XVI, clause 4(a)",
      "Rule XVI, clause 4(a)(1)",
      "Rule XVI, clause 4(a)(2)",
      "Rule XVI, clause 4(a)(3)",
      "Rule XVI, clause 4(b)",
      "Rule XVI, clause 6",
      "Rule XVII",
      "Rule XVII, clause 1",
      "Rule XVII, clause 1(a)",
    ]);
    expect(preamble).toBe("RULES OF THE HOUSE OF REPRESENTATIVES");
  });

  it("keeps titles and captions apart from the text, and joins wrapped lines", () => {
    expect(c["Rule XVI"]!.title).toBe("MOTIONS AND AMENDMENTS");
    expect(c["Rule XVI, clause 4"]!.title).toBe("Privileged motions");
    expect(c["Rule XVI, clause 1"]!.text).toBe("Every motion entertained by the Speaker shall be reduced to writing on the demand of a Member and, if desired by the Speaker, be read before being debated.");
  });

  it("drops a page number and keeps \"(a) of clause 4\" inside the sentence a PDF line break cut", () => {
    expect(c["Rule XVI, clause 4(b)"]!.text).toBe("A motion to adjourn, to lay on the table, or for the previous question shall be decided without debate.");
    expect(c["Rule XVI, clause 6"]!.text).toMatch(/in order under paragraph \(a\) of clause 4 of this rule\.$/);
    expect(c["Rule XVI, clause 6"]!.title).toBe("Amendments");
  });

  it("gives unique keys and parents", () => {
    expect(new Set(clauses.map((x) => x.key)).size).toBe(clauses.length);
    expect(c["Rule XVI, clause 4(a)(2)"]).toMatchObject({ key: "rule-xvi/4/a/2", parent: "rule-xvi/4/a", level: 3, path: ["Rule XVI", "4", "(a)", "(2)"] });
  });
});

describe("Westminster standing orders: SO 32(1), letters and roman numerals", () => {
  const text = `Selection of amendments
32.—(1) In respect of any motion or in committee on any bill, the Speaker shall have power to
select the amendments, new clauses or new schedules to be proposed.
(2) The Speaker may call upon any Member who has given notice of an amendment to give such
explanation of the object of the amendment as may enable the Speaker to form a judgment upon it.

Questions on amendments
31.—(1) Where an amendment is proposed, the question shall be—
(a) that the original words stand part of the question; and
(b) that the proposed words be there inserted, where—
(i) words are to be left out; or
(ii) words are to be added;
(c) in any other case, that the amendment be made.
(h) an eighth paragraph;
(i) a ninth paragraph, lettered.`;
  const { clauses } = splitClauses(text);

  it("reads 32.—(1) as order 32, paragraph (1)", () => {
    expect(clauses.slice(0, 3).map((c) => [c.label, c.title])).toEqual([
      ["32", "Selection of amendments"],
      ["32(1)", null],
      ["32(2)", null],
    ]);
  });

  it("tells (i) the roman numeral from (i) the letter after (h)", () => {
    const labels = clauses.map((c) => c.label);
    expect(labels).toContain("31(1)(b)(i)");
    expect(labels).toContain("31(1)(b)(ii)");
    expect(labels).toContain("31(1)(c)");
    expect(labels.at(-1)).toBe("31(1)(i)");
    expect(clauses.at(-1)!.text).toBe("a ninth paragraph, lettered.");
  });
});

describe("headings by word: Standing Order No., S.O., §, Article", () => {
  it("Standing Order No. 32 and S.O. 33 are cited as SO", () => {
    const { clauses } = splitClauses("Standing Order No. 32 Selection of amendments\n(1) The Speaker shall select.\n\nS.O. 33\n(1) Amendments are called.");
    expect(clauses.map((c) => c.label)).toEqual(["SO 32", "SO 32(1)", "SO 33", "SO 33(1)"]);
    expect(clauses[0]!.title).toBe("Selection of amendments");
  });

  it("§33 and §34 of Robert's Rules, each with its title and text", () => {
    const { clauses } = splitClauses("§33. To Amend. This motion takes precedence of the motion to postpone indefinitely.\n\n§ 34. To Postpone Indefinitely. This motion cannot be amended.");
    expect(clauses.map((c) => [c.label, c.title, c.text])).toEqual([
      ["§33", "To Amend", "This motion takes precedence of the motion to postpone indefinitely."],
      ["§34", "To Postpone Indefinitely", "This motion cannot be amended."],
    ]);
  });

  it("\"Section 3 of the Act\" in a sentence is not a heading; Article 170 with numbered paragraphs is", () => {
    const { clauses } = splitClauses("Article 170\nAdmissibility of amendments\n1. An amendment shall be inadmissible if:\n(a) it does not directly relate to the text;\n(b) it seeks to delete the whole of a text.\nSection 3 of the Act applies.");
    expect(clauses.map((c) => c.label)).toEqual(["Article 170", "Article 170, paragraph 1", "Article 170, paragraph 1(a)", "Article 170, paragraph 1(b)"]);
    expect(clauses[0]!.title).toBe("Admissibility of amendments");
    expect(clauses.at(-1)!.text).toBe("it seeks to delete the whole of a text. Section 3 of the Act applies.");
  });

  it("a Rule inside a Chapter is cited by its rule; a new chapter closes the rule", () => {
    const { clauses } = splitClauses("Chapter 1 Sittings\nRule 1 Quorum\n1. A quorum is a majority.\nChapter 2 Debate\nRule 2 Speaking\n1. A member speaks once.");
    expect(clauses.map((c) => [c.label, c.level])).toEqual([
      ["Chapter 1", 0],
      ["Rule 1", 1],
      ["Rule 1, clause 1", 2],
      ["Chapter 2", 0],
      ["Rule 2", 1],
      ["Rule 2, clause 1", 2],
    ]);
  });
});

describe("Markdown and plain numbered lists", () => {
  it("reads Markdown headings, bold numbers and list numbers (fictional standing orders)", () => {
    const md = "# Standing Orders of the Harrowmere Assembly\n\n## SO 20 Precedence of motions\nWhen a question is under debate, no motion shall be received except:\n1. to adjourn;\n2. to lay on the table.\n\n## SO 42 Suspension\n**(1)** Standing orders may be suspended by a majority of all members.\n";
    const { clauses, preamble } = splitClauses(md);
    expect(clauses.map((c) => c.label)).toEqual(["SO 20", "SO 20, paragraph 1", "SO 20, paragraph 2", "SO 42", "SO 42(1)"]);
    expect(clauses[0]!.text).toBe("When a question is under debate, no motion shall be received except:");
    expect(clauses.at(-1)!.text).toBe("Standing orders may be suspended by a majority of all members.");
    expect(preamble).toBe("Standing Orders of the Harrowmere Assembly");
  });

  it("a document numbered only 1., 2. with (a), (b) below", () => {
    const { clauses } = splitClauses("1. Meetings are held monthly.\n(a) The chair calls them.\n(b) Notice is seven days.\n2. A quorum is five.");
    expect(clauses.map((c) => c.label)).toEqual(["1", "1(a)", "1(b)", "2"]);
    expect(clauses.map((c) => c.key)).toEqual(["1", "1/a", "1/b", "2"]);
  });

  it("repeated numbering gets distinct keys; text without numbers is all preamble", () => {
    expect(splitClauses("1. One.\n1. One again.").clauses.map((c) => c.key)).toEqual(["1", "1~2"]);
    const none = splitClauses("These rules have no numbers at all.\nNone.");
    expect(none.clauses).toEqual([]);
    expect(none.preamble).toContain("no numbers");
  });
});

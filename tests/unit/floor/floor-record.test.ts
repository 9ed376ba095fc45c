// The floor record's pure parts: how a question is named, the count against a threshold, and the
// board replayed after a correction. Thresholds: a majority of the votes cast and a tie loses
// (Robert's Rules of Order Revised, 1915, §46 pp. 191–192); two-thirds of the votes cast (§48 p. 204);
// a majority of the members counts against the whole membership (the demo rulebook's 40 members).
import { readFileSync } from "node:fs";
import { resolve } from "node:path";
import { describe, expect, it } from "vitest";
import { parseRulebook } from "../../../src/lib/procedure/parse-rulebook.ts";
import { questionName } from "../../../src/lib/procedure/question-name.ts";
import { countAdopts, replayBoard, type Entry } from "../../../src/lib/server/floor-record.ts";

const demo = parseRulebook(JSON.parse(readFileSync(resolve(import.meta.dirname, "../../../rulebooks/demo-chamber.json"), "utf8")));
const V = "00000000-0000-4000-8000-000000000001";

describe("questionName", () => {
  const main = { motion: "main", name: "Main motion", degree: null, text: "That the Assembly approve the scheme", ref: "" };
  const a1 = { motion: "amend", name: "Amend", degree: 1, text: "", ref: "A1" };
  const a2 = { motion: "amend", name: "Amend", degree: 2, text: "Insert 'and seating'", ref: "A2" };
  it("names an amendment by its reference and what it amends, with its wording", () => {
    expect(questionName([main, a1, a2], 2)).toBe("Amendment A2 to Amendment A1 — “Insert 'and seating'”");
    expect(questionName([main, a1], 1)).toBe("Amendment A1 to the main motion");
    expect(questionName([main, { ...a1, ref: "" }], 1)).toBe("An amendment to the main motion");
    expect(questionName([main], 0)).toBe("Main motion — “That the Assembly approve the scheme”");
  });
  it("shortens long wording", () => {
    const long = { ...main, text: "x".repeat(200) };
    expect(questionName([long], 0).length).toBeLessThan(100);
  });
});

describe("countAdopts", () => {
  it("a tie loses under a majority; two-thirds of the votes cast; a majority of the members", () => {
    expect(countAdopts("majority", { yes: 16, no: 16, abstain: 0 }, 40)).toBe(false);
    expect(countAdopts("majority", { yes: 17, no: 16, abstain: 5 }, 40)).toBe(true);
    expect(countAdopts("two-thirds", { yes: 20, no: 12, abstain: 0 }, 40)).toBe(false);
    expect(countAdopts("two-thirds", { yes: 22, no: 11, abstain: 0 }, 40)).toBe(true);
    expect(countAdopts("majority-of-members", { yes: 20, no: 2, abstain: 0 }, 40)).toBe(false);
    expect(countAdopts("majority-of-members", { yes: 21, no: 2, abstain: 0 }, 40)).toBe(true);
    expect(countAdopts("majority-of-members", { yes: 21, no: 2, abstain: 0 }, undefined)).toBeNull();
  });
});

describe("replayBoard", () => {
  const entries: Entry[] = [
    { seq: 1, payload: { kind: "made", motion: "main", text: "M", key: "q1" }, summary: "Moved: main" },
    { seq: 2, payload: { kind: "made", motion: "amend", ref: "A1", key: "q2" }, summary: "Moved: A1" },
    { seq: 3, payload: { kind: "voted", question: "q2", result: "rejected", method: "voice" }, summary: "Voted: A1 rejected" },
  ];
  it("applies every entry in order", () => {
    expect(replayBoard(entries, V, () => demo).pending.map((p) => p.key)).toEqual(["q1"]);
  });
  it("skips a struck entry, or puts its replacement in its place", () => {
    const struck = replayBoard([...entries, { seq: 4, payload: { kind: "strike", entry: 3, reason: "wrong" }, summary: "" }], V, () => demo);
    expect(struck.pending.map((p) => p.key)).toEqual(["q1", "q2"]);
    expect(struck.lastVote).toBeNull();
    const replaced = replayBoard([...entries, { seq: 4, payload: { kind: "strike", entry: 3, reason: "count", replacement: { kind: "voted", question: "q2", result: "adopted", method: "division", tally: { yes: 20, no: 12, abstain: 0 } } }, summary: "" }], V, () => demo);
    expect(replaced.lastVote).toMatchObject({ result: "adopted", tally: { yes: 20, no: 12 } });
  });
  it("refuses a correction that leaves a later entry without its question", () => {
    const later = [...entries, { seq: 4, payload: { kind: "voted", question: "q1", result: "adopted", method: "voice" }, summary: "Voted: main adopted" }];
    expect(() => replayBoard([...later, { seq: 5, payload: { kind: "strike", entry: 3, reason: "wrong" }, summary: "" }], V, () => demo)).toThrow(/Entry 4/);
  });
});

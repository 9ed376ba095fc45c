// The journal generated from a recorded sitting (pure), checked by hand against the record below.
// A journal records what was done, not what was said (paraphrase of Robert's Rules of Order
// Revised, 1915, §59): seconds, statements and debate are left out; motions with their movers,
// the questions put in order with results and counts, the recorded vote by name, rulings and
// corrections are kept. A second-degree amendment is voted on before the first-degree amendment it
// amends (RONR 1915 §33, paraphrase), so the questions are put A2, A1, M1.
import { describe, expect, it } from "vitest";
import { journalDocument, journalOf, type RecordEntry, type SittingRecord } from "../../../src/lib/journal/journal.ts";
import { documentText } from "../../../src/lib/documents/model.ts";

const at = (m: number) => new Date(Date.UTC(2026, 11, 3, 9, m)).toISOString();
let seq = 0;
const e = (payload: RecordEntry["payload"], by = "Clerk Penrose"): RecordEntry => ({ seq: ++seq, payload, summary: `entry ${seq + 0}`, by, at: at(seq) });
const members = ["Arden", "Bellweather", "Carrow", "Dunmore", "Ellery"].map((name, i) => ({ id: `m${i}`, name }));

const entries: RecordEntry[] = [
  e({ kind: "made", motion: "main", ref: "M1", text: "That the ferry run daily", mover: "Ms Arden", key: "q1" }),
  e({ kind: "seconded", question: "q1" }),
  e({ kind: "stated", question: "q1" }),
  e({ kind: "made", motion: "amend", ref: "A1", text: "Insert 'in summer'", mover: "Mr Bellweather", key: "q4" }),
  e({ kind: "floor", speaker: "Mr Carrow" }),
  e({ kind: "made", motion: "amend", ref: "A2", text: "Insert 'and spring'", mover: "Mr Carrow", key: "q6" }),
  // 7: A2 rejected by division 2–3
  e({ kind: "voted", question: "q6", result: "rejected", method: "division", tally: { yes: 2, no: 3, abstain: 0 } }),
  // 8: A1 adopted by a recorded vote (Arden, Bellweather, Carrow yea; Dunmore nay; Ellery not in the roll)
  e({ kind: "voted", question: "q4", result: "adopted", method: "recorded", tally: { yes: 3, no: 1, abstain: 0 }, roll: [{ member: "m0", position: "yea" }, { member: "m1", position: "yea" }, { member: "m2", position: "yea" }, { member: "m3", position: "nay" }] }),
  // 9: M1 recorded as rejected by voice — wrong; struck by 10, adopted 4–1 in its place
  e({ kind: "voted", question: "q1", result: "rejected", method: "voice", tally: null }),
  e({ kind: "strike", entry: 9, reason: "The chair declared the main motion adopted.", replacement: { kind: "voted", result: "adopted", method: "division", tally: { yes: 4, no: 1, abstain: 0 } } }),
  e({ kind: "close" }),
];

const record: SittingRecord = {
  chamber: "Quillbrook Assembly",
  sitting: "Sitting of 3 December",
  openedAt: at(0),
  closedAt: at(11),
  dates: { timeZone: "Europe/London" },
  motions: { main: "Main motion", amend: "Amend" },
  amendMotion: "amend",
  members,
  entries,
  rulings: [{ number: 4, question: "Is amendment A2 germane?", decision: "Point of order not sustained (overruled).", raisedBy: "Ms Dunmore" }],
};

describe("journalOf", () => {
  const j = journalOf(record);

  it("keeps motions with movers and questions put, leaves out seconds, statements and who had the floor", () => {
    expect(j.items.map((i) => i.entry)).toEqual([1, 4, 6, 7, 8, 9, 10, 11]);
    expect(j.items[0].text).toBe("Ms Arden moved: Main motion M1 — “That the ferry run daily”.");
    expect(j.items[2].text).toBe("Mr Carrow moved: Amendment A2 to Amendment A1 — “Insert 'and spring'”.");
  });

  it("numbers the questions put in order A2, A1, M1, with results and counts", () => {
    expect(j.questionsPut).toBe(3);
    const put = j.items.filter((i) => i.question && !i.struck).map((i) => [i.question!.number, i.question!.name.split(" — ")[0], i.question!.result, i.question!.count]);
    expect(put).toEqual([
      [1, "Amendment A2 to Amendment A1", "rejected", "on a division, 2 in favour, 3 against"],
      [2, "Amendment A1 to Main motion M1", "adopted", "on a recorded vote, yeas 3, nays 1"],
    ]);
  });

  it("names each member's vote on the recorded vote; a member left out of the roll did not vote", () => {
    expect(j.items[4].roll).toEqual({ yea: ["Arden", "Bellweather", "Carrow"], nay: ["Dunmore"], present: [], "not-voting": ["Ellery"], recused: [] });
  });

  it("shows the struck entry struck with its reason, and the correction with what stands in its place", () => {
    const struck = j.items.find((i) => i.entry === 9)!;
    expect(struck.struck).toEqual({ by: 10, reason: "The chair declared the main motion adopted.", who: "Clerk Penrose" });
    expect(struck.text).toContain("not agreed to on a vote by voice");
    const c = j.items.find((i) => i.entry === 10)!;
    expect(c.kind).toBe("correction");
    expect(c.text).toContain("Reason: The chair declared the main motion adopted.");
    expect(c.correction!.replacement).toContain("agreed to on a division, 4 in favour, 1 against");
  });

  it("dates the sitting on the chamber's clock and records the close", () => {
    expect(j.date).toBe("3 December 2026");
    expect(j.items[j.items.length - 1].text).toBe("The sitting was closed at 3 December 2026, 09:11.");
  });

  it("renders as a document with the rulings and the approval line", () => {
    const text = documentText(journalDocument(j, "Approved 4 December 2026, 10:00 by Clerk Penrose."));
    expect(text).toContain("Ruling 4. Ms Dunmore raised a point of order: Is amendment A2 germane? Point of order not sustained (overruled).");
    expect(text).toContain("Yeas (3): Arden, Bellweather, Carrow");
    expect(text).toContain("[Struck out by the correction in entry 10: The chair declared the main motion adopted.]");
    expect(text).toContain("Approved 4 December 2026, 10:00 by Clerk Penrose.");
  });
});

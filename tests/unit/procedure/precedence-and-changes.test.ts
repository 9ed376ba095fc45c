// The order of precedence as the editor shows and rewrites it, and the differences between two
// versions in plain words. Sources: the demo chamber's order follows Robert's Rules of Order Revised
// (1915), Order of Precedence of Motions; the tie follows US House Rule XVI cl. 4(c) (paraphrase:
// the motions to fix the day to which the House shall adjourn and to authorise a recess have equal
// privilege with the motion to adjourn). The rest is the product's own contract (common practice, no source).
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { legalMoves } from "../../../src/lib/procedure/legal-moves.ts";
import { parseRulebook } from "../../../src/lib/procedure/parse-rulebook.ts";
import { addToOrder, applyPrecedence, moveBefore, moveDown, moveUp, precedenceView, removeFromOrder, separate, tieWithAbove } from "../../../src/lib/procedure/precedence-order.ts";
import { changeLine, describeChanges } from "../../../src/lib/procedure/rulebook-changes.ts";

const demo = () => JSON.parse(readFileSync("rulebooks/demo-chamber.json", "utf8"));
const gpl = () => JSON.parse(readFileSync("rulebooks/general-parliamentary-law.json", "utf8"));

describe("order of precedence", () => {
  it("reads chains as tiers, highest first, with the unranked apart (RONR 1915, Order of Precedence)", () => {
    const v = precedenceView(demo());
    expect(v.tiers[0]).toEqual(["fix-time-to-adjourn"]);
    expect(v.tiers.at(-1)).toEqual(["main"]);
    expect(v.tiers.flat()).toHaveLength(13);
    expect(v.unranked).toContain("point-of-order");
    expect(v.unranked).toContain("reconsider");
  });

  it("reads equal numbers as a tie (GPL: amend and filling a blank share a rank)", () => {
    const v = precedenceView(gpl());
    const tie = v.tiers.find((t) => t.includes("amend"))!;
    expect(tie).toContain("fill-blank");
  });

  it("moves up and down by keyboard steps, ties and separates, and writes numeric ranks the engine reads", async () => {
    const doc = demo();
    let v = precedenceView(doc);
    v = moveUp(v, "previous-question"); // above lay on the table
    expect(v.tiers.flat().indexOf("previous-question")).toBeLessThan(v.tiers.flat().indexOf("lay-on-table"));
    v = moveDown(v, "previous-question");
    expect(v.tiers.flat().indexOf("previous-question")).toBeGreaterThan(v.tiers.flat().indexOf("lay-on-table"));
    // US House Rule XVI cl. 4(c) (paraphrase): recess of equal privilege with adjourn.
    v = tieWithAbove(v, "recess");
    expect(v.tiers[1]).toEqual(["adjourn", "recess"]);
    const written = applyPrecedence(doc, v);
    expect(written.precedence).toBeUndefined();
    const parsed = parseRulebook(written);
    const rank = (id: string) => parsed.motions.find((m) => m.id === id)!.rank;
    expect(rank("adjourn")).toBe(rank("recess"));
    expect(rank("fix-time-to-adjourn")).toBeGreaterThan(rank("adjourn")!);
    // Equal rank: neither may be moved while the other is immediately pending (ranksNotAbove).
    const moves = await legalMoves(parsed, { pending: [{ motion: "main" }, { motion: "adjourn" }] });
    expect(moves.find((m) => m.motion === "recess")!.inOrder).toBe(false);
    expect(moves.find((m) => m.motion === "fix-time-to-adjourn")!.inOrder).toBe(true);
    // Separating puts it just below the others of its tier.
    const apart = separate(v, "recess");
    expect(apart.tiers[1]).toEqual(["adjourn"]);
    expect(apart.tiers[2]).toEqual(["recess"]);
  });

  it("states a tie in a precedence chain as one place holding several motions (US House Rule XVI cl. 4(c), paraphrase); plain chains load as before", async () => {
    const doc = demo();
    const plain = parseRulebook(demo());
    doc.precedence = [["fix-time-to-adjourn", ["adjourn", "recess"], "question-of-privilege", "orders-of-the-day", "lay-on-table", "previous-question", "limit-debate", "postpone-definitely", "commit", "amend", "postpone-indefinitely", "main"]];
    const tied = parseRulebook(doc);
    const rank = (rb: typeof plain, id: string) => rb.motions.find((m) => m.id === id)!.rank!;
    expect(rank(tied, "adjourn")).toBe(rank(tied, "recess"));
    expect(rank(tied, "fix-time-to-adjourn")).toBeGreaterThan(rank(tied, "adjourn"));
    expect(rank(plain, "adjourn")).toBeGreaterThan(rank(plain, "recess"));
    expect(precedenceView(doc).tiers[1]).toEqual(["recess", "adjourn"]);
    const moves = await legalMoves(tied, { pending: [{ motion: "main" }, { motion: "recess" }] });
    expect(moves.find((m) => m.motion === "adjourn")!.inOrder).toBe(false);
    // A motion tied with itself, or above itself through a tie, is refused.
    doc.precedence = [["adjourn", ["adjourn", "recess"]]];
    expect(() => parseRulebook(doc)).toThrow(/above itself/);
  });

  it("drag puts a motion above the one dropped on; ranking and unranking move between the lists", () => {
    let v = precedenceView(demo());
    v = moveBefore(v, "main", "fix-time-to-adjourn");
    expect(v.tiers[0]).toEqual(["main"]);
    v = removeFromOrder(v, "main");
    expect(v.unranked).toContain("main");
    v = addToOrder(v, "main");
    expect(v.tiers.at(-1)).toEqual(["main"]);
  });

  it("keeps the numbers when only the order changes in a numerically ranked rulebook", () => {
    const doc = gpl();
    const before = doc.motions.map((m: { rank: number | null }) => m.rank).filter((r: number | null) => r !== null).sort();
    const v = moveUp(precedenceView(doc), "lay-on-table");
    const after = applyPrecedence(doc, v).motions.map((m: { rank: number | null }) => m.rank).filter((r: number | null) => r !== null).sort();
    expect(after).toEqual(before);
  });
});

describe("differences in plain words", () => {
  it("lists a re-ranking, a threshold, a deadline and a new rule as a clerk reads them, with citations", () => {
    const a = demo();
    const b = applyPrecedence(a, moveUp(precedenceView(a), "previous-question"));
    b.motions = b.motions.map((m: Record<string, unknown>) => (m.id === "limit-debate" ? { ...m, vote: "majority" } : m));
    b.amendments = { ...b.amendments, filingDeadline: { hoursBefore: 24, citation: "Harrowmere County Assembly Standing Orders (fictional) SO 64" } };
    b.rules = [...b.rules, { id: "no-recess-in-debate", scope: "motion", citation: "SO 99", message: "No recess in debate.", conditions: { all: [{ fact: "motion", path: "$.id", operator: "equal", value: "recess" }, { fact: "floor", path: "$.debateBegun", operator: "equal", value: true }] } }];
    const lines = describeChanges(a, b).map(changeLine);
    expect(lines).toContain("Filing deadline: 48 hours → 24 hours (Harrowmere County Assembly Standing Orders (fictional) SO 64)");
    expect(lines.some((l) => l.startsWith("Limit or extend limits of debate — vote required: two-thirds → a majority"))).toBe(true);
    expect(lines.some((l) => l.startsWith("Close debate: below Lay on the table → ranks above Lay on the table"))).toBe(true);
    expect(lines).toContain("Rule added: Take a recess is out of order when debate has begun. (SO 99)");
    // Nothing else changed: the chains rewritten as numbers are not a change of substance.
    expect(lines).toHaveLength(4);
    for (const l of lines) expect(l).not.toMatch(/[{}"]|hoursBefore|filingDeadline/);
  });

  it("lists motions and rules removed, a rule changed as old and new sentences, and nothing for identical versions", () => {
    const a = demo();
    expect(describeChanges(a, demo())).toEqual([]);
    const b = demo();
    b.motions = b.motions.filter((m: { id: string }) => m.id !== "rescind");
    b.rules = b.rules.filter((r: { id: string }) => r.id !== "restorative-needs-empty-floor" && r.id !== "rescind-needs-empty-floor").map((r: Record<string, any>) => (r.id === "appeal-needs-ruling" ? { ...r, conditions: { all: [{ fact: "motion", path: "$.id", operator: "equal", value: "appeal" }, { fact: "floor", path: "$.debateBegun", operator: "equal", value: true }] } } : r));
    b.motions.push({ id: "call-for-quorum", name: "Call for a quorum count", class: "incidental", rank: null, second: false, debatable: false, amendable: false, vote: "none", interrupt: true, reconsiderable: "neither", citation: "SO 70 (fictional)" });
    b.amendments = { ...b.amendments, maxDegree: 1, filingDeadline: null };
    const changes = describeChanges(a, b);
    expect(changes.find((c) => c.kind === "removed" && c.section === "motions")?.text).toBe("Rescind");
    expect(changes.find((c) => c.kind === "added" && c.section === "motions")).toMatchObject({ text: "Call for a quorum count", citation: "SO 70 (fictional)" });
    expect(changes.map(changeLine)).toContain("Highest degree of amendment: 2 → 1 (Harrowmere County Assembly Standing Orders (fictional) SO 60-66)");
    expect(changes.map(changeLine)).toContain("Filing deadline: 48 hours → none (Harrowmere County Assembly Standing Orders (fictional) SO 64)");
    const changed = changes.find((c) => c.section === "rules" && c.kind === "changed")!;
    expect(changed.from).toBe("Appeal from the decision of the chair is out of order when the chair has not ruled.");
    expect(changed.to).toBe("Appeal from the decision of the chair is out of order when debate has begun.");
  });
});

/**
 * Coverage of the chamber's text by a rulebook's clause links. The text is the demo chamber's fictional
 * standing orders (Markdown); the rulebook is the demo-chamber template with links added.
 */
import { describe, expect, it } from "vitest";
import { clauseCoverage, linkableItems, setClauseLink } from "../../../src/lib/chamber-text/coverage.ts";
import { splitClauses } from "../../../src/lib/chamber-text/split-clauses.ts";
import { parseRulebook } from "../../../src/lib/procedure/parse-rulebook.ts";
import { legalMoves } from "../../../src/lib/procedure/legal-moves.ts";
import { rawTemplate } from "../procedure/fixtures.ts";

const TEXT = "## SO 20 Precedence of motions\nWhen a question is under debate, no motion shall be received except:\n1. to adjourn;\n2. to lay on the table.\n\n## SO 42 Suspension\n(1) Standing orders may be suspended by a majority of all members.\n(2) No suspension lasts beyond the sitting.\n\n## SO 50 Reconsideration\nA vote may be reconsidered on the next day.";
const { clauses } = splitClauses(TEXT);

describe("linkableItems and clauseCoverage", () => {
  it("lists motions, rules, thresholds and sections with their paths", () => {
    const items = linkableItems(parseRulebook(rawTemplate("demo-chamber")));
    expect(items.filter((i) => i.kind === "motion").length).toBe(rawTemplate("demo-chamber").motions.length);
    expect(items.map((i) => i.path)).toEqual(expect.arrayContaining(["motions.0.clause", "rules.0.clause", "voting.quorum.clause", "voting.amendmentThresholdClause", "amendments.clause"]));
  });

  it("lists a rule by its message in words, not its placeholders", () => {
    const items = linkableItems(parseRulebook(rawTemplate("demo-chamber")));
    expect(items.find((i) => i.label.includes("does not take precedence"))!.label).toBe("The motion does not take precedence of the immediately pending question, the immediately pending question.");
    expect(items.filter((i) => /[{}]/.test(i.label))).toEqual([]);
  });

  it("with no links every clause is uncited and every motion and rule cites nothing", () => {
    const rb = parseRulebook(rawTemplate("demo-chamber"));
    const c = clauseCoverage(rb, clauses);
    expect(c.uncitedClauses.length).toBe(clauses.length);
    expect(c.itemsWithoutClause.length).toBe(rb.motions.length + rb.rules.length);
  });

  it("a link covers the clause, the clauses above it and below it; a link to a missing clause is broken", () => {
    let doc = rawTemplate("demo-chamber");
    const suspend = doc.motions.findIndex((m: { id: string }) => m.id === "suspend-rules");
    doc = setClauseLink(doc, `motions.${suspend}.clause`, "so-42");
    doc = setClauseLink(doc, "rules.0.clause", "so-20/2");
    doc = setClauseLink(doc, "voting.quorum.clause", "so-99");
    const rb = parseRulebook(doc);
    const c = clauseCoverage(rb, clauses);
    expect(c.uncitedClauses.map((x) => x.label)).toEqual(["SO 20, paragraph 1", "SO 50"]);
    expect(c.brokenLinks.map((i) => i.path)).toEqual(["voting.quorum.clause"]);
    expect(c.linked.map((i) => [i.path, i.clauseLabel])).toEqual([
      [`motions.${suspend}.clause`, "SO 42"],
      ["rules.0.clause", "SO 20, paragraph 2"],
    ]);
    expect(c.itemsWithoutClause.map((i) => i.path)).not.toContain(`motions.${suspend}.clause`);
    // Clearing a link removes the field.
    expect(parseRulebook(setClauseLink(doc, "rules.0.clause", null)).rules[0]!.clause).toBeUndefined();
  });

  it("a rule's clause travels with its verdict, so a citation can open the clause's text", async () => {
    const doc = rawTemplate("demo-chamber");
    const i = doc.rules.findIndex((r: { id: string }) => r.id === "rank-precedence");
    expect(i).toBeGreaterThanOrEqual(0);
    const rb = parseRulebook(setClauseLink(doc, `rules.${i}.clause`, "so-20"));
    const v = (await legalMoves(rb, { pending: [{ motion: "main" }, { motion: "amend" }] })).find((x) => x.motion === "postpone-indefinitely")!;
    expect(v.reasons.find((r) => r.rule === "rank-precedence")).toMatchObject({ clause: "so-20" });
  });

  it("the rulebook refuses a clause key that is not a key, naming the field", () => {
    const doc = setClauseLink(rawTemplate("demo-chamber"), "motions.0.clause", "Rule XVI cl. 4");
    expect(() => parseRulebook(doc)).toThrow(/motions\.0\.clause/);
  });
});

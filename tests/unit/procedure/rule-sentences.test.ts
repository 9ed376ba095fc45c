// Rules read as sentences: every rule of every shipped template (the folder is read, so templates
// added later are checked too) renders as words from the one description of the facts, never as
// raw JSON, and names no undescribed fact. The product's own contract (common practice, no source);
// the expected sentences paraphrase the templates' rules, whose sources are cited on each rule.
import { readdirSync, readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { describeField, describeOperator, factDescriptions, undescribedFacts } from "../../../src/lib/procedure/fact-descriptions.ts";
import { parseRulebook } from "../../../src/lib/procedure/parse-rulebook.ts";
import { RULE_SCOPES, SCOPE_FACTS } from "../../../src/lib/procedure/rule-vocabulary.ts";
import { conditionClause, ruleSentence, sentenceContext } from "../../../src/lib/procedure/rule-sentence.ts";

const TEMPLATES = readdirSync("rulebooks")
  .filter((f) => f.endsWith(".json") && !f.endsWith(".scenarios.json"))
  .map((f) => ({ file: f, doc: JSON.parse(readFileSync(`rulebooks/${f}`, "utf8")) as { motions: { id: string; name: string; variants?: { when: unknown }[]; voteAlternatives?: { when?: unknown }[] }[]; rules: { id: string; scope: string; conditions: unknown; severity?: string }[] } }));

describe("the description of the facts", () => {
  it("describes every fact of every scope", () => {
    for (const scope of RULE_SCOPES) expect(undescribedFacts(scope), scope).toEqual([]);
    for (const scope of RULE_SCOPES) for (const f of SCOPE_FACTS[scope]) expect(factDescriptions(scope).some((d) => d.fact === f), f).toBe(true);
  });

  it("reads decorated operators as their negation", () => {
    expect(describeOperator("not:overlaps")).toBe("shares nothing with");
    expect(describeOperator("not:contains")).toBe("does not include");
    expect(describeOperator("ranksNotAbove")).toBe("does not rank above");
    expect(describeOperator("nonsense")).toBeNull();
    expect(describeField("floor", "$.speakerHasFloor")?.yes).toBe("another member has the floor");
    expect(describeField("floor", "$.nonsense")).toBeNull();
  });
});

describe("rule sentences", () => {
  it("finds the shipped templates", () => {
    expect(TEMPLATES.length).toBeGreaterThanOrEqual(3);
  });

  for (const { file, doc } of TEMPLATES) {
    it(`every rule of ${file} reads as a sentence with described facts only`, () => {
      parseRulebook(doc); // a template that does not load is another test's failure, but must not hide here
      const ctx = sentenceContext(doc);
      for (const rule of doc.rules) {
        const s = ruleSentence(rule, ctx);
        expect(s.undescribed, `${file} ${rule.id}: ${s.text}`).toEqual([]);
        expect(s.text, rule.id).not.toMatch(/[{}[\]"]|\$\.|\bfact\b|\boperator\b/);
        expect(s.text, rule.id).toMatch(/^(An? |Any |[A-Z]).* (is out of order|is always out of order|draws (an error|a warning|a note)) ?/);
        // No camelCase JSON names in the words.
        expect(s.text, rule.id).not.toMatch(/\b[a-z]+[A-Z][a-zA-Z]*\b/);
      }
      for (const m of doc.motions) {
        for (const v of m.variants ?? []) expect(conditionClause(v.when, ctx).undescribed, `${file} ${m.id} variant`).toEqual([]);
        for (const a of m.voteAlternatives ?? []) if (a.when) expect(conditionClause(a.when, ctx).undescribed, `${file} ${m.id} alternative`).toEqual([]);
      }
    });
  }

  const ctx = sentenceContext({ motions: [{ id: "amend", name: "Amend" }, { id: "reconsider", name: "Reconsider" }, { id: "lay-on-table", name: "Lay on the table" }] });

  it("names the motion as the subject and reads the rest as the circumstance (RONR 1915 §33, paraphrase)", () => {
    const s = ruleSentence({ scope: "motion", conditions: { all: [{ fact: "motion", path: "$.id", operator: "equal", value: "amend" }, { fact: "amendTarget", path: "$.amendable", operator: "equal", value: false }] } }, ctx);
    expect(s.text).toBe("Amend is out of order when the question an amendment would apply to cannot be amended.");
  });

  it("reads a class as the subject, a rank comparison between two questions, and a negated group as 'unless'", () => {
    const s = ruleSentence(
      {
        scope: "motion",
        conditions: { all: [
          { fact: "motion", path: "$.class", operator: "notEqual", value: "main" },
          { fact: "motion", path: "$.rank", operator: "ranksNotAbove", value: { fact: "immediatelyPending", path: "$.rank" } },
          { not: { all: [{ fact: "motion", path: "$.id", operator: "equal", value: "amend" }, { fact: "amendTarget", path: "$.amendable", operator: "equal", value: true }] } },
        ] },
      },
      ctx,
    );
    expect(s.text).toBe("Any motion other than a main motion is out of order when the motion does not rank above the immediately pending question, unless the motion is Amend and the question an amendment would apply to can be amended.");
  });

  it("reads amendment findings by severity, numbers against limits, and either-or last", () => {
    expect(ruleSentence({ scope: "amendment", severity: "warning", conditions: { all: [{ fact: "amendment", path: "$.sponsorCount", operator: "lessThan", value: { fact: "limits", path: "$.minSponsors" } }] } }, ctx).text).toBe(
      "An amendment draws a warning when the number of the amendment's sponsors is less than the number of sponsors required.",
    );
    expect(
      ruleSentence({ scope: "motion", conditions: { all: [{ any: [{ fact: "immediatelyPending", path: "$.class", operator: "equal", value: "privileged" }, { fact: "immediatelyPending", path: "$.motion", operator: "equal", value: "lay-on-table" }] }, { fact: "floor", path: "$.speakerHasFloor", operator: "equal", value: true }] } }, ctx).text,
    ).toBe("A motion is out of order when another member has the floor and either the class of the immediately pending question is privileged or the immediately pending question is Lay on the table.");
  });

  it("reports what it cannot describe instead of inventing words", () => {
    const s = ruleSentence({ scope: "motion", conditions: { all: [{ fact: "floor", path: "$.moonPhase", operator: "equal", value: "full" }] } }, ctx);
    expect(s.undescribed).toEqual(["floor.moonPhase"]);
  });
});

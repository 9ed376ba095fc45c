import { describe, expect, it } from "vitest";
import { GavelError } from "../../../src/lib/errors.ts";
import { MAX_RULEBOOK_BYTES, parseRulebook, parseRulebookText, parseRulebookWithNotes } from "../../../src/lib/procedure/parse-rulebook.ts";
import { templateIdCandidates } from "../../../src/lib/procedure/template-ids.ts";
import { rawTemplate, TEMPLATE_IDS } from "./fixtures.ts";

function failure(fn: () => unknown): GavelError {
  try {
    fn();
  } catch (e) {
    if (e instanceof GavelError) return e;
    throw e;
  }
  throw new Error("expected a GavelError");
}

const gpl = () => rawTemplate("general-parliamentary-law");

describe("parseRulebook: invalid input", () => {
  it("rejects non-objects", () => {
    for (const v of [null, 42, "x", [], true]) expect(failure(() => parseRulebook(v)).code).toBe("invalid-input");
  });

  it("rejects wrong types with the exact path", () => {
    const rb = gpl();
    rb.motions[3].rank = "high";
    rb.motions[5].debatable = "no";
    const e = failure(() => parseRulebook(rb));
    expect(e.code).toBe("invalid-input");
    expect(e.issues.map((i) => i.path)).toEqual(expect.arrayContaining(["motions.3.rank", "motions.5.debatable"]));
  });

  it("rejects an unknown format or version", () => {
    const rb = gpl();
    rb.formatVersion = 2;
    expect(failure(() => parseRulebook(rb)).issues[0].path).toBe("formatVersion");
  });

  it("rejects a vote threshold outside VOTE_THRESHOLDS", () => {
    const rb = gpl();
    rb.motions[0].vote = "three-quarters";
    expect(failure(() => parseRulebook(rb)).issues[0].path).toBe("motions.0.vote");
  });

  it("rejects an unknown operator, naming the path", () => {
    const rb = gpl();
    rb.rules[0].conditions.all[1].operator = "moreThan";
    const e = failure(() => parseRulebook(rb));
    expect(e.code).toBe("invalid-input");
    expect(e.issues.map((i) => i.path)).toContain("rules.0.conditions.all.1.operator");
  });

  it("rejects an unknown operator decorator but accepts known ones", () => {
    const rb = gpl();
    rb.rules[0].conditions.all[1].operator = "maybe:greaterThan";
    expect(failure(() => parseRulebook(rb)).issues[0].path).toBe("rules.0.conditions.all.1.operator");
    rb.rules[0].conditions.all[1].operator = "not:lessThanInclusive";
    expect(() => parseRulebook(rb)).not.toThrow();
  });

  it("rejects unknown facts, facts of the other scope, and unsafe paths", () => {
    const rb = gpl();
    rb.rules[0].conditions.all[0].fact = "motoin";
    rb.rules[1].conditions.all[1].fact = "tree"; // an amendment-scope fact in a motion-scope rule
    rb.rules[2].conditions.all[1].value.path = "$..[?(@.rank)]";
    const paths = failure(() => parseRulebook(rb)).issues.map((i) => i.path);
    expect(paths).toEqual(expect.arrayContaining(["rules.0.conditions.all.0.fact", "rules.1.conditions.all.1.fact", "rules.2.conditions.all.1.value.path"]));
  });

  it("rejects malformed condition trees", () => {
    const rb = gpl();
    rb.rules[0].conditions = { fact: "pendingCount", operator: "equal", value: 0 };
    rb.rules[1].conditions = { all: [] };
    rb.rules[2].conditions = { all: [{ any: [{ fact: "pendingCount", operator: "equal" }] }], any: [] };
    const paths = failure(() => parseRulebook(rb)).issues.map((i) => i.path);
    expect(paths).toEqual(expect.arrayContaining(["rules.0.conditions", "rules.1.conditions.all", "rules.2.conditions"]));
  });

  it("rejects conditions nested too deep", () => {
    const rb = gpl();
    let node: unknown = { fact: "pendingCount", operator: "equal", value: 0 };
    for (let i = 0; i < 40; i++) node = { not: node };
    rb.rules[0].conditions = node;
    expect(failure(() => parseRulebook(rb)).code).toBe("invalid-input");
  });

  it("rejects duplicate motion ids and duplicate rule ids", () => {
    const rb = gpl();
    rb.motions[4].id = "commit";
    rb.rules[3].id = rb.rules[1].id;
    const e = failure(() => parseRulebook(rb));
    expect(e.code).toBe("invalid-input");
    expect(e.issues.map((i) => i.path)).toEqual(expect.arrayContaining(["motions.4.id", "rules.3.id"]));
  });

  it("rejects rules that name motions missing from the catalogue", () => {
    const rb = gpl();
    rb.rules[1].conditions.all[0].value = ["take-from-table", "annul"];
    expect(failure(() => parseRulebook(rb)).issues[0].path).toBe("rules.1.conditions.all.0.value.1");
  });

  it("rejects amendment-scope rules without code or severity, and motion-scope rules with one", () => {
    const rb = gpl();
    const a = rb.rules.findIndex((r: { scope: string }) => r.scope === "amendment");
    delete rb.rules[a].code;
    rb.rules[0].severity = "error";
    const paths = failure(() => parseRulebook(rb)).issues.map((i) => i.path);
    expect(paths).toEqual(expect.arrayContaining([`rules.${a}.code`, "rules.0.severity"]));
  });

  it("rejects a rank cycle in precedence chains as unprocessable", () => {
    const rb = gpl();
    for (const m of rb.motions) if (["adjourn", "recess", "question-of-privilege"].includes(m.id)) m.rank = null;
    rb.precedence = [["adjourn", "recess", "question-of-privilege"], ["question-of-privilege", "adjourn"]];
    const e = failure(() => parseRulebook(rb));
    expect(e.code).toBe("unprocessable");
    expect(e.issues[0].path).toMatch(/^precedence\.\d+\.\d+$/);
  });

  it("rejects a motion listed above itself, and a motion ranked twice", () => {
    const rb = gpl();
    rb.motions.find((m: { id: string }) => m.id === "adjourn").rank = null;
    rb.precedence = [["adjourn", "adjourn"]];
    expect(failure(() => parseRulebook(rb)).code).toBe("unprocessable");
    const rb2 = gpl();
    rb2.precedence = [["adjourn", "recess"]];
    expect(failure(() => parseRulebook(rb2)).issues.map((i) => i.path)).toContain("motions.11.rank");
  });

  it("rejects 5 MB of junk text as too-large before parsing", () => {
    const junk = "\u0000junk{".repeat(Math.ceil((5 * 1024 * 1024) / 6));
    expect(junk.length).toBeGreaterThan(MAX_RULEBOOK_BYTES);
    expect(failure(() => parseRulebookText(junk)).code).toBe("too-large");
  });

  it("rejects a large junk object quickly with a bounded issue list", () => {
    const junk = { format: "gavelwright.rulebook", motions: Array.from({ length: 50_000 }, (_, i) => ({ id: i, junk: "x".repeat(80) })) };
    const t0 = Date.now();
    const e = failure(() => parseRulebook(junk));
    expect(e.code).toBe("invalid-input");
    expect(e.issues.length).toBeLessThanOrEqual(100);
    expect(Date.now() - t0).toBeLessThan(3000);
  });

  it("rejects text that is not JSON", () => {
    expect(failure(() => parseRulebookText("{ not json")).code).toBe("invalid-input");
  });
});

describe("parseRulebook: precedence chains", () => {
  it("derives ranks from chains so that every stated relation holds", () => {
    const rb = gpl();
    const chain = ["fix-time-to-adjourn", "adjourn", "recess", "question-of-privilege", "orders-of-the-day"];
    for (const m of rb.motions) if (chain.includes(m.id)) m.rank = null;
    rb.precedence = [chain];
    const parsed = parseRulebook(rb);
    const rank = (id: string) => parsed.motions.find((m) => m.id === id)!.rank!;
    for (let i = 1; i < chain.length; i++) expect(rank(chain[i - 1])).toBeGreaterThan(rank(chain[i]));
  });
});

describe("shipped templates", () => {
  for (const id of TEMPLATE_IDS) {
    it(`${id} loads`, () => {
      const rb = parseRulebook(rawTemplate(id));
      // An old id (an alias) may resolve to the template that replaced it.
      expect(templateIdCandidates(id)).toContain(rb.id);
      expect(rb.rules.every((r) => r.citation.length > 0)).toBe(true);
    });
  }

  it("templates use the trade names of the motion catalogue (issue 3 item 6)", () => {
    const names = ["main", "postpone-indefinitely", "amend", "commit", "postpone-definitely", "limit-debate", "previous-question", "lay-on-table", "orders-of-the-day", "question-of-privilege", "recess", "adjourn", "fix-time-to-adjourn", "point-of-order", "appeal", "suspend-rules", "division-of-question", "division-of-assembly", "withdraw", "objection-to-consideration", "reconsider", "rescind", "take-from-table"];
    const ids = rawTemplate("general-parliamentary-law").motions.map((m: { id: string }) => m.id);
    // Beyond the Order of Precedence: filling blanks (RONR 1915 §33 p. 149), nominations (§66 p. 263), closing them (§25 p. 96).
    expect(ids.sort()).toEqual([...names, "fill-blank", "nominate", "close-nominations"].sort());
  });
});

describe("reconsiderable, variants and vote alternatives (rulebook format, December 2026 revision)", () => {
  it("reads a boolean reconsiderable saved by an earlier version as both/neither and reports each change", () => {
    const rb = gpl();
    rb.motions[0].reconsiderable = true;
    rb.motions[7].reconsiderable = false;
    const { rulebook, migrations } = parseRulebookWithNotes(rb);
    expect([rulebook.motions[0].reconsiderable, rulebook.motions[7].reconsiderable]).toEqual(["both", "neither"]);
    expect(migrations.map((m) => [m.path, m.from, m.to])).toEqual([["motions.0.reconsiderable", true, "both"], ["motions.7.reconsiderable", false, "neither"]]);
    expect(parseRulebookWithNotes(gpl()).migrations).toEqual([]);
  });

  it("refuses a reconsiderable outside the four values, at its path", () => {
    const rb = gpl();
    rb.motions[2].reconsiderable = "sometimes";
    expect(failure(() => parseRulebook(rb)).issues.map((i) => i.path)).toContain("motions.2.reconsiderable");
  });

  it("checks variant and alternative conditions like rules, at their exact paths", () => {
    const rb = gpl();
    const recess = rb.motions.findIndex((m: { id: string }) => m.id === "recess");
    rb.motions[recess].variants[0].when = { all: [{ fact: "pendingCuont", operator: "equal", value: 0 }] };
    const rescind = rb.motions.findIndex((m: { id: string }) => m.id === "rescind");
    rb.motions[rescind].voteAlternatives[0].when = { all: [{ fact: "floor", path: "$.noticeGiven", operator: "sameAs", value: true }] };
    const paths = failure(() => parseRulebook(rb)).issues.map((i) => i.path);
    expect(paths).toEqual(expect.arrayContaining([`motions.${recess}.variants.0.when.all.0.fact`, `motions.${rescind}.voteAlternatives.0.when.all.0.operator`]));
  });

  it("refuses a variant that sets nothing or sets an unknown characteristic, and an alternative without its circumstance", () => {
    const rb = gpl();
    rb.motions[0].variants = [{ when: { all: [{ fact: "pendingCount", operator: "equal", value: 0 }] }, set: {}, citation: "x" }];
    rb.motions[1].variants = [{ when: { all: [{ fact: "pendingCount", operator: "equal", value: 0 }] }, set: { colour: "red" }, citation: "x" }];
    rb.motions[2].voteAlternatives = [{ kind: "or", vote: "majority", citation: "x" }];
    const paths = failure(() => parseRulebook(rb)).issues.map((i) => i.path);
    expect(paths).toEqual(expect.arrayContaining(["motions.0.variants.0.set", "motions.1.variants.0.set", "motions.2.voteAlternatives.0.if"]));
  });

  it("motion ids compared with amendTarget or lastVote must be in the catalogue", () => {
    const rb = gpl();
    rb.rules.push({ id: "x", scope: "motion", citation: "x", message: "x", conditions: { all: [{ fact: "lastVote", path: "$.motion", operator: "equal", value: "filibuster" }] } });
    expect(failure(() => parseRulebook(rb)).issues[0].path).toBe(`rules.${rb.rules.length - 1}.conditions.all.0.value`);
  });
});

// Pure core of rulings: the appeal's tie rule, issue readiness, and the circulated e-mail.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { GavelError } from "../../../src/lib/errors.ts";
import { appealOutcome } from "../../../src/lib/rulings/appeal-outcome.ts";
import { issueReadiness, rulingContentSchema } from "../../../src/lib/rulings/ruling-content.ts";
import { renderRulingMail, type RulingForMail } from "../../../src/lib/rulings/render-ruling-mail.ts";
import { floorDigestSchema, renderFloorDigest } from "../../../src/lib/rulings/render-floor-digest.ts";

describe("appealOutcome", () => {
  it("refuses negative or fractional tallies", () => {
    expect(() => appealOutcome({ ayes: -1, noes: 0 })).toThrow(GavelError);
    try {
      appealOutcome({ ayes: 1, noes: 1.5 });
    } catch (e) {
      expect((e as GavelError).code).toBe("invalid-input");
      expect((e as GavelError).issues[0].path).toBe("appeal.noes");
    }
  });

  it("sustains the chair on a tie, including 0–0", () => {
    // Robert's Rules of Order Revised (1915) §21: a tie vote sustains the chair.
    expect(appealOutcome({ ayes: 0, noes: 0 })).toBe("chair-sustained");
    expect(appealOutcome({ ayes: 20, noes: 20 })).toBe("chair-sustained");
  });

  it("reverses the chair only on a majority in the negative", () => {
    // Robert's Rules of Order Revised (1915) §21: the decision stands unless a majority votes against it.
    fc.assert(
      fc.property(fc.nat(500), fc.nat(500), (ayes, noes) => {
        expect(appealOutcome({ ayes, noes })).toBe(noes > ayes ? "chair-overruled" : "chair-sustained");
      }),
      { numRuns: 200 },
    );
  });
});

const base = {
  raisedById: "6f1c2c7e-3b7a-4d8e-9a55-2f1e0b6c9d01",
  target: { kind: "motion", label: "Motion to lay on the table" },
  question: "Is the motion in order?",
};

describe("ruling content", () => {
  it("rejects an impossible date and an unknown decision, path by path", () => {
    const r = rulingContentSchema.safeParse({ ...base, sittingDate: "2026-02-29", decision: "dismissed" });
    expect(r.success).toBe(false);
    expect(r.error!.issues.map((i) => i.path.join(".")).sort()).toEqual(["decision", "sittingDate"]);
  });

  it("lets a draft be incomplete but says what issuing needs", () => {
    const c = rulingContentSchema.parse(base);
    expect(issueReadiness(c).map((i) => i.path)).toEqual(["decision", "reasoning", "sitting", "sittingDate"]);
    const other = rulingContentSchema.parse({ ...base, decision: "other", reasoning: "r", sitting: "s", sittingDate: "2024-02-29" });
    expect(issueReadiness(other).map((i) => i.path)).toEqual(["decisionNote"]);
  });
});

const ruling: RulingForMail = {
  number: 7,
  revision: 2,
  raisedByName: "Cora <Dunmere>",
  targetLabel: "Amendment \"A\" & B",
  measureLabel: null,
  question: "<img src=x onerror=alert(1)>",
  decision: "sustained",
  decisionNote: "",
  reasoning: "First paragraph.\n\nSecond <i>paragraph</i>.",
  citations: [{ kind: "rule", citation: "RONR (1915) §33", ruleId: "amend" }, { kind: "ruling", label: "Ruling 3" }],
  appeal: { ayes: 10, noes: 10, abstentions: 0, appellant: "" },
  sitting: "Fourth sitting",
  sittingDate: "2026-03-18",
};

describe("renderRulingMail", () => {
  it("escapes every piece of user text in the HTML and keeps it verbatim in the text", () => {
    const m = renderRulingMail({ chamberName: "Harrowmere County Assembly", ruling, rulingUrl: "https://gw.example/rulings/1?a=1&b=2", unsubscribeUrl: "https://gw.example/unsubscribe?token=x" });
    expect(m.html).not.toMatch(/<img|<i>|<Dunmere>/);
    expect(m.html).toContain("&lt;img src=x onerror=alert(1)&gt;");
    expect(m.html).toContain("Amendment &quot;A&quot; &amp; B");
    expect(m.html).toContain('href="https://gw.example/rulings/1?a=1&amp;b=2"');
    expect(m.text).toContain("Question: <img src=x onerror=alert(1)>");
    expect(m.subject).toBe('Harrowmere County Assembly: Ruling 7 (revision 2) — Amendment "A" & B');
  });

  it("states the appeal result with the tie rule, and the citations", () => {
    // Robert's Rules of Order Revised (1915) §21: a tie sustains the chair.
    const m = renderRulingMail({ chamberName: "H", ruling, rulingUrl: "u", unsubscribeUrl: null });
    expect(m.text).toContain("10 to sustain, 10 against. The decision of the chair stands (a tie sustains the chair).");
    expect(m.text).toContain("- RONR (1915) §33\n");
    expect(m.text).not.toContain("(rule amend)");
    expect(m.text).toContain("- Ruling 3");
    expect(m.text).not.toContain("unsubscribe");
  });
});

describe("renderFloorDigest", () => {
  it("refuses a digest without a sitting or with a bad severity", () => {
    const r = floorDigestSchema.safeParse({ date: "2026-01-01", findings: [{ severity: "fatal", message: "x" }] });
    expect(r.success).toBe(false);
    expect(r.error!.issues.map((i) => i.path.join(".")).sort()).toEqual(["findings.0.severity", "sitting"]);
  });

  it("numbers the proposed order and escapes findings", () => {
    const d = floorDigestSchema.parse({ sitting: "S", date: "2026-01-01", findings: [{ severity: "warning", message: "<b>x</b>" }], proposedOrder: [{ label: "A2" }, { label: "A1" }] });
    const m = renderFloorDigest({ chamberName: "H", digest: d, unsubscribeUrl: null });
    expect(m.text).toContain("1. A2\n2. A1");
    // The date reads as the house's one date format (src/lib/text/dates.ts), never 01/01/2026.
    expect(m.subject).toBe("H: floor-day digest — S, 1 January 2026");
    expect(m.html).toContain("&lt;b&gt;x&lt;/b&gt;");
    expect(m.html).not.toContain("<b>x");
  });
});

/**
 * The scenario runner (src/lib/procedure/scenarios.ts): a scenario passes exactly when the rulebook
 * gives the expected verdict; a failure names the expectation, what was expected and what came back;
 * two runs of one bench say which scenarios changed verdict. Examples from Robert's Rules of Order
 * Revised (1915), §33 p. 134 ("To Amend takes precedence of the motion to postpone indefinitely") and
 * §29 (previous question: two-thirds, paraphrase), run against the general-parliamentary-law template.
 */
import { describe, expect, it } from "vitest";
import { GavelError } from "../../../src/lib/errors.ts";
import { parseRulebook } from "../../../src/lib/procedure/parse-rulebook.ts";
import { parseScenarios, runScenario, runScenarios, verdictChanges, type Scenario } from "../../../src/lib/procedure/scenarios.ts";
import { rawTemplate, template } from "./fixtures.ts";

const gpl = template("general-parliamentary-law");
const MAIN = { motion: "main" };

const amendOverPI: Scenario = parseScenarios({
  format: "gavelwright.scenarios",
  formatVersion: 1,
  scenarios: [
    {
      id: "amend-over-pi",
      kind: "floor",
      title: "With postpone indefinitely pending, amend is in order",
      source: "Robert's Rules of Order Revised (1915), §33 p. 134",
      state: { pending: [MAIN, { motion: "postpone-indefinitely" }] },
      expect: { motions: { amend: { inOrder: true, appliesTo: "main" }, "postpone-indefinitely": { inOrder: false, reasons: ["rank-precedence"] } } },
    },
  ],
}).scenarios[0]!;

const file = (scenarios: unknown[]) => ({ format: "gavelwright.scenarios", formatVersion: 1, scenarios });

describe("parseScenarios", () => {
  it("names the field of a bad scenario", () => {
    const bad = file([{ id: "x", kind: "floor", title: "t", source: "s", state: {}, expect: { motions: { amend: { inOrdr: true } } } }]);
    try {
      parseScenarios(bad);
      expect.unreachable();
    } catch (e) {
      expect((e as GavelError).code).toBe("invalid-input");
      expect((e as GavelError).issues[0]!.path).toMatch(/^scenarios\.0\.expect\.motions\.amend/);
    }
  });
  it("refuses a scenario without a source, a duplicate id, and a bad floor state", () => {
    const s = { id: "x", kind: "floor", title: "t", state: {}, expect: { motions: { amend: { inOrder: true } } } };
    expect(() => parseScenarios(file([s]))).toThrow(/scenarios\.0\.source/);
    const ok = { ...s, source: "RONR §33" };
    expect(() => parseScenarios(file([ok, ok]))).toThrow(/scenarios\.1\.id/);
    expect(() => parseScenarios(file([{ ...ok, state: { pending: "main" } }]))).toThrow(/scenarios\.0\.state\.pending/);
  });
});

describe("runScenario", () => {
  it("passes when the rulebook gives the expected verdict, recording what it gave", async () => {
    const r = await runScenario(gpl, amendOverPI);
    expect(r.failures).toEqual([]);
    expect(r.passed).toBe(true);
    expect(r.got["motions.amend.inOrder"]).toBe(true);
  });

  it("fails with expected vs got when the rulebook differs: amend ranked below postpone indefinitely", async () => {
    const raw = rawTemplate("general-parliamentary-law");
    const changed = parseRulebook({ ...raw, rules: raw.rules, motions: raw.motions.map((m: { id: string; rank: number | null }) => (m.id === "postpone-indefinitely" ? { ...m, rank: 100 } : m)) });
    const r = await runScenario(changed, amendOverPI);
    expect(r.passed).toBe(false);
    expect(r.failures).toContainEqual({ path: "motions.amend.inOrder", expected: true, got: false });
  });

  it("a scenario naming a motion the rulebook lacks fails instead of throwing", async () => {
    const s = parseScenarios(file([{ id: "x", kind: "floor", title: "t", source: "s", state: { pending: [{ motion: "cloture" }] }, expect: { motions: { amend: { inOrder: true } } } }])).scenarios[0]!;
    const r = await runScenario(gpl, s);
    expect(r.passed).toBe(false);
    expect(r.error).toMatch(/cloture/);
  });

  it("an amendment-tree scenario checks the finding codes of each named amendment (RONR 1915 §33: no third degree)", async () => {
    const measure = { id: "B", subjects: ["roads"], sections: [{ id: "s1", subjects: ["roads"], lines: 10 }] };
    const a = (id: string, target: string) => ({ id, target, form: "insert", sponsors: ["M"], subjects: ["roads"] });
    const tree = { measure, amendments: [a("A1", "s1"), a("A2", "A1"), a("A3", "A2")] };
    const [pass, fail] = parseScenarios(
      file([
        { id: "p", kind: "amendments", title: "third degree", source: "RONR §33", tree, expect: { findings: { A3: ["degree-exceeded"], A2: [] } } },
        { id: "f", kind: "amendments", title: "wrongly expected", source: "RONR §33", tree, expect: { findings: { A3: [] } } },
      ]),
    ).scenarios;
    expect((await runScenario(gpl, pass!)).passed).toBe(true);
    expect((await runScenario(gpl, fail!)).failures).toEqual([{ path: "findings.A3", expected: [], got: ["degree-exceeded"] }]);
  });
});

describe("verdictChanges", () => {
  it("lists the scenarios whose verdict differs between the version in force and the candidate, and only those", async () => {
    const steady = parseScenarios(file([{ id: "pq", kind: "floor", title: "previous question needs two-thirds", source: "RONR 1915 §29 (paraphrase)", state: { pending: [MAIN] }, expect: { motions: { "previous-question": { vote: "two-thirds" } } } }])).scenarios;
    const bench = [amendOverPI, ...steady];
    const raw = rawTemplate("general-parliamentary-law");
    const candidate = parseRulebook({ ...raw, motions: raw.motions.map((m: { id: string }) => (m.id === "postpone-indefinitely" ? { ...m, rank: 100 } : m)) });
    const before = await runScenarios(gpl, bench);
    const after = await runScenarios(candidate, bench);
    expect([before.passed, after.passed]).toEqual([2, 1]);
    const changes = verdictChanges(before, after);
    expect(changes.map((c) => c.id)).toEqual(["amend-over-pi"]);
    expect(changes[0]!.changes).toContainEqual({ path: "motions.amend.appliesTo", before: "main", after: "postpone-indefinitely" });
    expect(verdictChanges(before, before)).toEqual([]);
  });
});

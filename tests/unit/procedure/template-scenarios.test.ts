/**
 * Every shipped template passes its own bench (rulebooks/<id>.scenarios.json). The scenarios are the
 * worked examples of tests/unit/procedure/templates*.test.ts, each with its source citation; this test
 * runs them through the same runner as the app and `gavelwright rulebook test`.
 */
import { existsSync, readdirSync, readFileSync } from "node:fs";
import { resolve } from "node:path";
import { describe, expect, it } from "vitest";
import { parseScenarios, runScenarios } from "../../../src/lib/procedure/scenarios.ts";
import { templateIdOfFile } from "../../../src/lib/procedure/template-ids.ts";
import { template, TEMPLATE_IDS } from "./fixtures.ts";

const dir = resolve(import.meta.dirname, "../../../rulebooks");
const bench = (id: string) => parseScenarios(JSON.parse(readFileSync(resolve(dir, `${id}.scenarios.json`), "utf8")));

describe("shipped templates pass their own scenarios", () => {
  it("every template ships a scenarios file, and no scenarios file is taken for a template", () => {
    for (const id of TEMPLATE_IDS) expect(existsSync(resolve(dir, `${id}.scenarios.json`)), id).toBe(true);
    const ids = readdirSync(dir).map(templateIdOfFile).filter((x) => x !== null);
    expect(ids.some((id) => id.includes("scenarios"))).toBe(false);
    expect(ids.sort()).toEqual([...TEMPLATE_IDS].sort());
  });

  for (const id of TEMPLATE_IDS) {
    it(id, async () => {
      const file = bench(id);
      expect(file.rulebook).toBe(id);
      expect(file.scenarios.length).toBeGreaterThanOrEqual(4);
      for (const s of file.scenarios) expect(s.source.length, s.id).toBeGreaterThan(10);
      const run = await runScenarios(template(id), file.scenarios);
      expect(run.results.filter((r) => !r.passed).map((r) => ({ id: r.id, failures: r.failures }))).toEqual([]);
      expect(run.passed).toBe(file.scenarios.length);
    });
  }
});

/**
 * A rulebook's bench of test scenarios ("gavelwright.scenarios", formatVersion 1): each scenario is
 * a floor state (for the legal-moves engine) or an amendment tree (for the tree validator), the
 * verdict the chamber expects, and the source the expectation comes from. Running a bench against
 * a rulebook says which scenarios pass and, for each failure, what was expected and what the rulebook
 * gave. Comparing two runs says which scenarios changed verdict between two versions of a rulebook.
 *
 * Pure: no I/O. Field by field: docs/rulebook-format.md, "Scenarios".
 */
import { z } from "zod";
import { GavelError, parseWith } from "../errors.ts";
import { idSchema, measureSchema, amendmentSchema } from "../amendments/case-schema.ts";
import { validateTree } from "../amendments/validate-tree.ts";
import { floorStateSchema } from "./floor-state-schema.ts";
import { legalMoves, type MotionVerdict } from "./legal-moves.ts";
import { characteristicsShape, type Rulebook } from "./rulebook-schema.ts";

export const SCENARIOS_FORMAT = "gavelwright.scenarios";
export const SCENARIOS_FORMAT_VERSION = 1;
export const MAX_SCENARIOS = 500;

const text = (max: number) => z.string().trim().min(1).max(max);

/** What a floor scenario expects of one motion; only the characteristics stated are checked. */
export const motionExpectationSchema = z
  .object({
    inOrder: z.boolean(),
    /** The ids of the rules that make it out of order, in any order (exactly these). */
    reasons: z.array(z.string().min(1).max(64)).max(50),
    degree: z.number().int().min(1).max(10),
    appliesTo: idSchema.nullable(),
    ...characteristicsShape,
  })
  .partial()
  .strict()
  .refine((o) => Object.keys(o).length > 0, { message: "expect at least one characteristic of the motion" });

export type MotionExpectation = z.output<typeof motionExpectationSchema>;

const base = {
  id: idSchema,
  /** The verdict in the clerk's words: "with postpone indefinitely pending, amend is in order". */
  title: text(500),
  /** Where the expectation comes from: the chamber's rule, a manual's page, a precedent. */
  source: text(1000),
  note: z.string().max(2000).optional(),
};

export const floorScenarioSchema = z.object({
  ...base,
  kind: z.literal("floor"),
  /** The floor state, as `gavelwright moves` reads it: {pending, floor}. */
  state: z.record(z.string(), z.unknown()).default({}),
  expect: z.object({ motions: z.record(idSchema, motionExpectationSchema).refine((o) => Object.keys(o).length > 0, { message: "expect a verdict on at least one motion" }) }).strict(),
});

export const treeScenarioSchema = z.object({
  ...base,
  kind: z.literal("amendments"),
  /** The amendment tree, as `gavelwright check` reads it (without its `rulebook`). */
  tree: z.object({
    measure: measureSchema,
    amendments: z.array(amendmentSchema).max(500),
    asOf: z.iso.datetime({ offset: true }).optional(),
  }),
  /** For each amendment named: exactly these finding codes (any order; [] = no finding). */
  expect: z.object({ findings: z.record(idSchema, z.array(z.string().min(1).max(64)).max(50)).refine((o) => Object.keys(o).length > 0, { message: "expect findings for at least one amendment" }) }).strict(),
});

export const scenarioSchema = z.discriminatedUnion("kind", [floorScenarioSchema, treeScenarioSchema]);
export type Scenario = z.output<typeof scenarioSchema>;

export const scenariosFileSchema = z.object({
  format: z.literal(SCENARIOS_FORMAT),
  formatVersion: z.literal(SCENARIOS_FORMAT_VERSION),
  /** The rulebook the scenarios were written for (its id); informative. */
  rulebook: idSchema.optional(),
  scenarios: z.array(scenarioSchema).max(MAX_SCENARIOS),
});
export type ScenariosFile = z.output<typeof scenariosFileSchema>;

/** Validate a scenarios document (a file or an import); ids must be unique. Throws GavelError("invalid-input"). */
export function parseScenarios(input: unknown): ScenariosFile {
  const file = parseWith(scenariosFileSchema, input, "scenarios");
  const seen = new Map<string, number>();
  file.scenarios.forEach((s, i) => {
    const j = seen.get(s.id);
    if (j !== undefined) throw new GavelError("invalid-input", `scenarios: scenarios.${i}.id: duplicate id "${s.id}" (also scenarios.${j})`, { issues: [{ path: `scenarios.${i}.id`, message: `duplicate scenario id "${s.id}"` }] });
    seen.set(s.id, i);
    if (s.kind === "floor") parseWith(floorStateSchema, s.state, "scenario floor state", `scenarios.${i}.state`);
  });
  return file;
}

/** One check that failed: the path of the expectation, what was expected, what the rulebook gave. */
export interface ScenarioFailure {
  path: string;
  expected: unknown;
  got: unknown;
}

export interface ScenarioResult {
  id: string;
  title: string;
  source: string;
  kind: Scenario["kind"];
  passed: boolean;
  failures: ScenarioFailure[];
  /** The rulebook's verdict on every expectation, keyed by its path ("motions.amend.inOrder"). */
  got: Record<string, unknown>;
  /** Set when the scenario could not be run against this rulebook (a motion it names is not in the catalogue…). */
  error?: string;
}

const sorted = (xs: readonly string[]) => [...xs].sort();
const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

function observeMotion(v: MotionVerdict | undefined, key: keyof MotionExpectation): unknown {
  if (!v) return "(no such motion)";
  if (key === "reasons") return sorted(v.reasons.map((r) => r.rule));
  const value = (v as unknown as Record<string, unknown>)[key];
  return value === undefined ? null : value;
}

/** Run one scenario against a parsed rulebook. Never throws for a scenario the rulebook cannot read: it fails with `error`. */
export async function runScenario(rulebook: Rulebook, s: Scenario): Promise<ScenarioResult> {
  const result: ScenarioResult = { id: s.id, title: s.title, source: s.source, kind: s.kind, passed: false, failures: [], got: {} };
  try {
    if (s.kind === "floor") {
      const verdicts = new Map((await legalMoves(rulebook, s.state)).map((v) => [v.motion, v]));
      for (const [motion, exp] of Object.entries(s.expect.motions)) {
        for (const [key, expected] of Object.entries(exp) as Array<[keyof MotionExpectation, unknown]>) {
          const path = `motions.${motion}.${key}`;
          const got = observeMotion(verdicts.get(motion), key);
          result.got[path] = got;
          const want = key === "reasons" ? sorted(expected as string[]) : expected;
          if (!same(want, got)) result.failures.push({ path, expected: want, got });
        }
      }
    } else {
      const { findings } = await validateTree({ rulebook, ...s.tree });
      for (const [amendment, codes] of Object.entries(s.expect.findings)) {
        const path = `findings.${amendment}`;
        const got = sorted(findings.filter((f) => f.amendment === amendment && !f.overridden).map((f) => f.code));
        result.got[path] = got;
        if (!same(sorted(codes), got)) result.failures.push({ path, expected: sorted(codes), got });
      }
    }
  } catch (e) {
    result.error = e instanceof Error ? e.message : String(e);
    result.failures.push({ path: "(scenario)", expected: "a verdict", got: result.error });
  }
  result.passed = result.failures.length === 0;
  return result;
}

export interface BenchRun {
  passed: number;
  failed: number;
  results: ScenarioResult[];
}

/** Run every scenario of a bench against a rulebook, in order. */
export async function runScenarios(rulebook: Rulebook, scenarios: readonly Scenario[]): Promise<BenchRun> {
  const results: ScenarioResult[] = [];
  for (const s of scenarios) results.push(await runScenario(rulebook, s));
  const passed = results.filter((r) => r.passed).length;
  return { passed, failed: results.length - passed, results };
}

export interface VerdictChange {
  id: string;
  title: string;
  source: string;
  /** Each expectation whose verdict differs: before (the version in force) and after (the candidate). */
  changes: Array<{ path: string; before: unknown; after: unknown }>;
  passedBefore: boolean;
  passedAfter: boolean;
}

/**
 * Scenarios whose verdict differs between two runs of the same bench (the version in force and the
 * candidate): a scenario changes verdict when any expectation's observed value differs, or when it
 * passes in one run and fails in the other. Scenarios present in only one run are left out.
 */
export function verdictChanges(before: BenchRun, after: BenchRun): VerdictChange[] {
  const old = new Map(before.results.map((r) => [r.id, r]));
  const out: VerdictChange[] = [];
  for (const r of after.results) {
    const b = old.get(r.id);
    if (!b) continue;
    const paths = [...new Set([...Object.keys(b.got), ...Object.keys(r.got)])];
    const changes = paths.filter((p) => !same(b.got[p], r.got[p])).map((p) => ({ path: p, before: b.got[p] ?? null, after: r.got[p] ?? null }));
    if (changes.length || b.passed !== r.passed) out.push({ id: r.id, title: r.title, source: r.source, changes, passedBefore: b.passed, passedAfter: r.passed });
  }
  return out;
}

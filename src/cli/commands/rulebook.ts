/**
 * `gavelwright rulebook check FILE`: validate a rulebook file and print a short summary.
 * Also exports `readCase` and `loadRulebookRef`, which the `moves` and `check` commands use to read
 * a case file and its `rulebook` member (a path, a template id, or an inline object).
 */
import { existsSync } from "node:fs";
import { dirname, resolve } from "node:path";
import { z } from "zod";
import { GavelError, parseWith } from "../../lib/errors.ts";
import { parseRulebook, parseRulebookWithNotes } from "../../lib/procedure/parse-rulebook.ts";
import type { Rulebook } from "../../lib/procedure/rulebook-schema.ts";
import { SCENARIOS_SUFFIX, templateIdCandidates } from "../../lib/procedure/template-ids.ts";
import { packageRoot, printJson, readJsonFile, type CliIO } from "../io.ts";
import type { Command } from "../main.ts";

/** The shipped templates (rulebooks/*.json at the package root). */
export const TEMPLATE_DIR = resolve(packageRoot(), "rulebooks");

/**
 * The file of a shipped template named by `id`, or null: the current id, or an old id kept as an
 * alias ("four-amendment-legislature" → "us-house"; src/lib/procedure/template-ids.ts).
 */
export function templateFile(id: string): string | null {
  if (!/^[a-z0-9-]+$/.test(id)) return null;
  for (const c of templateIdCandidates(id)) {
    const f = resolve(TEMPLATE_DIR, `${c}.json`);
    if (existsSync(f)) return f;
  }
  return null;
}

/** Prefix the issue paths of a GavelError with the member the value came from ("rulebook.motions.3.rank"). */
function prefixed(e: unknown, prefix: string): unknown {
  if (!(e instanceof GavelError)) return e;
  const issues = e.issues.map((i) => ({ path: i.path === "(root)" || i.path.startsWith("(") ? prefix : `${prefix}.${i.path}`, message: i.message }));
  return new GavelError(e.code, e.message, { issues, details: e.details });
}

/** A case file's `rulebook` member: a path, a template id, or the rulebook object itself. */
export const rulebookRefSchema = z.union([z.string().min(1).max(1000), z.record(z.string(), z.unknown())]);

/** Read a case file named on the command line, check it with `schema`, and load its rulebook. */
export function readCase<S extends z.ZodType<{ rulebook: unknown }>>(file: string | undefined, io: CliIO, schema: S): { raw: z.output<S>; rulebook: Rulebook } {
  const raw = parseWith(schema, readJsonFile(file, io, "case file"), "case file") as z.output<S>;
  const caseDir = !file || file === "-" ? io.cwd : dirname(resolve(io.cwd, file));
  return { raw, rulebook: loadRulebookRef(raw.rulebook, caseDir, io) };
}

/**
 * Resolve a case file's `rulebook`: an inline object; a path relative to the case file;
 * or the id of a shipped template ("general-parliamentary-law"), old ids included.
 */
export function loadRulebookRef(ref: unknown, caseDir: string, io: CliIO): Rulebook {
  if (typeof ref === "string") {
    const asPath = resolve(caseDir, ref);
    const file = existsSync(asPath) ? asPath : templateFile(ref);
    if (!file) throw new GavelError("not-found", `rulebook "${ref}" is neither a file (relative to the case file) nor a template id`, { issues: [{ path: "rulebook", message: "no such file or template" }] });
    const value = readJsonFile(file, io, "rulebook file");
    try {
      return parseRulebook(value);
    } catch (e) {
      throw prefixed(e, "rulebook");
    }
  }
  if (ref === undefined) throw new GavelError("invalid-input", "the case has no rulebook", { issues: [{ path: "rulebook", message: "required: a path, a template id or an object" }] });
  try {
    return parseRulebook(ref);
  } catch (e) {
    throw prefixed(e, "rulebook");
  }
}

/**
 * `gavelwright rulebook test RULEBOOK [SCENARIOS]`: run a bench of scenarios against a rulebook (a file or
 * a template id). Without SCENARIOS, a template id runs the bench shipped beside it. Prints which scenarios
 * passed and, for each failure, expected vs got; exit 0 when all pass, 1 when any fails, 2 on bad input.
 */
async function runTest(args: string[], io: CliIO): Promise<number> {
  const [ref, scenariosPath] = args;
  if (!ref) throw new GavelError("invalid-input", "missing rulebook: give a rulebook file or a template id", { issues: [{ path: "(argument)", message: "missing RULEBOOK" }] });
  const rulebook = loadRulebookRef(ref, io.cwd, io);
  let benchFile = scenariosPath;
  if (!benchFile) {
    const shipped = templateFile(ref);
    const bench = shipped ? shipped.replace(/\.json$/, SCENARIOS_SUFFIX) : null;
    if (!bench || !existsSync(bench)) throw new GavelError("invalid-input", "missing scenarios file: give the path of a scenarios JSON file", { issues: [{ path: "(argument)", message: "missing SCENARIOS" }] });
    benchFile = bench;
  }
  const { parseScenarios, runScenarios } = await import("../../lib/procedure/scenarios.ts");
  const bench = parseScenarios(readJsonFile(benchFile, io, "scenarios file"));
  const run = await runScenarios(rulebook, bench.scenarios);
  printJson(io, {
    rulebook: { id: rulebook.id, title: rulebook.title },
    total: run.results.length,
    passedCount: run.passed,
    failedCount: run.failed,
    passed: run.results.filter((r) => r.passed).map((r) => r.id),
    failed: run.results
      .filter((r) => !r.passed)
      .map((r) => ({ id: r.id, title: r.title, source: r.source, failures: r.failures, ...(r.error ? { error: r.error } : {}) })),
  });
  return run.failed > 0 ? 1 : 0;
}

export default {
  async run(args, io) {
    const [sub, file] = args;
    if (sub === "test") return runTest(args.slice(1), io);
    if (sub !== "check") throw new GavelError("invalid-input", `unknown subcommand ${JSON.stringify(sub ?? "")}; use "rulebook check FILE" or "rulebook test RULEBOOK SCENARIOS"`, { issues: [{ path: "(argument)", message: "expected \"check\" or \"test\"" }] });
    const { rulebook, migrations } = parseRulebookWithNotes(readJsonFile(file, io, "rulebook file"));
    printJson(io, {
      valid: true,
      id: rulebook.id,
      title: rulebook.title,
      format: rulebook.format,
      formatVersion: rulebook.formatVersion,
      motions: rulebook.motions.length,
      rules: { motion: rulebook.rules.filter((r) => r.scope === "motion").length, amendment: rulebook.rules.filter((r) => r.scope === "amendment").length },
      maxDegree: rulebook.amendments.maxDegree,
      procedure: rulebook.voting.procedure,
      migrations,
    });
    return 0;
  },
} satisfies Command;

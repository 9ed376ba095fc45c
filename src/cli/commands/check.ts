/**
 * `gavelwright check CASE.json`: validate a measure's amendment tree against a rulebook.
 * CASE = {"rulebook": path | template id | object, "measure": {…}, "amendments": […],
 * "asOf"?: ISO time, "overrides"?: […]}; prints {"findings": […]} and exits 0 even with
 * findings (README.md, "Command line"). Malformed input exits 2 naming the path.
 */
import { dirname, resolve } from "node:path";
import { z } from "zod";
import { validateTree } from "../../lib/amendments/validate-tree.ts";
import { parseWith } from "../../lib/errors.ts";
import { printJson, readJsonFile } from "../io.ts";
import type { Command } from "../main.ts";
import { loadRulebookRef } from "./rulebook.ts";

const checkCaseSchema = z.looseObject({
  rulebook: z.union([z.string().min(1).max(1000), z.record(z.string(), z.unknown())]),
  measure: z.unknown(),
  amendments: z.unknown(),
  asOf: z.unknown().optional(),
  overrides: z.unknown().optional(),
});

export default {
  summary: "Validate a measure's amendment tree against a rulebook and list the findings.",
  usage: "check CASE.json",
  async run(args, io) {
    const file = args[0];
    const raw = parseWith(checkCaseSchema, readJsonFile(file, io, "case file"), "case file");
    const caseDir = file === "-" ? io.cwd : dirname(resolve(io.cwd, file));
    const rulebook = loadRulebookRef(raw.rulebook, caseDir, io);
    const { findings } = await validateTree({ rulebook, measure: raw.measure, amendments: raw.amendments, asOf: raw.asOf, overrides: raw.overrides });
    printJson(io, { findings });
    return 0;
  },
} satisfies Command;

/**
 * `gavelwright check CASE.json`: validate a measure's amendment tree against a rulebook.
 * CASE = {"rulebook": path | template id | object, "measure": {…}, "amendments": […],
 * "asOf"?: ISO time, "overrides"?: […]}; prints {"findings": […], "tree": […]} (the tree: each
 * amendment's degree, role and slot as derived) and exits 0 even with findings (README.md,
 * "Command line"). Malformed input exits 2 naming the path.
 */
import { z } from "zod";
import { validateTree } from "../../lib/amendments/validate-tree.ts";
import { printJson } from "../io.ts";
import type { Command } from "../main.ts";
import { readCase, rulebookRefSchema } from "./rulebook.ts";

const checkCaseSchema = z.looseObject({
  rulebook: rulebookRefSchema,
  measure: z.unknown(),
  amendments: z.unknown(),
  asOf: z.unknown().optional(),
  overrides: z.unknown().optional(),
});

export default {
  async run(args, io) {
    const { raw, rulebook } = readCase(args[0], io, checkCaseSchema);
    const { findings, tree } = await validateTree({ rulebook, measure: raw.measure, amendments: raw.amendments, asOf: raw.asOf, overrides: raw.overrides });
    const degrees = tree.amendments.map((id) => {
      const n = tree.nodes[id];
      return { amendment: id, degree: n.degree, role: n.role, slot: n.slot, underSubstitute: n.underSubstitute };
    });
    printJson(io, { findings, tree: degrees });
    return 0;
  },
} satisfies Command;

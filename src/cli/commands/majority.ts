/** `gavelwright majority FILE`: the majority graph of a profile (or given edges/margins) and its sets. */
import { z } from "zod";
import { parseWith } from "../../lib/errors.ts";
import { majorityInputSchema, parsedMajorityGraph } from "../../lib/voting/majority-input.ts";
import { majorityReport } from "../../lib/voting/majority-report.ts";
import { UNCOVERED_VARIANTS } from "../../lib/voting/uncovered-set.ts";
import type { Command } from "../main.ts";
import { printJson, readJsonFile } from "../io.ts";

const schema = majorityInputSchema.extend({ uncovered: z.enum(UNCOVERED_VARIANTS).default("gillies") });

export default {
  async run(args, io) {
    const input = parseWith(schema, readJsonFile(args[0], io), "majority input");
    const { graph } = parsedMajorityGraph(input);
    printJson(io, majorityReport(graph, { uncovered: input.uncovered }));
    return 0;
  },
} satisfies Command;

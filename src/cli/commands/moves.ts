/**
 * `gavelwright moves CASE.json`: which motions are in order for a floor state.
 * CASE = {"rulebook": path | template id | object, "pending": [{"motion", "degree"?}…] (bottom
 * first), "floor"?: {…}}; prints one verdict per catalogue motion (README.md, "Command line").
 */
import { z } from "zod";
import { legalMoves } from "../../lib/procedure/legal-moves.ts";
import { printJson } from "../io.ts";
import type { Command } from "../main.ts";
import { readCase, rulebookRefSchema } from "./rulebook.ts";

const movesCaseSchema = z.looseObject({
  rulebook: rulebookRefSchema,
  pending: z.array(z.unknown()).max(100).default([]),
  floor: z.record(z.string(), z.unknown()).optional(),
});

export default {
  async run(args, io) {
    const { raw, rulebook } = readCase(args[0], io, movesCaseSchema);
    printJson(io, await legalMoves(rulebook, { pending: raw.pending, floor: raw.floor }));
    return 0;
  },
} satisfies Command;

/**
 * `gavelwright moves CASE.json`: which motions are in order for a floor state.
 * CASE = {"rulebook": path | template id | object, "pending": [{"motion", "degree"?}…] (bottom
 * first), "floor"?: {…}}; prints one verdict per catalogue motion (README.md, "Command line").
 */
import { dirname, resolve } from "node:path";
import { z } from "zod";
import { parseWith } from "../../lib/errors.ts";
import { legalMoves } from "../../lib/procedure/legal-moves.ts";
import { printJson, readJsonFile } from "../io.ts";
import type { Command } from "../main.ts";
import { loadRulebookRef } from "./rulebook.ts";

const movesCaseSchema = z.looseObject({
  rulebook: z.union([z.string().min(1).max(1000), z.record(z.string(), z.unknown())]),
  pending: z.array(z.unknown()).max(100).default([]),
  floor: z.record(z.string(), z.unknown()).optional(),
});

export default {
  summary: "List every motion of the rulebook as in or out of order for a floor state, with reasons.",
  usage: "moves CASE.json",
  async run(args, io) {
    const file = args[0];
    const raw = parseWith(movesCaseSchema, readJsonFile(file, io, "case file"), "case file");
    const caseDir = file === "-" ? io.cwd : dirname(resolve(io.cwd, file));
    const rulebook = loadRulebookRef(raw.rulebook, caseDir, io);
    printJson(io, await legalMoves(rulebook, { pending: raw.pending, floor: raw.floor }));
    return 0;
  },
} satisfies Command;

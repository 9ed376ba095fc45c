/**
 * `gavelwright orders FILE`: the voting orders of an amendment tree under a rulebook's voting section.
 * `rulebook` is an inline object, a path relative to the case file's folder, or a shipped template's
 * id (old ids included); only its `voting` section is read.
 */
import { existsSync } from "node:fs";
import { dirname, resolve } from "node:path";
import { GavelError } from "../../lib/errors.ts";
import { analyseOrders } from "../../lib/voting/analyse-orders.ts";
import type { Command } from "../main.ts";
import { printJson, readJsonFile } from "../io.ts";
import { templateFile } from "./rulebook.ts";

export default {
  async run(args, io) {
    const input = readJsonFile(args[0], io);
    if (input && typeof input === "object" && !Array.isArray(input) && typeof (input as { rulebook?: unknown }).rulebook === "string") {
      const rel = (input as { rulebook: string }).rulebook;
      const base = args[0] === "-" ? io.cwd : dirname(resolve(io.cwd, args[0]!));
      let rulebook: unknown;
      try {
        // A path relative to the case file; failing that, a shipped template's id (old ids included).
        const file = existsSync(resolve(base, rel)) ? resolve(base, rel) : (templateFile(rel) ?? resolve(base, rel));
        rulebook = readJsonFile(file, { ...io, cwd: base }, "rulebook file");
      } catch (e) {
        if (e instanceof GavelError) throw new GavelError(e.code, `rulebook: ${e.message}`, { issues: [{ path: "rulebook", message: e.message }] });
        throw e;
      }
      (input as { rulebook: unknown }).rulebook = rulebook;
    }
    printJson(io, analyseOrders(input));
    return 0;
  },
} satisfies Command;

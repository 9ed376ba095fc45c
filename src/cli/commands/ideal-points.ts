/** `gavelwright ideal-points FILE`: members' ideal points estimated from recorded votes (src/lib/ideal-points/). */
import { estimateIdealPoints } from "../../lib/ideal-points/ideal-points.ts";
import type { Command } from "../main.ts";
import { printJson, readJsonFile } from "../io.ts";

export default {
  async run(args, io) {
    printJson(io, estimateIdealPoints(readJsonFile(args[0], io)));
    return 0;
  },
} satisfies Command;

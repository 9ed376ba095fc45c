/** `gavelwright agendas FILE`: legal voting orders and how many lead to each outcome. */
import { analyseAgendas } from "../../lib/voting/agendas-report.ts";
import type { Command } from "../main.ts";
import { printJson, readJsonFile } from "../io.ts";

export default {
  async run(args, io) {
    printJson(io, analyseAgendas(readJsonFile(args[0], io)));
    return 0;
  },
} satisfies Command;

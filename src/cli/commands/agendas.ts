/** `gavelwright agendas FILE`: legal voting orders and how many lead to each outcome. */
import { analyseAgendas } from "../../lib/voting/agendas-report.ts";
import type { Command } from "../main.ts";
import { printJson, readJsonFile } from "../io.ts";

export default {
  summary: "Count legal voting orders and the orders leading to each sincere/sophisticated outcome",
  usage: "agendas FILE",
  async run(args, io) {
    printJson(io, analyseAgendas(readJsonFile(args[0], io)));
    return 0;
  },
} satisfies Command;

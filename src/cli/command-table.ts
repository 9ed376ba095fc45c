/**
 * The commands of `gavelwright`, with their usage and summary, as one static table: `help` prints
 * from it without loading any command (each command's module is imported only when it runs).
 * A new command is one row here and one file in ./commands/.
 */
export interface CommandInfo {
  usage: string;
  summary: string;
}

export const COMMAND_TABLE = {
  moves: { usage: "moves CASE.json", summary: "List every motion of the rulebook as in or out of order for a floor state, with reasons." },
  rulebook: { usage: "rulebook check FILE | test RULEBOOK SCENARIOS", summary: "Validate a rulebook file (exit 0 with a summary, or 2 with path-precise errors); test: run a bench of scenarios (exit 1 when any fails)." },
  check: { usage: "check CASE.json", summary: "Validate a measure's amendment tree against a rulebook and list the findings." },
  majority: { usage: "majority FILE", summary: "Majority graph, Condorcet winner, top cycle, Schwartz, uncovered and Banks sets" },
  agendas: { usage: "agendas FILE", summary: "Count legal voting orders and the orders leading to each sincere/sophisticated outcome" },
  orders: { usage: "orders FILE", summary: "Alternatives, majority sets, legal voting orders and their outcomes for an amendment tree" },
} satisfies Record<string, CommandInfo>;

export type CommandName = keyof typeof COMMAND_TABLE;

/**
 * `gavelwright` command dispatcher. Each command lives in ./commands/<name>.ts and
 * calls the same framework-free core functions that the API routes and pages use.
 * Exit codes: 0 success, 2 bad input (message names the field), 1 anything else.
 */
import { isGavelError } from "../lib/errors.ts";
import type { CliIO } from "./io.ts";
import { COMMAND_TABLE, type CommandName } from "./command-table.ts";

export interface Command {
  run(args: string[], io: CliIO): Promise<number>;
}

const LOADERS: Record<CommandName, () => Promise<{ default: Command }>> = {
  moves: () => import("./commands/moves.ts"),
  rulebook: () => import("./commands/rulebook.ts"),
  check: () => import("./commands/check.ts"),
  majority: () => import("./commands/majority.ts"),
  agendas: () => import("./commands/agendas.ts"),
  orders: () => import("./commands/orders.ts"),
};

function help(io: CliIO): void {
  const lines = ["usage: gavelwright <command> [arguments]", "", "commands:"];
  for (const { usage, summary } of Object.values(COMMAND_TABLE)) lines.push(`  ${usage.padEnd(34)} ${summary}`);
  lines.push("", "Input and output are JSON; see README.md, section \"Command line\".");
  io.stdout(lines.join("\n") + "\n");
}

const isCommand = (name: string): name is CommandName => Object.hasOwn(COMMAND_TABLE, name);

export async function main(argv: string[], io: CliIO = defaultIO()): Promise<number> {
  const [name, ...rest] = argv;
  if (!name || name === "help" || name === "--help" || name === "-h") {
    help(io);
    return name ? 0 : 2;
  }
  if (!isCommand(name)) {
    io.stderr(`gavelwright: unknown command "${name}". Run "gavelwright help" for the list.\n`);
    return 2;
  }
  try {
    if (rest[0] === "--help" || rest[0] === "-h") {
      const { usage, summary } = COMMAND_TABLE[name];
      io.stdout(`usage: gavelwright ${usage}\n${summary}\n`);
      return 0;
    }
    const cmd = (await LOADERS[name]()).default;
    return await cmd.run(rest, io);
  } catch (e) {
    if (isGavelError(e)) {
      io.stderr(`gavelwright ${name}: ${e.message}\n`);
      for (const i of e.issues.slice(0, 50)) io.stderr(`  at ${i.path}: ${i.message}\n`);
      return e.code === "limit-exceeded" ? 1 : 2;
    }
    io.stderr(`gavelwright ${name}: internal error: ${(e as Error)?.stack ?? String(e)}\n`);
    return 1;
  }
}

export function defaultIO(): CliIO {
  return {
    stdout: (t) => process.stdout.write(t),
    stderr: (t) => process.stderr.write(t),
    cwd: process.cwd(),
  };
}

/** Input and output helpers shared by every CLI command. */
import { existsSync, readFileSync, statSync } from "node:fs";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { GavelError } from "../lib/errors.ts";

export interface CliIO {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
  /** Directory that relative paths in arguments are resolved against. */
  cwd: string;
}

/**
 * The package's root folder (where package.json and rulebooks/ are), found from this module's own
 * location, so the same code works from src/ (through tsx) and from the bundle in dist/.
 */
export function packageRoot(from = dirname(fileURLToPath(import.meta.url))): string {
  for (let dir = from; ; dir = dirname(dir)) {
    if (existsSync(join(dir, "package.json")) && existsSync(join(dir, "rulebooks"))) return dir;
    if (dirname(dir) === dir) throw new Error(`gavelwright: cannot find the package root above ${from}`);
  }
}

export const MAX_INPUT_BYTES = 5 * 1024 * 1024;

/** Read and parse a JSON file named on the command line ("-" reads standard input). */
export function readJsonFile(path: string | undefined, io: CliIO, what = "input file"): unknown {
  if (!path) throw new GavelError("invalid-input", `missing ${what}: give the path of a JSON file`, { issues: [{ path: "(argument)", message: `missing ${what}` }] });
  const full = path === "-" ? "/dev/stdin" : resolve(io.cwd, path);
  let text: string;
  try {
    if (path !== "-") {
      const st = statSync(full);
      if (!st.isFile()) throw new GavelError("invalid-input", `${path} is not a file`);
      if (st.size > MAX_INPUT_BYTES) throw new GavelError("too-large", `${path} is ${st.size} bytes; the limit is ${MAX_INPUT_BYTES}`);
    }
    text = readFileSync(full, "utf8");
  } catch (e) {
    if (e instanceof GavelError) throw e;
    throw new GavelError("invalid-input", `cannot read ${path}: ${(e as Error).message}`, { issues: [{ path: "(file)", message: (e as Error).message }] });
  }
  return parseJsonText(text, path);
}

/** Parse JSON text, reporting line and column of a syntax error. */
export function parseJsonText(text: string, source: string): unknown {
  try {
    return JSON.parse(text);
  } catch (e) {
    const msg = (e as Error).message;
    const m = /position (\d+)/.exec(msg);
    let where = "";
    if (m) {
      const pos = Number(m[1]);
      const before = text.slice(0, pos);
      const line = before.split("\n").length;
      const col = pos - before.lastIndexOf("\n");
      where = ` at line ${line}, column ${col}`;
    }
    throw new GavelError("invalid-input", `${source} is not valid JSON${where}: ${msg}`, { issues: [{ path: "(file)", message: `not valid JSON${where}` }] });
  }
}

/** Stable JSON output: two-space indented, newline-terminated. */
export function printJson(io: CliIO, value: unknown): void {
  io.stdout(JSON.stringify(value, null, 2) + "\n");
}

/** Run the `gavelwright` CLI in-process (main() from src/cli/main.ts) against files in a temp folder. */
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll } from "vitest";
import { main } from "../../src/cli/main.ts";

export interface CliRun {
  code: number;
  out: string;
  err: string;
}

/** A temp folder removed after the test file; `file` writes JSON (or text) into it, `run` calls the CLI there. */
export function cliSandbox(prefix: string) {
  const dir = mkdtempSync(join(tmpdir(), `gw-${prefix}-`));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));
  return {
    dir,
    file(name: string, content: unknown): string {
      const p = join(dir, name);
      writeFileSync(p, typeof content === "string" ? content : JSON.stringify(content));
      return p;
    },
    async run(...argv: string[]): Promise<CliRun> {
      let out = "";
      let err = "";
      const code = await main(argv, { stdout: (t) => void (out += t), stderr: (t) => void (err += t), cwd: dir });
      return { code, out, err };
    },
  };
}

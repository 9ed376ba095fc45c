// The build's bundles (dist/cli, dist/workers) are used only while no source is newer than they are;
// otherwise the CLI remakes its bundle and a worker starts from its TypeScript entry (product
// contract, README "Command line" and DEVELOPERS.md; common practice, no source).
import { mkdirSync, mkdtempSync, rmSync, utimesSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { Worker } from "node:worker_threads";
import { afterAll, describe, expect, it } from "vitest";
import { bundleIsCurrent } from "../../../src/lib/server/bundles.mjs";
import { workerFile } from "../../../src/lib/server/workers.ts";

const root = mkdtempSync(join(tmpdir(), "gw-bundles-"));
afterAll(() => rmSync(root, { recursive: true, force: true }));
const at = (file: string, seconds: number) => utimesSync(file, seconds, seconds);

describe("bundle freshness", () => {
  const source = join(root, "src", "lib", "voting", "a.ts");
  const cli = join(root, "src", "cli", "main.ts");
  const bundle = join(root, "dist", "workers", "analysis.js");
  mkdirSync(join(root, "src", "lib", "voting"), { recursive: true });
  mkdirSync(join(root, "src", "cli"), { recursive: true });
  mkdirSync(join(root, "dist", "workers"), { recursive: true });

  it("is false while the bundle is missing", () => {
    writeFileSync(source, "export {};\n");
    writeFileSync(cli, "export {};\n");
    expect(bundleIsCurrent(bundle, root)).toBe(false);
  });

  it("is true when every source is older than the bundle, false once one is newer", () => {
    writeFileSync(bundle, "// bundle\n");
    at(source, 1_000_000);
    at(cli, 1_000_000);
    at(bundle, 2_000_000);
    expect(bundleIsCurrent(bundle, root)).toBe(true);
    at(source, 3_000_000);
    expect(bundleIsCurrent(bundle, root)).toBe(false);
    at(source, 1_000_000);
    at(cli, 3_000_000);
    expect(bundleIsCurrent(bundle, root)).toBe(false);
  });
});

describe("the worker a server starts", () => {
  it("answers an estimate's bad input with the catalogue's error, from whichever file is current", async () => {
    const file = workerFile("ideal-points");
    expect(file).toMatch(/dist[\\/]workers[\\/]ideal-points\.js$|src[\\/]lib[\\/]server[\\/]ideal-points[\\/]worker\.mjs$/);
    const w = new Worker(file, { workerData: { input: { dimensions: 1, votes: [] }, cancel: new SharedArrayBuffer(4) } });
    const msg = await new Promise<{ type: string; error?: { code: string; message: string } }>((resolve, reject) => {
      w.on("message", (m) => m.type !== "progress" && resolve(m));
      w.on("error", reject);
    });
    await w.terminate();
    expect(msg.type).toBe("error");
    expect(msg.error?.code).toBe("invalid-input");
    expect(msg.error?.message).toMatch(/votes/);
  });
});

// Bundles the `gavelwright` command (src/cli) into dist/cli/ with esbuild, so the command runs on
// plain Node.js with no TypeScript loader at run time. Run by `npm install` (prepare) and by the
// app's build. Each command is its own chunk: `help` loads none of them.
import { rmSync } from "node:fs";
import { join } from "node:path";
import { ROOT } from "./lib/setup.mjs";

let esbuild;
try {
  esbuild = await import("esbuild");
} catch {
  // An install without devDependencies: bin/gavelwright.mjs falls back to running the sources through tsx.
  console.warn("[gavelwright] esbuild is not installed; the CLI will run from its TypeScript sources.");
  process.exit(0);
}

const outdir = join(ROOT, "dist", "cli");
rmSync(outdir, { recursive: true, force: true });
await esbuild.build({
  entryPoints: { gavelwright: join(ROOT, "src", "cli", "main.ts") },
  outdir,
  bundle: true,
  splitting: true,
  format: "esm",
  platform: "node",
  target: "node20",
  packages: "bundle",
  chunkNames: "chunks/[name]-[hash]",
  // Some bundled CommonJS packages call require(); give the ES module one.
  banner: { js: 'import { createRequire as __gwCreateRequire } from "node:module"; const require = __gwCreateRequire(import.meta.url);' },
  logLevel: "warning",
  legalComments: "none",
});

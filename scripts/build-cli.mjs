// Bundles the `gavelwright` command (src/cli) into dist/cli/, and the bodies of the worker threads
// (analyses, ideal points) into dist/workers/, with esbuild, so the command and the workers run on
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

const common = {
  bundle: true,
  format: "esm",
  platform: "node",
  target: "node20",
  packages: "bundle",
  // Some bundled CommonJS packages call require(); give the ES module one.
  banner: { js: 'import { createRequire as __gwCreateRequire } from "node:module"; const require = __gwCreateRequire(import.meta.url);' },
  logLevel: "warning",
  legalComments: "none",
};

const outdir = join(ROOT, "dist", "cli");
rmSync(outdir, { recursive: true, force: true });
await esbuild.build({
  entryPoints: { gavelwright: join(ROOT, "src", "cli", "main.ts") },
  outdir,
  splitting: true,
  chunkNames: "chunks/[name]-[hash]",
  ...common,
});

// One self-contained file per worker (src/lib/server/workers.ts starts it while it is current).
const workers = join(ROOT, "dist", "workers");
rmSync(workers, { recursive: true, force: true });
await esbuild.build({
  entryPoints: {
    analysis: join(ROOT, "src", "lib", "server", "analysis", "analysis-worker.ts"),
    "ideal-points": join(ROOT, "src", "lib", "server", "ideal-points", "ideal-points-worker.ts"),
  },
  outdir: workers,
  ...common,
});

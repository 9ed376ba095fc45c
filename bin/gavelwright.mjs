#!/usr/bin/env node
// Gavelwright command line. Runs the bundle that `npm install` (prepare) and the build write to
// dist/cli/ (plain JavaScript, no TypeScript loader). In a checkout whose sources changed since the
// bundle was made, the bundle is made again first; without esbuild, the sources run through tsx.
import { spawnSync } from "node:child_process";
import { existsSync, readdirSync, statSync } from "node:fs";
import { fileURLToPath } from "node:url";

const root = new URL("..", import.meta.url);
const bundle = new URL("dist/cli/gavelwright.js", root);

/** Newest modification time under a folder of sources (0 when it is absent, as in an installed package). */
function newest(dir) {
  if (!existsSync(dir)) return 0;
  let t = 0;
  for (const e of readdirSync(dir, { withFileTypes: true, recursive: true })) {
    if (e.isFile() && e.name.endsWith(".ts")) t = Math.max(t, statSync(`${e.parentPath}/${e.name}`).mtimeMs);
  }
  return t;
}

function bundleIsCurrent() {
  if (!existsSync(bundle)) return false;
  const built = statSync(bundle).mtimeMs;
  return newest(fileURLToPath(new URL("src/cli", root))) <= built && newest(fileURLToPath(new URL("src/lib", root))) <= built;
}

if (!bundleIsCurrent()) spawnSync(process.execPath, [fileURLToPath(new URL("scripts/build-cli.mjs", root))], { stdio: ["ignore", "ignore", "inherit"] });
let main;
if (existsSync(bundle)) ({ main } = await import(bundle.href));
else {
  const { register } = await import("tsx/esm/api");
  register();
  ({ main } = await import("../src/cli/main.ts"));
}
process.exitCode = await main(process.argv.slice(2));

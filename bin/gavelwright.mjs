#!/usr/bin/env node
// Gavelwright command line. Runs the bundle that `npm install` (prepare) and the build write to
// dist/cli/ (plain JavaScript, no TypeScript loader). In a checkout whose sources changed since the
// bundle was made, the bundle is made again first; without esbuild, the sources run through tsx.
import { spawnSync } from "node:child_process";
import { existsSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { bundleIsCurrent } from "../src/lib/server/bundles.mjs";

const root = new URL("..", import.meta.url);
const bundle = new URL("dist/cli/gavelwright.js", root);

if (!bundleIsCurrent(fileURLToPath(bundle), fileURLToPath(root))) spawnSync(process.execPath, [fileURLToPath(new URL("scripts/build-cli.mjs", root))], { stdio: ["ignore", "ignore", "inherit"] });
let main;
if (existsSync(bundle)) ({ main } = await import(bundle.href));
else {
  const { register } = await import("tsx/esm/api");
  register();
  ({ main } = await import("../src/cli/main.ts"));
}
process.exitCode = await main(process.argv.slice(2));

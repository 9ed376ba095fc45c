#!/usr/bin/env node
// Gavelwright command line. Runs the bundle that `npm install` (prepare) and the build write to
// dist/cli/ (plain JavaScript, no TypeScript loader); a checkout without it runs the sources
// through tsx instead.
import { existsSync } from "node:fs";

const bundle = new URL("../dist/cli/gavelwright.js", import.meta.url);
let main;
if (existsSync(bundle)) ({ main } = await import(bundle.href));
else {
  const { register } = await import("tsx/esm/api");
  register();
  ({ main } = await import("../src/cli/main.ts"));
}
process.exitCode = await main(process.argv.slice(2));

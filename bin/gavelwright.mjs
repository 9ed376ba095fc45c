#!/usr/bin/env node
// Gavelwright command line: runs the TypeScript CLI through tsx (a runtime dependency),
// so it works right after `npm install`, with no build, server or database.
import { register } from "tsx/esm/api";

register();
const { main } = await import("../src/cli/main.ts");
process.exitCode = await main(process.argv.slice(2));

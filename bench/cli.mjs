// Start-up time of the `gavelwright` command (the bundle in dist/cli/, built by `npm install`),
// next to bare Node.js: median of 10 runs each, wall-clock, one after another.
//   node bench/cli.mjs
import { spawnSync } from "node:child_process";
import { existsSync, mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";

const root = fileURLToPath(new URL("..", import.meta.url));
if (!existsSync(join(root, "dist", "cli", "gavelwright.js"))) {
  console.error("dist/cli/ is missing: run `node scripts/build-cli.mjs` (npm install does) first.");
  process.exit(1);
}
const dir = mkdtempSync(join(tmpdir(), "gw-bench-cli-"));
const movesCase = join(dir, "moves.json");
writeFileSync(movesCase, JSON.stringify({ rulebook: "general-parliamentary-law", pending: [{ motion: "main" }, { motion: "amend" }] }));
const bin = join(root, "bin", "gavelwright.mjs");
const RUNS = 10;

function median(args) {
  const times = [];
  for (let i = 0; i < RUNS; i++) {
    const t = process.hrtime.bigint();
    const r = spawnSync(process.execPath, args, { stdio: ["ignore", "ignore", "inherit"] });
    times.push(Number(process.hrtime.bigint() - t) / 1e6);
    if (r.status !== 0) throw new Error(`node ${args.join(" ")} exited ${r.status}`);
  }
  times.sort((a, b) => a - b);
  return (times[RUNS / 2 - 1] + times[RUNS / 2]) / 2;
}

const rows = [
  ["node -e 0", median(["-e", "0"])],
  ["gavelwright help", median([bin, "help"])],
  ["gavelwright moves (general-parliamentary-law)", median([bin, "moves", movesCase])],
];
console.log(`CLI start-up, median of ${RUNS} runs (ms):`);
for (const [what, ms] of rows) console.log(`  ${what.padEnd(48)} ${ms.toFixed(0)}`);

/**
 * Ideal-point benchmark (`npm run bench:ideal`, part of `npm run bench`): seeded synthetic recorded
 * votes (bench/ideal-points-data.ts), estimated in a worker thread exactly as the web app runs them
 * (src/lib/server/workers.ts chooses the file: the bundle dist/workers/ideal-points.js after a build),
 * timed from starting the worker to its result.
 * Targets (issue 19): 100 members × 650 roll calls, 1 dimension, under 2 s; 435 members × 1,000
 * roll calls under 10 s. Each size is timed for the estimate alone (bootstrap 0) and with the default
 * 20 bootstrap replicates for the standard errors; the worker's own start-up is
 * reported on its own row. Median of 3 runs (BENCH_RUNS=n to change). Wall-clock `ms` depends on what
 * else runs on the machine; `cpuMs` is the process's CPU time over the run (the worker's work, plus
 * the garbage collector's threads), a steadier figure on a shared machine.
 * Writes bench/results/ideal-points.json. Not a test.
 */
import { mkdirSync, writeFileSync } from "node:fs";
import { cpus } from "node:os";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { Worker } from "node:worker_threads";
import { workerFile } from "../src/lib/server/workers.ts";
import { syntheticRollCalls } from "./ideal-points-data.ts";

const here = dirname(fileURLToPath(import.meta.url));
process.chdir(join(here, ".."));
const WORKER = workerFile("ideal-points");
process.stderr.write(`worker: ${WORKER.includes("dist") ? "the bundle (dist/workers/ideal-points.js)" : "the TypeScript sources through tsx (no current bundle: run node scripts/build-cli.mjs)"}\n`);

function inWorker(input: unknown): Promise<{ ms: number; cpuMs: number; result: { fit: { classification: number; iterations: number } } }> {
  const started = performance.now();
  const cpu = process.cpuUsage();
  return new Promise((resolve, reject) => {
    const w = new Worker(WORKER, { workerData: { input, cancel: new SharedArrayBuffer(4) } });
    w.on("message", (m: { type: string; result?: unknown; error?: { message: string } }) => {
      if (m.type === "done") {
        const used = process.cpuUsage(cpu);
        resolve({ ms: performance.now() - started, cpuMs: (used.user + used.system) / 1000, result: m.result as never });
        void w.terminate();
      } else if (m.type === "error") {
        reject(new Error(m.error!.message));
        void w.terminate();
      }
    });
    w.on("error", reject);
  });
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const rows: Array<Record<string, unknown>> = [];
const tiny = syntheticRollCalls(5, 30, 1);
const startup: number[] = [];
const RUNS = Number(process.env.BENCH_RUNS ?? 3);
for (let k = 0; k < RUNS; k++) startup.push((await inWorker({ ...tiny, minVotes: 1, bootstrap: 0 })).ms);
rows.push({ case: "worker start-up + 5 × 30", target: "", ms: Math.round(median(startup)) });
for (const [members, votes, target] of [[100, 650, 2000], [435, 1000, 10_000]] as const) {
  const input = syntheticRollCalls(members, votes, 7);
  for (const bootstrap of [0, 20]) {
    const times: number[] = [];
    const cpuTimes: number[] = [];
    let fit = { classification: 0, iterations: 0 };
    for (let k = 0; k < RUNS; k++) {
      const r = await inWorker({ ...input, bootstrap });
      times.push(r.ms);
      cpuTimes.push(r.cpuMs);
      fit = r.result.fit;
    }
    const ms = Math.round(median(times));
    rows.push({ case: `${members} × ${votes}, 1 dimension, bootstrap ${bootstrap}`, target: bootstrap === 0 ? `< ${target / 1000} s` : "", ms, cpuMs: Math.round(median(cpuTimes)), met: bootstrap === 0 ? ms < target : "", iterations: fit.iterations, classification: fit.classification });
  }
}
console.table(rows);
const out = join(here, "results");
mkdirSync(out, { recursive: true });
writeFileSync(join(out, "ideal-points.json"), JSON.stringify({ when: new Date().toISOString(), cpu: cpus()[0]?.model, cores: cpus().length, rows }, null, 2) + "\n");

// The body of an analysis worker thread. The built server starts the bundle of this file
// (dist/workers/analysis.js, made by scripts/build-cli.mjs); a checkout whose sources changed since
// that bundle starts ./worker.mjs, which loads this file through tsx. Cancellation is a shared flag
// the engine polls.
import { parentPort, workerData } from "node:worker_threads";
import { runAnalysisJob } from "./analysis-job.ts";
import { workerError } from "../workers.ts";

const flag = new Int32Array(workerData.cancel as SharedArrayBuffer);
// Tests hold a worker here to have a run in flight (runner.ts holdWorkersForTests); never set in production.
if (workerData.hold) Atomics.wait(new Int32Array(workerData.hold as SharedArrayBuffer), 0, 0);
let last = 0;
const progress = (phase: string, fraction: number) => {
  const now = Date.now();
  if (now - last < 100 && fraction < 1) return;
  last = now;
  parentPort!.postMessage({ type: "progress", phase, fraction });
};
try {
  const result = runAnalysisJob(workerData.input, {
    shouldCancel: () => Atomics.load(flag, 0) === 1,
    onPhase: (phase, fraction) => progress(phase, fraction),
    onListing: (fraction) => progress("listing", fraction),
  });
  parentPort!.postMessage({ type: "done", result });
} catch (e) {
  parentPort!.postMessage({ type: "error", error: workerError(e) });
}

// Worker-thread entry for analyses. Plain .mjs so it starts the same way under vitest and in the
// built server (node .build/<name>/server/entry.mjs, always run from the project root): it registers
// tsx and imports the TypeScript job from src/. Cancellation is a shared flag the engine polls.
import { parentPort, workerData } from "node:worker_threads";
import { register } from "tsx/esm/api";

register();
const { runAnalysisJob } = await import("./analysis-job.ts");
const flag = new Int32Array(workerData.cancel);
// Tests hold a worker here to have a run in flight (runner.ts holdWorkersForTests); never set in production.
if (workerData.hold) Atomics.wait(new Int32Array(workerData.hold), 0, 0);
let last = 0;
const progress = (phase, fraction) => {
  const now = Date.now();
  if (now - last < 100 && fraction < 1) return;
  last = now;
  parentPort.postMessage({ type: "progress", phase, fraction });
};
try {
  const result = runAnalysisJob(workerData.input, {
    shouldCancel: () => Atomics.load(flag, 0) === 1,
    onPhase: (phase, fraction) => progress(phase, fraction),
    onListing: (fraction) => progress("listing", fraction),
  });
  parentPort.postMessage({ type: "done", result });
} catch (e) {
  parentPort.postMessage({ type: "error", error: { code: e?.code ?? "internal", message: String(e?.message ?? e), issues: e?.issues ?? [], cancelled: Boolean(e?.details?.cancelled) } });
}

// The body of an ideal-point worker thread, the same pattern as ../analysis/analysis-worker.ts: the
// built server starts its bundle (dist/workers/ideal-points.js); a checkout whose sources changed
// since starts ./worker.mjs, which loads this file through tsx. Cancellation is a shared flag the
// estimate polls each iteration.
import { parentPort, workerData } from "node:worker_threads";
import { estimateIdealPoints } from "../../ideal-points/ideal-points.ts";
import { workerError } from "../workers.ts";

const flag = new Int32Array(workerData.cancel as SharedArrayBuffer);
let last = 0;
try {
  const result = estimateIdealPoints(workerData.input, {
    shouldCancel: () => Atomics.load(flag, 0) === 1,
    onProgress: (phase, fraction) => {
      const now = Date.now();
      if (now - last < 100 && fraction < 1) return;
      last = now;
      parentPort!.postMessage({ type: "progress", phase, fraction });
    },
  });
  parentPort!.postMessage({ type: "done", result });
} catch (e) {
  parentPort!.postMessage({ type: "error", error: workerError(e) });
}

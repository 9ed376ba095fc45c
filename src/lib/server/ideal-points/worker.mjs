// Worker-thread entry for ideal-point estimates, the same pattern as ../analysis/worker.mjs: plain
// .mjs so it starts under vitest, under tsx (bench) and in the built server; it registers tsx and
// imports the TypeScript core. Cancellation is a shared flag the estimate polls each iteration.
import { parentPort, workerData } from "node:worker_threads";
import { register } from "tsx/esm/api";

register();
const { estimateIdealPoints } = await import("../../ideal-points/ideal-points.ts");
const flag = new Int32Array(workerData.cancel);
let last = 0;
try {
  const result = estimateIdealPoints(workerData.input, {
    shouldCancel: () => Atomics.load(flag, 0) === 1,
    onProgress: (phase, fraction) => {
      const now = Date.now();
      if (now - last < 100 && fraction < 1) return;
      last = now;
      parentPort.postMessage({ type: "progress", phase, fraction });
    },
  });
  parentPort.postMessage({ type: "done", result });
} catch (e) {
  parentPort.postMessage({ type: "error", error: { code: e?.code ?? "internal", message: String(e?.message ?? e), issues: e?.issues ?? [], cancelled: Boolean(e?.details?.cancelled) } });
}

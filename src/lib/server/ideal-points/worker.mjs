// Worker-thread entry for ideal-point estimates when the bundle (dist/workers/ideal-points.js) is
// missing or older than the sources (../workers.ts decides): registers tsx and runs the TypeScript
// body, ideal-points-worker.ts.
import { register } from "tsx/esm/api";

register();
await import("./ideal-points-worker.ts");

// Worker-thread entry for analyses when the bundle (dist/workers/analysis.js) is missing or older than
// the sources (../workers.ts decides): registers tsx and runs the TypeScript body, analysis-worker.ts.
import { register } from "tsx/esm/api";

register();
await import("./analysis-worker.ts");

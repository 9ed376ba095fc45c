/**
 * Where a worker thread's code comes from. The build (scripts/build-cli.mjs, also run by `npm install`)
 * bundles each worker body into dist/workers/<name>.js: plain JavaScript that starts with no
 * TypeScript loader. A checkout whose sources changed since that bundle starts the worker's .mjs
 * entry instead, which loads the TypeScript body through tsx. Paths are taken from the project root,
 * the working directory of the server, the CLI, the tests and the bench.
 */
import path from "node:path";
import { bundleIsCurrent } from "./bundles.mjs";

export type WorkerName = "analysis" | "ideal-points";

const SOURCE_ENTRY: Record<WorkerName, string> = {
  analysis: "src/lib/server/analysis/worker.mjs",
  "ideal-points": "src/lib/server/ideal-points/worker.mjs",
};

const chosen = new Map<WorkerName, string>();

/** The file to start a worker from: the bundle when it is current, otherwise the source entry (checked once per process). */
export function workerFile(name: WorkerName): string {
  let file = chosen.get(name);
  if (!file) {
    const bundle = path.resolve("dist", "workers", `${name}.js`);
    file = bundleIsCurrent(bundle, path.resolve(".")) ? bundle : path.resolve(SOURCE_ENTRY[name]);
    chosen.set(name, file);
  }
  return file;
}

/** An error thrown in a worker, as the message the worker posts back (the catalogue's code, or "internal"). */
export function workerError(e: unknown): { code: string; message: string; issues: unknown[]; cancelled: boolean } {
  const err = e as { code?: string; message?: string; issues?: unknown[]; details?: { cancelled?: boolean } } | undefined;
  return { code: err?.code ?? "internal", message: String(err?.message ?? e), issues: err?.issues ?? [], cancelled: Boolean(err?.details?.cancelled) };
}

/**
 * Runs analyses off the request path, one worker thread each (node:worker_threads), and records
 * them: progress in `analysis_runs`, the finished result in `analysis_cache`. The cache row is
 * written only when the worker reports success and no cancellation was asked for, in the same
 * transaction that marks the run done — a cancelled, failed or crashed run leaves no cache row.
 * Workers live in the process that started the run, which touches the run's heartbeat every
 * HEARTBEAT_MS; any server reports a run whose heartbeat is older than STALE_MS as interrupted
 * (its process went away). A run cancelled from another server (status no longer "running")
 * is stopped here at the next heartbeat.
 */
import path from "node:path";
import { Worker } from "node:worker_threads";
import { and, eq } from "drizzle-orm";
import { db } from "../db.ts";
import { analysisCache, analysisRuns } from "../../db/schema/estimates.ts";

export const WORKER_FILE = path.resolve("src/lib/server/analysis/worker.mjs");
export const MAX_WORKERS = 2;
const PROGRESS_WRITE_MS = 250;
export const HEARTBEAT_MS = 2000;
export const STALE_MS = 8000;

interface Active {
  worker: Worker;
  cancel: Int32Array;
  cancelRequested: boolean;
  done: Promise<void>;
}

const active = new Map<string, Active>();

export function isActive(runId: string): boolean {
  return active.has(runId);
}

export function activeCount(): number {
  return active.size;
}

/** Start a worker for a run row already inserted as "running"; resolves when the run has ended and been recorded. */
export function launchRun(run: { id: string; chamberId: string; hash: string }, input: unknown, extra: Record<string, unknown>): Promise<void> {
  const shared = new SharedArrayBuffer(4);
  const cancel = new Int32Array(shared);
  const started = Date.now();
  const worker = new Worker(WORKER_FILE, { workerData: { input, cancel: shared } });
  let lastWrite = 0;
  let settled = false;
  let resolveDone!: () => void;
  const done = new Promise<void>((r) => (resolveDone = r));
  const entry: Active = { worker, cancel, cancelRequested: false, done };
  active.set(run.id, entry);
  const heartbeat = setInterval(() => {
    db.update(analysisRuns)
      .set({ heartbeatAt: new Date() })
      .where(and(eq(analysisRuns.id, run.id), eq(analysisRuns.status, "running")))
      .returning({ id: analysisRuns.id })
      .then((rows) => {
        if (rows.length === 0 && !settled) void cancelActive(run.id); // cancelled from another server
      })
      .catch(() => {}); // the database is away: the next beat tries again
  }, HEARTBEAT_MS);
  heartbeat.unref();

  const finish = async (status: "failed" | "cancelled", error: Record<string, unknown> | null) => {
    await db.update(analysisRuns).set({ status, error, finishedAt: new Date() }).where(and(eq(analysisRuns.id, run.id), eq(analysisRuns.status, "running")));
  };
  const settle = async (work: () => Promise<void>) => {
    if (settled) return;
    settled = true;
    try {
      await work();
    } catch (e) {
      console.error("[analysis] could not record the end of run", run.id, e);
    } finally {
      clearInterval(heartbeat);
      active.delete(run.id);
      void worker.terminate();
      resolveDone();
    }
  };

  worker.on("message", (msg: { type: string; phase?: string; fraction?: number; result?: unknown; error?: { code: string; message: string; issues: unknown[]; cancelled: boolean } }) => {
    if (msg.type === "progress" && !settled) {
      const now = Date.now();
      if (now - lastWrite < PROGRESS_WRITE_MS) return;
      lastWrite = now;
      void db.update(analysisRuns).set({ phase: msg.phase, progress: msg.fraction ?? 0 }).where(and(eq(analysisRuns.id, run.id), eq(analysisRuns.status, "running"))).catch(() => {});
    } else if (msg.type === "done") {
      void settle(async () => {
        if (entry.cancelRequested) return finish("cancelled", { code: "cancelled", message: "The analysis was cancelled." });
        await db.transaction(async (tx) => {
          // Only a run still "running" (not cancelled meanwhile, here or on another server) is stored.
          const [still] = await tx.update(analysisRuns).set({ status: "done", progress: 1, phase: "done", finishedAt: new Date() }).where(and(eq(analysisRuns.id, run.id), eq(analysisRuns.status, "running"))).returning({ id: analysisRuns.id });
          if (still) await tx.insert(analysisCache).values({ chamberId: run.chamberId, hash: run.hash, result: { ...extra, ...(msg.result as object) }, durationMs: Date.now() - started }).onConflictDoNothing();
        });
      });
    } else if (msg.type === "error") {
      const e = msg.error!;
      void settle(() => (e.cancelled || entry.cancelRequested ? finish("cancelled", { code: "cancelled", message: "The analysis was cancelled." }) : finish("failed", { code: e.code, message: e.message, issues: e.issues })));
    }
  });
  worker.on("error", (e) => void settle(() => finish("failed", { code: "internal", message: `The analysis stopped unexpectedly: ${e.message}` })));
  worker.on("exit", (code) => void settle(() => (entry.cancelRequested ? finish("cancelled", { code: "cancelled", message: "The analysis was cancelled." }) : finish("failed", { code: "internal", message: `The analysis worker exited (code ${code}) without a result.` }))));
  return done;
}

/** Ask a running worker to stop; it is terminated if it does not stop within two seconds. */
export function cancelActive(runId: string): Promise<void> | null {
  const a = active.get(runId);
  if (!a) return null;
  a.cancelRequested = true;
  Atomics.store(a.cancel, 0, 1);
  const t = setTimeout(() => void a.worker.terminate(), 2000);
  return a.done.finally(() => clearTimeout(t));
}

/** Wait for a run to end (tests and the seed use this). */
export function runFinished(runId: string): Promise<void> {
  return active.get(runId)?.done ?? Promise.resolve();
}

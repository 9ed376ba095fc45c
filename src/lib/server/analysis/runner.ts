/**
 * Runs analyses off the request path, one worker thread each (node:worker_threads), and records
 * them: progress in `analysis_runs`, the finished result in `analysis_cache`. The cache row is
 * written only when the worker reports success and a run of its group is still waiting, in the
 * same transaction that marks the runs done — a cancelled, failed or crashed run leaves no cache row.
 *
 * A worker computes for a GROUP: every run of one chamber with the same content hash that is still
 * "running". The first run starts the worker; an identical run asked for while it works joins the
 * group (src/lib/server/services/analysis.ts) instead of starting another. Cancelling one run of a
 * group marks that run only; the worker stops when no run of its group is waiting any more.
 *
 * Budget (src/lib/server/analysis/limits.ts): at most `workers` workers in this process and
 * `chamberShare` of them for one chamber; a worker over its time limit is terminated, and one over
 * its memory limit is stopped by V8 (worker resourceLimits); either way its runs are recorded as
 * failed with `error.stopped = "over-the-limit"`, the limit, and what to narrow.
 *
 * Workers live in the process that started them, which touches the group's heartbeat every
 * HEARTBEAT_MS; any server reports a run whose heartbeat is older than STALE_MS as interrupted
 * (its process went away). A group whose runs were all cancelled from another server is stopped
 * here at the next heartbeat.
 */
import { Worker } from "node:worker_threads";
import { and, eq } from "drizzle-orm";
import { db } from "../db.ts";
import { analysisCache, analysisRuns } from "../../db/schema/estimates.ts";
import { workerFile } from "../workers.ts";
import { analysisLimits, overLimitError, type AnalysisLimits } from "./limits.ts";

/** The default pool size (GAVELWRIGHT_ANALYSIS_WORKERS overrides it). */
export const MAX_WORKERS = 2;
const PROGRESS_WRITE_MS = 250;
export const HEARTBEAT_MS = 2000;
export const STALE_MS = 8000;

interface Active {
  chamberId: string;
  hash: string;
  worker: Worker;
  cancel: Int32Array;
  stopRequested: boolean;
  overLimit: "time" | "memory" | null;
  done: Promise<void>;
}

/** Workers by group key (chamber and content hash). */
const active = new Map<string, Active>();
/** Runs of this process (started or joined here) → their group key. */
const runs = new Map<string, string>();

/** Tests only: workers started while this is set wait on it (Atomics.wait on index 0 while 0) before working. */
let holdGate: SharedArrayBuffer | null = null;
export function holdWorkersForTests(gate: SharedArrayBuffer | null): void {
  holdGate = gate;
}

const groupKey = (chamberId: string, hash: string) => `${chamberId}\u0000${hash}`;
const group = (chamberId: string, hash: string) => and(eq(analysisRuns.chamberId, chamberId), eq(analysisRuns.hash, hash), eq(analysisRuns.status, "running"));

/** A worker is computing this run's result in this process. */
export function isActive(run: { chamberId: string; hash: string }): boolean {
  return active.has(groupKey(run.chamberId, run.hash));
}

/** Slots promised to runs being inserted (between the pool check and launchRun), by chamber. */
const reserved = new Map<string, number>();

/** Workers running (or about to) in this process. */
export function activeCount(): number {
  let n = active.size;
  for (const r of reserved.values()) n += r;
  return n;
}

/** Workers running (or about to) in this process for one chamber. */
export function activeCountFor(chamberId: string): number {
  let n = reserved.get(chamberId) ?? 0;
  for (const a of active.values()) if (a.chamberId === chamberId) n++;
  return n;
}

/**
 * Hold a slot of the pool for a chamber from the moment the pool was checked (synchronously, so
 * two requests cannot both take the last slot) until launchRun starts the worker; call the returned
 * function then, or when the run is not started after all.
 */
export function reserveSlot(chamberId: string): () => void {
  reserved.set(chamberId, (reserved.get(chamberId) ?? 0) + 1);
  let released = false;
  return () => {
    if (released) return;
    released = true;
    const n = (reserved.get(chamberId) ?? 1) - 1;
    if (n > 0) reserved.set(chamberId, n);
    else reserved.delete(chamberId);
  };
}

/** Record that `runId` waits on the group's worker already running here (for runFinished). */
export function joinRun(runId: string, run: { chamberId: string; hash: string }): void {
  if (active.has(groupKey(run.chamberId, run.hash))) runs.set(runId, groupKey(run.chamberId, run.hash));
}

/**
 * Start a worker for a run row already inserted as "running"; resolves when the group has ended and
 * been recorded. `limits` defaults to the environment's (analysisLimits()).
 */
export function launchRun(run: { id: string; chamberId: string; hash: string }, input: unknown, extra: Record<string, unknown>, limits: Pick<AnalysisLimits, "timeMs" | "memoryMb"> = analysisLimits()): Promise<void> {
  const key = groupKey(run.chamberId, run.hash);
  const shared = new SharedArrayBuffer(4);
  const cancel = new Int32Array(shared);
  const started = Date.now();
  const worker = new Worker(workerFile("analysis"), { workerData: { input, cancel: shared, hold: holdGate }, resourceLimits: { maxOldGenerationSizeMb: limits.memoryMb } });
  let lastWrite = 0;
  let settled = false;
  let resolveDone!: () => void;
  const done = new Promise<void>((r) => (resolveDone = r));
  const entry: Active = { chamberId: run.chamberId, hash: run.hash, worker, cancel, stopRequested: false, overLimit: null, done };
  active.set(key, entry);
  runs.set(run.id, key);
  const heartbeat = setInterval(() => {
    db.update(analysisRuns)
      .set({ heartbeatAt: new Date() })
      .where(group(run.chamberId, run.hash))
      .returning({ id: analysisRuns.id })
      .then((rows) => {
        if (rows.length === 0 && !settled) void stopGroup(run.chamberId, run.hash); // every run cancelled (here or on another server)
      })
      .catch(() => {}); // the database is away: the next beat tries again
  }, HEARTBEAT_MS);
  heartbeat.unref();
  const timer = setTimeout(() => {
    if (settled) return;
    entry.overLimit = "time";
    Atomics.store(cancel, 0, 1);
    void worker.terminate();
  }, limits.timeMs);
  timer.unref();

  const cancelled = { code: "cancelled", message: "The analysis was cancelled." };
  const finish = async (status: "failed" | "cancelled", error: Record<string, unknown> | null) => {
    await db.update(analysisRuns).set({ status, error, finishedAt: new Date() }).where(group(run.chamberId, run.hash));
  };
  /** How a run that did not succeed ended: over its limit, cancelled, or failed. */
  const ending = (failure: Record<string, unknown>) => (entry.overLimit ? finish("failed", overLimitError(entry.overLimit, limits)) : entry.stopRequested ? finish("cancelled", cancelled) : finish("failed", failure));
  const settle = async (work: () => Promise<void>) => {
    if (settled) return;
    settled = true;
    try {
      await work();
    } catch (e) {
      console.error("[analysis] could not record the end of run", run.id, e);
    } finally {
      clearInterval(heartbeat);
      clearTimeout(timer);
      active.delete(key);
      for (const [id, k] of runs) if (k === key) runs.delete(id);
      void worker.terminate();
      resolveDone();
    }
  };

  worker.on("message", (msg: { type: string; phase?: string; fraction?: number; result?: unknown; error?: { code: string; message: string; issues: unknown[]; cancelled: boolean } }) => {
    if (msg.type === "progress" && !settled) {
      const now = Date.now();
      if (now - lastWrite < PROGRESS_WRITE_MS) return;
      lastWrite = now;
      void db.update(analysisRuns).set({ phase: msg.phase, progress: msg.fraction ?? 0 }).where(group(run.chamberId, run.hash)).catch(() => {});
    } else if (msg.type === "done") {
      void settle(async () => {
        if (entry.overLimit || entry.stopRequested) return ending({});
        await db.transaction(async (tx) => {
          // Only runs still "running" (not cancelled meanwhile, here or on another server) are answered.
          const still = await tx.update(analysisRuns).set({ status: "done", progress: 1, phase: "done", finishedAt: new Date() }).where(group(run.chamberId, run.hash)).returning({ id: analysisRuns.id });
          if (still.length > 0) await tx.insert(analysisCache).values({ chamberId: run.chamberId, hash: run.hash, result: { ...extra, ...(msg.result as object) }, durationMs: Date.now() - started }).onConflictDoNothing();
        });
      });
    } else if (msg.type === "error") {
      const e = msg.error!;
      void settle(() => (e.cancelled && !entry.overLimit ? finish("cancelled", cancelled) : ending({ code: e.code, message: e.message, issues: e.issues })));
    }
  });
  worker.on("error", (e) => {
    if ((e as { code?: string }).code === "ERR_WORKER_OUT_OF_MEMORY") entry.overLimit ??= "memory";
    void settle(() => ending({ code: "internal", message: `The analysis stopped unexpectedly: ${e.message}` }));
  });
  worker.on("exit", (code) => void settle(() => ending({ code: "internal", message: `The analysis worker exited (code ${code}) without a result.` })));
  return done;
}

/** Stop a group's worker (no run of it is waiting any more); terminated if it does not stop within two seconds. */
export function stopGroup(chamberId: string, hash: string): Promise<void> | null {
  const a = active.get(groupKey(chamberId, hash));
  if (!a) return null;
  a.stopRequested = true;
  Atomics.store(a.cancel, 0, 1);
  const t = setTimeout(() => void a.worker.terminate(), 2000);
  return a.done.finally(() => clearTimeout(t));
}

/** Wait for a run to end (tests and the seed use this). */
export function runFinished(runId: string): Promise<void> {
  const key = runs.get(runId);
  return (key ? active.get(key)?.done : undefined) ?? Promise.resolve();
}

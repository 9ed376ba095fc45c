/**
 * Ideal-point estimates run off the request path, one worker thread each (../workers.ts: the bundle, or ./worker.mjs in a changed checkout), with
 * progress and cancellation as for analyses (../analysis/runner.ts). Unlike an analysis, an
 * estimate of ideal points is a working result, not a record: it lives in this server's memory for
 * JOB_TTL_MS and only becomes a record when its author saves it as a spatial estimate
 * (services/estimates.ts). A job is visible only to the person who started it, in that chamber.
 */
import { randomUUID } from "node:crypto";
import { Worker } from "node:worker_threads";
import { GavelError } from "../../errors.ts";
import { workerFile } from "../workers.ts";
import type { IdealPointsResult } from "../../ideal-points/ideal-points.ts";

export const MAX_IDEAL_JOBS = 2;
export const JOB_TTL_MS = 60 * 60 * 1000;

export interface IdealJobView {
  id: string;
  status: "running" | "done" | "failed" | "cancelled";
  phase: string;
  progress: number;
  result: IdealPointsResult | null;
  error: { code: string; message: string; issues: Array<{ path: string; message: string }> } | null;
}

interface Job extends IdealJobView {
  owner: string;
  chamberId: string;
  worker: Worker | null;
  cancel: Int32Array;
  done: Promise<void>;
  endedAt: number;
}

const jobs = new Map<string, Job>();

function sweep(): void {
  const now = Date.now();
  for (const [id, j] of jobs) if (j.status !== "running" && now - j.endedAt > JOB_TTL_MS) jobs.delete(id);
}

/** Start an estimate in a worker; the input is validated by the core inside the worker (errors come back as the job's error). */
export function startIdealJob(owner: { userId: string; chamberId: string }, input: unknown, file = workerFile("ideal-points")): IdealJobView {
  sweep();
  const running = [...jobs.values()].filter((j) => j.status === "running").length;
  if (running >= MAX_IDEAL_JOBS) throw new GavelError("rate-limited", "Two estimates are already running on this server; wait for one to finish.");
  const shared = new SharedArrayBuffer(4);
  const id = randomUUID();
  let resolveDone!: () => void;
  const job: Job = { id, status: "running", phase: "starting", progress: 0, result: null, error: null, owner: owner.userId, chamberId: owner.chamberId, worker: null, cancel: new Int32Array(shared), done: new Promise((r) => (resolveDone = r)), endedAt: 0 };
  jobs.set(id, job);
  const worker = new Worker(file, { workerData: { input, cancel: shared } });
  job.worker = worker;
  const end = (status: Job["status"], patch: Partial<Job> = {}) => {
    if (job.status !== "running") return;
    Object.assign(job, patch, { status, endedAt: Date.now(), worker: null });
    void worker.terminate();
    resolveDone();
  };
  worker.on("message", (msg: { type: string; phase?: string; fraction?: number; result?: IdealPointsResult; error?: { code: string; message: string; issues: Array<{ path: string; message: string }>; cancelled: boolean } }) => {
    if (msg.type === "progress") {
      job.phase = msg.phase ?? job.phase;
      job.progress = msg.fraction ?? job.progress;
    } else if (msg.type === "done") end("done", { result: msg.result!, progress: 1, phase: "done" });
    else if (msg.type === "error") {
      const e = msg.error!;
      end(e.cancelled ? "cancelled" : "failed", { error: { code: e.cancelled ? "cancelled" : e.code, message: e.cancelled ? "The estimate was cancelled." : e.message, issues: e.issues } });
    }
  });
  worker.on("error", (e) => end("failed", { error: { code: "internal", message: `The estimate stopped unexpectedly: ${e.message}`, issues: [] } }));
  worker.on("exit", (code) => end(Atomics.load(job.cancel, 0) === 1 ? "cancelled" : "failed", { error: { code: "internal", message: `The estimate's worker exited (code ${code}) without a result.`, issues: [] } }));
  return view(job);
}

function view(j: Job): IdealJobView {
  return { id: j.id, status: j.status, phase: j.phase, progress: j.progress, result: j.result, error: j.error };
}

function own(id: string, owner: { userId: string; chamberId: string }): Job {
  const j = jobs.get(id);
  if (!j || j.owner !== owner.userId || j.chamberId !== owner.chamberId) throw new GavelError("not-found", "No such estimate of positions (it may have expired; estimate again).");
  return j;
}

export function idealJob(id: string, owner: { userId: string; chamberId: string }): IdealJobView {
  return view(own(id, owner));
}

/** Ask the worker to stop; it is terminated if it does not stop within two seconds. */
export async function cancelIdealJob(id: string, owner: { userId: string; chamberId: string }): Promise<IdealJobView> {
  const j = own(id, owner);
  if (j.status === "running") {
    Atomics.store(j.cancel, 0, 1);
    const w = j.worker;
    const t = setTimeout(() => void w?.terminate(), 2000);
    await j.done.finally(() => clearTimeout(t));
  }
  return view(j);
}

/** Wait for a job to end (tests and the bench). */
export function idealJobFinished(id: string): Promise<void> {
  return jobs.get(id)?.done ?? Promise.resolve();
}

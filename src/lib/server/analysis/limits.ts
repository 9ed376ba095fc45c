/**
 * The analysis budget, from the environment (documented in README "Analysis limits" and
 * docs/security/limits.md): how many workers one server process runs, how many of them one chamber
 * may hold at a time, and how long and how much memory one run may take. Read on every call, so
 * an operator's change applies at the next start and tests can pass their own.
 */
export interface AnalysisLimits {
  /** Worker threads per server process (GAVELWRIGHT_ANALYSIS_WORKERS, default 2). */
  workers: number;
  /** Of those, at most this many for one chamber at a time (GAVELWRIGHT_ANALYSIS_CHAMBER_SHARE, default half the pool, at least 1). */
  chamberShare: number;
  /** Wall-clock time one run may take, in ms (GAVELWRIGHT_ANALYSIS_TIME_LIMIT seconds, default 120). */
  timeMs: number;
  /** Heap one worker may use, in MB (GAVELWRIGHT_ANALYSIS_MEMORY_MB, default 1024). */
  memoryMb: number;
}

const warned = new Set<string>();

function positive(name: string, fallback: number, env: Record<string, string | undefined>): number {
  const raw = env[name];
  if (raw === undefined || raw.trim() === "") return fallback;
  const n = Number(raw);
  if (!Number.isFinite(n) || n <= 0) {
    if (!warned.has(name)) console.error(`[analysis] ${name} must be a positive number (got "${raw}"); using ${fallback}`);
    warned.add(name);
    return fallback;
  }
  return n;
}

export function analysisLimits(env: Record<string, string | undefined> = process.env): AnalysisLimits {
  const workers = Math.floor(positive("GAVELWRIGHT_ANALYSIS_WORKERS", 2, env));
  const chamberShare = Math.min(workers, Math.floor(positive("GAVELWRIGHT_ANALYSIS_CHAMBER_SHARE", Math.max(1, Math.floor(workers / 2)), env)));
  return {
    workers,
    chamberShare,
    timeMs: Math.round(positive("GAVELWRIGHT_ANALYSIS_TIME_LIMIT", 120, env) * 1000),
    memoryMb: Math.floor(positive("GAVELWRIGHT_ANALYSIS_MEMORY_MB", 1024, env)),
  };
}

/** What the clerk can narrow, said in the message of a run stopped over its limit. */
export const NARROW_ADVICE =
  "Narrow the question and run it again: put fewer amendments in scope (each one doubles the versions compared), merge members into fewer blocs, or analyse one part of the tree at a time.";

export function overLimitError(kind: "time" | "memory", limits: Pick<AnalysisLimits, "timeMs" | "memoryMb">) {
  const limit = kind === "time" ? { kind, value: limits.timeMs / 1000, unit: "s" } : { kind, value: limits.memoryMb, unit: "MB" };
  const what = kind === "time" ? `took longer than the limit of ${limit.value} s per analysis` : `needed more memory than the limit of ${limit.value} MB per analysis`;
  return { code: "limit-exceeded", stopped: "over-the-limit", message: `Stopped: over the limit. The analysis ${what}. ${NARROW_ADVICE}`, limit };
}

/**
 * The one catalogue of domain errors. Every error the core throws is a GavelError
 * with a permanent `code`; API routes map codes to HTTP statuses in one table
 * (src/lib/server/http.ts) and the CLI maps them to exit codes. Tests assert codes,
 * never message wording.
 */
import type { ZodError } from "zod";

export const ERROR_CODES = {
  /** Input is malformed or fails validation; `issues` says where. */
  "invalid-input": "The input is not valid.",
  /** Input parses, but breaks a domain rule (a rank cycle, a self-targeting amendment…). */
  "unprocessable": "The input is well-formed but cannot be processed.",
  /** A referenced thing does not exist (or is not visible to the caller). */
  "not-found": "Not found.",
  /** A write was based on a stale version. */
  conflict: "The record changed since it was read.",
  /** The request would repeat or finalise something and must be sent again with `confirm: true` (`details` says what). */
  "needs-confirmation": "This needs your confirmation first.",
  /** The record is archived: it can be read, not changed. */
  archived: "The record is archived.",
  unauthenticated: "Sign-in required.",
  forbidden: "Not permitted.",
  /** A body or upload is larger than allowed. */
  "too-large": "The input is too large.",
  /** The request asks for more computation than the stated limit. */
  "limit-exceeded": "The request exceeds a stated limit.",
  "rate-limited": "Too many requests.",
  /** A service the request needs (the database, the mail relay) cannot be reached just now. */
  unavailable: "A service is temporarily unavailable.",
} as const;

export type ErrorCode = keyof typeof ERROR_CODES;

/** One problem found in an input: `path` is a JSON-pointer-like dotted path ("motions.3.rank"). */
export interface InputIssue {
  path: string;
  message: string;
}

export class GavelError extends Error {
  override readonly name = "GavelError";
  readonly code: ErrorCode;
  readonly issues: InputIssue[];
  readonly details?: Record<string, unknown>;

  constructor(code: ErrorCode, message?: string, opts: { issues?: InputIssue[]; details?: Record<string, unknown>; cause?: unknown } = {}) {
    super(message ?? ERROR_CODES[code], opts.cause === undefined ? undefined : { cause: opts.cause });
    this.code = code;
    this.issues = opts.issues ?? [];
    this.details = opts.details;
  }

  toJSON() {
    return { error: { code: this.code, message: this.message, issues: this.issues, ...(this.details ? { details: this.details } : {}) } };
  }
}

export function isGavelError(e: unknown): e is GavelError {
  return e instanceof GavelError;
}

/** Format a path array from zod as "a.b.3.c" (empty path → "(root)"). */
export function formatPath(path: readonly PropertyKey[], prefix?: string): string {
  const parts = [...(prefix ? [prefix] : []), ...path.map((p) => String(p))];
  return parts.length ? parts.join(".") : "(root)";
}

/** Turn a ZodError into an invalid-input GavelError with one issue per problem. */
export function fromZodError(err: ZodError, what: string, prefix?: string): GavelError {
  const issues = err.issues.map((i) => ({ path: formatPath(i.path, prefix), message: i.message }));
  const first = issues[0];
  const summary = first ? `${what}: ${first.path}: ${first.message}${issues.length > 1 ? ` (and ${issues.length - 1} more)` : ""}` : `${what} is not valid`;
  return new GavelError("invalid-input", summary, { issues });
}

/** Parse `value` with a zod schema, throwing a GavelError("invalid-input") naming each bad field. */
export function parseWith<T>(schema: { safeParse(v: unknown): { success: true; data: T } | { success: false; error: ZodError } }, value: unknown, what: string, prefix?: string): T {
  const r = schema.safeParse(value);
  if (!r.success) throw fromZodError(r.error, what, prefix);
  return r.data;
}

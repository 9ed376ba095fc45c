/**
 * The zod building blocks every schema that reaches the database is made of, so that PostgreSQL
 * never sees a value it would refuse (a refusal there is a 500; here it is a 400 naming the field):
 * - text: well-formed Unicode (no lone surrogate halves) and no control characters except tab and
 *   newline (LF or CR LF). PostgreSQL refuses NUL in `text` and `\u0000` or a lone surrogate escape
 *   in `jsonb` ("unsupported Unicode escape sequence"); other control characters are accepted by it
 *   but are never meant in a title, a name or a paragraph, and break the CSV and e-mail we write.
 * - integers within the column's range: `int4` is −2^31 … 2^31−1 (PostgreSQL manual, "Numeric Types",
 *   table 8.2); zod's `.int()` alone allows up to 2^53.
 * - dates that exist (no 2026-02-30, no year 0000) within a sane range (MIN_YEAR … MAX_YEAR).
 * Pure; shared by the server, the browser forms and the tests. `stringIssues` walks any parsed JSON
 * value for the same text rule, so readJson and parseQuery refuse a bad string anywhere (even in a
 * field a schema keeps as `unknown`) before the schema runs.
 */
import { z } from "zod";

export const INT4_MIN = -(2 ** 31);
export const INT4_MAX = 2 ** 31 - 1;
export const MIN_YEAR = 1800;
export const MAX_YEAR = 2999;

/** C0 controls except tab (09), LF (0A) and CR (0D), plus DEL (7F). */
const CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/;
/** A CR not followed by LF: only CR LF counts as a newline. */
const LONE_CR = /\r(?!\n)/;

/** What is wrong with a text value, or null when it is fine to store. */
export function textProblem(s: string): string | null {
  if (s.includes("\u0000")) return "must not contain the NUL character (U+0000)";
  if (!s.isWellFormed()) return "must be well-formed Unicode (it contains half of a surrogate pair)";
  const c = CONTROL.exec(s);
  if (c) return `must not contain control characters (found U+${c[0].charCodeAt(0).toString(16).toUpperCase().padStart(4, "0")}); only tab and newline are allowed`;
  if (LONE_CR.test(s)) return "must not contain a carriage return except before a newline";
  return null;
}

/**
 * Text extracted from a document (PDF, DOCX, plain text) made storable rather than refused: line
 * breaks become LF (CR LF, CR, form feed, vertical tab), other control characters are dropped and
 * half surrogate pairs become U+FFFD. The upload is the user's own file; refusing it for a page
 * break would help nobody.
 */
export function storableText(s: string): string {
  return s
    .toWellFormed()
    .replace(/\r\n?|[\f\v]/g, "\n")
    .replace(/[\u0000-\u0008\u000E-\u001F\u007F]/g, "");
}

/** Add the text rule to a string schema (keeps its type). */
export function safe<T extends z.ZodString>(s: T): T {
  return s.superRefine((v, ctx) => {
    const p = textProblem(v);
    if (p) ctx.addIssue({ code: "custom", message: p });
  }) as unknown as T;
}

/** Text of at most `max` characters (multi-line allowed: tab and newline). */
export const text = (max: number) => safe(z.string().max(max));
/** Trimmed text of at most `max` characters. */
export const trimmed = (max: number) => safe(z.string().trim().max(max));
/** Trimmed, non-empty text of at most `max` characters. */
export const required = (max: number, empty = "must not be empty") => safe(z.string().trim().min(1, empty).max(max));

/** An integer a PostgreSQL `integer` (int4) column holds. */
export const int4 = () => z.number().int().min(INT4_MIN, "below the smallest integer stored (−2^31)").max(INT4_MAX, "above the largest integer stored (2^31 − 1)");
/** A record's version or revision number: 1 … 2^31 − 1. */
export const version = () => int4().min(1);
/** A counter from zero: 0 … 2^31 − 1. */
export const count = () => int4().min(0);
/** An integer from a query string ("12"), within int4. */
export const queryInt = () => z.coerce.number().int().min(INT4_MIN).max(INT4_MAX);

function validDay(y: number, m: number, d: number): boolean {
  if (y < MIN_YEAR || y > MAX_YEAR || m < 1 || m > 12 || d < 1) return false;
  const dt = new Date(Date.UTC(y, m - 1, d));
  return dt.getUTCFullYear() === y && dt.getUTCMonth() === m - 1 && dt.getUTCDate() === d;
}

/** What is wrong with a calendar date YYYY-MM-DD, or null. */
export function dateProblem(s: string): string | null {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(s);
  if (!m) return "must be a date YYYY-MM-DD";
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  if (y < MIN_YEAR || y > MAX_YEAR) return `must be a date between ${MIN_YEAR}-01-01 and ${MAX_YEAR}-12-31`;
  if (!validDay(y, mo, d)) return "must be a real calendar date";
  return null;
}

const DATE_TIME = /^(\d{4})-(\d{2})-(\d{2})T([01]\d|2[0-3]):([0-5]\d)(?::([0-5]\d)(?:\.\d{1,9})?)?(Z|[+-](?:[01]\d|2[0-3]):?[0-5]\d)$/;

/** What is wrong with a date and time with an offset (ISO 8601), or null. */
export function dateTimeProblem(s: string): string | null {
  const m = DATE_TIME.exec(s);
  if (!m) return "must be a date and time with an offset, such as 2026-04-02T14:30:00Z";
  if (!validDay(Number(m[1]), Number(m[2]), Number(m[3]))) {
    const y = Number(m[1]);
    return y < MIN_YEAR || y > MAX_YEAR ? `must be between ${MIN_YEAR} and ${MAX_YEAR}` : "must be a real calendar date";
  }
  if (Number.isNaN(Date.parse(s))) return "must be a real date and time";
  return null;
}

/** A calendar date YYYY-MM-DD that exists, between MIN_YEAR and MAX_YEAR. */
export const calendarDate = () =>
  z.string().superRefine((v, ctx) => {
    const p = dateProblem(v);
    if (p) ctx.addIssue({ code: "custom", message: p });
  });

/** A date and time with an offset that exists, between MIN_YEAR and MAX_YEAR. */
export const dateTime = () =>
  z.string().superRefine((v, ctx) => {
    const p = dateTimeProblem(v);
    if (p) ctx.addIssue({ code: "custom", message: p });
  });

/** Either a calendar date or a date and time. */
export const dateOrDateTime = () =>
  z.string().superRefine((v, ctx) => {
    const p = /^\d{4}-\d{2}-\d{2}$/.test(v) ? dateProblem(v) : dateTimeProblem(v);
    if (p) ctx.addIssue({ code: "custom", message: /^\d{4}-\d{2}-\d{2}$/.test(v) || !p.startsWith("must be a date and time") ? p : "must be a date YYYY-MM-DD or a date and time with an offset" });
  });

export interface StringIssue {
  path: string;
  message: string;
}

/**
 * Every string (and object key) in a parsed JSON value that breaks the text rule, with its dotted
 * path. Iterative, so a deeply nested value cannot overflow the stack; stops after `limit` issues.
 */
export function stringIssues(value: unknown, prefix = "", limit = 20): StringIssue[] {
  const out: StringIssue[] = [];
  const stack: Array<[unknown, string]> = [[value, prefix]];
  const at = (base: string, k: string | number) => (base ? `${base}.${k}` : String(k));
  while (stack.length && out.length < limit) {
    const [v, path] = stack.pop()!;
    if (typeof v === "string") {
      const p = textProblem(v);
      if (p) out.push({ path: path || "(root)", message: p });
    } else if (Array.isArray(v)) {
      for (let i = v.length - 1; i >= 0; i--) stack.push([v[i], at(path, i)]);
    } else if (v && typeof v === "object") {
      for (const [k, x] of Object.entries(v)) {
        const p = textProblem(k);
        if (p) out.push({ path: at(path, "(key)"), message: `a field name ${p}` });
        stack.push([x, at(path, k)]);
      }
    }
  }
  return out;
}

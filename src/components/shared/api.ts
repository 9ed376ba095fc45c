/**
 * The islands' one way to call the app's JSON API: every answer is parsed with zod (never cast),
 * and an error body becomes an ApiError carrying the code, the field issues and any details, so
 * every island shows a refusal the same way.
 */
import { z } from "zod";
import { invalidInputWords, issueWords } from "../../lib/text/field-words.ts";

export type Issue = { path: string; message: string };

/** The validator's summary ("ruling: raisedById: must be …"); a message written for people is kept. */
const ZOD_SUMMARY = /^[\w -]+: [\w.()-]+: /;

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly issues: Issue[] = [],
    readonly details: Record<string, unknown> = {},
  ) {
    super(message);
  }
}

/** The error body every route answers with (see src/lib/server/http.ts). */
const errorBody = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    issues: z.array(z.object({ path: z.string(), message: z.string() })).default([]),
    details: z.record(z.string(), z.unknown()).optional(),
  }),
});

export interface ApiInit {
  method?: string;
  /** Sent as JSON. */
  body?: unknown;
  /** Sent as multipart form data (the browser sets the content type). */
  form?: FormData;
  /** Sent as is, with `type` as its content type (default text/csv). */
  raw?: Blob | string;
  type?: string;
}

async function send(url: string, init: ApiInit): Promise<Response> {
  const res = await fetch(url, {
    method: init.method ?? "GET",
    headers: init.raw !== undefined ? { "content-type": init.type ?? "text/csv" } : init.body !== undefined ? { "content-type": "application/json" } : undefined,
    body: init.form ?? init.raw ?? (init.body !== undefined ? JSON.stringify(init.body) : undefined),
  });
  if (res.ok) return res;
  let data: unknown = null;
  try {
    data = await res.json();
  } catch {
    /* no JSON body */
  }
  const e = errorBody.safeParse(data);
  if (e.success) {
    const { code, message, issues, details } = e.data.error;
    // Field paths and validator terms are for the API and the CLI: a person reads the field in words.
    const plain = issues.map((i) => ({ path: i.path, message: issueWords(i.message) }));
    throw new ApiError(res.status, code, code === "invalid-input" && issues.length > 0 && ZOD_SUMMARY.test(message) ? invalidInputWords(issues) : message, plain, details);
  }
  throw new ApiError(res.status, "internal", `The server answered ${res.status}. Nothing was saved.`);
}

/** Call a JSON route; the answer is parsed with `schema`. Throws ApiError for an error answer or an answer of another shape. */
export async function apiCall<S extends z.ZodType>(schema: S, url: string, init: ApiInit = {}): Promise<z.output<S>> {
  const res = await send(url, init);
  let data: unknown = null;
  try {
    data = await res.json();
  } catch {
    /* no JSON body */
  }
  const parsed = schema.safeParse(data);
  if (!parsed.success) throw new ApiError(res.status, "internal", "The server's answer was not in the expected shape. Reload the page.");
  return parsed.data;
}

/** Call a route that answers text (a CSV template, a Markdown script); errors as apiCall. */
export async function apiText(url: string, init: ApiInit = {}): Promise<string> {
  return (await send(url, init)).text();
}

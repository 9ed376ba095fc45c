/**
 * Browser-side calls to the measures API: every response is parsed with zod (never cast), and
 * an error body becomes an ApiError carrying the code, the field issues and any details.
 */
import type { z } from "zod";
import { errorBodySchema } from "../../lib/server/measure-schemas.ts";

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly issues: Array<{ path: string; message: string }> = [],
  ) {
    super(message);
  }
}

export async function apiCall<S extends z.ZodType>(schema: S, url: string, init: { method?: string; body?: unknown; form?: FormData } = {}): Promise<z.output<S>> {
  const res = await fetch(url, {
    method: init.method ?? "GET",
    headers: init.body !== undefined ? { "content-type": "application/json" } : undefined,
    body: init.form ?? (init.body !== undefined ? JSON.stringify(init.body) : undefined),
  });
  let data: unknown = null;
  try {
    data = await res.json();
  } catch {
    /* no JSON body */
  }
  if (!res.ok) {
    const e = errorBodySchema.safeParse(data);
    if (e.success) throw new ApiError(res.status, e.data.error.code, e.data.error.message, e.data.error.issues);
    throw new ApiError(res.status, "internal", `The server answered ${res.status}. Nothing was saved.`);
  }
  const parsed = schema.safeParse(data);
  if (!parsed.success) throw new ApiError(res.status, "internal", "The server's answer was not in the expected shape.");
  return parsed.data;
}

/** Field issues keyed by their first path segment, for showing beside inputs. */
export function issuesByField(e: unknown): Record<string, string> {
  const out: Record<string, string> = {};
  if (e instanceof ApiError) for (const i of e.issues) out[i.path.split(".")[0]] ??= i.message;
  return out;
}

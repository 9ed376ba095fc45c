/**
 * Browser-side calls to the measures API: every response is parsed with zod (never cast), and
 * an error body becomes an ApiError carrying the code, the field issues and any details.
 */
import { z } from "zod";
import { errorBodySchema } from "../../lib/server/measure-schemas.ts";

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly issues: Array<{ path: string; message: string }> = [],
    readonly details: Record<string, unknown> = {},
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
    if (e.success) throw new ApiError(res.status, e.data.error.code, e.data.error.message, e.data.error.issues, e.data.error.details);
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

const changesSchema = z.array(z.object({ version: z.number(), action: z.string(), by: z.string(), at: z.string(), fields: z.array(z.string()) }));

/**
 * A stale write (409) in the clerk's words: who changed it since it was opened, and what.
 * Other errors keep the server's message.
 */
export function conflictText(e: unknown, fallback: string): string {
  if (!(e instanceof ApiError)) return fallback;
  if (e.status !== 409) return e.message;
  const changes = changesSchema.safeParse(e.details.changes);
  if (!changes.success || changes.data.length === 0) return e.message;
  const who = [...new Set(changes.data.map((c) => c.by))].join(" and ");
  const what = changes.data.map((c) => `${c.action}${c.fields.length ? ` (${c.fields.join(", ")})` : ""} at ${new Date(c.at).toLocaleTimeString("en-GB", { hour: "2-digit", minute: "2-digit" })}`).join("; ");
  return `Changed by ${who} since you opened it: ${what}. Your edit was not saved; reload to see their version and make it again.`;
}

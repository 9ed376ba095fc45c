/**
 * Browser-side calls to the estimates and analysis API, every answer parsed with zod (never cast).
 */
import { z } from "zod";

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

const errorBody = z.object({ error: z.object({ code: z.string(), message: z.string(), issues: z.array(z.object({ path: z.string(), message: z.string() })).default([]) }) });

export async function apiCall<S extends z.ZodType>(schema: S, url: string, init: { method?: string; body?: unknown; raw?: Blob | string; type?: string } = {}): Promise<z.output<S>> {
  const res = await fetch(url, {
    method: init.method ?? "GET",
    headers: init.raw !== undefined ? { "content-type": init.type ?? "text/csv" } : init.body !== undefined ? { "content-type": "application/json" } : undefined,
    body: init.raw ?? (init.body !== undefined ? JSON.stringify(init.body) : undefined),
  });
  let data: unknown = null;
  try {
    data = await res.json();
  } catch {
    /* no JSON body */
  }
  if (!res.ok) {
    const e = errorBody.safeParse(data);
    if (e.success) throw new ApiError(res.status, e.data.error.code, e.data.error.message, e.data.error.issues);
    throw new ApiError(res.status, "internal", `The server answered ${res.status}. Nothing was saved.`);
  }
  const parsed = schema.safeParse(data);
  if (!parsed.success) throw new ApiError(res.status, "internal", "The server's answer was not in the expected shape.");
  return parsed.data;
}

const count = z.union([z.number(), z.string()]);
export const versionSchema = z.object({ id: z.string(), short: z.string(), words: z.string() });
export const findingSchema = z.object({ id: z.string(), headline: z.string(), detail: z.string(), caution: z.string() });
export const runSchema = z.object({
  id: z.string(),
  status: z.enum(["running", "done", "failed", "cancelled"]),
  cached: z.boolean(),
  phase: z.string().nullable(),
  progress: z.number(),
  rulebook: z.string(),
  estimateId: z.string().optional(),
  estimateVersion: z.number(),
  error: z.object({ code: z.string(), message: z.string() }).passthrough().nullable(),
});
export const analysisSchema = z.object({
  procedure: z.enum(["amendment", "successive"]),
  threshold: z.string(),
  alternatives: z.array(z.object({ id: z.string(), amendments: z.array(z.string()) })),
  questions: z.array(z.object({ id: z.string(), kind: z.string() })),
  constraints: z.array(z.tuple([z.string(), z.string()])),
  majority: z.object({
    margins: z.record(z.string(), z.record(z.string(), z.number())),
    condorcetWinner: z.string().nullable(),
    topCycle: z.array(z.string()),
    uncoveredSet: z.array(z.string()),
    banksSet: z.array(z.string()),
    banksComplete: z.boolean(),
  }),
  orders: count,
  sincere: z.record(z.string(), count),
  sophisticated: z.record(z.string(), count),
});
export const runResultSchema = z.object({
  run: runSchema,
  versions: z.array(versionSchema).optional(),
  analysis: analysisSchema.optional(),
  listed: z.object({ count: z.number(), complete: z.boolean() }).optional(),
  findings: z.array(findingSchema).optional(),
});
export const ordersPageSchema = z.object({
  total: z.number(),
  complete: z.boolean(),
  page: z.number(),
  pageSize: z.number(),
  orders: z.array(z.object({ rank: z.number(), questions: z.array(z.string()), sincere: z.string(), sophisticated: z.string(), sincereShort: z.string(), sophisticatedShort: z.string() })),
});
const stepSchema = z.object({ question: z.string(), put: z.boolean(), motion: z.string().optional(), base: z.string().optional(), for: z.number().optional(), against: z.number().optional(), withinReach: z.array(z.string()).optional(), adopted: z.boolean().optional(), fallsIfAdopted: z.array(z.string()).optional(), fallsIfRejected: z.array(z.string()).optional() });
export const walkSchema = z.object({
  walk: z.object({ order: z.array(z.string()), totalWeight: z.number(), sincere: z.object({ outcome: z.string(), steps: z.array(stepSchema) }), sophisticated: z.object({ outcome: z.string(), steps: z.array(stepSchema) }) }),
  versions: z.array(versionSchema),
});
export type Versions = z.output<typeof versionSchema>[];
export type Step = z.output<typeof stepSchema>;

export const num = (c: number | string) => (typeof c === "number" ? c : Number(c));

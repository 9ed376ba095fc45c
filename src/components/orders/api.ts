/**
 * The estimates and analysis API's answers, as zod schemas the islands parse with (never cast);
 * the calls themselves go through the shared client in ../shared/api.ts. An analysis is read with
 * the engine's own schema (lib/voting/orders-analysis-schema.ts), the one the cache stores by.
 */
import { z } from "zod";
import { ordersAnalysisSchema } from "../../lib/voting/orders-analysis-schema.ts";

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
  error: z.looseObject({ code: z.string(), message: z.string(), stopped: z.literal("over-the-limit").optional(), limit: z.object({ kind: z.enum(["time", "memory"]), value: z.number(), unit: z.string() }).optional() }).nullable(),
});
export const runResultSchema = z.object({
  run: runSchema,
  versions: z.array(versionSchema).optional(),
  analysis: ordersAnalysisSchema.optional(),
  listed: z.object({ count: z.number(), complete: z.boolean() }).optional(),
  findings: z.array(findingSchema).optional(),
  /** What people read for each amendment key (a draft's key is internal: "Draft", "Draft-1"). */
  labels: z.object({ amendments: z.record(z.string(), z.object({ label: z.string().optional() })) }).optional(),
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

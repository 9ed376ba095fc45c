/**
 * The shape of what an order analysis stores (the engine's OrdersAnalysis without its page, and
 * the listed orders), as a zod schema. The analysis cache key includes a hash of this schema's JSON
 * Schema (`analysisResultJsonSchema`), so a change of shape is a different key and never serves a
 * result stored in the old shape. The type checks below fail the build when the engine's types
 * and this schema part ways: change the schema with the types, and the key changes by itself.
 */
import { z } from "zod";
import type { OrdersAnalysis } from "./analyse-orders.ts";
import { THRESHOLDS } from "./vote-threshold.ts";
import { QUORUM_KINDS } from "../procedure/voting-section.ts";

const count = z.union([z.number(), z.string()]);
const winSet = z.object({
  threshold: z.union([z.enum(THRESHOLDS as [(typeof THRESHOLDS)[number], ...(typeof THRESHOLDS)[number][]]), z.object({ kind: z.literal("number"), value: z.number() })]),
  discs: z.array(z.object({ member: z.number(), center: z.array(z.number()), radiusSquared: z.number(), exact: z.object({ center: z.array(z.string()), radiusSquared: z.string() }) })),
  coalitions: z.array(z.array(z.number())).nullable(),
  intervals: z.array(z.object({ from: z.number(), to: z.number(), exact: z.tuple([z.string(), z.string()]) })).optional(),
});
const core = z.object({
  exists: z.boolean().nullable(),
  interval: z.tuple([z.number(), z.number()]).optional(),
  points: z.array(z.array(z.number())).optional(),
  exact: z.array(z.array(z.string())).optional(),
  reason: z.string().optional(),
});

export const ordersAnalysisSchema = z.object({
  procedure: z.enum(["amendment", "successive"]),
  threshold: z.string(),
  thresholds: z.object({ amendment: z.string(), passage: z.string(), passageFrom: z.string(), members: z.number().nullable(), membersFrom: z.string().nullable() }),
  tieRule: z.string(),
  chairBallot: z.boolean(),
  quorum: z.object({ kind: z.enum(QUORUM_KINDS), required: z.number().nullable(), present: z.number(), met: z.boolean().nullable() }),
  passesAgainstQ: z.record(z.string(), z.boolean()),
  alternatives: z.array(z.object({ id: z.string(), amendments: z.array(z.string()) })),
  questions: z.array(z.object({ id: z.string(), kind: z.enum(["amendment", "passage"]), degree: z.union([z.literal(1), z.literal(2)]).optional(), amends: z.string().optional(), form: z.string().optional(), substituteFor: z.string().optional() })),
  constraints: z.array(z.tuple([z.string(), z.string()])),
  blocks: z.array(z.array(z.string())),
  notBetween: z.array(z.object({ span: z.array(z.string()), excludes: z.array(z.string()) })),
  majority: z.object({
    margins: z.record(z.string(), z.record(z.string(), z.number())),
    condorcetWinner: z.string().nullable(),
    topCycle: z.array(z.string()),
    schwartzSet: z.array(z.string()),
    uncoveredSet: z.array(z.string()),
    banksSet: z.array(z.string()),
    banksComplete: z.boolean(),
  }),
  orders: count,
  sincere: z.record(z.string(), count),
  sophisticated: z.record(z.string(), count),
  spatial: z.object({ positions: z.record(z.string(), z.array(z.number())), exactPositions: z.record(z.string(), z.array(z.string())), statusQuoWinSet: winSet, core }).optional(),
});

export const listedOrderSchema = z.object({ rank: z.number(), questions: z.array(z.string()), sincere: z.string(), sophisticated: z.string() });

/** What one analysis job returns and the cache stores (with the page's labels beside it). */
export const analysisResultSchema = z.object({
  analysis: ordersAnalysisSchema,
  listing: z.object({ orders: z.array(listedOrderSchema), complete: z.boolean() }),
});

/** True only when A and B are the same type (each assignable to the other, exactly). */
export type SameShape<A, B> = (<T>() => T extends A ? 1 : 2) extends <T>() => T extends B ? 1 : 2 ? true : false;
const analysisMatches: SameShape<z.output<typeof ordersAnalysisSchema>, Omit<OrdersAnalysis, "page">> = true;
void analysisMatches;

/** The schema as JSON Schema: the analysis cache key hashes it (src/lib/server/services/analysis.ts), so a different result shape is a different key. */
export const analysisResultJsonSchema = () => z.toJSONSchema(analysisResultSchema);

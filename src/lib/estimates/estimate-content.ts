/**
 * The content of a preference estimate, as saved: either weighted ranked ballots over the versions
 * of a measure (one row per member or per bloc), or a spatial model (policy dimensions, members'
 * weighted ideal points, positions of the status quo and the measure, each amendment's effect).
 * `toOrdersProfile` turns it into the `profile` the voting engine's analyseOrders reads
 * (src/lib/voting/analyse-orders.ts); the engine checks versions and coordinates itself.
 * Spatial members sharing an ideal point are merged (weights added): the majority relation is the
 * same, and the status quo's win set can then be drawn exactly for up to 16 distinct points.
 */
import { z } from "zod";
import { safe } from "../schema-parts.ts";
import { ballotSchema } from "../voting/majority-input.ts";
import { spatialSchema, MAX_DIMENSIONS } from "../voting/spatial-profile.ts";

export const MAX_ROWS = 5000;

const label = safe(z.string().trim().min(1).max(200));
const coord = z.number().min(-1e6).max(1e6);

export const ballotRowSchema = z.object({
  member: label,
  bloc: safe(z.string().trim().max(120)).default(""),
  weight: z.number().int().min(1).max(1000).default(1),
  /** Best first. Empty in a draft row not yet filled in, or in a row marked `unranked`. */
  ranking: ballotSchema.shape.ranking,
  /** Explicitly left out: the row ranks nothing and takes no part in the analysis (src/lib/estimates/draft.ts). */
  unranked: z.boolean().optional(),
  /** The presiding officer's row: its ranking is the chair's preference under the rulebook's tie rule (docs/decisions/0008). */
  chair: z.boolean().optional(),
});
export type BallotRow = z.output<typeof ballotRowSchema>;

export const ballotContentSchema = z.object({
  kind: z.literal("ballots"),
  partial: z.enum(["abstain", "bottom"]).default("abstain"),
  rows: z
    .array(ballotRowSchema)
    .min(1)
    .max(MAX_ROWS)
    .superRefine((rows, ctx) => {
      const chairs = rows.flatMap((r, i) => (r.chair ? [i] : []));
      if (chairs.length > 1) ctx.addIssue({ code: "custom", path: [chairs[1], "chair"], message: `only one row can be the chair's (row ${chairs[0]} already is)` });
      if (chairs.length >= 1 && rows[chairs[0]].weight !== 1) ctx.addIssue({ code: "custom", path: [chairs[0], "weight"], message: "the chair's row has weight 1" });
    }),
});

export const idealRowSchema = z.object({ member: label, bloc: safe(z.string().trim().max(120)).default(""), weight: z.number().int().min(1).max(1000).default(1), ideal: z.array(coord).min(1).max(MAX_DIMENSIONS) });
export type IdealRow = z.output<typeof idealRowSchema>;

export const spatialContentSchema = z.object({
  kind: z.literal("spatial"),
  dimensions: z.array(safe(z.string().trim().min(1).max(80))).min(1).max(MAX_DIMENSIONS),
  /** Optional scale of each dimension, [low, high], for drawing (points may lie outside it). */
  ranges: z.array(z.tuple([coord, coord]).refine(([a, b]) => a < b, "a range is [low, high] with low < high")).max(MAX_DIMENSIONS).optional(),
  statusQuo: z.array(coord),
  measure: z.array(coord),
  /** Amendment key → its effect: a new position, or shifts per dimension (in order of dimensions). */
  effects: z.record(z.string(), z.object({ position: z.array(coord).optional(), shift: z.array(coord).optional() })).default({}),
  members: z.array(idealRowSchema).min(1).max(MAX_ROWS),
  /** Started from the roster: the positions are placeholders until a person saves real ones (src/lib/estimates/draft.ts). */
  draft: z.boolean().optional(),
});

export const estimateContentSchema = z.discriminatedUnion("kind", [ballotContentSchema, spatialContentSchema]);
export type EstimateContent = z.output<typeof estimateContentSchema>;
export type EstimateContentInput = z.input<typeof estimateContentSchema>;

/** Spatial members merged by identical ideal point, with the names behind each merged point. */
export function mergedIdealPoints(rows: readonly IdealRow[]): Array<{ ideal: number[]; weight: number; members: string[]; blocs: string[] }> {
  const byPoint = new Map<string, { ideal: number[]; weight: number; members: string[]; blocs: string[] }>();
  for (const r of rows) {
    const key = r.ideal.join(",");
    const g = byPoint.get(key) ?? { ideal: r.ideal, weight: 0, members: [], blocs: [] };
    g.weight += r.weight;
    g.members.push(r.member);
    if (r.bloc && !g.blocs.includes(r.bloc)) g.blocs.push(r.bloc);
    byPoint.set(key, g);
  }
  return [...byPoint.values()];
}

/** The engine's spatial input for a spatial estimate. */
export function spatialInput(c: Extract<EstimateContent, { kind: "spatial" }>): z.input<typeof spatialSchema> {
  return {
    dimensions: c.dimensions,
    members: mergedIdealPoints(c.members).map((g, i) => ({ id: `p${i}`, ideal: g.ideal, weight: g.weight })),
    statusQuo: c.statusQuo,
    measure: c.measure,
    amendments: Object.fromEntries(
      Object.entries(c.effects).map(([id, e]) => [
        id,
        {
          ...(e.position ? { position: e.position } : {}),
          ...(e.shift ? { shift: Object.fromEntries(e.shift.map((v, i) => [c.dimensions[i] ?? `#${i}`, v]).filter(([, v]) => v !== 0)) } : {}),
        },
      ]),
    ),
  };
}

/** The `profile` member of analyseOrders' input. */
export function toOrdersProfile(c: EstimateContent): { ballots: Array<{ ranking: Array<string | string[]>; weight: number; chair?: boolean }>; partial: "abstain" | "bottom" } | { spatial: z.input<typeof spatialSchema> } {
  // Rows without a ranking (marked unranked) take no part; a draft is refused before it gets here (draft.ts).
  if (c.kind === "ballots") return { ballots: c.rows.filter((r) => r.ranking.length > 0).map((r) => ({ ranking: r.ranking, weight: r.weight, ...(r.chair ? { chair: true } : {}) })), partial: c.partial };
  return { spatial: spatialInput(c) };
}

/**
 * Spatial preferences (DOMAIN §2): policy dimensions, members' ideal points (weighted), positions of
 * the alternatives. A member prefers x to y iff x is strictly nearer its ideal point (Euclidean),
 * compared on squared distances in exact integer arithmetic (exact-decimal.ts); equal distances are
 * indifference. For an amendment tree, versions get positions: Q sits at `statusQuo`, the measure at
 * `measure`, and each adopted amendment, in tree order, applies its effect — `position` (every
 * coordinate), `set` (named dimensions to values) and/or `shift` (named dimensions by deltas),
 * applied in that order. An amendment not listed leaves the position unchanged.
 */
import { z } from "zod";
import { GavelError } from "../errors.ts";
import { idSchema } from "../amendments/case-schema.ts";
import { scaleExactly } from "./exact-decimal.ts";
import type { Profile } from "./profile.ts";

export const MAX_DIMENSIONS = 8;
export const MAX_MEMBERS = 10_000;

const coord = z.number();
const effectSchema = z.object({
  position: z.array(coord).optional(),
  set: z.record(z.string(), coord).optional(),
  shift: z.record(z.string(), coord).optional(),
});

export const spatialSchema = z.object({
  dimensions: z.array(z.string().trim().min(1).max(80)).min(1).max(MAX_DIMENSIONS),
  members: z.array(z.object({ id: z.string().max(200).optional(), ideal: z.array(coord), weight: z.number().int().min(1).max(1_000_000_000).default(1) })).min(1).max(MAX_MEMBERS),
  statusQuo: z.array(coord),
  measure: z.array(coord).optional(),
  amendments: z.record(idSchema, effectSchema).default({}),
});
export type SpatialInput = z.input<typeof spatialSchema>;
export type Spatial = z.output<typeof spatialSchema>;

/** All spatial numbers on one integer scale. */
export interface ScaledSpatial {
  dims: string[];
  scale: number;
  ideals: bigint[][];
  weights: number[];
  totalWeight: number;
  statusQuo: bigint[];
  measure: bigint[] | null;
  effects: Map<string, { position?: bigint[]; set: Array<[number, bigint]>; shift: Array<[number, bigint]> }>;
}

function bad(path: string, message: string): never {
  throw new GavelError("invalid-input", `${path}: ${message}`, { issues: [{ path, message }] });
}

export function scaleSpatial(s: Spatial, path = "spatial"): ScaledSpatial {
  const d = s.dimensions.length;
  const dimIndex = new Map(s.dimensions.map((n, i) => [n, i]));
  if (dimIndex.size !== d) bad(`${path}.dimensions`, "dimension names must be distinct");
  const vec = (v: number[], p: string) => {
    if (v.length !== d) bad(p, `must have ${d} coordinate${d === 1 ? "" : "s"}, one per dimension`);
    return v;
  };
  const numbers: number[] = [];
  const push = (xs: number[]) => {
    const at = numbers.length;
    numbers.push(...xs);
    return at;
  };
  const idealAt = s.members.map((m, i) => push(vec(m.ideal, `${path}.members.${i}.ideal`)));
  const sqAt = push(vec(s.statusQuo, `${path}.statusQuo`));
  const measureAt = s.measure ? push(vec(s.measure, `${path}.measure`)) : -1;
  const effectAt = Object.entries(s.amendments).map(([id, e]) => {
    const dimOf = (name: string, p: string) => dimIndex.get(name) ?? bad(p, `unknown dimension "${name}"`);
    return {
      id,
      position: e.position ? push(vec(e.position, `${path}.amendments.${id}.position`)) : -1,
      set: Object.entries(e.set ?? {}).map(([n, v]) => [dimOf(n, `${path}.amendments.${id}.set.${n}`), push([v])] as const),
      shift: Object.entries(e.shift ?? {}).map(([n, v]) => [dimOf(n, `${path}.amendments.${id}.shift.${n}`), push([v])] as const),
    };
  });
  const { values, scale } = scaleExactly(numbers);
  const slice = (at: number) => values.slice(at, at + d);
  return {
    dims: s.dimensions,
    scale,
    ideals: idealAt.map(slice),
    weights: s.members.map((m) => m.weight),
    totalWeight: s.members.reduce((a, m) => a + m.weight, 0),
    statusQuo: slice(sqAt),
    measure: measureAt >= 0 ? slice(measureAt) : null,
    effects: new Map(
      effectAt.map((e) => [
        e.id,
        { ...(e.position >= 0 ? { position: slice(e.position) } : {}), set: e.set.map(([i, at]) => [i, values[at]] as [number, bigint]), shift: e.shift.map(([i, at]) => [i, values[at]] as [number, bigint]) },
      ]),
    ),
  };
}

/** Position of a version: start at the measure, apply each adopted amendment's effect in tree order. */
export function versionPosition(s: ScaledSpatial, amendmentIds: readonly string[]): bigint[] {
  if (!s.measure) bad("spatial.measure", "the measure's position is required to place its versions");
  const p = [...s.measure];
  for (const id of amendmentIds) {
    const e = s.effects.get(id);
    if (!e) continue;
    if (e.position) e.position.forEach((v, i) => (p[i] = v));
    for (const [i, v] of e.set) p[i] = v;
    for (const [i, v] of e.shift) p[i] += v;
  }
  return p;
}

export function squaredDistance(a: readonly bigint[], b: readonly bigint[]): bigint {
  let s = 0n;
  for (let i = 0; i < a.length; i++) {
    const t = a[i] - b[i];
    s += t * t;
  }
  return s;
}

/** The profile the positions induce: each member's levels rank the alternatives by exact squared distance. */
export function spatialProfile(s: ScaledSpatial, names: string[], positions: readonly bigint[][]): Profile {
  const members = s.ideals.map((v, i) => {
    const d = positions.map((p) => squaredDistance(p, v));
    const distinct = [...new Set(d)].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
    const rank = new Map(distinct.map((x, j) => [x, j]));
    return { weight: s.weights[i], level: Int32Array.from(d, (x) => rank.get(x)!) };
  });
  return { alternatives: names, members, totalWeight: s.totalWeight };
}

/** Weight preferring p to q, q to p, and indifferent. */
export function spatialTally(s: ScaledSpatial, p: readonly bigint[], q: readonly bigint[]): { forP: number; forQ: number; indifferent: number } {
  let forP = 0;
  let forQ = 0;
  let indifferent = 0;
  s.ideals.forEach((v, i) => {
    const dp = squaredDistance(p, v);
    const dq = squaredDistance(q, v);
    if (dp < dq) forP += s.weights[i];
    else if (dp > dq) forQ += s.weights[i];
    else indifferent += s.weights[i];
  });
  return { forP, forQ, indifferent };
}

/** Scale a point given in input units onto the spatial scale (exact when it needs no more decimals than the inputs). */
export function scalePoint(s: ScaledSpatial, point: readonly number[]): bigint[] {
  const { values, scale } = scaleExactly(point);
  const f = 10n ** BigInt(s.scale);
  return values.map((v) => {
    if (scale > s.scale) throw new RangeError("point has more decimals than the spatial inputs");
    return (v * f) / 10n ** BigInt(scale);
  });
}

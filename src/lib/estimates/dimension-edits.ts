/**
 * Adding and removing a policy dimension of a spatial estimate (DOMAIN §2, spatial model): every
 * point of the estimate — members' ideal points, the status quo, the measure, each amendment's new
 * position or shift, and the drawing ranges — carries one coordinate per dimension, so a dimension
 * is added or removed in all of them at once.
 * A new dimension starts at 0 for every point and shift: all distances change by the same zero, so
 * the majority relation is what it was until someone moves a point along it. Removing a dimension
 * projects every point onto the others (members whose points then coincide are merged by the plot
 * and the analysis, as for any shared point). Names follow the save check: trimmed, non-empty, at
 * most 80 characters, distinct ignoring case; one to MAX_DIMENSIONS dimensions.
 */
import { z } from "zod";
import { safe } from "../schema-parts.ts";
import { GavelError } from "../errors.ts";
import { MAX_DIMENSIONS } from "../voting/spatial-profile.ts";
import type { EstimateContent } from "./estimate-content.ts";

type Spatial = Extract<EstimateContent, { kind: "spatial" }>;

export const NEW_DIMENSION_RANGE: [number, number] = [0, 10];

const nameSchema = safe(z.string().trim().min(1, "give the dimension a name").max(80, "at most 80 characters"));

/** Why `name` cannot name a dimension among `names` (ignoring the one at `self`), or null if it can. */
export function dimensionNameIssue(names: readonly string[], name: string, self = -1): string | null {
  const r = nameSchema.safeParse(name);
  if (!r.success) return r.error.issues[0].message;
  const key = r.data.toLowerCase();
  const other = names.findIndex((n, i) => i !== self && n.trim().toLowerCase() === key);
  return other >= 0 ? `dimension ${other + 1} is already called “${names[other].trim()}”` : null;
}

function bad(code: "invalid-input" | "limit-exceeded", path: string, message: string): never {
  throw new GavelError(code, `${path}: ${message}`, { issues: [{ path, message }] });
}

export function addDimension(c: Spatial, rawName: string): Spatial {
  if (c.dimensions.length >= MAX_DIMENSIONS) bad("limit-exceeded", "dimensions", `an estimate has at most ${MAX_DIMENSIONS} dimensions`);
  const issue = dimensionNameIssue(c.dimensions, rawName);
  if (issue) bad("invalid-input", `dimensions.${c.dimensions.length}`, issue);
  const more = (v: readonly number[]) => [...v, 0];
  return {
    ...c,
    dimensions: [...c.dimensions, rawName.trim()],
    ...(c.ranges ? { ranges: [...c.ranges, [...NEW_DIMENSION_RANGE] as [number, number]] } : {}),
    statusQuo: more(c.statusQuo),
    measure: more(c.measure),
    effects: Object.fromEntries(Object.entries(c.effects).map(([k, e]) => [k, { ...(e.position ? { position: more(e.position) } : {}), ...(e.shift ? { shift: more(e.shift) } : {}) }])),
    members: c.members.map((m) => ({ ...m, ideal: more(m.ideal) })),
  };
}

export function removeDimension(c: Spatial, index: number): Spatial {
  if (!Number.isInteger(index) || index < 0 || index >= c.dimensions.length) bad("invalid-input", "dimensions", `there is no dimension ${index + 1}`);
  if (c.dimensions.length === 1) bad("invalid-input", `dimensions.${index}`, "an estimate needs at least one dimension");
  const less = <T>(v: readonly T[]) => v.filter((_, i) => i !== index);
  return {
    ...c,
    dimensions: less(c.dimensions),
    ...(c.ranges ? { ranges: less(c.ranges) } : {}),
    statusQuo: less(c.statusQuo),
    measure: less(c.measure),
    effects: Object.fromEntries(Object.entries(c.effects).map(([k, e]) => [k, { ...(e.position ? { position: less(e.position) } : {}), ...(e.shift ? { shift: less(e.shift) } : {}) }])),
    members: c.members.map((m) => ({ ...m, ideal: less(m.ideal) })),
  };
}

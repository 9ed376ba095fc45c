/**
 * Whether the spatial majority game has a core (an unbeaten point), under simple majority.
 *  - One dimension: the weighted median interval of the ideal points is unbeaten (Black 1948).
 *  - Two dimensions: Plott's (1967) symmetry condition, in its weighted half-plane form: x is unbeaten
 *    iff every open half-plane bounded by a line through x holds at most half the weight (if some y
 *    beats x, every member preferring y lies in the open half-plane towards y). Candidates are the
 *    ideal points and the intersections of lines through two ideal points (the vertices of a
 *    Tukey-depth region lie there); each is tested exactly with rational arithmetic.
 *  - More dimensions, or more than MAX_CORE_POINTS distinct ideal points in 2-D: not decided (null).
 * Otherwise majority rule cycles everywhere (McKelvey 1976, J. Econ. Theory 12:472–482).
 */
import { exactText, unscale } from "./exact-decimal.ts";
import type { ScaledSpatial } from "./spatial-profile.ts";

export const MAX_CORE_POINTS = 24;

export interface CoreResult {
  exists: boolean | null;
  /** One dimension: the unbeaten interval [from, to]. */
  interval?: [number, number];
  /** Two dimensions: unbeaten candidate points (the core's vertices). */
  points?: number[][];
  exact?: string[][];
  reason?: string;
}

export function corePoint(s: ScaledSpatial): CoreResult {
  const d = s.dims.length;
  const W = s.totalWeight;
  if (d === 1) {
    const xs = [...new Set(s.ideals.map((v) => v[0]))].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
    const ok = (x: bigint) => {
      let lo = 0;
      let hi = 0;
      s.ideals.forEach((v, i) => {
        if (v[0] < x) lo += s.weights[i];
        else if (v[0] > x) hi += s.weights[i];
      });
      return 2 * lo <= W && 2 * hi <= W;
    };
    const good = xs.filter(ok);
    const a = good[0];
    const b = good[good.length - 1];
    return { exists: true, interval: [unscale(a, s.scale), unscale(b, s.scale)], exact: [[exactText(a, s.scale), exactText(b, s.scale)]] };
  }
  if (d > 2) return { exists: null, reason: "the core is only decided in one or two dimensions" };
  const keyOf = (v: bigint[]) => `${v[0]},${v[1]}`;
  const pts = [...new Map(s.ideals.map((v) => [keyOf(v), v])).values()];
  if (pts.length > MAX_CORE_POINTS) return { exists: null, reason: `more than ${MAX_CORE_POINTS} distinct ideal points` };
  // Weight grouped by distinct point.
  const weightAt = new Map<string, number>();
  s.ideals.forEach((v, i) => weightAt.set(keyOf(v), (weightAt.get(keyOf(v)) ?? 0) + s.weights[i]));
  const ws = pts.map((v) => weightAt.get(keyOf(v))!);
  // Candidate x = (X/D, Y/D), D > 0.
  const unbeaten = (X: bigint, Y: bigint, D: bigint): boolean => {
    const vecs: Array<[bigint, bigint, number]> = [];
    pts.forEach((v, i) => {
      const dx = v[0] * D - X;
      const dy = v[1] * D - Y;
      if (dx !== 0n || dy !== 0n) vecs.push([dx, dy, ws[i]]);
    });
    // Axis directions first: a cheap necessary condition.
    for (const [ux, uy] of [[1n, 0n], [0n, 1n]] as const) {
      let pos = 0;
      let neg = 0;
      for (const [dx, dy, w] of vecs) {
        const dot = dx * ux + dy * uy;
        if (dot > 0n) pos += w;
        else if (dot < 0n) neg += w;
      }
      if (2 * pos > W || 2 * neg > W) return false;
    }
    // The heaviest open half-plane can be taken with its boundary through some d_j, turned a little so
    // that one of the two rays of that line falls inside.
    for (const [jx, jy] of vecs) {
      let pos = 0;
      let neg = 0;
      let same = 0;
      let opp = 0;
      for (const [dx, dy, w] of vecs) {
        const cr = jx * dy - jy * dx;
        if (cr > 0n) pos += w;
        else if (cr < 0n) neg += w;
        else if (jx * dx + jy * dy > 0n) same += w;
        else opp += w;
      }
      if (2 * (Math.max(pos, neg) + Math.max(same, opp)) > W) return false;
    }
    return true;
  };
  const found = new Map<string, [bigint, bigint, bigint]>();
  const norm = (X: bigint, Y: bigint, D: bigint): [bigint, bigint, bigint] => {
    if (D < 0n) [X, Y, D] = [-X, -Y, -D];
    const gcd = (a: bigint, b: bigint): bigint => (b === 0n ? (a < 0n ? -a : a) : gcd(b, a % b));
    const g = gcd(gcd(X, Y), D) || 1n;
    return [X / g, Y / g, D / g];
  };
  const tried = new Set<string>();
  const tryPoint = (X: bigint, Y: bigint, D: bigint) => {
    const p = norm(X, Y, D);
    const key = p.join(",");
    if (tried.has(key)) return;
    tried.add(key);
    if (unbeaten(...p)) found.set(key, p);
  };
  for (const v of pts) tryPoint(v[0], v[1], 1n);
  const lines: Array<[bigint[], bigint[]]> = [];
  for (let i = 0; i < pts.length; i++) for (let j = i + 1; j < pts.length; j++) lines.push([pts[i], pts[j]]);
  for (let a = 0; a < lines.length; a++)
    for (let b = a + 1; b < lines.length; b++) {
      const [p1, p2] = lines[a];
      const [p3, p4] = lines[b];
      const rx = p2[0] - p1[0];
      const ry = p2[1] - p1[1];
      const sx = p4[0] - p3[0];
      const sy = p4[1] - p3[1];
      const den = rx * sy - ry * sx;
      if (den === 0n) continue;
      const t = (p3[0] - p1[0]) * sy - (p3[1] - p1[1]) * sx;
      tryPoint(p1[0] * den + t * rx, p1[1] * den + t * ry, den);
    }
  const points = [...found.values()];
  return {
    exists: points.length > 0,
    points: points.map(([X, Y, D]) => [unscale(X, s.scale, D), unscale(Y, s.scale, D)]),
    exact: points.map(([X, Y, D]) => [exactText(X, s.scale, D), exactText(Y, s.scale, D)]),
  };
}

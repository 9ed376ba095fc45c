/**
 * The win set W(q) of the status quo: the points a majority prefers to q (docs/sources.md §2; McKelvey 1976,
 * J. Econ. Theory 12:472–482). Member i prefers p to q iff p lies in the open ball centred on its ideal
 * point with radius |q − v_i|; so, away from the boundary circles, W(q) is the union over winning
 * coalitions of the intersections of their members' open balls. Returned exactly, for drawing:
 *  - `discs`: centre and squared radius per member (exact text beside each number);
 *  - `coalitions`: the minimal winning coalitions (member indices), for up to MAX_COALITION_MEMBERS
 *    members (null beyond: the region is then described by the discs and the threshold alone);
 *  - in one dimension, `intervals`: W(q) as exact open intervals.
 * A coalition wins when its weight, against all the others, meets the threshold.
 */
import { adopts, type Threshold } from "./vote-threshold.ts";
import { exactText, unscale } from "./exact-decimal.ts";
import { squaredDistance, type ScaledSpatial } from "./spatial-profile.ts";

export const MAX_COALITION_MEMBERS = 16;

export interface WinSet {
  threshold: Threshold;
  discs: Array<{ member: number; center: number[]; radiusSquared: number; exact: { center: string[]; radiusSquared: string } }>;
  coalitions: number[][] | null;
  intervals?: Array<{ from: number; to: number; exact: [string, string] }>;
}

export function winSet(s: ScaledSpatial, q: readonly bigint[], threshold: Threshold = "majority"): WinSet {
  const m = s.ideals.length;
  const discs = s.ideals.map((v, i) => {
    const r2 = squaredDistance(q, v);
    return {
      member: i,
      center: v.map((c) => unscale(c, s.scale)),
      radiusSquared: unscale(r2, 2 * s.scale),
      exact: { center: v.map((c) => exactText(c, s.scale)), radiusSquared: exactText(r2, 2 * s.scale) },
    };
  });
  let coalitions: number[][] | null = null;
  if (m <= MAX_COALITION_MEMBERS) {
    const weightOf = (mask: number) => s.weights.reduce((a, w, i) => (mask & (1 << i) ? a + w : a), 0);
    const wins = (mask: number) => {
      const w = weightOf(mask);
      return adopts(w, s.totalWeight - w, s.totalWeight, threshold);
    };
    coalitions = [];
    for (let mask = 1; mask < 1 << m; mask++) {
      if (!wins(mask)) continue;
      let minimal = true;
      for (let b = mask; b && minimal; b &= b - 1) if (wins(mask & ~(b & -b))) minimal = false;
      if (minimal) coalitions.push([...Array(m).keys()].filter((i) => mask & (1 << i)));
    }
  }
  const out: WinSet = { threshold, discs, coalitions };
  if (s.dims.length === 1) out.intervals = intervals1d(s, q[0], threshold);
  return out;
}

/** One dimension: test every open segment between consecutive critical points q and 2v_i − q (doubled coordinates keep midpoints integral). */
function intervals1d(s: ScaledSpatial, q: bigint, threshold: Threshold): WinSet["intervals"] {
  const crit = [...new Set([q, ...s.ideals.map((v) => 2n * v[0] - q)])].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
  const beatsQ = (p2: bigint) => {
    // p2 is a doubled coordinate: compare |p2 − 2v| with |2q − 2v|.
    let f = 0;
    let a = 0;
    s.ideals.forEach((v, i) => {
      const dp = p2 - 2n * v[0];
      const dq = 2n * q - 2n * v[0];
      const sp = dp * dp;
      const sq = dq * dq;
      if (sp < sq) f += s.weights[i];
      else if (sp > sq) a += s.weights[i];
    });
    return adopts(f, a, s.totalWeight, threshold);
  };
  const res: Array<[bigint, bigint]> = [];
  for (let i = 0; i + 1 < crit.length; i++) {
    if (!beatsQ(crit[i] + crit[i + 1])) continue;
    const last = res[res.length - 1];
    if (last && last[1] === crit[i] && crit[i] !== q && beatsQ(2n * crit[i])) last[1] = crit[i + 1];
    else res.push([crit[i], crit[i + 1]]);
  }
  return res.map(([a, b]) => ({ from: unscale(a, s.scale), to: unscale(b, s.scale), exact: [exactText(a, s.scale), exactText(b, s.scale)] }));
}

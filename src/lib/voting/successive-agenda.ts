/**
 * Outcomes of one successive agenda x1…xm (continental practice): x1 is put to a yes/no vote, then
 * x2, …; the first adopted wins; if all are rejected xm stands. A tie rejects the proposal (DOMAIN §1).
 *  - Sincere (definition used, DOMAIN §1 [MEM]): a member votes yes on xi iff xi is strictly preferred
 *    to every other alternative still available (xi+1…xm) that the member ranks; a member that ranks
 *    xi equal to or below one of them votes no; a member that does not rank xi abstains. This needs the
 *    members' rankings, not only the majority graph.
 *  - Sophisticated: o_m = x_m; o_i = x_i if x_i beats o_{i+1}, else o_{i+1}; the outcome is o_1
 *    (backward induction on the successive voting tree).
 */
import type { MajorityGraph } from "./majority-graph.ts";
import { attendingWeight, type Profile } from "./profile.ts";
import { adopts, type Threshold } from "./vote-threshold.ts";

/** Yes and no weight on proposal x when the alternatives in `available` (indices, x included) remain. */
export function successiveTally(p: Profile, x: number, available: readonly number[]): { forWeight: number; againstWeight: number } {
  let forWeight = 0;
  let againstWeight = 0;
  for (const m of p.members) {
    const lx = m.level[x];
    if (lx < 0) continue;
    let top = true;
    for (const y of available) {
      if (y === x) continue;
      const ly = m.level[y];
      if (ly >= 0 && ly <= lx) {
        top = false;
        break;
      }
    }
    if (top) forWeight += m.weight;
    else againstWeight += m.weight;
  }
  return { forWeight, againstWeight };
}

export function successivePasses(p: Profile, threshold: Threshold, x: number, available: readonly number[]): boolean {
  const t = successiveTally(p, x, available);
  return adopts(t.forWeight, t.againstWeight, attendingWeight(p), threshold);
}

export function sincereSuccessive(p: Profile, threshold: Threshold, order: readonly number[]): number {
  for (let i = 0; i < order.length - 1; i++) if (successivePasses(p, threshold, order[i], order.slice(i))) return order[i];
  return order[order.length - 1];
}

/** The sophisticated equivalents o_m, o_{m−1}, …, o_1 and the outcome o_1. */
export function sophisticatedSuccessive(g: MajorityGraph, order: readonly number[]): { equivalents: number[]; outcome: number } {
  const m = order.length;
  let o = order[m - 1];
  const equivalents = [o];
  for (let i = m - 2; i >= 0; i--) {
    if (g.beats[order[i]][o]) o = order[i];
    equivalents.push(o);
  }
  return { equivalents, outcome: o };
}

/**
 * Outcomes of one amendment agenda x1…xm (pairwise elimination: x1 meets x2, the survivor meets x3,
 * …). In each vote the earlier-listed alternative is the motion and a tie defeats it (docs/sources.md §1;
 * Robert's Rules of Order Revised, 1915, §46).
 *  - Sincere: each vote goes to the directly compared alternative the majority prefers.
 *  - Sophisticated: Shepsle & Weingast (1984, AJPS 28:49–74), linear form: chain C = [xm]; for
 *    k = m−1 down to 1, append xk if it beats every member of C; the outcome is the last appended.
 *    Equal to backward induction on the agenda's voting tree (McKelvey & Niemi 1978), ties included.
 */
import type { MajorityGraph } from "./majority-graph.ts";

export function sincereAmendment(g: MajorityGraph, order: readonly number[]): number {
  let survivor = order[0];
  for (let k = 1; k < order.length; k++) if (!g.beats[survivor][order[k]]) survivor = order[k];
  return survivor;
}

export function shepsleWeingast(g: MajorityGraph, order: readonly number[]): { chain: number[]; outcome: number } {
  const m = order.length;
  const chain = [order[m - 1]];
  for (let k = m - 2; k >= 0; k--) {
    const x = order[k];
    if (chain.every((c) => g.beats[x][c])) chain.push(x);
  }
  return { chain, outcome: chain[chain.length - 1] };
}

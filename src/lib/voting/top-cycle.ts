/**
 * Top cycle (Smith set, GETCHA): the smallest set every member of which beats or ties every
 * alternative outside it; the top strongly connected component of the "beats or ties" relation
 * (Smith 1973; Miller 1977, AJPS 21:769–803; docs/sources.md §2).
 */
import type { MajorityGraph } from "./majority-graph.ts";
import { reachability } from "./reachability.ts";

export function topCycle(g: MajorityGraph): number[] {
  const n = g.alternatives.length;
  // "Beats or ties" is complete because beats is asymmetric, so x is in the top component iff it reaches all.
  const reach = reachability((x, y) => !g.beats[y][x], n);
  const out: number[] = [];
  for (let x = 0; x < n; x++) if (reach[x].every((r, y) => r || y === x)) out.push(x);
  return out;
}

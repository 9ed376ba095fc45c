/**
 * Condorcet winner: the alternative that beats every other in the majority graph (Condorcet 1785;
 * docs/sources.md §2). With ties (weak tournaments) there may be none.
 */
import type { MajorityGraph } from "./majority-graph.ts";

export function condorcetWinner(g: MajorityGraph): number | null {
  const n = g.alternatives.length;
  for (let x = 0; x < n; x++) {
    let all = true;
    for (let y = 0; y < n && all; y++) if (y !== x && !g.beats[x][y]) all = false;
    if (all) return x;
  }
  return null;
}

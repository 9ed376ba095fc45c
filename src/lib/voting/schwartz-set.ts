/**
 * Schwartz set (GOCHA): the union of the minimal sets not beaten from outside under the strict
 * majority relation (Schwartz 1986; docs/sources.md §2). x belongs iff every y that reaches x by a beat-path
 * is reached back from x.
 */
import type { MajorityGraph } from "./majority-graph.ts";
import { reachability } from "./reachability.ts";

export function schwartzSet(g: MajorityGraph): number[] {
  const n = g.alternatives.length;
  const reach = reachability((x, y) => g.beats[x][y], n);
  const out: number[] = [];
  for (let x = 0; x < n; x++) {
    let ok = true;
    for (let y = 0; y < n && ok; y++) if (y !== x && reach[y][x] && !reach[x][y]) ok = false;
    if (ok) out.push(x);
  }
  return out;
}

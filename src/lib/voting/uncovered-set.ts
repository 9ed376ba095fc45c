/**
 * Uncovered set (Miller 1980, AJPS 24:68–96), with the four covering relations that differ on weak
 * tournaments (Duggan 2013, Soc. Choice Welf. 41:489–535). With D(x) = alternatives beating x and
 * W(x) = alternatives beating or tied with x:
 *  - gillies (default): y covers x iff y beats x and D(y) ⊆ D(x);
 *  - fishburn: y covers x iff D(y) ⊊ D(x);
 *  - bordes: y covers x iff y beats x and W(y) ⊆ W(x);
 *  - mckelvey: y covers x iff it covers x in both the Gillies and the Bordes sense.
 * On tournaments all four coincide. See docs/decisions/0002-uncovered-set-variant.md.
 */
import type { MajorityGraph } from "./majority-graph.ts";

export const UNCOVERED_VARIANTS = ["gillies", "fishburn", "bordes", "mckelvey"] as const;
export type UncoveredVariant = (typeof UNCOVERED_VARIANTS)[number];

function subset(a: boolean[], b: boolean[]): boolean {
  for (let i = 0; i < a.length; i++) if (a[i] && !b[i]) return false;
  return true;
}

export function uncoveredSet(g: MajorityGraph, variant: UncoveredVariant = "gillies"): number[] {
  const n = g.alternatives.length;
  const D = Array.from({ length: n }, (_, x) => Array.from({ length: n }, (_, z) => g.beats[z][x]));
  const W = Array.from({ length: n }, (_, x) => Array.from({ length: n }, (_, z) => z !== x && !g.beats[x][z]));
  const covers = (y: number, x: number): boolean => {
    switch (variant) {
      case "gillies":
        return g.beats[y][x] && subset(D[y], D[x]);
      case "fishburn":
        return subset(D[y], D[x]) && !subset(D[x], D[y]);
      case "bordes":
        return g.beats[y][x] && subset(W[y], W[x]);
      case "mckelvey":
        return g.beats[y][x] && subset(D[y], D[x]) && subset(W[y], W[x]);
    }
  };
  const out: number[] = [];
  for (let x = 0; x < n; x++) {
    let covered = false;
    for (let y = 0; y < n && !covered; y++) if (y !== x && covers(y, x)) covered = true;
    if (!covered) out.push(x);
  }
  return out;
}

/** Test helpers: small graphs and plain brute-force references, written independently of the engine. */
import { graphFromMargins, type MajorityGraph } from "../../../src/lib/voting/majority-graph.ts";

/** pairs[i][j] for i < j: 1 = i beats j, -1 = j beats i, 0 = tie. */
export function graphFromPairs(n: number, cells: number[]): MajorityGraph {
  const m = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  let c = 0;
  for (let i = 0; i < n; i++)
    for (let j = i + 1; j < n; j++) {
      const v = cells[c++] ?? 0;
      m[i][j] = v;
      m[j][i] = -v;
    }
  return graphFromMargins(Array.from({ length: n }, (_, i) => String(i)), m);
}

export function* permutations(items: number[]): Generator<number[]> {
  if (items.length <= 1) {
    yield items.slice();
    return;
  }
  for (let i = 0; i < items.length; i++) {
    const rest = items.filter((_, j) => j !== i);
    for (const p of permutations(rest)) yield [items[i], ...p];
  }
}

export const range = (n: number) => Array.from({ length: n }, (_, i) => i);

/** Plain sincere amendment procedure: survivor meets next; a tie keeps the later-listed one. */
export function bruteSincere(g: MajorityGraph, order: number[]): number {
  let s = order[0];
  for (const x of order.slice(1)) s = g.beats[s][x] ? s : x;
  return s;
}

/** Full backward induction on the amendment agenda tree (no chain shortcut). */
export function bruteSophisticated(g: MajorityGraph, order: number[]): number {
  const value = (survivor: number, k: number): number => {
    if (k === order.length) return survivor;
    const keep = value(survivor, k + 1);
    const swap = value(order[k], k + 1);
    return keep !== swap && g.beats[keep][swap] ? keep : swap;
  };
  return value(order[0], 1);
}

/** Full backward induction on the successive tree. */
export function bruteSophisticatedSuccessive(g: MajorityGraph, order: number[]): number {
  const value = (i: number): number => {
    if (i === order.length - 1) return order[i];
    const rest = value(i + 1);
    return order[i] !== rest && g.beats[order[i]][rest] ? order[i] : rest;
  };
  return value(0);
}

/** Banks set by listing every subset: tops of transitive chains that no outside alternative beats entirely. */
export function bruteBanks(g: MajorityGraph): number[] {
  const n = g.alternatives.length;
  const tops = new Set<number>();
  for (let mask = 1; mask < 1 << n; mask++) {
    const members = range(n).filter((i) => mask & (1 << i));
    // Transitive chain: every pair compared strictly, and the "beats" count gives a strict order.
    let chain = members.every((a) => members.every((b) => a === b || g.beats[a][b] || g.beats[b][a]));
    if (!chain) continue;
    const wins = members.map((a) => members.filter((b) => g.beats[a][b]).length);
    chain = new Set(wins).size === members.length;
    if (!chain) continue;
    const maximal = range(n).every((z) => members.includes(z) || !members.every((c) => g.beats[z][c]));
    if (maximal) tops.add(members[wins.indexOf(members.length - 1)]);
  }
  return [...tops].sort((a, b) => a - b);
}

/** Smallest nonempty set whose every member beats every outsider, by listing subsets (tournaments). */
export function bruteTopCycle(g: MajorityGraph): number[] {
  const n = g.alternatives.length;
  let best: number[] = range(n);
  for (let mask = 1; mask < 1 << n; mask++) {
    const s = range(n).filter((i) => mask & (1 << i));
    if (s.length >= best.length) continue;
    if (s.every((x) => range(n).every((y) => s.includes(y) || !g.beats[y][x]))) best = s;
  }
  return best;
}

/** Is `order` a linear extension of the constraint pairs? */
export function respects(order: number[], before: Array<[number, number]>): boolean {
  return before.every(([a, b]) => order.indexOf(a) < order.indexOf(b));
}

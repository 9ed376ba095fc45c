/**
 * Transitive closure of a relation on n points (Warshall 1962), used by the top cycle and the
 * Schwartz set. reach[x][y] is true when a path of one or more steps leads from x to y.
 */
export function reachability(rel: (x: number, y: number) => boolean, n: number): boolean[][] {
  const reach = Array.from({ length: n }, (_, x) => Array.from({ length: n }, (_, y) => x !== y && rel(x, y)));
  for (let k = 0; k < n; k++) {
    const rk = reach[k];
    for (let i = 0; i < n; i++) {
      const ri = reach[i];
      if (!ri[k]) continue;
      for (let j = 0; j < n; j++) if (rk[j]) ri[j] = true;
    }
  }
  return reach;
}

/**
 * The majority matrix and the rules for drawing the majority graph at any size: each version's
 * head-to-head record (wins, losses, ties and Copeland score — wins minus losses, the score
 * A. H. Copeland proposed in 1951 for ranking by pairwise contests), sorting of the rows, which
 * cells lie on the top cycle, and the collapse of the drawing to the top cycle when there are too
 * many versions to draw legibly. Pure: the browser's matrix and graph use it, and so do the tests.
 */

export type Margins = Record<string, Record<string, number>>;

export interface MatrixRow {
  id: string;
  wins: number;
  losses: number;
  ties: number;
  copeland: number;
  /** Position in the versions' own order (the order the analysis lists them in). */
  index: number;
}

export type SortKey = "order" | "name" | "wins" | "losses" | "copeland" | `beats:${string}`;
export interface Sort {
  key: SortKey;
  descending: boolean;
}

/** Above this many versions the graph shows only the top cycle (or its strongest members). */
export const GRAPH_LIMIT = 8;

export function margin(margins: Margins, x: string, y: string): number {
  return margins[x]?.[y] ?? -(margins[y]?.[x] ?? 0);
}

export function matrixRows(ids: readonly string[], margins: Margins): MatrixRow[] {
  return ids.map((id, index) => {
    let wins = 0;
    let losses = 0;
    let ties = 0;
    for (const other of ids) {
      if (other === id) continue;
      const m = margin(margins, id, other);
      if (m > 0) wins++;
      else if (m < 0) losses++;
      else ties++;
    }
    return { id, wins, losses, ties, copeland: wins - losses, index };
  });
}

/**
 * Rows in the order asked for; ties keep the versions' own order, so a sort is stable and
 * predictable. `name` sorts by the label a person reads (`nameOf`), `beats:<id>` by the margin over
 * that column's version.
 */
export function sortRows(rows: readonly MatrixRow[], sort: Sort, margins: Margins, nameOf: (id: string) => string = (id) => id): MatrixRow[] {
  const value = (r: MatrixRow): number | string => {
    if (sort.key === "order") return r.index;
    if (sort.key === "name") return nameOf(r.id);
    if (sort.key.startsWith("beats:")) {
      const col = sort.key.slice("beats:".length);
      return col === r.id ? Number.NEGATIVE_INFINITY : margin(margins, r.id, col);
    }
    return r[sort.key as "wins" | "losses" | "copeland"];
  };
  const dir = sort.descending ? -1 : 1;
  return [...rows].sort((a, b) => {
    const va = value(a);
    const vb = value(b);
    const c = typeof va === "string" && typeof vb === "string" ? va.localeCompare(vb, undefined, { numeric: true }) : (va as number) - (vb as number);
    return c !== 0 ? dir * c : a.index - b.index;
  });
}

/**
 * Whether the cell (row beats column) is an edge of the majority cycle: both versions are in the
 * top cycle, there is no Condorcet winner (a one-version top cycle is not a cycle), and the row
 * beats the column.
 */
export function onCycle(row: string, col: string, margins: Margins, topCycle: readonly string[], condorcetWinner: string | null): boolean {
  if (condorcetWinner !== null || topCycle.length < 3 || row === col) return false;
  return topCycle.includes(row) && topCycle.includes(col) && margin(margins, row, col) > 0;
}

export interface GraphSelection {
  /** Versions to draw, in the versions' own order. */
  shown: string[];
  /** True when some versions are left out of the drawing. */
  collapsed: boolean;
  /** Why, in words for the screen; null when nothing is left out. */
  note: string | null;
}

/**
 * Which versions the majority graph draws. Up to GRAPH_LIMIT versions (or when asked for all), all of
 * them. Beyond that, the top cycle — the versions sincere voting can end on — and when the top cycle
 * itself is larger than the limit, its GRAPH_LIMIT members with the best Copeland scores.
 */
export function graphSelection(ids: readonly string[], margins: Margins, topCycle: readonly string[], showAll = false, limit = GRAPH_LIMIT): GraphSelection {
  if (showAll || ids.length <= limit) return { shown: [...ids], collapsed: false, note: null };
  const inCycle = new Set(topCycle);
  if (topCycle.length <= limit) {
    const shown = ids.filter((id) => inCycle.has(id));
    const what = topCycle.length === 1 ? "only the version that beats every other" : `only the top cycle (${topCycle.length} versions)`;
    return { shown, collapsed: true, note: `${ids.length} versions are too many to draw legibly: the graph shows ${what}. The matrix lists every version.` };
  }
  const rows = matrixRows(ids.filter((id) => inCycle.has(id)), margins);
  const best = new Set(sortRows(rows, { key: "copeland", descending: true }, margins).slice(0, limit).map((r) => r.id));
  return { shown: ids.filter((id) => best.has(id)), collapsed: true, note: `${ids.length} versions are too many to draw legibly, and the top cycle alone has ${topCycle.length}: the graph shows its ${limit} versions with the most head-to-head wins. The matrix lists every version.` };
}

/** The sentence about the cycle: names up to `maxNames` versions, otherwise a count and a pointer to the matrix. */
export function cycleSentence(topCycle: readonly string[], nameOf: (id: string) => string, maxNames = 4): string {
  if (topCycle.length <= maxNames) {
    const names = topCycle.map(nameOf);
    const list = names.length <= 1 ? names.join("") : `${names.slice(0, -1).join(", ")} and ${names[names.length - 1]}`;
    return `the majorities cycle among ${list}`;
  }
  return `the majorities cycle among ${topCycle.length} versions — see the matrix`;
}

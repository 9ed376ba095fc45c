/**
 * Layout of an amendment tree in reading order: left to right, one column per level (the measure,
 * its sections, then amendments by degree), and top-down in the order given — the caller passes
 * sections in text order and amendments in filing order, so §1 sits above §2 and A1 above A2, as
 * the arrow keys, the outline and the printout read. A tidy tree: every leaf gets the next row,
 * a parent sits level with the middle of its children, so a tree of hundreds of amendments grows
 * downwards rather than into one wide row. Pure: no DOM, no React; the drawing and the tests call
 * the same function. (A general graph layout such as dagre, used before, orders siblings to reduce
 * crossings, not in the order of the text, so §3 could sit above §1; a tree in a given order needs
 * no more than this.)
 */
export interface LayoutInput {
  key: string;
  kind: "measure" | "section" | "amendment";
  parent: string | null;
}

export interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}

export const NODE_SIZE: Record<LayoutInput["kind"], { width: number; height: number }> = {
  measure: { width: 250, height: 84 },
  section: { width: 220, height: 60 },
  amendment: { width: 240, height: 84 },
};

const MARGIN = 20;
/** Between rows and between columns. */
const ROW_GAP = 16;
const COLUMN = Math.max(...Object.values(NODE_SIZE).map((s) => s.width)) + 70;

/**
 * Top-left corner and size of every node. Nodes whose parent is missing, and cycles of targets,
 * hang below everything else in the first amendment column.
 */
export function layoutTree(nodes: readonly LayoutInput[]): Map<string, Box> {
  const keys = new Set(nodes.map((n) => n.key));
  const children = new Map<string, LayoutInput[]>();
  for (const n of nodes) if (n.parent && keys.has(n.parent) && n.parent !== n.key) children.set(n.parent, [...(children.get(n.parent) ?? []), n]);
  const out = new Map<string, Box>();
  const columnBottom: number[] = [];
  let cursor = MARGIN;

  function place(n: LayoutInput, depth: number): void {
    const size = NODE_SIZE[n.kind];
    const below = (columnBottom[depth] ?? -Infinity) + ROW_GAP;
    out.set(n.key, { x: MARGIN + depth * COLUMN, y: 0, ...size }); // marks it placed (cycles stop here)
    const kids = (children.get(n.key) ?? []).filter((c) => !out.has(c.key));
    for (const c of kids) if (!out.has(c.key)) place(c, depth + 1);
    const placedKids = kids.map((c) => out.get(c.key)!).filter((b) => b.x === MARGIN + (depth + 1) * COLUMN);
    const y =
      placedKids.length === 0
        ? Math.max(cursor, below)
        : Math.max(below, (Math.min(...placedKids.map((b) => b.y)) + Math.max(...placedKids.map((b) => b.y + b.height))) / 2 - size.height / 2);
    out.set(n.key, { x: MARGIN + depth * COLUMN, y, ...size });
    columnBottom[depth] = y + size.height;
    cursor = Math.max(cursor, y + size.height + ROW_GAP);
  }

  const roots = nodes.filter((n) => n.kind === "measure");
  for (const r of roots) place(r, 0);
  for (const n of nodes) if (!out.has(n.key)) place(n, n.kind === "section" ? 1 : 2);
  return out;
}

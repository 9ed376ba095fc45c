/**
 * Automatic layout of an amendment tree with dagre (layered drawing, Sugiyama method): left to
 * right, one column per level — the measure, its sections, then amendments by degree — so a
 * tree of hundreds of amendments grows downwards in columns rather than into one wide row.
 * Pure: no DOM, no React; the drawing and the tests call the same function.
 */
import dagre from "@dagrejs/dagre";

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
  measure: { width: 230, height: 76 },
  section: { width: 190, height: 52 },
  amendment: { width: 200, height: 72 },
};

/** Top-left corner and size of every node. Nodes whose parent is missing sit in the first amendment column. */
export function layoutTree(nodes: readonly LayoutInput[]): Map<string, Box> {
  const g = new dagre.graphlib.Graph();
  g.setGraph({ rankdir: "LR", nodesep: 14, ranksep: 90, marginx: 20, marginy: 20 });
  g.setDefaultEdgeLabel(() => ({}));
  const keys = new Set(nodes.map((n) => n.key));
  for (const n of nodes) g.setNode(n.key, { ...NODE_SIZE[n.kind] });
  const measure = nodes.find((n) => n.kind === "measure")?.key;
  for (const n of nodes) {
    if (n.parent && keys.has(n.parent) && n.parent !== n.key) g.setEdge(n.parent, n.key);
    // Orphans (missing target, cycles) hang from the measure with a long edge so they still get a column.
    else if (n.kind === "amendment" && measure) g.setEdge(measure, n.key, { minlen: 2 });
  }
  dagre.layout(g);
  const out = new Map<string, Box>();
  for (const n of nodes) {
    const p = g.node(n.key);
    const size = NODE_SIZE[n.kind];
    out.set(n.key, { x: p.x - size.width / 2, y: p.y - size.height / 2, ...size });
  }
  return out;
}

/**
 * The amendment tree of a measure, built from stored rows: the measure at the root, its
 * sections below it, and each amendment below its target. Degrees are derived, never stored:
 * an amendment to the measure or a section is of the first degree, an amendment to an
 * amendment of degree d is of degree d + 1 (Robert's Rules of Order Revised, 1915, §33).
 *
 * Structural problems are recorded, not thrown, so a broken tree can still be drawn:
 * a target that does not exist, a self-target, and cycles of targets (strongly connected
 * components of the amendment→target relation). Members of a cycle, and amendments that
 * depend on one, have no degree.
 *
 * Slots: at most `pendingPerSlot` amendments may be pending in one slot. A first-degree slot is
 * the measure (or, with `substituteSlot`, the measure's perfecting slot and its substitute slot,
 * as in the four-amendment tree of US House Rule XVI cl. 6); a higher-degree slot is its parent.
 */
import { DirectedGraph } from "graphology";
import { stronglyConnectedComponents } from "graphology-components";
import type { Amendment, Measure } from "./case-schema.ts";

export type TreeNodeKind = "measure" | "section" | "amendment";

export interface TreeNode {
  id: string;
  kind: TreeNodeKind;
  /** Amendments: the id they target (which may be missing). */
  target: string | null;
  degree: number | null;
  /** Ids of the amendments targeting this node, in input order. */
  children: string[];
  slot: string | null;
  /** For amendments with a degree: the measure or section at the bottom of their chain. */
  root: string | null;
  targetMissing: boolean;
  selfTarget: boolean;
  inCycle: boolean;
  dependsOnCycle: boolean;
}

export interface AmendmentTree {
  /** Edges run from the target to the amendment (and from the measure to each section). */
  graph: DirectedGraph;
  measure: string;
  nodes: Record<string, TreeNode>;
  /** Amendment ids in input order. */
  amendments: string[];
  /** Each cycle of targets once, members in input order. */
  cycles: string[][];
}

export const SUBSTITUTE_FORMS: ReadonlySet<string> = new Set(["substitute", "in-nature-of-substitute"]);

export interface BuildTreeOptions {
  /** Substitutes get a first-degree slot of their own (four-amendment tree). */
  substituteSlot?: boolean;
}

/** Build the tree. Ids must be unique across the measure, its sections and the amendments (validateTree checks this). */
export function buildTree(measure: { id: Measure["id"]; sections: ReadonlyArray<{ id: string }> }, amendments: ReadonlyArray<Pick<Amendment, "id" | "target" | "form">>, options: BuildTreeOptions = {}): AmendmentTree {
  const graph = new DirectedGraph();
  const nodes: Record<string, TreeNode> = {};
  const blank = (id: string, kind: TreeNodeKind): TreeNode => ({ id, kind, target: null, degree: kind === "amendment" ? null : 0, children: [], slot: null, root: kind === "amendment" ? null : id, targetMissing: false, selfTarget: false, inCycle: false, dependsOnCycle: false });
  graph.addNode(measure.id, { kind: "measure" });
  nodes[measure.id] = blank(measure.id, "measure");
  for (const s of measure.sections) {
    graph.addNode(s.id, { kind: "section" });
    graph.addEdge(measure.id, s.id);
    nodes[s.id] = blank(s.id, "section");
  }
  for (const a of amendments) {
    graph.addNode(a.id, { kind: "amendment", form: a.form });
    nodes[a.id] = { ...blank(a.id, "amendment"), target: a.target };
  }
  const byId = new Map(amendments.map((a) => [a.id, a]));
  const targetGraph = new DirectedGraph();
  for (const a of amendments) targetGraph.addNode(a.id);
  for (const a of amendments) {
    const node = nodes[a.id];
    if (!(a.target in nodes)) {
      node.targetMissing = true;
      continue;
    }
    graph.addEdge(a.target, a.id);
    nodes[a.target].children.push(a.id);
    if (a.target === a.id) node.selfTarget = node.inCycle = true;
    else if (byId.has(a.target)) targetGraph.addEdge(a.id, a.target);
  }
  const order = new Map(amendments.map((a, i) => [a.id, i]));
  const cycles: string[][] = amendments.filter((a) => nodes[a.id].selfTarget).map((a) => [a.id]);
  for (const comp of stronglyConnectedComponents(targetGraph)) {
    if (comp.length < 2) continue;
    for (const id of comp) nodes[id].inCycle = true;
    cycles.push([...comp].sort((x, y) => order.get(x)! - order.get(y)!));
  }
  cycles.sort((x, y) => order.get(x[0])! - order.get(y[0])!);

  // Chains are walked iteratively: a long chain of amendments must not exhaust the stack.
  const resolved = new Set<string>();
  for (const a of amendments) {
    const chain: string[] = [];
    const onChain = new Set<string>();
    let cur: string = a.id;
    while (!resolved.has(cur) && byId.has(cur)) {
      const n = nodes[cur];
      if (n.inCycle || n.targetMissing || onChain.has(cur)) break;
      chain.push(cur);
      onChain.add(cur);
      cur = n.target!;
    }
    const base = nodes[cur];
    let degree: number | null;
    let root: string | null;
    let cyclic = false;
    if (base.kind !== "amendment") [degree, root] = [0, base.id];
    else if (resolved.has(cur)) [degree, root, cyclic] = [base.degree, base.root, base.dependsOnCycle || base.inCycle];
    else [degree, root, cyclic] = [null, null, base.inCycle || base.dependsOnCycle];
    if (!chain.length) {
      resolved.add(cur);
      continue;
    }
    for (let i = chain.length - 1; i >= 0; i--) {
      const n = nodes[chain[i]];
      degree = degree === null ? null : degree + 1;
      n.degree = degree;
      n.root = degree === null ? null : root;
      n.dependsOnCycle = cyclic;
      resolved.add(n.id);
    }
  }
  for (const a of amendments) {
    const n = nodes[a.id];
    if (n.degree === null) continue;
    if (n.degree === 1) n.slot = options.substituteSlot ? `${measure.id}/${SUBSTITUTE_FORMS.has(a.form) ? "substitute" : "perfecting"}` : measure.id;
    else n.slot = a.target;
  }
  return { graph, measure: measure.id, nodes, amendments: amendments.map((a) => a.id), cycles };
}

/**
 * The amendment tree of a measure, built from stored rows: the measure at the root, its
 * sections below it, and each amendment below its target. The graphology graph is the tree's one
 * representation, and graphology-traversal its one way of being walked (degrees, slots, what
 * falls with what).
 *
 * Degrees and slots are derived, never stored, from what targets what and what is pending, as the
 * manuals derive them (docs/rulebook-format.md, "Degrees and slots"):
 *  - an amendment to the measure or a section is of the first degree (`perfecting` or `substitute`);
 *    an amendment to an amendment of degree d is of degree d + 1 (Robert's Rules of Order Revised,
 *    1915, §33 p. 135);
 *  - with `substituteForAmendment`, a substitute for a first-degree amendment A counts as first
 *    degree, in A's substitute slot, with its own second-degree slot (US House Rule XVI cl. 6; CRS
 *    Report 98-613: "Such a substitute is treated as a first-degree amendment");
 *  - with `perfectingUnderSubstitute: "second-degree"`, an amendment made while a substitute S is
 *    pending, to the text S would strike out, is of the second degree in S's slot (RONR 1915 §33
 *    p. 142: amendments to the paragraph "to be struck out, these amendments being of the second
 *    degree"), so an amendment to it is of the third degree.
 *
 * Structural problems are recorded, not thrown, so a broken tree can still be drawn:
 * a target that does not exist, a self-target, and cycles of targets (strongly connected
 * components of the amendment→target relation). Members of a cycle, and amendments that
 * depend on one, have no degree.
 *
 * Slots: at most `pendingPerSlot` amendments may be pending in one slot. A first-degree slot is
 * the measure (or, with `substituteSlot`, the measure's perfecting slot and its substitute slot);
 * a substitute for an amendment A sits in `A/substitute`; any other amendment's slot is the
 * amendment it amends (or, under a pending substitute, that substitute).
 */
import { DirectedGraph } from "graphology";
import { stronglyConnectedComponents } from "graphology-components";
import { bfsFromNode, dfsFromNode } from "graphology-traversal";
import type { Amendment, Measure } from "./case-schema.ts";

export type TreeNodeKind = "measure" | "section" | "amendment";

/** How an amendment counts in the tree (docs/rulebook-format.md, "Degrees and slots"). */
export const TREE_ROLES = ["perfecting", "substitute", "substitute-for-amendment", "perfecting-under-substitute", "amendment-to-amendment"] as const;
export type TreeRole = (typeof TREE_ROLES)[number];

export interface TreeNode {
  id: string;
  kind: TreeNodeKind;
  /** Amendments: the id they target (which may be missing). */
  target: string | null;
  /** As counted by the manuals (see the file comment); null without a valid chain to the measure. */
  degree: number | null;
  /** Ids of the amendments targeting this node, in input order. */
  children: string[];
  slot: string | null;
  role: TreeRole | null;
  /** For `perfecting-under-substitute`: the pending substitute whose text it amends. */
  underSubstitute: string | null;
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
  /** Pending amendments in the order they were made (filing time, then input order). */
  pending: string[];
}

export const SUBSTITUTE_FORMS: ReadonlySet<string> = new Set(["substitute", "in-nature-of-substitute"]);

export interface BuildTreeOptions {
  /** Substitutes get a first-degree slot of their own (four-amendment tree). */
  substituteSlot?: boolean;
  /** A substitute for a first-degree amendment counts as first degree, in that amendment's substitute slot. */
  substituteForAmendment?: boolean;
  /** How an amendment to the text a pending substitute would strike out counts when made after it. */
  perfectingUnderSubstitute?: "first-degree" | "second-degree";
}

export type TreeAmendment = Pick<Amendment, "id" | "target" | "form"> & { status?: Amendment["status"]; filedAt?: string };

const timeMs = (iso: string | undefined) => (iso === undefined ? Infinity : Date.parse(iso));

/** Pending amendments in the order they were made: filing time, then input order (no filing time goes last). */
export function pendingOrder<T extends TreeAmendment>(amendments: readonly T[]): T[] {
  const index = new Map(amendments.map((a, i) => [a.id, i]));
  return amendments.filter((a) => a.status === "pending").sort((x, y) => timeMs(x.filedAt) - timeMs(y.filedAt) || index.get(x.id)! - index.get(y.id)!);
}

/** Amendments below `id` (amending it, directly or through others): what falls if it is rejected or withdrawn. */
export function amendmentsBelow(tree: AmendmentTree, id: string): string[] {
  const out: string[] = [];
  if (!tree.graph.hasNode(id)) return out;
  dfsFromNode(tree.graph, id, (node) => {
    if (node !== id && tree.nodes[node].kind === "amendment") out.push(node);
  });
  const order = new Map(tree.amendments.map((a, i) => [a, i]));
  return out.sort((x, y) => order.get(x)! - order.get(y)!);
}

/** Build the tree. Ids must be unique across the measure, its sections and the amendments (validateTree checks this). */
export function buildTree(measure: { id: Measure["id"]; sections: ReadonlyArray<{ id: string }> }, amendments: ReadonlyArray<TreeAmendment>, options: BuildTreeOptions = {}): AmendmentTree {
  const graph = new DirectedGraph();
  const nodes: Record<string, TreeNode> = {};
  const blank = (id: string, kind: TreeNodeKind): TreeNode => ({ id, kind, target: null, degree: kind === "amendment" ? null : 0, children: [], slot: null, role: null, underSubstitute: null, root: kind === "amendment" ? null : id, targetMissing: false, selfTarget: false, inCycle: false, dependsOnCycle: false });
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

  const pending = pendingOrder(amendments).map((a) => a.id);
  const pendingAt = new Map(pending.map((id, i) => [id, i]));
  const isSubstitute = (id: string) => SUBSTITUTE_FORMS.has(byId.get(id)!.form);
  const sectionIds = new Set(measure.sections.map((s) => s.id));
  /** Whether `text` (the measure or a section) contains `target`. */
  const contains = (text: string, target: string) => text === target || (text === measure.id && sectionIds.has(target));
  // Pending substitutes for the measure or a section, in the order they were made.
  const pendingSubstitutes = pending.filter((id) => isSubstitute(id) && !byId.has(byId.get(id)!.target) && byId.get(id)!.target in nodes);
  const firstSlot = (form: "perfecting" | "substitute") => (options.substituteSlot ? `${measure.id}/${form}` : measure.id);

  // Breadth first from the measure: every amendment is reached from its one target, after it.
  // Members of cycles, amendments hanging from them and amendments with a missing target are never reached.
  bfsFromNode(graph, measure.id, (id) => {
    const n = nodes[id];
    if (n.kind !== "amendment") return;
    const parent = nodes[n.target!];
    if (parent.kind !== "amendment") {
      n.root = parent.id;
      const at = pendingAt.get(id);
      const under =
        options.perfectingUnderSubstitute === "second-degree" && at !== undefined
          ? pendingSubstitutes.find((s) => s !== id && pendingAt.get(s)! < at && contains(byId.get(s)!.target, n.target!))
          : undefined;
      if (under !== undefined) Object.assign(n, { role: "perfecting-under-substitute", degree: 2, slot: under, underSubstitute: under });
      else if (isSubstitute(id)) Object.assign(n, { role: "substitute", degree: 1, slot: firstSlot("substitute") });
      else Object.assign(n, { role: "perfecting", degree: 1, slot: firstSlot("perfecting") });
      return;
    }
    n.root = parent.root;
    if (options.substituteForAmendment && isSubstitute(id) && (parent.role === "perfecting" || parent.role === "substitute"))
      Object.assign(n, { role: "substitute-for-amendment", degree: 1, slot: `${parent.id}/substitute` });
    else Object.assign(n, { role: "amendment-to-amendment", degree: parent.degree! + 1, slot: parent.id });
  });

  const tree: AmendmentTree = { graph, measure: measure.id, nodes, amendments: amendments.map((a) => a.id), cycles, pending };
  // What hangs from a cycle: every member reaches the same amendments, and each amendment hangs from at most one cycle.
  for (const cycle of cycles)
    dfsFromNode(graph, cycle[0], (id) => {
      if (!nodes[id].inCycle) nodes[id].dependsOnCycle = true;
    });
  return tree;
}

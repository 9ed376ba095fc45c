// The tree drawing's layout stays readable with a large generated tree: no two boxes overlap,
// every amendment sits to the right of what it amends (columns by degree), siblings read top-down
// in the order given (sections in text order, amendments in filing order, as the arrow keys and
// the printout go), and it is computed quickly. Readability criteria: common practice for tidy
// tree drawings, no single source.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { layoutTree, type Box, type LayoutInput } from "../../../src/components/tree/layout.ts";

function generated(amendments: number, sections = 8, seed = 7): LayoutInput[] {
  const nodes: LayoutInput[] = [{ key: "measure", kind: "measure", parent: null }];
  for (let i = 1; i <= sections; i++) nodes.push({ key: `s${i}`, kind: "section", parent: "measure" });
  let x = seed;
  const rand = (n: number) => ((x = (x * 1103515245 + 12345) % 2 ** 31), x % n);
  for (let i = 1; i <= amendments; i++) {
    const firstDegree = nodes.filter((n) => n.kind === "amendment" && (n.parent?.startsWith("s") || n.parent === "measure"));
    const r = rand(10);
    const parent = r < 6 || firstDegree.length === 0 ? (r === 0 ? "measure" : `s${1 + rand(sections)}`) : r < 9 ? firstDegree[rand(firstDegree.length)].key : `A${1 + rand(i - 1)}`;
    nodes.push({ key: `A${i}`, kind: "amendment", parent });
  }
  return nodes;
}

function overlaps(a: Box, b: Box): boolean {
  return a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;
}

function assertReadable(nodes: LayoutInput[], boxes: Map<string, Box>) {
  const list = nodes.map((n) => boxes.get(n.key)!);
  for (let i = 0; i < list.length; i++) for (let j = i + 1; j < list.length; j++) expect(overlaps(list[i], list[j]), `${nodes[i].key} overlaps ${nodes[j].key}`).toBe(false);
  for (const n of nodes) if (n.parent) expect(boxes.get(n.key)!.x, `${n.key} right of ${n.parent}`).toBeGreaterThan(boxes.get(n.parent)!.x + boxes.get(n.parent)!.width);
  // Reading order: each node's later siblings sit below it.
  const siblings = new Map<string, string[]>();
  for (const n of nodes) if (n.parent) siblings.set(n.parent, [...(siblings.get(n.parent) ?? []), n.key]);
  for (const keys of siblings.values())
    for (let i = 1; i < keys.length; i++) expect(boxes.get(keys[i])!.y, `${keys[i]} below ${keys[i - 1]}`).toBeGreaterThanOrEqual(boxes.get(keys[i - 1])!.y + boxes.get(keys[i - 1])!.height);
}

describe("tree layout", () => {
  it("reads top-down: §1 above §2 above §3, A1 above A2, whatever the filing targets", () => {
    const nodes: LayoutInput[] = [
      { key: "measure", kind: "measure", parent: null },
      { key: "s1", kind: "section", parent: "measure" },
      { key: "s2", kind: "section", parent: "measure" },
      { key: "s3", kind: "section", parent: "measure" },
      { key: "A1", kind: "amendment", parent: "s3" },
      { key: "A2", kind: "amendment", parent: "s1" },
      { key: "A3", kind: "amendment", parent: "s1" },
      { key: "A4", kind: "amendment", parent: "A3" },
    ];
    const b = layoutTree(nodes);
    const y = (k: string) => b.get(k)!.y;
    expect(y("s1")).toBeLessThan(y("s2"));
    expect(y("s2")).toBeLessThan(y("s3"));
    expect(y("A2")).toBeLessThan(y("A3"));
    // The section's amendments sit beside it: A1 (on §3) is below those on §1.
    expect(y("A3")).toBeLessThan(y("A1"));
    assertReadable(nodes, b);
  });

  it("lays out 180 amendments without overlaps, in columns by degree, in a few seconds", () => {
    const nodes = generated(180);
    const t0 = performance.now();
    const boxes = layoutTree(nodes);
    expect(performance.now() - t0).toBeLessThan(5000);
    assertReadable(nodes, boxes);
    // Columns, not one wide row: the drawing is far taller than wide.
    const xs = [...boxes.values()].map((b) => b.x);
    const ys = [...boxes.values()].map((b) => b.y);
    expect(Math.max(...ys) - Math.min(...ys)).toBeGreaterThan(3 * (Math.max(...xs) - Math.min(...xs)));
  });

  it("places orphans (missing target) and cycles without overlap", () => {
    const nodes: LayoutInput[] = [
      { key: "measure", kind: "measure", parent: null },
      { key: "A1", kind: "amendment", parent: null },
      { key: "A2", kind: "amendment", parent: "A3" },
      { key: "A3", kind: "amendment", parent: "A2" },
      { key: "A4", kind: "amendment", parent: "A4" },
    ];
    const boxes = layoutTree(nodes);
    const list = [...boxes.values()];
    for (let i = 0; i < list.length; i++) for (let j = i + 1; j < list.length; j++) expect(overlaps(list[i], list[j])).toBe(false);
  });

  it("never overlaps for random small trees (property)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 40 }), fc.integer({ min: 1, max: 6 }), fc.integer({ min: 1, max: 10_000 }), (n, sections, seed) => {
        const nodes = generated(n, sections, seed);
        assertReadable(nodes, layoutTree(nodes));
      }),
      { numRuns: 40 },
    );
  });
});

import { describe, expect, it } from "vitest";
import { buildTree } from "../../../src/lib/amendments/build-tree.ts";

const measure = { id: "B1", sections: [{ id: "s1" }, { id: "s2" }] };
const am = (id: string, target: string, form: "insert" | "substitute" = "insert") => ({ id, target, form });

describe("buildTree: malformed trees", () => {
  it("marks a self-target as a cycle of one, without a degree", () => {
    const t = buildTree(measure, [am("A1", "A1")]);
    expect(t.nodes.A1).toMatchObject({ selfTarget: true, inCycle: true, degree: null });
    expect(t.cycles).toEqual([["A1"]]);
  });

  it("finds a cycle of targets, and marks amendments hanging from it", () => {
    const t = buildTree(measure, [am("A1", "A2"), am("A2", "A3"), am("A3", "A1"), am("A4", "A2"), am("A5", "s1")]);
    expect(t.cycles).toEqual([["A1", "A2", "A3"]]);
    expect(t.nodes.A4).toMatchObject({ inCycle: false, dependsOnCycle: true, degree: null });
    expect(t.nodes.A5).toMatchObject({ degree: 1, dependsOnCycle: false });
  });

  it("marks a missing target and leaves its descendants without a degree", () => {
    const t = buildTree(measure, [am("A1", "nowhere"), am("A2", "A1")]);
    expect(t.nodes.A1).toMatchObject({ targetMissing: true, degree: null });
    expect(t.nodes.A2.degree).toBeNull();
    expect(t.graph.hasEdge("A1", "A2")).toBe(true);
  });
});

describe("buildTree: degrees and slots", () => {
  // Robert's Rules of Order Revised (1915) §33: an amendment to an amendment is of the second degree.
  it("derives degrees from targets, in any input order", () => {
    const t = buildTree(measure, [am("A3", "A2"), am("A2", "A1"), am("A1", "s1"), am("A4", "B1")]);
    expect([t.nodes.A1.degree, t.nodes.A2.degree, t.nodes.A3.degree, t.nodes.A4.degree]).toEqual([1, 2, 3, 1]);
    expect(t.nodes.A3.root).toBe("s1");
    expect(t.nodes.s1.children).toEqual(["A1"]);
    expect(t.graph.hasEdge("B1", "s1")).toBe(true);
  });

  it("puts first-degree amendments in one slot, or perfecting and substitute slots for a four-amendment tree", () => {
    const rows = [am("A", "s1"), am("S", "B1", "substitute"), am("A2", "A")];
    expect([buildTree(measure, rows).nodes.A.slot, buildTree(measure, rows).nodes.S.slot]).toEqual(["B1", "B1"]);
    const t = buildTree(measure, rows, { substituteSlot: true });
    expect([t.nodes.A.slot, t.nodes.S.slot, t.nodes.A2.slot]).toEqual(["B1/perfecting", "B1/substitute", "A"]);
  });

  it("handles a chain of 3000 amendments without exhausting the stack", () => {
    const rows = [am("A0", "s1"), ...Array.from({ length: 2999 }, (_, i) => am(`A${i + 1}`, `A${i}`))];
    expect(buildTree(measure, rows.reverse()).nodes.A2999.degree).toBe(3000);
  });
});

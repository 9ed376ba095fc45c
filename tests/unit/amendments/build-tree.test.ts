import { describe, expect, it } from "vitest";
import { amendmentsBelow, buildTree, pendingOrder } from "../../../src/lib/amendments/build-tree.ts";

const measure = { id: "B1", sections: [{ id: "s1" }, { id: "s2" }] };
const am = (id: string, target: string, form: "insert" | "substitute" = "insert", extra: { status?: "pending" | "filed"; filedAt?: string } = {}) => ({ id, target, form, ...extra });

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

  // House Rule XVI cl. 6; CRS Report 98-613: a substitute for the amendment "is treated as a first-degree amendment"
  // and "is subject to second-degree amendments".
  it("with substituteForAmendment, a substitute for a first-degree amendment counts as first degree in that amendment's substitute slot", () => {
    const rows = [am("A", "s1"), am("A2", "A"), am("S", "A", "substitute"), am("S2", "S"), am("SS", "S", "substitute")];
    const t = buildTree(measure, rows, { substituteSlot: true, substituteForAmendment: true });
    expect(rows.map((r) => [t.nodes[r.id].degree, t.nodes[r.id].slot, t.nodes[r.id].role])).toEqual([
      [1, "B1/perfecting", "perfecting"],
      [2, "A", "amendment-to-amendment"],
      [1, "A/substitute", "substitute-for-amendment"],
      [2, "S", "amendment-to-amendment"],
      // A substitute for the substitute is an amendment to it (only the original first-degree amendment has a substitute slot).
      [2, "S", "amendment-to-amendment"],
    ]);
    expect(buildTree(measure, rows).nodes.S).toMatchObject({ degree: 2, slot: "A", role: "amendment-to-amendment" });
  });

  // Robert's Rules of Order Revised (1915) §33 p. 142: amendments to the paragraph "to be struck out, these amendments
  // being of the second degree".
  it("with perfectingUnderSubstitute, an amendment to the text made after a pending substitute is second degree in its slot", () => {
    const rows = [
      am("S", "s1", "substitute", { status: "pending", filedAt: "2025-01-01T10:00:00Z" }),
      am("P", "s1", "insert", { status: "pending", filedAt: "2025-01-01T10:05:00Z" }),
      am("P2", "P", "insert", { status: "pending", filedAt: "2025-01-01T10:06:00Z" }),
      am("Q", "s2", "insert", { status: "pending", filedAt: "2025-01-01T10:07:00Z" }),
      am("F", "s1", "insert", { status: "filed" }),
    ];
    const t = buildTree(measure, rows, { perfectingUnderSubstitute: "second-degree" });
    expect(t.nodes.P).toMatchObject({ degree: 2, slot: "S", role: "perfecting-under-substitute", underSubstitute: "S", root: "s1" });
    expect(t.nodes.P2).toMatchObject({ degree: 3, slot: "P" });
    // Another section is not the text S would strike out; a merely filed amendment is not yet made.
    expect([t.nodes.Q.degree, t.nodes.F.degree]).toEqual([1, 1]);
    expect(buildTree(measure, rows).nodes.P).toMatchObject({ degree: 1, role: "perfecting", underSubstitute: null });
    // Made before the substitute, the perfecting amendment stays first degree.
    const earlier = buildTree(measure, [{ ...rows[0], filedAt: "2025-01-01T11:00:00Z" }, rows[1]], { perfectingUnderSubstitute: "second-degree" });
    expect(earlier.nodes.P.degree).toBe(1);
  });

  it("orders pending amendments by filing time, then input order", () => {
    const rows = [am("X", "s1", "insert", { status: "pending" }), am("Y", "s1", "insert", { status: "pending", filedAt: "2025-01-01T10:00:00Z" }), am("Z", "s1", "insert", { status: "filed" }), am("W", "s1", "insert", { status: "pending" })];
    expect(pendingOrder(rows).map((r) => r.id)).toEqual(["Y", "X", "W"]);
    expect(buildTree(measure, rows).pending).toEqual(["Y", "X", "W"]);
  });

  it("lists what falls with an amendment: every amendment below it", () => {
    const t = buildTree(measure, [am("A", "s1"), am("A2", "A"), am("A3", "A2"), am("C", "s2")]);
    expect(amendmentsBelow(t, "A")).toEqual(["A2", "A3"]);
    expect(amendmentsBelow(t, "s1")).toEqual(["A", "A2", "A3"]);
    expect(amendmentsBelow(t, "C")).toEqual([]);
  });

  it("handles a chain of 3000 amendments without exhausting the stack", () => {
    const rows = [am("A0", "s1"), ...Array.from({ length: 2999 }, (_, i) => am(`A${i + 1}`, `A${i}`))];
    expect(buildTree(measure, rows.reverse()).nodes.A2999.degree).toBe(3000);
  });
});

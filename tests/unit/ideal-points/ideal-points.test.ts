// Ideal points from recorded votes (issue 19, item 3): src/lib/ideal-points/.
// External check: the 109th U.S. Senate recorded votes (pscl 1.5.5 data `s109`) against pscl's
// `ideal()` posterior means, recomputed by tests/fixtures/ideal-points/recompute.R (settings there).
import { describe, expect, it } from "vitest";
import { estimateIdealPoints } from "../../../src/lib/ideal-points/ideal-points.ts";
import { isGavelError } from "../../../src/lib/errors.ts";
import { syntheticRollCalls } from "../../../bench/ideal-points-data.ts";
import { pearson, reference, s109, s109Votes } from "./s109.ts";

function gavelError(f: () => unknown) {
  try {
    f();
  } catch (e) {
    if (isGavelError(e)) return e;
    throw e;
  }
  throw new Error("expected a GavelError");
}

/**
 * Worked example checked by hand: five members A–E on a line, four roll calls, each splitting the
 * line once (A | BCDE, AB | CDE, ABC | DE, ABCD | E) — a perfect one-dimensional ordering (Guttman
 * scale). Any estimate that classifies every vote correctly must place the members in the order
 * A < B < C < D < E (each adjacent pair is separated by one cutting point), and by the symmetry of the
 * data (reversing the order and swapping yea and nay gives the same votes) C sits at the mean, 0, and
 * B, D (and A, E) mirror each other.
 */
const fiveMembers = [
  { id: "v1", yea: ["A"], nay: ["B", "C", "D", "E"] },
  { id: "v2", yea: ["A", "B"], nay: ["C", "D", "E"] },
  { id: "v3", yea: ["A", "B", "C"], nay: ["D", "E"] },
  { id: "v4", yea: ["A", "B", "C", "D"], nay: ["E"] },
];

describe("worked example: five members, four roll calls, a perfect ordering", () => {
  const r = estimateIdealPoints({ dimensions: 1, votes: fiveMembers, minVotes: 1, direction: { left: "A", right: "E" } });
  const x = Object.fromEntries(r.members.map((m) => [m.id, m.ideal[0]]));
  it("recovers the order exactly and the symmetry of the data", () => {
    expect(r.members.map((m) => m.id).sort((p, q) => x[p] - x[q])).toEqual(["A", "B", "C", "D", "E"]);
    expect(x.C).toBeCloseTo(0, 6);
    expect(x.B).toBeCloseTo(-x.D, 6);
    expect(x.A).toBeCloseTo(-x.E, 6);
  });
  it("is normalised to mean 0, variance 1", () => {
    const v = Object.values(x);
    expect(v.reduce((a, b) => a + b, 0) / 5).toBeCloseTo(0, 6);
    expect(v.reduce((a, b) => a + b * b, 0) / 5).toBeCloseTo(1, 5);
  });
  it("classifies every vote, so the APRE is 1, and each cutting point lies between the members it separates", () => {
    expect(r.fit).toMatchObject({ classification: 1, apre: 1, votesClassified: 20 });
    const order = ["A", "B", "C", "D", "E"];
    r.votes.forEach((v, j) => {
      const cut = v.cut!.at * v.cut!.normal[0];
      expect(cut).toBeGreaterThan(x[order[j]]);
      expect(cut).toBeLessThan(x[order[j + 1]]);
      // yea lies left (members A…): the normal points left.
      expect(v.cut!.normal[0]).toBe(-1);
    });
  });
  it("the direction chosen by the clerk orients the dimension", () => {
    const flipped = estimateIdealPoints({ dimensions: 1, votes: fiveMembers, minVotes: 1, direction: { left: "E", right: "A" } });
    const y = Object.fromEntries(flipped.members.map((m) => [m.id, m.ideal[0]]));
    for (const k of Object.keys(x)) expect(y[k]).toBeCloseTo(-x[k], 6);
  });
  it("in two dimensions the first dimension keeps the order", () => {
    const two = estimateIdealPoints({ dimensions: 2, votes: fiveMembers, minVotes: 1, direction: { left: "A", right: "E" } });
    const first = Object.fromEntries(two.members.map((m) => [m.id, m.ideal[0]]));
    expect(Object.keys(first).sort((p, q) => first[p] - first[q])).toEqual(["A", "B", "C", "D", "E"]);
    expect(two.fit.classification).toBe(1);
    for (const v of two.votes) expect(Math.hypot(...v.cut!.normal)).toBeCloseTo(1, 5);
  });
});

describe("leaving out lopsided roll calls and members with few votes (defaults 2.5% and 20)", () => {
  it("counts what it leaves out", () => {
    const input = syntheticRollCalls(30, 40, 3);
    const votes = [...input.votes, { id: "unanimous", yea: Array.from({ length: 30 }, (_, i) => `m${i + 1}`), nay: [] }, { id: "few", yea: ["late"], nay: ["m1"] }];
    const r = estimateIdealPoints({ ...input, votes, bootstrap: 0 });
    expect(r.votes.find((v) => v.id === "unanimous")).toMatchObject({ used: false, reason: "lopsided", yea: 30, nay: 0 });
    expect(r.excluded.members).toEqual([{ id: "late", votes: 1 }]);
    expect(r.members.some((m) => m.id === "late")).toBe(false);
    expect(r.excluded.lopsidedVotes).toBe(r.votes.filter((v) => !v.used).length);
  });
  it("a minority of exactly 2.5% is kept, just under is left out", () => {
    const ids = Array.from({ length: 80 }, (_, i) => `m${i}`);
    const base = syntheticRollCalls(80, 30, 5).votes.map((v) => ({ ...v, yea: v.yea.map((s) => `m${Number(s.slice(1)) - 1}`), nay: v.nay.map((s) => `m${Number(s.slice(1)) - 1}`) }));
    const two = { id: "two", yea: ids.slice(0, 2), nay: ids.slice(2) }; // 2 of 80 = 2.5%
    const one = { id: "one", yea: ids.slice(0, 1), nay: ids.slice(1) }; // 1.25%
    const r = estimateIdealPoints({ dimensions: 1, votes: [...base, two, one], bootstrap: 0 });
    expect(r.votes.find((v) => v.id === "two")!.used).toBe(true);
    expect(r.votes.find((v) => v.id === "one")!.used).toBe(false);
  });
});

describe("109th U.S. Senate against pscl 1.5.5 ideal() (recompute.R)", () => {
  const r = estimateIdealPoints({ dimensions: 1, votes: s109Votes(), members: s109.members.map((m) => m.id), bootstrap: 0, direction: { left: "KENNEDY (D MA)", right: "FRIST (R TN)" } });
  const mine = new Map(r.members.map((m) => [m.id, m.ideal[0]]));
  const party = new Map(s109.members.map((m) => [m.id, m.party]));
  it("uses the same roll calls and senators as the reference", () => {
    expect(r.votes.filter((v) => v.used).map((v) => v.id)).toEqual(reference.usedRollcalls);
    expect(r.members.map((m) => m.id).sort()).toEqual([...reference.usedMembers].sort());
    expect(r.fit.votesClassified).toBe(reference.votesClassified);
  });
  it("ideal points correlate with pscl's posterior means at |r| ≥ 0.97", () => {
    const ours = reference.usedMembers.map((id) => mine.get(id)!);
    expect(Math.abs(pearson(ours, reference.ideal))).toBeGreaterThanOrEqual(0.97);
  });
  it("the parties separate: Democrats left of Republicans, a single cut misplacing no more senators than the reference's", () => {
    const misplaced = (xs: Array<[number, string]>) => {
      const sorted = xs.filter(([, p]) => p === "D" || p === "R").sort((a, b) => a[0] - b[0]);
      let best = Infinity;
      for (let k = 0; k <= sorted.length; k++) {
        const errs = sorted.slice(0, k).filter(([, p]) => p === "R").length + sorted.slice(k).filter(([, p]) => p === "D").length;
        best = Math.min(best, errs);
      }
      return best;
    };
    const ours: Array<[number, string]> = r.members.map((m) => [m.ideal[0], party.get(m.id)!]);
    const refSign = Math.sign(pearson(reference.usedMembers.map((id) => mine.get(id)!), reference.ideal));
    const theirs: Array<[number, string]> = reference.usedMembers.map((id, i) => [refSign * reference.ideal[i], party.get(id)!]);
    const mean = (p: string) => ours.filter(([, q]) => q === p).reduce((a, [x]) => a + x, 0) / ours.filter(([, q]) => q === p).length;
    expect(mean("R") - mean("D")).toBeGreaterThan(1.5);
    expect(misplaced(ours)).toBeLessThanOrEqual(Math.max(2, misplaced(theirs)));
  });
  it("classification within one percentage point of the reference model's", () => {
    expect(Math.abs(r.fit.classification - reference.classification)).toBeLessThanOrEqual(0.01);
    expect(r.fit.apre).toBeGreaterThan(0.6);
  });
});

describe("uncertainty, determinism and input", () => {
  const input = syntheticRollCalls(40, 60, 11);
  it("the parametric bootstrap gives positive standard errors, the same for the same seed", () => {
    const a = estimateIdealPoints({ ...input, bootstrap: 8, seed: 4 });
    const b = estimateIdealPoints({ ...input, bootstrap: 8, seed: 4 });
    expect(a).toEqual(b);
    for (const m of a.members) expect(m.se![0]).toBeGreaterThan(0);
    const c = estimateIdealPoints({ ...input, bootstrap: 8, seed: 5 });
    expect(c.members.map((m) => m.se)).not.toEqual(a.members.map((m) => m.se));
    expect(c.members.map((m) => m.ideal)).toEqual(a.members.map((m) => m.ideal));
  });
  it("two dimensions: normalised, se per dimension", () => {
    const r = estimateIdealPoints({ ...syntheticRollCalls(40, 80, 12, 2), bootstrap: 3 });
    for (let k = 0; k < 2; k++) {
      const v = r.members.map((m) => m.ideal[k]);
      expect(v.reduce((a, b) => a + b, 0) / v.length).toBeCloseTo(0, 4);
      expect(v.reduce((a, b) => a + b * b, 0) / v.length).toBeCloseTo(1, 3);
    }
    const cov = r.members.reduce((a, m) => a + m.ideal[0] * m.ideal[1], 0) / r.members.length;
    expect(cov).toBeCloseTo(0, 3);
    expect(r.members[0].se).toHaveLength(2);
  });
  it("cancellation stops the estimate", () => {
    const e = gavelError(() => estimateIdealPoints(input, { shouldCancel: () => true }));
    expect(e.details).toMatchObject({ cancelled: true });
  });
  it.each([
    [{ dimensions: 3, votes: fiveMembers }, "dimensions"],
    [{ dimensions: 1, votes: [{ id: "", yea: [], nay: [] }] }, "votes.0.id"],
    [{ dimensions: 1, votes: [{ id: "v", yea: ["x".repeat(201)], nay: [] }] }, "votes.0.yea.0"],
    [{ dimensions: 1, votes: [{ id: "v", yea: ["a"], nay: ["a"] }] }, "votes.0.nay.0"],
    [{ dimensions: 1, votes: [...fiveMembers, fiveMembers[0]] }, "votes.4.id"],
    [{ dimensions: 1, votes: fiveMembers, members: ["A", "B"] }, "votes.0.nay.1"],
    [{ dimensions: 1, votes: fiveMembers, direction: { left: "A", right: "Z" } }, "direction.right"],
  ])("bad input names the field (%#)", (input, path) => {
    const e = gavelError(() => estimateIdealPoints({ minVotes: 1, ...input }));
    expect(e.code).toBe("invalid-input");
    expect(e.issues.map((i) => i.path)).toContain(path);
  });
});

describe("the EM iteration", () => {
  it("SQUAREM acceleration reaches the plain EM's fixed point", async () => {
    const { buildMatrix, runEm, startValues } = await import("../../../src/lib/ideal-points/em.ts");
    const input = syntheticRollCalls(30, 50, 21);
    const ids = new Map<string, number>();
    const cells: Array<{ member: number; vote: number; yea: boolean }> = [];
    input.votes.forEach((v, j) => {
      for (const [list, yea] of [[v.yea, true], [v.nay, false]] as const) for (const m of list) cells.push({ member: ids.get(m) ?? (ids.set(m, ids.size), ids.size - 1), vote: j, yea });
    });
    const m = buildMatrix(ids.size, input.votes.length, cells);
    const start = startValues(m, 1);
    const plain = runEm(m, start, { accelerate: false, tolerance: 1e-13, maxIterations: 20_000 });
    const fast = runEm(m, start, { tolerance: 1e-13, maxIterations: 20_000 });
    expect(plain.converged && fast.converged).toBe(true);
    expect(fast.iterations).toBeLessThan(plain.iterations);
    for (let i = 0; i < plain.x.length; i++) expect(fast.x[i]).toBeCloseTo(plain.x[i], 3);
  });
});

// Property tests on random small instances against plain brute force written in helpers.ts.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { shepsleWeingast } from "../../../src/lib/voting/amendment-agenda.ts";
import { sincereCounts, sophisticatedCounts } from "../../../src/lib/voting/agenda-counts.ts";
import { banksSet } from "../../../src/lib/voting/banks-set.ts";
import { countLegalOrders } from "../../../src/lib/voting/count-orders.ts";
import { legalOrderPage, legalOrders } from "../../../src/lib/voting/legal-orders.ts";
import { precedence } from "../../../src/lib/voting/precedence.ts";
import { profileFromRankings } from "../../../src/lib/voting/profile.ts";
import { majorityGraph } from "../../../src/lib/voting/majority-graph.ts";
import { sincereSuccessive } from "../../../src/lib/voting/successive-agenda.ts";
import { topCycle } from "../../../src/lib/voting/top-cycle.ts";
import { uncoveredSet, UNCOVERED_VARIANTS } from "../../../src/lib/voting/uncovered-set.ts";
import { schwartzSet } from "../../../src/lib/voting/schwartz-set.ts";
import { bruteBanks, bruteSincere, bruteSophisticated, bruteSophisticatedSuccessive, bruteTopCycle, graphFromPairs, permutations, range, respects } from "./helpers.ts";

const pairsCount = (n: number) => (n * (n - 1)) / 2;
const tournament = (lo: number, hi: number) => fc.integer({ min: lo, max: hi }).chain((n) => fc.tuple(fc.constant(n), fc.array(fc.constantFrom(1, -1), { minLength: pairsCount(n), maxLength: pairsCount(n) })));
const weakTournament = (lo: number, hi: number) => fc.integer({ min: lo, max: hi }).chain((n) => fc.tuple(fc.constant(n), fc.array(fc.constantFrom(1, 0, -1), { minLength: pairsCount(n), maxLength: pairsCount(n) })));
/** Random acyclic constraints: pairs (a, b) with a < b in a random relabelling. */
const constrained = (lo: number, hi: number) =>
  weakTournament(lo, hi).chain(([n, cells]) =>
    fc.tuple(fc.constant(n), fc.constant(cells), fc.shuffledSubarray(range(n), { minLength: n, maxLength: n }), fc.array(fc.tuple(fc.nat(n - 1), fc.nat(n - 1)), { maxLength: n })).map(([n2, c, perm, raw]) => {
      const before = raw.filter(([a, b]) => a < b).map(([a, b]) => [perm[a], perm[b]] as [number, number]);
      return { n: n2, cells: c, before };
    }),
  );
const tally = (outcomes: number[], n: number) => {
  const out = new Array<number>(n).fill(0);
  for (const o of outcomes) out[o]++;
  return out;
};

describe("tournaments: Miller 1977 and Banks 1985 (docs/sources.md §2)", () => {
  it("sincere outcomes over all orders = top cycle; sophisticated = Banks set", () => {
    fc.assert(
      fc.property(tournament(2, 6), ([n, cells]) => {
        const g = graphFromPairs(n, cells);
        const prec = precedence(n, []);
        const sinc = sincereCounts(g, prec, "amendment", null).flatMap((c, i) => (c ? [i] : []));
        const soph = sophisticatedCounts(g, prec, "amendment").flatMap((c, i) => (c ? [i] : []));
        expect(sinc).toEqual(bruteTopCycle(g));
        expect(soph).toEqual(bruteBanks(g));
      }),
      { numRuns: 150 },
    );
  });
  it("Banks ⊆ uncovered ⊆ top cycle, every variant; the search equals brute force up to 9 alternatives", () => {
    fc.assert(
      fc.property(tournament(1, 9), ([n, cells]) => {
        const g = graphFromPairs(n, cells);
        const tc = topCycle(g);
        const banks = banksSet(g);
        expect(banks.complete).toBe(true);
        expect(banks.members).toEqual(bruteBanks(g));
        expect(tc).toEqual(bruteTopCycle(g));
        for (const v of UNCOVERED_VARIANTS) {
          const uc = uncoveredSet(g, v);
          expect(banks.members.every((x) => uc.includes(x))).toBe(true);
          expect(uc.every((x) => tc.includes(x))).toBe(true);
        }
      }),
      { numRuns: 200 },
    );
  });
  it("swapping x1 and x2 changes neither outcome", () => {
    fc.assert(
      fc.property(tournament(2, 7), fc.infiniteStream(fc.nat()), ([n, cells], seeds) => {
        const g = graphFromPairs(n, cells);
        const order = range(n).sort((a, b) => ((seeds.next().value as number) % 3) - 1 || a - b);
        const swapped = [order[1], order[0], ...order.slice(2)];
        expect(bruteSincere(g, swapped)).toBe(bruteSincere(g, order));
        expect(shepsleWeingast(g, swapped).outcome).toBe(shepsleWeingast(g, order).outcome);
      }),
      { numRuns: 200 },
    );
  });
});

describe("weak tournaments (ties): the tie rule of docs/sources.md §1", () => {
  it("Shepsle–Weingast equals full backward induction on every order", () => {
    fc.assert(
      fc.property(weakTournament(2, 6), ([n, cells]) => {
        const g = graphFromPairs(n, cells);
        for (const order of permutations(range(n))) expect(shepsleWeingast(g, order).outcome).toBe(bruteSophisticated(g, order));
      }),
      { numRuns: 60 },
    );
  });
  it("Banks (search) equals brute force, and lies within the Bordes uncovered set and the top cycle", () => {
    fc.assert(
      fc.property(weakTournament(1, 8), ([n, cells]) => {
        const g = graphFromPairs(n, cells);
        const banks = banksSet(g).members;
        expect(banks).toEqual(bruteBanks(g));
        const uc = uncoveredSet(g, "bordes");
        const tc = topCycle(g);
        expect(banks.every((x) => uc.includes(x)) && uc.every((x) => tc.includes(x))).toBe(true);
        expect(schwartzSet(g).every((x) => tc.includes(x))).toBe(true);
      }),
      { numRuns: 200 },
    );
  });
});

describe("the counting DP equals brute-force enumeration (docs/sources.md §2)", () => {
  it("amendment and successive, sincere and sophisticated, with and without constraints", () => {
    fc.assert(
      fc.property(constrained(1, 6), ({ n, cells, before }) => {
        const g = graphFromPairs(n, cells);
        for (const cons of [[], before]) {
          const prec = precedence(n, cons);
          const legal = [...permutations(range(n))].filter((o) => respects(o, cons));
          expect(countLegalOrders(prec)).toBe(legal.length);
          expect(sincereCounts(g, prec, "amendment", null)).toEqual(tally(legal.map((o) => bruteSincere(g, o)), n));
          expect(sophisticatedCounts(g, prec, "amendment")).toEqual(tally(legal.map((o) => bruteSophisticated(g, o)), n));
          expect(sophisticatedCounts(g, prec, "successive")).toEqual(tally(legal.map((o) => bruteSophisticatedSuccessive(g, o)), n));
        }
      }),
      { numRuns: 120 },
    );
  });
  it("sincere successive from random ballots", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 2, max: 5 }).chain((n) => fc.tuple(fc.constant(n), fc.array(fc.record({ ranking: fc.shuffledSubarray(range(n)), weight: fc.integer({ min: 1, max: 3 }) }), { minLength: 1, maxLength: 6 }))),
        ([n, ballots]) => {
          const p = profileFromRankings(range(n).map(String), ballots, "abstain");
          const g = majorityGraph(p);
          const prec = precedence(n, []);
          const legal = [...permutations(range(n))];
          expect(sincereCounts(g, prec, "successive", p)).toEqual(tally(legal.map((o) => sincereSuccessive(p, "majority", o)), n));
        },
      ),
      { numRuns: 80 },
    );
  });
  it("the lazy generator lists exactly the legal orders, lexicographically, and pages join up", () => {
    fc.assert(
      fc.property(constrained(1, 6), fc.integer({ min: 1, max: 7 }), ({ n, before }, size) => {
        const prec = precedence(n, before);
        const expected = [...permutations(range(n))].filter((o) => respects(o, before));
        expect([...legalOrders(prec)]).toEqual(expected);
        const paged: number[][] = [];
        for (let page = 1; (page - 1) * size < expected.length; page++) paged.push(...legalOrderPage(prec, page, size));
        expect(paged).toEqual(expected);
      }),
      { numRuns: 100 },
    );
  });
});

describe("Banks set limits (banks-set.ts)", () => {
  it("with a tiny search budget the result is marked incomplete unless proven, and lists only true members", () => {
    fc.assert(
      fc.property(tournament(6, 10), ([n, cells]) => {
        const g = graphFromPairs(n, cells);
        const r = banksSet(g, { maxNodes: 1 });
        const truth = bruteBanks(g);
        expect(r.members.every((x) => truth.includes(x))).toBe(true);
        if (r.complete) expect(r.members).toEqual(truth);
      }),
      { numRuns: 100 },
    );
  });
  it("a top cycle above the exact limit falls back to greedy witnesses inside the uncovered set", () => {
    fc.assert(
      fc.property(tournament(32, 32), ([n, cells]) => {
        const g = graphFromPairs(n, cells);
        const r = banksSet(g);
        const uc = uncoveredSet(g);
        expect(r.members.every((x) => uc.includes(x))).toBe(true);
        if (topCycle(g).length > 30) expect(r.complete).toBe(r.members.length === topCycle(g).length);
      }),
      { numRuns: 10 },
    );
  });
});

/**
 * Banks set (Banks 1985, Soc. Choice Welf. 1:295–306): the tops of maximal transitive chains of the
 * majority relation; exactly the sophisticated outcomes of amendment agendas over all orders.
 * Membership is NP-complete (Woeginger 2003, Soc. Choice Welf. 20:523–528), so the search is exact
 * but bounded:
 *  - only the top cycle is searched: every top-cycle member beats every alternative outside it, so
 *    a chain is maximal iff its part inside the top cycle is maximal there;
 *  - a chain is grown downward from its top x; the state is (candidates beaten by the whole chain,
 *    alternatives beating the whole chain). The chain is maximal when the second set is empty. A state
 *    dies when some dominator beats every remaining candidate, and dead states are memoised.
 * Limits: at most BANKS_MAX_EXACT alternatives in the top cycle and `maxNodes` search steps (default
 * BANKS_MAX_NODES). Beyond either, a greedy chain builder adds the members it can prove and the result
 * is marked incomplete: every listed member is a true member, some members may be missing.
 *
 * "Beats every member of the chain" uses the strict relation, so on weak tournaments this is the set
 * of sophisticated outcomes under the tie rule (a tie defeats the motion), Shepsle–Weingast form.
 */
import type { MajorityGraph } from "./majority-graph.ts";
import { topCycle } from "./top-cycle.ts";

export const BANKS_MAX_EXACT = 30;
export const BANKS_MAX_NODES = 2_000_000;

export interface BanksResult {
  members: number[];
  complete: boolean;
}

class BudgetExhausted extends Error {}

/** Greedy witness: grow a chain under x, each time taking the candidate that leaves fewest dominators. */
function greedyMember(g: MajorityGraph, x: number, within: number[]): boolean {
  let cand = within.filter((y) => g.beats[x][y]);
  let dom = within.filter((z) => g.beats[z][x]);
  while (dom.length > 0) {
    let best = -1;
    let bestLeft = Infinity;
    for (const y of cand) {
      const left = dom.filter((z) => g.beats[z][y]).length;
      if (left < bestLeft) {
        bestLeft = left;
        best = y;
      }
    }
    if (best < 0) return false;
    const b = best;
    cand = cand.filter((y) => g.beats[b][y]);
    dom = dom.filter((z) => g.beats[z][b]);
  }
  return true;
}

export function banksSet(g: MajorityGraph, opts: { maxNodes?: number } = {}): BanksResult {
  const tc = topCycle(g);
  if (tc.length === 1) return { members: tc, complete: true };
  const found = new Set<number>();
  if (tc.length > BANKS_MAX_EXACT) {
    for (const x of tc) if (greedyMember(g, x, tc)) found.add(x);
    return { members: [...found].sort((a, b) => a - b), complete: found.size === tc.length };
  }
  const k = tc.length;
  const out = new Array<number>(k).fill(0);
  const into = new Array<number>(k).fill(0);
  for (let i = 0; i < k; i++)
    for (let j = 0; j < k; j++)
      if (g.beats[tc[i]][tc[j]]) {
        out[i] |= 1 << j;
        into[j] |= 1 << i;
      }
  const maxNodes = opts.maxNodes ?? BANKS_MAX_NODES;
  let nodes = 0;
  const dead = new Map<number, Set<number>>();
  const search = (cand: number, dom: number): boolean => {
    if (dom === 0) return true;
    for (let d = dom; d !== 0; d &= d - 1) {
      const z = 31 - Math.clz32(d & -d);
      if ((cand & ~out[z]) === 0) return false;
    }
    const seen = dead.get(cand);
    if (seen?.has(dom)) return false;
    if (++nodes > maxNodes) throw new BudgetExhausted();
    for (let c = cand; c !== 0; c &= c - 1) {
      const y = 31 - Math.clz32(c & -c);
      if (search(cand & out[y], dom & into[y])) return true;
    }
    if (seen) seen.add(dom);
    else dead.set(cand, new Set([dom]));
    return false;
  };
  let complete = true;
  for (let i = 0; i < k; i++) {
    if (!complete) {
      if (greedyMember(g, tc[i], tc)) found.add(tc[i]);
      continue;
    }
    try {
      if (search(out[i], into[i])) found.add(tc[i]);
    } catch (e) {
      if (!(e instanceof BudgetExhausted)) throw e;
      complete = false;
      if (greedyMember(g, tc[i], tc)) found.add(tc[i]);
    }
  }
  return { members: [...found].sort((a, b) => a - b), complete: complete || found.size === tc.length };
}

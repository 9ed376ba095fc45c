/**
 * Exact counts, over every legal order x1…xm, of the orders leading to each outcome, for the
 * amendment and successive procedures, sincere and sophisticated — without listing the orders
 * (docs/sources.md §2). Each is one run of the counting engine (count-orders.ts) with a small state machine:
 *  - sincere amendment, forward: state = current survivor; O(I·n²) for I order ideals;
 *  - sophisticated amendment, backward (x_m first): state = (alternatives not yet placed that beat
 *    every member of the Shepsle–Weingast chain, top of the chain); at most ~3^n states;
 *  - sophisticated successive, backward: state = o_{i+1};
 *  - sincere successive, backward: state = outcome of the suffix; the proposal passes or not given
 *    the set still available, which is the placed suffix.
 */
import { countOrders, type OrderMachine, type RunControl } from "./count-orders.ts";
import type { Count } from "./count-json.ts";
import { beatMasks, type MajorityGraph } from "./majority-graph.ts";
import type { Precedence } from "./precedence.ts";
import type { Profile } from "./profile.ts";
import { successivePasses } from "./successive-agenda.ts";

export type Procedure = "amendment" | "successive";

const NONE = 31;

function group(final: Map<number, Count>, outcomeOf: (s: number) => number, n: number): Count[] {
  const out: Count[] = new Array(n).fill(n > 18 ? 0n : 0);
  for (const [s, c] of final) {
    const o = outcomeOf(s);
    out[o] = (out[o] as number) + (c as number);
  }
  return out;
}

/** Counts by outcome (indexed like the alternatives) of sincere voting over all legal orders. */
export function sincereCounts(g: MajorityGraph, prec: Precedence, procedure: Procedure, profile: Profile | null, control?: RunControl): Count[] {
  const n = g.alternatives.length;
  if (procedure === "amendment") {
    const m: OrderMachine<number> = { start: NONE, step: (s, x) => (s === NONE ? x : g.beats[s][x] ? s : x) };
    return group(countOrders(prec, m, "forward", control), (s) => s, n);
  }
  if (!profile) throw new RangeError("sincere successive voting needs the members' rankings");
  const memo = new Map<number, boolean>();
  const passes = (x: number, suffix: number): boolean => {
    const key = suffix * 32 + x;
    let r = memo.get(key);
    if (r === undefined) {
      const avail = [x];
      for (let y = 0; y < n; y++) if (suffix & (1 << y)) avail.push(y);
      r = successivePasses(profile, g.threshold, x, avail);
      memo.set(key, r);
    }
    return r;
  };
  const m: OrderMachine<number> = { start: NONE, step: (s, x, placed) => (s === NONE ? x : passes(x, placed) ? x : s) };
  return group(countOrders(prec, m, "backward", control), (s) => s, n);
}

/** Counts by outcome of sophisticated voting over all legal orders. */
export function sophisticatedCounts(g: MajorityGraph, prec: Precedence, procedure: Procedure, control?: RunControl): Count[] {
  const n = g.alternatives.length;
  if (procedure === "successive") {
    const m: OrderMachine<number> = { start: NONE, step: (o, x) => (o === NONE ? x : g.beats[x][o] ? x : o) };
    return group(countOrders(prec, m, "backward", control), (s) => s, n);
  }
  const { into } = beatMasks(g);
  const all = n === 0 ? 0 : (2 ** n - 1) | 0;
  // State packs D (unplaced alternatives beating the whole chain) and the chain's top: D·32 + top.
  const m: OrderMachine<number> = {
    start: all * 32 + NONE,
    step: (s, x, placed) => {
      const top = s % 32;
      let d = (s - top) / 32;
      const rest = ~(placed | (1 << x));
      if (d & (1 << x)) return (d & into[x] & rest) * 32 + x;
      d &= rest;
      return (d >>> 0) * 32 + top;
    },
  };
  return group(countOrders(prec, m, "backward", control), (s) => s % 32, n);
}

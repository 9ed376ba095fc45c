/**
 * The counting engine: dynamic programming over order ideals (docs/sources.md §2, "counting outcomes without
 * listing orders"). Orders are built one item at a time — from the first position forward, or from
 * the last position backward — and a caller-supplied state machine folds each placed item into a
 * state. Orders that reach the same (placed set, state) are merged and counted together, so the cost
 * is the number of distinct such pairs, never the number of orders. Which item may come next is the
 * precedence's one availability rule (`availableMask`: the pairs, and the windows such as contiguous
 * blocks, which depend on the placed set); a partial order from which nothing can follow is dropped.
 *
 * Every count in the product (legal orders, outcomes of sincere and sophisticated voting, orders
 * of question trees) is one run of this engine; the sophisticated count on amendment trees runs it up
 * to a layer (`countOrderLayer`) and finishes the last positions depth first (question-counts.ts).
 * Counts are exact: float64 while n! < 2^53 (n ≤ 18; every partial count is at most n!), BigInt above.
 */
import { GavelError } from "../errors.ts";
import type { Count } from "./count-json.ts";
import { availableMask, type Precedence } from "./precedence.ts";

export interface OrderMachine<S extends number | string> {
  start: S;
  /** Fold `item` into `state`; `placed` is the set already placed (before this item). */
  step(state: S, item: number, placed: number): S;
}

export interface RunControl {
  /** Called after each position is filled, with the fraction done. */
  onProgress?: (fraction: number) => void;
  /** Polled regularly; returning true stops the run with a limit-exceeded error marked cancelled. */
  shouldCancel?: () => boolean;
  /** Stop with limit-exceeded beyond this many (placed set, state) pairs in one layer. */
  maxStates?: number;
}

/** About 300–600 MB of maps at the peak; beyond it a count stops with limit-exceeded instead of exhausting memory. */
export const DEFAULT_MAX_STATES = 4_000_000;

/**
 * Count, for every final state, the legal orders that reach it. `direction: "backward"` places the
 * last item first (so machines like the Shepsle–Weingast chain see x_m, x_{m−1}, …).
 */
export function countOrders<S extends number | string>(prec: Precedence, machine: OrderMachine<S>, direction: "forward" | "backward" = "forward", control: RunControl = {}): Map<S, Count> {
  const { n } = prec;
  const layer = countOrderLayer(prec, machine, direction, control, () => false);
  return layer.get(n === 0 ? 0 : (2 ** n - 1) | 0) ?? (n === 0 ? layer.get(0)! : new Map());
}

/**
 * The engine's layer once `stopAfter(placedCount, layer)` says so after a position is filled (or after the last):
 * for every placed set, the states reached and the number of partial orders reaching each. Callers that
 * finish the remaining positions another way use it.
 */
export function countOrderLayer<S extends number | string>(prec: Precedence, machine: OrderMachine<S>, direction: "forward" | "backward", control: RunControl, stopAfter: (placedCount: number, layer: Map<number, Map<S, Count>>) => boolean): Map<number, Map<S, Count>> {
  const { n } = prec;
  const useBig = n > 18;
  const one: Count = useBig ? 1n : 1;
  const maxStates = control.maxStates ?? DEFAULT_MAX_STATES;
  let layer = new Map<number, Map<S, Count>>([[0, new Map([[machine.start, one]])]]);
  let polled: number;
  for (let pos = 0; pos < n; pos++) {
    const next = new Map<number, Map<S, Count>>();
    let states = 0;
    polled = 0;
    for (const [placed, dist] of layer) {
      // Poll at the start of every layer and every 1024 sets within one.
      if (control.shouldCancel && (polled++ & 1023) === 0 && control.shouldCancel())
        throw new GavelError("limit-exceeded", "the analysis was cancelled", { details: { cancelled: true } });
      for (let avail = availableMask(prec, placed, direction); avail !== 0; avail &= avail - 1) {
        const x = 31 - Math.clz32(avail & -avail);
        const to = placed | (1 << x);
        let target = next.get(to);
        if (!target) {
          target = new Map();
          next.set(to, target);
        }
        for (const [state, count] of dist) {
          const s2 = machine.step(state, x, placed);
          const prev = target.get(s2);
          if (prev === undefined) {
            target.set(s2, count);
            if (++states > maxStates) throw new GavelError("limit-exceeded", `the count needs more than ${maxStates} states in one position`, { details: { states } });
          } else target.set(s2, (prev as number) + (count as number));
        }
      }
    }
    layer = next;
    control.onProgress?.((pos + 1) / n);
    if (pos + 1 < n && stopAfter(pos + 1, layer)) break;
  }
  return layer;
}

/** Number of legal orders (linear extensions). */
export function countLegalOrders(prec: Precedence, control?: RunControl): Count {
  const m = countOrders(prec, { start: 0, step: () => 0 }, "forward", control);
  return m.get(0) ?? (prec.n > 18 ? 0n : 0);
}

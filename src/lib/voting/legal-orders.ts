/**
 * Legal voting orders: the orders the precedence's availability rule allows (its pairs and its
 * windows, see precedence.ts), listed lazily in lexicographic order of item indices, one order at a
 * time (never all in memory). For a plain partial order these are its linear extensions; counting
 * them is #P-complete in general (Brightwell & Winkler 1991, Order 8:225–242), but pages of a few
 * dozen orders only need a simple successor step.
 *
 * A page can start at any rank: the rank is unranked with completion counts memoised per placed set
 * (at most 2^n of them), so page 1000 costs no more than page 1. The same counts tell the successor
 * step which partial orders can still be completed, so a window (a contiguous block) never leads the
 * listing into a dead end. Above MAX_UNRANK_ITEMS items the listing walks forward depth-first instead.
 */
import { GavelError } from "../errors.ts";
import { availableMask, type Precedence } from "./precedence.ts";

/** Unranking memoises completion counts per placed set; above this many items a page start is reached by skipping. */
export const MAX_UNRANK_ITEMS = 24;

type Counter = (placed: number) => bigint | number;

/** Number of ways to complete an order from the placed set (number while n! < 2^53, BigInt above). */
function completionCounter(prec: Precedence): Counter {
  const big = prec.n > 18;
  const memo = new Map<number, bigint | number>();
  const full = prec.n === 0 ? 0 : (2 ** prec.n - 1) | 0;
  const count = (placed: number): bigint | number => {
    if (placed === full) return big ? 1n : 1;
    const hit = memo.get(placed);
    if (hit !== undefined) return hit;
    let total: bigint | number = big ? 0n : 0;
    for (let avail = availableMask(prec, placed); avail !== 0; avail &= avail - 1) total = (total as number) + (count(placed | (avail & -avail)) as number);
    memo.set(placed, total);
    return total;
  };
  return count;
}

const lowest = (mask: number) => 31 - Math.clz32(mask & -mask);

/**
 * Fill positions from..n−1 with the lexicographically first completion; false if there is none. With
 * counts: the smallest item that can still be completed each time. Without (large n): depth-first.
 */
function completeSmallest(prec: Precedence, order: number[], from: number, count: Counter | null): boolean {
  let placed = 0;
  for (let i = 0; i < from; i++) placed |= 1 << order[i];
  if (!count) {
    const walk = (i: number, p: number): boolean => {
      if (i === prec.n) return true;
      for (let avail = availableMask(prec, p); avail !== 0; avail &= avail - 1) {
        order[i] = lowest(avail);
        if (walk(i + 1, p | (1 << order[i]))) return true;
      }
      return false;
    };
    return walk(from, placed);
  }
  for (let i = from; i < prec.n; i++) {
    let avail = availableMask(prec, placed);
    while (avail !== 0 && !count(placed | (avail & -avail))) avail &= avail - 1;
    if (avail === 0) return false;
    order[i] = lowest(avail);
    placed |= 1 << order[i];
  }
  return true;
}

/** The order after `order` in lexicographic order, in place; false when `order` was the last. */
function advance(prec: Precedence, order: number[], count: Counter | null): boolean {
  const n = prec.n;
  for (let i = n - 2; i >= 0; i--) {
    let placed = 0;
    for (let j = 0; j < i; j++) placed |= 1 << order[j];
    // Items above order[i] still available at position i, smallest first.
    let avail = availableMask(prec, placed) & ~((2 ** (order[i] + 1) - 1) | 0);
    for (; avail !== 0; avail &= avail - 1) {
      const y = lowest(avail);
      if (count && !count(placed | (1 << y))) continue;
      order[i] = y;
      if (completeSmallest(prec, order, i + 1, count)) return true;
    }
  }
  return false;
}

/** The order of the given 0-based rank in lexicographic order. */
function unrank(prec: Precedence, rank: bigint, count: Counter): number[] {
  const order: number[] = [];
  let placed = 0;
  for (let i = 0; i < prec.n; i++) {
    for (let avail = availableMask(prec, placed); avail !== 0; avail &= avail - 1) {
      const x = lowest(avail);
      const c = BigInt(count(placed | (1 << x)));
      if (rank < c) {
        order.push(x);
        placed |= 1 << x;
        break;
      }
      rank -= c;
    }
  }
  return order;
}

/** Lazily yield legal orders (arrays of item indices; each yielded array is a fresh copy), from `start`. */
export function* legalOrders(prec: Precedence, start: bigint = 0n): Generator<number[], void, undefined> {
  let order: number[];
  let count: Counter | null = null;
  if (prec.n > MAX_UNRANK_ITEMS) {
    order = new Array<number>(prec.n);
    if (!completeSmallest(prec, order, 0, null)) return;
    for (let skipped = 0n; skipped < start; skipped++) if (!advance(prec, order, null)) return;
  } else {
    count = completionCounter(prec);
    if (start >= BigInt(count(0))) return;
    order = unrank(prec, start, count);
  }
  do yield order.slice();
  while (advance(prec, order, count));
}

/** One page of legal orders (pages count from 1). */
export function legalOrderPage(prec: Precedence, page: number, pageSize: number): number[][] {
  if (!Number.isInteger(page) || page < 1) throw new GavelError("invalid-input", "page must be a positive integer", { issues: [{ path: "page", message: "must be a positive integer" }] });
  const out: number[][] = [];
  for (const o of legalOrders(prec, BigInt(page - 1) * BigInt(pageSize))) {
    out.push(o);
    if (out.length >= pageSize) break;
  }
  return out;
}

/**
 * Legal voting orders: the linear extensions of the precedence constraints, listed lazily in
 * lexicographic order of item indices, one order at a time (never all in memory). Counting them is
 * #P-complete in general (Brightwell & Winkler 1991, Order 8:225–242); constant-amortised-time
 * generation exists (Pruesse & Ruskey 1994, SIAM J. Comput. 23:373–386), but pages of a few dozen
 * orders only need this simple O(n²)-per-order successor step.
 *
 * A page can start at any rank: the rank is unranked with completion counts memoised per order
 * ideal (at most 2^n of them), so page 1000 costs no more than page 1.
 */
import { GavelError } from "../errors.ts";
import type { Precedence } from "./precedence.ts";

/** Unranking memoises completion counts per ideal; above this many items a page start is reached by skipping. */
export const MAX_UNRANK_ITEMS = 24;

function completionCounter(prec: Precedence): (placed: number) => bigint {
  const memo = new Map<number, bigint>();
  const full = prec.n === 0 ? 0 : (2 ** prec.n - 1) | 0;
  const count = (placed: number): bigint => {
    if (placed === full) return 1n;
    const hit = memo.get(placed);
    if (hit !== undefined) return hit;
    let total = 0n;
    for (let x = 0; x < prec.n; x++) if (!(placed & (1 << x)) && (prec.pred[x] & ~placed) === 0) total += count(placed | (1 << x));
    memo.set(placed, total);
    return total;
  };
  return count;
}

function available(prec: Precedence, placed: number, x: number): boolean {
  return !(placed & (1 << x)) && (prec.pred[x] & ~placed) === 0;
}

/** Fill positions from..n−1 with the smallest available item each time. */
function completeGreedy(prec: Precedence, order: number[], from: number): void {
  let placed = 0;
  for (let i = 0; i < from; i++) placed |= 1 << order[i];
  for (let i = from; i < prec.n; i++) {
    let x = 0;
    while (!available(prec, placed, x)) x++;
    order[i] = x;
    placed |= 1 << x;
  }
}

/** The order after `order` in lexicographic order, in place; false when `order` was the last. */
function advance(prec: Precedence, order: number[]): boolean {
  const n = prec.n;
  for (let i = n - 2; i >= 0; i--) {
    let placed = 0;
    for (let j = 0; j < i; j++) placed |= 1 << order[j];
    for (let y = order[i] + 1; y < n; y++) {
      if (available(prec, placed, y)) {
        order[i] = y;
        completeGreedy(prec, order, i + 1);
        return true;
      }
    }
  }
  return false;
}

/** The order of the given 0-based rank in lexicographic order. */
function unrank(prec: Precedence, rank: bigint, count: (placed: number) => bigint): number[] {
  const order: number[] = [];
  let placed = 0;
  for (let i = 0; i < prec.n; i++) {
    for (let x = 0; x < prec.n; x++) {
      if (!available(prec, placed, x)) continue;
      const c = count(placed | (1 << x));
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
  if (start === 0n || prec.n > MAX_UNRANK_ITEMS) {
    order = new Array<number>(prec.n);
    completeGreedy(prec, order, 0);
    for (let skipped = 0n; skipped < start; skipped++) if (!advance(prec, order)) return;
  } else {
    const count = completionCounter(prec);
    if (start >= count(0)) return;
    order = unrank(prec, start, count);
  }
  do yield order.slice();
  while (advance(prec, order));
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

/**
 * The rule that says which item of a voting order may come next, as bitmasks.
 *  - Precedence pairs ("a is voted before b"), transitively closed (DOMAIN §2). A cycle has no legal
 *    order and is rejected.
 *  - Windows: an item of `excludes` may not be placed while the set `span` is partly placed, i.e.
 *    between the first and the last member of `span` in the order. A contiguous block B is the window
 *    (span B, excludes everything outside B): once a block is open it must be finished before anything
 *    else is voted ("one primary amendment pending at a time"). The condition reads the same whether an
 *    order is built from its first position forward or from its last position backward, so every
 *    counting run (forward or backward) and the listing of orders share this one rule.
 * An item is available after the set `placed` exactly when its predecessors are all placed and no open
 * window excludes it (`availableMask`). With windows some partial orders lead nowhere (no item is
 * available although items remain); counting drops them and listing never enters them.
 */
import { GavelError } from "../errors.ts";

/** Orders are enumerated and counted over bitmasks of items; 2^n work bounds n well below this. */
export const MAX_ORDER_ITEMS = 30;

export interface OrderWindow {
  /** While some but not all of these items are placed… */
  span: number;
  /** …none of these may be placed. */
  excludes: number;
}

export interface Precedence {
  n: number;
  /** pred[x]: items that must come before x (transitively closed). */
  pred: number[];
  /** succ[x]: items that must come after x (transitively closed). */
  succ: number[];
  /** Windows (contiguous blocks and "not between" rules); empty for a plain partial order. */
  windows: OrderWindow[];
}

export function precedence(n: number, before: ReadonlyArray<readonly [number, number]>, path = "constraints", windows: readonly OrderWindow[] = []): Precedence {
  if (n > MAX_ORDER_ITEMS) throw new GavelError("limit-exceeded", `at most ${MAX_ORDER_ITEMS} items can be ordered; got ${n}`, { issues: [{ path, message: "too many items" }] });
  const pred = new Array<number>(n).fill(0);
  for (const [a, b] of before) {
    if (a === b) throw new GavelError("unprocessable", "an item cannot be voted before itself", { issues: [{ path, message: "item constrained before itself" }] });
    pred[b] |= 1 << a;
  }
  // Close transitively: pred[x] ∪= pred[y] for y ∈ pred[x], until stable.
  for (let changed = true; changed; ) {
    changed = false;
    for (let x = 0; x < n; x++) {
      let p = pred[x];
      for (let m = pred[x]; m !== 0; m &= m - 1) p |= pred[31 - Math.clz32(m & -m)];
      if (p !== pred[x]) {
        pred[x] = p;
        changed = true;
      }
    }
  }
  for (let x = 0; x < n; x++)
    if (pred[x] & (1 << x)) throw new GavelError("unprocessable", "the ordering constraints form a cycle, so no voting order is legal", { issues: [{ path, message: "constraints form a cycle" }] });
  const succ = new Array<number>(n).fill(0);
  for (let x = 0; x < n; x++) for (let m = pred[x]; m !== 0; m &= m - 1) succ[31 - Math.clz32(m & -m)] |= 1 << x;
  const all = n === 0 ? 0 : (2 ** n - 1) | 0;
  // Windows that can never exclude anything (a span of one item, or nothing excluded) are dropped.
  const kept = windows.map((w) => ({ span: w.span & all, excludes: w.excludes & all & ~w.span })).filter((w) => (w.span & (w.span - 1)) !== 0 && w.excludes !== 0);
  const seen = new Set<string>();
  const unique = kept.filter((w) => {
    const key = `${w.span}:${w.excludes}`;
    return seen.has(key) ? false : (seen.add(key), true);
  });
  return { n, pred, succ, windows: unique };
}

/**
 * Items that may be placed next, given the set already placed. `direction: "backward"` reads
 * `placed` as the suffix already placed (the last items of the order) and places the item before it.
 */
export function availableMask(prec: Precedence, placed: number, direction: "forward" | "backward" = "forward"): number {
  const req = direction === "forward" ? prec.pred : prec.succ;
  let mask = 0;
  for (let x = 0; x < prec.n; x++) if (!(placed & (1 << x)) && (req[x] & ~placed) === 0) mask |= 1 << x;
  for (const w of prec.windows) {
    const inSpan = placed & w.span;
    if (inSpan !== 0 && inSpan !== w.span) mask &= ~w.excludes;
  }
  return mask;
}

/** Whether `order` (every item exactly once) satisfies the pairs and the windows. */
export function isLegalOrder(prec: Precedence, order: readonly number[]): boolean {
  if (order.length !== prec.n) return false;
  let placed = 0;
  for (const x of order) {
    if (!(availableMask(prec, placed) & (1 << x))) return false;
    placed |= 1 << x;
  }
  return true;
}

/**
 * Precedence constraints on the items of a voting order ("a is voted before b"), as bitmasks.
 * Legal orders are the linear extensions of this partial order (DOMAIN §2). A cycle has no legal
 * order and is rejected.
 */
import { GavelError } from "../errors.ts";

/** Orders are enumerated and counted over bitmasks of items; 2^n work bounds n well below this. */
export const MAX_ORDER_ITEMS = 30;

export interface Precedence {
  n: number;
  /** pred[x]: items that must come before x (transitively closed). */
  pred: number[];
  /** succ[x]: items that must come after x (transitively closed). */
  succ: number[];
}

export function precedence(n: number, before: ReadonlyArray<readonly [number, number]>, path = "constraints"): Precedence {
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
  return { n, pred, succ };
}

/**
 * Exact arithmetic for spatial inputs: every JSON number is read at its shortest round-trip decimal
 * representation (what JavaScript prints for it; up to 17 significant digits, normally exactly what
 * was written) and scaled by a common power of ten to a BigInt, so squared distances and every
 * comparison made from them are exact (docs/sources.md §2, spatial model).
 */
export interface Scaled {
  /** Each input times 10^scale, exactly. */
  values: bigint[];
  scale: number;
}

function parts(x: number): { digits: bigint; exp: number } {
  const [mant, e] = x.toExponential().split("e");
  const [int, frac = ""] = mant.split(".");
  return { digits: BigInt(int + frac), exp: Number(e) - frac.length };
}

export function scaleExactly(xs: readonly number[]): Scaled {
  const ps = xs.map(parts);
  const scale = Math.max(0, ...ps.map((p) => -p.exp));
  return { values: ps.map((p) => p.digits * 10n ** BigInt(p.exp + scale)), scale };
}

/** A scaled integer (or rational num/den) back to a JSON number (nearest double). */
export function unscale(v: bigint, scale: number, den: bigint = 1n): number {
  return Number(v) / Number(den) / 10 ** scale;
}

/** Exact decimal or fraction text of num / (den · 10^scale). */
export function exactText(num: bigint, scale: number, den: bigint = 1n): string {
  let d = den * 10n ** BigInt(scale);
  let nn = num;
  if (d < 0n) {
    d = -d;
    nn = -nn;
  }
  const gcd = (a: bigint, b: bigint): bigint => (b === 0n ? (a < 0n ? -a : a) : gcd(b, a % b));
  const g = gcd(nn, d) || 1n;
  nn /= g;
  d /= g;
  return d === 1n ? nn.toString() : `${nn}/${d}`;
}

/**
 * Normal-distribution helpers for the probit item-response model, written for speed and numerical
 * stability in the tails. The scaled complementary error function erfcx(z) = exp(z²)·erfc(z) uses
 * the Chebyshev fit of Numerical Recipes (Press et al., 2nd ed., §6.2, function `erfcc`, fractional
 * error below 1.2e-7 everywhere), whose form t·exp(-z² + P(t)) gives erfcx for z ≥ 0 without
 * underflow. The inverse Mills ratio φ(m)/Φ(m) = √(2/π) / erfcx(-m/√2) is then finite for every m.
 */
const SQRT1_2 = Math.SQRT1_2;
const SQRT_2_OVER_PI = 0.7978845608028654;

/** exp(z²)·erfc(z). */
export function erfcx(z: number): number {
  const a = z < 0 ? -z : z;
  const t = 1 / (1 + 0.5 * a);
  const v = t * Math.exp(-1.26551223 + t * (1.00002368 + t * (0.37409196 + t * (0.09678418 + t * (-0.18628806 + t * (0.27886807 + t * (-1.13520398 + t * (1.48851587 + t * (-0.82215223 + t * 0.17087277)))))))));
  // erfc(−a) = 2 − erfc(a), so erfcx(−a) = 2·exp(a²) − erfcx(a) (no recursion, so the engine inlines it).
  return z < 0 ? 2 * Math.exp(a * a) - v : v;
}

/** Standard normal distribution function Φ(m). */
export function normalCdf(m: number): number {
  const z = -m * SQRT1_2;
  if (z >= 0) return 0.5 * Math.exp(-z * z) * erfcx(z);
  return 1 - 0.5 * Math.exp(-z * z) * erfcx(-z);
}

/** Inverse Mills ratio φ(m)/Φ(m): the mean of a standard normal truncated to (-m, ∞) is m + this. */
export function millsRatio(m: number): number {
  return SQRT_2_OVER_PI / erfcx(-m * SQRT1_2);
}

/** Small seeded generator (mulberry32): the same seed gives the same bootstrap everywhere. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

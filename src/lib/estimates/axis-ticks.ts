/**
 * "Nice" axis ticks for a plot: steps of 1, 2 or 5 times a power of ten, chosen so that about
 * `target` ticks fall inside [min, max] — the usual rule of chart libraries (common practice, no
 * source). Values are rounded to the step's decimals so labels read "0.5", not "0.5000000001".
 */
export function niceStep(span: number, target = 6): number {
  if (!(span > 0) || !Number.isFinite(span)) return 1;
  const raw = span / Math.max(1, target);
  const power = 10 ** Math.floor(Math.log10(raw));
  // A little slack, so that a span of 0.001 and one of 0.000999… (floating-point rounding) agree.
  const f = raw / power - 1e-9;
  const nice = f <= 1 ? 1 : f <= 2 ? 2 : f <= 5 ? 5 : 10;
  return nice * power;
}

function decimals(step: number): number {
  return Math.max(0, -Math.floor(Math.log10(step) + 1e-9));
}

export function axisTicks(min: number, max: number, target = 6): number[] {
  if (!Number.isFinite(min) || !Number.isFinite(max)) return [];
  if (max < min) [min, max] = [max, min];
  if (max === min) return [Number(min.toFixed(6))];
  const step = niceStep(max - min, target);
  const d = decimals(step);
  const ticks: number[] = [];
  for (let v = Math.ceil(min / step - 1e-9) * step; v <= max + step * 1e-9; v += step) ticks.push(Number(v.toFixed(d)) + 0);
  // A step about as long as the range may leave fewer than two ticks inside it: ask for more.
  if (ticks.length < 2 && target < 64) return axisTicks(min, max, target * 2);
  return ticks.map((t) => (Object.is(t, -0) ? 0 : t));
}

export function tickLabel(v: number): string {
  return String(Object.is(v, -0) ? 0 : v);
}

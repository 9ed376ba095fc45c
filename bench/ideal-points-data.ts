/**
 * Seeded synthetic recorded votes for the ideal-point benchmark: members spread on a line (or in a
 * plane), roll calls with random cut points, votes drawn from the probit model, about 5% absences.
 */
import { seededRandom } from "../src/lib/ideal-points/normal.ts";
import type { IdealPointsInput } from "../src/lib/ideal-points/ideal-points.ts";

export function syntheticRollCalls(members: number, votes: number, seed = 7, dimensions: 1 | 2 = 1): IdealPointsInput {
  const rnd = seededRandom(seed);
  const gauss = () => Math.sqrt(-2 * Math.log(rnd() || 1e-12)) * Math.cos(2 * Math.PI * rnd());
  const ids = Array.from({ length: members }, (_, i) => `m${i + 1}`);
  const xs = ids.map(() => Array.from({ length: dimensions }, gauss));
  const out: IdealPointsInput["votes"] = [];
  for (let j = 0; j < votes; j++) {
    const beta = Array.from({ length: dimensions }, () => gauss() * 2.5);
    const alpha = gauss() * 0.8;
    const yea: string[] = [];
    const nay: string[] = [];
    ids.forEach((id, i) => {
      if (rnd() < 0.05) return;
      const u = alpha + beta.reduce((a, b, k) => a + b * xs[i][k], 0) + gauss();
      (u > 0 ? yea : nay).push(id);
    });
    out.push({ id: `v${j + 1}`, yea, nay });
  }
  return { dimensions, votes: out, direction: { left: ids[0], right: ids[1] } };
}

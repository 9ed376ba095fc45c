/**
 * A ranked ballot as "places" (one number per version, 1 = best, equal numbers = a tie, blank =
 * unranked) and back: the shape a table editor shows, one column per version. Weak orders with
 * unranked alternatives, as in the estimate's ballots (docs/sources.md §1; partial ballots follow the
 * estimate's convention). Only the order of the numbers matters: places 1, 1, 3 and 2, 2, 7 are
 * the same ballot.
 */
export type Ranking = Array<string | string[]>;

/** Places → ranking, best first; versions sharing a place are one tied group. */
export function rankingFromPlaces(places: Readonly<Record<string, number | null | undefined>>, order: readonly string[]): Ranking {
  const byPlace = new Map<number, string[]>();
  for (const id of order) {
    const p = places[id];
    if (p === null || p === undefined) continue;
    if (!Number.isInteger(p) || p < 1) throw new RangeError(`place of ${id} must be a whole number from 1`);
    byPlace.set(p, [...(byPlace.get(p) ?? []), id]);
  }
  return [...byPlace.entries()].sort((a, b) => a[0] - b[0]).map(([, ids]) => (ids.length === 1 ? ids[0] : ids));
}

/** Ranking → places 1, 2, … (a tied group shares one place; the next place follows on). */
export function placesFromRanking(ranking: Readonly<Ranking>): Record<string, number> {
  const out: Record<string, number> = {};
  ranking.forEach((level, i) => {
    for (const id of typeof level === "string" ? [level] : level) out[id] = i + 1;
  });
  return out;
}

/**
 * A voting profile: weighted members, each holding a weak order over the alternatives.
 *
 * Each member's order is stored as levels (smaller is preferred; equal levels are indifference;
 * -1 means the member does not compare that alternative and abstains on every pair with it).
 * Partial ballots follow one of two conventions (DOMAIN §1): "abstain" (convention A: a ballot
 * counts for a pair only if it ranks both) or "bottom" (convention B: unranked alternatives sit
 * below all ranked ones, tied with each other).
 */
export interface Member {
  weight: number;
  level: Int32Array;
}

export interface Profile {
  alternatives: string[];
  /** The members whose votes are counted (the chair's ballot included unless kept apart). */
  members: Member[];
  /** Weight of `members`. */
  totalWeight: number;
  /**
   * The chair's ballot kept apart from the count (tie rule "chair-casting-vote"): it is added only when
   * the votes are equally divided. Counted as present (attendance), never among the votes cast.
   */
  chair?: Member;
}

/** Attending weight: every ballot, the chair's included (quorum; thresholds of the members present). */
export function attendingWeight(p: Profile): number {
  return p.totalWeight + (p.chair?.weight ?? 0);
}

export type PartialConvention = "abstain" | "bottom";

/** 1 if the member prefers x to y, -1 if y to x, 0 if indifferent, null if it abstains on the pair. */
export function memberPrefers(m: Member, x: number, y: number): 1 | -1 | 0 | null {
  const a = m.level[x];
  const b = m.level[y];
  if (a < 0 || b < 0) return null;
  return a < b ? 1 : a > b ? -1 : 0;
}

/** Weight preferring x to y and y to x. */
export function pairSupport(p: Profile, x: number, y: number): { forX: number; forY: number } {
  let forX = 0;
  let forY = 0;
  for (const m of p.members) {
    const r = memberPrefers(m, x, y);
    if (r === 1) forX += m.weight;
    else if (r === -1) forY += m.weight;
  }
  return { forX, forY };
}

/**
 * Build a profile from rankings of alternative indices; each ranking entry is one index or a
 * group of indices the member ranks equal. Indices must be valid and distinct (checked by the caller).
 */
export function profileFromRankings(
  alternatives: string[],
  ballots: ReadonlyArray<{ ranking: ReadonlyArray<number | readonly number[]>; weight: number; chair?: boolean }>,
  partial: PartialConvention,
  opts: { chairApart?: boolean } = {},
): Profile {
  const n = alternatives.length;
  let totalWeight = 0;
  let chair: Member | undefined;
  const members: Member[] = [];
  for (const b of ballots) {
    const level = new Int32Array(n).fill(partial === "abstain" ? -1 : b.ranking.length);
    b.ranking.forEach((entry, pos) => {
      for (const x of typeof entry === "number" ? [entry] : entry) level[x] = pos;
    });
    if (b.chair && opts.chairApart) {
      chair = { weight: b.weight, level };
      continue;
    }
    totalWeight += b.weight;
    members.push({ weight: b.weight, level });
  }
  return { alternatives, members, totalWeight, ...(chair ? { chair } : {}) };
}

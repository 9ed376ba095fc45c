/**
 * Whether a motion is adopted, given the weight for it, against it, and the base the threshold counts
 * against: the chamber's membership and the members present.
 *
 * Thresholds (ids in src/lib/procedure/voting-section.ts; docs/decisions/0008-thresholds-quorum-chair.md):
 *  - "majority": a majority of the votes cast (Robert's Rules of Order Revised, 1915, §46 p. 191:
 *    "a majority vote, that is a majority of the votes cast, ignoring blanks");
 *  - "two-thirds": "two-thirds of the votes cast, ignoring blanks" (RONR 1915 §48 p. 204);
 *  - "majority-of-members", "two-thirds-of-members", "three-fifths-of-members": that share of the whole
 *    membership votes for — counted against `members`, never against the ballots of an estimate
 *    (RONR 1915 §68 p. 270: "two-thirds of the members — that is, two-thirds of the entire membership");
 *  - "two-thirds-of-present": two-thirds of the members present vote for (RONR 1915 §48 p. 204);
 *  - a fixed number `{kind: "number", value}`: at least that many votes for, and more for than against
 *    (common practice, no source, for the second condition).
 * A tie defeats the motion under every threshold unless the tie rule gives the chair a casting vote
 * (`decides`). Weights are integers, so every comparison below is exact.
 */
import { GavelError } from "../errors.ts";
import { MEMBERSHIP_THRESHOLDS, VOTE_THRESHOLDS, type ThresholdSpec, type TieRule, type VoteThreshold } from "../procedure/voting-section.ts";

export type Threshold = Exclude<VoteThreshold, "none"> | { kind: "number"; value: number };
export const THRESHOLDS = VOTE_THRESHOLDS.filter((t): t is Exclude<VoteThreshold, "none"> => t !== "none");

/** "none" (no vote required) has no meaning for a contested question; it is read as a simple majority. */
export function toThreshold(t: VoteThreshold | ThresholdSpec): Threshold {
  return t === "none" ? "majority" : t;
}

/** A short, stable text for a threshold ("majority", "two-thirds-of-members", "16 votes"). */
export function thresholdText(t: Threshold | ThresholdSpec): string {
  return typeof t === "string" ? t : `${t.value} votes`;
}

export function needsMembership(t: Threshold | ThresholdSpec): boolean {
  return typeof t === "string" && (MEMBERSHIP_THRESHOLDS as readonly string[]).includes(t);
}

/**
 * What a threshold counts against. `members`: the chamber's membership (null when unknown: a threshold
 * "of the members" then cannot be decided); `present`: the attending weight.
 */
export interface VoteBase {
  members: number | null;
  present: number;
}

/** A bare number is the legacy base: the ballots given are the whole membership, all present. */
function baseOf(b: number | VoteBase): VoteBase {
  return typeof b === "number" ? { members: b, present: b } : b;
}

function membership(b: VoteBase): number {
  if (b.members === null)
    throw new GavelError("unprocessable", "a threshold of the members needs the chamber's membership (rulebook chamber.members)", { issues: [{ path: "rulebook.chamber.members", message: "set the number of members the threshold counts against" }] });
  return b.members;
}

export function adopts(forWeight: number, againstWeight: number, base: number | VoteBase, threshold: Threshold): boolean {
  const b = baseOf(base);
  if (typeof threshold === "object") return forWeight >= threshold.value && forWeight > againstWeight;
  switch (threshold) {
    case "majority":
      return forWeight > againstWeight;
    case "two-thirds":
      return forWeight > 0 && 3 * forWeight >= 2 * (forWeight + againstWeight);
    case "majority-of-members":
      return 2 * forWeight > membership(b);
    case "two-thirds-of-members":
      return forWeight > 0 && 3 * forWeight >= 2 * membership(b);
    case "three-fifths-of-members":
      return forWeight > 0 && 5 * forWeight >= 3 * membership(b);
    case "two-thirds-of-present":
      return forWeight > 0 && 3 * forWeight >= 2 * b.present;
  }
}

/** The chair's side on a question: 1 prefers the motion, −1 the alternative, 0 neither (or no chair). */
export type ChairSide = 1 | -1 | 0;

/**
 * The decision under the tie rule. `forWeight`/`againstWeight` are the members' votes; under
 * "chair-casting-vote" they exclude the chair (whose ballot is kept apart, with weight `chairWeight`),
 * and the chair's vote is added only when the votes are equally divided (at least one vote each way: a
 * question on which no member votes is not "divided"). Under the other rules the
 * chair's ballot, if any, is already among the members' votes: voting only when the vote affects the
 * result (RONR §46) gives the same decision as voting every time.
 */
export function decides(forWeight: number, againstWeight: number, base: number | VoteBase, threshold: Threshold, tieRule: TieRule = "motion-fails", chairSide: ChairSide = 0, chairWeight = 1): boolean {
  if (tieRule === "chair-casting-vote" && forWeight === againstWeight && forWeight > 0 && chairSide !== 0)
    return chairSide > 0 ? adopts(forWeight + chairWeight, againstWeight, base, threshold) : false;
  return adopts(forWeight, againstWeight, base, threshold);
}

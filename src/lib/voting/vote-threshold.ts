/**
 * Whether a motion is adopted, given the weight for it, against it, and of all members.
 *
 * Thresholds follow general parliamentary law (Robert's Rules of Order Revised, 1915 [PD]; DOMAIN §3):
 * a majority of the votes cast; two-thirds of the votes cast; a majority of all members.
 * A tie defeats the motion under every threshold, so the later-listed alternative survives.
 * Weights are integers, so every comparison below is exact.
 */
import { VOTE_THRESHOLDS, type VoteThreshold } from "../procedure/voting-section.ts";

export type Threshold = Exclude<VoteThreshold, "none">;
export const THRESHOLDS = VOTE_THRESHOLDS.filter((t): t is Threshold => t !== "none");

/** "none" (no vote required) has no meaning for a contested question; it is read as a simple majority. */
export function toThreshold(t: VoteThreshold): Threshold {
  return t === "none" ? "majority" : t;
}

export function adopts(forWeight: number, againstWeight: number, totalWeight: number, threshold: Threshold): boolean {
  switch (threshold) {
    case "majority":
      return forWeight > againstWeight;
    case "two-thirds":
      return forWeight > 0 && 3 * forWeight >= 2 * (forWeight + againstWeight);
    case "majority-of-members":
      return 2 * forWeight > totalWeight;
  }
}

/**
 * How a chamber's votes are taken (the `voting.methods` part of a rulebook), and what orders a
 * recorded vote. Methods:
 *  - "voice": the chair declares the result from the voices or a show of hands, without a count
 *    ("The ayes have it", Robert's Rules of Order Revised, 1915, §46 p. 190);
 *  - "division": the assembly divides (rising, standing or show of hands) and the votes are counted;
 *  - "recorded": a roll call — each member's vote is entered by name ("the yeas and nays").
 * What orders a recorded vote (`recordedOnDemand`):
 *  - "share-of-present": a demand by at least numerator/denominator of the members present. The US
 *    Constitution, art. I §5 cl. 3: "the Yeas and Nays of the Members of either House on any question
 *    shall, at the Desire of one fifth of those Present, be entered on the Journal" (1/5);
 *  - "majority-vote": the assembly orders it by a majority: "Where no rule has been adopted a majority
 *    vote is required to order a count, or that the vote be taken by ballot or by yeas and nays (roll
 *    call)" (Robert's Rules of Order Revised, 1915, §46 p. 190);
 *  - "any-member": one member's demand suffices.
 * Pure: the schema only; the floor record checks a vote against it.
 */
import { z } from "zod";

export const VOTING_METHODS = ["voice", "division", "recorded"] as const;
export type VotingMethod = (typeof VOTING_METHODS)[number];

/** A member's answer on a recorded vote. */
export const ROLL_POSITIONS = ["yea", "nay", "present", "not-voting", "recused"] as const;
export type RollPosition = (typeof ROLL_POSITIONS)[number];

const citation = z.string().trim().min(1).max(500);

export const recordedDemandSchema = z
  .object({
    kind: z.enum(["share-of-present", "majority-vote", "any-member"]),
    /** kind "share-of-present": the share of those present whose demand orders it (one fifth: 1/5). */
    numerator: z.number().int().min(1).max(100).optional(),
    denominator: z.number().int().min(1).max(100).optional(),
    citation,
  })
  .refine((d) => d.kind !== "share-of-present" || (d.numerator !== undefined && d.denominator !== undefined && d.numerator <= d.denominator), {
    message: "a share of those present needs a numerator and a denominator (numerator ≤ denominator)",
    path: ["numerator"],
  });
export type RecordedDemand = z.output<typeof recordedDemandSchema>;

export const votingMethodsSchema = z.object({
  /** The ways the chamber takes a vote; the floor record refuses any other. */
  available: z.array(z.enum(VOTING_METHODS)).min(1).max(VOTING_METHODS.length),
  /** What orders a recorded vote; absent: the rulebook does not say (any recorded vote is accepted). */
  recordedOnDemand: recordedDemandSchema.optional(),
  citation,
});
export type VotingMethods = z.output<typeof votingMethodsSchema>;

/** Members whose demand orders a recorded vote when `present` members are present; null when the rule is not a share. */
export function demandNeeded(demand: RecordedDemand | undefined, present: number): number | null {
  if (!demand) return null;
  if (demand.kind === "any-member") return 1;
  if (demand.kind !== "share-of-present" || !demand.numerator || !demand.denominator) return null;
  return Math.ceil((present * demand.numerator) / demand.denominator);
}

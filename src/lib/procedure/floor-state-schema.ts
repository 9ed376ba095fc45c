/**
 * The floor state a legal-moves question is asked about: the stack of pending questions,
 * listed bottom (first made) to top (immediately pending), and what is known about the floor.
 * Amendments carry their degree (1 = primary, 2 = secondary); when omitted it is derived from
 * the stack, since an amendment applies to the question it amends (Robert's Rules of Order
 * Revised, 1915, §33).
 *
 * Recent votes (`floor.votes`) are what a motion to reconsider is judged against: §36, "It can be
 * made only on the day the vote to be reconsidered was taken, or on the next succeeding day, a
 * legal holiday or a recess not being counted as a day. It must be made by one who voted with the
 * prevailing side." Days and sittings are numbered by the clerk, counting only the days that count.
 */
import { z } from "zod";
import { idSchema } from "../amendments/case-schema.ts";

export const pendingEntrySchema = z.looseObject({
  motion: idSchema,
  degree: z.number().int().min(1).max(10).optional(),
  /** The question is made of propositions on independent subjects (RONR 1915 Table of Rules note 10). */
  independentParts: z.boolean().optional(),
  /** The question contains a blank to be filled (RONR 1915 §33, filling blanks). */
  hasBlank: z.boolean().optional(),
});

const dayNumber = z.number().int().min(0).max(1_000_000);

/** A vote recently taken: the question as put and its result, and when. */
export const recentVoteSchema = z.object({
  motion: idSchema,
  result: z.enum(["adopted", "rejected"]),
  day: dayNumber.nullable().optional(),
  sitting: dayNumber.nullable().optional(),
  /** Whether the member now seeking to move to reconsider voted with the prevailing side; absent = not known. */
  moverOnPrevailingSide: z.boolean().nullable().optional(),
});
export type RecentVote = z.output<typeof recentVoteSchema>;

export const floorSchema = z.looseObject({
  /** A member is speaking: only motions that may interrupt are in order. */
  speakerHasFloor: z.boolean().default(false),
  /** Debate on the immediately pending question has begun. */
  debateBegun: z.boolean().default(false),
  /** The chair has just ruled, so an appeal lies. */
  chairHasRuled: z.boolean().default(false),
  /** A vote has been taken this session that could be reconsidered (kept for older callers; `votes` says which). */
  voteTaken: z.boolean().default(false),
  /** How many questions lie on the table. */
  tabled: z.number().int().min(0).max(10_000).default(0),
  /** Today's day number and this sitting's number, as the clerk counts them (null = not given). */
  day: dayNumber.nullable().default(null),
  sitting: dayNumber.nullable().default(null),
  /** Recent votes, oldest first. */
  votes: z.array(recentVoteSchema).max(100).default([]),
  /** Which of `votes` a motion to reconsider would apply to (index); null = the latest. */
  reconsiderVote: z.number().int().min(0).max(99).nullable().default(null),
  /** Previous notice was given of the motion about to be made (rescind, amend something adopted). */
  noticeGiven: z.boolean().default(false),
  /** The incidental motion about to be made arises out of the immediately pending question (e.g. leave to withdraw it). */
  arisesFromPending: z.boolean().default(false),
  /** The chamber is sitting as a Committee of the Whole (US House: Rule XVIII), whose motions differ. */
  committeeOfTheWhole: z.boolean().default(false),
  /** A quorum is present; when false, the rulebook's `no-quorum` rule leaves only `voting.quorum.withoutQuorum` in order (RONR 1915 §64). */
  quorumPresent: z.boolean().default(true),
});

const FLOOR_DEFAULTS = {
  speakerHasFloor: false,
  debateBegun: false,
  chairHasRuled: false,
  voteTaken: false,
  tabled: 0,
  day: null,
  sitting: null,
  votes: [],
  reconsiderVote: null,
  noticeGiven: false,
  arisesFromPending: false,
  committeeOfTheWhole: false,
  quorumPresent: true,
};

export const floorStateSchema = z
  .object({
    pending: z.array(pendingEntrySchema).max(100).default([]),
    floor: floorSchema.default(FLOOR_DEFAULTS),
  })
  .superRefine((s, ctx) => {
    const i = s.floor.reconsiderVote;
    if (i !== null && i >= s.floor.votes.length) ctx.addIssue({ code: "custom", path: ["floor", "reconsiderVote"], message: `no vote ${i} in floor.votes (${s.floor.votes.length} listed)` });
  });

export type FloorStateInput = z.input<typeof floorStateSchema>;
export type FloorState = z.output<typeof floorStateSchema>;

/**
 * The floor state a legal-moves question is asked about: the stack of pending questions,
 * listed bottom (first made) to top (immediately pending), and what is known about the floor.
 * Amendments carry their degree (1 = primary, 2 = secondary); when omitted it is derived from
 * the stack, since an amendment always applies to the question directly below it
 * (Robert's Rules of Order Revised, 1915, §33).
 */
import { z } from "zod";
import { idSchema } from "../amendments/case-schema.ts";

export const pendingEntrySchema = z.looseObject({
  motion: idSchema,
  degree: z.number().int().min(1).max(10).optional(),
});

export const floorSchema = z.looseObject({
  /** A member is speaking: only motions that may interrupt are in order. */
  speakerHasFloor: z.boolean().default(false),
  /** Debate on the immediately pending question has begun. */
  debateBegun: z.boolean().default(false),
  /** The chair has just ruled, so an appeal lies. */
  chairHasRuled: z.boolean().default(false),
  /** A vote has been taken this session that could be reconsidered. */
  voteTaken: z.boolean().default(false),
  /** How many questions lie on the table. */
  tabled: z.number().int().min(0).max(10_000).default(0),
  /** The chamber is sitting as a Committee of the Whole (US House: Rule XVIII), whose motions differ. */
  committeeOfTheWhole: z.boolean().default(false),
  /** A quorum is present; when false, the rulebook's `no-quorum` rule leaves only `voting.quorum.withoutQuorum` in order (RONR 1915 §64). */
  quorumPresent: z.boolean().default(true),
});

export const floorStateSchema = z.object({
  pending: z.array(pendingEntrySchema).max(100).default([]),
  floor: floorSchema.default({ speakerHasFloor: false, debateBegun: false, chairHasRuled: false, voteTaken: false, tabled: 0, committeeOfTheWhole: false, quorumPresent: true }),
});

export type FloorStateInput = z.input<typeof floorStateSchema>;
export type FloorState = z.output<typeof floorStateSchema>;

/**
 * The `voting` section of a rulebook: which procedure the chamber uses to put competing
 * texts, the constraints on the order of questions, and the tie rule. The voting engine
 * (src/lib/voting) reads this section to list legal voting orders.
 *
 * Procedures (see docs/decisions and ../shared DOMAIN conventions):
 *  - "amendment": pairwise votes; the survivor meets the next alternative (Anglo-American practice).
 *  - "successive": each alternative put to a yes/no vote in turn; the first adopted wins (continental practice).
 * Tie rule: a tie defeats the motion, so the later-listed alternative survives
 * (Robert's Rules of Order Revised, 1915, §46); on an appeal a tie sustains the chair.
 */
import { z } from "zod";
import { votingMethodsSchema } from "./voting-methods.ts";

export const VOTE_THRESHOLDS = ["majority", "two-thirds", "majority-of-members", "none"] as const;
export type VoteThreshold = (typeof VOTE_THRESHOLDS)[number];

export const ORDER_CONSTRAINTS = [
  /** A second-degree amendment is voted before the first-degree amendment it amends. */
  "secondary-before-primary",
  /** Amendments perfecting a text are voted before a substitute for that text. */
  "perfecting-before-substitute",
  /** Among amendments to the same text, the one furthest from the text is voted first (by `distance`). */
  "furthest-first",
  /** Amendments to different parts are taken in the order of the measure's sections (and lines). */
  "textual-order",
  /** The measure (as amended) is put last, against the status quo. */
  "passage-last",
  /** One primary amendment pending at a time: an amendment and everything amending it are voted as one contiguous block. */
  "primary-contiguous",
  /** With perfecting-before-substitute: a perfecting amendment may also be voted after the substitute is rejected (it falls if the substitute was adopted). */
  "perfecting-after-rejected-substitute",
] as const;
export type OrderConstraint = (typeof ORDER_CONSTRAINTS)[number];

export const citationSchema = z.string().trim().min(1).max(500);

export const votingSectionSchema = z.object({
  procedure: z.enum(["amendment", "successive"]),
  constraints: z.array(z.enum(ORDER_CONSTRAINTS)).max(ORDER_CONSTRAINTS.length).default(["secondary-before-primary", "perfecting-before-substitute", "passage-last"]),
  /** Only one tie rule is supported today; it is named so a rulebook states it explicitly. */
  tieRule: z.enum(["motion-fails"]).default("motion-fails"),
  appealTieRule: z.enum(["chair-sustained"]).default("chair-sustained"),
  /** Threshold for adopting an amendment; passage uses the main motion's threshold from the catalogue. */
  amendmentThreshold: z.enum(VOTE_THRESHOLDS).default("majority"),
  quorum: z
    .object({ kind: z.enum(["majority-of-members", "number", "none"]), value: z.number().int().min(1).optional() })
    .refine((q) => q.kind !== "number" || q.value !== undefined, { message: "a quorum of kind \"number\" needs a value", path: ["value"] })
    .default({ kind: "majority-of-members" }),
  /** How votes are taken and what orders a recorded vote (voting-methods.ts); optional. */
  methods: votingMethodsSchema.optional(),
  citation: citationSchema,
});

export type VotingSection = z.output<typeof votingSectionSchema>;
export type VotingSectionInput = z.input<typeof votingSectionSchema>;

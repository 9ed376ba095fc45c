/**
 * The `voting` section of a rulebook: which procedure the chamber uses to put competing
 * texts, the constraints on the order of questions, the thresholds, the quorum and the tie rule.
 * The voting engine (src/lib/voting) reads this section to list legal voting orders.
 *
 * Procedures (see docs/decisions and ../shared DOMAIN conventions):
 *  - "amendment": pairwise votes; the survivor meets the next alternative (Anglo-American practice).
 *  - "successive": each alternative put to a yes/no vote in turn; the first adopted wins (continental practice).
 * Thresholds (docs/decisions/0008-thresholds-quorum-chair.md): one per question kind — amendments
 * (`amendmentThreshold`) and final passage (`passageThreshold`, by default the main motion's own `vote`
 * in the catalogue: "An amendment of a pending question requires only a majority vote for its adoption,
 * even though the question to be amended requires a two-thirds vote", Robert's Rules of Order Revised,
 * 1915, §33 p. 134). "Of the members" thresholds count against the chamber's membership
 * (`chamber.members`), never against the ballots of an estimate.
 * Tie rule: by default a tie defeats the motion (RONR 1915 §46 pp. 191–192: "On a tie vote the motion
 * is lost"); the chair's casting vote is a choice of the rulebook. On an appeal a tie sustains the chair.
 */
import { z } from "zod";
import { idSchema } from "../amendments/case-schema.ts";
import { votingMethodsSchema } from "./voting-methods.ts";

/**
 * Threshold ids (never renamed; new ones are appended):
 *  - "majority": more votes for than against (a majority of the votes cast);
 *  - "two-thirds": at least two-thirds of the votes cast (RONR 1915 §48 p. 204);
 *  - "majority-of-members": more than half of the membership (`chamber.members`) vote for;
 *  - "none": no vote (decided by the chair or on demand); read as "majority" when a vote is counted;
 *  - "two-thirds-of-members", "three-fifths-of-members": at least that share of the membership vote for
 *    (members elected, or "duly chosen and sworn": `chamber.members` is the number the rule counts);
 *  - "two-thirds-of-present": at least two-thirds of the members present vote for (present = the
 *    attending weight of the estimate, abstainers and the chair included).
 * A fixed number of votes is written `{ "kind": "number", "value": N }` where a threshold object is
 * allowed (`amendmentThreshold`, `passageThreshold`), see `thresholdSpecSchema`.
 */
export const VOTE_THRESHOLDS = ["majority", "two-thirds", "majority-of-members", "none", "two-thirds-of-members", "three-fifths-of-members", "two-thirds-of-present"] as const;
export type VoteThreshold = (typeof VOTE_THRESHOLDS)[number];

/** Thresholds counted against the chamber's membership: they need `chamber.members` (or the roster). */
export const MEMBERSHIP_THRESHOLDS: readonly VoteThreshold[] = ["majority-of-members", "two-thirds-of-members", "three-fifths-of-members"];

/** A threshold of the voting section: an id, or a fixed number of votes in favour. */
export const fixedThresholdSchema = z.object({ kind: z.literal("number"), value: z.number().int().min(1).max(100_000) }).strict();
export const thresholdSpecSchema = z.union([z.enum(VOTE_THRESHOLDS), fixedThresholdSchema]);
export type ThresholdSpec = z.output<typeof thresholdSpecSchema>;

/**
 * Tie rules (the chair's vote):
 *  - "motion-fails": a tie defeats the motion; a ballot marked as the chair's counts like any other.
 *  - "chair-casting-vote": the chair votes only when the votes are equally divided, and then decides
 *    (US Constitution art. I §3 cl. 4: "shall have no Vote, unless they be equally divided").
 *  - "chair-votes": the chair votes on every question like any member; a tie defeats the motion.
 *  - "chair-may-make-or-break-tie": the chair votes only when that vote affects the result — to break a
 *    tie, or to make one (RONR 1915 §46 p. 192: "may vote to make it a tie unless the vote is by ballot.
 *    The chair cannot, however, vote twice, first to make a tie and then give the casting vote").
 * The chair's preference is the estimate's ballot marked `"chair": true`.
 */
export const TIE_RULES = ["motion-fails", "chair-casting-vote", "chair-votes", "chair-may-make-or-break-tie"] as const;
export type TieRule = (typeof TIE_RULES)[number];

/** Quorum kinds: a majority of the members; a fraction of them (EP: one third); a fixed number; none. */
export const QUORUM_KINDS = ["majority-of-members", "number", "none", "fraction"] as const;
export type QuorumKind = (typeof QUORUM_KINDS)[number];

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

/**
 * A link to the clause of the chamber's own rules that an item encodes: the clause's key in the
 * chamber's text as uploaded and split ("rule-xvi/4/a", "so-32/1", "s-33"; src/lib/chamber-text).
 * Optional everywhere; a link to a clause the text does not have is listed by the coverage view.
 */
export const clauseRefSchema = z.string().trim().min(1).max(200).regex(/^[a-z0-9][a-z0-9/~-]*$/, "a clause key: lower-case letters, digits, '/', '~' and '-' (as the chamber's text numbers it, e.g. \"rule-xvi/4/a\")");

export const votingSectionSchema = z.object({
  procedure: z.enum(["amendment", "successive"]),
  constraints: z.array(z.enum(ORDER_CONSTRAINTS)).max(ORDER_CONSTRAINTS.length).default(["secondary-before-primary", "perfecting-before-substitute", "passage-last"]),
  /** How a tie is decided (see TIE_RULES); `motion-fails` unless the rulebook gives the chair a casting vote. */
  tieRule: z.enum(TIE_RULES).default("motion-fails"),
  appealTieRule: z.enum(["chair-sustained"]).default("chair-sustained"),
  /** Threshold for adopting an amendment (RONR 1915 §33 p. 134: a majority even where the question needs two-thirds). */
  amendmentThreshold: thresholdSpecSchema.default("majority"),
  /** Threshold for final passage; absent = the main motion's `vote` in the catalogue (resolved by `votingRules`). */
  passageThreshold: thresholdSpecSchema.optional(),
  /** The clauses of the chamber's rules that fix the amendment and passage thresholds. */
  amendmentThresholdClause: clauseRefSchema.optional(),
  passageThresholdClause: clauseRefSchema.optional(),
  quorum: z
    .object({
      kind: z.enum(QUORUM_KINDS),
      /** kind "number": members that make a quorum. */
      value: z.number().int().min(1).optional(),
      /** kind "fraction": at least numerator/denominator of the members (one third: 1/3). */
      numerator: z.number().int().min(1).max(1000).optional(),
      denominator: z.number().int().min(1).max(1000).optional(),
      /** Catalogue ids of the motions in order when no quorum is present (the `no-quorum` rule reads them). */
      withoutQuorum: z.array(idSchema).max(50).optional(),
      citation: citationSchema.optional(),
      clause: clauseRefSchema.optional(),
    })
    .refine((q) => q.kind !== "number" || q.value !== undefined, { message: "a quorum of kind \"number\" needs a value", path: ["value"] })
    .refine((q) => q.kind !== "fraction" || (q.numerator !== undefined && q.denominator !== undefined), { message: "a quorum of kind \"fraction\" needs a numerator and a denominator", path: ["numerator"] })
    .refine((q) => q.numerator === undefined || q.denominator === undefined || q.numerator <= q.denominator, { message: "a quorum fraction is at most 1", path: ["numerator"] })
    .default({ kind: "majority-of-members" }),
  /** How votes are taken and what orders a recorded vote (voting-methods.ts); optional. */
  methods: votingMethodsSchema.optional(),
  citation: citationSchema,
  clause: clauseRefSchema.optional(),
});

export type VotingSection = z.output<typeof votingSectionSchema>;
export type VotingSectionInput = z.input<typeof votingSectionSchema>;

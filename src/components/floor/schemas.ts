/** Shapes of the legal-moves and floor APIs' answers, parsed in the browser. */
import { z } from "zod";
import { VOTE_THRESHOLDS } from "../../lib/procedure/voting-section.ts";
import { MOTION_CLASSES } from "../../lib/procedure/rulebook-schema.ts";
import { VOTING_METHODS } from "../../lib/procedure/voting-methods.ts";

export const verdictSchema = z.object({
  motion: z.string(),
  name: z.string(),
  class: z.enum(MOTION_CLASSES),
  rank: z.number().nullable(),
  inOrder: z.boolean(),
  reasons: z.array(z.object({ rule: z.string(), citation: z.string(), clause: z.string().optional(), message: z.string() })),
  second: z.boolean(),
  debatable: z.boolean(),
  amendable: z.boolean(),
  vote: z.enum(VOTE_THRESHOLDS),
  interrupt: z.boolean(),
  degree: z.number().optional(),
});
export type Verdict = z.output<typeof verdictSchema>;

export const rulebookRefSchema = z.object({ versionId: z.string(), number: z.number(), title: z.string() });
export const movesAnswerSchema = z.object({ rulebook: rulebookRefSchema, moves: z.array(verdictSchema) });

export const pendingItemSchema = z.object({ key: z.string(), motion: z.string(), name: z.string(), degree: z.number().nullable(), text: z.string(), mover: z.string(), ref: z.string().default(""), stage: z.enum(["made", "seconded", "stated"]), debateBegun: z.boolean() });
export type PendingItem = z.output<typeof pendingItemSchema>;

export const boardSchema = z.object({
  pending: z.array(pendingItemSchema),
  speaker: z.string().nullable(),
  chairHasRuled: z.boolean(),
  voteTaken: z.boolean(),
  tabled: z.number(),
  lastVote: z.object({ motion: z.string(), name: z.string(), result: z.enum(["adopted", "rejected"]), tally: z.object({ yes: z.number(), no: z.number(), abstain: z.number() }).nullable() }).nullable(),
  committeeOfTheWhole: z.boolean().default(false),
});

export const sittingSummarySchema = z.object({ id: z.string(), title: z.string(), status: z.enum(["open", "closed"]), revision: z.number(), openedAt: z.string(), closedAt: z.string().nullable() });
export const sittingsSchema = z.object({ sittings: z.array(sittingSummarySchema) });

export const historyLineSchema = z.object({
  seq: z.number(),
  kind: z.string(),
  summary: z.string(),
  by: z.string().nullable(),
  at: z.string(),
  /** The correction that struck this entry out. */
  struck: z.object({ entry: z.number(), reason: z.string(), by: z.string().nullable(), at: z.string() }).nullable().default(null),
  /** For a correction: the entry it struck out. */
  strikes: z.number().nullable().default(null),
});
export type HistoryLine = z.output<typeof historyLineSchema>;

export const sittingSchema = z.object({
  sitting: sittingSummarySchema,
  rulebook: rulebookRefSchema,
  /** The version in force today; `superseded` when the sitting is judged by an older one. */
  inForce: rulebookRefSchema.extend({ since: z.string() }).nullable().default(null),
  superseded: z.boolean().default(false),
  board: boardSchema,
  /** The immediately pending question as the clerk reads it, and the threshold that decides it. */
  question: z
    .object({
      key: z.string(),
      name: z.string(),
      threshold: z.string(),
      needsCount: z.boolean(),
      methods: z.array(z.enum(VOTING_METHODS)).default([...VOTING_METHODS]),
      quorum: z.number().nullable().default(null),
      demand: z.string().nullable().default(null),
      casting: z.boolean().default(false),
    })
    .nullable()
    .default(null),
  moves: z.array(verdictSchema),
  history: z.array(historyLineSchema),
});
export type Sitting = z.output<typeof sittingSchema>;

export const recordedSchema = z.object({ revision: z.number(), summary: z.string() });

export const VOTE_LABELS: Record<(typeof VOTE_THRESHOLDS)[number], string> = {
  majority: "Majority of those voting",
  "two-thirds": "Two-thirds",
  "majority-of-members": "Majority of the members",
  none: "No vote (chair decides)",
  "two-thirds-of-members": "Two-thirds of the members",
  "three-fifths-of-members": "Three-fifths of the members",
  "two-thirds-of-present": "Two-thirds of the members present",
};

export type Question = NonNullable<Sitting["question"]>;
export const rosterSchema = z.object({ legislators: z.array(z.object({ id: z.string(), name: z.string(), bloc: z.string() })) });
export type RosterMember = z.output<typeof rosterSchema>["legislators"][number];

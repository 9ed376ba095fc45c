/**
 * The rulebook file format ("gavelwright.rulebook", formatVersion 1): chamber metadata, the
 * motion catalogue, amendment rules, the voting section, and json-rules-engine rules over facts.
 * This file fixes the shape only; parseRulebook adds the semantic checks (unique ids, known
 * facts and operators, precedence without cycles). Field by field: docs/rulebook-format.md.
 *
 * Motion classes follow the general classification of Robert's Rules of Order Revised (1915)
 * §§11-15, with "restorative" for the motions that bring a question again before the
 * assembly (take from the table, reconsider, rescind; §§35-37).
 */
import { z } from "zod";
import { AMENDMENT_FORMS, idSchema } from "../amendments/case-schema.ts";
import { citationSchema, clauseRefSchema, VOTE_THRESHOLDS, votingSectionSchema } from "./voting-section.ts";
import { RULE_SCOPES } from "./rule-vocabulary.ts";

export const RULEBOOK_FORMAT = "gavelwright.rulebook";
export const RULEBOOK_FORMAT_VERSION = 1;

export const MOTION_CLASSES = ["privileged", "subsidiary", "incidental", "main", "restorative"] as const;
export type MotionClass = (typeof MOTION_CLASSES)[number];

export const FINDING_SEVERITIES = ["error", "warning", "info"] as const;
export type FindingSeverity = (typeof FINDING_SEVERITIES)[number];

/** Codes the shipped templates and the tree builder use; a rulebook may add its own. */
export const FINDING_CODES = [
  "degree-exceeded",
  "slot-taken",
  "not-germane",
  "needs-ruling",
  "filed-late",
  "sponsors-missing",
  "target-missing",
  "target-closed",
  "conflicts-with",
  "cycle",
  "form-not-allowed",
  "voted-after-perfecting",
  "whole-text",
  "several-parts",
  "needs-selection",
  "two-part-question",
] as const;

const text = (max: number) => z.string().trim().min(1).max(max);
export const findingCodeSchema = z.string().regex(/^[a-z][a-z0-9-]{0,63}$/, "must be lower-case letters, digits and '-'");

/**
 * Which vote on a motion may be reconsidered, for the question as put (Robert's Rules of Order
 * Revised, 1915, §36 and the Table of Rules notes): both results, only an affirmative (adopting)
 * vote, only a negative one, or neither.
 */
export const RECONSIDERABLE = ["both", "affirmative", "negative", "neither"] as const;
export type Reconsiderable = (typeof RECONSIDERABLE)[number];

/**
 * `reconsiderable` as written: the enum, or the boolean of rulebooks saved before the enum existed,
 * migrated on read (true → "both", false → "neither"); parseRulebookWithNotes reports each change.
 */
export const reconsiderableSchema = z.union([z.enum(RECONSIDERABLE), z.boolean().transform((b): Reconsiderable => (b ? "both" : "neither"))]);

/** How long after the vote it applies to a motion may be made; null = no limit. */
export const motionWindowSchema = z.object({
  days: z.number().int().min(0).max(3660).nullable().default(null),
  sittings: z.number().int().min(0).max(100_000).nullable().default(null),
  citation: citationSchema,
});

/**
 * A motion's characteristics as a variant sets them or a floor scenario expects them (each stated
 * one exactly; reconsiderable by its name, not the older true/false).
 */
export const characteristicsShape = {
  second: z.boolean(),
  debatable: z.boolean(),
  amendable: z.boolean(),
  vote: z.enum(VOTE_THRESHOLDS),
  interrupt: z.boolean(),
  reconsiderable: z.enum(RECONSIDERABLE),
};

/** Characteristics a variant may set when its condition holds. */
export const variantSetSchema = z
  .object({
    class: z.enum(MOTION_CLASSES),
    rank: z.number().int().min(0).max(1000).nullable(),
    ...characteristicsShape,
  })
  .partial()
  .strict()
  .refine((o) => Object.keys(o).length > 0, { message: "a variant sets at least one characteristic" });

/** A json-rules-engine condition tree; its nodes are checked by parseRulebook with exact paths. */
export const conditionTreeSchema = z.record(z.string(), z.unknown());

/** Characteristics that hold only in some floor states (a recess moved when nothing is pending…). */
export const motionVariantSchema = z.object({
  when: conditionTreeSchema,
  set: variantSetSchema,
  citation: citationSchema,
  note: z.string().max(1000).optional(),
});

/** Another threshold: adopted also by it (`or`), or it replaces `vote` (`instead`), in the circumstance stated. */
export const voteAlternativeSchema = z.object({
  kind: z.enum(["or", "instead"]),
  vote: z.enum(VOTE_THRESHOLDS),
  /** The circumstance in words, for the clerk and the chair. */
  if: z.string().trim().min(1).max(500),
  /** Optional: the circumstance as a condition over motion-scope facts; absent = for the chair to apply. */
  when: conditionTreeSchema.optional(),
  citation: citationSchema,
  clause: clauseRefSchema.optional(),
});

export const motionSchema = z.object({
  id: idSchema,
  name: text(200),
  class: z.enum(MOTION_CLASSES),
  /** Higher outranks lower; null for motions without rank (incidental, restorative). */
  rank: z.number().int().min(0).max(1000).nullable(),
  second: z.boolean(),
  debatable: z.boolean(),
  /** Debatable exactly when the question it applies to is (amend, reconsider). */
  debatableFollowsTarget: z.boolean().default(false),
  amendable: z.boolean(),
  vote: z.enum(VOTE_THRESHOLDS),
  /** In order when another member has the floor. */
  interrupt: z.boolean(),
  reconsiderable: reconsiderableSchema,
  /** Other thresholds, in the alternative or in stated circumstances; `vote` stays the ordinary one. */
  voteAlternatives: z.array(voteAlternativeSchema).max(8).optional(),
  /** How long after the vote it applies to the motion may be made (reconsider: RONR 1915 §36). */
  window: motionWindowSchema.optional(),
  /** Characteristics that depend on the floor state, applied in order when their condition holds. */
  variants: z.array(motionVariantSchema).max(10).optional(),
  citation: citationSchema,
  /** The clause of the chamber's rules the motion encodes (its key in the uploaded text). */
  clause: clauseRefSchema.optional(),
  /** The clause that fixes the motion's threshold (`vote`), when another than `clause`. */
  voteClause: clauseRefSchema.optional(),
  note: z.string().max(1000).optional(),
});

export const germanenessSchema = z.object({
  /** subjects: tags overlap with the measure's; section: with the targeted section's; committee: same committee of jurisdiction. */
  test: z.enum(["subjects", "section", "committee", "none"]),
  citation: citationSchema,
});

export const amendmentRulesSchema = z.object({
  /** Catalogue id of the motion to amend. */
  motion: idSchema.default("amend"),
  forms: z.array(z.enum(AMENDMENT_FORMS)).min(1).max(AMENDMENT_FORMS.length),
  maxDegree: z.number().int().min(1).max(10),
  /** How many amendments may be pending at once in one slot; null = no limit. */
  pendingPerSlot: z.number().int().min(1).max(100).nullable().default(1),
  /** A substitute has its own first-degree slot beside the perfecting amendment (four-amendment tree). */
  substituteSlot: z.boolean().default(false),
  /**
   * A substitute may target a first-degree amendment: it then counts as first degree, takes that
   * amendment's substitute slot (`<amendment>/substitute`) and has a second-degree slot of its own
   * (US House Rule XVI cl. 6; CRS Report 98-613). When false, a substitute for an amendment is an
   * amendment to it, one degree higher. Default false (the behaviour before this field existed).
   */
  substituteForAmendment: z.boolean().default(false),
  /**
   * How an amendment to the text a pending substitute would strike out counts when it is made while
   * that substitute (for the measure or a section) is pending. "second-degree": it is of the second
   * degree, in the substitute's slot, so an amendment to it is of the third degree (Robert's Rules of
   * Order Revised, 1915, §33 pp. 140-142). "first-degree": it stays a first-degree amendment in its
   * own slot (with `substituteSlot`, the perfecting slot). Default "first-degree" (the behaviour before
   * this field existed).
   */
  perfectingUnderSubstitute: z.enum(["first-degree", "second-degree"]).default("first-degree"),
  /** How many amendments may be pending at once on one measure; null = no limit. */
  maxPending: z.number().int().min(1).max(1000).nullable().default(null),
  germaneness: germanenessSchema,
  /** Amendments must be filed this many hours before the sitting (`asOf`); null = no deadline. */
  filingDeadline: z.object({ hoursBefore: z.number().min(0).max(24 * 366), citation: citationSchema, clause: clauseRefSchema.optional() }).nullable().default(null),
  minSponsors: z.number().int().min(0).max(1000).default(1),
  citation: citationSchema,
  clause: clauseRefSchema.optional(),
});

export const chamberSchema = z.object({
  name: text(200),
  kind: z.enum(["assembly", "legislature", "committee", "board", "other"]).default("assembly"),
  members: z.number().int().min(1).max(100_000).optional(),
  jurisdiction: z.string().max(200).optional(),
  note: z.string().max(2000).optional(),
});

export const sourceSchema = z.object({
  title: text(500),
  edition: z.string().max(200).optional(),
  /** The date (or term, or session) of the text the rulebook was written from, as the clerk would say it. */
  date: z.string().max(200).optional(),
  url: z.url().max(2000).optional(),
  license: z.string().max(200).optional(),
  note: z.string().max(2000).optional(),
  /** "Verify before use": what the source does not settle, or the engine cannot express, listed for a clerk to check. */
  verify: z.array(text(1000)).max(60).default([]),
});

export const ruleSchema = z.object({
  id: idSchema,
  scope: z.enum(RULE_SCOPES),
  citation: citationSchema,
  /** May name facts in braces, e.g. "{motion.name} ranks below {immediatelyPending.name}". */
  message: text(1000),
  conditions: conditionTreeSchema,
  priority: z.number().int().min(1).max(100).optional(),
  /** Amendment scope: the finding's stable code and severity. */
  code: findingCodeSchema.optional(),
  severity: z.enum(FINDING_SEVERITIES).optional(),
  /** Amendment scope: a fact (an array of amendment ids) listed as the finding's `related`. */
  related: z.enum(["conflictsWith", "perfectingSiblings", "cycleMembers"]).optional(),
  /** The clause of the chamber's rules the rule encodes (its key in the uploaded text). */
  clause: clauseRefSchema.optional(),
  /** For the clerk: what the source says beyond the citation, what is from memory, what the engine cannot express. */
  note: z.string().max(2000).optional(),
});

/**
 * One place in a precedence chain: a motion id, or several ids of equal rank (a tie, e.g. US House
 * Rule XVI cl. 4(c): fix the day and authorise a recess have equal privilege with adjourn).
 * Added December 2026; chains of plain ids read as before.
 */
export const precedenceStepSchema = z.union([idSchema, z.array(idSchema).min(2).max(50)]);

export const rulebookSchema = z.object({
  format: z.literal(RULEBOOK_FORMAT),
  formatVersion: z.literal(RULEBOOK_FORMAT_VERSION),
  id: idSchema,
  title: text(300),
  version: z.string().max(60).optional(),
  chamber: chamberSchema,
  source: sourceSchema,
  motions: z.array(motionSchema).min(1).max(200),
  /**
   * Optional precedence chains, highest first, as an alternative to numeric ranks:
   * ranks are then derived from the chains (a motion in a chain must not also give a number).
   */
  precedence: z.array(z.array(precedenceStepSchema).min(2).max(200)).max(50).optional(),
  amendments: amendmentRulesSchema,
  voting: votingSectionSchema,
  rules: z.array(ruleSchema).max(500),
});

export type MotionInput = z.input<typeof motionSchema>;
export type Motion = z.output<typeof motionSchema>;
export type RuleDefinition = z.output<typeof ruleSchema>;
export type RulebookInput = z.input<typeof rulebookSchema>;
/** A parsed rulebook; after parseRulebook every ranked motion's `rank` is resolved. */
export type Rulebook = z.output<typeof rulebookSchema>;

/**
 * The content of a ruling on a point of order, as clerks draft it and the API accepts it:
 * who raised the point, against what, the question, the chair's decision, the reasoning,
 * citations (rules of a rulebook version, earlier rulings), the appeal and its tally, the
 * sitting and its date. The point of order and the appeal from the chair's decision follow
 * Robert's Rules of Order Revised (1915) §21.
 *
 * A draft may be incomplete; `issueReadiness` says what an issued ruling still needs.
 */
import { z } from "zod";
import { calendarDate, safe } from "../schema-parts.ts";
import { idSchema } from "../amendments/case-schema.ts";

export const DECISIONS = ["sustained", "not-sustained", "other"] as const;
export type Decision = (typeof DECISIONS)[number];
export const DECISION_LABELS: Record<Decision, string> = {
  sustained: "Point of order sustained",
  "not-sustained": "Point of order not sustained (overruled)",
  other: "Other disposition",
};

export const TARGET_KINDS = ["motion", "amendment", "finding", "measure", "other"] as const;
export type TargetKind = (typeof TARGET_KINDS)[number];

const line = (max: number) => safe(z.string().trim().min(1, "must not be empty").max(max));
const uuid = z.uuid("must be an id (uuid)");
const isoDate = calendarDate();

export const ruleCitationSchema = z.object({
  kind: z.literal("rule"),
  /** The rulebook version the rule is cited from; null when cited by text only. */
  rulebookVersionId: uuid.nullable().default(null),
  ruleId: idSchema.nullable().default(null),
  /** The citation as printed, e.g. "RONR (1915) §21" or "Standing Order 31(2)". */
  citation: line(300),
});

export const rulingCitationSchema = z.object({
  kind: z.literal("ruling"),
  rulingId: uuid,
  /** Filled in by the server ("Ruling 3"); ignored on input. */
  label: safe(z.string().max(200)).optional(),
});

export const citationSchema = z.discriminatedUnion("kind", [ruleCitationSchema, rulingCitationSchema]);
export type Citation = z.output<typeof citationSchema>;

export const appealTallySchema = z.object({
  /** Votes that the decision of the chair stand as the judgment of the assembly. */
  ayes: z.number().int().min(0).max(100_000),
  noes: z.number().int().min(0).max(100_000),
  abstentions: z.number().int().min(0).max(100_000).default(0),
  /** Who appealed (optional free text). */
  appellant: safe(z.string().trim().max(200)).default(""),
});
export type AppealTally = z.output<typeof appealTallySchema>;

export const rulingContentSchema = z.object({
  raisedById: uuid,
  target: z.object({
    kind: z.enum(TARGET_KINDS),
    /** Id of a motion event, tree finding or other record; amendments and measures use the ids below. */
    ref: safe(z.string().trim().max(200)).nullable().default(null),
    label: line(300),
  }),
  measureId: uuid.nullable().default(null),
  amendmentId: uuid.nullable().default(null),
  /** Catalogue id of the motion concerned ("previous-question", "amend"…). */
  motion: idSchema.nullable().default(null),
  question: line(4000),
  decision: z.enum(DECISIONS).nullable().default(null),
  decisionNote: safe(z.string().trim().max(500)).default(""),
  reasoning: safe(z.string().trim().max(20_000)).default(""),
  citations: z.array(citationSchema).max(50).default([]),
  appeal: appealTallySchema.nullable().default(null),
  sittingId: uuid.nullable().default(null),
  sitting: safe(z.string().trim().max(200)).default(""),
  sittingDate: isoDate.nullable().default(null),
});
export type RulingContent = z.output<typeof rulingContentSchema>;
export type RulingContentInput = z.input<typeof rulingContentSchema>;

/** What an issued ruling needs beyond a draft: path-precise problems, empty when ready. */
export function issueReadiness(c: RulingContent): Array<{ path: string; message: string }> {
  const out: Array<{ path: string; message: string }> = [];
  if (!c.decision) out.push({ path: "decision", message: "an issued ruling states the chair's decision" });
  if (c.decision === "other" && !c.decisionNote) out.push({ path: "decisionNote", message: "say what the other disposition was" });
  if (!c.reasoning) out.push({ path: "reasoning", message: "an issued ruling gives the chair's reasoning" });
  if (!c.sitting) out.push({ path: "sitting", message: "name the sitting at which the chair ruled" });
  if (!c.sittingDate) out.push({ path: "sittingDate", message: "give the date of the sitting" });
  return out;
}

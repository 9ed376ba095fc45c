/**
 * Shared input shapes for a measure and its amendments, as they appear in CLI case files,
 * API bodies and the rows the server loads. Used by the tree validator (src/lib/amendments)
 * and by the voting engine when it builds the alternatives of a measure (src/lib/voting).
 *
 * A target is a string: the measure id (the whole text), a section id of the measure,
 * or another amendment's id. Its degree is derived, never stored: an amendment whose target
 * is the measure or a section is first-degree; one whose target is a first-degree amendment
 * is second-degree; and so on.
 */
import { z } from "zod";

export const ID_PATTERN = /^[A-Za-z0-9][A-Za-z0-9._:-]{0,63}$/;
export const idSchema = z.string().regex(ID_PATTERN, "must be 1-64 letters, digits, '.', '_', ':' or '-', starting with a letter or digit");

export const AMENDMENT_FORMS = ["insert", "strike", "strike-and-insert", "substitute", "in-nature-of-substitute"] as const;
export type AmendmentForm = (typeof AMENDMENT_FORMS)[number];

export const subjectsSchema = z.array(z.string().trim().min(1).max(80)).max(50);

export const sectionSchema = z.object({
  id: idSchema,
  heading: z.string().max(500).optional(),
  text: z.string().max(200_000).optional(),
  subjects: subjectsSchema.default([]),
  /** Lines are counted from 1 within the section. */
  lines: z.number().int().min(0).max(100_000).optional(),
  /** Text already adopted or struck by an earlier amendment cannot be amended again. */
  status: z.enum(["open", "adopted", "struck"]).default("open"),
});

export const measureSchema = z.object({
  id: idSchema,
  number: z.string().max(40).optional(),
  title: z.string().max(500).optional(),
  subjects: subjectsSchema.default([]),
  committee: z.string().max(200).optional(),
  sections: z.array(sectionSchema).max(2000).default([]),
});

export const lineRangeSchema = z
  .tuple([z.number().int().min(1), z.number().int().min(1)])
  .refine(([a, b]) => a <= b, "line range must be [from, to] with from <= to");

export const amendmentSchema = z.object({
  id: idSchema,
  target: idSchema,
  form: z.enum(AMENDMENT_FORMS),
  /** Line range within the targeted section (first-degree amendments to a section only). */
  lines: lineRangeSchema.optional(),
  sponsors: z.array(z.string().trim().min(1).max(200)).max(500).default([]),
  filedAt: z.iso.datetime({ offset: true }).optional(),
  subjects: subjectsSchema.default([]),
  text: z.string().max(200_000).optional(),
  title: z.string().max(500).optional(),
  /**
   * How far the amendment departs from the text it amends, as assessed by the clerk (larger is
   * further). Used by the "furthest-first" ordering constraint of continental chambers.
   */
  distance: z.number().optional(),
  /** Committee of jurisdiction the amendment's subject falls under (the "committee" germaneness test). */
  committee: z.string().max(200).optional(),
  /** Lifecycle status; only draft/filed/pending amendments take part in a tree's analysis. */
  status: z.enum(["draft", "filed", "pending", "adopted", "rejected", "withdrawn", "fell", "ruled-out"]).default("filed"),
});

export type Section = z.output<typeof sectionSchema>;
export type MeasureInput = z.input<typeof measureSchema>;
export type Measure = z.output<typeof measureSchema>;
export type AmendmentInput = z.input<typeof amendmentSchema>;
export type Amendment = z.output<typeof amendmentSchema>;

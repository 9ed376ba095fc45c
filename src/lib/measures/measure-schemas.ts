/**
 * Request and response shapes of the measures, amendments and tree API. Pure zod, no I/O:
 * the endpoints parse bodies with these and the islands parse fetched JSON with them, so the
 * browser may import this file.
 */
import { z } from "zod";
import { AMENDMENT_FORMS, ID_PATTERN } from "../amendments/case-schema.ts";
import { dateTime, int4, safe, version } from "../schema-parts.ts";

export const MEASURE_STATUSES = ["draft", "introduced", "in-committee", "reported", "on-floor", "passed", "failed", "withdrawn"] as const;
export const AMENDMENT_STATUSES = ["draft", "filed", "pending", "adopted", "rejected", "withdrawn", "fell", "ruled-out"] as const;
export type MeasureStatus = (typeof MEASURE_STATUSES)[number];
export type AmendmentStatus = (typeof AMENDMENT_STATUSES)[number];

export const AMENDMENT_STATUS_LABELS: Record<AmendmentStatus, string> = {
  draft: "Draft",
  filed: "Filed",
  pending: "Pending",
  adopted: "Adopted",
  rejected: "Rejected",
  withdrawn: "Withdrawn",
  fell: "Fell",
  "ruled-out": "Ruled out of order",
};
export const MEASURE_STATUS_LABELS: Record<MeasureStatus, string> = {
  draft: "Draft",
  introduced: "Introduced",
  "in-committee": "In committee",
  reported: "Reported",
  "on-floor": "On the floor",
  passed: "Passed",
  failed: "Failed",
  withdrawn: "Withdrawn",
};
export const SECTION_STATUS_LABELS: Record<"open" | "adopted" | "struck", string> = { open: "Open", adopted: "Adopted", struck: "Struck" };
/** The status of a measure, section or amendment in words (an unknown value is shown as stored). */
export function statusLabel(kind: "measure" | "section" | "amendment", status: string | null | undefined): string {
  if (!status) return "";
  const labels: Record<string, string> = kind === "measure" ? MEASURE_STATUS_LABELS : kind === "section" ? SECTION_STATUS_LABELS : AMENDMENT_STATUS_LABELS;
  return labels[status] ?? status;
}
/** The form of an amendment in words. */
export function formLabel(form: string | null | undefined): string {
  if (!form) return "";
  return (FORM_LABELS as Record<string, string>)[form] ?? form;
}
export const FORM_LABELS: Record<(typeof AMENDMENT_FORMS)[number], string> = {
  insert: "Insert",
  strike: "Strike",
  "strike-and-insert": "Strike and insert",
  substitute: "Substitute",
  "in-nature-of-substitute": "In the nature of a substitute",
};

const tag = safe(z.string().trim().toLowerCase().min(1).max(80));
export const tagsSchema = z.array(tag).max(50);
/** Keys the amendment tree gives the measure and its amendments ("measure", "A3", "Draft", "Draft-2"); a section may not take one. */
export const TREE_RESERVED_ID = /^(measure|A\d+|Draft(-\d+)?|D-[0-9a-f]{8})$/;
const sectionId = safe(
  z
    .string()
    .regex(ID_PATTERN, "must be 1-64 letters, digits, '.', '_', ':' or '-'")
    .refine((id) => !TREE_RESERVED_ID.test(id), "is how the tree names the measure or an amendment (measure, A1, Draft, Draft-1); give the section another id, such as s1"),
);

export const sectionInputSchema = z.object({
  id: sectionId.optional(),
  heading: safe(z.string().trim().max(500)).optional(),
  text: safe(z.string().max(200_000)).default(""),
  subjects: tagsSchema.default([]),
  status: z.enum(["open", "adopted", "struck"]).default("open"),
});

const measureFields = {
  number: safe(z.string().trim().min(1).max(40).regex(/^[A-Za-z0-9][A-Za-z0-9 ./-]*$/, "letters, digits, spaces, '.', '/' and '-' only")),
  title: safe(z.string().trim().min(1).max(500)),
  committee: safe(z.string().trim().max(200)).nullable(),
  status: z.enum(MEASURE_STATUSES),
  subjects: tagsSchema,
  sponsors: z.array(z.uuid()).max(100),
  sittingAt: dateTime().nullable(),
  sections: z.array(sectionInputSchema).max(2000),
};

/** Create: sections given, or plain text split into sections (see measure-sections.ts). */
export const measureCreateSchema = z.object({
  number: measureFields.number,
  title: measureFields.title,
  committee: measureFields.committee.default(null),
  status: measureFields.status.default("introduced"),
  subjects: measureFields.subjects.default([]),
  sponsors: measureFields.sponsors.default([]),
  sittingAt: measureFields.sittingAt.default(null),
  sections: measureFields.sections.optional(),
  text: safe(z.string().max(200_000)).optional(),
});

/** Update: any subset of fields, plus the version the edit was based on. */
export const measureUpdateSchema = z.object({
  version: version(),
  number: measureFields.number.optional(),
  title: measureFields.title.optional(),
  committee: measureFields.committee.optional(),
  status: measureFields.status.optional(),
  subjects: measureFields.subjects.optional(),
  sponsors: measureFields.sponsors.optional(),
  sittingAt: measureFields.sittingAt.optional(),
  sections: measureFields.sections.optional(),
});

const lines = z
  .tuple([int4().min(1), int4().min(1)])
  .refine(([a, b]) => a <= b, "line range must be [from, to] with from <= to");

/**
 * What an amendment amends: "measure" (the whole text), a section id ("s2"), another
 * amendment by its label ("A3") or by its id.
 */
export const targetSchema = safe(z.string().trim().min(1).max(64));

export const amendmentFileSchema = z.object({
  form: z.enum(AMENDMENT_FORMS),
  target: targetSchema,
  lines: lines.nullable().default(null),
  title: safe(z.string().trim().max(500)).nullable().default(null),
  text: safe(z.string().max(200_000)).default(""),
  subjects: tagsSchema.default([]),
  sponsors: z.array(z.uuid()).max(100).default([]),
  committee: safe(z.string().trim().max(200)).nullable().default(null),
  /** Save without filing: no number, no receipt. */
  draft: z.boolean().default(false),
  /** File even though the same person filed an identical amendment within the last hour. */
  confirm: z.boolean().default(false),
});

export const amendmentUpdateSchema = z.object({
  version: version(),
  form: z.enum(AMENDMENT_FORMS).optional(),
  target: targetSchema.optional(),
  lines: lines.nullable().optional(),
  title: safe(z.string().trim().max(500)).nullable().optional(),
  text: safe(z.string().max(200_000)).optional(),
  subjects: tagsSchema.optional(),
  sponsors: z.array(z.uuid()).max(100).optional(),
  committee: safe(z.string().trim().max(200)).nullable().optional(),
  /** Filing a draft goes through POST /api/amendments/:id/file, not here. */
  status: z.enum(AMENDMENT_STATUSES).exclude(["draft"]).optional(),
});

export const versionOnlySchema = z.object({ version: version() });

/** Filing a draft: the version it was read at, and `confirm` once the filer has answered the repeat question. */
export const draftFilingSchema = z.object({ version: version(), confirm: z.boolean().default(false) });

export const overrideCreateSchema = z.object({
  amendmentId: z.uuid(),
  code: safe(z.string().regex(/^[a-z][a-z0-9-]{0,63}$/, "a finding code such as not-germane")),
  /** The amendment's version the clerk saw when deciding. */
  version: version(),
  rulingRef: safe(z.string().trim().min(1).max(500)),
  rulingId: z.uuid().nullable().default(null),
  note: safe(z.string().trim().max(2000)).nullable().default(null),
});

// ---- Responses (parsed by the islands) ----

export const findingViewSchema = z.object({
  code: z.string(),
  severity: z.enum(["error", "warning", "info"]),
  /** The amendment as people read it, which is its key in the tree ("A3", a draft "Draft"); `related` likewise. */
  amendment: z.string(),
  amendmentId: z.string().nullable(),
  rule: z.string(),
  citation: z.string(),
  /** The clause of the chamber's rules the finding's rule encodes, when the rulebook links one. */
  clause: z.string().optional(),
  message: z.string(),
  related: z.array(z.string()).optional(),
  overridden: z.boolean().optional(),
  ruling: z.string().optional(),
  overrideId: z.string().nullable().optional(),
  /** The issued ruling the override rests on, when one was picked; and the clerk's note. */
  overrideRulingId: z.string().nullable().optional(),
  overrideNote: z.string().nullable().optional(),
});
export type FindingView = z.infer<typeof findingViewSchema>;

export const treeNodeViewSchema = z.object({
  key: z.string(),
  kind: z.enum(["measure", "section", "amendment"]),
  /** The amendment's row id (amendments only). */
  id: z.string().nullable(),
  label: z.string(),
  title: z.string().nullable(),
  parent: z.string().nullable(),
  degree: z.number().nullable(),
  /** Amendments: how the amendment counts (buildTree role), its slot, and the pending substitute it perfects the text under. */
  role: z.string().nullable().optional(),
  slot: z.string().nullable().optional(),
  underSubstitute: z.string().nullable().optional(),
  form: z.string().nullable(),
  status: z.string().nullable(),
  subjects: z.array(z.string()),
  sponsors: z.array(z.string()),
  filedAt: z.string().nullable(),
  text: z.string().nullable(),
  lines: z.tuple([z.number(), z.number()]).nullable(),
  version: z.number().nullable(),
});
export type TreeNodeView = z.infer<typeof treeNodeViewSchema>;

export const treeViewSchema = z.object({
  measure: z.object({ id: z.string(), number: z.string(), title: z.string(), version: z.number(), sittingAt: z.string().nullable(), archived: z.boolean().default(false) }),
  rulebook: z.object({ id: z.string(), title: z.string(), source: z.string(), maxDegree: z.number(), minSponsors: z.number() }),
  nodes: z.array(treeNodeViewSchema),
  findings: z.array(findingViewSchema),
  counts: z.object({ error: z.number(), warning: z.number(), info: z.number(), overridden: z.number() }),
});
export type TreeView = z.infer<typeof treeViewSchema>;

export const errorBodySchema = z.object({
  error: z.object({ code: z.string(), message: z.string(), issues: z.array(z.object({ path: z.string(), message: z.string() })).default([]), details: z.record(z.string(), z.unknown()).optional() }),
});

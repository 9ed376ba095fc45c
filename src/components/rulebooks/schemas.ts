/** Shapes of the rulebook API's answers, parsed in the browser. */
import { z } from "zod";
import { rulebookSchema, type RulebookInput } from "../../lib/procedure/rulebook-schema.ts";

const date = z.string();

export const versionMetaSchema = z.object({
  id: z.string(),
  number: z.number(),
  basedOn: z.string().nullable(),
  title: z.string(),
  origin: z.string(),
  note: z.string(),
  author: z.string().nullable(),
  createdAt: date,
});
export type VersionMeta = z.output<typeof versionMetaSchema>;

/** A shipped template as the library lists it: what it follows, how recent that text is, and what to verify. */
export const templateMetaSchema = z.object({
  id: z.string(),
  title: z.string(),
  chamber: z.string(),
  aliases: z.array(z.string()).default([]),
  source: z
    .object({ title: z.string(), edition: z.string().optional(), date: z.string().optional(), license: z.string().optional(), url: z.string().optional(), note: z.string().optional() })
    .optional(),
  verify: z.array(z.string()).default([]),
});
export type TemplateMeta = z.output<typeof templateMetaSchema>;

export const librarySchema = z.object({
  versions: z.array(versionMetaSchema),
  adoptions: z.array(z.object({ id: z.string(), versionId: z.string(), number: z.number(), effectiveFrom: date, note: z.string(), adoptedBy: z.string().nullable(), adoptedAt: date })),
  inForce: z.object({ adoptionId: z.string(), versionId: z.string(), number: z.number(), title: z.string(), effectiveFrom: date }).nullable(),
  latest: z.object({ id: z.string(), number: z.number() }).nullable(),
  templates: z.array(templateMetaSchema),
});
export type Library = z.output<typeof librarySchema>;

/** A rulebook document as written (defaults not filled in), accepted when its shape is valid. */
export const documentSchema = z.custom<RulebookInput>((v) => rulebookSchema.safeParse(v).success, { message: "not a rulebook document" });

export const versionSchema = versionMetaSchema.extend({
  document: z.record(z.string(), z.unknown()),
  latest: z.object({ id: z.string(), number: z.number() }).nullable(),
  adoptions: z.array(z.object({ effectiveFrom: date, adoptedAt: date })),
  inForce: z.boolean(),
});

export const templateSchema = z.object({ id: z.string(), title: z.string(), chamber: z.string(), document: z.record(z.string(), z.unknown()) });

export const savedSchema = z.object({ id: z.string(), number: z.number(), title: z.string() });
export const adoptedSchema = z.object({ id: z.string(), versionId: z.string(), number: z.number(), effectiveFrom: date, inForce: z.boolean() });

export const plainChangeSchema = z.object({
  section: z.string(),
  kind: z.enum(["added", "removed", "changed", "re-ranked"]),
  what: z.string(),
  from: z.string().optional(),
  to: z.string().optional(),
  text: z.string().optional(),
  citation: z.string().optional(),
});
export type PlainChangeView = z.output<typeof plainChangeSchema>;

const fieldChangeSchema = z.object({ field: z.string(), from: z.unknown(), to: z.unknown() });
export const diffSchema = z.object({
  identical: z.boolean(),
  sections: z.array(z.object({ section: z.string(), changes: z.array(z.object({ kind: z.enum(["added", "removed", "changed"]), id: z.string(), name: z.string().optional(), fields: z.array(fieldChangeSchema) })) })),
  summary: z.array(z.string()),
});
export type Diff = z.output<typeof diffSchema>;


export const compareSchema = z.object({ from: versionMetaSchema, to: versionMetaSchema, diff: diffSchema, changes: z.array(plainChangeSchema).default([]) });

export const staleSchema = z.object({
  latest: z.object({ id: z.string(), number: z.number(), author: z.string().nullable(), note: z.string() }),
  savedSince: z.array(z.object({ id: z.string(), number: z.number(), author: z.string().nullable(), note: z.string() })),
  changes: diffSchema,
  plainChanges: z.array(plainChangeSchema).default([]),
});

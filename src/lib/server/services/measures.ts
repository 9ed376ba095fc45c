/**
 * Measures of a chamber: list, read, create (typed text or an uploaded document), edit with
 * optimistic concurrency, and their attachments and audit log. Every query is scoped by the
 * actor's chamber; another chamber's measure is "not found".
 */
import { and, asc, count, desc, eq, inArray, isNotNull, isNull } from "drizzle-orm";
import { user } from "../../db/schema/auth.ts";
import type { z } from "zod";
import { chamberMemory } from "../chamber-memory.ts";
import { db, type Tx } from "../db.ts";
import { legislators } from "../../db/schema/chamber.ts";
import { amendments, measureAttachments, measures, type StoredSection } from "../../db/schema/measures.ts";
import { GavelError, parseWith } from "../../errors.ts";
import type { Actor } from "../http.ts";
import { assertFresh, auditOf, recordAudit } from "../measure-audit.ts";
import { measureCreateSchema, measureUpdateSchema, sectionInputSchema, versionOnlySchema } from "../../measures/measure-schemas.ts";
import { countLines, parseMeasureText, subjectList } from "../measure-sections.ts";
import { checkDocument, type MultipartUpload } from "../uploads.ts";

export type MeasureRow = typeof measures.$inferSelect;

const uuidLike = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** The measure, in the actor's chamber, or not-found (also for malformed ids). */
/** A measure id that cannot exist is simply not found (and never reaches PostgreSQL). */
export function assertMeasureId(id: string): void {
  if (!uuidLike.test(id)) throw new GavelError("not-found", "No such measure in this chamber.");
}

export async function measureRow(chamberId: string, id: string, q: Tx | typeof db = db, lock = false): Promise<MeasureRow> {
  assertMeasureId(id);
  const base = q.select().from(measures).where(and(eq(measures.id, id), eq(measures.chamberId, chamberId)));
  const [row] = lock ? await base.for("update") : await base;
  if (!row) throw new GavelError("not-found", "No such measure in this chamber.");
  return row;
}

/** An archived measure is read, never changed: every write to it or its amendments answers 409 "archived". */
export function assertNotArchived(m: MeasureRow): void {
  if (m.archivedAt) throw new GavelError("archived", `${m.number} is archived: it can be read, not changed.`, { details: { measure: m.number } });
}

/** Legislators of the chamber by id; unknown ids are an input error at `path`. */
export async function checkLegislators(chamberId: string, ids: string[], path: string, q: Tx | typeof db = db): Promise<Map<string, string>> {
  const unique = [...new Set(ids)];
  if (unique.length !== ids.length) throw new GavelError("invalid-input", `${path}: a legislator is listed twice`, { issues: [{ path, message: "duplicate legislator" }] });
  if (!unique.length) return new Map();
  const rows = await q.select({ id: legislators.id, name: legislators.name }).from(legislators).where(and(eq(legislators.chamberId, chamberId), inArray(legislators.id, unique)));
  const found = new Map(rows.map((r) => [r.id, r.name]));
  const issues = ids.flatMap((id, i) => (found.has(id) ? [] : [{ path: `${path}.${i}`, message: "not a legislator of this chamber" }]));
  if (issues.length) throw new GavelError("unprocessable", `${issues[0].path}: not a legislator of this chamber`, { issues });
  return found;
}

async function readLegislatorNames(chamberId: string, q: Tx | typeof db = db): Promise<Map<string, string>> {
  const rows = await q.select({ id: legislators.id, name: legislators.name }).from(legislators).where(eq(legislators.chamberId, chamberId));
  return new Map(rows.map((r) => [r.id, r.name]));
}
const rememberedNames = chamberMemory((chamberId) => readLegislatorNames(chamberId));

/** Legislators' names by id (read-only map); inside a transaction, read from it. */
export function legislatorNames(chamberId: string, q?: Tx): Promise<ReadonlyMap<string, string>> {
  return q ? readLegislatorNames(chamberId, q) : rememberedNames(chamberId);
}

export async function listLegislators(actor: Actor) {
  return db.select({ id: legislators.id, name: legislators.name, bloc: legislators.bloc, userId: legislators.userId }).from(legislators).where(eq(legislators.chamberId, actor.chamber.id)).orderBy(asc(legislators.name));
}

/** Give sections ids s1, s2… where missing, refuse duplicates, and count their lines. */
function normaliseSections(input: Array<z.output<typeof sectionInputSchema>>): StoredSection[] {
  const used = new Set(input.flatMap((s) => (s.id ? [s.id] : [])));
  const seen = new Set<string>();
  let n = 0;
  return input.map((s, i) => {
    let id = s.id;
    if (!id) {
      do id = `s${++n}`;
      while (used.has(id));
    }
    if (seen.has(id) || id === "measure") throw new GavelError("invalid-input", `sections.${i}.id: "${id}" is used twice`, { issues: [{ path: `sections.${i}.id`, message: "duplicate section id" }] });
    seen.add(id);
    return { id, ...(s.heading ? { heading: s.heading } : {}), text: s.text, subjects: s.subjects, lines: countLines(s.text), status: s.status };
  });
}

function snapshot(m: MeasureRow) {
  return { number: m.number, title: m.title, committee: m.committee, status: m.status, subjects: m.subjects, sponsors: m.sponsors, sittingAt: m.sittingAt?.toISOString() ?? null, sections: m.sections, attachmentId: m.attachmentId, version: m.version };
}

export async function listMeasures(actor: Actor) {
  const rows = await db
    .select({ id: measures.id, number: measures.number, title: measures.title, committee: measures.committee, status: measures.status, sittingAt: measures.sittingAt, updatedAt: measures.updatedAt })
    .from(measures)
    .where(and(eq(measures.chamberId, actor.chamber.id), isNull(measures.archivedAt)))
    .orderBy(asc(measures.number));
  const counts = await db.select({ measureId: amendments.measureId, n: count() }).from(amendments).where(eq(amendments.chamberId, actor.chamber.id)).groupBy(amendments.measureId);
  const byMeasure = new Map(counts.map((c) => [c.measureId, c.n]));
  return { measures: rows.map((r) => ({ ...r, amendments: byMeasure.get(r.id) ?? 0 })) };
}

export async function getMeasure(actor: Actor, id: string) {
  const m = await measureRow(actor.chamber.id, id);
  const names = await legislatorNames(actor.chamber.id);
  const [attachment] = m.attachmentId
    ? await db.select({ id: measureAttachments.id, filename: measureAttachments.filename, mediaType: measureAttachments.mediaType, size: measureAttachments.size }).from(measureAttachments).where(eq(measureAttachments.id, m.attachmentId))
    : [];
  return {
    id: m.id,
    number: m.number,
    title: m.title,
    committee: m.committee,
    status: m.status,
    subjects: m.subjects,
    sponsors: m.sponsors.map((s) => ({ id: s, name: names.get(s) ?? "(former legislator)" })),
    sittingAt: m.sittingAt?.toISOString() ?? null,
    sections: m.sections,
    attachment: attachment ?? null,
    version: m.version,
    updatedAt: m.updatedAt.toISOString(),
    archivedAt: m.archivedAt?.toISOString() ?? null,
  };
}

/** Measures archived in this chamber, newest first: still readable, offered nowhere else. */
export async function listArchivedMeasures(actor: Actor) {
  const rows = await db
    .select({ id: measures.id, number: measures.number, title: measures.title, archivedAt: measures.archivedAt, archivedByName: user.name })
    .from(measures)
    .leftJoin(user, eq(user.id, measures.archivedBy))
    .where(and(eq(measures.chamberId, actor.chamber.id), isNotNull(measures.archivedAt)))
    .orderBy(desc(measures.archivedAt));
  return { measures: rows.map((r) => ({ ...r, archivedAt: r.archivedAt!.toISOString() })) };
}

/**
 * Archive a measure filed by mistake or twice: it leaves the lists and the forms that offer
 * measures, stays readable, and takes no more changes. Sent with the version the clerk read.
 */
export async function archiveMeasure(actor: Actor, id: string, input: z.output<typeof versionOnlySchema>) {
  await db.transaction(async (tx) => {
    const m = await measureRow(actor.chamber.id, id, tx, true);
    assertNotArchived(m);
    await assertFresh(tx, { entity: "measure", entityId: m.id, label: `Measure ${m.number}` }, input.version, m.version);
    const [next] = await tx.update(measures).set({ archivedAt: new Date(), archivedBy: actor.user.id, version: m.version + 1, updatedAt: new Date() }).where(eq(measures.id, m.id)).returning();
    await recordAudit(tx, actor, { measureId: m.id, entity: "measure", entityId: m.id, action: "archived", version: next.version, before: snapshot(m), after: snapshot(next) });
  });
  return getMeasure(actor, id);
}

type CreateInput = z.output<typeof measureCreateSchema>;

async function insertMeasure(tx: Tx, actor: Actor, input: CreateInput, sections: StoredSection[], attachmentId: string | null): Promise<MeasureRow> {
  await checkLegislators(actor.chamber.id, input.sponsors, "sponsors", tx);
  const [dup] = await tx.select({ id: measures.id }).from(measures).where(and(eq(measures.chamberId, actor.chamber.id), eq(measures.number, input.number)));
  if (dup) throw new GavelError("conflict", `${input.number} already exists in this chamber.`, { issues: [{ path: "number", message: "already used" }] });
  const [row] = await tx
    .insert(measures)
    .values({ chamberId: actor.chamber.id, number: input.number, title: input.title, committee: input.committee, status: input.status, subjects: input.subjects, sponsors: input.sponsors, sittingAt: input.sittingAt ? new Date(input.sittingAt) : null, sections, attachmentId, createdBy: actor.user.id })
    .returning();
  await recordAudit(tx, actor, { measureId: row.id, entity: "measure", entityId: row.id, action: "created", version: row.version, before: null, after: snapshot(row) });
  return row;
}

export async function createMeasure(actor: Actor, input: CreateInput) {
  const sections = input.sections ? normaliseSections(input.sections) : parseMeasureText(input.text ?? "").sections;
  const row = await db.transaction((tx) => insertMeasure(tx, actor, input, sections, null));
  return getMeasure(actor, row.id);
}

/**
 * Create a measure from an uploaded document. Text and Markdown are split into sections;
 * a PDF or DOCX is kept as the attachment and its extracted text split the same way.
 */
/** A measure from an uploaded document: the multipart body as the route read it (readMultipart). */
export async function createMeasureFromUpload(actor: Actor, { fields, file }: MultipartUpload) {
  const input = parseWith(
    measureCreateSchema,
    {
      number: fields.number,
      title: fields.title || undefined,
      committee: fields.committee || null,
      status: fields.status || undefined,
      subjects: fields.subjects ? subjectList(fields.subjects) : [],
      sponsors: fields.sponsors ? fields.sponsors.split(",").map((s) => s.trim()).filter(Boolean) : [],
      sittingAt: fields.sittingAt || null,
    },
    "upload",
  );
  if (!file) throw new GavelError("invalid-input", "upload: attach the measure's text as `file`", { issues: [{ path: "file", message: "required" }] });
  const doc = await checkDocument(file);
  const parsed = parseMeasureText(doc.text);
  const row = await db.transaction(async (tx) => {
    const [att] = await tx.insert(measureAttachments).values({ chamberId: actor.chamber.id, filename: doc.filename, mediaType: doc.mediaType, size: doc.size, sha256: doc.sha256, bytes: doc.bytes, extractedText: doc.text, uploadedBy: actor.user.id }).returning({ id: measureAttachments.id });
    return insertMeasure(tx, actor, { ...input, title: input.title }, parsed.sections, att.id);
  });
  return getMeasure(actor, row.id);
}

export async function updateMeasure(actor: Actor, id: string, input: z.output<typeof measureUpdateSchema>) {
  await db.transaction(async (tx) => {
    const m = await measureRow(actor.chamber.id, id, tx, true);
    assertNotArchived(m);
    await assertFresh(tx, { entity: "measure", entityId: m.id, label: `Measure ${m.number}` }, input.version, m.version);
    if (input.sponsors) await checkLegislators(actor.chamber.id, input.sponsors, "sponsors", tx);
    if (input.number && input.number !== m.number) {
      const [dup] = await tx.select({ id: measures.id }).from(measures).where(and(eq(measures.chamberId, actor.chamber.id), eq(measures.number, input.number)));
      if (dup) throw new GavelError("conflict", `${input.number} already exists in this chamber.`, { issues: [{ path: "number", message: "already used" }] });
    }
    const { version, sections, sittingAt, ...rest } = input;
    const [next] = await tx
      .update(measures)
      .set({ ...rest, ...(sections ? { sections: normaliseSections(sections) } : {}), ...(sittingAt !== undefined ? { sittingAt: sittingAt ? new Date(sittingAt) : null } : {}), version: version + 1, updatedAt: new Date() })
      .where(eq(measures.id, m.id))
      .returning();
    await recordAudit(tx, actor, { measureId: m.id, entity: "measure", entityId: m.id, action: "edited", version: next.version, before: snapshot(m), after: snapshot(next) });
  });
  return getMeasure(actor, id);
}

/** An attachment of the chamber, for download. */
export async function getAttachment(actor: Actor, measureId: string, attachmentId: string) {
  await measureRow(actor.chamber.id, measureId);
  if (!uuidLike.test(attachmentId)) throw new GavelError("not-found", "No such attachment.");
  const [a] = await db
    .select({ filename: measureAttachments.filename, mediaType: measureAttachments.mediaType, bytes: measureAttachments.bytes, size: measureAttachments.size })
    .from(measureAttachments)
    .where(and(eq(measureAttachments.id, attachmentId), eq(measureAttachments.chamberId, actor.chamber.id)));
  if (!a) throw new GavelError("not-found", "No such attachment.");
  const linked = await db
    .select({ id: amendments.id })
    .from(amendments)
    .where(and(eq(amendments.measureId, measureId), eq(amendments.attachmentId, attachmentId)))
    .limit(1);
  const own = await db.select({ id: measures.id }).from(measures).where(and(eq(measures.id, measureId), eq(measures.attachmentId, attachmentId)));
  if (!linked.length && !own.length) throw new GavelError("not-found", "No such attachment on this measure.");
  return a;
}

export async function getMeasureAudit(actor: Actor, measureId: string) {
  await measureRow(actor.chamber.id, measureId);
  const rows = await auditOf(actor.chamber.id, measureId);
  return { entries: rows.map((r) => ({ ...r, at: r.at.toISOString() })) };
}

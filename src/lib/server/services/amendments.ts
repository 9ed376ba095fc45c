/**
 * Amendments to a measure: filing (by form or upload) with a gap-free number per measure and
 * a filing receipt queued in the same transaction, drafts, edits with optimistic concurrency,
 * and the audit trail of each change.
 */
import { and, asc, desc, eq, gt, inArray, isNull, sql as dsql } from "drizzle-orm";
import { lineRangeFromText } from "../../amendments/line-range-text.ts";
import type { z } from "zod";
import { db, type Tx } from "../db.ts";
import { member, user } from "../../db/schema/auth.ts";
import { legislators } from "../../db/schema/chamber.ts";
import { amendmentInWords, amendmentLabels, filedKey } from "../../amendments/amendment-words.ts";
import { amendments, measureAttachments, measures } from "../../db/schema/measures.ts";
import { GavelError, parseWith } from "../../errors.ts";
import { can } from "../../permissions.ts";
import type { Actor } from "../http.ts";
import { enqueueMail } from "../mail.ts";
import { assertFresh, recordAudit } from "../measure-audit.ts";
import { amendmentFileSchema, amendmentUpdateSchema, AMENDMENT_STATUS_LABELS, FORM_LABELS, type draftFilingSchema } from "../../measures/measure-schemas.ts";
import { subjectList } from "../measure-sections.ts";
import { treeOf } from "./trees.ts";
import { checkDocument, type MultipartUpload } from "../uploads.ts";
import { assertNotArchived, checkLegislators, legislatorNames, measureRow, type MeasureRow } from "./measures.ts";
import { dateStyleOf, formatDateTime } from "../../text/dates.ts";

export type AmendmentRow = typeof amendments.$inferSelect;

const uuidLike = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
/** Measures in these states take no more amendments. */
const CLOSED_MEASURE = new Set(["passed", "failed", "withdrawn"]);

/** The amendment's id in the tree: "A7" once filed, "D-1a2b3c4d" while a draft. */
export function amendmentKey(a: Pick<AmendmentRow, "id" | "number">): string {
  return a.number === null ? `D-${a.id.slice(0, 8)}` : filedKey(a.number);
}

export async function amendmentRow(chamberId: string, id: string, q: Tx | typeof db = db, lock = false): Promise<AmendmentRow> {
  if (!uuidLike.test(id)) throw new GavelError("not-found", "No such amendment in this chamber.");
  const base = q.select().from(amendments).where(and(eq(amendments.id, id), eq(amendments.chamberId, chamberId)));
  const [row] = lock ? await base.for("update") : await base;
  if (!row) throw new GavelError("not-found", "No such amendment in this chamber.");
  return row;
}

interface ResolvedTarget {
  targetKind: "measure" | "section" | "amendment";
  targetSection: string | null;
  targetAmendmentId: string | null;
}

/** "measure", a section id, "A3" (an amendment's number) or an amendment id, within the measure. */
async function resolveTarget(tx: Tx, m: MeasureRow, target: string, lines: [number, number] | null, selfId?: string): Promise<ResolvedTarget> {
  const bad = (message: string, path = "target") => new GavelError("unprocessable", `${path}: ${message}`, { issues: [{ path, message }] });
  let out: ResolvedTarget | null = null;
  if (target === "measure") out = { targetKind: "measure", targetSection: null, targetAmendmentId: null };
  else if (m.sections.some((s) => s.id === target)) out = { targetKind: "section", targetSection: target, targetAmendmentId: null };
  else {
    const byNumber = /^A(\d{1,9})$/i.exec(target);
    const where = byNumber ? eq(amendments.number, Number(byNumber[1])) : uuidLike.test(target) ? eq(amendments.id, target) : null;
    if (where) {
      const [t] = await tx.select({ id: amendments.id, number: amendments.number }).from(amendments).where(and(eq(amendments.measureId, m.id), where));
      // A draft is before no one: it can be amended once it is filed (and has its number).
      if (t && t.number === null) throw bad("that amendment is still a draft; an amendment to it can be filed once it is filed");
      if (t) out = { targetKind: "amendment", targetSection: null, targetAmendmentId: t.id };
    }
  }
  if (!out) throw bad(`"${target}" is not this measure, one of its sections (${m.sections.map((s) => s.id).join(", ") || "none"}) or one of its amendments`);
  if (selfId && out.targetAmendmentId === selfId) throw bad("an amendment cannot amend itself");
  if (selfId && out.targetAmendmentId) {
    // Re-targeting onto one of its own descendants would store a cycle: walk up from the new target.
    const rows = await tx.select({ id: amendments.id, target: amendments.targetAmendmentId }).from(amendments).where(eq(amendments.measureId, m.id));
    const parent = new Map(rows.map((r) => [r.id, r.target]));
    for (let at: string | null | undefined = out.targetAmendmentId, steps = 0; at && steps <= rows.length; at = parent.get(at), steps++)
      if (at === selfId) throw bad(`"${target}" amends this amendment (directly or further down); amending it would make a cycle`);
  }
  if (lines) {
    if (out.targetKind !== "section") throw bad("a line range applies to a section of the measure only", "lines");
    const section = m.sections.find((s) => s.id === out.targetSection)!;
    if (section.lines !== undefined && lines[1] > section.lines) throw bad(`section ${section.id} has ${section.lines} lines`, "lines");
  }
  return out;
}

function snapshot(a: AmendmentRow) {
  return { number: a.number, title: a.title, form: a.form, targetKind: a.targetKind, targetSection: a.targetSection, targetAmendmentId: a.targetAmendmentId, lines: a.lineFrom === null ? null : [a.lineFrom, a.lineTo], text: a.text, subjects: a.subjects, sponsors: a.sponsors, committee: a.committee, status: a.status, filedAt: a.filedAt?.toISOString() ?? null, attachmentId: a.attachmentId, version: a.version };
}

function targetLabel(a: AmendmentRow, keys: Map<string, string>, m: MeasureRow): string {
  if (a.targetKind === "measure") return `${m.number} (whole text)`;
  if (a.targetKind === "section") {
    const s = m.sections.find((x) => x.id === a.targetSection);
    return `${a.targetSection}${s?.heading ? ` — ${s.heading}` : ""}${a.lineFrom !== null ? `, lines ${a.lineFrom}–${a.lineTo}` : ""}`;
  }
  return `Amendment ${keys.get(a.targetAmendmentId ?? "") ?? "(removed)"}`;
}

function view(a: AmendmentRow, keys: Map<string, string>, byId: ReadonlyMap<string, AmendmentRow>, m: MeasureRow, names: ReadonlyMap<string, string>) {
  return {
    id: a.id,
    key: amendmentKey(a),
    number: a.number,
    measureId: a.measureId,
    title: a.title,
    form: a.form,
    formLabel: FORM_LABELS[a.form as keyof typeof FORM_LABELS] ?? a.form,
    target: a.targetKind === "measure" ? "measure" : a.targetKind === "section" ? a.targetSection! : (keys.get(a.targetAmendmentId ?? "") ?? a.targetAmendmentId!),
    targetLabel: targetLabel(a, keys, m),
    /** In words (amendmentInWords): "Amendment A3 to section 2 of HCA 12" (a draft: "A draft amendment to …"). */
    words: amendmentInWords(a, m.number, a.targetAmendmentId ? byId.get(a.targetAmendmentId) : null),
    lines: a.lineFrom === null ? null : ([a.lineFrom, a.lineTo!] as [number, number]),
    text: a.text,
    subjects: a.subjects,
    sponsors: a.sponsors.map((s) => ({ id: s, name: names.get(s) ?? "(former legislator)" })),
    committee: a.committee,
    status: a.status,
    statusLabel: AMENDMENT_STATUS_LABELS[a.status],
    filedAt: a.filedAt?.toISOString() ?? null,
    filedBy: a.filedBy,
    attachmentId: a.attachmentId,
    version: a.version,
  };
}

export type AmendmentView = ReturnType<typeof view>;

export async function listAmendments(actor: Actor, measureId: string) {
  const m = await measureRow(actor.chamber.id, measureId);
  const rows = await db.select().from(amendments).where(and(eq(amendments.measureId, m.id), eq(amendments.chamberId, actor.chamber.id))).orderBy(asc(dsql`coalesce(${amendments.number}, 2147483647)`), asc(amendments.createdAt));
  const keys = new Map(rows.map((r) => [r.id, amendmentKey(r)]));
  const names = await legislatorNames(actor.chamber.id);
  // Drafts come last, in the order they were saved: each labelled as the tree names it ("Draft", never its internal key).
  const labels = amendmentLabels(rows);
  const byId = new Map(rows.map((r) => [r.id, r]));
  return { amendments: rows.map((r) => ({ ...view(r, keys, byId, m, names), label: labels.get(r.id)! })) };
}

export async function getAmendment(actor: Actor, id: string) {
  const a = await amendmentRow(actor.chamber.id, id);
  const { amendments: all } = await listAmendments(actor, a.measureId);
  return all.find((x) => x.id === id)!;
}

/** Hand out the measure's next number: the row lock serialises concurrent filings and a rollback returns the number. */
async function nextNumber(tx: Tx, measureId: string): Promise<number> {
  const [r] = await tx.update(measures).set({ amendmentCounter: dsql`${measures.amendmentCounter} + 1` }).where(eq(measures.id, measureId)).returning({ n: measures.amendmentCounter });
  return r.n;
}

/** The amendment named in words, as a confirmation and a receipt read it. */
async function nameOf(q: Tx | typeof db, m: MeasureRow, a: AmendmentRow): Promise<string> {
  const [target] = a.targetKind === "amendment" && a.targetAmendmentId ? await q.select({ number: amendments.number }).from(amendments).where(eq(amendments.id, a.targetAmendmentId)) : [];
  return amendmentInWords(a, m.number, target);
}

/**
 * The filing receipt: one message to each sponsor who has an account in the chamber, and a copy to
 * the filer when the filer is not among them. Named in words, dated in the chamber's format; no
 * internal reference.
 */
async function queueReceipt(tx: Tx, actor: Actor, m: MeasureRow, a: AmendmentRow, sponsorNames: string[]): Promise<void> {
  const [filer] = await tx.select({ email: user.email, name: user.name }).from(user).where(eq(user.id, actor.user.id));
  const sponsorAccounts = a.sponsors.length
    ? await tx
        .select({ userId: user.id, email: user.email, name: user.name })
        .from(legislators)
        .innerJoin(user, eq(user.id, legislators.userId))
        .innerJoin(member, and(eq(member.userId, user.id), eq(member.organizationId, actor.chamber.id)))
        .where(and(eq(legislators.chamberId, actor.chamber.id), inArray(legislators.id, a.sponsors)))
    : [];
  const key = amendmentKey(a);
  const name = await nameOf(tx, m, a);
  const base = process.env.BETTER_AUTH_URL ?? "";
  const body = (copy: boolean) =>
    [
      `Filing receipt — ${actor.chamber.name}`,
      "",
      `${name} (${m.title})${a.title ? `, “${a.title}”,` : ""} was filed on ${formatDateTime(a.filedAt!, dateStyleOf(actor.chamber))}.`,
      `Form: ${FORM_LABELS[a.form as keyof typeof FORM_LABELS] ?? a.form}`,
      `Sponsors: ${sponsorNames.length ? sponsorNames.join(", ") : "none named"}`,
      `Filed by: ${filer.name}`,
      ...(copy ? ["", "You receive this copy because you filed the amendment; each sponsor with an account has the receipt."] : []),
      "",
      `See where it stands in the tree: ${base}/measures/${m.id}/tree#${key}`,
      "",
      "Filing records the amendment; whether it is in order is for the presiding officer, under the chamber's rules.",
    ].join("\n");
  const subject = `Filing receipt: Amendment ${key} to ${m.number}`;
  const seen = new Set<string>();
  for (const s of sponsorAccounts) {
    if (seen.has(s.userId)) continue;
    seen.add(s.userId);
    await enqueueMail({ kind: "amendment-receipt", ref: a.id, chamberId: actor.chamber.id, to: s.email, subject, text: body(false) }, tx);
  }
  if (!seen.has(actor.user.id)) await enqueueMail({ kind: "amendment-receipt", ref: a.id, chamberId: actor.chamber.id, to: filer.email, subject, text: body(true) }, tx);
}

/**
 * A filing identical to one the same person filed on this measure in the last hour asks first
 * (common practice, no source: a double-clicked or resubmitted form must not file twice).
 */
/** What makes two filings the same: form, target, lines, text and title. */
interface FilingShape extends ResolvedTarget {
  form: string;
  lines: [number, number] | null;
  text: string;
  title: string | null;
}

async function assertNotRepeated(tx: Tx, actor: Actor, m: MeasureRow, input: FilingShape): Promise<void> {
  const since = new Date(Date.now() - 60 * 60 * 1000);
  const same = await tx
    .select()
    .from(amendments)
    .where(
      and(
        eq(amendments.measureId, m.id),
        eq(amendments.filedBy, actor.user.id),
        eq(amendments.status, "filed"),
        gt(amendments.filedAt, since),
        eq(amendments.form, input.form),
        eq(amendments.targetKind, input.targetKind),
        input.targetSection === null ? isNull(amendments.targetSection) : eq(amendments.targetSection, input.targetSection),
        input.targetAmendmentId === null ? isNull(amendments.targetAmendmentId) : eq(amendments.targetAmendmentId, input.targetAmendmentId),
        input.lines ? and(eq(amendments.lineFrom, input.lines[0]), eq(amendments.lineTo, input.lines[1])) : isNull(amendments.lineFrom),
        eq(amendments.text, input.text),
        input.title === null ? isNull(amendments.title) : eq(amendments.title, input.title),
      ),
    )
    .orderBy(desc(amendments.filedAt))
    .limit(1);
  const [earlier] = same;
  if (!earlier) return;
  const name = await nameOf(tx, m, earlier);
  throw new GavelError("needs-confirmation", `You filed the same amendment ${formatDateTime(earlier.filedAt!, dateStyleOf(actor.chamber))}: ${name}. File it again anyway?`, {
    details: { reason: "repeated-filing", amendment: amendmentKey(earlier), name },
  });
}

/** `confirm` is the form's "File it anyway"; callers of our own (the seed) may leave it out. */
type FileInput = Omit<z.output<typeof amendmentFileSchema>, "confirm"> & { confirm?: boolean };

async function insertAmendment(tx: Tx, actor: Actor, m: MeasureRow, input: FileInput, attachmentId: string | null): Promise<AmendmentRow> {
  assertNotArchived(m);
  if (CLOSED_MEASURE.has(m.status)) throw new GavelError("unprocessable", `${m.number} is ${m.status}; it takes no more amendments.`, { issues: [{ path: "(measure)", message: `measure is ${m.status}` }] });
  const names = await checkLegislators(actor.chamber.id, input.sponsors, "sponsors", tx);
  const target = await resolveTarget(tx, m, input.target, input.lines);
  // The measure's row lock (nextNumber) serialises concurrent filings, so a repeat sent twice at once is caught too.
  const number = input.draft ? null : await nextNumber(tx, m.id);
  if (!input.draft && !input.confirm) await assertNotRepeated(tx, actor, m, { ...input, ...target });
  const [row] = await tx
    .insert(amendments)
    .values({
      chamberId: actor.chamber.id,
      measureId: m.id,
      number,
      title: input.title,
      form: input.form,
      ...target,
      lineFrom: input.lines?.[0] ?? null,
      lineTo: input.lines?.[1] ?? null,
      text: input.text,
      subjects: input.subjects,
      sponsors: input.sponsors,
      committee: input.committee,
      status: input.draft ? "draft" : "filed",
      filedAt: input.draft ? null : new Date(),
      filedBy: actor.user.id,
      attachmentId,
    })
    .returning();
  await recordAudit(tx, actor, { measureId: m.id, entity: "amendment", entityId: row.id, action: input.draft ? "drafted" : `filed ${amendmentKey(row)}`, version: row.version, before: null, after: snapshot(row) });
  if (!input.draft) await queueReceipt(tx, actor, m, row, input.sponsors.map((s) => names.get(s)!));
  return row;
}

/**
 * What the filer sees at once: the amendment named in words and the tree check's findings on it
 * (degree, sponsors, germaneness…), from the same validation the tree page shows.
 */
async function filingAnswer(actor: Actor, id: string) {
  const view = await getAmendment(actor, id);
  if (view.status === "draft") return { ...view, name: null, check: null };
  const a = await amendmentRow(actor.chamber.id, id);
  const m = await measureRow(actor.chamber.id, a.measureId);
  const tree = await treeOf(actor, m.id);
  const node = tree.nodes.find((n) => n.key === view.key);
  const findings = tree.findings.filter((f) => f.amendment === view.key && !f.overridden).map((f) => ({ severity: f.severity, message: f.message }));
  return { ...view, name: await nameOf(db, m, a), check: { degree: node?.degree ?? null, findings } };
}

export async function fileAmendment(actor: Actor, measureId: string, input: FileInput) {
  const row = await db.transaction(async (tx) => insertAmendment(tx, actor, await measureRow(actor.chamber.id, measureId, tx, true), input, null));
  return filingAnswer(actor, row.id);
}

function parseLines(s: string | undefined): [number, number] | null {
  const lines = lineRangeFromText(s ?? "");
  if (lines === "invalid") throw new GavelError("invalid-input", "lines: write a line or a range such as 3-7", { issues: [{ path: "lines", message: "expected N or N-M" }] });
  return lines;
}

/** File from an upload: the document is kept as the attachment; its text is the amendment's text unless typed. */
/** An amendment from an uploaded document: the multipart body as the route read it (readMultipart). */
export async function fileAmendmentFromUpload(actor: Actor, measureId: string, { fields, file }: MultipartUpload) {
  const input = parseWith(
    amendmentFileSchema,
    {
      form: fields.form,
      target: fields.target,
      lines: parseLines(fields.lines),
      title: fields.title || null,
      text: fields.text ?? "",
      subjects: fields.subjects ? subjectList(fields.subjects) : [],
      sponsors: fields.sponsors ? fields.sponsors.split(",").map((s) => s.trim()).filter(Boolean) : [],
      committee: fields.committee || null,
      draft: fields.draft === "true",
      confirm: fields.confirm === "true",
    },
    "upload",
  );
  if (!file) throw new GavelError("invalid-input", "upload: attach the amendment as `file`", { issues: [{ path: "file", message: "required" }] });
  const doc = await checkDocument(file);
  const row = await db.transaction(async (tx) => {
    const m = await measureRow(actor.chamber.id, measureId, tx, true);
    assertNotArchived(m);
    const [att] = await tx.insert(measureAttachments).values({ chamberId: actor.chamber.id, filename: doc.filename, mediaType: doc.mediaType, size: doc.size, sha256: doc.sha256, bytes: doc.bytes, extractedText: doc.text, uploadedBy: actor.user.id }).returning({ id: measureAttachments.id });
    return insertAmendment(tx, actor, m, { ...input, text: input.text.trim() ? input.text : doc.text.slice(0, 200_000) }, att.id);
  });
  return filingAnswer(actor, row.id);
}

/** Clerks edit any amendment; a member edits their own while it is a draft or filed, and may withdraw it. */
function assertMayEdit(actor: Actor, a: AmendmentRow, input: { status?: string }): void {
  if (can(actor.role, "measure:edit")) return;
  const own = a.filedBy === actor.user.id && can(actor.role, "amendment:file");
  if (!own) throw new GavelError("forbidden", "Only the clerks, or the member who filed it, may change this amendment.");
  if (a.status !== "draft" && a.status !== "filed") throw new GavelError("forbidden", `Amendment ${amendmentKey(a)} is ${a.status}; only a clerk may change it now.`);
  if (input.status !== undefined && input.status !== "withdrawn") throw new GavelError("forbidden", "A member may withdraw their amendment; other status changes are for the clerks.");
}

export async function updateAmendment(actor: Actor, id: string, input: z.output<typeof amendmentUpdateSchema>) {
  await db.transaction(async (tx) => {
    const a = await amendmentRow(actor.chamber.id, id, tx, true);
    assertMayEdit(actor, a, input);
    await assertFresh(tx, { entity: "amendment", entityId: a.id, label: `Amendment ${amendmentKey(a)}` }, input.version, a.version);
    if (a.status === "draft" && input.status) throw new GavelError("unprocessable", "status: file the draft first (POST /api/amendments/:id/file)", { issues: [{ path: "status", message: "a draft is filed, not given a status" }] });
    const m = await measureRow(actor.chamber.id, a.measureId, tx);
    assertNotArchived(m);
    if (input.sponsors) await checkLegislators(actor.chamber.id, input.sponsors, "sponsors", tx);
    const lines = input.lines !== undefined ? input.lines : a.lineFrom === null ? null : ([a.lineFrom, a.lineTo!] as [number, number]);
    const currentTarget = a.targetKind === "measure" ? "measure" : a.targetKind === "section" ? a.targetSection! : a.targetAmendmentId!;
    const target = input.target !== undefined || input.lines !== undefined ? await resolveTarget(tx, m, input.target ?? currentTarget, lines, a.id) : null;
    const { version, lines: _l, target: _t, ...rest } = input;
    const [next] = await tx
      .update(amendments)
      .set({ ...rest, ...(target ?? {}), lineFrom: lines?.[0] ?? null, lineTo: lines?.[1] ?? null, version: version + 1, updatedAt: new Date() })
      .where(eq(amendments.id, a.id))
      .returning();
    const action = input.status && input.status !== a.status ? `${amendmentKey(a)} marked ${input.status}` : `edited ${amendmentKey(a)}`;
    await recordAudit(tx, actor, { measureId: a.measureId, entity: "amendment", entityId: a.id, action, version: next.version, before: snapshot(a), after: snapshot(next) });
  });
  return getAmendment(actor, id);
}

/** File a draft: it gets the measure's next number and a receipt is queued. */
export async function fileDraft(actor: Actor, id: string, input: z.output<typeof draftFilingSchema>) {
  await db.transaction(async (tx) => {
    const a = await amendmentRow(actor.chamber.id, id, tx, true);
    assertMayEdit(actor, a, {});
    await assertFresh(tx, { entity: "amendment", entityId: a.id, label: `Amendment ${amendmentKey(a)}` }, input.version, a.version);
    if (a.status !== "draft") throw new GavelError("conflict", `Amendment ${amendmentKey(a)} is already filed.`, { issues: [{ path: "(status)", message: `is ${a.status}` }] });
    const m = await measureRow(actor.chamber.id, a.measureId, tx);
    assertNotArchived(m);
    if (CLOSED_MEASURE.has(m.status)) throw new GavelError("unprocessable", `${m.number} is ${m.status}; it takes no more amendments.`);
    const number = await nextNumber(tx, m.id);
    // A draft filed twice over (or the same text filed from the form an hour ago) asks first, as a filing does.
    if (!input.confirm) await assertNotRepeated(tx, actor, m, { ...a, lines: a.lineFrom === null || a.lineTo === null ? null : [a.lineFrom, a.lineTo] });
    const [next] = await tx.update(amendments).set({ number, status: "filed", filedAt: new Date(), filedBy: actor.user.id, version: a.version + 1, updatedAt: new Date() }).where(eq(amendments.id, a.id)).returning();
    await recordAudit(tx, actor, { measureId: m.id, entity: "amendment", entityId: a.id, action: `filed ${amendmentKey(next)}`, version: next.version, before: snapshot(a), after: snapshot(next) });
    // On the transaction's own connection: a second pool connection here deadlocks the pool when
    // as many filings as connections wait on the measure's row lock.
    const names = await legislatorNames(actor.chamber.id, tx);
    await queueReceipt(tx, actor, m, next, next.sponsors.map((s) => names.get(s) ?? s));
  });
  return filingAnswer(actor, id);
}

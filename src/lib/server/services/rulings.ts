/**
 * Rulings on points of order: drafting, issuing, corrections as revisions, precedent search
 * (PostgreSQL full text: a weighted tsvector with a GIN index, queried with
 * websearch_to_tsquery) and related-precedent suggestions. Every query is scoped to the
 * actor's chamber; another chamber's ruling answers 404.
 */
import { and, asc, desc, eq, inArray, isNull, lte, ne, sql as dsql, type SQL } from "drizzle-orm";
import { z } from "zod";
import { calendarDate, queryInt, safe, version } from "../../schema-parts.ts";
import { db, type Tx } from "../db.ts";
import { legislators } from "../../db/schema/chamber.ts";
import { amendments, measures } from "../../db/schema/measures.ts";
import { sittings } from "../../db/schema/floor.ts";
import { rulebookAdoptions, rulebookVersions } from "../../db/schema/rulebooks.ts";
import { rulingRevisions, rulings } from "../../db/schema/rulings.ts";
import { circulations, outbox } from "../../db/schema/mail.ts";
import { GavelError, isGavelError, type InputIssue } from "../../errors.ts";
import { can } from "../../permissions.ts";
import { appealOutcome } from "../../rulings/appeal-outcome.ts";
import { appealTallySchema, citationSchema, issueReadiness, rulingContentSchema, type AppealTally, type Citation, type RulingContent } from "../../rulings/ruling-content.ts";
import { readStored } from "../stored-json.ts";
import { dateStyleOf, isoDateIn } from "../../text/dates.ts";
import type { Actor } from "../http.ts";
import { circulateRulingInTx } from "./circulation.ts";
import { searchJournals } from "./journal.ts";
import { loadRulebook } from "./rulebooks.ts";

const uuid = z.uuid();
export const createDraftSchema = rulingContentSchema;
export const updateDraftSchema = z.object({ version: version(), content: rulingContentSchema });
export const issueSchema = z.object({ version: version(), circulateTo: z.array(uuid).max(10).default([]) });
export const reviseSchema = z.object({
  /** The revision the correction is based on; a stale one is refused (409). */
  revision: version(),
  note: safe(z.string().trim().min(1, "say what the correction changes").max(1000)),
  content: rulingContentSchema,
});
const dateParam = calendarDate();
export const searchSchema = z.object({
  q: safe(z.string().trim().max(300)).optional(),
  rule: safe(z.string().trim().min(1).max(300)).optional(),
  measure: safe(z.string().trim().min(1).max(300)).optional(),
  motion: safe(z.string().trim().min(1).max(200)).optional(),
  from: dateParam.optional(),
  to: dateParam.optional(),
  status: z.enum(["issued", "draft", "all"]).default("issued"),
  limit: queryInt().min(1).max(100).default(50),
});
export const relatedSchema = z.object({
  text: safe(z.string().trim().max(20_000)).optional(),
  rule: safe(z.string().trim().max(300)).optional(),
  citation: safe(z.string().trim().max(300)).optional(),
  exclude: uuid.optional(),
  limit: queryInt().min(1).max(20).default(5),
});

type Row = typeof rulings.$inferSelect;
const notFound = () => new GavelError("not-found", "No such ruling in this chamber.");

/** The stored citation list with labels (typed by a person: parsed on read; a damaged one throws). */
function storedCitations(r: Row): Citation[] {
  return readStored(z.array(citationSchema), r.citations, `citations of ruling ${r.number}`);
}

/** The stored appeal tally, or null (parsed on read like the citations). */
function storedAppeal(r: Row): AppealTally | null {
  return readStored(appealTallySchema.nullable(), r.appeal, `appeal of ruling ${r.number}`);
}

export function contentOf(r: Row): RulingContent {
  const appeal = storedAppeal(r);
  return {
    raisedById: r.raisedById ?? "",
    target: { kind: r.targetKind, ref: r.targetRef, label: r.targetLabel },
    measureId: r.measureId,
    amendmentId: r.amendmentId,
    motion: r.motion,
    question: r.question,
    decision: r.decision,
    decisionNote: r.decisionNote ?? "",
    reasoning: r.reasoning,
    citations: storedCitations(r),
    appeal,
    sittingId: r.sittingId,
    sitting: r.sitting,
    sittingDate: r.sittingDate,
  };
}

/**
 * The motion's name as the chamber's adopted rulebook gives it ("Close debate" for previous-question in
 * one chamber, "Previous question" in another); a motion no longer in the rulebook reads as its id in words.
 */
function motionNameOf(id: string | null, names?: ReadonlyMap<string, string>): string | null {
  if (!id) return null;
  const named = names?.get(id);
  if (named) return named;
  const words = id.replace(/[-_]+/g, " ").trim();
  return words.charAt(0).toUpperCase() + words.slice(1);
}

/** The adopted rulebook's motions, id → name (none adopted: empty). */
async function adoptedMotionNames(chamberId: string): Promise<Map<string, string>> {
  try {
    return new Map((await loadRulebook(chamberId)).rulebook.motions.map((m) => [m.id, m.name]));
  } catch (e) {
    if (isGavelError(e) && e.code === "not-found") return new Map();
    throw e;
  }
}

/** The motions a ruling may concern, by name, from a rulebook document. */
export function motionChoices(document: unknown): Array<{ id: string; name: string }> {
  const doc = z.object({ motions: z.array(z.object({ id: z.string(), name: z.string().optional() }).loose()).optional() }).loose().safeParse(document);
  return doc.success ? (doc.data.motions ?? []).map((m) => ({ id: m.id, name: m.name ?? motionNameOf(m.id)! })) : [];
}

export function toRuling(r: Row, motionNames?: ReadonlyMap<string, string>) {
  const appeal = storedAppeal(r);
  return {
    id: r.id,
    number: r.number,
    status: r.status,
    revision: r.revision,
    version: r.version,
    raisedById: r.raisedById,
    raisedByName: r.raisedByName,
    target: { kind: r.targetKind, ref: r.targetRef, label: r.targetLabel },
    measureId: r.measureId,
    measureLabel: r.measureLabel,
    amendmentId: r.amendmentId,
    motion: r.motion,
    motionName: motionNameOf(r.motion, motionNames),
    question: r.question,
    decision: r.decision,
    decisionNote: r.decisionNote ?? "",
    reasoning: r.reasoning,
    citations: storedCitations(r),
    appeal: appeal ? { ...appeal, outcome: appealOutcome(appeal) } : null,
    sittingId: r.sittingId,
    sitting: r.sitting,
    sittingDate: r.sittingDate,
    issuedAt: r.issuedAt?.toISOString() ?? null,
    createdAt: r.createdAt.toISOString(),
    updatedAt: r.updatedAt.toISOString(),
  };
}
export type RulingDto = ReturnType<typeof toRuling>;

interface ResolvedRefs {
  raisedByName: string;
  measureId: string | null;
  measureLabel: string | null;
  amendmentId: string | null;
  sittingLabel: string;
  citations: Citation[];
  citationKeys: string[];
  citationText: string;
}

interface CitableRule {
  ruleId: string;
  citation: string;
  name: string;
}

/** Rules and motions a rulebook version document makes citable (read loosely: it was validated when saved). */
export function citableRules(document: unknown): CitableRule[] {
  const doc = z
    .object({
      motions: z.array(z.object({ id: z.string(), name: z.string().optional(), citation: z.string().optional() }).loose()).optional(),
      rules: z.array(z.object({ id: z.string(), citation: z.string().optional(), message: z.string().optional() }).loose()).optional(),
    })
    .loose()
    .safeParse(document);
  if (!doc.success) return [];
  return [
    ...(doc.data.rules ?? []).map((r) => ({ ruleId: r.id, citation: r.citation ?? r.id, name: r.message ?? r.id })),
    ...(doc.data.motions ?? []).map((m) => ({ ruleId: m.id, citation: m.citation ?? m.id, name: m.name ?? m.id })),
  ];
}

/** Check every reference belongs to the actor's chamber and fill in labels. */
async function resolveRefs(tx: Tx | typeof db, actor: Actor, c: RulingContent, selfId: string | null): Promise<ResolvedRefs> {
  const chamberId = actor.chamber.id;
  const issues: InputIssue[] = [];
  const [leg] = await tx.select({ name: legislators.name }).from(legislators).where(and(eq(legislators.id, c.raisedById), eq(legislators.chamberId, chamberId)));
  if (!leg) issues.push({ path: "raisedById", message: "no such legislator in this chamber" });

  let measureId = c.measureId;
  let measureLabel: string | null = null;
  if (c.amendmentId) {
    const [a] = await tx.select({ id: amendments.id, number: amendments.number, measureId: amendments.measureId }).from(amendments).where(and(eq(amendments.id, c.amendmentId), eq(amendments.chamberId, chamberId)));
    if (!a) issues.push({ path: "amendmentId", message: "no such amendment in this chamber" });
    else if (measureId && measureId !== a.measureId) issues.push({ path: "amendmentId", message: "the amendment belongs to a different measure" });
    else measureId = a.measureId;
  }
  if (measureId) {
    const [m] = await tx.select({ number: measures.number, title: measures.title }).from(measures).where(and(eq(measures.id, measureId), eq(measures.chamberId, chamberId)));
    if (!m) issues.push({ path: "measureId", message: "no such measure in this chamber" });
    else measureLabel = `${m.number} — ${m.title}`;
  }
  let sittingLabel = c.sitting;
  if (c.sittingId) {
    const [s] = await tx.select({ title: sittings.title }).from(sittings).where(and(eq(sittings.id, c.sittingId), eq(sittings.chamberId, chamberId)));
    if (!s) issues.push({ path: "sittingId", message: "no such sitting in this chamber" });
    else if (!sittingLabel) sittingLabel = s.title;
  }

  const citations: Citation[] = [];
  const keys = new Set<string>();
  const texts: string[] = [];
  const versionIds = [...new Set(c.citations.flatMap((x) => (x.kind === "rule" && x.rulebookVersionId ? [x.rulebookVersionId] : [])))];
  const versions = versionIds.length ? await tx.select({ id: rulebookVersions.id, document: rulebookVersions.document }).from(rulebookVersions).where(and(inArray(rulebookVersions.id, versionIds), eq(rulebookVersions.chamberId, chamberId))) : [];
  const rulingIds = [...new Set(c.citations.flatMap((x) => (x.kind === "ruling" ? [x.rulingId] : [])))];
  const cited = rulingIds.length ? await tx.select({ id: rulings.id, number: rulings.number, status: rulings.status }).from(rulings).where(and(inArray(rulings.id, rulingIds), eq(rulings.chamberId, chamberId))) : [];
  c.citations.forEach((x, i) => {
    if (x.kind === "rule") {
      if (x.rulebookVersionId) {
        const v = versions.find((v) => v.id === x.rulebookVersionId);
        if (!v) return issues.push({ path: `citations.${i}.rulebookVersionId`, message: "no such rulebook version in this chamber" });
        if (x.ruleId && !citableRules(v.document).some((r) => r.ruleId === x.ruleId)) return issues.push({ path: `citations.${i}.ruleId`, message: `that rulebook version has no rule or motion "${x.ruleId}"` });
      }
      citations.push(x);
      keys.add(x.citation.toLowerCase());
      if (x.ruleId) keys.add(x.ruleId.toLowerCase());
      texts.push(x.citation, x.ruleId ?? "");
    } else {
      const r = cited.find((r) => r.id === x.rulingId);
      if (!r || r.status !== "issued") return issues.push({ path: `citations.${i}.rulingId`, message: "cite only issued rulings of this chamber" });
      if (r.id === selfId) return issues.push({ path: `citations.${i}.rulingId`, message: "a ruling cannot cite itself" });
      citations.push({ kind: "ruling", rulingId: r.id, label: `Ruling ${r.number}` });
      texts.push(`Ruling ${r.number}`);
    }
  });
  if (issues.length) throw new GavelError("unprocessable", `ruling: ${issues[0].path}: ${issues[0].message}${issues.length > 1 ? ` (and ${issues.length - 1} more)` : ""}`, { issues });
  return { raisedByName: leg!.name, measureId, measureLabel, amendmentId: c.amendmentId, sittingLabel, citations, citationKeys: [...keys], citationText: texts.filter(Boolean).join(" ") };
}

function rowValues(c: RulingContent, refs: ResolvedRefs) {
  return {
    raisedById: c.raisedById,
    raisedByName: refs.raisedByName,
    targetKind: c.target.kind,
    targetRef: c.target.ref,
    targetLabel: c.target.label,
    measureId: refs.measureId,
    measureLabel: refs.measureLabel,
    amendmentId: refs.amendmentId,
    motion: c.motion,
    question: c.question,
    decision: c.decision,
    decisionNote: c.decisionNote,
    reasoning: c.reasoning,
    citations: refs.citations,
    citationKeys: refs.citationKeys,
    citationText: refs.citationText,
    appeal: c.appeal,
    sittingId: c.sittingId,
    sitting: refs.sittingLabel,
    sittingDate: c.sittingDate,
  };
}

async function loadRow(tx: Tx | typeof db, actor: Actor, id: string, lock = false): Promise<Row> {
  if (!uuid.safeParse(id).success) throw notFound();
  const q = tx.select().from(rulings).where(and(eq(rulings.id, id), eq(rulings.chamberId, actor.chamber.id)));
  const [row] = lock ? await q.for("update") : await q;
  if (!row) throw notFound();
  if (row.status === "draft" && !can(actor.role, "ruling:draft")) throw notFound();
  return row;
}

export async function createDraft(actor: Actor, content: RulingContent) {
  return db.transaction(async (tx) => {
    const refs = await resolveRefs(tx, actor, content, null);
    // Serialise numbering per chamber so numbers are gap-free and unique.
    await tx.execute(dsql`SELECT pg_advisory_xact_lock(hashtext(${"rulings:" + actor.chamber.id}))`);
    const [{ next }] = await tx.select({ next: dsql<number>`coalesce(max(${rulings.number}), 0) + 1` }).from(rulings).where(eq(rulings.chamberId, actor.chamber.id));
    const [row] = await tx
      .insert(rulings)
      .values({ chamberId: actor.chamber.id, number: Number(next), createdBy: actor.user.id, ...rowValues(content, refs) })
      .returning();
    return toRuling(row);
  });
}

export async function updateDraft(actor: Actor, id: string, input: z.output<typeof updateDraftSchema>) {
  return db.transaction(async (tx) => {
    const row = await loadRow(tx, actor, id, true);
    if (row.status !== "draft") throw new GavelError("conflict", `Ruling ${row.number} has been issued; an issued ruling is never edited in place. Record a correction as a new revision.`, { details: { status: row.status, revision: row.revision } });
    if (row.version !== input.version) throw new GavelError("conflict", `Ruling ${row.number} was changed by someone else since you opened it (version ${input.version}, now ${row.version}). Reload and reapply your changes.`, { details: { currentVersion: row.version } });
    const refs = await resolveRefs(tx, actor, input.content, row.id);
    const [out] = await tx
      .update(rulings)
      .set({ ...rowValues(input.content, refs), version: row.version + 1, updatedAt: new Date() })
      .where(eq(rulings.id, row.id))
      .returning();
    return toRuling(out);
  });
}

function assertReady(c: RulingContent) {
  const missing = issueReadiness(c);
  if (missing.length) throw new GavelError("unprocessable", `The ruling cannot be issued yet: ${missing[0].path}: ${missing[0].message}${missing.length > 1 ? ` (and ${missing.length - 1} more)` : ""}`, { issues: missing });
}

/** Issue a draft (revision 1); optionally circulate it to lists in the same transaction. */
export async function issueRuling(actor: Actor, id: string, input: z.output<typeof issueSchema>) {
  if (input.circulateTo.length && !can(actor.role, "circulation:send")) throw new GavelError("forbidden", `Your role in ${actor.chamber.name} does not allow this (circulation:send).`);
  return db.transaction(async (tx) => {
    const row = await loadRow(tx, actor, id, true);
    if (row.status !== "draft") throw new GavelError("conflict", `Ruling ${row.number} is already issued.`, { details: { status: row.status, revision: row.revision } });
    if (row.version !== input.version) throw new GavelError("conflict", `Ruling ${row.number} was changed since you opened it (version ${input.version}, now ${row.version}). Reload and check it before issuing.`, { details: { currentVersion: row.version } });
    const content = contentOf(row);
    assertReady(content);
    const now = new Date();
    const [out] = await tx.update(rulings).set({ status: "issued", revision: 1, version: row.version + 1, issuedBy: actor.user.id, issuedAt: now, updatedAt: now }).where(eq(rulings.id, row.id)).returning();
    await tx.insert(rulingRevisions).values({ rulingId: row.id, chamberId: actor.chamber.id, revision: 1, content: toRuling(out), note: "As issued", issuedBy: actor.user.id, issuedByName: actor.user.name, issuedAt: now });
    const sent = [];
    for (const listId of input.circulateTo) sent.push(await circulateRulingInTx(tx, actor, out, listId));
    return { ruling: toRuling(out), circulations: sent };
  });
}

/** A correction to an issued ruling: a new revision; earlier revisions stay as they were. */
export async function reviseRuling(actor: Actor, id: string, input: z.output<typeof reviseSchema>) {
  return db.transaction(async (tx) => {
    const row = await loadRow(tx, actor, id, true);
    if (row.status !== "issued") throw new GavelError("conflict", `Ruling ${row.number} is still a draft: edit the draft instead.`, { details: { status: row.status } });
    if (row.revision !== input.revision) throw new GavelError("conflict", `Ruling ${row.number} is now at revision ${row.revision}, not ${input.revision}: someone corrected it meanwhile. Reload and reapply your correction.`, { details: { currentRevision: row.revision } });
    assertReady(input.content);
    const refs = await resolveRefs(tx, actor, input.content, row.id);
    const now = new Date();
    const [out] = await tx
      .update(rulings)
      .set({ ...rowValues(input.content, refs), revision: row.revision + 1, version: row.version + 1, updatedAt: now })
      .where(eq(rulings.id, row.id))
      .returning();
    await tx.insert(rulingRevisions).values({ rulingId: row.id, chamberId: actor.chamber.id, revision: out.revision, content: toRuling(out), note: input.note, issuedBy: actor.user.id, issuedByName: actor.user.name, issuedAt: now });
    return toRuling(out);
  });
}

export async function getRuling(actor: Actor, id: string) {
  const row = await loadRow(db, actor, id);
  const revisions = await db
    .select({ revision: rulingRevisions.revision, note: rulingRevisions.note, issuedByName: rulingRevisions.issuedByName, issuedAt: rulingRevisions.issuedAt, content: rulingRevisions.content })
    .from(rulingRevisions)
    .where(and(eq(rulingRevisions.rulingId, row.id), eq(rulingRevisions.chamberId, actor.chamber.id)))
    .orderBy(desc(rulingRevisions.revision));
  let sendings: Array<{ id: string; listName: string; rulingRevision: number | null; sentByName: string; createdAt: string; skipped: unknown; messages: Array<{ id: string; to: string; status: string; attempts: number; lastError: string | null; sentAt: string | null }> }> = [];
  if (can(actor.role, "circulation:send")) {
    const cs = await db.select().from(circulations).where(and(eq(circulations.rulingId, row.id), eq(circulations.chamberId, actor.chamber.id))).orderBy(desc(circulations.createdAt));
    const msgs = cs.length ? await db.select().from(outbox).where(inArray(outbox.circulationId, cs.map((c) => c.id))).orderBy(asc(outbox.to)) : [];
    sendings = cs.map((c) => ({
      id: c.id,
      listName: c.listName,
      rulingRevision: c.rulingRevision,
      sentByName: c.sentByName,
      createdAt: c.createdAt.toISOString(),
      skipped: c.skipped,
      messages: msgs.filter((m) => m.circulationId === c.id).map((m) => ({ id: m.id, to: m.to, status: m.status, attempts: m.attempts, lastError: m.lastError, sentAt: m.sentAt?.toISOString() ?? null })),
    }));
  }
  return {
    ruling: toRuling(row, await adoptedMotionNames(actor.chamber.id)),
    revisions: revisions.map((r) => ({ ...r, issuedAt: r.issuedAt.toISOString() })),
    circulations: sendings,
  };
}

/** Precedent search: full text (websearch syntax) with filters; issued rulings unless asked otherwise. */
export async function searchRulings(actor: Actor, q: z.output<typeof searchSchema>) {
  if (q.status !== "issued" && !can(actor.role, "ruling:draft")) throw new GavelError("forbidden", "Only clerks see draft rulings.");
  const where: SQL[] = [eq(rulings.chamberId, actor.chamber.id)];
  if (q.status !== "all") where.push(eq(rulings.status, q.status));
  const tsq = q.q ? dsql`websearch_to_tsquery('english', ${q.q})` : null;
  if (tsq) where.push(dsql`${rulings.search} @@ ${tsq}`);
  if (q.rule) where.push(dsql`${q.rule.toLowerCase()} = ANY(${rulings.citationKeys})`);
  if (q.measure) where.push(uuid.safeParse(q.measure).success ? eq(rulings.measureId, q.measure) : dsql`${rulings.measureLabel} ILIKE ${"%" + q.measure.replace(/[\\%_]/g, (m) => "\\" + m) + "%"}`);
  const motionNames = await adoptedMotionNames(actor.chamber.id);
  if (q.motion) {
    // The motion as a person writes it ("close debate") or as the rulebook names it (previous-question).
    const said = q.motion.trim().toLowerCase();
    const ids = [...new Set([q.motion, ...[...motionNames].filter(([id, name]) => name.toLowerCase() === said || motionNameOf(id)!.toLowerCase() === said).map(([id]) => id)])];
    where.push(dsql`(${inArray(rulings.motion, ids)} OR (${rulings.targetKind} = 'motion' AND ${inArray(rulings.targetRef, ids)}))`);
  }
  if (q.from) where.push(dsql`${rulings.sittingDate} >= ${q.from}`);
  if (q.to) where.push(dsql`${rulings.sittingDate} <= ${q.to}`);
  const rank = tsq ? dsql<number>`ts_rank_cd(${rulings.search}, ${tsq})` : dsql<number>`0`;
  const snippet = tsq ? dsql<string>`ts_headline('english', ${rulings.reasoning}, ${tsq}, 'StartSel=⟦, StopSel=⟧, MaxWords=35, MinWords=12, ShortWord=2')` : dsql<string>`left(${rulings.reasoning}, 240)`;
  const rows = await db
    .select({ row: rulings, rank, snippet })
    .from(rulings)
    .where(and(...where))
    .orderBy(...(tsq ? [desc(rank)] : []), dsql`${rulings.sittingDate} DESC NULLS LAST`, desc(rulings.number))
    .limit(q.limit);
  // Approved journals of sittings with the same words, searched beside the precedents (issue 19 item 2).
  const journals = q.q && !q.rule && !q.measure && !q.motion ? await searchJournals(actor, { q: q.q, limit: 10 }) : [];
  return { results: rows.map((r) => ({ ...toRuling(r.row, motionNames), rank: Number(r.rank), snippet: r.snippet })), journals };
}

/**
 * Precedents related to a draft or a tree finding: issued rulings citing the same rule, or
 * sharing words with the text (any of its lexemes, ranked), best first.
 */
export async function relatedPrecedents(actor: Actor, q: z.output<typeof relatedSchema>) {
  const keys = [q.rule, q.citation].filter((x): x is string => !!x).map((x) => x.toLowerCase());
  const text = [q.text, q.citation].filter(Boolean).join(" ");
  // Any lexeme of the text, OR-ed; lexemes are already normalised, so they are quoted into the query as they are.
  const anyWord = text
    ? dsql`(SELECT string_agg(quote_literal(l), ' | ')::tsquery FROM unnest(tsvector_to_array(to_tsvector('english', ${text}))) AS l WHERE position(E'\\\\' in l) = 0)`
    : null;
  const conds: SQL[] = [];
  if (keys.length) conds.push(dsql`${rulings.citationKeys} && ${dsql`ARRAY[${dsql.join(keys.map((k) => dsql`${k}`), dsql`, `)}]::text[]`}`);
  if (anyWord) conds.push(dsql`${rulings.search} @@ coalesce(${anyWord}, ''::tsquery)`);
  if (conds.length === 0) return { results: [] };
  const shared = keys.length ? dsql<number>`cardinality(ARRAY(SELECT unnest(${rulings.citationKeys}) INTERSECT SELECT unnest(${dsql`ARRAY[${dsql.join(keys.map((k) => dsql`${k}`), dsql`, `)}]::text[]`})))` : dsql<number>`0`;
  const score = anyWord ? dsql<number>`(${shared} + ts_rank_cd(${rulings.search}, coalesce(${anyWord}, ''::tsquery)))` : dsql<number>`${shared}`;
  const where: SQL[] = [eq(rulings.chamberId, actor.chamber.id), eq(rulings.status, "issued"), dsql`(${dsql.join(conds, dsql` OR `)})`];
  if (q.exclude) where.push(ne(rulings.id, q.exclude));
  const rows = await db.select({ row: rulings, score }).from(rulings).where(and(...where)).orderBy(desc(score), desc(rulings.number)).limit(q.limit);
  return { results: rows.map((r) => ({ ...toRuling(r.row), score: Number(r.score) })) };
}

/** What the drafting form offers: legislators, measures, amendments, sittings, citable rules, earlier rulings. */
export async function draftingOptions(actor: Actor) {
  const chamberId = actor.chamber.id;
  const legs = await db.select({ id: legislators.id, name: legislators.name, bloc: legislators.bloc, office: legislators.office }).from(legislators).where(eq(legislators.chamberId, chamberId)).orderBy(asc(legislators.name));
  const ms = await db.select({ id: measures.id, number: measures.number, title: measures.title }).from(measures).where(and(isNull(measures.archivedAt), eq(measures.chamberId, chamberId))).orderBy(asc(measures.number));
  const ams = await db
    .select({ id: amendments.id, number: amendments.number, title: amendments.title, measureId: amendments.measureId })
    .from(amendments)
    .where(and(eq(amendments.chamberId, chamberId), dsql`${amendments.number} IS NOT NULL`))
    .orderBy(asc(amendments.measureId), asc(amendments.number));
  const sits = await db.select({ id: sittings.id, title: sittings.title, openedAt: sittings.openedAt }).from(sittings).where(eq(sittings.chamberId, chamberId)).orderBy(desc(sittings.openedAt)).limit(50);
  const [adopted] = await db
    .select({ id: rulebookVersions.id, number: rulebookVersions.number, title: rulebookVersions.title, document: rulebookVersions.document })
    .from(rulebookAdoptions)
    .innerJoin(rulebookVersions, eq(rulebookAdoptions.versionId, rulebookVersions.id))
    .where(and(eq(rulebookAdoptions.chamberId, chamberId), lte(rulebookAdoptions.effectiveFrom, new Date())))
    .orderBy(desc(rulebookAdoptions.effectiveFrom), desc(rulebookAdoptions.adoptedAt))
    .limit(1);
  const earlier = await db.select({ id: rulings.id, number: rulings.number, targetLabel: rulings.targetLabel }).from(rulings).where(and(eq(rulings.chamberId, chamberId), eq(rulings.status, "issued"))).orderBy(desc(rulings.number)).limit(200);
  return {
    legislators: legs,
    measures: ms.map((m) => ({ id: m.id, label: `${m.number} — ${m.title}` })),
    amendments: ams.map((a) => ({ id: a.id, measureId: a.measureId, label: `Amendment ${a.number}${a.title ? ` — ${a.title}` : ""}` })),
    sittings: sits.map((s) => ({ id: s.id, title: s.title, date: isoDateIn(s.openedAt, dateStyleOf(actor.chamber)) })),
    rulebook: adopted ? { id: adopted.id, label: `${adopted.title} (version ${adopted.number})`, rules: citableRules(adopted.document), motions: motionChoices(adopted.document) } : null,
    rulings: earlier.map((r) => ({ id: r.id, label: `Ruling ${r.number} — ${r.targetLabel}` })),
  };
}

/**
 * The journal of a sitting: generated from the floor record (src/lib/journal/journal.ts), reviewed
 * by the clerk, approved as a record (stored), then changed only by correction entries, each
 * with its reason; never edited. Downloads (PDF, DOCX, Markdown) through the one document
 * renderer. Every query is scoped to the actor's chamber.
 */
import { and, asc, desc, eq, sql as dsql } from "drizzle-orm";
import { z } from "zod";
import { db } from "../db.ts";
import { user } from "../../db/schema/auth.ts";
import { legislators } from "../../db/schema/chamber.ts";
import { floorEvents, sittings } from "../../db/schema/floor.ts";
import { journalEntries } from "../../db/schema/journal.ts";
import { rulings } from "../../db/schema/rulings.ts";
import { GavelError } from "../../errors.ts";
import { journalDocument, journalOf, type Journal, type RecordEntry } from "../../journal/journal.ts";
import { documentText } from "../../documents/model.ts";
import { DECISION_LABELS, type Decision } from "../../rulings/ruling-content.ts";
import { dateStyleOf, formatDateTime } from "../../text/dates.ts";
import { documentResponse, type DocumentFormat } from "../documents/render.ts";
import { loadRulebook } from "./rulebooks.ts";
import type { Actor } from "../http.ts";

export const approveSchema = z.object({
  /** The floor record's revision the clerk reviewed; a record changed since is refused (409). */
  revision: z.number().int().min(0),
});
export const correctJournalSchema = z.object({
  revision: z.number().int().min(0),
  reason: z.string().trim().min(1, "say what the correction changes and why").max(1000),
});
export const journalQuerySchema = z.object({ format: z.enum(["json", "pdf", "docx", "md"]).default("json") });

const notFound = () => new GavelError("not-found", "No such sitting in this chamber.");

async function sittingRow(actor: Actor, id: string) {
  if (!z.uuid().safeParse(id).success) throw notFound();
  const [row] = await db.select().from(sittings).where(and(eq(sittings.id, id), eq(sittings.chamberId, actor.chamber.id)));
  if (!row) throw notFound();
  return row;
}

/** The journal generated from the floor record as it now stands. */
async function generate(actor: Actor, row: Awaited<ReturnType<typeof sittingRow>>): Promise<Journal> {
  const rb = await loadRulebook(actor.chamber.id, row.rulebookVersionId ?? undefined);
  const [entries, members, rulingRows] = await Promise.all([
    db
      .select({ seq: floorEvents.seq, payload: floorEvents.payload, summary: floorEvents.summary, by: user.name, at: floorEvents.createdAt })
      .from(floorEvents)
      .leftJoin(user, eq(floorEvents.actorId, user.id))
      .where(eq(floorEvents.sittingId, row.id))
      .orderBy(asc(floorEvents.seq)),
    db.select({ id: legislators.id, name: legislators.name }).from(legislators).where(eq(legislators.chamberId, actor.chamber.id)).orderBy(asc(legislators.name)),
    db
      .select({ number: rulings.number, question: rulings.question, decision: rulings.decision, decisionNote: rulings.decisionNote, raisedBy: rulings.raisedByName })
      .from(rulings)
      .where(and(eq(rulings.sittingId, row.id), eq(rulings.status, "issued")))
      .orderBy(asc(rulings.number)),
  ]);
  return journalOf({
    chamber: actor.chamber.name,
    sitting: row.title,
    openedAt: row.openedAt.toISOString(),
    closedAt: row.closedAt?.toISOString() ?? null,
    dates: dateStyleOf(actor.chamber),
    motions: Object.fromEntries(rb.rulebook.motions.map((m) => [m.id, m.name])),
    amendMotion: rb.rulebook.amendments.motion,
    members,
    entries: entries.map((e): RecordEntry => ({ seq: e.seq, payload: e.payload as RecordEntry["payload"], summary: e.summary, by: e.by, at: e.at.toISOString() })),
    rulings: rulingRows.map((r) => ({
      number: r.number,
      question: r.question ?? "",
      decision: r.decision ? `${DECISION_LABELS[r.decision as Decision] ?? ""}${r.decisionNote ? ` (${r.decisionNote})` : ""}.` : "",
      raisedBy: r.raisedBy ?? "",
    })),
  });
}

async function storedEntries(sittingId: string) {
  return db
    .select({ seq: journalEntries.seq, kind: journalEntries.kind, reason: journalEntries.reason, floorRevision: journalEntries.floorRevision, content: journalEntries.content, by: user.name, at: journalEntries.createdAt })
    .from(journalEntries)
    .leftJoin(user, eq(journalEntries.actorId, user.id))
    .where(eq(journalEntries.sittingId, sittingId))
    .orderBy(asc(journalEntries.seq));
}

function approvalLine(actor: Actor, entries: Awaited<ReturnType<typeof storedEntries>>): string | null {
  const first = entries[0];
  if (!first) return null;
  const style = dateStyleOf(actor.chamber);
  const corrections = entries.slice(1).map((c) => `corrected ${formatDateTime(c.at, style)}${c.by ? ` by ${c.by}` : ""}: ${c.reason}`);
  return `Approved ${formatDateTime(first.at, style)}${first.by ? ` by ${first.by}` : ""}${corrections.length ? `; ${corrections.join("; ")}` : ""}.`;
}

/** The sitting's journal: the approved record (if any, with its corrections) and the draft from the floor record now. */
export async function getJournal(actor: Actor, id: string) {
  const row = await sittingRow(actor, id);
  const [draft, entries] = await Promise.all([generate(actor, row), storedEntries(row.id)]);
  const last = entries[entries.length - 1];
  const approved = last ? (last.content as Journal) : null;
  return {
    sitting: { id: row.id, title: row.title, status: row.status, revision: row.revision },
    draft,
    approved,
    approval: approvalLine(actor, entries),
    entries: entries.map((e) => ({ seq: e.seq, kind: e.kind, reason: e.reason, floorRevision: e.floorRevision, by: e.by, at: e.at })),
    /** The floor record has changed since the journal was approved or last corrected. */
    recordChanged: last ? last.floorRevision !== row.revision : false,
  };
}

async function append(actor: Actor, id: string, revision: number, kind: "approved" | "correction", reason: string) {
  const row = await sittingRow(actor, id);
  if (row.revision !== revision)
    throw new GavelError("conflict", "The floor record changed since you reviewed the journal. Nothing was stored; review the journal again.", { issues: [{ path: "revision", message: `stale: the record is at revision ${row.revision}` }], details: { revision: row.revision } });
  const journal = await generate(actor, row);
  return db.transaction(async (tx) => {
    await tx.execute(dsql`select 1 from ${sittings} where ${sittings.id} = ${row.id} for update`);
    const [top] = await tx.select({ seq: journalEntries.seq }).from(journalEntries).where(eq(journalEntries.sittingId, row.id)).orderBy(desc(journalEntries.seq)).limit(1);
    if (kind === "approved" && top)
      throw new GavelError("conflict", "This journal is already approved. An approved journal is not edited: record a correction, with the reason.", { issues: [{ path: "journal", message: "already approved" }] });
    if (kind === "correction" && !top) throw new GavelError("conflict", "The journal has not been approved yet; review and approve it first.", { issues: [{ path: "journal", message: "not approved" }] });
    const text = documentText(journalDocument(journal, null));
    const seq = (top?.seq ?? 0) + 1;
    await tx.insert(journalEntries).values({ sittingId: row.id, chamberId: actor.chamber.id, seq, kind, reason, floorRevision: row.revision, content: journal, text, actorId: actor.user.id });
    return { seq, kind };
  });
}

export function approveJournal(actor: Actor, id: string, input: z.output<typeof approveSchema>) {
  return append(actor, id, input.revision, "approved", "");
}

export function correctJournal(actor: Actor, id: string, input: z.output<typeof correctJournalSchema>) {
  return append(actor, id, input.revision, "correction", input.reason);
}

/** The journal as a file: the approved record when there is one, else the draft (marked so). */
export async function journalFile(actor: Actor, id: string, format: Exclude<DocumentFormat, never>) {
  const j = await getJournal(actor, id);
  const doc = journalDocument(j.approved ?? j.draft, j.approval);
  return documentResponse(doc, format, `journal ${j.sitting.title}`);
}

export const journalSearchSchema = z.object({ q: z.string().trim().min(1).max(300), limit: z.coerce.number().int().min(1).max(50).default(20) });

/** Approved journals matching the words (websearch syntax), latest version of each, best first. */
export async function searchJournals(actor: Actor, q: { q: string; limit: number }) {
  const tsq = dsql`websearch_to_tsquery('english', ${q.q})`;
  const rows = await db.execute<{ sitting_id: string; title: string; rank: number; snippet: string; at: Date }>(dsql`
    select distinct on (j.sitting_id) j.sitting_id, s.title, ts_rank_cd(to_tsvector('english', j.text), ${tsq}) as rank,
      ts_headline('english', j.text, ${tsq}, 'StartSel=⟦, StopSel=⟧, MaxWords=35, MinWords=12, ShortWord=2') as snippet, s.opened_at as at
    from ${journalEntries} j join ${sittings} s on s.id = j.sitting_id
    where j.chamber_id = ${actor.chamber.id} and to_tsvector('english', j.text) @@ ${tsq}
      and j.seq = (select max(seq) from ${journalEntries} k where k.sitting_id = j.sitting_id)
    order by j.sitting_id`);
  return rows
    .map((r) => ({ sittingId: r.sitting_id, sitting: r.title, rank: Number(r.rank), snippet: r.snippet, openedAt: new Date(r.at).toISOString() }))
    .sort((a, b) => b.rank - a.rank)
    .slice(0, q.limit);
}

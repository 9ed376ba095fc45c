/**
 * The journal of a sitting's proceedings, generated from the floor record. Pure: a function of the
 * typed record below (the sitting's entries as stored, the roster's names, the rulings on points
 * of order raised in the sitting), no I/O.
 *
 * What a journal records is what was done, not what was said: "the Journal should contain a
 * record, principally, of what is done, and not what is said" (paraphrase of Robert's Rules of
 * Order Revised, 1915, §59 "Minutes"), so debate and who had the floor are left out; motions made
 * and by whom, each question put with its result and count, recorded votes by name, rulings, and
 * corrections are kept. A corrected entry is not dropped: it is shown struck through with the
 * correction that struck it and why, and the entry put in its place is shown as the correction.
 */
import { formatDate, formatDateTime, type DateStyle } from "../text/dates.ts";
import { questionName, type NamedQuestion } from "../procedure/question-name.ts";
import type { Block, DocumentModel, Run } from "../documents/model.ts";

/** One stored floor entry, as the record keeps it. */
export interface RecordEntry {
  seq: number;
  /** The stored payload: a floor event ({kind: "made" | "voted" | "strike" | …}). */
  payload: Record<string, unknown> & { kind: string };
  summary: string;
  by: string | null;
  at: string;
}

export interface RecordRuling {
  number: number;
  question: string;
  /** The decision in words ("The point of order is well taken."). */
  decision: string;
  raisedBy: string;
}

/** Everything the journal is generated from. */
export interface SittingRecord {
  chamber: string;
  sitting: string;
  openedAt: string;
  closedAt: string | null;
  dates: DateStyle;
  /** Motion ids to their names in the rulebook's catalogue, and the id of the motion to amend. */
  motions: Record<string, string>;
  amendMotion: string;
  /** The roster: legislator id to name, in the order of the roll. */
  members: Array<{ id: string; name: string }>;
  entries: RecordEntry[];
  rulings: RecordRuling[];
}

export type RollAnswer = "yea" | "nay" | "present" | "not-voting" | "recused";

export interface JournalItem {
  /** The floor entry it comes from. */
  entry: number;
  kind: "motion" | "question" | "withdrawn" | "rulebook" | "closed" | "correction";
  /** The journal's words for the entry. */
  text: string;
  /** A question put: its number in the order put, result and count in words. */
  question?: { number: number; name: string; result: "adopted" | "rejected"; count: string };
  /** A recorded vote: the members by their answer, in the roll's order. */
  roll?: Record<RollAnswer, string[]>;
  /** Struck out by a later correction: its entry number, reason, who and when. */
  struck?: { by: number; reason: string; who: string | null };
  /** A correction: the entry it strikes and why; `replacement` when it records a vote in its place. */
  correction?: { strikes: number; reason: string; replacement?: string };
  by: string | null;
  at: string;
}

export interface Journal {
  title: string;
  chamber: string;
  sitting: string;
  date: string;
  opened: string;
  closed: string | null;
  items: JournalItem[];
  rulings: RecordRuling[];
  /** How many questions were put (as the record now stands: struck votes not counted). */
  questionsPut: number;
}

interface Pending extends NamedQuestion {
  key: string;
  mover: string;
}

const ANSWERS: RollAnswer[] = ["yea", "nay", "present", "not-voting", "recused"];
export const ANSWER_WORDS: Record<RollAnswer, string> = { yea: "Yeas", nay: "Nays", present: "Present", "not-voting": "Not voting", recused: "Recused" };

function str(v: unknown): string {
  return typeof v === "string" ? v : "";
}

function tallyOf(p: Record<string, unknown>): { yes: number; no: number; abstain: number } | null {
  const t = p.tally as { yes?: unknown; no?: unknown; abstain?: unknown } | null | undefined;
  if (!t || typeof t.yes !== "number" || typeof t.no !== "number") return null;
  return { yes: t.yes, no: t.no, abstain: typeof t.abstain === "number" ? t.abstain : 0 };
}

/** "by 12 to 20, 3 abstaining", "by voice", "on a recorded vote, yeas 21, nays 12, 3 present". */
export function countWords(p: Record<string, unknown>): string {
  const t = tallyOf(p);
  if (!t) return "on a vote by voice";
  if (p.method === "recorded" || Array.isArray(p.roll)) {
    const casting = p.casting ? `; the votes being equally divided, the chair voted ${p.casting === "yea" ? "yea" : "nay"}` : "";
    return `on a recorded vote, yeas ${t.yes}, nays ${t.no}${t.abstain ? `, ${t.abstain} present` : ""}${casting}`;
  }
  return `on a division, ${t.yes} in favour, ${t.no} against${t.abstain ? `, ${t.abstain} abstaining` : ""}`;
}

function rollOf(p: Record<string, unknown>, members: SittingRecord["members"]): Record<RollAnswer, string[]> | undefined {
  if (!Array.isArray(p.roll)) return undefined;
  const answer = new Map<string, RollAnswer>();
  for (const r of p.roll as Array<{ member?: unknown; position?: unknown }>) if (typeof r.member === "string" && ANSWERS.includes(r.position as RollAnswer)) answer.set(r.member, r.position as RollAnswer);
  const out: Record<RollAnswer, string[]> = { yea: [], nay: [], present: [], "not-voting": [], recused: [] };
  // Members of the roster left out of the roll did not vote (floor-record.ts, votedEventSchema).
  for (const m of members) out[answer.get(m.id) ?? "not-voting"].push(m.name);
  return out;
}

/** The journal of a sitting from its floor record. */
export function journalOf(record: SittingRecord): Journal {
  const strikes = new Map<number, { by: number; reason: string; who: string | null; replacement: Record<string, unknown> | null }>();
  for (const e of record.entries)
    if (e.payload.kind === "strike" && typeof e.payload.entry === "number")
      strikes.set(e.payload.entry, { by: e.seq, reason: str(e.payload.reason), who: e.by, replacement: (e.payload.replacement as Record<string, unknown> | undefined) ?? null });

  const items: JournalItem[] = [];
  // Two stacks: the record as it now stands (names of questions), and the record as first written
  // (names for struck entries, so a struck vote is named as it was recorded).
  let pending: Pending[] = [];
  let questionsPut = 0;
  const name = (stack: Pending[]) => questionName(stack, stack.length - 1);

  const voteItem = (p: Record<string, unknown>, e: RecordEntry, stack: Pending[], counted: boolean): JournalItem => {
    const result = p.result === "rejected" ? "rejected" : "adopted";
    const qname = stack.length ? name(stack) : str(p.name) || "the question";
    const count = countWords(p);
    const number = counted ? ++questionsPut : 0;
    return {
      entry: e.seq,
      kind: "question",
      text: `The question was put on ${qname}, and it was ${result === "adopted" ? "agreed to" : "not agreed to"} ${count}.`,
      question: { number, name: qname, result, count },
      roll: rollOf(p, record.members),
      by: e.by,
      at: e.at,
    };
  };

  for (const e of record.entries) {
    const p = e.payload;
    const struck = strikes.get(e.seq);
    if (p.kind === "strike") {
      const target = record.entries.find((x) => x.seq === p.entry);
      const replacement = struck === undefined && p.replacement ? (p.replacement as Record<string, unknown>) : null;
      let replacementText: string | undefined;
      if (replacement && target) {
        const r = replacement;
        replacementText = `In its place: the question on ${str(target.payload.name) || "the question"} was ${r.result === "rejected" ? "not agreed to" : "agreed to"} ${countWords(r)}.`;
      }
      items.push({
        entry: e.seq,
        kind: "correction",
        text: `Correction: entry ${str(String(p.entry))} (${target?.summary ?? "an earlier entry"}) is struck out. Reason: ${str(p.reason)}${replacementText ? ` ${replacementText}` : ""}`,
        correction: { strikes: p.entry as number, reason: str(p.reason), replacement: replacementText },
        by: e.by,
        at: e.at,
      });
      continue;
    }
    const strikeInfo = struck ? { struck: { by: struck.by, reason: struck.reason, who: struck.who } } : {};
    // The event that stands in the record for this entry: itself, its replacement, or nothing.
    const standing = struck ? struck.replacement : p;
    switch (p.kind) {
      case "made": {
        const motion = str(p.motion);
        const top = pending[pending.length - 1];
        const degree = motion === record.amendMotion ? (top && top.degree !== null && top.motion === record.amendMotion ? top.degree + 1 : 1) : null;
        const item: Pending = { key: str(p.key) || `q${e.seq}`, motion, name: record.motions[motion] ?? motion, degree, text: str(p.text), ref: str(p.ref), mover: str(p.mover) };
        const stack = [...pending, item];
        items.push({ entry: e.seq, kind: "motion", text: `${item.mover ? `${item.mover} moved` : "It was moved"}: ${name(stack)}.`, by: e.by, at: e.at, ...strikeInfo });
        if (standing) pending = stack;
        break;
      }
      case "voted": {
        if (struck) items.push({ ...voteItem(p, e, pending, false), ...strikeInfo });
        if (standing) {
          if (!struck) items.push(voteItem(standing, e, pending, true));
          else questionsPut++;
          pending = standing.disposesBelow === true && standing.result === "adopted" ? [] : pending.slice(0, -1);
        }
        break;
      }
      case "withdrawn": {
        const i = pending.findIndex((q) => q.key === p.key);
        items.push({ entry: e.seq, kind: "withdrawn", text: i >= 0 ? `${questionName(pending, i)} was withdrawn${i < pending.length - 1 ? ", with the questions adhering to it" : ""}.` : "A question was withdrawn.", by: e.by, at: e.at, ...strikeInfo });
        if (standing && i >= 0) pending = pending.slice(0, i);
        break;
      }
      case "rulebook":
        items.push({ entry: e.seq, kind: "rulebook", text: e.summary, by: e.by, at: e.at, ...strikeInfo });
        break;
      case "close":
        items.push({ entry: e.seq, kind: "closed", text: `The sitting was closed at ${formatDateTime(e.at, record.dates)}.`, by: e.by, at: e.at, ...strikeInfo });
        break;
      default:
        // Seconds, statements, who had the floor and debate are not matters of the journal.
        break;
    }
  }
  return {
    title: `Journal of ${record.sitting}`,
    chamber: record.chamber,
    sitting: record.sitting,
    date: formatDate(record.openedAt, record.dates),
    opened: formatDateTime(record.openedAt, record.dates),
    closed: record.closedAt ? formatDateTime(record.closedAt, record.dates) : null,
    items,
    rulings: record.rulings,
    questionsPut,
  };
}

/** The journal as a document (PDF, DOCX, Markdown, the page's print view). */
export function journalDocument(j: Journal, approval: string | null): DocumentModel {
  const blocks: Block[] = [{ kind: "heading", level: 1, text: "Proceedings" }];
  for (const it of j.items) {
    const struck = it.struck !== undefined;
    const lead: Run[] = it.question && !struck ? [{ text: `Question ${it.question.number}. `, bold: true }] : it.kind === "correction" ? [{ text: "Correction. ", bold: true }] : [];
    const runs: Run[] = [...lead, { text: it.kind === "correction" ? it.text.replace(/^Correction: /, "") : it.text, struck }];
    if (struck) runs.push({ text: ` [Struck out by the correction in entry ${it.struck!.by}: ${it.struck!.reason}]`, italic: true });
    blocks.push({ kind: "paragraph", runs });
    if (it.roll && !struck) {
      const items = (Object.keys(ANSWER_WORDS) as RollAnswer[]).filter((a) => it.roll![a].length).map((a) => [{ text: `${ANSWER_WORDS[a]} (${it.roll![a].length}): `, bold: true }, { text: it.roll![a].join(", ") }]);
      blocks.push({ kind: "list", items });
    }
  }
  if (!j.items.length) blocks.push({ kind: "paragraph", runs: [{ text: "Nothing has been recorded in this sitting.", italic: true }] });
  blocks.push({ kind: "heading", level: 1, text: "Rulings on points of order" });
  if (!j.rulings.length) blocks.push({ kind: "paragraph", runs: [{ text: "No point of order was ruled on in this sitting.", italic: true }] });
  for (const r of j.rulings) blocks.push({ kind: "paragraph", runs: [{ text: `Ruling ${r.number}. `, bold: true }, { text: `${r.raisedBy ? `${r.raisedBy} raised a point of order: ` : ""}${r.question} ${r.decision}` }] });
  blocks.push({ kind: "note", text: approval ?? "Not yet approved: a draft generated from the floor record as it now stands." });
  return {
    title: j.title,
    subtitle: [j.chamber, `${j.date}. Opened ${j.opened}${j.closed ? `; closed ${j.closed}` : ""}.`, `${j.questionsPut} ${j.questionsPut === 1 ? "question" : "questions"} put.`],
    blocks,
    footer: `${j.chamber} — ${j.title}`,
  };
}

/**
 * The desk: what is current in the chamber today, for the person asking. One read of each
 * source, scoped to the chamber: the next sitting and the measures due at it, open floor
 * sittings, measures whose tree check has open errors, filing deadlines running out (the
 * adopted rulebook's filing deadline counted back from each measure's sitting), recent rulings,
 * analyses running (those the person may read), and, for those who may see addresses (chief
 * clerk and clerks), mail not delivered.
 */
import { and, asc, desc, eq, gt, inArray, isNotNull, isNull, ne, notInArray, or, sql as dsql } from "drizzle-orm";
import { db } from "../db.ts";
import { amendments, measures } from "../../db/schema/measures.ts";
import { legislators } from "../../db/schema/chamber.ts";
import { amendmentInWords } from "../../amendments/amendment-words.ts";
import { sittings } from "../../db/schema/floor.ts";
import { rulings } from "../../db/schema/rulings.ts";
import { analysisRuns, estimates } from "../../db/schema/estimates.ts";
import { outbox } from "../../db/schema/mail.ts";
import { can } from "../../permissions.ts";
import { dateStyleOf, isoDateIn } from "../../text/dates.ts";
import type { Actor } from "../http.ts";
import { adoptedRulebookOf } from "../measure-rulebook.ts";
import { visibleTo } from "./estimates.ts";
import { treeOf } from "./trees.ts";

/** Deadlines shown when they fall within this many days. */
export const DEADLINE_WINDOW_DAYS = 7;
/** Rulings shown when issued within this many days (at most RECENT_RULINGS of them). */
export const RECENT_RULING_DAYS = 30;
export const RECENT_RULINGS = 5;

const CLOSED_STATUSES = ["passed", "failed", "withdrawn"] as const;
const DAY = 86_400_000;

export interface MeasureRef {
  id: string;
  number: string;
  title: string;
}

export interface Desk {
  /** The earliest sitting after now that a measure is due at, and every measure due that day. */
  nextSitting: { at: string; measures: Array<MeasureRef & { at: string }> } | null;
  openSittings: Array<{ id: string; title: string; openedAt: string }>;
  treeErrors: Array<MeasureRef & { errors: number }>;
  deadlines: Array<MeasureRef & { deadline: string; sittingAt: string; hoursBefore: number; citation: string | null }>;
  recentRulings: Array<{ id: string; number: number; question: string; issuedAt: string }>;
  analysesRunning: Array<{ id: string; estimateId: string; estimateTitle: string; startedAt: string; progress: number }>;
  /**
   * The person's own amendments on measures still open: drafts they have not filed, and amendments
   * they filed or sponsor that are still pending. null for those who do not file amendments.
   */
  ownAmendments: Array<{ id: string; measureId: string; words: string; title: string | null; status: "draft" | "filed" }> | null;
  /** null when the person may not see it (it names recipients' addresses). */
  undeliveredMail: Array<{ id: string; to: string; subject: string; status: string; lastError: string | null; createdAt: string }> | null;
}

export async function deskOf(actor: Actor, now: Date = new Date()): Promise<Desk> {
  const chamberId = actor.chamber.id;
  const style = dateStyleOf(actor.chamber);
  const [active, open, issued, running, rb, mail] = await Promise.all([
    db
      .select({ id: measures.id, number: measures.number, title: measures.title, sittingAt: measures.sittingAt })
      .from(measures)
      .where(and(eq(measures.chamberId, chamberId), notInArray(measures.status, [...CLOSED_STATUSES]), isNull(measures.archivedAt)))
      .orderBy(asc(measures.number)),
    db.select({ id: sittings.id, title: sittings.title, openedAt: sittings.openedAt }).from(sittings).where(and(eq(sittings.chamberId, chamberId), eq(sittings.status, "open"))).orderBy(desc(sittings.openedAt)),
    db
      .select({ id: rulings.id, number: rulings.number, question: rulings.question, issuedAt: rulings.issuedAt })
      .from(rulings)
      .where(and(eq(rulings.chamberId, chamberId), eq(rulings.status, "issued"), isNotNull(rulings.issuedAt), gt(rulings.issuedAt, new Date(now.getTime() - RECENT_RULING_DAYS * DAY))))
      .orderBy(desc(rulings.issuedAt))
      .limit(RECENT_RULINGS),
    db
      .select({ id: analysisRuns.id, estimateId: estimates.id, title: estimates.title, createdAt: analysisRuns.createdAt, progress: analysisRuns.progress, authorId: estimates.authorId, sharedRoles: estimates.sharedRoles, sharedUsers: estimates.sharedUsers })
      .from(analysisRuns)
      .innerJoin(estimates, eq(estimates.id, analysisRuns.estimateId))
      .where(and(eq(analysisRuns.chamberId, chamberId), eq(estimates.chamberId, chamberId), eq(analysisRuns.status, "running")))
      .orderBy(asc(analysisRuns.createdAt)),
    adoptedRulebookOf(chamberId),
    can(actor.role, "people:see-email")
      ? db
          .select({ id: outbox.id, to: outbox.to, subject: outbox.subject, status: outbox.status, lastError: outbox.lastError, createdAt: outbox.createdAt })
          .from(outbox)
          .where(and(eq(outbox.chamberId, chamberId), or(inArray(outbox.status, ["failed", "uncertain"]), and(ne(outbox.status, "sent"), gt(outbox.attempts, 0)))))
          .orderBy(desc(outbox.createdAt))
          .limit(20)
      : Promise.resolve(null),
  ]);

  const upcoming = active.filter((m) => m.sittingAt && m.sittingAt.getTime() > now.getTime()).sort((a, b) => a.sittingAt!.getTime() - b.sittingAt!.getTime());
  let nextSitting: Desk["nextSitting"] = null;
  if (upcoming.length > 0) {
    const first = upcoming[0].sittingAt!;
    const day = isoDateIn(first, style);
    nextSitting = { at: first.toISOString(), measures: upcoming.filter((m) => isoDateIn(m.sittingAt!, style) === day).map((m) => ({ id: m.id, number: m.number, title: m.title, at: m.sittingAt!.toISOString() })) };
  }

  const rule = rb.rulebook.amendments.filingDeadline;
  const deadlines: Desk["deadlines"] = rule
    ? upcoming.flatMap((m) => {
        const deadline = m.sittingAt!.getTime() - rule.hoursBefore * 3_600_000;
        if (deadline <= now.getTime() || deadline - now.getTime() > DEADLINE_WINDOW_DAYS * DAY) return [];
        return [{ id: m.id, number: m.number, title: m.title, deadline: new Date(deadline).toISOString(), sittingAt: m.sittingAt!.toISOString(), hoursBefore: rule.hoursBefore, citation: rule.citation ?? null }];
      })
    : [];
  deadlines.sort((a, b) => a.deadline.localeCompare(b.deadline));

  // The tree check of every measure still open (each remembered per measure between writes).
  const trees = await Promise.all(active.map(async (m) => ({ m, errors: (await treeOf(actor, m.id)).counts.error })));
  const treeErrors = trees.filter((t) => t.errors > 0).map((t) => ({ id: t.m.id, number: t.m.number, title: t.m.title, errors: t.errors }));

  return {
    ownAmendments: can(actor.role, "amendment:file") ? await ownAmendmentsOf(actor, active) : null,
    nextSitting,
    openSittings: open.map((s) => ({ id: s.id, title: s.title, openedAt: s.openedAt.toISOString() })),
    treeErrors,
    deadlines,
    recentRulings: issued.map((r) => ({ id: r.id, number: r.number, question: r.question, issuedAt: r.issuedAt!.toISOString() })),
    analysesRunning: running.filter((r) => visibleTo(r, actor)).map((r) => ({ id: r.id, estimateId: r.estimateId, estimateTitle: r.title, startedAt: r.createdAt.toISOString(), progress: r.progress })),
    undeliveredMail: mail?.map((o) => ({ id: o.id, to: o.to, subject: o.subject, status: o.status, lastError: o.lastError, createdAt: o.createdAt.toISOString() })) ?? null,
  };
}

/** Drafts the person saved and pending amendments they filed or sponsor, on the measures given (those still open). */
async function ownAmendmentsOf(actor: Actor, open: ReadonlyArray<{ id: string; number: string }>): Promise<NonNullable<Desk["ownAmendments"]>> {
  if (open.length === 0) return [];
  const chamberId = actor.chamber.id;
  const mine = await db.select({ id: legislators.id }).from(legislators).where(and(eq(legislators.chamberId, chamberId), eq(legislators.userId, actor.user.id)));
  const rows = await db
    .select()
    .from(amendments)
    .where(
      and(
        eq(amendments.chamberId, chamberId),
        inArray(
          amendments.measureId,
          open.map((m) => m.id),
        ),
        or(and(eq(amendments.status, "draft"), eq(amendments.filedBy, actor.user.id)), and(eq(amendments.status, "filed"), or(eq(amendments.filedBy, actor.user.id), ...mine.map((l) => dsql`${amendments.sponsors} @> ${JSON.stringify([l.id])}::jsonb`)))),
      ),
    )
    .orderBy(asc(amendments.measureId), asc(amendments.number), asc(amendments.createdAt));
  const targets = rows.flatMap((a) => (a.targetAmendmentId ? [a.targetAmendmentId] : []));
  const targetOf = new Map(targets.length ? (await db.select({ id: amendments.id, number: amendments.number }).from(amendments).where(inArray(amendments.id, targets))).map((t) => [t.id, t]) : []);
  const measureNumber = new Map(open.map((m) => [m.id, m.number]));
  return rows.map((a) => {
    const words = amendmentInWords(a, measureNumber.get(a.measureId)!, a.targetAmendmentId ? targetOf.get(a.targetAmendmentId) : null);
    return { id: a.id, measureId: a.measureId, words, title: a.title, status: a.status as "draft" | "filed" };
  });
}

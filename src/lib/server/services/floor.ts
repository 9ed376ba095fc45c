/**
 * Sittings and the live floor: open a sitting, record what happens on the floor, read the
 * board (pending stack, floor facts, history) with the legal moves the core computes for it,
 * and answer hypothetical legal-moves questions. Every change is committed with its NOTIFY.
 */
import { and, asc, desc, eq, inArray } from "drizzle-orm";
import { z } from "zod";
import { safe, count } from "../../schema-parts.ts";
import { db } from "../db.ts";
import { user } from "../../db/schema/auth.ts";
import { floorEvents, sittings } from "../../db/schema/floor.ts";
import { legislators } from "../../db/schema/chamber.ts";
import { GavelError, parseWith } from "../../errors.ts";
import { legalMoves } from "../../procedure/legal-moves.ts";
import { applyFloorEvent, boardSchema, checkVote, EMPTY_BOARD, floorEventSchema, floorStateOf, questionName, questionThreshold, quorumNeeded, replayBoard, storedKey, thresholdNeedsCount, thresholdWords, withQuestion, type Board, type Entry, type FloorEvent, type Roster } from "../floor-record.ts";
import type { Rulebook } from "../../procedure/rulebook-schema.ts";
import { notifyFloor } from "../floor-bus.ts";
import { loadRulebook, rulebookInForce, versionIdSchema } from "./rulebooks.ts";
import type { Actor } from "../http.ts";
import { Memo, memoKey } from "../memo.ts";

export const movesRequestSchema = z.object({
  /** A rulebook version of the chamber; the version in force when omitted. */
  version: versionIdSchema.optional(),
  /** The floor state asked about: {pending (bottom first), floor}; checked by the core. */
  state: z.unknown().default({}),
});

export const openSittingSchema = z.object({ title: safe(z.string().trim().min(1).max(200)) });

export const recordSchema = z.object({
  /** The board revision the clerk was looking at; a stale one is refused with what changed. */
  revision: count(),
  event: floorEventSchema,
});

// Legal moves depend only on the (immutable) rulebook version and the state asked about.
const movesMemo = new Memo<Awaited<ReturnType<typeof legalMoves>>>(500);

/** Legal moves for any floor state, real or hypothetical; stores nothing. */
export async function legalMovesFor(actor: Actor, input: z.output<typeof movesRequestSchema>) {
  const rb = await loadRulebook(actor.chamber.id, input.version);
  const key = memoKey(rb.versionId, input.state);
  const moves = key === null ? await legalMoves(rb.rulebook, input.state) : await movesMemo.get(key, () => legalMoves(rb.rulebook, input.state));
  return { rulebook: { versionId: rb.versionId, number: rb.number, title: rb.title }, moves };
}

export async function listSittings(actor: Actor) {
  return {
    sittings: await db
      .select({ id: sittings.id, title: sittings.title, status: sittings.status, revision: sittings.revision, openedAt: sittings.openedAt, closedAt: sittings.closedAt })
      .from(sittings)
      .where(eq(sittings.chamberId, actor.chamber.id))
      .orderBy(asc(sittings.status), desc(sittings.openedAt)),
  };
}

async function sittingRow(chamberId: string, id: string) {
  if (!z.uuid().safeParse(id).success) throw new GavelError("not-found", "No such sitting in this chamber.");
  const [row] = await db.select().from(sittings).where(and(eq(sittings.id, id), eq(sittings.chamberId, chamberId)));
  if (!row) throw new GavelError("not-found", "No such sitting in this chamber.");
  return row;
}

/** Check a sitting is visible to the actor (used before opening its event stream). */
export async function sittingExists(actor: Actor, id: string): Promise<void> {
  await sittingRow(actor.chamber.id, id);
}

export async function openSitting(actor: Actor, input: z.output<typeof openSittingSchema>) {
  // The sitting is judged by the rulebook in force; refuse to open one without a rulebook.
  const rb = await loadRulebook(actor.chamber.id);
  return db.transaction(async (tx) => {
    const [row] = await tx.insert(sittings).values({ chamberId: actor.chamber.id, title: input.title, rulebookVersionId: rb.versionId, state: EMPTY_BOARD, openedBy: actor.user.id }).returning({ id: sittings.id, title: sittings.title, revision: sittings.revision });
    await notifyFloor(tx, { chamberId: actor.chamber.id, sittingId: row.id, revision: 0, kind: "opened" });
    return row;
  });
}

export async function getSitting(actor: Actor, id: string) {
  const row = await sittingRow(actor.chamber.id, id);
  const board = parseWith(boardSchema, row.state, "stored board");
  const rb = await loadRulebook(actor.chamber.id, row.rulebookVersionId);
  const rows = await db
    .select({ seq: floorEvents.seq, kind: floorEvents.kind, payload: floorEvents.payload, summary: floorEvents.summary, by: user.name, at: floorEvents.createdAt })
    .from(floorEvents)
    .leftJoin(user, eq(floorEvents.actorId, user.id))
    .where(eq(floorEvents.sittingId, row.id))
    .orderBy(asc(floorEvents.seq));
  // Each struck entry carries the correction that struck it (its number, reason, who and when).
  const struckBy = new Map<number, { entry: number; reason: string; by: string | null; at: Date }>();
  for (const r of rows) {
    const p = r.payload as { kind?: string; entry?: number; reason?: string };
    if (r.kind === "strike" && typeof p.entry === "number") struckBy.set(p.entry, { entry: r.seq, reason: p.reason ?? "", by: r.by, at: r.at });
  }
  const history = rows.map((r) => ({
    seq: r.seq,
    kind: r.kind,
    summary: r.summary,
    by: r.by,
    at: r.at,
    struck: struckBy.get(r.seq) ?? null,
    strikes: r.kind === "strike" ? ((r.payload as { entry?: number }).entry ?? null) : null,
  }));
  const inForce = await rulebookInForce(actor.chamber.id);
  const state = floorStateOf(board);
  return {
    sitting: { id: row.id, title: row.title, status: row.status, revision: row.revision, openedAt: row.openedAt, closedAt: row.closedAt },
    rulebook: { versionId: rb.versionId, number: rb.number, title: rb.title },
    /** The version in force today; `superseded` when the sitting is judged by another (older) one. */
    inForce: inForce ? { versionId: inForce.versionId, number: inForce.number, title: inForce.title, since: inForce.effectiveFrom } : null,
    superseded: inForce !== null && inForce.versionId !== rb.versionId,
    board,
    state,
    /** The immediately pending question as the clerk reads it, with the threshold that decides it. */
    question: questionOf(rb.rulebook, board, (await db.select({ id: legislators.id }).from(legislators).where(eq(legislators.chamberId, actor.chamber.id))).length),
    moves: await legalMoves(rb.rulebook, state),
    history,
  };
}

function questionOf(rulebook: Rulebook, board: Board, rosterSize: number) {
  const i = board.pending.length - 1;
  if (i < 0) return null;
  const threshold = questionThreshold(rulebook, board.pending[i]);
  const methods = rulebook.voting.methods;
  const demand = methods?.recordedOnDemand;
  return {
    key: board.pending[i].key,
    name: questionName(board.pending, i),
    threshold: thresholdWords(threshold),
    needsCount: thresholdNeedsCount(threshold),
    /** The ways of voting the rulebook provides for (all three when it does not say). */
    methods: methods?.available ?? ["voice", "division", "recorded"],
    /** Members whose presence makes a quorum (null: the rulebook sets none), and what orders a recorded vote, in words. */
    quorum: quorumNeeded(rulebook, rulebook.chamber.members ?? rosterSize),
    demand: demand ? `${demand.kind === "share-of-present" ? `a demand by ${demand.numerator === 1 && demand.denominator === 5 ? "one fifth" : `${demand.numerator}/${demand.denominator}`} of those present` : demand.kind === "majority-vote" ? "a majority vote of the assembly" : "the demand of any member"} (${demand.citation})` : null,
    /** The rulebook gives the chair a casting vote on an equal division. */
    casting: ["chair-casting-vote", "chair-may-make-or-break-tie"].includes(rulebook.voting.tieRule),
  };
}

/** Record one event on the floor: checked, applied, stored with its history line and NOTIFY, atomically. */
export async function recordEvent(actor: Actor, id: string, input: z.output<typeof recordSchema>) {
  const head = await sittingRow(actor.chamber.id, id);
  const rb = await loadRulebook(actor.chamber.id, head.rulebookVersionId);
  return db.transaction(async (tx) => {
    const [row] = await tx.select().from(sittings).where(and(eq(sittings.id, id), eq(sittings.chamberId, actor.chamber.id))).for("update");
    if (row.status !== "open") throw new GavelError("conflict", "This sitting is closed; nothing can be recorded in it.", { issues: [{ path: "sitting", message: "closed" }] });
    if (row.revision !== input.revision) {
      const since = await tx.select({ seq: floorEvents.seq, summary: floorEvents.summary }).from(floorEvents).where(and(eq(floorEvents.sittingId, id))).orderBy(asc(floorEvents.seq));
      const missed = since.filter((e) => e.seq > input.revision);
      throw new GavelError("conflict", `The floor changed since you looked: ${missed.map((e) => e.summary).join("; ")}. Nothing was recorded; check the form against the floor and record again.`, {
        issues: [{ path: "revision", message: `stale: the board is at revision ${row.revision}` }],
        details: { revision: row.revision, missed },
      });
    }
    const board = parseWith(boardSchema, row.state, "stored board");
    const revision = row.revision + 1;
    const event = input.event;
    let next: Board;
    let summary: string;
    let payload: Record<string, unknown>;
    let versionChange: string | null = null;
    if (event.kind === "strike") {
      ({ board: next, summary, payload } = await strikeEntry(tx, actor.chamber.id, row, revision, event));
    } else if (event.kind === "rulebook") {
      const inForce = await rulebookInForce(actor.chamber.id, new Date(), tx);
      if (!inForce || inForce.versionId !== event.version) throw new GavelError("conflict", `That is not the rulebook version in force${inForce ? `; version ${inForce.number} is` : ""}. Nothing was recorded.`, { issues: [{ path: "event.version", message: "not the version in force" }] });
      if (inForce.versionId === rb.versionId) throw new GavelError("conflict", `The sitting is already judged by version ${inForce.number}, the version in force.`, { issues: [{ path: "event.version", message: "already the version judging the sitting" }] });
      next = board;
      versionChange = inForce.versionId;
      summary = `From now on the sitting is judged by rulebook version ${inForce.number} (${inForce.title}), the version in force, in place of version ${rb.number} (${rb.title}).`;
      payload = { kind: "rulebook", version: inForce.versionId, from: rb.versionId };
    } else {
      await checkInOrder(rb.rulebook, board, event);
      const checked = withQuestion(board, event.kind === "voted" ? checkVote(rb.rulebook, board, event, event.roll ? await rosterOf(tx, actor.chamber.id) : undefined) : event);
      const key = `q${revision}`;
      ({ board: next, summary } = applyFloorEvent(rb.rulebook, board, checked, key));
      // A vote keeps the name of its question, so recorded votes can be read without replaying the sitting.
      payload = checked.kind === "made" ? { ...checked, key } : checked.kind === "voted" ? { ...checked, name: questionName(board.pending, board.pending.length - 1) } : { ...checked };
    }
    await tx
      .update(sittings)
      .set({ state: next, revision, ...(event.kind === "close" ? { status: "closed" as const, closedAt: new Date() } : {}), ...(versionChange ? { rulebookVersionId: versionChange } : {}) })
      .where(eq(sittings.id, id));
    await tx.insert(floorEvents).values({ sittingId: id, chamberId: actor.chamber.id, seq: revision, kind: event.kind, payload, summary, actorId: actor.user.id });
    await notifyFloor(tx, { chamberId: actor.chamber.id, sittingId: id, revision, kind: event.kind });
    return { revision, summary, board: next };
  });
}

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

/** The chamber's roster as a recorded vote is checked against it. */
async function rosterOf(tx: Tx, chamberId: string): Promise<Roster> {
  const rows = await tx.select({ id: legislators.id }).from(legislators).where(eq(legislators.chamberId, chamberId));
  return { ids: new Set(rows.map((r) => r.id)), size: rows.length };
}

export const recordedVotesQuerySchema = z.object({ sitting: z.uuid().optional() });

/**
 * The chamber's recorded votes (roll calls) as the record now stands: a struck-out vote is left
 * out, a vote recorded in its place by a correction is in. Each with the members by their answer
 * (legislator ids), so they can be read as {id, yea: [...], nay: [...]}. Oldest first.
 */
export async function recordedVotes(actor: Actor, query: z.output<typeof recordedVotesQuerySchema> = {}) {
  const rows = await db
    .select({ id: floorEvents.id, sittingId: floorEvents.sittingId, sitting: sittings.title, seq: floorEvents.seq, kind: floorEvents.kind, payload: floorEvents.payload, at: floorEvents.createdAt })
    .from(floorEvents)
    .innerJoin(sittings, eq(floorEvents.sittingId, sittings.id))
    .where(and(eq(floorEvents.chamberId, actor.chamber.id), inArray(floorEvents.kind, ["voted", "strike"]), ...(query.sitting ? [eq(floorEvents.sittingId, query.sitting)] : [])))
    .orderBy(asc(floorEvents.createdAt), asc(floorEvents.seq));
  const struck = new Set(rows.filter((r) => r.kind === "strike").map((r) => `${r.sittingId}:${(r.payload as { entry?: number }).entry}`));
  type Stored = { method?: string; result?: string; name?: string; casting?: string; roll?: Array<{ member: string; position: string }> };
  const votes = [];
  for (const r of rows) {
    const vote = (r.kind === "strike" ? (r.payload as { replacement?: Stored }).replacement : (r.payload as Stored)) ?? null;
    if (!vote || vote.method !== "recorded" || !vote.roll) continue;
    if (r.kind === "voted" && struck.has(`${r.sittingId}:${r.seq}`)) continue;
    const by = (p: string) => vote.roll!.filter((x) => x.position === p).map((x) => x.member);
    votes.push({
      id: r.id,
      sittingId: r.sittingId,
      sitting: r.sitting,
      entry: r.seq,
      question: vote.name ?? "",
      result: vote.result,
      casting: vote.casting ?? null,
      at: r.at,
      yea: by("yea"),
      nay: by("nay"),
      present: by("present"),
      notVoting: by("not-voting"),
      recused: by("recused"),
    });
  }
  return { votes };
}
const UNSTRIKABLE: Record<string, string> = {
  strike: "a correction is not struck out; record a new correction of the entry it struck",
  rulebook: "a change of rulebook version is not struck out; the version in force judges the sitting",
  close: "the sitting is closed",
};

/**
 * A correction: the entry is struck out (never edited or deleted) and the board is recomputed
 * from the record as if it had never been recorded, with the replacement vote, if any, in its
 * place. Refused, with nothing stored, when a later entry would no longer hold.
 */
async function strikeEntry(tx: Tx, chamberId: string, row: typeof sittings.$inferSelect, revision: number, event: Extract<FloorEvent, { kind: "strike" }>) {
  const rows = await tx.select({ seq: floorEvents.seq, kind: floorEvents.kind, payload: floorEvents.payload, summary: floorEvents.summary }).from(floorEvents).where(eq(floorEvents.sittingId, row.id)).orderBy(asc(floorEvents.seq));
  const target = rows.find((r) => r.seq === event.entry);
  if (!target) throw new GavelError("invalid-input", `There is no entry ${event.entry} in this sitting's history.`, { issues: [{ path: "event.entry", message: "no such entry" }] });
  if (UNSTRIKABLE[target.kind]) throw new GavelError("unprocessable", `Entry ${target.seq} (${target.summary}) cannot be struck out: ${UNSTRIKABLE[target.kind]}.`, { issues: [{ path: "event.entry", message: "cannot be struck out" }] });
  const earlier = rows.find((r) => r.kind === "strike" && (r.payload as { entry?: number }).entry === target.seq);
  if (earlier) throw new GavelError("conflict", `Entry ${target.seq} was already struck out by entry ${earlier.seq}.`, { issues: [{ path: "event.entry", message: "already struck out" }] });
  if (event.replacement && target.kind !== event.replacement.kind) throw new GavelError("invalid-input", "Only a vote can be recorded in place of a struck-out vote.", { issues: [{ path: "event.replacement", message: "only a vote replaces a vote" }] });

  // The rulebook each entry is read by: the first version switch says which version judged the sitting before it.
  const switches = rows.filter((r) => r.kind === "rulebook").map((r) => r.payload as { version: string; from?: string });
  const initial = switches[0]?.from ?? row.rulebookVersionId;
  if (!initial) throw new GavelError("conflict", "The rulebook version this sitting was judged by no longer exists; the record cannot be recomputed.");
  const versions = new Map<string, Rulebook>();
  for (const v of new Set([initial, ...switches.map((s) => s.version)])) versions.set(v, (await loadRulebook(chamberId, v)).rulebook);
  const rulebookOf = (v: string) => versions.get(v) ?? versions.get(initial)!;
  const entries: Entry[] = rows.map((r) => ({ seq: r.seq, payload: r.payload, summary: r.summary }));

  let replacement: FloorEvent | undefined;
  let instead = "";
  if (event.replacement) {
    // The vote in place of the struck one is checked against the floor as it stood before it.
    const before = replayBoard(entries.filter((e) => e.seq < target.seq || rows.find((r) => r.seq === e.seq)?.kind === "strike"), initial, rulebookOf);
    const versionThen = [...rows].filter((r) => r.kind === "rulebook" && r.seq < target.seq).map((r) => (r.payload as { version: string }).version).pop() ?? initial;
    const question = (target.payload as { question?: string }).question;
    const vote = checkVote(rulebookOf(versionThen), before, { ...event.replacement, question: question ?? event.replacement.question }, event.replacement.roll ? await rosterOf(tx, chamberId) : undefined);
    replacement = { ...vote, name: questionName(before.pending, before.pending.length - 1) } as FloorEvent;
    instead = `; recorded instead: ${applyFloorEvent(rulebookOf(versionThen), before, vote, storedKey(target.payload, target.seq)).summary.replace(/^Voted: /, "")}`;
  }
  const payload = { kind: "strike", entry: target.seq, reason: event.reason, ...(replacement ? { replacement } : {}) };
  const board = replayBoard([...entries, { seq: revision, payload, summary: "" }], initial, rulebookOf);
  return { board, payload, summary: `Struck out entry ${target.seq} (${target.summary}). Reason: ${event.reason}${instead}` };
}

/** A motion made out of order is refused with the rulebook's reasons unless the clerk records that the chair admitted it. */
async function checkInOrder(rulebook: Parameters<typeof legalMoves>[0], board: Board, event: FloorEvent): Promise<void> {
  if (event.kind !== "made" || event.overrule) return;
  const verdict = (await legalMoves(rulebook, floorStateOf(board))).find((v) => v.motion === event.motion);
  if (verdict && !verdict.inOrder) {
    throw new GavelError("unprocessable", `${verdict.name} is out of order now: ${verdict.reasons.map((r) => `${r.message} (${r.citation})`).join("; ")}. If the chair admitted it, record it as admitted by the chair.`, {
      issues: [{ path: "event.motion", message: "out of order under the rulebook" }],
      details: { reasons: verdict.reasons },
    });
  }
}

/**
 * Sittings and the live floor: open a sitting, record what happens on the floor, read the
 * board (pending stack, floor facts, history) with the legal moves the core computes for it,
 * and answer hypothetical legal-moves questions. Every change is committed with its NOTIFY.
 */
import { and, asc, desc, eq } from "drizzle-orm";
import { randomUUID } from "node:crypto";
import { z } from "zod";
import { safe, count } from "../../schema-parts.ts";
import { db } from "../db.ts";
import { user } from "../../db/schema/auth.ts";
import { floorEvents, sittings } from "../../db/schema/floor.ts";
import { GavelError, parseWith } from "../../errors.ts";
import { legalMoves } from "../../procedure/legal-moves.ts";
import { applyFloorEvent, boardSchema, EMPTY_BOARD, floorEventSchema, floorStateOf, type Board, type FloorEvent } from "../floor-record.ts";
import { notifyFloor } from "../floor-bus.ts";
import { loadRulebook, versionIdSchema } from "./rulebooks.ts";
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
  const history = await db
    .select({ seq: floorEvents.seq, kind: floorEvents.kind, summary: floorEvents.summary, by: user.name, at: floorEvents.createdAt })
    .from(floorEvents)
    .leftJoin(user, eq(floorEvents.actorId, user.id))
    .where(eq(floorEvents.sittingId, row.id))
    .orderBy(asc(floorEvents.seq));
  const state = floorStateOf(board);
  return {
    sitting: { id: row.id, title: row.title, status: row.status, revision: row.revision, openedAt: row.openedAt, closedAt: row.closedAt },
    rulebook: { versionId: rb.versionId, number: rb.number, title: rb.title },
    board,
    state,
    moves: await legalMoves(rb.rulebook, state),
    history,
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
      throw new GavelError("conflict", `The floor changed since you looked (now at ${row.revision}, you saw ${input.revision}): ${missed.map((e) => e.summary).join("; ")}. Nothing was recorded.`, {
        issues: [{ path: "revision", message: `stale: the board is at revision ${row.revision}` }],
        details: { revision: row.revision, missed },
      });
    }
    const board = parseWith(boardSchema, row.state, "stored board");
    await checkInOrder(rb.rulebook, board, input.event);
    const { board: next, summary } = applyFloorEvent(rb.rulebook, board, input.event, randomUUID().slice(0, 8));
    const revision = row.revision + 1;
    await tx
      .update(sittings)
      .set({ state: next, revision, ...(input.event.kind === "close" ? { status: "closed" as const, closedAt: new Date() } : {}) })
      .where(eq(sittings.id, id));
    await tx.insert(floorEvents).values({ sittingId: id, chamberId: actor.chamber.id, seq: revision, kind: input.event.kind, payload: input.event, summary, actorId: actor.user.id });
    await notifyFloor(tx, { chamberId: actor.chamber.id, sittingId: id, revision, kind: input.event.kind });
    return { revision, summary, board: next };
  });
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

/**
 * The live floor's bookkeeping: the pending-question stack and the floor facts as a clerk
 * records them (made, seconded, stated, voted, withdrawn; who has the floor), and the floor
 * state handed to the core's legalMoves. Pure. Whether a motion is in order is never decided
 * here: that is legalMoves over the rulebook's rules. This module only keeps the record
 * consistent (an amendment's degree follows the stack, as in Robert's Rules of Order Revised
 * (1915) §33; a motion needing a second is not stated before it is seconded, §4; withdrawing a
 * question takes what adheres to it with it, §27).
 */
import { z } from "zod";
import { safe, count } from "../schema-parts.ts";
import { idSchema } from "../amendments/case-schema.ts";
import { GavelError } from "../errors.ts";
import type { FloorStateInput } from "../procedure/floor-state-schema.ts";
import type { Rulebook } from "../procedure/rulebook-schema.ts";

export const STAGES = ["made", "seconded", "stated"] as const;

export const pendingItemSchema = z.object({
  key: safe(z.string().min(1).max(40)),
  motion: idSchema,
  name: safe(z.string().max(200)),
  degree: z.number().int().min(1).max(10).nullable(),
  text: safe(z.string().max(2000)),
  mover: safe(z.string().max(200)),
  stage: z.enum(STAGES),
  debateBegun: z.boolean(),
});
export type PendingItem = z.output<typeof pendingItemSchema>;

export const tallySchema = z.object({ yes: z.number().int().min(0).max(100_000), no: z.number().int().min(0).max(100_000), abstain: z.number().int().min(0).max(100_000).default(0) });

export const boardSchema = z.object({
  pending: z.array(pendingItemSchema).max(100),
  speaker: safe(z.string().max(200)).nullable(),
  chairHasRuled: z.boolean(),
  voteTaken: z.boolean(),
  tabled: count(),
  lastVote: z.object({ motion: idSchema, name: z.string(), result: z.enum(["adopted", "rejected"]), tally: tallySchema.nullable() }).nullable(),
  /** Sitting as a Committee of the Whole (US House Rule XVIII); boards stored before this field read as false. */
  committeeOfTheWhole: z.boolean().default(false),
});
export type Board = z.output<typeof boardSchema>;

export const EMPTY_BOARD: Board = { pending: [], speaker: null, chairHasRuled: false, voteTaken: false, tabled: 0, lastVote: null, committeeOfTheWhole: false };

const shortText = (max: number) => safe(z.string().trim().max(max));

export const floorEventSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("made"), motion: idSchema, text: shortText(2000).default(""), mover: shortText(200).default(""), overrule: z.boolean().default(false) }),
  z.object({ kind: z.literal("seconded") }),
  z.object({ kind: z.literal("stated") }),
  z.object({ kind: z.literal("voted"), result: z.enum(["adopted", "rejected"]), tally: tallySchema.nullable().default(null), disposesBelow: z.boolean().default(false) }),
  z.object({ kind: z.literal("withdrawn"), key: safe(z.string().min(1).max(40)) }),
  z.object({ kind: z.literal("floor"), speaker: shortText(200).nullable().optional(), debateBegun: z.boolean().optional(), chairHasRuled: z.boolean().optional(), committeeOfTheWhole: z.boolean().optional() }),
  z.object({ kind: z.literal("close") }),
]);
export type FloorEvent = z.output<typeof floorEventSchema>;

/** The state legalMoves judges: the stack (bottom first) and the floor facts. */
export function floorStateOf(board: Board): FloorStateInput {
  const top = board.pending[board.pending.length - 1];
  return {
    pending: board.pending.map((p) => (p.degree !== null ? { motion: p.motion, degree: p.degree } : { motion: p.motion })),
    floor: {
      speakerHasFloor: board.speaker !== null,
      debateBegun: top?.debateBegun ?? false,
      chairHasRuled: board.chairHasRuled,
      voteTaken: board.voteTaken,
      tabled: board.tabled,
      // The last vote recorded, so reconsider is judged by what was voted and how (RONR 1915 §36);
      // its day is not recorded, so no time limit is applied here.
      votes: board.lastVote ? [{ motion: board.lastVote.motion, result: board.lastVote.result }] : [],
      committeeOfTheWhole: board.committeeOfTheWhole,
    },
  };
}

function refuse(message: string, path = "event.kind"): never {
  throw new GavelError("unprocessable", message, { issues: [{ path, message }] });
}

/** Apply one recorded event; returns the new board and a one-line summary for the history. */
export function applyFloorEvent(rulebook: Rulebook, board: Board, event: FloorEvent, key: string): { board: Board; summary: string } {
  const pending = [...board.pending];
  const top = pending[pending.length - 1];
  switch (event.kind) {
    case "made": {
      const m = rulebook.motions.find((x) => x.id === event.motion);
      if (!m) refuse(`No motion "${event.motion}" in the rulebook's catalogue.`, "event.motion");
      const amendId = rulebook.amendments.motion;
      const degree = m.id === amendId ? (top?.motion === amendId && top.degree !== null ? top.degree + 1 : 1) : null;
      pending.push({ key, motion: m.id, name: m.name, degree, text: event.text, mover: event.mover, stage: "made", debateBegun: false });
      const who = event.mover ? `${event.mover} moved` : "Moved";
      return { board: { ...board, pending, speaker: null }, summary: `${who}: ${m.name}${degree ? ` (degree ${degree})` : ""}${event.text ? ` — ${event.text}` : ""}${event.overrule ? " [admitted by the chair]" : ""}` };
    }
    case "seconded": {
      if (!top) refuse("Nothing is pending to second.");
      if (top.stage !== "made") refuse(`${top.name} is already ${top.stage}.`);
      pending[pending.length - 1] = { ...top, stage: "seconded" };
      return { board: { ...board, pending }, summary: `Seconded: ${top.name}` };
    }
    case "stated": {
      if (!top) refuse("Nothing is pending to state.");
      if (top.stage === "stated") refuse(`${top.name} has already been stated by the chair.`);
      const needsSecond = rulebook.motions.find((x) => x.id === top.motion)?.second ?? false;
      if (needsSecond && top.stage !== "seconded") refuse(`${top.name} needs a second before the chair states it.`);
      pending[pending.length - 1] = { ...top, stage: "stated" };
      return { board: { ...board, pending }, summary: `The chair stated the question: ${top.name}` };
    }
    case "voted": {
      if (!top) refuse("Nothing is pending to vote on.");
      const rest = event.disposesBelow && event.result === "adopted" ? [] : pending.slice(0, -1);
      const tabled = top.motion === "lay-on-table" && event.result === "adopted" ? board.tabled + 1 : board.tabled;
      const tally = event.tally ? ` (${event.tally.yes}–${event.tally.no}${event.tally.abstain ? `, ${event.tally.abstain} abstaining` : ""})` : "";
      return {
        board: { ...board, pending: rest, speaker: null, voteTaken: true, tabled, lastVote: { motion: top.motion, name: top.name, result: event.result, tally: event.tally } },
        summary: `Voted: ${top.name} ${event.result}${tally}${rest.length < pending.length - 1 ? "; the questions below leave the floor with it" : ""}`,
      };
    }
    case "withdrawn": {
      const i = pending.findIndex((p) => p.key === event.key);
      if (i < 0) refuse("That question is no longer pending.", "event.key");
      const gone = pending[i];
      return { board: { ...board, pending: pending.slice(0, i) }, summary: `Withdrawn: ${gone.name}${i < pending.length - 1 ? ` (with ${pending.length - 1 - i} question(s) adhering to it)` : ""}` };
    }
    case "floor": {
      const next = { ...board };
      const parts: string[] = [];
      if (event.speaker !== undefined) {
        next.speaker = event.speaker || null;
        parts.push(next.speaker ? `${next.speaker} has the floor` : "No one has the floor");
      }
      if (event.debateBegun !== undefined) {
        if (!top) refuse("Nothing is pending to debate.", "event.debateBegun");
        pending[pending.length - 1] = { ...top, debateBegun: event.debateBegun };
        next.pending = pending;
        parts.push(event.debateBegun ? `Debate begun on ${top.name}` : `Debate not yet begun on ${top.name}`);
      }
      if (event.chairHasRuled !== undefined) {
        next.chairHasRuled = event.chairHasRuled;
        parts.push(event.chairHasRuled ? "The chair has ruled" : "No ruling awaiting appeal");
      }
      if (event.committeeOfTheWhole !== undefined) {
        next.committeeOfTheWhole = event.committeeOfTheWhole;
        parts.push(event.committeeOfTheWhole ? "Sitting as a Committee of the Whole" : "Sitting as the chamber (out of Committee of the Whole)");
      }
      if (!parts.length) refuse("Say what changed on the floor.", "event");
      return { board: next, summary: parts.join("; ") };
    }
    case "close":
      return { board, summary: "The sitting was closed." };
  }
}

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
import { questionName } from "../procedure/question-name.ts";
import type { ThresholdSpec } from "../procedure/voting-section.ts";
import { adopts, needsMembership, toThreshold } from "../voting/vote-threshold.ts";
import { quorumStatus } from "../voting/vote-rules.ts";
import { demandNeeded, ROLL_POSITIONS, VOTING_METHODS, type VotingMethod } from "../procedure/voting-methods.ts";

export const STAGES = ["made", "seconded", "stated"] as const;

export const pendingItemSchema = z.object({
  key: safe(z.string().min(1).max(40)),
  motion: idSchema,
  name: safe(z.string().max(200)),
  degree: z.number().int().min(1).max(10).nullable(),
  text: safe(z.string().max(2000)),
  mover: safe(z.string().max(200)),
  /** The clerk's short reference for the question ("A2"), used to name it; empty when none was given. */
  ref: safe(z.string().max(40)).default(""),
  stage: z.enum(STAGES),
  debateBegun: z.boolean(),
});
export type PendingItem = z.output<typeof pendingItemSchema>;

const tallyCount = z.number({ error: "must be a whole number (0 or more)" }).int("must be a whole number (0 or more)").min(0, "must be a whole number (0 or more)").max(100_000);
export const tallySchema = z.object({ yes: tallyCount, no: tallyCount, abstain: tallyCount.default(0) });
export type Tally = z.output<typeof tallySchema>;

/** How a vote was taken: voice, division (counted) or recorded (roll call); see voting-methods.ts. */
export const VOTE_METHODS = VOTING_METHODS;
export type VoteMethod = VotingMethod;

/** One member's answer on a recorded vote (a legislator of the chamber's roster). */
export const rollEntrySchema = z.object({ member: z.uuid(), position: z.enum(ROLL_POSITIONS) });
export type RollEntry = z.output<typeof rollEntrySchema>;

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
const questionKey = safe(z.string().min(1).max(40));

export const votedEventSchema = z.object({
  kind: z.literal("voted"),
  /** The key of the question the clerk was recording (the immediately pending one); refused if another is pending now. */
  question: questionKey.optional(),
  result: z.enum(["adopted", "rejected"]),
  /** How the vote was taken; absent (older clients): "division" when a tally is given, else "voice". */
  method: z.enum(VOTE_METHODS).optional(),
  /** Recorded: the count (for a recorded vote, computed from the roll: yeas, nays, present). */
  tally: tallySchema.nullable().default(null),
  /** Recorded vote: each member's answer; members of the roster left out did not vote. */
  roll: z.array(rollEntrySchema).max(5000).optional(),
  /** Recorded vote: the chair's casting vote on an equal division, where the rulebook gives one. */
  casting: z.enum(["yea", "nay"]).optional(),
  /** Recorded vote: how many members demanded it (checked against the rulebook's share of those present). */
  demandedBy: z.number().int().min(1).max(100_000).optional(),
  /** The clerk confirms the chair declared a result the count does not give under the threshold. */
  againstCount: z.boolean().default(false),
  disposesBelow: z.boolean().default(false),
});

const correctableEvent = z.discriminatedUnion("kind", [votedEventSchema]);

export const floorEventSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("made"), motion: idSchema, text: shortText(2000).default(""), mover: shortText(200).default(""), ref: shortText(40).default(""), overrule: z.boolean().default(false) }),
  // `question`: the key of the immediately pending question the entry is for (stored by the service).
  z.object({ kind: z.literal("seconded"), question: questionKey.optional() }),
  z.object({ kind: z.literal("stated"), question: questionKey.optional() }),
  votedEventSchema,
  z.object({ kind: z.literal("withdrawn"), key: questionKey }),
  z.object({ kind: z.literal("floor"), speaker: shortText(200).nullable().optional(), debateBegun: z.boolean().optional(), chairHasRuled: z.boolean().optional(), committeeOfTheWhole: z.boolean().optional(), question: questionKey.optional() }),
  z.object({ kind: z.literal("close") }),
  /**
   * A correction: strikes an earlier entry (by its number in the history) with a reason, and
   * optionally records in its place what should have been recorded (a vote only). Entries are
   * never edited; the board is recomputed as if the struck entry had never been recorded.
   */
  z.object({ kind: z.literal("strike"), entry: z.number().int().min(1), reason: shortText(1000).min(1, "say why the entry is struck out"), replacement: correctableEvent.optional() }),
  /** The sitting is judged from now on by the rulebook version in force (a superseded version was judging it). */
  z.object({ kind: z.literal("rulebook"), version: z.uuid() }),
]);
export type FloorEvent = z.output<typeof floorEventSchema>;
export type VotedEvent = z.output<typeof votedEventSchema>;

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

export { questionName };

/** "12–20, 3 abstaining" */
export function tallyWords(tally: Tally | null): string {
  if (!tally) return "by voice";
  return `${tally.yes}–${tally.no}${tally.abstain ? `, ${tally.abstain} abstaining` : ""}`;
}

/** "21–12, 3 present, 2 not voting (recorded vote; the chair's casting vote: yea)", or the tally's words. */
export function voteCountWords(event: VotedEvent): string {
  if (!event.roll || !event.tally) return tallyWords(event.tally);
  const n = (p: string) => event.roll!.filter((r) => r.position === p).length;
  const extra = [n("present") && `${n("present")} present`, n("not-voting") && `${n("not-voting")} not voting`, n("recused") && `${n("recused")} recused`].filter(Boolean).join(", ");
  return `${event.tally.yes}–${event.tally.no}${extra ? `, ${extra}` : ""} (recorded vote${event.casting ? `; the chair's casting vote: ${event.casting}` : ""})`;
}

/** A threshold as a rulebook writes it: an id, or `{ kind: "number", value }`. */
export type ThresholdLike = ThresholdSpec;

/**
 * The threshold the rulebook sets for deciding this question: amendments by the voting section's
 * `amendmentThreshold`, the main motion by `passageThreshold` where the rulebook gives one, any
 * other motion by its catalogue entry.
 */
export function questionThreshold(rulebook: Rulebook, item: PendingItem): ThresholdSpec {
  if (item.degree !== null || item.motion === rulebook.amendments.motion) return rulebook.voting.amendmentThreshold;
  const motion = rulebook.motions.find((m) => m.id === item.motion);
  if (motion?.class === "main" && rulebook.voting.passageThreshold) return rulebook.voting.passageThreshold;
  return motion?.vote ?? "majority";
}

/** Thresholds that cannot be judged without counting (of the members, of those present, a fixed number). */
export function thresholdNeedsCount(threshold: ThresholdSpec): boolean {
  if (typeof threshold !== "string") return true;
  return needsMembership(threshold) || threshold === "two-thirds-of-present";
}

/**
 * Whether a counted tally adopts the question under the threshold (the core's `adopts`); null when
 * it cannot be told (a threshold of the members and the rulebook gives no number of members). A
 * tie loses: "On a tie vote the motion is lost" (Robert's Rules of Order Revised, 1915, §46 pp.
 * 191–192). Those present are those voting and those answering present (abstaining).
 */
export function countAdopts(threshold: ThresholdSpec, tally: Tally, members: number | undefined): boolean | null {
  const t = toThreshold(threshold);
  if (needsMembership(t) && members === undefined) return null;
  return adopts(tally.yes, tally.no, { members: members ?? null, present: tally.yes + tally.no + tally.abstain }, t);
}

export const THRESHOLD_WORDS: Record<string, string> = {
  majority: "a majority of those voting",
  none: "a majority of those voting",
  "two-thirds": "two-thirds of those voting",
  "majority-of-members": "a majority of the members",
  "two-thirds-of-members": "two-thirds of the members",
  "three-fifths-of-members": "three-fifths of the members",
  "two-thirds-of-present": "two-thirds of the members present",
};
export function thresholdWords(threshold: ThresholdSpec): string {
  if (typeof threshold !== "string") return `${threshold.value} votes in favour`;
  return THRESHOLD_WORDS[threshold] ?? threshold;
}

function invalid(path: string, message: string): never {
  throw new GavelError("invalid-input", message, { issues: [{ path, message }] });
}

/**
 * Check a vote as the clerk records it, against the question pending and the rulebook: it is for
 * the question the clerk saw (else nothing is recorded), a counted vote carries its ayes and noes,
 * a threshold that needs a count is not recorded by voice, and a count that contradicts the
 * declared result is recorded only when the clerk confirms the chair declared it so.
 * Returns the vote with its question and method filled in, as stored.
 */
export function checkVote(rulebook: Rulebook, board: Board, event: VotedEvent, roster?: Roster): VotedEvent {
  const i = board.pending.length - 1;
  const top = board.pending[i];
  if (!top) refuse("Nothing is pending to vote on.");
  const name = questionName(board.pending, i);
  if (event.question !== undefined && event.question !== top.key) {
    const meant = board.pending.findIndex((p) => p.key === event.question);
    throw new GavelError("conflict", `The question pending is now ${name}${meant >= 0 ? `, not ${questionName(board.pending, meant)}` : ""}. Nothing was recorded; check the result against the question and record it again.`, {
      issues: [{ path: "event.question", message: "not the immediately pending question" }],
      details: { pending: { key: top.key, name } },
    });
  }
  const method = event.method ?? (event.roll ? "recorded" : event.tally ? "division" : "voice");
  const methods = rulebook.voting.methods;
  if (methods && !methods.available.includes(method)) invalid("event.method", `The rulebook provides for ${methods.available.map((m) => METHOD_WORDS[m]).join(", ")} only (${methods.citation}).`);
  const threshold = questionThreshold(rulebook, top);
  let tally = event.tally;
  let effective = event.tally;
  let quorumShort: string | null = null;
  if (method === "recorded") {
    if (!event.roll?.length) invalid("event.roll", "A recorded vote needs each member's vote.");
    if (!roster) throw new Error("checkVote: a recorded vote needs the roster");
    const seen = new Set<string>();
    event.roll.forEach((r, n) => {
      if (!roster.ids.has(r.member)) invalid(`event.roll.${n}.member`, "not a member on the chamber's roster");
      if (seen.has(r.member)) invalid(`event.roll.${n}.member`, "this member's vote is given twice");
      seen.add(r.member);
    });
    const count = (p: string) => event.roll!.filter((r) => r.position === p).length;
    tally = { yes: count("yea"), no: count("nay"), abstain: count("present") };
    effective = tally;
    if (event.casting) {
      if (!CASTING_RULES.has(rulebook.voting.tieRule)) invalid("event.casting", "The rulebook gives the chair no casting vote.");
      if (tally.yes !== tally.no) invalid("event.casting", "The chair's casting vote is given only when the votes are equally divided.");
      effective = { ...tally, yes: tally.yes + (event.casting === "yea" ? 1 : 0), no: tally.no + (event.casting === "nay" ? 1 : 0) };
    }
    const present = tally.yes + tally.no + tally.abstain + count("recused");
    const members = rulebook.chamber.members ?? roster.size;
    const needed = quorumNeeded(rulebook, members);
    if (needed !== null && present < needed) quorumShort = `${present} ${present === 1 ? "member answered" : "members answered"} (yea, nay, present or recused); the quorum is ${needed}`;
    if (event.demandedBy !== undefined) {
      const need = demandNeeded(methods?.recordedOnDemand, present);
      if (need !== null && event.demandedBy < need) invalid("event.demandedBy", `A demand by ${event.demandedBy} does not order a recorded vote: ${need} of the ${present} present are needed (${methods!.recordedOnDemand!.citation}).`);
    }
  } else {
    if (event.roll) invalid("event.roll", "Only a recorded vote has a roll.");
    if (event.casting) invalid("event.casting", "The chair's casting vote is recorded with a recorded vote.");
    if (method === "division" && !event.tally) invalid("event.tally", "A counted vote needs the ayes and the noes.");
    if (method === "voice" && event.tally) invalid("event.method", "A vote by voice has no count; choose a counted vote to record the ayes and noes.");
    if (method === "voice" && thresholdNeedsCount(threshold)) invalid("event.method", `${name} needs ${thresholdWords(threshold)}, which cannot be judged without a count; record the count.`);
  }
  if (quorumShort && !event.againstCount) {
    throw new GavelError("unprocessable", `No quorum: ${quorumShort}. Nothing was recorded. If the chair declared the result nonetheless, confirm that.`, {
      issues: [{ path: "event.roll", message: "no quorum" }],
      details: { noQuorum: true },
    });
  }
  if (effective && !event.againstCount) {
    const adopts = countAdopts(threshold, effective, rulebook.chamber.members ?? roster?.size);
    if (adopts !== null && adopts !== (event.result === "adopted")) {
      throw new GavelError("unprocessable", `A count of ${tallyWords(effective)} ${adopts ? "adopts" : "does not adopt"} ${name} under ${thresholdWords(threshold)}, but the result given is ${event.result}. Check the count; if the chair declared it ${event.result}, confirm that.`, {
        issues: [{ path: "event.result", message: `the count gives ${adopts ? "adopted" : "rejected"}` }],
        details: { countGives: adopts ? "adopted" : "rejected" },
      });
    }
  }
  return { ...event, question: top.key, method, tally };
}

/** The chamber's roster as a recorded vote is checked against it. */
export interface Roster {
  ids: ReadonlySet<string>;
  size: number;
}

const METHOD_WORDS: Record<VotingMethod, string> = { voice: "a vote by voice", division: "a division (counted)", recorded: "a recorded vote (roll call)" };
/** Tie rules under which the chair may give a casting vote (voting-section.ts, TIE_RULES). */
const CASTING_RULES = new Set<string>(["chair-casting-vote", "chair-may-make-or-break-tie"]);

/**
 * Members whose presence makes a quorum under the voting section (the core's `quorumStatus`): a
 * majority of the members (US Constitution art. I §5 cl. 1: "a Majority of each shall constitute a
 * Quorum to do Business"), a fraction of them, or a fixed number; null when the rulebook sets none.
 */
export function quorumNeeded(rulebook: Rulebook, members: number): number | null {
  const required = quorumStatus(rulebook.voting.quorum, members, 0).required;
  return required === 0 ? null : required;
}

/** Refuse an event that names a question other than the immediately pending one (a replayed entry after a correction). */
function onTop(top: PendingItem, question: string | undefined, what: string) {
  if (question !== undefined && question !== top.key) refuse(`${what} was for another question than ${top.name}.`, "event.question");
}

/** Apply one recorded event; returns the new board and a one-line summary for the history. */
export function applyFloorEvent(rulebook: Rulebook, board: Board, event: FloorEvent, key: string): { board: Board; summary: string } {
  const pending = [...board.pending];
  const top = pending[pending.length - 1];
  const topName = questionName(pending, pending.length - 1);
  switch (event.kind) {
    case "made": {
      const m = rulebook.motions.find((x) => x.id === event.motion);
      if (!m) refuse(`No motion "${event.motion}" in the rulebook's catalogue.`, "event.motion");
      const amendId = rulebook.amendments.motion;
      const degree = m.id === amendId ? (top?.motion === amendId && top.degree !== null ? top.degree + 1 : 1) : null;
      pending.push({ key, motion: m.id, name: m.name, degree, text: event.text, mover: event.mover, ref: event.ref, stage: "made", debateBegun: false });
      const who = event.mover ? `${event.mover} moved` : "Moved";
      return { board: { ...board, pending, speaker: null }, summary: `${who}: ${questionName(pending, pending.length - 1)}${event.overrule ? " [admitted by the chair]" : ""}` };
    }
    case "seconded": {
      if (!top) refuse("Nothing is pending to second.");
      onTop(top, event.question, "The second");
      if (top.stage !== "made") refuse(`${top.name} is already ${top.stage}.`);
      pending[pending.length - 1] = { ...top, stage: "seconded" };
      return { board: { ...board, pending }, summary: `Seconded: ${topName}` };
    }
    case "stated": {
      if (!top) refuse("Nothing is pending to state.");
      onTop(top, event.question, "The statement");
      if (top.stage === "stated") refuse(`${top.name} has already been stated by the chair.`);
      const needsSecond = rulebook.motions.find((x) => x.id === top.motion)?.second ?? false;
      if (needsSecond && top.stage !== "seconded") refuse(`${top.name} needs a second before the chair states it.`);
      pending[pending.length - 1] = { ...top, stage: "stated" };
      return { board: { ...board, pending }, summary: `The chair stated the question: ${topName}` };
    }
    case "voted": {
      if (!top) refuse("Nothing is pending to vote on.");
      onTop(top, event.question, "The vote");
      const rest = event.disposesBelow && event.result === "adopted" ? [] : pending.slice(0, -1);
      const tabled = top.motion === "lay-on-table" && event.result === "adopted" ? board.tabled + 1 : board.tabled;
      return {
        board: { ...board, pending: rest, speaker: null, voteTaken: true, tabled, lastVote: { motion: top.motion, name: top.name, result: event.result, tally: event.tally } },
        summary: `Voted: ${topName} — ${event.result}, ${voteCountWords(event)}${event.againstCount ? " (as the chair declared it)" : ""}${rest.length < pending.length - 1 ? "; the questions below leave the floor with it" : ""}`,
      };
    }
    case "withdrawn": {
      const i = pending.findIndex((p) => p.key === event.key);
      if (i < 0) refuse("That question is no longer pending.", "event.key");
      const above = pending.length - 1 - i;
      return { board: { ...board, pending: pending.slice(0, i) }, summary: `Withdrawn: ${questionName(pending, i)}${above ? ` (with ${above === 1 ? "the question" : `the ${above} questions`} adhering to it)` : ""}` };
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
        onTop(top, event.question, "The debate entry");
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
    case "strike":
    case "rulebook":
      // Corrections and version switches are kept by the sitting service (replay, version change).
      throw new Error(`${event.kind} entries are not applied to the board directly.`);
  }
}

/** The key of the question an event acts on, stored with the entry so a replay cannot re-target it. */
export function withQuestion(board: Board, event: FloorEvent): FloorEvent {
  const top = board.pending[board.pending.length - 1];
  if (!top) return event;
  if (event.kind === "seconded" || event.kind === "stated") return { ...event, question: top.key };
  if (event.kind === "floor" && event.debateBegun !== undefined) return { ...event, question: top.key };
  return event;
}

/** A stored entry as replay reads it. */
export interface Entry {
  seq: number;
  /** The stored payload (the event as recorded, with `key` for a motion made). */
  payload: unknown;
  summary: string;
}

/**
 * The board as the record now stands: every entry applied in order, except entries struck out
 * (a replacement, when the correction gives one, takes the struck entry's place) and the
 * corrections themselves. Rulebook switches change the rulebook later entries are read by.
 * An entry that no longer applies (a vote whose question the correction removed) is refused
 * with its number, so a correction that would make the record inconsistent stores nothing.
 */
export function replayBoard(entries: readonly Entry[], initialVersion: string, rulebookOf: (versionId: string) => Rulebook): Board {
  const parsed = entries.map((e) => ({ ...e, event: parseStored(e.payload, e.seq), key: storedKey(e.payload, e.seq) }));
  const struck = new Map<number, FloorEvent | null>();
  for (const e of parsed) if (e.event.kind === "strike") struck.set(e.event.entry, e.event.replacement ?? null);
  let board = EMPTY_BOARD;
  let version = initialVersion;
  for (const e of parsed) {
    if (e.event.kind === "strike") continue;
    if (e.event.kind === "rulebook") {
      version = e.event.version;
      continue;
    }
    const event = struck.has(e.seq) ? struck.get(e.seq)! : e.event;
    if (event === null) continue;
    try {
      board = applyFloorEvent(rulebookOf(version), board, event, e.key).board;
    } catch (err) {
      const why = err instanceof Error ? err.message : String(err);
      throw new GavelError("unprocessable", `Entry ${e.seq} (${e.summary}) would no longer hold: ${why}`, { issues: [{ path: "event.entry", message: `entry ${e.seq} would no longer hold` }], details: { entry: e.seq } });
    }
  }
  return board;
}

function parseStored(payload: unknown, seq: number): FloorEvent {
  const r = floorEventSchema.safeParse(payload);
  if (!r.success) throw new Error(`Stored floor entry ${seq} is not a floor event.`);
  return r.data;
}

/** The pending-question key of a motion made: stored with the entry; older entries have the entry number's key. */
export function storedKey(payload: unknown, seq: number): string {
  const key = (payload as { key?: unknown } | null)?.key;
  return typeof key === "string" && key ? key : `q${seq}`;
}

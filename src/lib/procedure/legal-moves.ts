/**
 * Which motions are in order now: for every motion in the catalogue, run the rulebook's
 * motion-scope rules over facts about the floor state; a motion is out of order exactly when
 * at least one rule fires, and each fired rule is a reason with its citation.
 *
 * Only facts are computed here (the immediately pending question, the question an amendment
 * would apply to and its degree, the vote a reconsideration would apply to, the characteristics
 * as made); verdicts come from the rules (docs/decisions/0004-rules-as-data.md).
 *
 * Degrees follow Robert's Rules of Order Revised (1915) §33: an amendment applies to the question
 * it amends, so moving amend while an amendment of degree d is the question amended proposes
 * degree d + 1. The question amended is the immediately pending one, except that amend "takes
 * precedence of the motion to postpone indefinitely" (§33 p. 134), which "cannot be amended"
 * (§34): while a motion that cannot be amended and ranks below amend is immediately pending, an
 * amendment applies to the question beneath it, with the degree it would have there.
 */
import { Engine } from "json-rules-engine";
import { GavelError, parseWith, type InputIssue } from "../errors.ts";
import type { VoteThreshold } from "./voting-section.ts";
import { floorStateSchema, type FloorState } from "./floor-state-schema.ts";
import { resolveFactPath, ruleRunner } from "./rule-engine.ts";
import { CUSTOM_OPERATORS } from "./rule-vocabulary.ts";
import type { Motion, MotionClass, Reconsiderable, Rulebook } from "./rulebook-schema.ts";

export interface Reason {
  rule: string;
  citation: string;
  /** The clause of the chamber's rules the rule encodes (its key in the chamber's text), when the rulebook links one. */
  clause?: string;
  message: string;
}

export interface AppliedVariant {
  index: number;
  citation: string;
  note?: string;
}

export interface VoteAlternativeVerdict {
  kind: "or" | "instead";
  vote: VoteThreshold;
  if: string;
  citation: string;
  /** Whether the circumstance holds now; null when the rulebook gives no condition (the chair applies it). */
  applies: boolean | null;
}

export interface MotionVerdict {
  motion: string;
  name: string;
  class: MotionClass;
  rank: number | null;
  inOrder: boolean;
  reasons: Reason[];
  second: boolean;
  debatable: boolean;
  amendable: boolean;
  vote: VoteThreshold;
  interrupt: boolean;
  /** Which result of a vote on this motion may be reconsidered. */
  reconsiderable: Reconsiderable;
  /** Only for the amend motion: the degree it would take if moved now. */
  degree?: number;
  /** Only for the amend motion: the pending question it would apply to (catalogue id; null when nothing is pending). */
  appliesTo?: string | null;
  /** Only for motions with variants: the variants that hold now (their characteristics are applied above). */
  variantsApplied?: AppliedVariant[];
  /** Only for motions with alternative thresholds. */
  voteAlternatives?: VoteAlternativeVerdict[];
}

export interface PendingFact {
  motion: string;
  name: string;
  class: MotionClass | null;
  rank: number | null;
  degree: number | null;
  debatable: boolean | null;
  amendable: boolean | null;
  independentParts: boolean | null;
  hasBlank: boolean | null;
  exists: boolean;
}

const NOTHING_PENDING: PendingFact = { motion: "", name: "no question", class: null, rank: null, degree: null, debatable: null, amendable: null, independentParts: null, hasBlank: null, exists: false };

/**
 * Index in `stack` of the question an amendment moved on top of it would apply to: the top, or,
 * while the top cannot be amended and ranks below the amend motion (postpone indefinitely, RONR
 * 1915 §33 p. 134), the question beneath it. -1 when nothing is pending.
 */
export function amendTargetIndex(stack: readonly PendingFact[], amendRank: number | null): number {
  let i = stack.length - 1;
  while (i > 0) {
    const p = stack[i];
    const below = p.amendable === false && p.rank !== null && amendRank !== null && p.rank < amendRank;
    if (!below) break;
    i--;
  }
  return i;
}

function degreeOn(target: PendingFact | undefined, amendId: string): number {
  return target?.motion === amendId && target.degree !== null ? target.degree + 1 : 1;
}

/** The pending stack with degrees and as-applied characteristics resolved; checks ids and stated degrees. */
export function resolvePending(rulebook: Rulebook, state: FloorState): PendingFact[] {
  const byId = new Map(rulebook.motions.map((m) => [m.id, m]));
  const amendId = rulebook.amendments.motion;
  const amendRank = byId.get(amendId)?.rank ?? null;
  const issues: InputIssue[] = [];
  const out: PendingFact[] = [];
  state.pending.forEach((entry, i) => {
    const m = byId.get(entry.motion);
    if (!m) {
      issues.push({ path: `pending.${i}.motion`, message: `no motion "${entry.motion}" in the rulebook's catalogue` });
      return;
    }
    const below = out[out.length - 1];
    let degree: number | null = null;
    let debatable = m.debatableFollowsTarget && below ? below.debatable ?? m.debatable : m.debatable;
    if (m.id === amendId) {
      const target = out[amendTargetIndex(out, amendRank)];
      degree = degreeOn(target, amendId);
      if (m.debatableFollowsTarget && target) debatable = target.debatable ?? m.debatable;
      if (entry.degree !== undefined && entry.degree !== degree) {
        issues.push({ path: `pending.${i}.degree`, message: `an amendment here applies to "${target?.motion ?? "nothing"}", so its degree is ${degree}` });
      }
    } else if (entry.degree !== undefined) {
      issues.push({ path: `pending.${i}.degree`, message: "only an amendment has a degree" });
    }
    const amendable = m.id === amendId ? m.amendable && degree! < rulebook.amendments.maxDegree : m.amendable;
    out.push({ motion: m.id, name: m.name, class: m.class, rank: m.rank, degree, debatable, amendable, independentParts: entry.independentParts ?? null, hasBlank: entry.hasBlank ?? null, exists: true });
  });
  state.floor.votes.forEach((v, i) => {
    if (!byId.has(v.motion)) issues.push({ path: `floor.votes.${i}.motion`, message: `no motion "${v.motion}" in the rulebook's catalogue` });
    if (v.day != null && state.floor.day !== null && v.day > state.floor.day) issues.push({ path: `floor.votes.${i}.day`, message: `day ${v.day} is after today (floor.day ${state.floor.day})` });
    if (v.sitting != null && state.floor.sitting !== null && v.sitting > state.floor.sitting) issues.push({ path: `floor.votes.${i}.sitting`, message: `sitting ${v.sitting} is after this sitting (floor.sitting ${state.floor.sitting})` });
  });
  if (issues.length) throw new GavelError("invalid-input", `floor state: ${issues[0].path}: ${issues[0].message}`, { issues });
  return out;
}

export interface LastVoteFact {
  exists: boolean;
  motion: string | null;
  name: string | null;
  class: MotionClass | null;
  result: "adopted" | "rejected" | null;
  day: number | null;
  sitting: number | null;
  daysSince: number | null;
  sittingsSince: number | null;
  reconsiderable: Reconsiderable | null;
  resultReconsiderable: boolean | null;
  moverOnPrevailingSide: boolean | null;
  debatable: boolean | null;
}

/** May this result of a vote on a motion be reconsidered, by the catalogue's `reconsiderable`? */
export function resultReconsiderable(r: Reconsiderable, result: "adopted" | "rejected"): boolean {
  return r === "both" || (r === "affirmative" && result === "adopted") || (r === "negative" && result === "rejected");
}

/** The vote a motion to reconsider would apply to (RONR 1915 §36). */
export function lastVoteFact(rulebook: Rulebook, state: FloorState): LastVoteFact {
  const votes = state.floor.votes;
  const unknown: LastVoteFact = { exists: false, motion: null, name: null, class: null, result: null, day: null, sitting: null, daysSince: null, sittingsSince: null, reconsiderable: null, resultReconsiderable: null, moverOnPrevailingSide: null, debatable: null };
  if (votes.length === 0) return { ...unknown, exists: state.floor.voteTaken };
  const v = votes[state.floor.reconsiderVote ?? votes.length - 1];
  const m = rulebook.motions.find((x) => x.id === v.motion)!;
  const day = v.day ?? null;
  const sitting = v.sitting ?? null;
  return {
    exists: true,
    motion: m.id,
    name: m.name,
    class: m.class,
    result: v.result,
    day,
    sitting,
    daysSince: day !== null && state.floor.day !== null ? state.floor.day - day : null,
    sittingsSince: sitting !== null && state.floor.sitting !== null ? state.floor.sitting - sitting : null,
    reconsiderable: m.reconsiderable,
    resultReconsiderable: resultReconsiderable(m.reconsiderable, v.result),
    moverOnPrevailingSide: v.moverOnPrevailingSide ?? null,
    debatable: m.debatable,
  };
}

type AsMade = Pick<Motion, "class" | "rank" | "second" | "debatable" | "amendable" | "vote" | "interrupt" | "reconsiderable">;

function motionFact(m: Motion, made: AsMade, withoutQuorum: readonly string[] = []) {
  return {
    id: m.id,
    name: m.name,
    ...made,
    window: { days: m.window?.days ?? null, sittings: m.window?.sittings ?? null },
    /** In order without a quorum present (the rulebook's voting.quorum.withoutQuorum; RONR 1915 §64). */
    withoutQuorum: withoutQuorum.includes(m.id),
  };
}

/**
 * Evaluates standalone condition trees (variants, vote alternatives) over motion-scope facts.
 * Built afresh for each legalMoves call, like ruleRunner's engine: a json-rules-engine Engine keeps
 * one run status, so a shared engine could skip rules when two runs overlap.
 */
class ConditionSet {
  private engine = new Engine([], { allowUndefinedFacts: false, pathResolver: resolveFactPath });
  private count = 0;
  constructor() {
    for (const [name, fn] of Object.entries(CUSTOM_OPERATORS)) this.engine.addOperator(name, fn);
  }
  add(conditions: Record<string, unknown>): number {
    const index = this.count++;
    // parseRulebook has checked every node of these trees against the motion-scope vocabulary.
    this.engine.addRule({ name: `c${index}`, conditions: conditions as never, event: { type: "holds", params: { index } } });
    return index;
  }
  async run(facts: Record<string, unknown>): Promise<Set<number>> {
    if (this.count === 0) return new Set();
    const { events } = await this.engine.run(facts);
    return new Set(events.map((e) => (e.params as { index: number }).index));
  }
}

/**
 * One verdict per catalogue motion, in catalogue order. `rulebook` must come from
 * parseRulebook; `stateInput` is validated here ({pending, floor}).
 */
export async function legalMoves(rulebook: Rulebook, stateInput: unknown): Promise<MotionVerdict[]> {
  const state = parseWith(floorStateSchema, stateInput ?? {}, "floor state");
  const pending = resolvePending(rulebook, state);
  const top = pending[pending.length - 1] ?? NOTHING_PENDING;
  const amendId = rulebook.amendments.motion;
  const amendRank = rulebook.motions.find((m) => m.id === amendId)?.rank ?? null;
  const targetIndex = amendTargetIndex(pending, amendRank);
  const target = pending[targetIndex] ?? NOTHING_PENDING;
  const amendDegree = degreeOn(target.exists ? target : undefined, amendId);
  const lastVote = lastVoteFact(rulebook, state);
  const runner = ruleRunner(rulebook, "motion");
  const shared = {
    immediatelyPending: top,
    pending,
    pendingMotions: pending.map((p) => p.motion),
    pendingCount: pending.length,
    amendDegree,
    amendTarget: { ...target, skipped: targetIndex >= 0 ? pending.slice(targetIndex + 1).map((p) => p.motion) : [] },
    lastVote,
    floor: { ...state.floor, voteTaken: state.floor.voteTaken || state.floor.votes.length > 0 },
    limits: rulebook.amendments,
  };
  const verdicts: MotionVerdict[] = [];
  for (const m of rulebook.motions) {
    const isAmend = m.id === amendId;
    let debatable = m.debatable;
    if (m.debatableFollowsTarget) {
      if (isAmend) debatable = target.exists ? target.debatable ?? m.debatable : m.debatable;
      else if (m.class === "restorative" && lastVote.debatable !== null) debatable = lastVote.debatable;
      else if (top.exists) debatable = top.debatable ?? m.debatable;
    }
    let made: AsMade = {
      class: m.class,
      rank: m.rank,
      second: m.second,
      debatable,
      amendable: isAmend ? m.amendable && amendDegree < rulebook.amendments.maxDegree : m.amendable,
      vote: m.vote,
      interrupt: m.interrupt,
      reconsiderable: m.reconsiderable,
    };
    let applied: AppliedVariant[] | undefined;
    let alternatives: VoteAlternativeVerdict[] | undefined;
    if (m.variants?.length || m.voteAlternatives?.some((a) => a.when)) {
      const set = new ConditionSet();
      const variantIdx = (m.variants ?? []).map((v) => set.add(v.when));
      const altIdx = (m.voteAlternatives ?? []).map((a) => (a.when ? set.add(a.when) : -1));
      const holds = await set.run({ ...shared, motion: motionFact(m, made, rulebook.voting.quorum.withoutQuorum ?? []) });
      if (m.variants) {
        applied = [];
        m.variants.forEach((v, k) => {
          if (!holds.has(variantIdx[k])) return;
          made = { ...made, ...v.set };
          applied!.push({ index: k, citation: v.citation, ...(v.note ? { note: v.note } : {}) });
        });
      }
      if (m.voteAlternatives) alternatives = m.voteAlternatives.map((a, k) => ({ kind: a.kind, vote: a.vote, if: a.if, citation: a.citation, applies: altIdx[k] < 0 ? null : holds.has(altIdx[k]) }));
    } else if (m.voteAlternatives) {
      alternatives = m.voteAlternatives.map((a) => ({ kind: a.kind, vote: a.vote, if: a.if, citation: a.citation, applies: null }));
    }
    const fired = await runner.run({ ...shared, motion: motionFact(m, made, rulebook.voting.quorum.withoutQuorum ?? []) });
    verdicts.push({
      motion: m.id,
      name: m.name,
      class: made.class,
      rank: made.rank,
      inOrder: fired.length === 0,
      reasons: fired.map((f) => ({ rule: f.rule.id, citation: f.rule.citation, ...(f.rule.clause ? { clause: f.rule.clause } : {}), message: f.message })),
      second: made.second,
      debatable: made.debatable,
      amendable: made.amendable,
      vote: made.vote,
      interrupt: made.interrupt,
      reconsiderable: made.reconsiderable,
      ...(isAmend ? { degree: amendDegree, appliesTo: target.exists ? target.motion : null } : {}),
      ...(applied ? { variantsApplied: applied } : {}),
      ...(alternatives ? { voteAlternatives: alternatives } : {}),
    });
  }
  return verdicts;
}

/**
 * Which motions are in order now: for every motion in the catalogue, run the rulebook's
 * motion-scope rules over facts about the floor state; a motion is out of order exactly when
 * at least one rule fires, and each fired rule is a reason with its citation.
 *
 * Only facts are computed here (the immediately pending question, the degree an amendment
 * would take, the characteristics that follow the question applied to); verdicts come from
 * the rules (docs/decisions/0004-rules-as-data.md). Degrees follow Robert's Rules of Order
 * Revised (1915) §33: an amendment applies to the immediately pending question, so moving
 * amend while an amendment of degree d is immediately pending proposes degree d + 1.
 */
import { GavelError, parseWith, type InputIssue } from "../errors.ts";
import type { VoteThreshold } from "./voting-section.ts";
import { floorStateSchema, type FloorState } from "./floor-state-schema.ts";
import { ruleRunner } from "./rule-engine.ts";
import type { Motion, MotionClass, Rulebook } from "./rulebook-schema.ts";

export interface Reason {
  rule: string;
  citation: string;
  message: string;
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
  /** Only for the amend motion: the degree it would take if moved now. */
  degree?: number;
}

export interface PendingFact {
  motion: string;
  name: string;
  class: MotionClass | null;
  rank: number | null;
  degree: number | null;
  debatable: boolean | null;
  amendable: boolean | null;
  exists: boolean;
}

const NOTHING_PENDING: PendingFact = { motion: "", name: "no question", class: null, rank: null, degree: null, debatable: null, amendable: null, exists: false };

/** The pending stack with degrees and as-applied characteristics resolved; checks ids and stated degrees. */
export function resolvePending(rulebook: Rulebook, state: FloorState): PendingFact[] {
  const byId = new Map(rulebook.motions.map((m) => [m.id, m]));
  const amendId = rulebook.amendments.motion;
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
    if (m.id === amendId) {
      degree = below?.motion === amendId && below.degree !== null ? below.degree + 1 : 1;
      if (entry.degree !== undefined && entry.degree !== degree) {
        issues.push({ path: `pending.${i}.degree`, message: `an amendment here applies to "${below?.motion ?? "nothing"}", so its degree is ${degree}` });
      }
    } else if (entry.degree !== undefined) {
      issues.push({ path: `pending.${i}.degree`, message: "only an amendment has a degree" });
    }
    const debatable = m.debatableFollowsTarget && below ? below.debatable ?? m.debatable : m.debatable;
    const amendable = m.id === amendId ? m.amendable && degree! < rulebook.amendments.maxDegree : m.amendable;
    out.push({ motion: m.id, name: m.name, class: m.class, rank: m.rank, degree, debatable, amendable, exists: true });
  });
  if (issues.length) throw new GavelError("invalid-input", `floor state: ${issues[0].path}: ${issues[0].message}`, { issues });
  return out;
}

function motionFact(m: Motion, withoutQuorum: readonly string[] = []) {
  return { id: m.id, name: m.name, class: m.class, rank: m.rank, second: m.second, debatable: m.debatable, amendable: m.amendable, vote: m.vote, interrupt: m.interrupt, reconsiderable: m.reconsiderable, withoutQuorum: withoutQuorum.includes(m.id) };
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
  const amendDegree = top.motion === amendId && top.degree !== null ? top.degree + 1 : 1;
  const runner = ruleRunner(rulebook, "motion");
  const shared = {
    immediatelyPending: top,
    pending,
    pendingMotions: pending.map((p) => p.motion),
    pendingCount: pending.length,
    amendDegree,
    floor: state.floor,
    limits: rulebook.amendments,
  };
  const verdicts: MotionVerdict[] = [];
  for (const m of rulebook.motions) {
    const facts = { ...shared, motion: motionFact(m, rulebook.voting.quorum.withoutQuorum) };
    const fired = await runner.run(facts);
    const isAmend = m.id === amendId;
    const debatable = m.debatableFollowsTarget && top.exists ? top.debatable ?? m.debatable : m.debatable;
    verdicts.push({
      motion: m.id,
      name: m.name,
      class: m.class,
      rank: m.rank,
      inOrder: fired.length === 0,
      reasons: fired.map((f) => ({ rule: f.rule.id, citation: f.rule.citation, message: f.message })),
      second: m.second,
      debatable,
      amendable: isAmend ? m.amendable && amendDegree < rulebook.amendments.maxDegree : m.amendable,
      vote: m.vote,
      interrupt: m.interrupt,
      ...(isAmend ? { degree: amendDegree } : {}),
    });
  }
  return verdicts;
}

/**
 * The voting rules an analysis applies, resolved from a rulebook (docs/decisions/0008):
 *  - the threshold of each question kind: amendments (`voting.amendmentThreshold`) and final passage
 *    (`voting.passageThreshold`, else the catalogue's main motion's `vote`, else — a rulebook object
 *    without a catalogue — the amendment threshold, as before). "An amendment of a pending question
 *    requires only a majority vote for its adoption, even though the question to be amended requires
 *    a two-thirds vote" (Robert's Rules of Order Revised, 1915, §33 p. 134);
 *  - the membership thresholds "of the members" count against: `chamber.members`, else the membership
 *    the caller knows (the chamber's roster), else unknown (never the estimate's ballots);
 *  - the quorum, checked against the attending weight (RONR 1915 §64);
 *  - the tie rule.
 * Pure: the caller gives the rulebook object (only `voting`, `chamber.members` and `motions[].class/vote` are read).
 */
import { z } from "zod";
import { GavelError, parseWith } from "../errors.ts";
import { VOTE_THRESHOLDS, type TieRule, type VotingSection } from "../procedure/voting-section.ts";
import { majorityGraph, type MajorityGraph } from "./majority-graph.ts";
import type { Profile } from "./profile.ts";
import { thresholdText, toThreshold, type Threshold } from "./vote-threshold.ts";

export interface VoteRules {
  amendment: Threshold;
  passage: Threshold;
  /** Where the passage threshold came from. */
  passageFrom: "voting.passageThreshold" | "main-motion" | "voting.amendmentThreshold";
  members: number | null;
  membersFrom: "chamber.members" | "roster" | null;
  tieRule: TieRule;
  quorum: VotingSection["quorum"];
}

const lenientRulebook = z.looseObject({
  chamber: z.looseObject({ members: z.number().int().min(1).max(100_000).optional() }).optional(),
  motions: z.array(z.looseObject({ class: z.string(), vote: z.enum(VOTE_THRESHOLDS) })).optional(),
});

/** Resolve the rules. `membership`: the chamber's size when the rulebook gives none (e.g. its roster). */
export function voteRules(rulebook: unknown, voting: VotingSection, membership?: number | null): VoteRules {
  const rb = parseWith(lenientRulebook, rulebook, "rulebook", "rulebook");
  const main = rb.motions?.find((m) => m.class === "main");
  const [passage, passageFrom] =
    voting.passageThreshold !== undefined
      ? [voting.passageThreshold, "voting.passageThreshold" as const]
      : main
        ? [main.vote, "main-motion" as const]
        : [voting.amendmentThreshold, "voting.amendmentThreshold" as const];
  const fromChamber = rb.chamber?.members;
  const members = fromChamber ?? membership ?? null;
  return {
    amendment: toThreshold(voting.amendmentThreshold),
    passage: toThreshold(passage),
    passageFrom,
    members,
    membersFrom: fromChamber !== undefined ? "chamber.members" : membership != null ? "roster" : null,
    tieRule: voting.tieRule,
    quorum: voting.quorum,
  };
}

export interface QuorumStatus {
  kind: VotingSection["quorum"]["kind"];
  /** Attending weight that makes a quorum; null when the membership it depends on is unknown. */
  required: number | null;
  present: number;
  /** null: not checked (membership unknown). */
  met: boolean | null;
}

/**
 * The quorum: a majority of the members ("more than half"), at least a fraction of them, a fixed number,
 * or none. A majority of 40 is 21; one third of 751 is 251 (at least 250⅓, rounded up).
 */
export function quorumStatus(q: VotingSection["quorum"], members: number | null, present: number): QuorumStatus {
  let required: number | null;
  switch (q.kind) {
    case "none":
      required = 0;
      break;
    case "number":
      required = q.value!;
      break;
    case "majority-of-members":
      required = members === null ? null : Math.floor(members / 2) + 1;
      break;
    case "fraction":
      required = members === null ? null : Math.ceil((members * q.numerator!) / q.denominator!);
      break;
  }
  return { kind: q.kind, required, present, met: required === null ? null : present >= required };
}

/** Refuse an analysis below quorum: it says so instead of producing outcomes. */
export function requireQuorum(status: QuorumStatus): void {
  if (status.met !== false) return;
  throw new GavelError("unprocessable", `no quorum: the estimate's attending weight is ${status.present}, and a quorum is ${status.required}; no question can be decided`, {
    issues: [{ path: "profile", message: `attending weight ${status.present} is below the quorum of ${status.required}` }],
    details: { reason: "no-quorum", quorum: status },
  });
}

/** One graph per distinct threshold; `graphFor(question)` picks passage's for the last question. */
export function questionGraphs(profile: Profile, rules: VoteRules, passageQuestion: number): { amendment: MajorityGraph; passage: MajorityGraph; graphFor: (question: number) => MajorityGraph } {
  const ctx = { members: rules.members, tieRule: rules.tieRule };
  const amendment = majorityGraph(profile, rules.amendment, ctx);
  const same = thresholdText(rules.amendment) === thresholdText(rules.passage);
  const passage = same ? amendment : majorityGraph(profile, rules.passage, ctx);
  return { amendment, passage, graphFor: (q) => (q === passageQuestion ? passage : amendment) };
}

/** The `thresholds` block of the orders and walk-through JSON. */
export function thresholdsJson(rules: VoteRules) {
  return {
    amendment: thresholdText(rules.amendment),
    passage: thresholdText(rules.passage),
    passageFrom: rules.passageFrom,
    members: rules.members,
    membersFrom: rules.membersFrom,
  };
}


/**
 * Voting procedures as binary voting trees (Farquharson 1969; McKelvey & Niemi 1978, J. Econ.
 * Theory 18:1–22; Ordeshook & Schwartz 1987, APSR 81:179–199). Each vote has a motion branch and a
 * base branch; a tie defeats the motion (Robert's Rules of Order Revised, 1915, §46).
 *  - Sophisticated outcome: backward induction — a leaf's value is its alternative; a vote's value is
 *    the motion branch's value if it beats the base branch's value, else the base branch's value.
 *  - Sincere path: at each vote members compare what the vote directly puts before them: for a pairwise
 *    vote the two alternatives named; for a successive (yes/no) vote, the proposal against every
 *    alternative still available (see successive-agenda.ts).
 * Builders: the amendment procedure, the successive procedure, and the two-stage perfecting-then-
 * substitute structure (Banks 1989, AJPS 33:25–43: a perfected amendment meets a perfected substitute,
 * the survivor meets the measure, then passage against the status quo).
 */
import type { MajorityGraph } from "./majority-graph.ts";
import { pairSupport, type Profile } from "./profile.ts";
import { successiveTally } from "./successive-agenda.ts";
import { decides } from "./vote-threshold.ts";

export type SincereRule = { kind: "pair"; motion: number; base: number } | { kind: "proposal"; proposal: number; available: number[] };

export type VotingTree = { kind: "leaf"; alternative: number } | { kind: "vote"; label: string; sincere: SincereRule; motion: VotingTree; base: VotingTree };

const leaf = (alternative: number): VotingTree => ({ kind: "leaf", alternative });

/** Amendment procedure over x1…xm: x1 vs x2, survivor vs x3, … (the earlier-listed is the motion). */
export function amendmentTree(order: readonly number[], names: readonly string[]): VotingTree {
  const build = (survivor: number, k: number): VotingTree => {
    if (k >= order.length) return leaf(survivor);
    const x = order[k];
    return { kind: "vote", label: `${names[survivor]} vs ${names[x]}`, sincere: { kind: "pair", motion: survivor, base: x }, motion: build(survivor, k + 1), base: build(x, k + 1) };
  };
  return build(order[0], 1);
}

/** Successive procedure over x1…xm: x1 yes/no, then x2, …; xm stands if all are rejected. */
export function successiveTree(order: readonly number[], names: readonly string[]): VotingTree {
  const build = (i: number): VotingTree =>
    i === order.length - 1 ? leaf(order[i]) : { kind: "vote", label: `${names[order[i]]}: yes or no`, sincere: { kind: "proposal", proposal: order[i], available: order.slice(i) }, motion: leaf(order[i]), base: build(i + 1) };
  return build(0);
}

export interface TwoStageAlternatives {
  /** The first-degree perfecting amendment, and the same amendment as perfected by its second-degree amendment (if any). */
  amendment: number;
  amendmentPerfected?: number;
  substitute: number;
  substitutePerfected?: number;
  measure: number;
  statusQuo: number;
}

/** Two-stage structure: A2|A, S2|S, survivor of S vs survivor of A, then vs the measure, then passage vs Q. */
export function twoStageTree(t: TwoStageAlternatives, names: readonly string[]): VotingTree {
  const pair = (label: string, motion: number, base: number, onMotion: VotingTree, onBase: VotingTree): VotingTree => ({ kind: "vote", label, sincere: { kind: "pair", motion, base }, motion: onMotion, base: onBase });
  const passage = (x: number) => pair(`passage: ${names[x]} vs ${names[t.statusQuo]}`, x, t.statusQuo, leaf(x), leaf(t.statusQuo));
  const vsMeasure = (x: number) => pair(`${names[x]} vs ${names[t.measure]}`, x, t.measure, passage(x), passage(t.measure));
  const subVsAmend = (a: number, s: number) => pair(`${names[s]} vs ${names[a]}`, s, a, vsMeasure(s), vsMeasure(a));
  const perfectSub = (a: number) =>
    t.substitutePerfected === undefined ? subVsAmend(a, t.substitute) : pair(`${names[t.substitutePerfected]} vs ${names[t.substitute]}`, t.substitutePerfected, t.substitute, subVsAmend(a, t.substitutePerfected), subVsAmend(a, t.substitute));
  return t.amendmentPerfected === undefined ? perfectSub(t.amendment) : pair(`${names[t.amendmentPerfected]} vs ${names[t.amendment]}`, t.amendmentPerfected, t.amendment, perfectSub(t.amendmentPerfected), perfectSub(t.amendment));
}

/** Backward induction (sophisticated voting). */
export function sophisticatedValue(tree: VotingTree, g: MajorityGraph): number {
  if (tree.kind === "leaf") return tree.alternative;
  const m = sophisticatedValue(tree.motion, g);
  const b = sophisticatedValue(tree.base, g);
  return m !== b && g.beats[m][b] ? m : b;
}

export interface VoteRecord {
  label: string;
  /** The alternatives members compare in this vote (for a sophisticated vote: the outcomes each branch leads to). */
  motion: string;
  base: string;
  /** Weight for and against the motion, when a profile is known. */
  for?: number;
  against?: number;
  adopted: boolean;
}

/**
 * The votes actually taken along the sincere or sophisticated path, each with its tally. A sincere
 * successive vote needs the profile; without one it is undefined and this throws.
 */
export function votePath(tree: VotingTree, g: MajorityGraph, profile: Profile | null, mode: "sincere" | "sophisticated"): { outcome: number; votes: VoteRecord[] } {
  const names = g.alternatives;
  const votes: VoteRecord[] = [];
  let node = tree;
  while (node.kind === "vote") {
    let motion: number;
    let base: number;
    let tally: { for: number; against: number } | undefined;
    let adopted: boolean;
    let motionName: string;
    let baseName: string;
    if (mode === "sophisticated" || node.sincere.kind === "pair") {
      [motion, base] = mode === "sophisticated" ? [sophisticatedValue(node.motion, g), sophisticatedValue(node.base, g)] : [(node.sincere as { motion: number }).motion, (node.sincere as { base: number }).base];
      adopted = motion !== base && g.beats[motion][base];
      if (profile) {
        const s = pairSupport(profile, motion, base);
        tally = { for: s.forX, against: s.forY };
      }
      motionName = names[motion];
      baseName = names[base];
    } else {
      if (!profile) throw new RangeError("a sincere successive vote needs the members' rankings");
      const rule = node.sincere;
      const t = successiveTally(profile, rule.proposal, rule.available);
      tally = { for: t.forWeight, against: t.againstWeight };
      const c = profile.chair ? successiveTally({ alternatives: profile.alternatives, members: [profile.chair], totalWeight: profile.chair.weight }, rule.proposal, rule.available) : null;
      const side = c ? (c.forWeight > 0 ? 1 : c.againstWeight > 0 ? -1 : 0) : 0;
      adopted = decides(t.forWeight, t.againstWeight, g.base ?? profile.totalWeight, g.threshold, g.tieRule, side, profile.chair?.weight ?? 1);
      motionName = names[rule.proposal];
      baseName = rule.available.filter((y) => y !== rule.proposal).map((y) => names[y]).join(", ");
    }
    votes.push({ label: node.label, motion: motionName, base: baseName, ...(tally ? { for: tally.for, against: tally.against } : {}), adopted });
    node = adopted ? node.motion : node.base;
  }
  return { outcome: node.alternative, votes };
}

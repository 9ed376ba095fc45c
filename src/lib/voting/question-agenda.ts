/**
 * Voting on an amendment tree question by question (docs/sources.md §2; Ordeshook & Schwartz 1987, APSR
 * 81:179–199; Banks 1989, AJPS 33:25–43). Questions are the pending amendments plus final passage.
 * The state is the set of adopted questions (passage's bit meaning "passed"); a question order is a
 * binary voting tree: each question that is still in order is a vote, adoption its motion branch.
 *
 * A question falls (is not put) when passage was already decided; when it is a second-degree
 * amendment whose parent was already decided or itself falls; when it is exclusive with an adopted
 * amendment (the first adopted makes the rest fall); or when an adopted substitute replaced its text.
 * A vote on amendment x compares the version with x adopted against the version without it, both
 * with what x amends taken as adopted (a second-degree amendment perfects its parent; a substitute for
 * a first-degree amendment A compares A as amended by the substitute with A as perfected). Passage compares
 * the version reached with Q. A tie defeats the motion.
 *
 * Sincere voting: "amendment" procedure — members vote for the preferred of the two versions the vote
 * compares; "successive" procedure — members vote yes iff the version with x adopted is strictly
 * preferred to every version still available if x is rejected (any consistent adoption of the
 * undecided amendments, and Q). Sophisticated voting: backward induction on the tree.
 * `sincereTally` reads back the weights behind each sincere decision (for the walk-through and the
 * chair's script): it counts over exactly the set of versions the decision itself uses.
 */
import type { AmendmentTreeModel } from "./amendment-versions.ts";
import type { MajorityGraph } from "./majority-graph.ts";
import type { Profile } from "./profile.ts";
import { successiveTally } from "./successive-agenda.ts";
import { pairSupport } from "./profile.ts";
import { decides, type ChairSide } from "./vote-threshold.ts";
import type { Procedure } from "./agenda-counts.ts";

export interface QuestionAgenda {
  model: AmendmentTreeModel;
  /** Questions: amendments 0..k−1 in tree order, passage = k. */
  k: number;
  passage: number;
  falls(x: number, decided: number, adopted: number): boolean;
  /** The amendments whose adoption can make x fall (for a fixed decided set, falls(x) reads only these bits of adopted). */
  fallsRelevant(x: number): number;
  /** The two versions a vote on x compares, and the state after adoption / rejection. */
  vote(x: number, adopted: number): { yesState: number; noState: number; yesVersion: number; noVersion: number };
  /** Final outcome (version index) of a completed state. */
  outcome(adopted: number): number;
  sincereAdopts(x: number, decided: number, adopted: number): boolean;
  /**
   * Weight for and against adopting x under sincere voting, given what has been decided so far:
   * the pairwise support of the two versions compared (amendment procedure, and passage), or the
   * successive tally over the versions still available (successive procedure). Null without a profile.
   */
  sincereTally(x: number, decided: number, adopted: number): { forWeight: number; againstWeight: number } | null;
  /** Successive procedure: the versions a sincere vote on x weighs the adopted text against (x's own version first). */
  successiveField(x: number, decided: number, adopted: number): number[];
  /** v beats w on the amendment graph (kept for callers that compare versions without a question). */
  beats(v: number, w: number): boolean;
  /** v beats w when question x puts them: each question is decided under its own threshold (passage, amendments). */
  beatsOn(x: number, v: number, w: number): boolean;
  /**
   * `beatsOn(x, ·, ·)` as a bit matrix (for the counts' inner loops): v beats w on question x iff bit
   * w % 32 of word v · stride + ⌊w / 32⌋ is set, stride = ⌈versions / 32⌉. Built once per distinct graph.
   */
  beatsBits(x: number): Uint32Array;
}

/**
 * `graphFor(question)` gives the majority graph a question is decided on (its threshold, membership
 * and tie rule: docs/decisions/0008); by default every question uses `g`.
 */
export function questionAgenda(model: AmendmentTreeModel, g: MajorityGraph, profile: Profile | null, procedure: Procedure, graphFor: (question: number) => MajorityGraph = () => g): QuestionAgenda {
  const k = model.amendments.length;
  const passage = k;
  const P = 1 << passage;
  const Q = 0;
  // An adopted substitute replaced x's text. A substitute for a first-degree amendment is voted before
  // that amendment, so its adoption makes the amendments to the amendment's text fall at once (they are
  // perfecting amendments of text no longer there) even though the amendment itself is still undecided.
  const superseding = (adopted: number, x: number) => {
    for (let s = 0; s < k; s++) if (adopted & (1 << s) && model.supersedes[s] & (1 << x)) return true;
    return false;
  };
  const falls = (x: number, decided: number, adopted: number): boolean => {
    if (x === passage) return false;
    if (decided & P) return true;
    const par = model.parent[x];
    if (par >= 0 && (decided & (1 << par) || falls(par, decided, adopted))) return true;
    return (model.exclusive[x] & adopted & ~P) !== 0 || superseding(adopted, x);
  };
  const relevant: number[] = [];
  const fallsRelevant = (x: number): number => {
    if (x === passage) return 0;
    if (relevant[x] === undefined) {
      let r = model.exclusive[x];
      for (let s = 0; s < k; s++) if (model.supersedes[s] & (1 << x)) r |= 1 << s;
      relevant[x] = r | (model.parent[x] >= 0 ? fallsRelevant(model.parent[x]) : 0);
    }
    return relevant[x];
  };
  // The motion branch's state is always adopted | (1 << x) (question-counts.ts relies on it).
  const vote = (x: number, adopted: number) => {
    if (x === passage) return { yesState: adopted | P, noState: adopted, yesVersion: model.versionOf(adopted & ~P), noVersion: Q };
    // Everything x amends is taken as adopted (a second-degree amendment perfects its parent; an
    // amendment of a substitute for A perfects the substitute, which would replace A's text).
    const assumed = adopted | model.ancestors[x];
    return { yesState: adopted | (1 << x), noState: adopted, yesVersion: model.versionOf((assumed | (1 << x)) & ~P), noVersion: model.versionOf(assumed & ~P) };
  };
  const outcome = (adopted: number) => (adopted & P ? model.versionOf(adopted & ~P) : Q);
  const beats = (v: number, w: number) => v !== w && g.beats[v][w];
  const graphs = [...Array(k + 1).keys()].map((x) => graphFor(x));
  const beatsOn = (x: number, v: number, w: number) => v !== w && graphs[x].beats[v][w];
  const bitMatrices = new Map<MajorityGraph, Uint32Array>();
  const beatsBits = (x: number): Uint32Array => {
    const gx = graphs[x];
    let bits = bitMatrices.get(gx);
    if (!bits) {
      const nv = model.versions.length;
      const stride = (nv + 31) >>> 5;
      bits = new Uint32Array(nv * stride);
      for (let v = 0; v < nv; v++) {
        const row = gx.beats[v];
        for (let w = 0; w < nv; w++) if (v !== w && row[w]) bits[v * stride + (w >>> 5)] |= 1 << (w & 31);
      }
      bitMatrices.set(gx, bits);
    }
    return bits;
  };
  // Versions still available if x is rejected: Q and every consistent adoption of the undecided amendments.
  const available = (x: number, decided: number, adopted: number): number[] => {
    const open = [...Array(k).keys()].filter((a) => a !== x && !(decided & (1 << a)));
    const out = new Set<number>([Q]);
    const walk = (i: number, st: number, dec: number) => {
      if (i === open.length) return void out.add(model.versionOf(st & ~P));
      const a = open[i];
      walk(i + 1, st, dec | (1 << a));
      if (!falls(a, dec, st)) walk(i + 1, st | (1 << a), dec | (1 << a));
    };
    walk(0, adopted, decided | (1 << x));
    return [...out];
  };
  const successiveField = (x: number, decided: number, adopted: number): number[] => {
    const yes = vote(x, adopted).yesVersion;
    return [yes, ...available(x, decided, adopted).filter((y) => y !== yes)];
  };
  const successive = (x: number) => procedure === "successive" && x !== passage;
  // One tally per (question, state): the decision below and the walk-through read the same numbers.
  const tallies = new Map<string, { forWeight: number; againstWeight: number }>();
  const sincereTally = (x: number, decided: number, adopted: number) => {
    if (!profile) return null;
    const v = vote(x, adopted);
    if (!successive(x)) {
      const s = pairSupport(profile, v.yesVersion, v.noVersion);
      return { forWeight: s.forX, againstWeight: s.forY };
    }
    const key = `${x}:${decided}:${adopted}`;
    let t = tallies.get(key);
    if (t === undefined) {
      t = successiveTally(profile, v.yesVersion, successiveField(x, decided, adopted));
      tallies.set(key, t);
    }
    return t;
  };
  // The chair's yes or no on a successive question, read from the ballot kept apart (casting vote only).
  const chairOnSuccessive = (x: number, decided: number, adopted: number): ChairSide => {
    const c = profile?.chair;
    if (!c) return 0;
    const t = successiveTally({ alternatives: profile!.alternatives, members: [c], totalWeight: c.weight }, vote(x, adopted).yesVersion, successiveField(x, decided, adopted));
    return t.forWeight > 0 ? 1 : t.againstWeight > 0 ? -1 : 0;
  };
  const sincereAdopts = (x: number, decided: number, adopted: number): boolean => {
    if (!successive(x) || !profile) {
      const v = vote(x, adopted);
      return beatsOn(x, v.yesVersion, v.noVersion);
    }
    const t = sincereTally(x, decided, adopted)!;
    const gx = graphs[x];
    return decides(t.forWeight, t.againstWeight, gx.base ?? profile.totalWeight, gx.threshold, gx.tieRule, chairOnSuccessive(x, decided, adopted), profile.chair?.weight ?? 1);
  };
  return { model, k, passage, falls, fallsRelevant, vote, outcome, sincereAdopts, sincereTally, successiveField, beats, beatsOn, beatsBits };
}

export interface QuestionStep {
  question: number;
  put: boolean;
  adopted?: boolean;
}

/** Sincere outcome of one question order, with the steps taken. */
export function sincereQuestionPath(qa: QuestionAgenda, order: readonly number[]): { outcome: number; steps: QuestionStep[] } {
  let decided = 0;
  let adopted = 0;
  const steps: QuestionStep[] = [];
  for (const x of order) {
    if (qa.falls(x, decided, adopted)) steps.push({ question: x, put: false });
    else {
      const yes = qa.sincereAdopts(x, decided, adopted);
      steps.push({ question: x, put: true, adopted: yes });
      if (yes) adopted = qa.vote(x, adopted).yesState;
    }
    decided |= 1 << x;
  }
  return { outcome: qa.outcome(adopted), steps };
}

/**
 * Backward induction over one question order: `value(i, decided, adopted)` is the outcome that
 * sophisticated voters reach from question i on, given which questions are decided and which
 * amendments are adopted. Memoised on (position, adopted state), which determine `decided`.
 */
export function sophisticatedValue(qa: QuestionAgenda, order: readonly number[]): (i: number, decided: number, adopted: number) => number {
  const memo = new Map<number, number>();
  const value = (i: number, decided: number, adopted: number): number => {
    if (i === order.length) return qa.outcome(adopted);
    const key = i * 2 ** 20 + adopted;
    const hit = memo.get(key);
    if (hit !== undefined) return hit;
    const x = order[i];
    let r: number;
    if (qa.falls(x, decided, adopted)) r = value(i + 1, decided | (1 << x), adopted);
    else {
      const v = qa.vote(x, adopted);
      const yes = value(i + 1, decided | (1 << x), v.yesState);
      const no = value(i + 1, decided | (1 << x), v.noState);
      r = qa.beatsOn(x, yes, no) ? yes : no;
    }
    memo.set(key, r);
    return r;
  };
  return value;
}

/** Sophisticated outcome of one question order: backward induction, memoised on (position, state). */
export function sophisticatedQuestionOutcome(qa: QuestionAgenda, order: readonly number[]): number {
  return sophisticatedValue(qa, order)(0, 0, 0);
}

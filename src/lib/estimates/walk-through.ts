/**
 * The vote-by-vote walk-through of one question order for an amendment tree: the questions put (or
 * falling), the two versions each vote compares, the projected tally, and which later questions fall
 * on adoption and on rejection — along the sincere path and along the sophisticated path
 * (backward induction, Farquharson 1969; McKelvey & Niemi 1978, J. Econ. Theory 18:1–22).
 * Sincere tallies are the engine's own (questionAgenda.sincereTally): pairwise support under the
 * amendment procedure; under the successive procedure, yes from members who rank the amended text
 * above every version still within reach, no from the others who rank it. Sophisticated tallies are
 * the pairwise support of the two outcomes the branches lead to, under either procedure.
 * The rules of the vote are the voting engine's (questionAgenda in src/lib/voting/question-agenda.ts);
 * this only follows one order through them and tallies each vote from the estimate's profile.
 * Input: the same object analyseOrders reads, plus the order as question ids (amendment keys and
 * "passage"). An order that breaks the rulebook's constraints is refused (unprocessable).
 */
import { z } from "zod";
import { GavelError, parseWith } from "../errors.ts";
import { votingSectionSchema } from "../procedure/voting-section.ts";
import { amendmentTreeModel } from "../voting/amendment-versions.ts";
import { ordersInputSchema, PASSAGE } from "../voting/analyse-orders.ts";
import { rankingsToIndices } from "../voting/majority-input.ts";
import { questionConstraints, questionPrecedence } from "../voting/order-constraints.ts";
import { isLegalOrder } from "../voting/precedence.ts";
import { attendingWeight, pairSupport, profileFromRankings, type Profile } from "../voting/profile.ts";
import { questionAgenda, sincereQuestionPath, sophisticatedValue } from "../voting/question-agenda.ts";
import { chairSide } from "../voting/majority-graph.ts";
import { successiveTally } from "../voting/successive-agenda.ts";
import { scaleSpatial, spatialProfile, versionPosition } from "../voting/spatial-profile.ts";
import { thresholdText } from "../voting/vote-threshold.ts";
import { questionGraphs, quorumStatus, requireQuorum, thresholdsJson, voteRules } from "../voting/vote-rules.ts";

export interface WalkStep {
  question: string;
  put: boolean;
  /** Versions the vote compares: the version if adopted (motion) and if rejected (base). */
  motion?: string;
  base?: string;
  for?: number;
  against?: number;
  /** Successive procedure, sincere path: the other versions still within reach that members weighed the motion against. */
  withinReach?: string[];
  adopted?: boolean;
  /** The votes were equally divided and the chair's casting vote decided (tie rule "chair-casting-vote"). */
  castingVote?: "for" | "against";
  /** Later questions that fall if this one is adopted / rejected. */
  fallsIfAdopted?: string[];
  fallsIfRejected?: string[];
}

/** What follows a decision in the chair's script: the questions that fall, then the next question put (a branch step) or the end. */
export interface BranchNext {
  falls: string[];
  /** The branch step put next; null at the end. */
  next: number | null;
  /** At the end: the version that results. */
  outcome: string | null;
}

/**
 * One question as it can come before the chamber: every order of decisions reaches a chain of
 * these (a question can appear more than once, for different earlier decisions). Numbered in the
 * order they can arise (question order first, then the order the branches were found).
 */
export interface BranchStep {
  id: number;
  question: string;
  /** The versions the vote compares: if adopted (motion) and if rejected (base). */
  motion: string;
  base: string;
  ifAdopted: BranchNext;
  ifRejected: BranchNext;
  /** The steps (and their decision) that lead here; empty for the first. */
  from: Array<{ step: number; adopted: boolean }>;
  /** On the projected sincere path. */
  projected: boolean;
}

export interface WalkThrough {
  order: string[];
  procedure: "amendment" | "successive";
  threshold: string;
  /** Each question kind's threshold, the membership counted against, and the tie rule. */
  thresholds: { amendment: string; passage: string; passageFrom: string; members: number | null; membersFrom: string | null };
  tieRule: string;
  totalWeight: number;
  sincere: { outcome: string; steps: WalkStep[] };
  sophisticated: { outcome: string; steps: WalkStep[] };
  /** Every branch: each question as it can be put, what follows adoption and rejection. */
  branches: BranchStep[];
  /** Questions that fall before any vote (none in a well-formed tree). */
  fallsAtStart: string[];
}

/** At most this many branch steps are written out (a script for a larger tree is cut short and says so). */
export const MAX_BRANCH_STEPS = 400;

export const walkOrderSchema = z.array(z.string().min(1).max(40)).min(1).max(40);

function buildProfile(input: z.output<typeof ordersInputSchema>, names: string[], versions: Array<{ amendments: string[] }>, chairApart: boolean): Profile {
  if ("ballots" in input.profile) {
    const index = new Map(names.map((n, i) => [n, i]));
    return profileFromRankings(names, rankingsToIndices(input.profile.ballots, index, "profile.ballots"), input.profile.partial, { chairApart });
  }
  const s = scaleSpatial(input.profile.spatial, "profile.spatial");
  const positions = versions.map((v, i) => (i === 0 ? s.statusQuo : versionPosition(s, v.amendments)));
  return spatialProfile(s, names, positions);
}

export function walkThrough(raw: unknown, rawOrder: unknown): WalkThrough {
  const input = parseWith(ordersInputSchema, raw, "orders input");
  const orderIds = parseWith(walkOrderSchema, rawOrder, "order");
  const voting = parseWith(votingSectionSchema, input.rulebook.voting, "rulebook voting section", "rulebook.voting");
  const model = amendmentTreeModel({ measure: input.measure, amendments: input.amendments ?? [] });
  const names = model.versions.map((v) => v.id);
  const rules = voteRules(input.rulebook, voting, input.membership);
  const profile = buildProfile(input, names, model.versions, rules.tieRule === "chair-casting-vote");
  requireQuorum(quorumStatus(rules.quorum, rules.members, attendingWeight(profile)));
  const graphs = questionGraphs(profile, rules, model.amendments.length);
  const qa = questionAgenda(model, graphs.amendment, profile, voting.procedure, graphs.graphFor);
  const qids = [...model.amendments.map((a) => a.id), PASSAGE];
  const order = orderIds.map((id, i) => {
    const x = qids.indexOf(id);
    if (x < 0) throw new GavelError("invalid-input", `order.${i}: unknown question "${id}"`, { issues: [{ path: `order.${i}`, message: `unknown question "${id}"; the questions are ${qids.join(", ")}` }] });
    return x;
  });
  if (new Set(order).size !== order.length || order.length !== qids.length)
    throw new GavelError("invalid-input", `order: list each of the ${qids.length} questions exactly once`, { issues: [{ path: "order", message: `list each of ${qids.join(", ")} exactly once` }] });
  const pos = new Map(order.map((x, i) => [x, i]));
  for (const [a, b] of questionConstraints(model, voting.constraints))
    if (pos.get(a)! > pos.get(b)!) throw new GavelError("unprocessable", `order: ${qids[a]} must be put before ${qids[b]} under the rulebook`, { issues: [{ path: "order", message: `${qids[a]} must come before ${qids[b]}` }] });
  // Contiguous blocks and "not between" rules (primary-contiguous, perfecting-after-rejected-substitute).
  if (!isLegalOrder(questionPrecedence(model, voting.constraints), order))
    throw new GavelError("unprocessable", "order: the rulebook does not allow this order (one primary amendment is pending at a time, and a substitute's amendments and the substitute are voted together)", { issues: [{ path: "order", message: "not a legal order under the rulebook's constraints" }] });

  const sincereTally = (x: number, decided: number, adopted: number) => {
    const t = qa.sincereTally(x, decided, adopted)!;
    const successive = voting.procedure === "successive" && x !== qa.passage;
    return { for: t.forWeight, against: t.againstWeight, ...(successive ? { withinReach: qa.successiveField(x, decided, adopted).slice(1).map((v) => names[v]) } : {}) };
  };
  const pairTally = (yes: number, no: number) => {
    const s = pairSupport(profile, yes, no);
    return { for: s.forX, against: s.forY };
  };
  // The chair's casting vote, shown where it decided an equal division.
  const casting = (t: { for: number; against: number }, side: number): Pick<WalkStep, "castingVote"> =>
    rules.tieRule === "chair-casting-vote" && profile.chair && t.for === t.against && t.for > 0 && side !== 0 ? { castingVote: side > 0 ? "for" : "against" } : {};
  const castingOnSincere = (x: number, decided: number, adopted: number) => {
    const t = qa.sincereTally(x, decided, adopted)!;
    const v = qa.vote(x, adopted);
    const successive = voting.procedure === "successive" && x !== qa.passage;
    let side = chairSide(profile, v.yesVersion, v.noVersion);
    if (successive && profile.chair) {
      const c = successiveTally({ alternatives: profile.alternatives, members: [profile.chair], totalWeight: profile.chair.weight }, v.yesVersion, qa.successiveField(x, decided, adopted));
      side = c.forWeight > 0 ? 1 : c.againstWeight > 0 ? -1 : 0;
    }
    return casting({ for: t.forWeight, against: t.againstWeight }, side);
  };
  const fallsAfter = (i: number, decided: number, adopted: number) => order.slice(i + 1).filter((y) => qa.falls(y, decided, adopted)).map((y) => qids[y]);

  const sincerePath = sincereQuestionPath(qa, order);
  const sincereSteps: WalkStep[] = [];
  {
    let decided = 0;
    let adopted = 0;
    sincerePath.steps.forEach((s, i) => {
      const x = s.question;
      if (!s.put) sincereSteps.push({ question: qids[x], put: false });
      else {
        const v = qa.vote(x, adopted);
        const before = new Set(fallsAfter(i, decided, adopted));
        const d2 = decided | (1 << x);
        sincereSteps.push({
          question: qids[x],
          put: true,
          motion: names[v.yesVersion],
          base: names[v.noVersion],
          ...sincereTally(x, decided, adopted),
          ...castingOnSincere(x, decided, adopted),
          adopted: s.adopted,
          fallsIfAdopted: fallsAfter(i, d2, v.yesState).filter((q) => !before.has(q)),
          fallsIfRejected: fallsAfter(i, d2, v.noState).filter((q) => !before.has(q)),
        });
        if (s.adopted) adopted = v.yesState;
      }
      decided |= 1 << x;
    });
  }

  // Sophisticated path: at each vote members compare the outcomes the two branches lead to.
  const value = sophisticatedValue(qa, order);
  const sophSteps: WalkStep[] = [];
  {
    let decided = 0;
    let adopted = 0;
    order.forEach((x, i) => {
      if (qa.falls(x, decided, adopted)) sophSteps.push({ question: qids[x], put: false });
      else {
        const v = qa.vote(x, adopted);
        const d2 = decided | (1 << x);
        const yes = value(i + 1, d2, v.yesState);
        const no = value(i + 1, d2, v.noState);
        const ok = qa.beatsOn(x, yes, no);
        const before = new Set(fallsAfter(i, decided, adopted));
        sophSteps.push({ question: qids[x], put: true, motion: names[yes], base: names[no], ...pairTally(yes, no), ...casting(pairTally(yes, no), chairSide(profile, yes, no)), adopted: ok, fallsIfAdopted: fallsAfter(i, d2, v.yesState).filter((q) => !before.has(q)), fallsIfRejected: fallsAfter(i, d2, v.noState).filter((q) => !before.has(q)) });
        if (ok) adopted = v.yesState;
      }
      decided |= 1 << x;
    });
  }
  // Every branch: states are (position in the order, amendments adopted); `decided` follows from the position.
  const decidedBefore = (i: number) => order.slice(0, i).reduce((m, x) => m | (1 << x), 0);
  const stepAt = new Map<string, BranchStep>();
  const branches: BranchStep[] = [];
  const sincereKeys = new Set<string>();
  {
    let adopted = 0;
    sincerePath.steps.forEach((st, i) => {
      if (st.put) {
        sincereKeys.add(`${i}:${adopted}`);
        if (st.adopted) adopted = qa.vote(order[i], adopted).yesState;
      }
    });
  }
  /** From position i in state `adopted`: the questions that fall, then the next one put. */
  const advance = (i: number, adopted: number): { falls: string[]; at: number | null } => {
    const falls: string[] = [];
    let j = i;
    while (j < order.length && qa.falls(order[j], decidedBefore(j), adopted)) falls.push(qids[order[j++]]);
    return { falls, at: j < order.length ? j : null };
  };
  const queue: Array<{ i: number; adopted: number }> = [];
  const reach = (i: number, adopted: number, from: { step: number; adopted: boolean } | null): BranchNext => {
    const a = advance(i, adopted);
    if (a.at === null) return { falls: a.falls, next: null, outcome: names[qa.outcome(adopted)] };
    const key = `${a.at}:${adopted}`;
    let step = stepAt.get(key);
    if (!step) {
      if (branches.length >= MAX_BRANCH_STEPS) return { falls: a.falls, next: null, outcome: null };
      const v = qa.vote(order[a.at], adopted);
      step = { id: branches.length + 1, question: qids[order[a.at]], motion: names[v.yesVersion], base: names[v.noVersion], ifAdopted: { falls: [], next: null, outcome: null }, ifRejected: { falls: [], next: null, outcome: null }, from: [], projected: sincereKeys.has(key) };
      stepAt.set(key, step);
      branches.push(step);
      queue.push({ i: a.at, adopted });
    }
    if (from) step.from.push(from);
    return { falls: a.falls, next: step.id, outcome: null };
  };
  const start = reach(0, 0, null);
  // Breadth first: steps are numbered in the order they can arise.
  for (let k = 0; k < queue.length; k++) {
    const { i, adopted } = queue[k];
    const step = stepAt.get(`${i}:${adopted}`)!;
    const v = qa.vote(order[i], adopted);
    step.ifAdopted = reach(i + 1, v.yesState, { step: step.id, adopted: true });
    step.ifRejected = reach(i + 1, v.noState, { step: step.id, adopted: false });
  }

  return {
    branches,
    fallsAtStart: start.falls,
    order: orderIds,
    procedure: voting.procedure,
    threshold: thresholdText(voting.amendmentThreshold),
    thresholds: thresholdsJson(rules),
    tieRule: rules.tieRule,
    totalWeight: profile.totalWeight,
    sincere: { outcome: names[sincerePath.outcome], steps: sincereSteps },
    sophisticated: { outcome: names[value(0, 0, 0)], steps: sophSteps },
  };
}

/**
 * The orders analysis of one amendment tree under a rulebook's voting section: the alternatives
 * (versions), the majority-graph sets over them, the number of legal question orders, how many lead
 * to each outcome under sincere and sophisticated voting (exact, without listing them), and one page of
 * orders with their outcomes. Pure and synchronous; the CLI (`orders`), the API, the analysis page and
 * a worker thread all call this one function. Counts are JSON numbers below 2^53, decimal strings above.
 */
import { z } from "zod";
import { GavelError, parseWith } from "../errors.ts";
import { votingSectionSchema } from "../procedure/voting-section.ts";
import { amendmentTreeModel, type AmendmentTreeModel } from "./amendment-versions.ts";
import { countsByName } from "./agendas-report.ts";
import { countToJson, type JsonCount } from "./count-json.ts";
import { countLegalOrders, type RunControl } from "./count-orders.ts";
import { corePoint, type CoreResult } from "./core-point.ts";
import { exactText, unscale } from "./exact-decimal.ts";
import { legalOrderPage } from "./legal-orders.ts";
import { ballotSchema, rankingsToIndices } from "./majority-input.ts";
import { majorityReport, type MajorityReport } from "./majority-report.ts";
import { attendingWeight, profileFromRankings, type Profile } from "./profile.ts";
import { questionAgenda, sincereQuestionPath, sophisticatedQuestionOutcome, type QuestionStep } from "./question-agenda.ts";
import { sincereQuestionCounts, sophisticatedQuestionCounts } from "./question-counts.ts";
import { questionOrderRules, questionPrecedence } from "./order-constraints.ts";
import { scaleSpatial, spatialProfile, spatialSchema, versionPosition } from "./spatial-profile.ts";
import { UNCOVERED_VARIANTS } from "./uncovered-set.ts";
import { thresholdText } from "./vote-threshold.ts";
import { questionGraphs, quorumStatus, requireQuorum, thresholdsJson, voteRules, type QuorumStatus } from "./vote-rules.ts";
import { winSet, type WinSet } from "./win-set.ts";

export const PASSAGE = "passage";
export const MAX_PAGE_SIZE = 200;

export const ordersInputSchema = z.object({
  /** Only `voting` is read; a path must be resolved to the rulebook object by the caller. */
  rulebook: z.looseObject({ voting: z.unknown() }),
  /**
   * The chamber's membership when the rulebook gives no `chamber.members` (the server passes its roster
   * size): what thresholds "of the members" and the quorum count against. Never the ballots' total.
   */
  membership: z.number().int().min(1).max(100_000).optional(),
  measure: z.unknown(),
  amendments: z.unknown().optional(),
  profile: z.union([
    z.object({ ballots: z.array(ballotSchema).min(1).max(100_000), partial: z.enum(["abstain", "bottom"]).default("abstain") }).strict(),
    z.object({ spatial: spatialSchema }).strict(),
  ]),
  page: z.number().int().min(1).default(1),
  pageSize: z.number().int().min(1).max(MAX_PAGE_SIZE).default(20),
  uncovered: z.enum(UNCOVERED_VARIANTS).default("gillies"),
});
export type OrdersInput = z.input<typeof ordersInputSchema>;

export interface OrdersAnalysis {
  procedure: "amendment" | "successive";
  /** The amendment threshold (as before); `thresholds` has each question kind's. */
  threshold: string;
  thresholds: { amendment: string; passage: string; passageFrom: string; members: number | null; membersFrom: string | null };
  tieRule: string;
  /** Whether the estimate marks a ballot as the chair's. */
  chairBallot: boolean;
  quorum: QuorumStatus;
  /** For each version other than Q: whether it beats Q under the passage threshold (head to head). */
  passesAgainstQ: Record<string, boolean>;
  alternatives: Array<{ id: string; amendments: string[] }>;
  questions: Array<{ id: string; kind: "amendment" | "passage"; degree?: 1 | 2; amends?: string; form?: string; substituteFor?: string }>;
  constraints: Array<[string, string]>;
  /** primary-contiguous: each list of questions is voted as one contiguous block. */
  blocks: string[][];
  /** perfecting-after-rejected-substitute: none of `excludes` is voted between the first and the last question of `span`. */
  notBetween: Array<{ span: string[]; excludes: string[] }>;
  majority: MajorityReport;
  orders: JsonCount;
  sincere: Record<string, JsonCount>;
  sophisticated: Record<string, JsonCount>;
  page: { number: number; size: number; orders: Array<{ rank: number; questions: string[]; sincere: string; sophisticated: string; sincereSteps: Array<{ question: string; put: boolean; adopted?: boolean }> }> };
  spatial?: { positions: Record<string, number[]>; exactPositions: Record<string, string[]>; statusQuoWinSet: WinSet; core: CoreResult };
}

export interface AnalyseOptions extends RunControl {
  /** Progress over the whole analysis, with the phase name. */
  onPhase?: (phase: "orders" | "sincere" | "sophisticated" | "page", fraction: number) => void;
}

function buildProfile(input: z.output<typeof ordersInputSchema>, model: AmendmentTreeModel, chairApart: boolean): { profile: Profile; spatial?: OrdersAnalysis["spatial"]; s?: ReturnType<typeof scaleSpatial> } {
  const names = model.versions.map((v) => v.id);
  if ("ballots" in input.profile) {
    const index = new Map(names.map((n, i) => [n, i]));
    return { profile: profileFromRankings(names, rankingsToIndices(input.profile.ballots, index, "profile.ballots"), input.profile.partial, { chairApart }) };
  }
  const s = scaleSpatial(input.profile.spatial, "profile.spatial");
  if (!s.measure) throw new GavelError("invalid-input", "profile.spatial.measure: the measure's position is required", { issues: [{ path: "profile.spatial.measure", message: "required to place the versions" }] });
  for (const id of s.effects.keys())
    if (!model.amendments.some((a) => a.id === id)) throw new GavelError("invalid-input", `profile.spatial.amendments.${id}: not a pending amendment`, { issues: [{ path: `profile.spatial.amendments.${id}`, message: "not a pending amendment of this tree" }] });
  const positions = model.versions.map((v, i) => (i === 0 ? s.statusQuo : versionPosition(s, v.amendments)));
  return {
    s,
    profile: spatialProfile(s, names, positions),
    spatial: {
      positions: Object.fromEntries(names.map((n, i) => [n, positions[i].map((c) => unscale(c, s.scale))])),
      exactPositions: Object.fromEntries(names.map((n, i) => [n, positions[i].map((c) => exactText(c, s.scale))])),
      statusQuoWinSet: winSet(s, s.statusQuo, "majority"),
      core: corePoint(s),
    },
  };
}

export function analyseOrders(raw: unknown, opts: AnalyseOptions = {}): OrdersAnalysis {
  const input = parseWith(ordersInputSchema, raw, "orders input");
  const voting = parseWith(votingSectionSchema, input.rulebook.voting, "rulebook voting section", "rulebook.voting");
  const model = amendmentTreeModel({ measure: input.measure, amendments: input.amendments ?? [] });
  const rules = voteRules(input.rulebook, voting, input.membership);
  const built = buildProfile(input, model, rules.tieRule === "chair-casting-vote");
  const quorum = quorumStatus(rules.quorum, rules.members, attendingWeight(built.profile));
  requireQuorum(quorum);
  const graphs = questionGraphs(built.profile, rules, model.amendments.length);
  const graph = graphs.amendment;
  const qa = questionAgenda(model, graph, built.profile, voting.procedure, graphs.graphFor);
  const qids = [...model.amendments.map((a) => a.id), PASSAGE];
  const orderRules = questionOrderRules(model, voting.constraints);
  const pairs = orderRules.pairs;
  const prec = questionPrecedence(model, voting.constraints);
  const phase = (name: "orders" | "sincere" | "sophisticated"): RunControl => ({ ...opts, onProgress: (f) => opts.onPhase?.(name, f) });
  const total = countLegalOrders(prec, phase("orders"));
  if (Number(total) === 0) throw new GavelError("unprocessable", "the rulebook's ordering constraints leave no legal voting order for this tree", { issues: [{ path: "rulebook.voting.constraints", message: "no order satisfies every constraint" }] });
  const sincere = sincereQuestionCounts(qa, prec, phase("sincere"));
  const sophisticated = sophisticatedQuestionCounts(qa, prec, phase("sophisticated"));
  const pageOrders = legalOrderPage(prec, input.page, input.pageSize);
  const firstRank = (input.page - 1) * input.pageSize + 1;
  const versionName = (v: number) => model.versions[v].id;
  const idsOf = (mask: number) => qids.filter((_, i) => mask & (1 << i));
  const stepJson = (s: QuestionStep) => ({ question: qids[s.question], put: s.put, ...(s.adopted === undefined ? {} : { adopted: s.adopted }) });
  const page = pageOrders.map((o, i) => {
    const path = sincereQuestionPath(qa, o);
    return { rank: firstRank + i, questions: o.map((x) => qids[x]), sincere: versionName(path.outcome), sophisticated: versionName(sophisticatedQuestionOutcome(qa, o)), sincereSteps: path.steps.map(stepJson) };
  });
  opts.onPhase?.("page", 1);
  return {
    procedure: voting.procedure,
    threshold: thresholdText(rules.amendment),
    thresholds: thresholdsJson(rules),
    tieRule: rules.tieRule,
    chairBallot: "ballots" in input.profile && input.profile.ballots.some((b) => b.chair === true),
    quorum,
    passesAgainstQ: Object.fromEntries(model.versions.slice(1).map((v, i) => [v.id, graphs.passage.beats[i + 1][0]])),
    alternatives: model.versions,
    questions: [
      ...model.amendments.map((a, i) => ({ id: a.id, kind: "amendment" as const, degree: model.degree[i], amends: a.target, form: a.form, ...(model.substituteFor[i] >= 0 ? { substituteFor: a.target } : {}) })),
      { id: PASSAGE, kind: "passage" as const },
    ],
    constraints: [...new Set(pairs.map(([a, b]) => `${a},${b}`))].map((s) => s.split(",").map((x) => qids[Number(x)]) as [string, string]),
    blocks: orderRules.blocks.map(idsOf),
    notBetween: orderRules.notBetween.map((w) => ({ span: idsOf(w.span), excludes: idsOf(w.excludes) })),
    majority: majorityReport(graph, { uncovered: input.uncovered }),
    orders: countToJson(total),
    sincere: countsByName(graph, sincere),
    sophisticated: countsByName(graph, sophisticated),
    page: { number: input.page, size: input.pageSize, orders: page },
    ...(built.spatial ? { spatial: built.spatial } : {}),
  };
}

/**
 * One analysis job, as run in a worker thread: the voting engine's analyseOrders (the same function
 * the `gavelwright orders` command calls) ONCE for the counts and sets, then the legal orders listed
 * with their sincere and sophisticated outcomes, up to MAX_LISTED orders, so the page can filter them
 * by outcome and export them. The listing walks the orders lazily from the same question agenda
 * (built once here, from the engine's exported parts, exactly as analyseOrders builds it) instead of
 * calling analyseOrders again for every page: the counts, the majority report and the graph are
 * computed once per run. tests/unit/estimates/analysis-job.test.ts checks the listing against
 * analyseOrders' own pages. No I/O; progress and cancellation come from the caller.
 */
import { GavelError, parseWith } from "../../errors.ts";
import { votingSectionSchema } from "../../procedure/voting-section.ts";
import { analyseOrders, MAX_PAGE_SIZE, ordersInputSchema, PASSAGE, type AnalyseOptions, type OrdersAnalysis } from "../../voting/analyse-orders.ts";
import { amendmentTreeModel } from "../../voting/amendment-versions.ts";
import { legalOrders } from "../../voting/legal-orders.ts";
import { rankingsToIndices } from "../../voting/majority-input.ts";
import { majorityGraph } from "../../voting/majority-graph.ts";
import { questionConstraints } from "../../voting/order-constraints.ts";
import { precedence } from "../../voting/precedence.ts";
import { profileFromRankings, type Profile } from "../../voting/profile.ts";
import { questionAgenda, sincereQuestionPath, sophisticatedQuestionOutcome } from "../../voting/question-agenda.ts";
import { scaleSpatial, spatialProfile, versionPosition } from "../../voting/spatial-profile.ts";
import { toThreshold } from "../../voting/vote-threshold.ts";

export const MAX_LISTED = 5000;

export interface ListedOrder {
  rank: number;
  questions: string[];
  sincere: string;
  sophisticated: string;
}

export interface JobResult {
  analysis: Omit<OrdersAnalysis, "page">;
  listing: { orders: ListedOrder[]; complete: boolean };
}

type JobOptions = AnalyseOptions & { onListing?: (fraction: number) => void; maxListed?: number };

/** The first `max` legal orders with their outcomes, from one question agenda (no recount). */
export function listOrders(raw: unknown, max: number, opts: JobOptions = {}): ListedOrder[] {
  const input = parseWith(ordersInputSchema, raw, "orders input");
  const voting = parseWith(votingSectionSchema, input.rulebook.voting, "rulebook voting section", "rulebook.voting");
  const model = amendmentTreeModel({ measure: input.measure, amendments: input.amendments ?? [] });
  const names = model.versions.map((v) => v.id);
  let profile: Profile;
  if ("ballots" in input.profile) {
    const index = new Map(names.map((n, i) => [n, i]));
    profile = profileFromRankings(names, rankingsToIndices(input.profile.ballots, index, "profile.ballots"), input.profile.partial);
  } else {
    const s = scaleSpatial(input.profile.spatial, "profile.spatial");
    if (!s.measure) throw new GavelError("invalid-input", "profile.spatial.measure: the measure's position is required", { issues: [{ path: "profile.spatial.measure", message: "required to place the versions" }] });
    profile = spatialProfile(s, names, model.versions.map((v, i) => (i === 0 ? s.statusQuo : versionPosition(s, v.amendments))));
  }
  const graph = majorityGraph(profile, toThreshold(voting.amendmentThreshold));
  const qa = questionAgenda(model, graph, profile, voting.procedure);
  const qids = [...model.amendments.map((a) => a.id), PASSAGE];
  const prec = precedence(qa.k + 1, questionConstraints(model, voting.constraints), "rulebook.voting.constraints");
  const out: ListedOrder[] = [];
  for (const o of legalOrders(prec)) {
    if (out.length >= max) break;
    if (out.length % 100 === 0) {
      if (opts.shouldCancel?.()) throw new GavelError("limit-exceeded", "the analysis was cancelled", { details: { cancelled: true } });
      if (out.length > 0) opts.onListing?.(out.length / max);
    }
    out.push({ rank: out.length + 1, questions: o.map((x) => qids[x]), sincere: names[sincereQuestionPath(qa, o).outcome], sophisticated: names[sophisticatedQuestionOutcome(qa, o)] });
  }
  return out;
}

export function runAnalysisJob(input: Record<string, unknown>, opts: JobOptions = {}): JobResult {
  const first = analyseOrders({ ...input, page: 1, pageSize: MAX_PAGE_SIZE }, opts);
  const { page, ...analysis } = first;
  const total = typeof first.orders === "number" ? first.orders : Number.POSITIVE_INFINITY;
  const want = Math.min(total, opts.maxListed ?? MAX_LISTED);
  const fromPage: ListedOrder[] = page.orders.map(({ rank, questions, sincere, sophisticated }) => ({ rank, questions, sincere, sophisticated }));
  // The first page is the engine's own; only a longer listing walks on from the same agenda.
  const orders = want <= fromPage.length ? fromPage.slice(0, want) : listOrders(input, want, opts);
  opts.onListing?.(1);
  return { analysis, listing: { orders, complete: orders.length === total } };
}

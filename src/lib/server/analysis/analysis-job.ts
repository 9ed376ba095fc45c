/**
 * One analysis job, as run in a worker thread: the voting engine's analyseOrders (the same function
 * the `gavelwright orders` command calls) for the counts and sets, then the legal orders listed page
 * by page with their sincere and sophisticated outcomes, up to MAX_LISTED orders, so the page can
 * filter them by outcome and export them. No I/O; progress and cancellation come from the caller.
 */
import { analyseOrders, MAX_PAGE_SIZE, type AnalyseOptions, type OrdersAnalysis } from "../../voting/analyse-orders.ts";

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

export function runAnalysisJob(input: Record<string, unknown>, opts: AnalyseOptions & { onListing?: (fraction: number) => void } = {}): JobResult {
  const first = analyseOrders({ ...input, page: 1, pageSize: MAX_PAGE_SIZE }, opts);
  const { page, ...analysis } = first;
  const total = typeof first.orders === "number" ? first.orders : Number.POSITIVE_INFINITY;
  const want = Math.min(total, MAX_LISTED);
  const orders: ListedOrder[] = page.orders.map(({ rank, questions, sincere, sophisticated }) => ({ rank, questions, sincere, sophisticated }));
  for (let p = 2; orders.length < want; p++) {
    const next = analyseOrders({ ...input, page: p, pageSize: MAX_PAGE_SIZE }, opts);
    if (next.page.orders.length === 0) break;
    for (const o of next.page.orders) if (orders.length < want) orders.push({ rank: o.rank, questions: o.questions, sincere: o.sincere, sophisticated: o.sophisticated });
    opts.onListing?.(orders.length / want);
  }
  return { analysis, listing: { orders, complete: orders.length === total } };
}

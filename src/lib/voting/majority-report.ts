/**
 * Everything the product shows about one majority graph, as JSON: margins, Condorcet winner, top
 * cycle, Schwartz set, uncovered set (Gillies unless asked otherwise), Banks set with its
 * completeness flag. Sets list alternatives in the input order.
 */
import { banksSet } from "./banks-set.ts";
import { condorcetWinner } from "./condorcet-winner.ts";
import type { MajorityGraph } from "./majority-graph.ts";
import { schwartzSet } from "./schwartz-set.ts";
import { topCycle } from "./top-cycle.ts";
import { uncoveredSet, type UncoveredVariant } from "./uncovered-set.ts";

export interface MajorityReport {
  margins: Record<string, Record<string, number>>;
  condorcetWinner: string | null;
  topCycle: string[];
  schwartzSet: string[];
  uncoveredSet: string[];
  banksSet: string[];
  banksComplete: boolean;
}

export function majorityReport(g: MajorityGraph, opts: { uncovered?: UncoveredVariant; banksMaxNodes?: number } = {}): MajorityReport {
  const names = g.alternatives;
  const ids = (xs: number[]) => xs.map((x) => names[x]);
  const margins: Record<string, Record<string, number>> = {};
  names.forEach((x, i) => {
    margins[x] = {};
    names.forEach((y, j) => {
      if (i !== j) margins[x][y] = g.margins[i][j] + 0;
    });
  });
  const cw = condorcetWinner(g);
  const banks = banksSet(g, { maxNodes: opts.banksMaxNodes });
  return {
    margins,
    condorcetWinner: cw === null ? null : names[cw],
    topCycle: ids(topCycle(g)),
    schwartzSet: ids(schwartzSet(g)),
    uncoveredSet: ids(uncoveredSet(g, opts.uncovered)),
    banksSet: ids(banks.members),
    banksComplete: banks.complete,
  };
}

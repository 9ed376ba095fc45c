/**
 * Findings in plain language from one orders analysis (the JSON of analyseOrders): whether the order
 * of questions decides the outcome and which outcomes it can produce; a Condorcet winner that some
 * legal order defeats (Condorcet 1785; McKelvey & Niemi 1978); where sophisticated voting changes
 * the sincere result (Farquharson 1969); amendments whose adoption would turn a passing measure
 * into a failing one or the reverse (pairwise margins against the status quo). Every finding carries
 * the caution that it is a projection from an estimate and that the chair and the rules decide.
 */
import type { OrdersAnalysis } from "../voting/analyse-orders.ts";
import { amendmentName, keyLabel, listInWords, STATUS_QUO_ID, thresholdInWords, versionInWords, versionShort, type TreeLabels } from "./version-words.ts";

export interface Finding {
  id: "order-decides" | "order-indifferent" | "condorcet-defeated" | "condorcet-holds" | "cycle" | "strategic" | "sincere-holds" | "kills" | "saves";
  headline: string;
  detail: string;
  caution: string;
}

export interface OrderListing {
  /** Orders listed with both outcomes (all of them when `complete`). */
  orders: Array<{ sincere: string; sophisticated: string }>;
  complete: boolean;
}

type Analysis = Pick<OrdersAnalysis, "alternatives" | "majority" | "orders" | "sincere" | "sophisticated"> & Partial<Pick<OrdersAnalysis, "passesAgainstQ" | "thresholds">>;

const num = (c: number | string) => (typeof c === "number" ? c : Number(c));
const orders = (c: number | string) => `${c} legal order${num(c) === 1 ? "" : "s"}`;

export function caution(estimateTitle: string): string {
  return `A projection from the estimate “${estimateTitle}”, not a forecast of the vote: the presiding officer's rulings, the chamber's own rules and its counsel decide.`;
}

function outcomesInWords(counts: Record<string, number | string>, labels: TreeLabels): string {
  return listInWords(Object.entries(counts).filter(([, c]) => num(c) > 0).map(([v, c]) => `${orders(c)} to ${versionShort(v, labels)}`));
}

export function buildFindings(a: Analysis, listing: OrderListing, labels: TreeLabels, estimateTitle: string): Finding[] {
  const out: Finding[] = [];
  const c = caution(estimateTitle);
  const reached = (m: Record<string, number | string>) => Object.keys(m).filter((v) => num(m[v]) > 0);
  const sincere = reached(a.sincere);
  const soph = reached(a.sophisticated);
  const all = [...new Set([...sincere, ...soph])];
  if (all.length > 1)
    out.push({
      id: "order-decides",
      headline: `The order of questions decides the outcome: ${all.length} different versions can win.`,
      detail: `Of ${orders(a.orders)}, under sincere voting ${outcomesInWords(a.sincere, labels)}; under sophisticated voting ${outcomesInWords(a.sophisticated, labels)}.`,
      caution: c,
    });
  else if (all.length === 1)
    out.push({ id: "order-indifferent", headline: `The order of questions does not change the outcome: every legal order ends with ${versionShort(all[0], labels)}.`, detail: `${versionInWords(all[0], labels)}, whether members vote sincerely or strategically.`, caution: c });

  const cw = a.majority.condorcetWinner;
  if (cw) {
    const lost = num(a.orders) - num(a.sincere[cw] ?? 0);
    const lostSoph = num(a.orders) - num(a.sophisticated[cw] ?? 0);
    if (lost > 0 || lostSoph > 0)
      out.push({ id: "condorcet-defeated", headline: `${versionShort(cw, labels)} beats every other version head to head, yet some legal orders defeat it.`, detail: `${versionInWords(cw, labels)} wins every pairwise vote; still ${lost} order${lost === 1 ? "" : "s"} end elsewhere under sincere voting and ${lostSoph} under sophisticated voting.`, caution: c });
    else out.push({ id: "condorcet-holds", headline: `${versionShort(cw, labels)} beats every other version head to head and wins under every legal order.`, detail: versionInWords(cw, labels), caution: c });
  } else {
    const cyc = a.majority.topCycle;
    const beats = cyc.flatMap((x) => cyc.filter((y) => (a.majority.margins[x]?.[y] ?? 0) > 0).map((y) => `${versionShort(x, labels)} beats ${versionShort(y, labels)} by ${a.majority.margins[x][y]}`));
    out.push({ id: "cycle", headline: `No version beats all the others: the majority preferences cycle among ${cyc.length <= 4 ? listInWords(cyc.map((v) => versionShort(v, labels))) : `${cyc.length} versions — see the majority matrix`}.`, detail: `${beats.slice(0, 6).join("; ")}${beats.length > 6 ? ` (and ${beats.length - 6} more wins within the cycle)` : ""}. Which of them wins can depend on the order in which the questions are put.`, caution: c });
  }

  const differing = listing.orders.filter((o) => o.sincere !== o.sophisticated);
  if (differing.length > 0) {
    const ex = differing[0];
    out.push({
      id: "strategic",
      headline: `Strategic voting would change the result in ${differing.length}${listing.complete ? "" : " or more"} of the ${listing.complete ? "" : "listed "}orders.`,
      detail: `For example, where sincere voting would give ${versionShort(ex.sincere, labels)}, members who look ahead would reach ${versionShort(ex.sophisticated, labels)}.`,
      caution: c,
    });
  } else if (listing.orders.length > 0)
    out.push({ id: "sincere-holds", headline: `Strategic voting changes nothing in ${listing.complete ? "any legal order" : "the listed orders"}.`, detail: "Sincere and sophisticated voting reach the same version in each.", caution: c });

  const ids = new Set(a.alternatives.map((v) => v.id));
  // Under the passage threshold when the analysis gives it (decision 0008), else a simple majority.
  const beatsQ = (v: string) => a.passesAgainstQ?.[v] ?? (a.majority.margins[v]?.[STATUS_QUO_ID] ?? 0) > 0;
  const needs = a.thresholds && a.thresholds.passage !== "majority" ? ` (passage needs ${thresholdInWords(a.thresholds.passage)})` : "";
  const seen = new Set<string>();
  for (const v of a.alternatives) {
    if (v.amendments.length === 0 || v.amendments.length > 2) continue;
    const last = v.amendments[v.amendments.length - 1];
    if (seen.has(last)) continue;
    const baseId = v.amendments.length === 1 ? labels.measureKey : `${labels.measureKey}+${v.amendments[0]}`;
    if (!ids.has(baseId)) continue;
    const name = amendmentName(last, labels);
    if (beatsQ(baseId) && !beatsQ(v.id)) {
      seen.add(last);
      out.push({ id: "kills", headline: `${name} would kill the measure.`, detail: `${versionShort(baseId, labels)} is projected to pass against no change (margin ${a.majority.margins[baseId][STATUS_QUO_ID]}); with ${keyLabel(last, labels)} adopted it is projected to fail (margin ${a.majority.margins[v.id][STATUS_QUO_ID]})${needs}.`, caution: c });
    } else if (!beatsQ(baseId) && beatsQ(v.id)) {
      seen.add(last);
      out.push({ id: "saves", headline: `${name} would save the measure.`, detail: `${versionShort(baseId, labels)} is projected to fail against no change (margin ${a.majority.margins[baseId][STATUS_QUO_ID]}); with ${keyLabel(last, labels)} adopted it is projected to pass (margin ${a.majority.margins[v.id][STATUS_QUO_ID]})${needs}.`, caution: c });
    }
  }
  return out;
}

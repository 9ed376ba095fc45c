/**
 * The `agendas` analysis: for a majority input, a procedure and ordering constraints, the number of
 * legal voting orders x1…xm, the number of distinct amendment agendas (swapping x1 and x2 changes
 * nothing, DOMAIN §2), and how many orders lead to each outcome under sincere and sophisticated
 * voting; for one given order, both outcomes, the sophisticated chain and the votes with tallies.
 */
import { z } from "zod";
import { GavelError, parseWith, type InputIssue } from "../errors.ts";
import { shepsleWeingast } from "./amendment-agenda.ts";
import { sincereCounts, sophisticatedCounts, type Procedure } from "./agenda-counts.ts";
import { countToJson, type Count, type JsonCount } from "./count-json.ts";
import { countLegalOrders, countOrders, type RunControl } from "./count-orders.ts";
import { alternativeNameSchema, indexAlternatives, majorityInputSchema, parsedMajorityGraph } from "./majority-input.ts";
import type { MajorityGraph } from "./majority-graph.ts";
import { precedence, type Precedence } from "./precedence.ts";
import { sophisticatedSuccessive } from "./successive-agenda.ts";
import { amendmentTree, successiveTree, votePath, type VoteRecord } from "./voting-tree.ts";

/** 2^n order ideals bound the work; 20 alternatives keeps a count within seconds to a minute. */
export const MAX_AGENDA_ALTERNATIVES = 20;

export const agendasInputSchema = majorityInputSchema.extend({
  procedure: z.enum(["amendment", "successive"]),
  constraints: z
    .object({
      first: alternativeNameSchema.optional(),
      last: alternativeNameSchema.optional(),
      before: z.array(z.tuple([alternativeNameSchema, alternativeNameSchema])).max(1000).default([]),
    })
    .default({ before: [] }),
  order: z.array(alternativeNameSchema).optional(),
});
export type AgendasInput = z.input<typeof agendasInputSchema>;

export interface AgendasReport {
  orders: JsonCount;
  /** Amendment procedure only: orders up to swapping x1 and x2. */
  distinctAgendas?: JsonCount;
  /** null when undefined: sincere successive voting needs ballots. */
  sincere: Record<string, JsonCount> | null;
  sophisticated: Record<string, JsonCount>;
  order?: { sincere: string | null; sophisticated: string; chain: string[]; votes: { sincere: VoteRecord[] | null; sophisticated: VoteRecord[] } };
}

function bad(path: string, message: string): never {
  const issues: InputIssue[] = [{ path, message }];
  throw new GavelError("invalid-input", `agendas input: ${path}: ${message}`, { issues });
}

export function countsByName(g: MajorityGraph, counts: Count[]): Record<string, JsonCount> {
  const out: Record<string, JsonCount> = {};
  counts.forEach((c, i) => {
    if (c !== 0 && c !== 0n) out[g.alternatives[i]] = countToJson(c);
  });
  return out;
}

/** Orders up to swapping the first two items: L − W/2, W = orders whose first two items could be swapped. */
export function distinctAgendaCount(prec: Precedence, control?: RunControl): Count {
  const FIRST = 64;
  const m = countOrders<number>(
    prec,
    { start: 0, step: (s, x) => (s === 0 ? FIRST + x : s >= FIRST ? (prec.pred[x] & (1 << (s - FIRST)) ? 1 : 2) : s) },
    "forward",
    control,
  );
  const total = [...m.values()].reduce<Count>((a, c) => (a as number) + (c as number), prec.n > 18 ? 0n : 0);
  const w = m.get(2) ?? (prec.n > 18 ? 0n : 0);
  return typeof total === "bigint" ? total - (w as bigint) / 2n : total - (w as number) / 2;
}

export function analyseAgendas(raw: unknown, control?: RunControl): AgendasReport {
  const input = parseWith(agendasInputSchema, raw, "agendas input");
  const { graph, profile } = parsedMajorityGraph(input);
  const n = graph.alternatives.length;
  if (n > MAX_AGENDA_ALTERNATIVES) throw new GavelError("limit-exceeded", `agendas are counted for at most ${MAX_AGENDA_ALTERNATIVES} alternatives; got ${n}`, { issues: [{ path: "alternatives", message: "too many alternatives" }] });
  const index = indexAlternatives(input.alternatives);
  const look = (name: string, path: string) => index.get(name) ?? bad(path, `unknown alternative "${name}"`);
  const before: Array<[number, number]> = input.constraints.before.map(([a, b], i) => [look(a, `constraints.before.${i}.0`), look(b, `constraints.before.${i}.1`)]);
  if (input.constraints.first !== undefined) {
    const f = look(input.constraints.first, "constraints.first");
    for (let y = 0; y < n; y++) if (y !== f) before.push([f, y]);
  }
  if (input.constraints.last !== undefined) {
    const l = look(input.constraints.last, "constraints.last");
    for (let y = 0; y < n; y++) if (y !== l) before.push([y, l]);
  }
  const prec = precedence(n, before, "constraints");
  const procedure: Procedure = input.procedure;
  const sinc = procedure === "successive" && !profile ? null : countsByName(graph, sincereCounts(graph, prec, procedure, profile, control));
  const report: AgendasReport = {
    orders: countToJson(countLegalOrders(prec, control)),
    ...(procedure === "amendment" ? { distinctAgendas: countToJson(distinctAgendaCount(prec, control)) } : {}),
    sincere: sinc,
    sophisticated: countsByName(graph, sophisticatedCounts(graph, prec, procedure, control)),
  };
  if (input.order) {
    if (input.order.length !== n) bad("order", `must list each of the ${n} alternatives once`);
    const order = input.order.map((a, i) => look(a, `order.${i}`));
    const seen = new Set<number>();
    order.forEach((x, i) => {
      if (seen.has(x)) bad(`order.${i}`, `"${input.order![i]}" appears twice`);
      if ((prec.pred[x] & ~[...seen].reduce((m, y) => m | (1 << y), 0)) !== 0) bad(`order.${i}`, `"${input.order![i]}" comes before an alternative the constraints put first`);
      seen.add(x);
    });
    const tree = procedure === "amendment" ? amendmentTree(order, graph.alternatives) : successiveTree(order, graph.alternatives);
    const sincerePath = procedure === "successive" && !profile ? null : votePath(tree, graph, profile, "sincere");
    const sophPath = votePath(tree, graph, profile, "sophisticated");
    const chain = procedure === "amendment" ? shepsleWeingast(graph, order).chain : [...new Set(sophisticatedSuccessive(graph, order).equivalents)];
    report.order = {
      sincere: sincerePath ? graph.alternatives[sincerePath.outcome] : null,
      sophisticated: graph.alternatives[sophPath.outcome],
      chain: chain.map((x) => graph.alternatives[x]),
      votes: { sincere: sincerePath?.votes ?? null, sophisticated: sophPath.votes },
    };
  }
  return report;
}

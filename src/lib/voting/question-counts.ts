/**
 * Exact counts, over every legal order of the questions of an amendment tree, of the orders leading
 * to each outcome — one run each of the counting engine (count-orders.ts):
 *  - sincere, forward: state = adopted set (the sincere path depends only on it and the decided set);
 *  - sophisticated, backward (last question first): state = the value table of the remaining suffix,
 *    i.e. the backward-induction outcome for every possible adopted set of the questions before it.
 *    Tables are interned, so orders whose suffixes induce the same table are merged.
 */
import { GavelError } from "../errors.ts";
import { countOrders, type OrderMachine, type RunControl } from "./count-orders.ts";
import type { Count } from "./count-json.ts";
import type { Precedence } from "./precedence.ts";
import type { QuestionAgenda } from "./question-agenda.ts";

function byOutcome(final: Map<number, Count>, outcomeOf: (s: number) => number, versions: number): Count[] {
  const out: Count[] = new Array(versions).fill(0);
  for (const [s, c] of final) out[outcomeOf(s)] = (out[outcomeOf(s)] as number) + (c as number);
  return out;
}

export function sincereQuestionCounts(qa: QuestionAgenda, prec: Precedence, control?: RunControl): Count[] {
  const m: OrderMachine<number> = { start: 0, step: (a, x, placed) => (qa.falls(x, placed, a) ? a : qa.sincereAdopts(x, placed, a) ? qa.vote(x, a).yesState : a) };
  return byOutcome(countOrders(prec, m, "forward", control), qa.outcome, qa.model.versions.length);
}

/** Index of A's bits among the set bits of C. */
function compress(a: number, bitsOfC: readonly number[]): number {
  let r = 0;
  for (let i = 0; i < bitsOfC.length; i++) if (a & (1 << bitsOfC[i])) r |= 1 << i;
  return r;
}

/** Total entries of all interned value tables; beyond it the count stops with limit-exceeded. */
export const MAX_TABLE_ENTRIES = 30_000_000;

export function sophisticatedQuestionCounts(qa: QuestionAgenda, prec: Precedence, control?: RunControl): Count[] {
  const n = qa.k + 1;
  const full = (2 ** n - 1) | 0;
  const bitsOf = (c: number) => [...Array(n).keys()].filter((i) => c & (1 << i));
  const tables: Array<{ c: number; bits: number[]; values: Int32Array }> = [];
  const ids = new Map<string, number>();
  let entries = 0;
  const intern = (c: number, bits: number[], values: Int32Array): number => {
    const key = `${c}|${values.join(",")}`;
    let id = ids.get(key);
    if (id === undefined) {
      id = tables.length;
      entries += values.length;
      if (entries > MAX_TABLE_ENTRIES) throw new GavelError("limit-exceeded", `the sophisticated count needs more than ${MAX_TABLE_ENTRIES} table entries`, { details: { tables: tables.length } });
      tables.push({ c, bits, values });
      ids.set(key, id);
    }
    return id;
  };
  const startBits = bitsOf(full);
  const start = new Int32Array(2 ** n);
  for (let i = 0; i < start.length; i++) {
    let a = 0;
    for (let j = 0; j < n; j++) if (i & (1 << j)) a |= 1 << startBits[j];
    start[i] = qa.outcome(a);
  }
  const startId = intern(full, startBits, start);
  const stepMemo = new Map<number, number>();
  const m: OrderMachine<number> = {
    start: startId,
    step: (id, x) => {
      const memoKey = id * 32 + x;
      const hit = stepMemo.get(memoKey);
      if (hit !== undefined) return hit;
      const { c, bits, values } = tables[id];
      const c2 = c & ~(1 << x);
      const bits2 = bitsOf(c2);
      const next = new Int32Array(2 ** bits2.length);
      for (let i = 0; i < next.length; i++) {
        let a = 0;
        for (let j = 0; j < bits2.length; j++) if (i & (1 << j)) a |= 1 << bits2[j];
        const no = values[compress(a, bits)];
        if (qa.falls(x, c2, a)) next[i] = no;
        else {
          const yes = values[compress(qa.vote(x, a).yesState, bits)];
          next[i] = qa.beatsOn(x, yes, no) ? yes : no;
        }
      }
      const r = intern(c2, bits2, next);
      stepMemo.set(memoKey, r);
      return r;
    },
  };
  return byOutcome(countOrders(prec, m, "backward", control), (id) => tables[id].values[0], qa.model.versions.length);
}

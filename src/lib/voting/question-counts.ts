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

/** Total entries of all interned value tables; beyond it the count stops with limit-exceeded. */
export const MAX_TABLE_ENTRIES = 30_000_000;

export function sophisticatedQuestionCounts(qa: QuestionAgenda, prec: Precedence, control?: RunControl): Count[] {
  const n = qa.k + 1;
  const full = (2 ** n - 1) | 0;
  const bitsOf = (c: number) => [...Array(n).keys()].filter((i) => c & (1 << i));
  const tables: Array<{ c: number; bits: number[]; values: Int32Array }> = [];
  // Interned by (set, FNV-1a hash of the values); equal hashes are compared entry by entry.
  const ids = new Map<string, number[]>();
  let entries = 0;
  const intern = (c: number, bits: number[], values: Int32Array): number => {
    let h = 0x811c9dc5;
    for (let i = 0; i < values.length; i++) h = Math.imul(h ^ values[i], 0x01000193);
    const key = `${c}:${h >>> 0}`;
    const same = ids.get(key);
    if (same)
      for (const id of same) {
        const v = tables[id].values;
        let eq = true;
        for (let i = 0; i < v.length && eq; i++) eq = v[i] === values[i];
        if (eq) return id;
      }
    const id = tables.length;
    entries += values.length;
    if (entries > MAX_TABLE_ENTRIES) throw new GavelError("limit-exceeded", `the sophisticated count needs more than ${MAX_TABLE_ENTRIES} table entries`, { details: { tables: tables.length } });
    tables.push({ c, bits, values });
    if (same) same.push(id);
    else ids.set(key, [id]);
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
  let adoptedOf = new Int32Array(0);
  const m: OrderMachine<number> = {
    start: startId,
    step: (id, x) => {
      const memoKey = id * 32 + x;
      const hit = stepMemo.get(memoKey);
      if (hit !== undefined) return hit;
      const { c, bits, values } = tables[id];
      const c2 = c & ~(1 << x);
      const bits2 = bits.filter((b) => b !== x);
      // Index i of the new table (adopted sets of bits2) is index j of the old one with a 0 (no) or 1 (yes)
      // inserted at x's position; the motion branch's state is adopted | (1 << x).
      const pos = bits.indexOf(x);
      const low = (1 << pos) - 1;
      const size = 2 ** bits2.length;
      const next = new Int32Array(size);
      if (adoptedOf.length < size) adoptedOf = new Int32Array(size);
      const relevant = qa.fallsRelevant(x);
      const fallsMemo = new Map<number, boolean>();
      for (let i = 0; i < size; i++) {
        const a = i === 0 ? 0 : adoptedOf[i & (i - 1)] | (1 << bits2[31 - Math.clz32(i & -i)]);
        adoptedOf[i] = a;
        const j = ((i & ~low) << 1) | (i & low);
        const no = values[j];
        let f = fallsMemo.get(a & relevant);
        if (f === undefined) {
          f = qa.falls(x, c2, a);
          fallsMemo.set(a & relevant, f);
        }
        if (f) next[i] = no;
        else {
          const yes = values[j | (1 << pos)];
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

/**
 * Exact counts, over every legal order of the questions of an amendment tree, of the orders leading
 * to each outcome — one run each of the counting engine (count-orders.ts):
 *  - sincere, forward: state = adopted set (the sincere path depends only on it and the decided set);
 *  - sophisticated, backward (last question first; backward induction on the binary voting tree,
 *    docs/sources.md §1 "Sophisticated voting"): state = the value table of the remaining suffix, i.e.
 *    the backward-induction outcome for every adopted set that the questions before it can leave
 *    (two layers: the reachable adopted sets of each set of earlier questions are listed once, and a
 *    table holds one outcome per listed set, not one per bitmask). Tables are interned per position, so
 *    orders whose suffixes induce the same table are merged; once positions stop merging (or the tables
 *    grow large), and always for the first few questions of the order, the rest is evaluated depth
 *    first from each table instead.
 */
import { GavelError } from "../errors.ts";
import { countOrderLayer, countOrders, type OrderMachine, type RunControl } from "./count-orders.ts";
import type { Count } from "./count-json.ts";
import { availableMask, type Precedence } from "./precedence.ts";
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

/**
 * One backward-induction step: the table before question x from the table after it. x's vote compares
 * the outcomes of its two branches (`bits`: x's beats relation, see QuestionAgenda.beatsBits); where x
 * falls (`yes` −1) the rejected branch's outcome passes on. Module-level, so every count shares one
 * optimised copy.
 */
function stepTable(bits: Uint32Array, stride: number, no: Int32Array, yes: Int32Array, alwaysPut: boolean, values: Int32Array, out: Int32Array): void {
  const size = no.length;
  if (alwaysPut)
    for (let i = 0; i < size; i++) {
      const vn = values[no[i]];
      const vy = values[yes[i]];
      out[i] = vy !== vn && bits[vy * stride + (vn >>> 5)] & (1 << (vn & 31)) ? vy : vn;
    }
  else
    for (let i = 0; i < size; i++) {
      const vn = values[no[i]];
      const y = yes[i];
      if (y < 0) out[i] = vn;
      else {
        const vy = values[y];
        out[i] = vy !== vn && bits[vy * stride + (vn >>> 5)] & (1 << (vn & 31)) ? vy : vn;
      }
    }
}

interface TableStep {
  no: Int32Array;
  yes: Int32Array;
  alwaysPut: boolean;
}

/** A step of the walk: x placed before the questions `placed` (null: a dead end). */
function stepOf(w: TailWalk, c2: number, x: number): TableStep | null {
  const t = w.made === null ? undefined : w.made[x * w.pow + c2];
  return t === undefined ? w.transition(c2, x) : t;
}

interface TailWalk {
  full: number;
  prec: Precedence;
  stride: number;
  beatsBits: Uint32Array[];
  /** One table per depth. */
  buffers: Int32Array[];
  /** Cache of availableMask(prec, placed, "backward") (−1: not yet), or null. */
  availBackward: Int32Array | null;
  transition: (c2: number, x: number) => TableStep | null;
  /** The transitions already made, by x · 2^n + C2 (read here first: one call site per closure would go polymorphic across counts). */
  made: Array<TableStep | null | undefined> | null;
  pow: number;
  out: Count[];
  useBig: boolean;
}

function availableBackward(w: TailWalk, placed: number): number {
  let avail = w.availBackward ? w.availBackward[placed] : -1;
  if (avail === -1) {
    avail = availableMask(w.prec, placed, "backward");
    if (w.availBackward) w.availBackward[placed] = avail;
  }
  return avail;
}

/** Entry i of the table stepTable would write (one entry, for the last two steps of a walk). */
function entryAfter(bits: Uint32Array, stride: number, no: Int32Array, yes: Int32Array, values: Int32Array, i: number): number {
  const vn = values[no[i]];
  const y = yes[i];
  if (y < 0) return vn;
  const vy = values[y];
  return vy !== vn && bits[vy * stride + (vn >>> 5)] & (1 << (vn & 31)) ? vy : vn;
}

/**
 * Depth first from one table: every legal way to place the remaining questions (backward), adding
 * `count` to the outcome each reaches. Module-level for the same reason as stepTable.
 */
function tailWalk(w: TailWalk, placed: number, values: Int32Array, depth: number, count: Count): void {
  const { full, out } = w;
  if (placed === full) {
    const v = values[0];
    out[v] = w.useBig ? (out[v] as bigint) + (count as bigint) : (out[v] as number) + (count as number);
    return;
  }
  const buffer = w.buffers[depth + 1];
  for (let avail = availableBackward(w, placed); avail !== 0; avail &= avail - 1) {
    const x = 31 - Math.clz32(avail & -avail);
    const to = placed | (1 << x);
    const t = stepOf(w, ~to & full, x);
    if (!t) continue;
    const rest = ~to & full;
    let v = -1;
    if (to === full) {
      // The first question of the order: one entry (nothing adopted before it).
      v = entryAfter(w.beatsBits[x], w.stride, t.no, t.yes, values, 0);
    } else if ((rest & (rest - 1)) === 0) {
      // One question z left before x: its one entry, from the two entries of x's table it reads.
      const z = 31 - Math.clz32(rest);
      const tz = availableBackward(w, to) & rest ? stepOf(w, 0, z) : null;
      if (!tz) continue;
      const bx = w.beatsBits[x];
      const vn = entryAfter(bx, w.stride, t.no, t.yes, values, tz.no[0]);
      const vy = tz.yes[0] < 0 ? vn : entryAfter(bx, w.stride, t.no, t.yes, values, tz.yes[0]);
      v = vy !== vn && w.beatsBits[z][vy * w.stride + (vn >>> 5)] & (1 << (vn & 31)) ? vy : vn;
    }
    if (v >= 0) out[v] = w.useBig ? (out[v] as bigint) + (count as bigint) : (out[v] as number) + (count as number);
    else {
      stepTable(w.beatsBits[x], w.stride, t.no, t.yes, t.alwaysPut, values, buffer);
      tailWalk(w, to, buffer, depth + 1, count);
    }
  }
}

/**
 * Total entries of the value tables alive at once (two positions), and separately of the lists of
 * reachable adopted sets; beyond either the count stops with limit-exceeded.
 */
export const MAX_TABLE_ENTRIES = 30_000_000;

/**
 * The first questions of an order (the last positions placed backward) are evaluated depth first from
 * each table instead of being interned: at most this many always (their tables are tiny and many), and
 * all that remain as soon as a position merges few tables (more than SWITCH_WHEN_NEW of the tables it
 * computes are new) or the live tables pass SWITCH_AT_ENTRIES — then interning costs memory and hashing
 * and saves next to nothing — provided the depth-first work, computed exactly beforehand (table entries
 * over every remaining path), stays within DEPTH_FIRST_BUDGET: depth first never merges, so where later
 * positions would merge again (many orders, structured preferences) the tables go on.
 */
export const DEPTH_FIRST_TAIL = 5;
const SWITCH_WHEN_NEW = 0.5;
const SWITCH_AT_ENTRIES = 8_000_000;
const DEPTH_FIRST_BUDGET = 500_000_000;

/**
 * `tuning.depthFirstTail` (tests): evaluate at least this many of the first questions depth first
 * (default DEPTH_FIRST_TAIL); the counts are the same for every value.
 */
export function sophisticatedQuestionCounts(qa: QuestionAgenda, prec: Precedence, control: RunControl = {}, tuning: { depthFirstTail?: number } = {}): Count[] {
  const depthFirstTail = tuning.depthFirstTail ?? DEPTH_FIRST_TAIL;
  const n = qa.k + 1;
  if (n > 24) throw new GavelError("limit-exceeded", `the sophisticated count handles at most 24 questions; got ${n}`);
  const full = (2 ** n - 1) | 0;
  const versions = qa.model.versions.length;
  const stride = (versions + 31) >>> 5;
  const beatsBits = [...Array(n).keys()].map((x) => qa.beatsBits(x));
  const popcount = (v: number) => {
    let c = 0;
    for (; v; v &= v - 1) c++;
    return c;
  };
  // Reachable adopted sets: reach(C) lists, in increasing order, every adopted set that some legal order
  // of exactly the questions C (decided first) can leave — a question that fell, or whose target was
  // rejected, is never in it. A forward pass over the order ideals; a set C that no legal order starts
  // with has no entry, and nothing placed after it is counted (it is a dead end).
  const reach = new Map<number, Int32Array>([[0, Int32Array.of(0)]]);
  const stamp = new Int32Array(2 ** Math.min(n, 24)).fill(-1);
  const index = new Int32Array(2 ** Math.min(n, 24));
  // Whether x falls after the questions `decided`, as a function of the adopted set: it reads only the
  // bits of fallsRelevant(x). The motion branch's state is adopted | (1 << x) (question-agenda.ts).
  const fallsGiven = (x: number, decided: number) => {
    const relevant = qa.fallsRelevant(x);
    if (relevant === 0) {
      const f = qa.falls(x, decided, 0);
      return () => f;
    }
    const memo = new Map<number, boolean>();
    return (a: number) => {
      let f = memo.get(a & relevant);
      if (f === undefined) {
        f = qa.falls(x, decided, a);
        memo.set(a & relevant, f);
      }
      return f;
    };
  };
  let reachEntries = 1;
  {
    let layer = [0];
    for (let pos = 0; pos < n; pos++) {
      // Each set of the next position from every (set, question) leading to it, one set at a time.
      const into = new Map<number, number[]>();
      for (const c of layer)
        for (let avail = availableMask(prec, c); avail !== 0; avail &= avail - 1) {
          const x = 31 - Math.clz32(avail & -avail);
          const c2 = c | (1 << x);
          const ways = into.get(c2);
          if (ways) ways.push(c, x);
          else into.set(c2, [c, x]);
        }
      for (const [c2, ways] of into) {
        const to: number[] = [];
        for (let w = 0; w < ways.length; w += 2) {
          const c = ways[w];
          const x = ways[w + 1];
          const fallsNow = fallsGiven(x, c);
          for (const a of reach.get(c)!) {
            if (stamp[a] !== c2) {
              stamp[a] = c2;
              to.push(a);
            }
            if (!fallsNow(a)) {
              const y = a | (1 << x);
              if (stamp[y] !== c2) {
                stamp[y] = c2;
                to.push(y);
              }
            }
          }
        }
        reachEntries += to.length;
        if (reachEntries > MAX_TABLE_ENTRIES) throw new GavelError("limit-exceeded", `the sophisticated count needs more than ${MAX_TABLE_ENTRIES} reachable adopted sets`, { details: { sets: reach.size } });
        reach.set(c2, Int32Array.from(to).sort());
      }
      layer = [...into.keys()];
    }
  }
  // Per transition (C2 = C without x, forward-legal): for each i, the index in reach(C) of the rejected
  // branch's adopted set, and of the adopted branch's or −1 when x falls. Null: a dead end.
  // Cached per (C2, x): an array indexed by x · 2^n + C2 while that stays small, else a map.
  type Transition = TableStep | null;
  const flat = n <= 16 ? new Array<Transition | undefined>(n << n) : null;
  const transitions = new Map<number, Transition>();
  const transition = (c2: number, x: number): Transition => {
    const key = x * 2 ** n + c2;
    let t = flat ? flat[key] : transitions.get(key);
    if (t !== undefined) return t;
    const from = reach.get(c2);
    const to = reach.get(c2 | (1 << x));
    if (!from || !to || !(availableMask(prec, c2) & (1 << x))) t = null;
    else {
      to.forEach((a, i) => (index[a] = i));
      const no = new Int32Array(from.length);
      const yes = new Int32Array(from.length);
      const fallsNow = fallsGiven(x, c2);
      for (let i = 0; i < from.length; i++) {
        const a = from[i];
        no[i] = index[a];
        yes[i] = fallsNow(a) ? -1 : index[a | (1 << x)];
      }
      t = { no, yes, alwaysPut: yes.every((y) => y >= 0) };
    }
    if (flat) flat[key] = t;
    else transitions.set(key, t);
    return t;
  };
  const stepInto = (x: number, t: Transition & object, values: Int32Array, out: Int32Array) => stepTable(beatsBits[x], stride, t.no, t.yes, t.alwaysPut, values, out);
  // Tables: values[i] is the backward-induction outcome of the remaining suffix when the questions C
  // before it left the adopted set reach(C)[i]. Interned per position (equal tables merge the orders
  // that reach them); only the tables of two positions are alive at a time.
  const vals: Array<Int32Array | null> = [];
  const setOf: number[] = [];
  const DEAD = -1;
  const ids = new Map<number, number[]>();
  let live = 0;
  let layerPos = -1;
  let layerFirst = 0;
  let prevFirst = 0;
  let computed = 0;
  const stepMemo = new Map<number, number>();
  const intern = (c: number, values: Int32Array): number => {
    let h = Math.imul(0x811c9dc5 ^ c, 0x01000193);
    for (let i = 0; i < values.length; i++) h = Math.imul(h ^ values[i], 0x01000193);
    const key = h >>> 0;
    const same = ids.get(key);
    if (same)
      for (const id of same) {
        if (setOf[id] !== c) continue;
        const v = vals[id]!;
        let eq = true;
        for (let i = 0; i < v.length && eq; i++) eq = v[i] === values[i];
        if (eq) return id;
      }
    const id = vals.length;
    live += values.length;
    if (live > MAX_TABLE_ENTRIES) throw new GavelError("limit-exceeded", `the sophisticated count needs more than ${MAX_TABLE_ENTRIES} table entries`, { details: { tables: id - prevFirst } });
    vals.push(values);
    setOf.push(c);
    if (same) same.push(id);
    else ids.set(key, [id]);
    return id;
  };
  const startReach = reach.get(full);
  const startId = startReach ? intern(full, startReach.map((a) => qa.outcome(a))) : DEAD;
  const m: OrderMachine<number> = {
    start: startId,
    step: (id, x, placed) => {
      if (id === DEAD) return DEAD;
      const pos = popcount(placed);
      if (pos !== layerPos) {
        // A new position: the tables of two positions back are no longer referenced.
        for (let i = prevFirst; i < layerFirst; i++) {
          live -= vals[i]!.length;
          vals[i] = null;
        }
        ids.clear();
        stepMemo.clear();
        prevFirst = layerFirst;
        layerFirst = vals.length;
        layerPos = pos;
      }
      const memoKey = id * 32 + x;
      const hit = stepMemo.get(memoKey);
      if (hit !== undefined) return hit;
      const c2 = setOf[id] & ~(1 << x);
      const t = transition(c2, x);
      computed++;
      let r = DEAD;
      if (t) {
        const next = new Int32Array(t.no.length);
        stepInto(x, t, vals[id]!, next);
        r = intern(c2, next);
      }
      stepMemo.set(memoKey, r);
      return r;
    },
  };
  // Depth-first work from a placed set: table entries computed over every way to place the rest.
  const walkCost = new Map<number, number>();
  const costFrom = (placed: number): number => {
    if (placed === full) return 0;
    const known = walkCost.get(placed);
    if (known !== undefined) return known;
    let cost = 0;
    for (let avail = availableMask(prec, placed, "backward"); avail !== 0; avail &= avail - 1) {
      const x = 31 - Math.clz32(avail & -avail);
      const t = transition(~(placed | (1 << x)) & full, x);
      if (t) cost += t.no.length + costFrom(placed | (1 << x));
    }
    walkCost.set(placed, cost);
    return cost;
  };
  const layer = countOrderLayer(prec, m, "backward", control, (placedCount, states) => {
    const made = vals.length - layerFirst;
    const wanted = live > SWITCH_AT_ENTRIES || (made > 1000 && made > SWITCH_WHEN_NEW * computed);
    computed = 0;
    if (n - placedCount <= depthFirstTail) return true;
    if (!wanted) return false;
    let cost = 0;
    for (const [placed, dist] of states) cost += dist.size * costFrom(placed);
    return cost <= DEPTH_FIRST_BUDGET;
  });
  let placedCount = n;
  for (const placed of layer.keys()) placedCount = popcount(placed);
  const tailLength = n - placedCount;
  // The tail, depth first: every legal way to place the remaining questions, one buffer per depth.
  const useBig = n > 18;
  const out: Count[] = new Array(versions).fill(useBig ? 0n : 0);
  const buffers = [...Array(tailLength + 1).keys()].map((d) => new Int32Array(2 ** (tailLength - d)));
  const availBackward = n <= 20 ? new Int32Array(2 ** n).fill(-1) : null;
  const walk: TailWalk = { full, prec, stride, beatsBits, buffers, availBackward, transition, made: flat, pow: 2 ** n, out, useBig };
  // Progress through the tail by its work done; cancellation is polled every 64 tables.
  let work = 0;
  let done = 0;
  if (control.onProgress) for (const [placed, dist] of layer) work += dist.size * costFrom(placed);
  let polled = 0;
  for (const [placed, dist] of layer)
    for (const [id, count] of dist) {
      if (id === DEAD) continue;
      if ((polled++ & 63) === 0) {
        if (control.shouldCancel?.()) throw new GavelError("limit-exceeded", "the analysis was cancelled", { details: { cancelled: true } });
        if (work > 0) control.onProgress?.((placedCount + (tailLength * done) / work) / n);
      }
      tailWalk(walk, placed, vals[id]!, 0, count);
      if (control.onProgress) done += costFrom(placed);
    }
  control.onProgress?.(1);
  return out;
}

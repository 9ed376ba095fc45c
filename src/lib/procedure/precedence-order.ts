/**
 * The order of precedence as a clerk reads it: ranked motions highest first, motions of equal rank
 * together in one tier (a tie: e.g. US House Rule XVI cl. 4(c) gives the motion to fix the day to
 * which the House shall adjourn and the motion to authorise a recess equal privilege with the motion
 * to adjourn), and the unranked motions apart. The editor reorders tiers and writes the result back
 * as numeric ranks: equal numbers are a tie (docs/rulebook-format.md, "Order of precedence and ties").
 *
 * Ranks are read as parseRulebook reads them: a motion's own number, or, for a motion named in
 * `precedence` chains, the length of the longest chain below it. Works on a document being edited
 * (tolerates a cycle or an unknown id rather than throwing). Pure: no I/O.
 */

interface MotionLike {
  id: string;
  rank: number | null;
}

interface DocLike<M extends MotionLike = MotionLike> {
  motions: M[];
  /** Chains, highest first; a place may hold several ids of equal rank. */
  precedence?: (string | string[])[][] | undefined;
}

export interface PrecedenceView {
  /** Ranked motion ids, highest tier first; a tier of several ids is a tie. */
  tiers: string[][];
  /** Unranked motion ids, in catalogue order. */
  unranked: string[];
}

/** Each motion's rank as the engine sees it (chains resolved); null = unranked. */
export function resolvedRanks(doc: DocLike): Map<string, number | null> {
  const below = new Map<string, Set<string>>();
  const ids = (step: string | string[]) => (typeof step === "string" ? [step] : step);
  for (const chain of doc.precedence ?? []) {
    chain.forEach((step, j) => {
      for (const id of ids(step)) {
        if (!below.has(id)) below.set(id, new Set());
        if (j + 1 < chain.length) for (const next of ids(chain[j + 1])) if (next !== id) below.get(id)!.add(next);
      }
    });
  }
  const memo = new Map<string, number>();
  const visiting = new Set<string>();
  const height = (id: string): number => {
    const known = memo.get(id);
    if (known !== undefined) return known;
    if (visiting.has(id)) return 0; // a cycle: parseRulebook reports it; here it must not loop
    visiting.add(id);
    let h = 0;
    for (const n of below.get(id) ?? []) h = Math.max(h, height(n) + 1);
    visiting.delete(id);
    memo.set(id, h);
    return h;
  };
  return new Map(doc.motions.map((m) => [m.id, below.has(m.id) ? height(m.id) : m.rank]));
}

/** The view of a document: tiers by resolved rank (highest first, catalogue order within a tier) and the unranked. */
export function precedenceView(doc: DocLike): PrecedenceView {
  const ranks = resolvedRanks(doc);
  const byRank = new Map<number, string[]>();
  const unranked: string[] = [];
  for (const m of doc.motions) {
    const r = ranks.get(m.id);
    if (r === null || r === undefined) unranked.push(m.id);
    else byRank.set(r, [...(byRank.get(r) ?? []), m.id]);
  }
  const tiers = [...byRank.entries()].sort((a, b) => b[0] - a[0]).map(([, ids]) => ids);
  return { tiers, unranked };
}

const clean = (tiers: string[][]) => tiers.filter((t) => t.length > 0);
const tierOf = (v: PrecedenceView, id: string) => v.tiers.findIndex((t) => t.includes(id));

/** Move a motion one place up: out of a tie to just above it, or above the tier above. */
export function moveUp(v: PrecedenceView, id: string): PrecedenceView {
  const i = tierOf(v, id);
  if (i < 0) return v;
  const tiers = v.tiers.map((t) => t.filter((x) => x !== id));
  if (v.tiers[i].length > 1) tiers.splice(i, 0, [id]);
  else if (i > 0) tiers.splice(i - 1, 0, [id]);
  else return v;
  return { ...v, tiers: clean(tiers) };
}

/** Move a motion one place down: out of a tie to just below it, or below the tier below. */
export function moveDown(v: PrecedenceView, id: string): PrecedenceView {
  const i = tierOf(v, id);
  if (i < 0) return v;
  const tiers = v.tiers.map((t) => t.filter((x) => x !== id));
  if (v.tiers[i].length > 1) tiers.splice(i + 1, 0, [id]);
  else if (i < v.tiers.length - 1) tiers.splice(i + 2, 0, [id]);
  else return v;
  return { ...v, tiers: clean(tiers) };
}

/** Give a motion the same rank as the tier above it (a tie). */
export function tieWithAbove(v: PrecedenceView, id: string): PrecedenceView {
  const i = tierOf(v, id);
  if (i <= 0) return v;
  const tiers = v.tiers.map((t) => t.filter((x) => x !== id));
  tiers[i - 1] = [...tiers[i - 1], id];
  return { ...v, tiers: clean(tiers) };
}

/** Take a motion out of its tie, just below the others. */
export function separate(v: PrecedenceView, id: string): PrecedenceView {
  const i = tierOf(v, id);
  if (i < 0 || v.tiers[i].length < 2) return v;
  const tiers = v.tiers.map((t) => t.filter((x) => x !== id));
  tiers.splice(i + 1, 0, [id]);
  return { ...v, tiers: clean(tiers) };
}

/** Drag and drop: put a motion on its own just above the tier of `target` (or into the unranked list). */
export function moveBefore(v: PrecedenceView, id: string, target: string): PrecedenceView {
  if (id === target) return v;
  const without = { tiers: clean(v.tiers.map((t) => t.filter((x) => x !== id))), unranked: v.unranked.filter((x) => x !== id) };
  const i = tierOf(without, target);
  if (i >= 0) {
    const tiers = [...without.tiers];
    tiers.splice(i, 0, [id]);
    return { ...without, tiers };
  }
  return v;
}

/** Rank an unranked motion, lowest in the order. */
export function addToOrder(v: PrecedenceView, id: string): PrecedenceView {
  if (!v.unranked.includes(id)) return v;
  return { tiers: [...v.tiers, [id]], unranked: v.unranked.filter((x) => x !== id) };
}

/** Make a motion unranked. */
export function removeFromOrder(v: PrecedenceView, id: string): PrecedenceView {
  if (tierOf(v, id) < 0) return v;
  return { tiers: clean(v.tiers.map((t) => t.filter((x) => x !== id))), unranked: [...v.unranked, id] };
}

/**
 * Write a view back as numeric ranks: the highest tier gets the largest number, a tie one number.
 * When the number of tiers is unchanged and the document already ranked by numbers, the same
 * numbers are reused (so numbers other parts of the rulebook mention stay put); otherwise tiers are
 * numbered afresh in steps of 10. `precedence` chains are replaced by these numbers.
 */
export function applyPrecedence<M extends MotionLike, D extends DocLike<M>>(doc: D, view: PrecedenceView): D {
  const old = precedenceView(doc);
  const oldValues = [...new Set([...resolvedRanks(doc).values()].filter((r): r is number => r !== null))].sort((a, b) => b - a);
  const n = view.tiers.length;
  const reuse = !doc.precedence?.length && oldValues.length === n && old.tiers.length === n;
  const step = n > 1 ? Math.max(1, Math.min(10, Math.floor(1000 / (n - 1)))) : 10;
  const value = new Map<string, number>();
  view.tiers.forEach((tier, i) => tier.forEach((id) => value.set(id, reuse ? oldValues[i] : (n - 1 - i) * step)));
  const motions = doc.motions.map((m) => ({ ...m, rank: value.has(m.id) ? value.get(m.id)! : null }));
  const next = { ...doc, motions };
  delete next.precedence;
  return next;
}

/** True when two views give the same order (same tiers, same members). */
export function sameOrder(a: PrecedenceView, b: PrecedenceView): boolean {
  const key = (v: PrecedenceView) => JSON.stringify(v.tiers.map((t) => [...t].sort()));
  return key(a) === key(b);
}

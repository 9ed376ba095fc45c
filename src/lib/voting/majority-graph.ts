/**
 * The majority graph (weak tournament) of a profile, or one given directly.
 *
 * Margins m(x,y) = support(x over y) − support(y over x); members indifferent or abstaining drop out
 * (DOMAIN §1–2). x beats y iff the motion "x over y" meets the threshold; a tie gives no edge
 * (Robert's Rules of Order Revised, 1915, §46: a tie defeats the motion) unless the tie rule gives
 * the chair a casting vote and the chair's ballot prefers x (docs/decisions/0008).
 * Thresholds "of the members" count against `ctx.members` (the chamber's membership); without a
 * context the ballots are taken as the whole membership (the standalone `majority` command).
 */
import type { TieRule } from "../procedure/voting-section.ts";
import { decides, needsMembership, type ChairSide, type Threshold, type VoteBase } from "./vote-threshold.ts";
import { attendingWeight, memberPrefers, type Profile } from "./profile.ts";
import { GavelError } from "../errors.ts";

/** What a vote counts against and how a tie is decided. `members: null` = unknown membership. */
export interface VoteContext {
  members?: number | null;
  tieRule?: TieRule;
}

export interface MajorityGraph {
  alternatives: string[];
  /** margins[x][y] = −margins[y][x]. */
  margins: number[][];
  /** beats[x][y]: x defeats y when x is the motion. Asymmetric for every supported threshold. */
  beats: boolean[][];
  threshold: Threshold;
  /** The base the threshold counted against, and the tie rule (absent for a graph given by margins). */
  base?: VoteBase;
  tieRule?: TieRule;
}

/** The chair's side on "x over y" from the ballot kept apart (0 without one, or when indifferent). */
export function chairSide(profile: Profile | null, x: number, y: number): ChairSide {
  const c = profile?.chair;
  if (!c) return 0;
  const r = memberPrefers(c, x, y);
  return r === 1 ? 1 : r === -1 ? -1 : 0;
}

export function voteBase(profile: Profile, ctx: VoteContext = {}): VoteBase {
  const present = attendingWeight(profile);
  return { members: ctx.members === undefined ? present : ctx.members, present };
}

export function majorityGraph(profile: Profile, threshold: Threshold = "majority", ctx: VoteContext = {}): MajorityGraph {
  const n = profile.alternatives.length;
  const base = voteBase(profile, ctx);
  const tieRule = ctx.tieRule ?? "motion-fails";
  if (needsMembership(threshold) && base.members === null)
    throw new GavelError("unprocessable", `the threshold "${threshold}" counts against the membership, which the rulebook does not give (chamber.members)`, { issues: [{ path: "rulebook.chamber.members", message: "set the number of members the threshold counts against" }] });
  const chairWeight = profile.chair?.weight ?? 1;
  // One flat row-major table: support[x·n + y] = weight preferring x to y.
  const support = new Float64Array(n * n);
  for (const m of profile.members) {
    const lv = m.level;
    const w = m.weight;
    for (let x = 0; x < n; x++) {
      const a = lv[x];
      if (a < 0) continue;
      const row = x * n;
      for (let y = 0; y < n; y++) if (lv[y] > a) support[row + y] += w; // an abstention (−1) never exceeds a ≥ 0
    }
  }
  const margins: number[][] = [];
  const beats: boolean[][] = [];
  for (let x = 0; x < n; x++) {
    margins.push(Array.from({ length: n }, (_, y) => support[x * n + y] - support[y * n + x]));
    beats.push(Array.from({ length: n }, (_, y) => x !== y && decides(support[x * n + y], support[y * n + x], base, threshold, tieRule, chairSide(profile, x, y), chairWeight)));
  }
  return { alternatives: profile.alternatives, margins, beats, threshold, base, tieRule };
}

/** A majority graph given by its margins (simple majority: x beats y iff m(x,y) > 0). */
export function graphFromMargins(alternatives: string[], margins: number[][]): MajorityGraph {
  return {
    alternatives,
    margins,
    beats: margins.map((row, x) => row.map((m, y) => x !== y && m > 0)),
    threshold: "majority",
  };
}

/** Bitmask rows for n ≤ 30: out[x] = set x beats, into[x] = set beating x. */
export function beatMasks(g: MajorityGraph): { out: number[]; into: number[] } {
  const n = g.alternatives.length;
  if (n > 30) throw new RangeError("beatMasks needs at most 30 alternatives");
  const out = new Array<number>(n).fill(0);
  const into = new Array<number>(n).fill(0);
  for (let x = 0; x < n; x++)
    for (let y = 0; y < n; y++)
      if (g.beats[x][y]) {
        out[x] |= 1 << y;
        into[y] |= 1 << x;
      }
  return { out, into };
}

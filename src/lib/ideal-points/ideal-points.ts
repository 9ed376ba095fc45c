/**
 * Members' ideal points from recorded votes (issue 19, item 3): the input (zod at the door), the
 * exclusions, the fit (./em.ts), identification, uncertainty and fit statistics, and the output the
 * CLI prints and the web saves. Framework-free and deterministic: the same input and seed give the
 * same numbers.
 *
 * - Exclusions, as the methods' authors do by default (Poole and Rosenthal's NOMINATE and the
 *   emIRT/pscl examples; paraphrase): a roll call whose minority is under 2.5% of those voting yea or
 *   nay is "lopsided" and left out; then a member with fewer than 20 votes on the remaining roll calls
 *   is left out. Both thresholds are options; both counts are in the result.
 * - Identification (Clinton, Jackman and Rivers 2004, §"Identification"; paraphrase: the model is
 *   identified only up to location, scale and rotation, fixed by normalising the ideal points and by
 *   a direction): ideal points are normalised to mean 0 and variance 1 on each dimension (in two
 *   dimensions: whitened, then rotated so that the first dimension carries the larger share of the
 *   roll calls' discrimination, Σ_j β_j β_jᵀ); the first dimension is oriented so that the member the
 *   clerk names `left` lies left of (below) the member named `right`; without a direction, so that the
 *   first member listed lies at or left of the mean. The second dimension is oriented so that the
 *   `left` member (else the first member) lies at or below the mean.
 * - Uncertainty: parametric bootstrap (Imai, Lo and Olmsted 2016, §"Standard errors"; paraphrase:
 *   votes are simulated from the fitted model, the model refitted, and the spread of the refitted
 *   ideal points reported): `bootstrap` replicates with the same votes cast, each replicate aligned to
 *   the estimate (sign in one dimension, orthogonal Procrustes rotation in two); `se` is the standard
 *   deviation across replicates.
 * - Fit: a vote is classified correctly when its sign agrees with α_j + β_j·x_i; APRE (aggregate
 *   proportional reduction in error, Poole and Rosenthal) = Σ_j (minority_j − errors_j) / Σ_j minority_j.
 * - Cutting line of roll call j: the points where α_j + β_j·x = 0, reported as a unit `normal`
 *   (pointing to the yea side) and `at` (yea predicted where normal·x > at); in one dimension the cut
 *   point is `at` times the sign of the normal.
 */
import { z } from "zod";
import { GavelError, parseWith } from "../errors.ts";
import { buildMatrix, runEm, startValues, type FitState, type RollCallMatrix } from "./em.ts";
import { normalCdf, seededRandom } from "./normal.ts";

export const MAX_IDEAL_MEMBERS = 2000;
export const MAX_IDEAL_VOTES = 5000;
export const MAX_CELLS = 2_000_000;

const id = z.string().min(1, "must be a non-empty string").max(200, "at most 200 characters");

export const idealPointsInputSchema = z.object({
  dimensions: z.union([z.literal(1), z.literal(2)], { error: "must be 1 or 2" }),
  votes: z.array(z.object({ id, yea: z.array(id).max(MAX_IDEAL_MEMBERS), nay: z.array(id).max(MAX_IDEAL_MEMBERS) })).min(1).max(MAX_IDEAL_VOTES),
  members: z.array(id).min(1).max(MAX_IDEAL_MEMBERS).optional(),
  direction: z.object({ left: id, right: id }).optional(),
  /** Left out: roll calls whose minority is below this share of those voting (default 0.025). */
  lopsided: z.number().min(0).max(0.5).default(0.025),
  /** Left out: members with fewer votes than this on the roll calls used (default 20). */
  minVotes: z.number().int().min(1).max(100_000).default(20),
  /** Parametric bootstrap replicates for the standard errors (0: none). */
  bootstrap: z.number().int().min(0).max(200).default(20),
  seed: z.number().int().min(0).max(2 ** 31 - 1).default(1),
  maxIterations: z.number().int().min(1).max(10_000).default(1000),
  tolerance: z.number().positive().max(0.01).default(1e-6),
});
export type IdealPointsInput = z.input<typeof idealPointsInputSchema>;
export type IdealPointsParsed = z.output<typeof idealPointsInputSchema>;

export interface IdealPointsOptions {
  /** Polled each iteration; returning true stops with a limit-exceeded error marked cancelled. */
  shouldCancel?: () => boolean;
  onProgress?: (phase: "estimating" | "bootstrap", fraction: number) => void;
}

export interface MemberResult {
  id: string;
  ideal: number[];
  se?: number[];
  /** Votes cast on the roll calls used. */
  votes: number;
  /** Of those, classified correctly by the fitted model. */
  correct: number;
}
export interface VoteResult {
  id: string;
  used: boolean;
  reason?: "lopsided" | "no-votes";
  yea: number;
  nay: number;
  /** Roll calls used: the fitted parameters in the normalised space and the cutting line. */
  difficulty?: number;
  discrimination?: number[];
  cut?: { normal: number[]; at: number };
  errors?: number;
}
export interface IdealPointsResult {
  dimensions: 1 | 2;
  members: MemberResult[];
  votes: VoteResult[];
  fit: { classification: number; apre: number; votesClassified: number; iterations: number; converged: boolean };
  excluded: { lopsidedVotes: number; members: Array<{ id: string; votes: number }> };
  direction: { left: string; right: string } | null;
  settings: { lopsided: number; minVotes: number; bootstrap: number; seed: number };
}

function bad(path: string, message: string): never {
  throw new GavelError("invalid-input", `${path}: ${message}`, { issues: [{ path, message }] });
}

interface Prepared {
  memberIds: string[];
  usedMembers: number[];
  usedVotes: number[];
  matrix: RollCallMatrix;
  voteInfo: VoteResult[];
  excludedMembers: Array<{ id: string; votes: number }>;
  lopsidedVotes: number;
}

function prepare(p: IdealPointsParsed): Prepared {
  const index = new Map<string, number>();
  const memberIds: string[] = [];
  if (p.members) {
    p.members.forEach((m, i) => {
      if (index.has(m)) bad(`members.${i}`, `"${m}" is listed twice`);
      index.set(m, memberIds.length);
      memberIds.push(m);
    });
  }
  const voteIds = new Set<string>();
  const cast: Array<Array<{ member: number; yea: boolean }>> = [];
  p.votes.forEach((v, j) => {
    if (voteIds.has(v.id)) bad(`votes.${j}.id`, `roll call "${v.id}" appears twice`);
    voteIds.add(v.id);
    const seen = new Set<string>();
    const cells: Array<{ member: number; yea: boolean }> = [];
    for (const side of ["yea", "nay"] as const) {
      v[side].forEach((m, k) => {
        if (seen.has(m)) bad(`votes.${j}.${side}.${k}`, `"${m}" is recorded twice on roll call "${v.id}"`);
        seen.add(m);
        let i = index.get(m);
        if (i === undefined) {
          if (p.members) bad(`votes.${j}.${side}.${k}`, `"${m}" is not in members`);
          i = memberIds.length;
          index.set(m, i);
          memberIds.push(m);
        }
        cells.push({ member: i, yea: side === "yea" });
      });
    }
    cast.push(cells);
  });
  if (memberIds.length > MAX_IDEAL_MEMBERS) bad("votes", `at most ${MAX_IDEAL_MEMBERS} members`);
  const totalCells = cast.reduce((a, c) => a + c.length, 0);
  if (totalCells > MAX_CELLS) throw new GavelError("too-large", `at most ${MAX_CELLS} votes cast in all; the input has ${totalCells}`, { issues: [{ path: "votes", message: "too many votes cast" }] });
  if (p.direction) {
    if (!index.has(p.direction.left)) bad("direction.left", `"${p.direction.left}" is not a member`);
    if (!index.has(p.direction.right)) bad("direction.right", `"${p.direction.right}" is not a member`);
    if (p.direction.left === p.direction.right) bad("direction.right", "name two different members");
  }
  const voteInfo: VoteResult[] = p.votes.map((v, j) => {
    const yea = cast[j].filter((c) => c.yea).length;
    const nay = cast[j].length - yea;
    const total = yea + nay;
    const lop = total === 0 || Math.min(yea, nay) / total < p.lopsided || Math.min(yea, nay) === 0;
    return { id: v.id, used: !lop, ...(lop ? { reason: total === 0 ? ("no-votes" as const) : ("lopsided" as const) } : {}), yea, nay };
  });
  const lopsidedVotes = voteInfo.filter((v) => !v.used).length;
  const count = new Int32Array(memberIds.length);
  cast.forEach((cells, j) => {
    if (voteInfo[j].used) for (const c of cells) count[c.member]++;
  });
  const usedMembers = memberIds.map((_, i) => i).filter((i) => count[i] >= p.minVotes);
  const excludedMembers = memberIds.map((m, i) => ({ id: m, votes: count[i] })).filter((m) => m.votes < p.minVotes);
  const usedVotes = voteInfo.map((_, j) => j).filter((j) => voteInfo[j].used);
  if (usedMembers.length < 3) throw new GavelError("unprocessable", `too few members to estimate: ${usedMembers.length} have at least ${p.minVotes} votes on the roll calls used (3 needed)`, { issues: [{ path: "votes", message: "too few members with enough votes" }] });
  if (usedVotes.length < p.dimensions) throw new GavelError("unprocessable", `too few roll calls to estimate: ${usedVotes.length} are not lopsided`, { issues: [{ path: "votes", message: "too few roll calls that divide the members" }] });
  const memberPos = new Int32Array(memberIds.length).fill(-1);
  usedMembers.forEach((i, k) => (memberPos[i] = k));
  const cells: Array<{ member: number; vote: number; yea: boolean }> = [];
  usedVotes.forEach((j, col) => {
    for (const c of cast[j]) if (memberPos[c.member] >= 0) cells.push({ member: memberPos[c.member], vote: col, yea: c.yea });
  });
  return { memberIds, usedMembers, usedVotes, matrix: buildMatrix(usedMembers.length, usedVotes.length, cells), voteInfo, excludedMembers, lopsidedVotes };
}

/** Normalise to mean 0, variance 1 (whitened, rotated in 2-D), keeping every α_j + β_j·x_i unchanged. */
function normalise(s: FitState): void {
  const { d, x, alpha, beta } = s;
  const n = x.length / d;
  const mean = new Float64Array(d);
  for (let i = 0; i < n; i++) for (let k = 0; k < d; k++) mean[k] += x[i * d + k] / n;
  for (let j = 0; j < alpha.length; j++) for (let k = 0; k < d; k++) alpha[j] += beta[j * d + k] * mean[k];
  for (let i = 0; i < n; i++) for (let k = 0; k < d; k++) x[i * d + k] -= mean[k];
  if (d === 1) {
    let v = 0;
    for (let i = 0; i < n; i++) v += x[i] * x[i];
    const sd = Math.sqrt(v / n) || 1;
    for (let i = 0; i < n; i++) x[i] /= sd;
    for (let j = 0; j < alpha.length; j++) beta[j] *= sd;
    return;
  }
  // Whiten: C = L Lᵀ; x' = L⁻¹ x, β' = Lᵀ β.
  let c00 = 0, c01 = 0, c11 = 0;
  for (let i = 0; i < n; i++) {
    c00 += x[2 * i] ** 2 / n;
    c01 += (x[2 * i] * x[2 * i + 1]) / n;
    c11 += x[2 * i + 1] ** 2 / n;
  }
  const l00 = Math.sqrt(c00) || 1;
  const l10 = c01 / l00;
  const l11 = Math.sqrt(Math.max(c11 - l10 * l10, 1e-12));
  for (let i = 0; i < n; i++) {
    const a = x[2 * i] / l00;
    x[2 * i + 1] = (x[2 * i + 1] - l10 * a) / l11;
    x[2 * i] = a;
  }
  for (let j = 0; j < alpha.length; j++) {
    const b0 = beta[2 * j], b1 = beta[2 * j + 1];
    beta[2 * j] = l00 * b0 + l10 * b1;
    beta[2 * j + 1] = l11 * b1;
  }
  // Rotate to the principal axes of Σ β βᵀ, larger first.
  let s00 = 0, s01 = 0, s11 = 0;
  for (let j = 0; j < alpha.length; j++) {
    s00 += beta[2 * j] ** 2;
    s01 += beta[2 * j] * beta[2 * j + 1];
    s11 += beta[2 * j + 1] ** 2;
  }
  const theta = 0.5 * Math.atan2(2 * s01, s00 - s11); // angle of the leading eigenvector
  rotate(s, Math.cos(theta), Math.sin(theta));
}

/** Apply the rotation with rows (c, s) and (−s, c) to ideal points and discriminations. */
function rotate(st: FitState, c: number, s: number): void {
  const { x, beta } = st;
  for (let i = 0; i < x.length; i += 2) {
    const a = x[i], b = x[i + 1];
    x[i] = c * a + s * b;
    x[i + 1] = -s * a + c * b;
  }
  for (let j = 0; j < beta.length; j += 2) {
    const a = beta[j], b = beta[j + 1];
    beta[j] = c * a + s * b;
    beta[j + 1] = -s * a + c * b;
  }
}

function flip(s: FitState, k: number): void {
  const d = s.d;
  for (let i = k; i < s.x.length; i += d) s.x[i] = -s.x[i];
  for (let j = k; j < s.beta.length; j += d) s.beta[j] = -s.beta[j];
}

function orient(s: FitState, left: number, right: number | null): void {
  const d = s.d;
  if (right !== null ? s.x[left * d] > s.x[right * d] : s.x[left * d] > 0) flip(s, 0);
  if (d === 2 && s.x[left * d + 1] > 0) flip(s, 1);
}

/** Align a bootstrap replicate to the estimate: sign (1-D) or orthogonal Procrustes rotation (2-D). */
function align(rep: FitState, ref: Float64Array): void {
  const d = rep.d;
  const n = ref.length / d;
  if (d === 1) {
    let dot = 0;
    for (let i = 0; i < n; i++) dot += rep.x[i] * ref[i];
    if (dot < 0) flip(rep, 0);
    return;
  }
  // M = Xrepᵀ Xref (2×2); the best rotation R (x ↦ R x) maximises tr(R M); with reflections allowed.
  let m00 = 0, m01 = 0, m10 = 0, m11 = 0;
  for (let i = 0; i < n; i++) {
    m00 += rep.x[2 * i] * ref[2 * i];
    m01 += rep.x[2 * i] * ref[2 * i + 1];
    m10 += rep.x[2 * i + 1] * ref[2 * i];
    m11 += rep.x[2 * i + 1] * ref[2 * i + 1];
  }
  // Proper rotation by angle t maximises (m00 + m11) cos t + (m01 − m10) sin t; a reflection of dim 2 first gives the other case.
  const proper = Math.hypot(m00 + m11, m01 - m10);
  const reflected = Math.hypot(m00 - m11, -m01 - m10);
  if (reflected > proper) {
    flip(rep, 1);
    m10 = -m10;
    m11 = -m11;
  }
  const t = Math.atan2(m01 - m10, m00 + m11);
  // x' = (cos t·a − sin t·b, sin t·a + cos t·b) is rotate(c, −s).
  rotate(rep, Math.cos(t), -Math.sin(t));
}

function fitStats(m: RollCallMatrix, s: FitState) {
  const d = s.d;
  const memberCorrect = new Int32Array(m.members);
  const voteErrors = new Int32Array(m.votes);
  let correct = 0, minority = 0;
  for (let j = 0; j < m.votes; j++) {
    let yea = 0;
    for (let c = m.voteStart[j]; c < m.voteStart[j + 1]; c++) {
      const i = m.cellMember[c];
      let u = s.alpha[j];
      for (let k = 0; k < d; k++) u += s.beta[j * d + k] * s.x[i * d + k];
      const ok = (u > 0) === (m.cellYea[c] === 1);
      if (ok) {
        correct++;
        memberCorrect[i]++;
      } else voteErrors[j]++;
      yea += m.cellYea[c];
    }
    minority += Math.min(yea, m.voteStart[j + 1] - m.voteStart[j] - yea);
  }
  const total = m.cellMember.length;
  const errors = total - correct;
  return { classification: correct / total, apre: minority === 0 ? 0 : (minority - errors) / minority, votesClassified: total, memberCorrect, voteErrors };
}

const round = (v: number) => Math.round(v * 1e6) / 1e6;

export function estimateIdealPoints(raw: unknown, opts: IdealPointsOptions = {}): IdealPointsResult {
  const p = parseWith(idealPointsInputSchema, raw, "ideal-points input");
  const prep = prepare(p);
  const { matrix } = prep;
  const d = p.dimensions;
  const checkCancel = () => {
    if (opts.shouldCancel?.()) throw new GavelError("limit-exceeded", "the estimate was cancelled", { details: { cancelled: true } });
  };
  const pos = new Map(prep.usedMembers.map((i, k) => [prep.memberIds[i], k]));
  const leftId = p.direction?.left ?? prep.memberIds[prep.usedMembers[0]];
  const left = pos.get(leftId);
  const right = p.direction ? pos.get(p.direction.right) : null;
  if (p.direction && left === undefined) bad("direction.left", `"${p.direction.left}" has fewer than ${p.minVotes} votes on the roll calls used, so has no estimate`);
  if (p.direction && right === undefined) bad("direction.right", `"${p.direction.right}" has fewer than ${p.minVotes} votes on the roll calls used, so has no estimate`);
  const share = 1 / (1 + p.bootstrap * 0.35);
  const fit = runEm(matrix, startValues(matrix, d), {
    maxIterations: p.maxIterations,
    tolerance: p.tolerance,
    onIteration: (it) => {
      checkCancel();
      opts.onProgress?.("estimating", Math.min(0.99, it / 200) * share);
    },
  });
  normalise(fit);
  orient(fit, left!, right ?? null);
  const stats = fitStats(matrix, fit);

  let se: Float64Array | null = null;
  if (p.bootstrap > 0) {
    const rnd = seededRandom(p.seed);
    const sum = new Float64Array(fit.x.length);
    const sumSq = new Float64Array(fit.x.length);
    const yeaSim = new Uint8Array(matrix.cellYea.length);
    for (let b = 0; b < p.bootstrap; b++) {
      for (let j = 0; j < matrix.votes; j++) {
        for (let c = matrix.voteStart[j]; c < matrix.voteStart[j + 1]; c++) {
          const i = matrix.cellMember[c];
          let u = fit.alpha[j];
          for (let k = 0; k < d; k++) u += fit.beta[j * d + k] * fit.x[i * d + k];
          yeaSim[c] = rnd() < normalCdf(u) ? 1 : 0;
        }
      }
      const rep = runEm({ ...matrix, cellYea: yeaSim }, fit, {
        // Replicates start at the estimate, where the plain iteration settles in fewer steps than SQUAREM.
        accelerate: false,
        maxIterations: p.maxIterations,
        tolerance: p.tolerance,
        onIteration: () => checkCancel(),
      });
      normalise(rep);
      align(rep, fit.x);
      for (let q = 0; q < rep.x.length; q++) {
        sum[q] += rep.x[q];
        sumSq[q] += rep.x[q] ** 2;
      }
      opts.onProgress?.("bootstrap", share + ((1 - share) * (b + 1)) / p.bootstrap);
    }
    const B = p.bootstrap;
    se = Float64Array.from(sum, (s, q) => (B > 1 ? Math.sqrt(Math.max(0, (sumSq[q] - (s * s) / B) / (B - 1))) : 0));
  }

  const members: MemberResult[] = prep.usedMembers.map((i, k) => ({
    id: prep.memberIds[i],
    ideal: Array.from({ length: d }, (_, q) => round(fit.x[k * d + q])),
    ...(se ? { se: Array.from({ length: d }, (_, q) => round(se[k * d + q])) } : {}),
    votes: matrix.memberStart[k + 1] - matrix.memberStart[k],
    correct: stats.memberCorrect[k],
  }));
  const votes = prep.voteInfo.map((v) => ({ ...v }));
  prep.usedVotes.forEach((j, col) => {
    const b = Array.from({ length: d }, (_, q) => fit.beta[col * d + q]);
    const norm = Math.hypot(...b) || 1;
    votes[j].difficulty = round(fit.alpha[col]);
    votes[j].discrimination = b.map(round);
    votes[j].cut = { normal: b.map((v) => round(v / norm)), at: round(-fit.alpha[col] / norm) };
    votes[j].errors = stats.voteErrors[col];
  });
  return {
    dimensions: d,
    members,
    votes,
    fit: { classification: round(stats.classification), apre: round(stats.apre), votesClassified: stats.votesClassified, iterations: fit.iterations, converged: fit.converged },
    excluded: { lopsidedVotes: prep.lopsidedVotes, members: prep.excludedMembers },
    direction: p.direction ?? null,
    settings: { lopsided: p.lopsided, minVotes: p.minVotes, bootstrap: p.bootstrap, seed: p.seed },
  };
}

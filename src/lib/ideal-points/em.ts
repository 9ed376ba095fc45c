/**
 * The EM algorithm of Imai, Lo and Olmsted (2016, "Fast estimation of ideal points with massive
 * data", APSR 110(4):631–656, §"The standard ideal point model", Proposition 1 and its closed-form
 * E- and M-steps) for the quadratic-utility item-response model of Clinton, Jackman and Rivers
 * (2004, "The statistical analysis of roll call data", APSR 98(2):355–370, eq. 1–3):
 *
 *   y*_ij = α_j + β_j·x_i + ε_ij,  ε_ij ~ N(0, 1),  member i votes yea on j iff y*_ij > 0,
 *   priors x_i ~ N(0, I_d) and (α_j, β_j) ~ N(0, 25·I_{d+1}) (the defaults of both papers' software).
 *
 * Written from the published equations as remembered ("from memory"), not from the authors' code:
 *   E-step   y*_ij ← m + φ(m)/Φ(m) for a yea, m − φ(m)/(1 − Φ(m)) for a nay, m = α_j + β_j·x_i;
 *   M-step   (α_j, β_j) ← (Σ_β⁻¹ + Σ_i x̃_i x̃_iᵀ)⁻¹ Σ_i x̃_i y*_ij  with x̃_i = (1, x_i),
 *            x_i ← (I + Σ_j β_j β_jᵀ)⁻¹ Σ_j β_j (y*_ij − α_j),
 * sums over the votes actually cast (a member absent from a roll call contributes nothing to it),
 * the two conditional maximisations done one after the other (an ECM step). The fixed point is the
 * posterior mode. The iteration is accelerated by SQUAREM (see runEm). Stops when 1 − r between successive iterates (r = Pearson correlation, per
 * dimension, of the ideal points and of the discrimination parameters) is below `tolerance`, as the
 * authors' software does, or after `maxIterations`. Pure and deterministic.
 */
import { millsRatio } from "./normal.ts";

/** Votes cast, stored twice: by roll call (cells in roll-call order) and by member (pointing at those cells). */
export interface RollCallMatrix {
  members: number;
  votes: number;
  voteStart: Int32Array;
  cellMember: Int32Array;
  cellYea: Uint8Array;
  memberStart: Int32Array;
  memberCell: Int32Array;
  memberCellVote: Int32Array;
}

export interface FitState {
  d: number;
  /** Ideal points, member-major: x[i*d + k]. */
  x: Float64Array;
  alpha: Float64Array;
  /** Discrimination, vote-major: beta[j*d + k]. */
  beta: Float64Array;
  iterations: number;
  converged: boolean;
}

export interface EmOptions {
  maxIterations?: number;
  tolerance?: number;
  /** SQUAREM acceleration (default true); false runs the plain EM iteration. */
  accelerate?: boolean;
  /** Called after each iteration; may throw to stop (cancellation). */
  onIteration?: (iteration: number) => void;
}

const ITEM_PRIOR_PRECISION = 1 / 25;

export function buildMatrix(members: number, votes: number, cells: ReadonlyArray<{ member: number; vote: number; yea: boolean }>): RollCallMatrix {
  const voteStart = new Int32Array(votes + 1);
  for (const c of cells) voteStart[c.vote + 1]++;
  for (let j = 0; j < votes; j++) voteStart[j + 1] += voteStart[j];
  const cellMember = new Int32Array(cells.length);
  const cellYea = new Uint8Array(cells.length);
  const next = voteStart.slice(0, votes);
  for (const c of cells) {
    const at = next[c.vote]++;
    cellMember[at] = c.member;
    cellYea[at] = c.yea ? 1 : 0;
  }
  const memberStart = new Int32Array(members + 1);
  for (let c = 0; c < cellMember.length; c++) memberStart[cellMember[c] + 1]++;
  for (let i = 0; i < members; i++) memberStart[i + 1] += memberStart[i];
  const fill = memberStart.slice(0, members);
  const memberCell = new Int32Array(cells.length);
  const memberCellVote = new Int32Array(cells.length);
  for (let j = 0; j < votes; j++) {
    for (let c = voteStart[j]; c < voteStart[j + 1]; c++) {
      const i = cellMember[c];
      memberCell[fill[i]] = c;
      memberCellVote[fill[i]++] = j;
    }
  }
  return { members, votes, voteStart, cellMember, cellYea, memberStart, memberCell, memberCellVote };
}

/** Solve A z = r for a small symmetric positive-definite A (row-major, size n ≤ 3) by Cholesky; A and r are overwritten. */
function solveSpd(a: Float64Array, r: Float64Array, n: number, out: Float64Array, outAt: number): void {
  for (let k = 0; k < n; k++) {
    let s = a[k * n + k];
    for (let m = 0; m < k; m++) s -= a[k * n + m] * a[k * n + m];
    const l = Math.sqrt(Math.max(s, 1e-300));
    a[k * n + k] = l;
    for (let i = k + 1; i < n; i++) {
      let t = a[i * n + k];
      for (let m = 0; m < k; m++) t -= a[i * n + m] * a[k * n + m];
      a[i * n + k] = t / l;
    }
  }
  for (let i = 0; i < n; i++) {
    let t = r[i];
    for (let m = 0; m < i; m++) t -= a[i * n + m] * r[m];
    r[i] = t / a[i * n + i];
  }
  for (let i = n - 1; i >= 0; i--) {
    let t = r[i];
    for (let m = i + 1; m < n; m++) t -= a[m * n + i] * r[m];
    r[i] = t / a[i * n + i];
  }
  for (let i = 0; i < n; i++) out[outAt + i] = r[i];
}

function correlation(p: Float64Array, q: Float64Array, d: number, k: number): number {
  const n = p.length / d;
  let sp = 0, sq = 0;
  for (let i = 0; i < n; i++) {
    sp += p[i * d + k];
    sq += q[i * d + k];
  }
  sp /= n;
  sq /= n;
  let cpq = 0, cpp = 0, cqq = 0;
  for (let i = 0; i < n; i++) {
    const u = p[i * d + k] - sp, v = q[i * d + k] - sq;
    cpq += u * v;
    cpp += u * u;
    cqq += v * v;
  }
  return cpp === 0 || cqq === 0 ? (cpp === cqq ? 1 : 0) : cpq / Math.sqrt(cpp * cqq);
}

/** E-step: the expected latent utilities of every vote cast. */
function expectedUtilities(m: RollCallMatrix, s: FitState, ystar: Float64Array): void {
  const { d, x, alpha, beta } = s;
  for (let j = 0; j < m.votes; j++) {
    const a = alpha[j];
    for (let c = m.voteStart[j]; c < m.voteStart[j + 1]; c++) {
      const i = m.cellMember[c];
      let u = a;
      for (let k = 0; k < d; k++) u += beta[j * d + k] * x[i * d + k];
      ystar[c] = m.cellYea[c] ? u + millsRatio(u) : u - millsRatio(-u);
    }
  }
}

export function runEm(m: RollCallMatrix, start: FitState, opts: EmOptions = {}): FitState {
  const d = start.d;
  const maxIterations = opts.maxIterations ?? 1000;
  const tolerance = opts.tolerance ?? 1e-6;
  const s: FitState = { d, x: Float64Array.from(start.x), alpha: Float64Array.from(start.alpha), beta: Float64Array.from(start.beta), iterations: 0, converged: false };
  const ystar = new Float64Array(m.cellMember.length);
  const e = d + 1;
  const A = new Float64Array(e * e);
  const r = new Float64Array(e);
  const item = new Float64Array(e);
  const step = () => (d === 1 ? oneDimensionalStep(m, s, ystar) : twoStep(m, s, ystar, A, r, item, e));
  const settled = (prevX: Float64Array, prevB: Float64Array) => {
    let worst = 0;
    for (let k = 0; k < d; k++) worst = Math.max(worst, 1 - correlation(prevX, s.x, d, k), 1 - correlation(prevB, s.beta, d, k));
    return worst < tolerance;
  };
  if (opts.accelerate === false) {
    for (let it = 1; it <= maxIterations; it++) {
      const prevX = Float64Array.from(s.x);
      const prevB = Float64Array.from(s.beta);
      step();
      s.iterations = it;
      opts.onIteration?.(it);
      if (settled(prevX, prevB)) {
        s.converged = true;
        break;
      }
    }
    return s;
  }
  // SQUAREM (Varadhan and Roland 2008, Scand. J. Statist. 35:335–353, scheme S3; from memory): two EM
  // steps θ1 = F(θ0), θ2 = F(θ1); r = θ1 − θ0, v = θ2 − θ1 − r; step a = −‖r‖/‖v‖ (at most −1, at least
  // −stepMax); θ' = θ0 − 2a·r + a²·v; then one more EM step from θ' to stabilise. The fixed point is the
  // EM's; a non-finite extrapolation falls back to θ2.
  const parts = (st: FitState) => [st.x, st.alpha, st.beta];
  const copy = () => parts(s).map((p) => Float64Array.from(p));
  let stepMax = 1;
  let it = 0;
  while (it < maxIterations) {
    const t0 = copy();
    step();
    const t1 = copy();
    step();
    const t2 = copy();
    it += 2;
    let rr = 0, vv = 0;
    for (let q = 0; q < 3; q++) {
      const a0 = t0[q], a1 = t1[q], a2 = t2[q];
      for (let k = 0; k < a0.length; k++) {
        const rk = a1[k] - a0[k];
        const vk = a2[k] - 2 * a1[k] + a0[k];
        rr += rk * rk;
        vv += vk * vk;
      }
    }
    let a = vv > 0 ? -Math.sqrt(rr / vv) : -1;
    if (!Number.isFinite(a)) a = -1;
    a = Math.max(-stepMax, Math.min(-1, a));
    if (a < -1) {
      const target = parts(s);
      for (let q = 0; q < 3; q++) {
        const a0 = t0[q], a1 = t1[q], a2 = t2[q], out = target[q];
        for (let k = 0; k < a0.length; k++) {
          const rk = a1[k] - a0[k];
          const vk = a2[k] - 2 * a1[k] + a0[k];
          out[k] = a0[k] - 2 * a * rk + a * a * vk;
        }
      }
    }
    if (a === -stepMax) stepMax *= 4;
    if (it < maxIterations) {
      step();
      it++;
    }
    if (!parts(s).every((p) => p.every(Number.isFinite))) {
      parts(s).forEach((p, q) => p.set(t2[q]));
      stepMax = 1;
    }
    s.iterations = it;
    opts.onIteration?.(it);
    if (settled(t0[0], t0[2])) {
      s.converged = true;
      break;
    }
  }
  return s;
}

/**
 * One iteration in one dimension, the E-step fused with the roll-call M-step (both walk a roll
 * call's votes): the 2×2 system of the roll call is solved in closed form.
 */
function oneDimensionalStep(m: RollCallMatrix, s: FitState, ystar: Float64Array): void {
  const { x, alpha, beta } = s;
  const { voteStart, cellMember, cellYea } = m;
  for (let j = 0; j < m.votes; j++) {
    const a = alpha[j], b = beta[j];
    let n = ITEM_PRIOR_PRECISION, sx = 0, sxx = ITEM_PRIOR_PRECISION, sy = 0, sxy = 0;
    for (let c = voteStart[j], hi = voteStart[j + 1]; c < hi; c++) {
      const xi = x[cellMember[c]];
      const u = a + b * xi;
      const y = cellYea[c] ? u + millsRatio(u) : u - millsRatio(-u);
      ystar[c] = y;
      n += 1;
      sx += xi;
      sxx += xi * xi;
      sy += y;
      sxy += xi * y;
    }
    const det = n * sxx - sx * sx;
    alpha[j] = (sxx * sy - sx * sxy) / det;
    beta[j] = (n * sxy - sx * sy) / det;
  }
  const { memberStart, memberCell, memberCellVote } = m;
  for (let i = 0; i < m.members; i++) {
    let A = 1, r = 0;
    for (let p = memberStart[i], hi = memberStart[i + 1]; p < hi; p++) {
      const j = memberCellVote[p];
      const b = beta[j];
      A += b * b;
      r += b * (ystar[memberCell[p]] - alpha[j]);
    }
    x[i] = r / A;
  }
}

function twoStep(m: RollCallMatrix, s: FitState, ystar: Float64Array, A: Float64Array, r: Float64Array, item: Float64Array, e: number): void {
  const d = s.d;
  {
    expectedUtilities(m, s, ystar);
    // M-step for each roll call's (α_j, β_j), given the ideal points.
    for (let j = 0; j < m.votes; j++) {
      A.fill(0);
      r.fill(0);
      for (let k = 0; k < e; k++) A[k * e + k] = ITEM_PRIOR_PRECISION;
      for (let c = m.voteStart[j]; c < m.voteStart[j + 1]; c++) {
        const i = m.cellMember[c];
        const y = ystar[c];
        A[0] += 1;
        r[0] += y;
        for (let k = 0; k < d; k++) {
          const xk = s.x[i * d + k];
          A[k + 1] += xk; // row 0
          r[k + 1] += xk * y;
          for (let l = 0; l <= k; l++) A[(k + 1) * e + (l + 1)] += xk * s.x[i * d + l];
        }
      }
      for (let k = 1; k < e; k++) {
        A[k * e] = A[k];
        for (let l = 0; l < k; l++) A[l * e + k] = A[k * e + l];
      }
      solveSpd(A, r, e, item, 0);
      s.alpha[j] = item[0];
      for (let k = 0; k < d; k++) s.beta[j * d + k] = item[k + 1];
    }
    // M-step for each member's ideal point, given the roll-call parameters.
    for (let i = 0; i < m.members; i++) {
      A.fill(0, 0, d * d);
      r.fill(0, 0, d);
      for (let k = 0; k < d; k++) A[k * d + k] = 1;
      for (let p = m.memberStart[i]; p < m.memberStart[i + 1]; p++) {
        const c = m.memberCell[p];
        const j = m.memberCellVote[p];
        const y = ystar[c] - s.alpha[j];
        for (let k = 0; k < d; k++) {
          const bk = s.beta[j * d + k];
          r[k] += bk * y;
          for (let l = 0; l < d; l++) A[k * d + l] += bk * s.beta[j * d + l];
        }
      }
      solveSpd(A, r, d, s.x, i * d);
    }
  }
}

/**
 * Start values: the leading principal components of the member × roll-call matrix (yea +1, nay −1,
 * each roll call centred over those voting, absences 0), by power iteration from a fixed vector —
 * the "eigen" start of both papers' software in spirit. Roll-call parameters start at 0.
 */
export function startValues(m: RollCallMatrix, d: number): FitState {
  const n = m.members;
  const centred = new Float64Array(m.cellMember.length);
  for (let j = 0; j < m.votes; j++) {
    const lo = m.voteStart[j], hi = m.voteStart[j + 1];
    let mean = 0;
    for (let c = lo; c < hi; c++) mean += m.cellYea[c] ? 1 : -1;
    mean /= Math.max(1, hi - lo);
    for (let c = lo; c < hi; c++) centred[c] = (m.cellYea[c] ? 1 : -1) - mean;
  }
  const comps: Float64Array[] = [];
  const tmp = new Float64Array(m.votes);
  for (let k = 0; k < d; k++) {
    let v = Float64Array.from({ length: n }, (_, i) => 1 + ((i * 7919 + k * 104729) % 97) / 97);
    for (let it = 0; it < 40; it++) {
      // w = Z Zᵀ v, deflated against earlier components.
      tmp.fill(0);
      for (let j = 0; j < m.votes; j++) for (let c = m.voteStart[j]; c < m.voteStart[j + 1]; c++) tmp[j] += centred[c] * v[m.cellMember[c]];
      const w = new Float64Array(n);
      for (let j = 0; j < m.votes; j++) for (let c = m.voteStart[j]; c < m.voteStart[j + 1]; c++) w[m.cellMember[c]] += centred[c] * tmp[j];
      for (const u of comps) {
        let dot = 0;
        for (let i = 0; i < n; i++) dot += w[i] * u[i];
        for (let i = 0; i < n; i++) w[i] -= dot * u[i];
      }
      let norm = 0;
      for (let i = 0; i < n; i++) norm += w[i] * w[i];
      norm = Math.sqrt(norm);
      if (norm === 0) break;
      let change = 0;
      for (let i = 0; i < n; i++) {
        w[i] /= norm;
        change = Math.max(change, Math.abs(w[i] - v[i]));
      }
      v = w;
      if (change < 1e-6) break;
    }
    comps.push(v);
  }
  const x = new Float64Array(n * d);
  for (let k = 0; k < d; k++) {
    const v = comps[k];
    let mean = 0;
    for (let i = 0; i < n; i++) mean += v[i];
    mean /= n;
    let sd = 0;
    for (let i = 0; i < n; i++) sd += (v[i] - mean) ** 2;
    sd = Math.sqrt(sd / n) || 1;
    for (let i = 0; i < n; i++) x[i * d + k] = (v[i] - mean) / sd;
  }
  return { d, x, alpha: new Float64Array(m.votes), beta: new Float64Array(m.votes * d), iterations: 0, converged: false };
}

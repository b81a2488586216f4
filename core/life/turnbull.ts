/**
 * The nonparametric maximum-likelihood estimate of the life distribution for arbitrarily censored
 * data (Turnbull 1976, JRSS B 38:290-295): all probability mass sits on the "innermost intervals"
 * [q_j, p_j] — a left end immediately followed by a right end when every row's end points are
 * sorted — and the masses are found by the self-consistency (EM) iteration
 *   s_j ← s_j · (1/N) Σ_i c_i α_ij / Σ_k α_ik s_k,   α_ij = 1 when innermost interval j lies in row i.
 * Within an innermost interval the estimate says how much mass lies there but not where, so F is
 * drawn as a box rising from F(q_j⁻) to F(p_j) across [q_j, p_j], not as points.
 * Convention: a censored row is the half-open interval (L, R] (left: (0, R]; right: (L, ∞)); an
 * exact failure t is the point [t, t]. Each row covers a contiguous run of innermost intervals, so
 * one iteration costs O(rows + intervals) with prefix sums.
 * Convergence: the largest change of any mass below `tolerance` (default 1e-10); the
 * Kuhn–Tucker conditions of the NPMLE (Gentleman & Geyer 1994, Biometrika 81:618-623: the
 * gradient d_j = (1/N) Σ_i c_i α_ij / Σ_k α_ik s_k is 1 where s_j > 0 and ≤ 1 elsewhere) are
 * reported as the largest excess of d_j over 1, so a reader can see that the answer is a maximum.
 * With only exact failures and suspensions this is the Kaplan–Meier estimate (Efron 1967, Proc.
 * 5th Berkeley Symp. 4:831-853, self-consistency [from memory]).
 */
import { CompensatedSum } from '../compensated.js';
import type { IntervalLifeData } from './interval-likelihood-data.js';

export interface TurnbullInterval {
  /** Innermost interval [lower, upper] (lower = upper for a point). */
  readonly lower: number;
  readonly upper: number;
  /** Probability mass in it. */
  readonly mass: number;
  /** F just before `lower` and at `upper`: the box the estimate is drawn as. */
  readonly cdfBefore: number;
  readonly cdfAfter: number;
}

export interface TurnbullEstimate {
  readonly intervals: readonly TurnbullInterval[];
  readonly iterations: number;
  readonly converged: boolean;
  /** max_j (d_j - 1) over all innermost intervals: ≤ ~1e-6 at the NPMLE (Kuhn–Tucker). */
  readonly kuhnTuckerExcess: number;
  /**
   * Σ_i c_i ln P̂(row i), P̂(row) the estimate's mass in the innermost intervals the row covers: the
   * nonparametric log-likelihood the model's is compared with (interval-likelihood-ratio.ts). An exact
   * row contributes the log of its point's mass (a probability, not a density).
   */
  readonly logLikelihood: number;
  readonly method: string;
  readonly source: string;
}

export interface TurnbullOptions {
  readonly tolerance?: number;
  /** Self-consistency steps allowed (each accelerated round counts its three steps). */
  readonly maxIterations?: number;
  /** Accelerate the iteration (SQUAREM, below); the same fixed point, fewer steps. Default off. */
  readonly accelerate?: boolean;
}

/** An end point key: value, then 0 = closed at the value, 1 = just after it (open left end). */
interface Key {
  readonly v: number;
  readonly after: 0 | 1;
}

const cmp = (a: Key, b: Key): number => a.v - b.v || a.after - b.after;

export const TURNBULL_METHOD =
  'Turnbull (1976) nonparametric maximum likelihood (self-consistency EM on the innermost intervals); each innermost interval is drawn as a box because the estimate does not say where in it the mass lies';

export function turnbull(data: IntervalLifeData, opts: TurnbullOptions = {}): TurnbullEstimate {
  const tol = opts.tolerance ?? 1e-10;
  const maxIt = opts.maxIterations ?? 100000;
  const m = data.lower.length;
  const lefts: Key[] = [];
  const rights: Key[] = [];
  for (let i = 0; i < m; i++) {
    const lo = data.lower[i] as number;
    const hi = data.upper[i] as number;
    const exact = data.kinds[i] === 'exact';
    lefts.push({ v: lo, after: exact ? 0 : 1 });
    rights.push({ v: hi, after: 0 });
  }
  // Sorted end points; at equal keys a left end comes first, so a point [t, t] is innermost.
  const ends = [...lefts.map((k) => ({ k, left: true })), ...rights.map((k) => ({ k, left: false }))];
  ends.sort((a, b) => cmp(a.k, b.k) || (a.left === b.left ? 0 : a.left ? -1 : 1));
  const inner: { lo: Key; hi: Key }[] = [];
  for (let i = 0; i + 1 < ends.length; i++) {
    const a = ends[i]!;
    const b = ends[i + 1]!;
    if (a.left && !b.left) inner.push({ lo: a.k, hi: b.k });
  }
  const s = inner.length;
  // Row i covers innermost intervals first[i]..last[i] (contiguous: the innermost intervals are disjoint and sorted).
  const first = new Int32Array(m);
  const last = new Int32Array(m);
  /** First index j in [0, s] with pred(j) false, for a predicate true on a prefix. */
  const search = (pred: (j: number) => boolean): number => {
    let lo = 0;
    let hi = s;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (pred(mid)) lo = mid + 1;
      else hi = mid;
    }
    return lo;
  };
  for (let i = 0; i < m; i++) {
    first[i] = search((j) => cmp(inner[j]!.lo, lefts[i]!) < 0);
    last[i] = search((j) => cmp(inner[j]!.hi, rights[i]!) <= 0) - 1;
  }
  const N = data.n;
  let p: Float64Array = new Float64Array(s).fill(1 / s);
  const prefix = new Float64Array(s + 1);
  const diff = new Float64Array(s + 1);
  const gradient = (q: Float64Array): Float64Array => {
    for (let j = 0; j < s; j++) prefix[j + 1] = (prefix[j] as number) + (q[j] as number);
    diff.fill(0);
    for (let i = 0; i < m; i++) {
      const a = first[i] as number;
      const b = last[i] as number;
      const denom = (prefix[b + 1] as number) - (prefix[a] as number);
      const w = (data.counts[i] as number) / (N * denom);
      diff[a] = (diff[a] as number) + w;
      diff[b + 1] = (diff[b + 1] as number) - w;
    }
    const d = new Float64Array(s);
    let run = 0;
    for (let j = 0; j < s; j++) {
      run += diff[j] as number;
      d[j] = run;
    }
    return d;
  };
  /** One self-consistency step from q, and the largest change of a mass. */
  const emStep = (q: Float64Array): { next: Float64Array; change: number } => {
    const d = gradient(q);
    const next = new Float64Array(s);
    let change = 0;
    let total = 0;
    for (let j = 0; j < s; j++) {
      next[j] = (q[j] as number) * (d[j] as number);
      total += next[j] as number;
    }
    for (let j = 0; j < s; j++) {
      next[j] = (next[j] as number) / total;
      change = Math.max(change, Math.abs((next[j] as number) - (q[j] as number)));
    }
    return { next, change };
  };
  let it = 0;
  let converged = false;
  while (it < maxIt) {
    it++;
    const one = emStep(p);
    if (one.change < tol) {
      p = one.next;
      converged = true;
      break;
    }
    if (!opts.accelerate) {
      p = one.next;
      continue;
    }
    // SQUAREM (Varadhan & Roland 2008, Scand. J. Statist. 35:335-353, scheme S3): from p, p1 = EM(p),
    // p2 = EM(p1), r = p1 − p, v = p2 − p1 − r, step α = −‖r‖/‖v‖ (≤ −1), p' = p − 2αr + α²v, halved
    // towards α = −1 (which gives p2) until every mass that p2 keeps stays positive (a mass set to 0
    // stays 0 under EM, so a clipped one would stop the iteration short of the maximum); then one EM
    // step from p'. The stopping rule is the plain one (an EM step that moves no mass by tol), and the
    // Kuhn–Tucker excess below reports whether the result is the maximum.
    const p1 = one.next;
    const p2 = emStep(p1).next;
    it++;
    let rr = 0;
    let vv = 0;
    for (let j = 0; j < s; j++) {
      const r = (p1[j] as number) - (p[j] as number);
      const v = (p2[j] as number) - (p1[j] as number) - r;
      rr += r * r;
      vv += v * v;
    }
    let alpha = vv > 0 ? -Math.sqrt(rr / vv) : -1;
    if (alpha > -1) alpha = -1;
    let candidate: Float64Array | null = null;
    for (let tries = 0; tries < 30 && alpha < -1; tries++) {
      const q = new Float64Array(s);
      let ok = true;
      let total = 0;
      for (let j = 0; j < s; j++) {
        const r = (p1[j] as number) - (p[j] as number);
        const v = (p2[j] as number) - (p1[j] as number) - r;
        const x = (p[j] as number) - 2 * alpha * r + alpha * alpha * v;
        if ((p2[j] as number) > 0 && !(x > 0)) {
          ok = false;
          break;
        }
        q[j] = Math.max(0, x);
        total += q[j] as number;
      }
      if (ok) {
        for (let j = 0; j < s; j++) q[j] = (q[j] as number) / total;
        candidate = q;
        break;
      }
      alpha = (alpha - 1) / 2;
    }
    if (candidate === null) {
      p = p2;
      continue;
    }
    p = emStep(candidate).next;
    it++;
  }
  const d = gradient(p);
  let kt = Number.NEGATIVE_INFINITY;
  for (let j = 0; j < s; j++) kt = Math.max(kt, (d[j] as number) - 1);
  // Each row's mass summed directly (not as a difference of prefix sums, which would cancel in the tails).
  const ll = new CompensatedSum();
  for (let i = 0; i < m; i++) {
    let mass = 0;
    for (let j = first[i] as number; j <= (last[i] as number); j++) mass += p[j] as number;
    ll.add((data.counts[i] as number) * Math.log(mass));
  }
  const logLikelihood = ll.value;
  const intervals: TurnbullInterval[] = [];
  let F = 0;
  for (let j = 0; j < s; j++) {
    const mass = p[j] as number;
    const before = F;
    F = Math.min(1, F + mass);
    intervals.push({ lower: inner[j]!.lo.v, upper: inner[j]!.hi.v, mass, cdfBefore: before, cdfAfter: j === s - 1 ? 1 : F });
  }
  return {
    intervals,
    iterations: it,
    converged,
    kuhnTuckerExcess: kt,
    logLikelihood,
    method: TURNBULL_METHOD,
    source: 'Turnbull 1976, JRSS B 38:290-295; Kuhn–Tucker check: Gentleman & Geyer 1994, Biometrika 81:618-623',
  };
}

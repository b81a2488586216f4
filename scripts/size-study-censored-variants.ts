/**
 * Diagnostic runs behind the "Censored, staggered withdrawals" paragraph of docs/size-study.md: the
 * size of the censored A² bootstrap (Weibull shape 1.5, scale 100, n = 40, α = 0.05) when the
 * replicates are drawn in other ways than the product's (core/life/bootstrap-range.ts), on the same
 * seeded samples as scripts/size-study-censored.ts (sample streams SEED + 0/100 + 10q, replicate b of
 * sample s from createRng(5000 + s, b), as the study's censoredGofBootstrap seed 5000 + s).
 *
 *   npx tsx scripts/size-study-censored-variants.ts fixed|staggered q R B VARIANT...
 *   e.g. nice -n 10 npx tsx scripts/size-study-censored-variants.ts staggered 0.3 2000 99 cur cur+old truecens+old
 *   FROM=2000 ... runs samples 2000 .. 2000 + R − 1 of the same streams (a second, disjoint pilot)
 *
 * VARIANT = censoring[+r][+old]:
 *   cur          each unit's censoring time from the Kaplan–Meier estimate of the censoring
 *                distribution, the mass it leaves at the last observed time (the product's staggered rule)
 *   curinf       the same with that mass beyond reach (no censoring)
 *   curhalf      that mass half at the last observed time, half beyond reach
 *   curW         censoring times from a Weibull fitted to them (roles of failure and suspension swapped)
 *   cond         Davison & Hinkley (1997) §3.5 conditional bootstrap [from memory]: a suspended unit
 *                keeps its time, a failed unit draws from the Kaplan–Meier censoring estimate beyond its
 *                failure time (mass at the last observed time); condinf: that mass beyond reach;
 *                condW: the Weibull censoring model beyond the failure time
 *   truecens     the true censoring mechanism of the study (fixed time or uniform withdrawals)
 *   oracleTheta  cur, but replicates drawn from the true parameters instead of the fit
 *   +r           keep the observed number of failures (redraw the replicate until it has r)
 *   +lf          the statistic integrated only to the last failure (nothing from there to the last observed time)
 *   +fdb         fast double bootstrap p-value (Davidson & MacKinnon 2007, Comput. Stat. Data Anal.
 *                51:3259-3281 [from memory]): each replicate j also draws one second-level sample from its
 *                own fit and censoring estimate (same scheme), giving A²**_j; with p̂ = #{A²*_j > A²}/B
 *                and Q the (1 − p̂) quantile of the A²**, p = #{A²*_j > Q}/B (unrefittable replicates dropped);
 *                cur+stud+r+fdb is the product's staggered test since 2026-12-05 (core/life/fast-double-bootstrap.ts)
 *   +old         the statistic before 2026-12-05: after a last failure of censored data it integrated
 *                (1 − u)/u on to u = 1 (core/life/anderson-darling.ts explains why that was dropped)
 *   +trunc       the data (and every replicate) truncated at their last withdrawal: units still running
 *                then suspended there, refitted, so no Kaplan–Meier censoring mass is left over
 *   +win         every replicate's statistic on the observed window [0, τ_obs] (units past τ_obs
 *                suspended there for the statistic only; the refit uses the whole replicate)
 *   +norm        A² / F̂(τ) (its mean for a known model without censoring inside the window)
 *   +stud        A² / its Greenwood-estimated mean (core/life/anderson-darling.ts
 *                censoredAndersonDarlingMean; the product's staggered statistic since 2026-12-05)
 *   +studA       the same with the Aalen increments d/Y² instead of Greenwood's d/(Y(Y − d))
 *   +studP       A² / (Greenwood mean − the fitted model's share, ∇Fᵀ J⁻¹ ∇F; Hausman 1978 [from memory])
 *   +studV       (A² − mean)/sd, both from Greenwood's covariance of the Kaplan–Meier process
 *   +studM       A² / its mean from the fitted model's asymptotic Kaplan–Meier variance under the
 *                Kaplan–Meier censoring estimate (Breslow & Crowley 1974 [from memory]; modelMean)
 *   +shapeF      replicates from the fitted shape × F (a sensitivity probe, not a method)
 *   prog         (mode) suspensions moved back to the failure before them and the sample treated as
 *                progressively Type II censored with that pattern (Balakrishnan & Sandhu 1995 draws):
 *                the statistic is then parameter-free for the Weibull, but the pattern is not ancillary
 *                under random censorship
 * Prints the size at α = 0.05 and 0.10, the mean p-value and the unrefittable replicates per variant.
 */
import { getFamily, type Distribution } from '../core/families/index.js';
import { censoringDistribution } from '../core/life/bootstrap.js';
import { forEachFailureTime, type LifeData } from '../core/life/data.js';
import { buildLifeData, censoredAndersonDarling, censoredLogLikelihood, fitCensored, prepareLifeData } from '../core/life/index.js';
import { createRng, type Rng } from '../core/random/index.js';

const SHAPE = 1.5;
const SCALE = 100;
const N = 40;
const SEED = 20261204;
const TRUTH = { shape: SHAPE, scale: SCALE };
const fam = getFamily('weibull');

function fixedTime(q: number): number {
  return SCALE * Math.pow(-Math.log(q), 1 / SHAPE);
}

/** As scripts/size-study-censored.ts: W with P(U·W < X) = q (seeded Monte Carlo, bisection). */
function staggeredWidth(q: number): number {
  const xs = fam.random(TRUTH, createRng(SEED, 999999), 200000);
  const frac = (w: number): number => {
    let s = 0;
    for (const x of xs) s += Math.min(1, x / w);
    return s / xs.length;
  };
  let lo = 1;
  let hi = 1e6;
  for (let k = 0; k < 100; k++) {
    const mid = Math.sqrt(lo * hi);
    if (frac(mid) > q) lo = mid;
    else hi = mid;
  }
  return Math.sqrt(lo * hi);
}

/** The statistic before the change: the current one plus n ∫ from u(τ) to 1 of (1 − u)/u when censored data end in a failure. */
function oldStatistic(dist: Distribution, data: LifeData): number {
  const a = censoredAndersonDarling(dist, data);
  if (data.suspensions === 0 || !data.failed[data.n - 1]) return a;
  const logU = dist.logCdf(data.maxTime);
  return a + data.n * (-logU - (1 - Math.exp(logU)));
}

/** The current statistic less its last piece: from the last failure to the last observed time, K constant. */
function toLastFailure(dist: Distribution, data: LifeData): number {
  if (data.suspensions === 0 || data.failed[data.n - 1] || data.failures === 0) return censoredAndersonDarling(dist, data);
  const lastFailure = data.failureTimes[data.failures - 1] as number;
  let i = data.n - 1;
  while (i >= 0 && (data.times[i] as number) > lastFailure) i--;
  const t = Float64Array.from(data.times.subarray(0, i + 1));
  const f = Uint8Array.from(data.failed.subarray(0, i + 1));
  // The units still running after the last failure, suspended at it: same Kaplan–Meier steps, window ends there.
  const tt = new Float64Array(data.n);
  const ff = new Uint8Array(data.n);
  tt.set(t);
  ff.set(f);
  for (let j = i + 1; j < data.n; j++) tt[j] = lastFailure;
  return censoredAndersonDarling(dist, buildLifeData(tt, ff));
}

/** Kaplan–Meier censoring draws beyond t; `leftover`: where the mass left after the last withdrawal goes. */
function kmCensoring(data: LifeData, leftover: 'last' | 'beyond' | 'half'): (t: number, rng: Rng) => number {
  const G = censoringDistribution(data);
  const atoms = Array.from(G.atoms);
  const mass = Array.from(G.mass);
  const lastIsLeftover = data.failed[data.n - 1] === 1 && atoms[atoms.length - 1] === data.maxTime;
  return (t, rng) => {
    let total = 0;
    for (let j = 0; j < atoms.length; j++) if ((atoms[j] as number) > t) total += mass[j] as number;
    let c = data.maxTime;
    if (total > 0) {
      let target = rng.uniform() * total;
      for (let j = 0; j < atoms.length; j++) {
        if (!((atoms[j] as number) > t)) continue;
        c = atoms[j] as number;
        target -= mass[j] as number;
        if (target <= 0) break;
      }
    }
    const inLeftover = c === data.maxTime && (lastIsLeftover || total === 0);
    if (inLeftover && (leftover === 'beyond' || (leftover === 'half' && rng.uniform() < 0.5))) return Number.POSITIVE_INFINITY;
    return c;
  };
}

function censoringFor(mode: string, data: LifeData, kind: string, w: number): (i: number, rng: Rng) => number {
  if (mode === 'truecens') return (_i, rng) => (kind === 'fixed' ? w : rng.uniform() * w);
  if (mode === 'curW' || mode === 'condW') {
    const sw = fitCensored('weibull', prepareLifeData({ times: Array.from(data.times), failed: Array.from(data.failed, (x) => 1 - x) }));
    if (sw.ok) {
      const k = sw.parameters.shape as number;
      const lam = sw.parameters.scale as number;
      return (i, rng) => {
        if (mode === 'condW' && !data.failed[i]) return data.times[i] as number;
        const y = mode === 'condW' ? (data.times[i] as number) : 0;
        return lam * Math.pow(Math.pow(y / lam, k) - Math.log(rng.uniform()), 1 / k);
      };
    }
    mode = mode === 'curW' ? 'cur' : 'cond';
  }
  const leftover = mode.endsWith('inf') ? 'beyond' : mode.endsWith('half') ? 'half' : 'last';
  const km = kmCensoring(data, leftover);
  if (mode.startsWith('cond')) return (i, rng) => (data.failed[i] ? km(data.times[i] as number, rng) : (data.times[i] as number));
  return (_i, rng) => km(Number.NEGATIVE_INFINITY, rng);
}

/**
 * The data with every suspension moved back to the failure before it (suspensions before the first
 * failure dropped): a progressively Type II censored sample with pattern R_1..R_m (Balakrishnan &
 * Aggarwala 2000, Progressive Censoring [from memory]). Returns the moved data and the pattern.
 */
function movedBack(data: LifeData): { moved: LifeData; pattern: number[] } {
  const pattern: number[] = [];
  const t: number[] = [];
  const f: number[] = [];
  let last = Number.NaN;
  for (let i = 0; i < data.n; i++) {
    if (data.failed[i]) {
      last = data.times[i] as number;
      pattern.push(0);
      t.push(last);
      f.push(1);
    } else if (pattern.length > 0) {
      pattern[pattern.length - 1]!++;
      t.push(last);
      f.push(0);
    }
  }
  return { moved: buildLifeData(Float64Array.from(t), Uint8Array.from(f)), pattern };
}

/** Progressive Type II sample (pattern R) from dist by Balakrishnan & Sandhu (1995, Am. Stat. 49:229-230 [from memory]). */
function drawProgressive(dist: Distribution, pattern: readonly number[], rng: Rng): LifeData {
  const m = pattern.length;
  const t: number[] = [];
  const f: number[] = [];
  let tail = 0; // R_m + ... + R_{m-i+1}
  let prod = 1;
  for (let i = 1; i <= m; i++) {
    tail += pattern[m - i] as number;
    prod *= Math.pow(rng.uniform(), 1 / (i + tail));
    const x = dist.quantile(1 - prod);
    const r = pattern[i - 1] as number;
    t.push(x);
    f.push(1);
    for (let k = 0; k < r; k++) {
      t.push(x);
      f.push(0);
    }
  }
  return buildLifeData(Float64Array.from(t), Uint8Array.from(f));
}

/** Every unit still running after the last withdrawal suspended at that withdrawal's time (failures there kept). */
function truncateAtLastWithdrawal(data: LifeData): LifeData {
  if (data.suspensions === 0) return data;
  const cMax = data.suspensionTimes[data.suspensions - 1] as number;
  if (cMax >= data.maxTime) return data;
  const t = Float64Array.from(data.times, (x) => Math.min(x, cMax));
  const f = Uint8Array.from(data.failed, (d, i) => ((data.times[i] as number) > cMax ? 0 : d));
  return buildLifeData(t, f);
}

/**
 * The mean of the censored A² for a fully specified model estimated from the data: n·Var K(u) by
 * Greenwood's formula (Kaplan & Meier 1958) on each Kaplan–Meier step, times ∫ du/(u(1 − u)) over
 * the step, summed over the window [0, τ] (τ = largest time; to u = 1 for a complete sample).
 */
function greenwoodMean(dist: Distribution, data: LifeData, aalen = false): number {
  let S = 1;
  let g = 0;
  let total = 0;
  let prevT = Number.NaN;
  const seg = (a: number, b: number): number => {
    const la = dist.logCdf(a);
    const lb = b === Number.POSITIVE_INFINITY ? 0 : dist.logCdf(b);
    const sa = dist.logSf(a);
    const sb = b === Number.POSITIVE_INFINITY ? Number.NEGATIVE_INFINITY : dist.logSf(b);
    return lb - la + (sa - sb);
  };
  forEachFailureTime(data, (t, Y, d) => {
    if (!Number.isNaN(prevT) && S > 0) total += data.n * S * S * g * seg(prevT, t);
    S *= 1 - d / Y;
    g += aalen ? d / (Y * Y) : Y > d ? d / (Y * (Y - d)) : 0;
    prevT = t;
  });
  if (!Number.isNaN(prevT) && S > 0 && data.suspensions > 0 && data.maxTime > prevT) total += data.n * S * S * g * seg(prevT, data.maxTime);
  return total;
}

/**
 * n ∫ Var F̂(u) du/(u(1 − u)) over the window: the part of the Kaplan–Meier variance the fitted model
 * takes up. With an efficient estimator θ̂, Var(K − F_θ̂) = Var K − Var F_θ̂ asymptotically (Hausman
 * 1978, Econometrica 46:1251-1271 [from memory]); Var F_θ̂(t) = ∇F(t)ᵀ J⁻¹ ∇F(t), J the observed
 * information on (ln shape, ln scale). Midpoint rule in ln u, 200 points. Weibull only (pilot).
 */
function parametricVarianceMean(params: { shape?: number; scale?: number }, data: LifeData): number {
  const ls = Math.log(params.shape as number);
  const lc = Math.log(params.scale as number);
  const ll = (a: number, b: number): number => censoredLogLikelihood(fam.make({ shape: Math.exp(a), scale: Math.exp(b) }), data);
  const h = 1e-4;
  const f0 = ll(ls, lc);
  const haa = (ll(ls + h, lc) - 2 * f0 + ll(ls - h, lc)) / (h * h);
  const hbb = (ll(ls, lc + h) - 2 * f0 + ll(ls, lc - h)) / (h * h);
  const hab = (ll(ls + h, lc + h) - ll(ls + h, lc - h) - ll(ls - h, lc + h) + ll(ls - h, lc - h)) / (4 * h * h);
  // J = -H; J⁻¹ = (1/det) [[jbb, -jab], [-jab, jaa]]
  const jaa = -haa;
  const jbb = -hbb;
  const jab = -hab;
  const det = jaa * jbb - jab * jab;
  if (!(det > 0)) return Number.NaN;
  const dist = fam.make(params as never);
  const uTau = data.suspensions === 0 ? 1 - 1e-12 : Math.exp(dist.logCdf(data.maxTime));
  const lo = Math.log(1e-10);
  const hi = Math.log(uTau);
  const K = 200;
  let total = 0;
  for (let i = 0; i < K; i++) {
    const v = lo + ((i + 0.5) * (hi - lo)) / K;
    const u = Math.exp(v);
    const t = dist.quantile(u);
    const cdf = (a: number, b: number): number => fam.make({ shape: Math.exp(a), scale: Math.exp(b) }).cdf(t);
    const ga = (cdf(ls + h, lc) - cdf(ls - h, lc)) / (2 * h);
    const gb = (cdf(ls, lc + h) - cdf(ls, lc - h)) / (2 * h);
    const q = (jbb * ga * ga - 2 * jab * ga * gb + jaa * gb * gb) / det;
    total += (q / (1 - u)) * ((hi - lo) / K);
  }
  return data.n * total;
}

/**
 * Mean and variance of the censored A² for a Gaussian limit of the Kaplan–Meier process with
 * Greenwood's covariance n·Cov(K(s), K(t)) = n·S(s)S(t)·g(min(s, t)) (steps i: S_i, g_i, weight
 * W_i = ∫ du/(u(1 − u))): mean Σ n S_i² g_i W_i, variance 2 Σ_i Σ_j (n S_i S_j g_min)² W_i W_j (on steps,
 * the within-step covariance taken at the step's value; a pilot approximation).
 */
function greenwoodMoments(dist: Distribution, data: LifeData): { mean: number; sd: number } {
  const Ss: number[] = [];
  const gs: number[] = [];
  const Ws: number[] = [];
  let S = 1;
  let g = 0;
  let prevT = Number.NaN;
  const seg = (a: number, b: number): number => dist.logCdf(b) - dist.logCdf(a) + (dist.logSf(a) - dist.logSf(b));
  forEachFailureTime(data, (t, Y, d) => {
    if (!Number.isNaN(prevT) && S > 0 && g > 0) {
      Ss.push(S);
      gs.push(g);
      Ws.push(seg(prevT, t));
    }
    S *= 1 - d / Y;
    if (Y > d) g += d / (Y * (Y - d));
    prevT = t;
  });
  if (!Number.isNaN(prevT) && S > 0 && g > 0 && data.suspensions > 0 && data.maxTime > prevT) {
    Ss.push(S);
    gs.push(g);
    Ws.push(seg(prevT, data.maxTime));
  }
  const n = data.n;
  let mean = 0;
  for (let i = 0; i < Ss.length; i++) mean += n * Ss[i]! * Ss[i]! * gs[i]! * Ws[i]!;
  // Σ_i Σ_j S_i² S_j² g_min² W_i W_j = Σ_i g_i² S_i² W_i (S_i² W_i + 2 Σ_{j>i} S_j² W_j)   (g increasing)
  let suffix = 0;
  let v = 0;
  for (let i = Ss.length - 1; i >= 0; i--) {
    const a = Ss[i]! * Ss[i]! * Ws[i]!;
    v += gs[i]! * gs[i]! * a * (a + 2 * suffix);
    suffix += a;
  }
  return { mean, sd: Math.sqrt(2 * v) * n };
}

/**
 * The mean of A² from the model's own asymptotic variance of the Kaplan–Meier estimate under random
 * censorship, n·Var K(t) = (1 − F(t))² ∫₀ᵗ dF/((1 − F)²(1 − G(s−))) (Breslow & Crowley 1974, Ann.
 * Stat. 2:437-453 [from memory]), with F the fitted model and G the Kaplan–Meier censoring
 * estimate: on a stretch where 1 − G = γ and C = the integral so far at u = a, the integrand
 * Var/(u(1 − u)) is C(1 − u)/u + (u − a)/(γ u (1 − a)), integrated in closed form.
 */
function modelMean(dist: Distribution, data: LifeData): number {
  const G = censoringDistribution(data);
  const end = data.suspensions === 0 ? Number.POSITIVE_INFINITY : data.maxTime;
  let gamma = 1;
  let C = 0;
  let a = 0;
  let total = 0;
  const piece = (b: number): void => {
    if (!(b > a)) return;
    const lr = a > 0 ? Math.log(b / a) : 0;
    const first = a > 0 ? C * (lr - (b - a)) : 0;
    const second = (a > 0 ? (b - a) - a * lr : b) / (gamma * (1 - a));
    total += first + second;
    C += (1 / (1 - b) - 1 / (1 - a)) / gamma;
    a = b;
  };
  for (let j = 0; j < G.atoms.length; j++) {
    const c = G.atoms[j] as number;
    if (c >= end) break;
    piece(Math.exp(dist.logCdf(c)));
    gamma -= G.mass[j] as number;
    if (!(gamma > 1e-12)) return total;
  }
  piece(end === Number.POSITIVE_INFINITY ? 1 - 1e-15 : Math.exp(dist.logCdf(end)));
  return total;
}

// FROM=S (environment): start at sample S instead of 0 (the same streams, later samples).
const FROM = Number(process.env.FROM ?? 0);
const [kind = 'staggered', qs = '0.3', Rs = '200', Bs = '99', ...variants] = process.argv.slice(2);
const q = Number(qs);
const R = Number(Rs);
const B = Number(Bs);
const w = kind === 'fixed' ? fixedTime(q) : staggeredWidth(q);
const res = new Map(variants.map((v) => [v, { rej5: 0, rej10: 0, psum: 0, unrefit: 0 }]));
let done = 0;
const started = Date.now();
for (let s = FROM; s < FROM + R; s++) {
  const rng = createRng(SEED + (kind === 'fixed' ? 0 : 100) + Math.round(q * 10), s);
  const life = fam.random(TRUTH, rng, N);
  const times: number[] = [];
  const failed: number[] = [];
  for (let j = 0; j < N; j++) {
    const c = kind === 'fixed' ? w : rng.uniform() * w;
    const x = life[j] as number;
    times.push(Math.min(x, c));
    failed.push(x <= c ? 1 : 0);
  }
  const data0 = prepareLifeData({ times, failed });
  const fit0 = fitCensored('weibull', data0);
  if (!fit0.ok) continue;
  done++;
  for (const v of variants) {
    const [mode = 'cur', ...flags] = v.split('+');
    if (mode === 'prog') {
      const { moved, pattern } = movedBack(data0);
      const mf = fitCensored('weibull', moved, { warmStart: fit0.parameters });
      const r = res.get(v)!;
      if (!mf.ok) {
        r.unrefit += B;
        continue;
      }
      const observed = censoredAndersonDarling(fam.make(mf.parameters), moved);
      const dist = fam.make(mf.parameters);
      let exceed = 0;
      let unrefit = 0;
      for (let b = 0; b < B; b++) {
        const sim = drawProgressive(dist, pattern, createRng(5000 + s, b));
        const rf = fitCensored('weibull', sim, { warmStart: mf.parameters });
        const a = rf.ok ? censoredAndersonDarling(fam.make(rf.parameters), sim) : Number.NaN;
        if (!Number.isFinite(a)) unrefit++;
        else if (a >= observed) exceed++;
      }
      const p = (1 + exceed + unrefit) / (1 + B);
      r.unrefit += unrefit;
      r.psum += p;
      if (p <= 0.05) r.rej5++;
      if (p <= 0.1) r.rej10++;
      continue;
    }
    const baseStat = flags.includes('old') ? oldStatistic : flags.includes('lf') ? toLastFailure : censoredAndersonDarling;
    const trunc = flags.includes('trunc');
    // +trunc: the statistic of data truncated at their last withdrawal, refitted there (observed and every replicate alike).
    const norm = flags.includes('norm');
    // +stud: A² divided by its Greenwood-estimated mean under a known model (greenwoodMean).
    const studA = flags.includes('studA');
    // +studP: divided by the Greenwood mean less the fitted model's share (parametricVarianceMean).
    const studP = flags.includes('studP');
    // +studV: (A² − mean)/sd with the Greenwood moments (greenwoodMoments).
    const studV = flags.includes('studV');
    // +studM: A² / its mean from the model's Kaplan–Meier variance with the censoring estimate (modelMean).
    const studM = flags.includes('studM');
    // +studA: the same with the Aalen form d/Y² of the variance increments.
    const stud = flags.includes('stud') || studA;
    // +norm: A² divided by u_τ = F̂(τ), its mean under a known model without censoring inside the window.
    const stat = (d: Distribution, x: LifeData): number => {
      if (norm) return statT(d, x) / (x.suspensions === 0 ? 1 : Math.exp(d.logCdf(x.maxTime)));
      if (studM) {
        const m = modelMean(d, x);
        return m > 0 ? statT(d, x) / m : statT(d, x);
      }
      if (studV) {
        const m = greenwoodMoments(d, x);
        return m.sd > 0 ? (statT(d, x) - m.mean) / m.sd : statT(d, x);
      }
      if (studP) {
        const g = greenwoodMean(d, x);
        const e = g - parametricVarianceMean(d.parameters as never, x);
        return e > 0.1 * g ? statT(d, x) / e : g > 0 ? statT(d, x) / (0.1 * g) : statT(d, x);
      }
      if (stud) {
        const e = greenwoodMean(d, x, studA);
        return e > 0 ? statT(d, x) / e : statT(d, x);
      }
      return statT(d, x);
    };
    const statT = (d: Distribution, x: LifeData): number => {
      if (!trunc) return baseStat(d, x);
      const y = truncateAtLastWithdrawal(x);
      if (y === x) return baseStat(d, x);
      const yf = fitCensored('weibull', y, { warmStart: d.parameters });
      return yf.ok ? baseStat(fam.make(yf.parameters), y) : Number.NaN;
    };
    const data = trunc ? truncateAtLastWithdrawal(data0) : data0;
    // +win: every replicate's statistic on the observed window [0, τ_obs] (units past τ_obs suspended there, fit unchanged).
    const win = flags.includes('win');
    const tauObs = data.maxTime;
    const repStat = (d: Distribution, x: LifeData, tau = tauObs): number => {
      if (!win || x.maxTime <= tau) return stat(d, x);
      const t2 = Float64Array.from(x.times, (y) => Math.min(y, tau));
      const f2 = Uint8Array.from(x.failed, (y, i) => ((x.times[i] as number) > tau ? 0 : y));
      return stat(d, buildLifeData(t2, f2));
    };
    const fit = trunc ? fitCensored('weibull', data, { warmStart: fit0.parameters }) : fit0;
    if (!fit.ok) continue;
    const keepR = flags.includes('r');
    const adj = flags.find((x) => x.startsWith('shape'));
    // +shapeF: replicates drawn with the fitted shape multiplied by F (a sensitivity probe, not a method).
    const par = mode === 'oracleTheta' ? TRUTH : adj ? { ...fit.parameters, shape: (fit.parameters.shape as number) * Number(adj.slice(5)) } : fit.parameters;
    const censor = censoringFor(mode === 'oracleTheta' ? 'cur' : mode, data, kind, w);
    const observed = stat(fam.make(fit.parameters), data);
    let exceed = 0;
    let unrefit = 0;
    const t = new Float64Array(N);
    const f = new Uint8Array(N);
    const fdb = flags.includes('fdb');
    const first: number[] = [];
    const second: number[] = [];
    const drawInto = (from: LifeData, p: typeof par, cens: (i: number, rng: Rng) => number, r2: Rng): LifeData => {
      for (let attempt = 0; attempt < 10000; attempt++) {
        const lf = fam.random(p, r2, N);
        let r = 0;
        for (let i = 0; i < N; i++) {
          const x = lf[i] as number;
          const c = cens(i, r2);
          t[i] = Math.min(x, c);
          f[i] = x <= c ? 1 : 0;
          r += f[i] as number;
        }
        if (!keepR || r === from.failures) break;
      }
      return buildLifeData(t, f);
    };
    for (let b = 0; b < B; b++) {
      const r2 = createRng(5000 + s, b);
      const sim = drawInto(data, par, censor, r2);
      const rf = fitCensored('weibull', sim, { warmStart: par });
      const a = rf.ok ? repStat(fam.make(rf.parameters), sim) : Number.NaN;
      if (!Number.isFinite(a)) unrefit++;
      else if (a >= observed) exceed++;
      if (fdb && rf.ok && Number.isFinite(a)) {
        const sim2 = drawInto(sim, rf.parameters, censoringFor(mode === 'oracleTheta' ? 'cur' : mode, sim, kind, w), r2);
        const rf2 = fitCensored('weibull', sim2, { warmStart: rf.parameters });
        const a2 = rf2.ok ? repStat(fam.make(rf2.parameters), sim2, Math.min(tauObs, sim.maxTime)) : Number.NaN;
        if (Number.isFinite(a2)) {
          first.push(a);
          second.push(a2);
        }
      }
    }
    let p = (1 + exceed + unrefit) / (1 + B);
    if (fdb && first.length > 0) {
      const m = first.length;
      const pHat = first.filter((x) => x > observed).length / m;
      const sorted = [...second].sort((x, y) => x - y);
      const q = sorted[Math.min(m - 1, Math.max(0, Math.ceil((1 - pHat) * m) - 1))] as number;
      p = first.filter((x) => x > q).length / m;
    }
    const r = res.get(v)!;
    r.unrefit += unrefit;
    r.psum += p;
    if (p <= 0.05) r.rej5++;
    if (p <= 0.1) r.rej10++;
  }
}
console.log(`${kind} ${100 * q} % censored, R = ${done}, B = ${B}, SE ${(100 * Math.sqrt(0.0475 / done)).toFixed(2)} points; ${((Date.now() - started) / 1000).toFixed(0)} s`);
for (const [v, r] of res) {
  console.log(`${v}: size ${((100 * r.rej5) / done).toFixed(2)} % at α = 0.05, ${((100 * r.rej10) / done).toFixed(2)} % at 0.10; mean p ${(r.psum / done).toFixed(4)}; unrefittable replicates ${r.unrefit}`);
}

/**
 * Diagnostic runs behind the "Censored, staggered withdrawals" paragraph of docs/size-study.md: the
 * size of the censored A² bootstrap (Weibull shape 1.5, scale 100, n = 40, α = 0.05) when the
 * replicates are drawn in other ways than the product's (core/life/bootstrap-range.ts), on the same
 * seeded samples as scripts/size-study-censored.ts (sample streams SEED + 0/100 + 10q, replicate b of
 * sample s from createRng(5000 + s, b), as the study's censoredGofBootstrap seed 5000 + s).
 *
 *   npx tsx scripts/size-study-censored-variants.ts fixed|staggered q R B VARIANT...
 *   e.g. nice -n 10 npx tsx scripts/size-study-censored-variants.ts staggered 0.3 2000 99 cur cur+old truecens+old
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
 *                and Q the (1 − p̂) quantile of the A²**, p = #{A²*_j > Q}/B (unrefittable replicates dropped)
 *   +old         the statistic before 2026-12-05: after a last failure of censored data it integrated
 *                (1 − u)/u on to u = 1 (core/life/anderson-darling.ts explains why that was dropped)
 * Prints the size at α = 0.05 and 0.10, the mean p-value and the unrefittable replicates per variant.
 */
import { getFamily, type Distribution } from '../core/families/index.js';
import { censoringDistribution } from '../core/life/bootstrap.js';
import { type LifeData } from '../core/life/data.js';
import { buildLifeData, censoredAndersonDarling, fitCensored, prepareLifeData } from '../core/life/index.js';
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

const [kind = 'staggered', qs = '0.3', Rs = '200', Bs = '99', ...variants] = process.argv.slice(2);
const q = Number(qs);
const R = Number(Rs);
const B = Number(Bs);
const w = kind === 'fixed' ? fixedTime(q) : staggeredWidth(q);
const res = new Map(variants.map((v) => [v, { rej5: 0, rej10: 0, psum: 0, unrefit: 0 }]));
let done = 0;
const started = Date.now();
for (let s = 0; s < R; s++) {
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
  const data = prepareLifeData({ times, failed });
  const fit = fitCensored('weibull', data);
  if (!fit.ok) continue;
  done++;
  for (const v of variants) {
    const [mode = 'cur', ...flags] = v.split('+');
    const stat = flags.includes('old') ? oldStatistic : flags.includes('lf') ? toLastFailure : censoredAndersonDarling;
    const keepR = flags.includes('r');
    const par = mode === 'oracleTheta' ? TRUTH : fit.parameters;
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
      const a = rf.ok ? stat(fam.make(rf.parameters), sim) : Number.NaN;
      if (!Number.isFinite(a)) unrefit++;
      else if (a >= observed) exceed++;
      if (fdb && rf.ok && Number.isFinite(a)) {
        const sim2 = drawInto(sim, rf.parameters, censoringFor(mode === 'oracleTheta' ? 'cur' : mode, sim, kind, w), r2);
        const rf2 = fitCensored('weibull', sim2, { warmStart: rf.parameters });
        const a2 = rf2.ok ? stat(fam.make(rf2.parameters), sim2) : Number.NaN;
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

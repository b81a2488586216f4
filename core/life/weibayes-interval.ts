/**
 * Weibayes with inspection data: the Weibull shape β ASSUMED (not estimated), units known to have
 * failed only within an inspection interval. With β fixed, X = T^β is exponential with rate
 * λ = η^−β, and each row's interval (L, R] becomes (L^β, R^β]; the exponential log-likelihood
 *   exact x: ln λ − λx;  right (a, ∞): −λa;  left (0, b]: ln(1 − e^{−λb});
 *   interval (a, b]: −λa + ln(1 − e^{−λ(b − a)})
 * is concave in λ, so its maximum is the root of the score, found in a bracket (core/special
 * findRoot). There is no closed form once an interval row is present, so the one-sided lower bound
 * of η at confidence C is the likelihood-ratio bound: the λ above λ̂ where
 * 2(ℓ(λ̂) − ℓ(λ)) = z_C² (the upper end of the two-sided 2C − 1 profile interval; Meeker & Escobar
 * 1998 §8.3 [from memory]). It is a large-sample bound, not the exact χ²(2r + 2) bound of Nelson's
 * Weibayes (weibayes.ts), which holds only for exact failures and suspensions; with those alone
 * the report uses weibayes.ts. With exact failures and suspensions only, λ̂ = r / Σ t^β, the same
 * scale (Σ t^β / r)^{1/β} as weibayes.ts (checked in test/life/weibayes-interval.test.ts against
 * SciPy weibull_min with the shape fixed, scripts/fixtures/life-weibayes-interval.py).
 * Sums use log1mexp (core/special) so that short intervals and small λ keep their digits.
 */
import { CompensatedSum } from '../compensated.js';
import { InputError } from '../errors.js';
import { findRoot, log1mexp, normalQuantile } from '../special/index.js';
import type { IntervalLifeData } from './interval-likelihood-data.js';
import type { WeibayesOptions, WeibayesResult } from './weibayes.js';

/** The rows on the X = T^β scale (a, b), with kinds and counts. */
function transformed(data: IntervalLifeData, beta: number): { a: Float64Array; b: Float64Array } {
  const a = new Float64Array(data.lower.length);
  const b = new Float64Array(data.lower.length);
  for (let i = 0; i < a.length; i++) {
    a[i] = Math.pow(data.lower[i] as number, beta);
    b[i] = Math.pow(data.upper[i] as number, beta);
  }
  return { a, b };
}

/** ℓ(λ) and its derivative for the transformed rows. */
function exponentialLikelihood(data: IntervalLifeData, x: { a: Float64Array; b: Float64Array }) {
  const ll = (lam: number): number => {
    const s = new CompensatedSum();
    for (let i = 0; i < x.a.length; i++) {
      const c = data.counts[i] as number;
      const a = x.a[i] as number;
      const b = x.b[i] as number;
      switch (data.kinds[i]) {
        case 'exact':
          s.add(c * (Math.log(lam) - lam * a));
          break;
        case 'right':
          s.add(-c * lam * a);
          break;
        case 'left':
          s.add(c * log1mexp(-lam * b));
          break;
        default:
          s.add(c * (-lam * a + log1mexp(-lam * (b - a))));
      }
    }
    return s.value;
  };
  const score = (lam: number): number => {
    const s = new CompensatedSum();
    for (let i = 0; i < x.a.length; i++) {
      const c = data.counts[i] as number;
      const a = x.a[i] as number;
      const b = x.b[i] as number;
      // d/dλ ln(1 − e^{−λw}) = w / expm1(λw).
      switch (data.kinds[i]) {
        case 'exact':
          s.add(c * (1 / lam - a));
          break;
        case 'right':
          s.add(-c * a);
          break;
        case 'left':
          s.add((c * b) / Math.expm1(lam * b));
          break;
        default:
          s.add(c * (-a + (b - a) / Math.expm1(lam * (b - a))));
      }
    }
    return s.value;
  };
  return { ll, score };
}

/** Find f's sign change above (grow) or below (shrink) `from`, on a log scale. */
function bracketFrom(f: (x: number) => number, from: number, grow: boolean): [number, number] {
  let lo = from;
  let hi = from;
  for (let k = 0; k < 200; k++) {
    if (grow) hi *= 2;
    else lo /= 2;
    const fl = f(lo);
    const fh = f(hi);
    if ((fl <= 0 && fh >= 0) || (fl >= 0 && fh <= 0)) return [lo, hi];
    if (grow) lo = hi;
    else hi = lo;
  }
  throw new InputError('The assumed-shape likelihood has no maximum for these data.', {}, 'not-computable');
}

export function weibayesInterval(data: IntervalLifeData, opts: WeibayesOptions): WeibayesResult {
  const beta = opts.shape;
  const C = opts.confidence ?? 0.9;
  if (!(beta > 0 && Number.isFinite(beta))) throw new InputError(`The assumed Weibull shape must be a number > 0, got ${String(beta)}.`, { value: String(beta) }, 'bad-option');
  if (!(C > 0 && C < 1)) throw new InputError(`The confidence must be in (0, 1), got ${String(C)}.`, { value: String(C) }, 'bad-option');
  if (data.failures === 0) throw new InputError('No failures: with suspensions only use the closed-form Weibayes bound (weibayes.ts).', {}, 'bad-option');
  const x = transformed(data, beta);
  const { ll, score } = exponentialLikelihood(data, x);
  // Start from the stand-in rate r / Σ (interval midpoints or running times)^β, then bracket the score's root.
  let E = 0;
  for (let i = 0; i < x.a.length; i++) E += (data.counts[i] as number) * (data.kinds[i] === 'left' ? (x.b[i] as number) / 2 : data.kinds[i] === 'interval' ? ((x.a[i] as number) + (x.b[i] as number)) / 2 : (x.a[i] as number));
  const start = data.failures / E;
  const grow = score(start) > 0;
  const [lo, hi] = bracketFrom(score, start, grow);
  const lam = findRoot(score, lo, hi, { relTol: 1e-13 }).root;
  const lmax = ll(lam);
  const z = normalQuantile(C);
  const drop = (l: number): number => lmax - ll(l) - (z * z) / 2;
  const [ulo, uhi] = bracketFrom(drop, lam, true);
  const lamUpper = findRoot(drop, ulo, uhi, { relTol: 1e-12 }).root;
  const scale = Math.pow(lam, -1 / beta);
  const scaleLower = Math.pow(lamUpper, -1 / beta);
  const bLives = (opts.bLifePercents ?? [10]).map((percent) => {
    const f = Math.pow(-Math.log1p(-percent / 100), 1 / beta);
    return { percent, estimate: scale * f, lower: scaleLower * f };
  });
  const reliability = (opts.reliabilityTimes ?? []).map((time) => ({ time, estimate: Math.exp(-Math.pow(time / scale, beta)), lower: Math.exp(-Math.pow(time / scaleLower, beta)) }));
  const pct = Number((100 * C).toPrecision(4));
  const r = data.failures;
  return {
    shape: beta,
    shapeIs: 'assumed',
    failures: r,
    units: data.n,
    exposure: Number.NaN,
    scale,
    scaleLower,
    scaleOneFailure: Number.NaN,
    confidence: C,
    degreesOfFreedom: 1,
    bLives,
    reliability,
    statement: `The Weibull shape β = ${beta} is ASSUMED (from experience or earlier data), not estimated from these data; every number below holds only if β is right. ${r} failure${r === 1 ? '' : 's'}, some known only to an inspection interval: the scale is the maximum-likelihood value given β and its lower bound is a likelihood-ratio (large-sample) bound, one-sided at ${pct} %, not the exact χ² bound of exact-time Weibayes.`,
    method: `Weibayes with inspection intervals: with β fixed, T^β is exponential; scale by maximum likelihood on the exact, left-, interval- and right-censored rows; lower bound where the log-likelihood has dropped by z²/2 (z = ${normalQuantile(C).toPrecision(4)}, one-sided ${pct} %)`,
    source: 'Nelson 1985, J. Quality Technology 17:140-146 (Weibayes); Meeker & Escobar 1998 §8.3 (likelihood-ratio bounds) [from memory]',
  };
}

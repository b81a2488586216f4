/**
 * Test planning: how many units, each tested for T = k·t, demonstrate a reliability R at time t
 * with confidence C, allowing at most r failures, for an assumed Weibull shape β.
 *
 * Derivation (binomial; common practice, the "success run" and its extension; e.g. Meeker & Escobar
 * 1998, §10.7 [from memory]):
 *  1. If the reliability at t is exactly R, a Weibull unit with shape β survives to T = k·t with
 *     probability R_T = exp(-(kt/η)^β) = R^{k^β}, because (t/η)^β = -ln R.
 *  2. The test passes when at most r of n units fail by T. The number failed is binomial (n, p)
 *     with p = 1 - R^{k^β}. To demonstrate R with confidence C, a population whose reliability is
 *     only R must pass with probability at most 1 - C:  Σ_{j≤r} C(n,j) p^j (1-p)^{n-j} ≤ 1 - C.
 *  3. With r = 0 this is R^{n k^β} ≤ 1 - C, so n = ln(1 - C) / (k^β ln R), rounded up; at k = 1,
 *     n = ln(1 - C) / ln R (e.g. R = 0.9, C = 0.9: n = 21.85 → 22 units).
 * Weibayes form (Nelson 1985, J. Quality Technology 17:140-146): the test passes when the
 * Weibayes lower bound of R(t) is at least R, i.e. n (kt)^β ≥ t^β χ²_{C; 2r+2} / (2(-ln R)), so
 * n = χ²_{C; 2r+2} / (2 k^β (-ln R)); with r = 0, χ²_{C; 2}/2 = -ln(1 - C) and it equals the
 * binomial form.
 */
import { InputError } from '../errors.js';
import { chiSquareIsf, lnGamma, log1mexp, logSumExp } from '../special/index.js';

export interface TestPlanInput {
  /** Reliability to demonstrate at `time`, in (0, 1). */
  readonly reliability: number;
  /** The time t (same unit as the test times). */
  readonly time: number;
  /** Confidence C, in (0, 1). */
  readonly confidence: number;
  /** Assumed Weibull shape β. */
  readonly shape: number;
  /** Failures allowed (default 0). */
  readonly failuresAllowed?: number;
  /** Test time per unit as multiples k of `time` (default 0.5, 1, 1.5, 2, 3). */
  readonly timeRatios?: readonly number[];
}

export interface TestPlanRow {
  /** k = test time / t. */
  readonly timeRatio: number;
  readonly testTime: number;
  /** Smallest n satisfying the binomial rule. */
  readonly unitsBinomial: number;
  /** The Weibayes rule's n (continuous value before rounding up, and rounded). */
  readonly unitsWeibayesExact: number;
  readonly unitsWeibayes: number;
  /** The zero-failure closed form ln(1 - C)/(k^β ln R) before rounding (only when r = 0). */
  readonly unitsZeroFailureExact: number | null;
}

export interface TestPlan {
  readonly input: Required<TestPlanInput>;
  readonly rows: readonly TestPlanRow[];
  readonly derivation: readonly string[];
  readonly cautions: readonly string[];
  readonly source: string;
}

/** ln P(X ≤ r) for X ~ binomial(n, p), given ln p and ln(1 - p). */
export function logBinomialCdf(r: number, n: number, logP: number, logQ: number): number {
  const terms: number[] = [];
  for (let j = 0; j <= Math.min(r, n); j++) {
    const lc = lnGamma(n + 1) - lnGamma(j + 1) - lnGamma(n - j + 1);
    terms.push(lc + (j === 0 ? 0 : j * logP) + (n - j === 0 ? 0 : (n - j) * logQ));
  }
  return logSumExp(terms);
}

/** Smallest n with P(at most r failures) ≤ 1 - C when each unit survives the test with ln-probability logSurvive. */
export function binomialUnits(r: number, logSurvive: number, confidence: number): number {
  const logTarget = Math.log1p(-confidence);
  const logP = log1mexp(logSurvive);
  const passes = (n: number) => logBinomialCdf(r, n, logP, logSurvive) <= logTarget;
  let hi = Math.max(r + 1, 1);
  while (!passes(hi)) {
    hi *= 2;
    if (hi > 1e9) return Number.POSITIVE_INFINITY;
  }
  let lo = r; // P(X ≤ r) = 1 at n = r: never passes.
  while (hi - lo > 1) {
    const mid = Math.floor((lo + hi) / 2);
    if (passes(mid)) hi = mid;
    else lo = mid;
  }
  return hi;
}

export function planTest(input: TestPlanInput): TestPlan {
  const { reliability: R, time: t, confidence: C, shape: beta } = input;
  const r = input.failuresAllowed ?? 0;
  const ratios = input.timeRatios ?? [0.5, 1, 1.5, 2, 3];
  const bad = (what: string, v: number) => new InputError(`Test plan: ${what}, got ${String(v)}.`, { value: String(v) }, 'bad-option');
  if (!(R > 0 && R < 1)) throw bad('the reliability must be in (0, 1)', R);
  if (!(C > 0 && C < 1)) throw bad('the confidence must be in (0, 1)', C);
  if (!(t > 0 && Number.isFinite(t))) throw bad('the time must be > 0', t);
  if (!(beta > 0 && Number.isFinite(beta))) throw bad('the assumed shape must be > 0', beta);
  if (!(Number.isInteger(r) && r >= 0)) throw bad('the failures allowed must be a whole number ≥ 0', r);
  for (const k of ratios) if (!(k > 0 && Number.isFinite(k))) throw bad('each test-time ratio must be > 0', k);
  const lnR = Math.log(R);
  const chi = chiSquareIsf(1 - C, 2 * r + 2);
  const rows = ratios.map((k) => {
    const kb = Math.pow(k, beta);
    const weibayesExact = chi / (2 * kb * -lnR);
    const zeroExact = r === 0 ? Math.log1p(-C) / (kb * lnR) : null;
    return {
      timeRatio: k,
      testTime: k * t,
      unitsBinomial: binomialUnits(r, kb * lnR, C),
      unitsWeibayesExact: weibayesExact,
      unitsWeibayes: Math.ceil(weibayesExact - 1e-12 * weibayesExact),
      unitsZeroFailureExact: zeroExact,
    };
  });
  const pc = (x: number) => `${Number((100 * x).toPrecision(6))} %`;
  return {
    input: { reliability: R, time: t, confidence: C, shape: beta, failuresAllowed: r, timeRatios: ratios },
    rows,
    derivation: [
      `If the reliability at t = ${t} is exactly R = ${R}, a unit with Weibull shape β = ${beta} survives a test of k·t with probability R^(k^β).`,
      `The test passes with at most r = ${r} failure${r === 1 ? '' : 's'} among n units; the number failed is binomial(n, 1 - R^(k^β)).`,
      `Demonstrating R at ${pc(C)} confidence means a population at exactly R passes with probability ≤ 1 - C = ${Number((1 - C).toPrecision(6))}; n is the smallest such number.`,
      r === 0
        ? `With no failures allowed: R^(n k^β) ≤ 1 - C, so n = ln(1 - C) / (k^β ln R); at k = 1, n = ln(${Number((1 - C).toPrecision(6))}) / ln(${R}) = ${Number((Math.log1p(-C) / lnR).toPrecision(6))}, rounded up to ${Math.ceil(Math.log1p(-C) / lnR - 1e-12)}.`
        : `With r failures allowed the binomial sum is solved for n; the Weibayes form n = χ²(C; 2r+2) / (2 k^β (-ln R)) with χ²(${pc(C)}; ${2 * r + 2}) = ${Number(chi.toPrecision(6))} is shown beside it.`,
    ],
    cautions: [
      `The plan holds only if the Weibull shape is β = ${beta}: the shape is assumed, not measured. With k > 1 a shape that is really smaller than assumed makes the test weaker than it looks; with k < 1 a larger one does.`,
      'The test units must fail by the same mechanisms, under the same loads and environment, as units in service; a demonstration does not cover failure modes the test cannot excite.',
      'Where the demonstrated reliability supports a safety decision, follow the governing codes and standards and have the plan reviewed under licensed practice.',
    ],
    source: 'binomial success run (common practice); Weibayes form: Nelson 1985, J. Quality Technology 17:140-146',
  };
}

/**
 * Data for the L-moment ratio diagram (L-skewness τ3 against L-kurtosis τ4; Hosking 1990 §5;
 * Hosking & Wallis 1997 §2.5 and App. A [from memory]): the sample's point and each
 * three-parameter family's curve τ4(τ3), with the two-parameter families as points.
 *   GEV (Hosking's k):  τ3 = 2(1 − 3^{−k})/(1 − 2^{−k}) − 3,
 *                        τ4 = [5(1 − 4^{−k}) − 10(1 − 3^{−k}) + 6(1 − 2^{−k})]/(1 − 2^{−k});
 *   generalized logistic: τ4 = (1 + 5τ3²)/6;
 *   generalized Pareto:   τ4 = τ3(1 + 5τ3)/(5 + τ3);
 *   Pearson III:          τ4 ≈ 0.1224 + 0.30115τ3² + 0.95812τ3⁴ − 0.57488τ3⁶ + 0.19383τ3⁸
 *                         (Hosking's polynomial approximation);
 *   points: normal (0, 0.1226), Gumbel (0.1699, 0.1504), exponential (1/3, 1/6), logistic (0, 1/6);
 *   the bound τ4 ≥ (5τ3² − 1)/4 of every distribution.
 * test/lmoments/ratio-diagram.test.ts checks each curve by quadrature of the family's quantile function.
 */
import { sampleLMoments } from './sample-lmoments.js';

export interface RatioPoint {
  readonly t3: number;
  readonly t4: number;
}

export interface RatioDiagram {
  readonly sample: RatioPoint & { readonly n: number };
  readonly curves: readonly { readonly family: 'gev' | 'genlogistic' | 'genpareto' | 'pearson3' | 'bound'; readonly label: string; readonly points: readonly RatioPoint[] }[];
  readonly points: readonly { readonly family: string; readonly label: string; readonly t3: number; readonly t4: number }[];
}

/** GEV (τ3, τ4) at Hosking's shape k > −1. */
export function gevRatios(k: number): RatioPoint {
  if (Math.abs(k) < 1e-8) return { t3: (2 * Math.log(3)) / Math.LN2 - 3, t4: (5 * Math.log(4) - 10 * Math.log(3) + 6 * Math.LN2) / Math.LN2 };
  const e = (b: number) => -Math.expm1(-k * Math.log(b)); // 1 − b^{−k}
  return { t3: (2 * e(3)) / e(2) - 3, t4: (5 * e(4) - 10 * e(3) + 6 * e(2)) / e(2) };
}

export function gloT4(t3: number): number {
  return (1 + 5 * t3 * t3) / 6;
}

export function gpaT4(t3: number): number {
  return (t3 * (1 + 5 * t3)) / (5 + t3);
}

export function pe3T4(t3: number): number {
  const x = t3 * t3;
  return 0.1224 + x * (0.30115 + x * (0.95812 + x * (-0.57488 + x * 0.19383)));
}

/** Diagram data for a sample (ascending or not; n ≥ 5) on a grid of τ3 from −0.6 to 0.9. */
export function ratioDiagram(values: ArrayLike<number>, gridPoints = 61): RatioDiagram {
  const sorted = Float64Array.from(values).sort();
  const lm = sampleLMoments(sorted);
  const grid = Array.from({ length: gridPoints }, (_, i) => -0.6 + (1.5 * i) / (gridPoints - 1));
  // GEV is parametrised by k; k from 2.5 down to −0.9 covers τ3 ≈ −0.6 … 0.93.
  const gev: RatioPoint[] = [];
  for (let i = 0; i < gridPoints; i++) gev.push(gevRatios(2.5 - (3.4 * i) / (gridPoints - 1)));
  return {
    sample: { t3: lm.t3, t4: lm.t4, n: lm.n },
    curves: [
      { family: 'gev', label: 'generalized extreme value', points: gev },
      { family: 'genlogistic', label: 'generalized logistic', points: grid.map((t3) => ({ t3, t4: gloT4(t3) })) },
      { family: 'genpareto', label: 'generalized Pareto', points: grid.map((t3) => ({ t3, t4: gpaT4(t3) })) },
      { family: 'pearson3', label: 'Pearson type III', points: grid.map((t3) => ({ t3, t4: pe3T4(t3) })) },
      { family: 'bound', label: 'lower bound of all distributions', points: grid.map((t3) => ({ t3, t4: (5 * t3 * t3 - 1) / 4 })) },
    ],
    points: [
      { family: 'normal', label: 'normal', t3: 0, t4: 30 * Math.atan(Math.SQRT2) / Math.PI - 9 },
      { family: 'gumbel', label: 'Gumbel', ...gevRatios(0) },
      { family: 'exponential', label: 'exponential', t3: 1 / 3, t4: 1 / 6 },
      { family: 'logistic', label: 'logistic', t3: 0, t4: 1 / 6 },
    ],
  };
}

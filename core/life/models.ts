/**
 * Per-family details the life-data module needs beyond the Family interface: the transforms for
 * the optimiser, a starting point, and the reparametrisation that replaces one parameter by a
 * quantile x_p (so that a quantile, a B-life or a reliability can be profiled as if it were a
 * parameter; Lawless 2003, §B.4 and §5.1.2):
 *   Weibull, gamma: scale = x_p / Q₁(p), Q₁ the quantile at scale 1;
 *   exponential: rate = Q₁(p) / x_p;   normal: mean = x_p - sd·z_p;   lognormal: meanlog = ln x_p - sdlog·z_p.
 */
import { getFamily, type FamilyName, type Parameters } from '../families/index.js';
import { IDENTITY, LOG, type Transform } from '../optimize/index.js';

export type LifeFamilyName = 'normal' | 'lognormal' | 'gamma' | 'weibull' | 'exponential';

export const LIFE_FAMILIES: readonly LifeFamilyName[] = ['weibull', 'lognormal', 'gamma', 'normal', 'exponential'];

export interface LifeModel {
  readonly name: LifeFamilyName;
  /** Parameter names in the Family's order. */
  readonly names: readonly string[];
  readonly transforms: readonly Transform[];
  /** Whether quantiles are positive (profiled and Wald-bounded on the log scale) or any real. */
  readonly quantileScale: 'log' | 'linear';
  /** Index of the parameter that the quantile replaces. */
  readonly replaced: number;
  /** Full parameters from the others (in order, without `replaced`), p and x_p. */
  fromQuantile(others: readonly number[], p: number, xp: number): Parameters;
}

function standardQuantile(fam: FamilyName, params: Parameters, p: number): number {
  return getFamily(fam).make(params).quantile(p);
}

const MODELS: Record<LifeFamilyName, LifeModel> = {
  weibull: {
    name: 'weibull',
    quantileScale: 'log',
    names: ['shape', 'scale'],
    transforms: [LOG, LOG],
    replaced: 1,
    fromQuantile: ([shape], p, xp) => ({ shape: shape as number, scale: xp / Math.pow(-Math.log1p(-p), 1 / (shape as number)) }),
  },
  gamma: {
    name: 'gamma',
    quantileScale: 'log',
    names: ['shape', 'scale'],
    transforms: [LOG, LOG],
    replaced: 1,
    fromQuantile: ([shape], p, xp) => ({ shape: shape as number, scale: xp / standardQuantile('gamma', { shape: shape as number, scale: 1 }, p) }),
  },
  exponential: {
    name: 'exponential',
    quantileScale: 'log',
    names: ['rate'],
    transforms: [LOG],
    replaced: 0,
    fromQuantile: (_o, p, xp) => ({ rate: -Math.log1p(-p) / xp }),
  },
  normal: {
    name: 'normal',
    quantileScale: 'linear',
    names: ['mean', 'sd'],
    transforms: [IDENTITY, LOG],
    replaced: 0,
    fromQuantile: ([sd], p, xp) => ({ mean: xp - (sd as number) * standardQuantile('normal', { mean: 0, sd: 1 }, p), sd: sd as number }),
  },
  lognormal: {
    name: 'lognormal',
    quantileScale: 'log',
    names: ['meanlog', 'sdlog'],
    transforms: [IDENTITY, LOG],
    replaced: 0,
    fromQuantile: ([sdlog], p, xp) => ({
      meanlog: Math.log(xp) - (sdlog as number) * standardQuantile('normal', { mean: 0, sd: 1 }, p),
      sdlog: sdlog as number,
    }),
  },
};

export function lifeModel(name: LifeFamilyName): LifeModel {
  return MODELS[name];
}

export function toVector(model: LifeModel, p: Parameters): Float64Array {
  return Float64Array.from(model.names.map((k) => p[k] as number));
}

export function toParameters(model: LifeModel, v: ArrayLike<number>): Parameters {
  const out: Record<string, number> = {};
  model.names.forEach((k, i) => (out[k] = v[i] as number));
  return out;
}

/**
 * The process model a capability number is computed under, as a serialisable description (so a
 * bootstrap range can run on a worker) and as a distribution (cdf, sf, quantile, isf):
 * - 'boxcox': y(λ) ~ Normal(mean, sd) on the Box–Cox scale (boxcox.ts). For λ ≠ 0 the normal puts
 *   a (usually negligible) mass Φ((-1/λ - mean)/sd) (λ > 0) outside the transform's range; the
 *   model is that normal truncated to the range (`outsideRange` is the mass removed).
 * - 'johnson': z = γ + δ f((x - ξ)/λ) ~ Normal(0, 1) (johnson.ts).
 * - 'family': a fitted family of core/families.
 */
import { getFamily, type FamilyName, type Parameters } from '../families/index.js';
import type { Rng } from '../random/index.js';
import { normalCdf, normalQuantile } from '../special/index.js';
import { boxCoxInverse, boxCoxRange, boxCoxTransform } from './boxcox.js';
import { johnsonSupport, johnsonX, johnsonZ, type JohnsonType } from './johnson.js';
import type { QuantileModel } from './percentile.js';

export type ModelSpec =
  | { readonly kind: 'boxcox'; readonly lambda: number; readonly mean: number; readonly sd: number }
  | { readonly kind: 'johnson'; readonly type: JohnsonType; readonly gamma: number; readonly delta: number; readonly xi: number; readonly lambda: number }
  | { readonly kind: 'family'; readonly family: FamilyName; readonly parameters: Parameters };

export interface CapabilityModel extends QuantileModel {
  readonly spec: ModelSpec;
  /** Support of x: (lower, upper), ±Infinity where unbounded. */
  readonly support: { readonly lower: number; readonly upper: number };
  cdf(x: number): number;
  sf(x: number): number;
  /** n values drawn with `rng`. */
  draw(rng: Rng, n: number): Float64Array;
}

/** The support in words, e.g. "x > 0", "3.1 < x < 7.9", "all real x". */
export function supportText(s: { readonly lower: number; readonly upper: number }): string {
  const fmt = (v: number): string => String(Number(v.toPrecision(6)));
  const lo = Number.isFinite(s.lower);
  const hi = Number.isFinite(s.upper);
  if (lo && hi) return `${fmt(s.lower)} < x < ${fmt(s.upper)}`;
  if (lo) return `x > ${fmt(s.lower)}`;
  if (hi) return `x < ${fmt(s.upper)}`;
  return 'all real x';
}

function boxCoxModel(spec: Extract<ModelSpec, { kind: 'boxcox' }>): CapabilityModel {
  const { lambda, mean, sd } = spec;
  const range = boxCoxRange(lambda);
  // Mass of the untruncated normal inside the range, below it and above it.
  const below = Number.isFinite(range.lower) ? normalCdf((range.lower - mean) / sd) : 0;
  const above = Number.isFinite(range.upper) ? normalCdf((mean - range.upper) / sd) : 0;
  const inside = 1 - below - above;
  const zOf = (x: number): number => (boxCoxTransform(x, lambda) - mean) / sd;
  const cdf = (x: number): number => (x <= 0 ? 0 : x === Number.POSITIVE_INFINITY ? 1 : Math.max(0, normalCdf(zOf(x)) - below) / inside);
  const sf = (x: number): number => (x <= 0 ? 1 : x === Number.POSITIVE_INFINITY ? 0 : Math.max(0, normalCdf(-zOf(x)) - above) / inside);
  const quantile = (p: number): number => boxCoxInverse(mean + sd * normalQuantile(below + p * inside), lambda);
  const isf = (q: number): number => boxCoxInverse(mean - sd * normalQuantile(above + q * inside), lambda);
  return {
    spec,
    family: 'Box–Cox normal',
    parameters: { lambda, mean, sd },
    support: { lower: 0, upper: Number.POSITIVE_INFINITY },
    cdf,
    sf,
    quantile,
    isf,
    draw: (rng, n) => {
      const out = new Float64Array(n);
      for (let i = 0; i < n; i++) {
        // the normal truncated to the transform's range, by rejection (the mass outside is tiny)
        let x = 0;
        for (let k = 0; k < 1000 && !(x > 0 && Number.isFinite(x)); k++) x = boxCoxInverse(mean + sd * rng.normal(), lambda);
        out[i] = x;
      }
      return out;
    },
  };
}

function johnsonModel(spec: Extract<ModelSpec, { kind: 'johnson' }>): CapabilityModel {
  const p = spec;
  return {
    spec,
    family: `Johnson ${p.type}`,
    parameters: { gamma: p.gamma, delta: p.delta, xi: p.xi, lambda: p.lambda },
    support: johnsonSupport(p),
    cdf: (x) => normalCdf(johnsonZ(p, x)),
    sf: (x) => normalCdf(-johnsonZ(p, x)),
    quantile: (q) => johnsonX(p, normalQuantile(q)),
    isf: (q) => johnsonX(p, -normalQuantile(q)),
    draw: (rng, n) => {
      const out = new Float64Array(n);
      for (let i = 0; i < n; i++) out[i] = johnsonX(p, rng.normal());
      return out;
    },
  };
}

function familyModel(spec: Extract<ModelSpec, { kind: 'family' }>): CapabilityModel {
  const fam = getFamily(spec.family);
  const d = fam.make(spec.parameters);
  return {
    spec,
    family: spec.family,
    parameters: d.parameters,
    support: { lower: d.support.lower, upper: d.support.upper },
    cdf: (x) => d.cdf(x),
    sf: (x) => d.sf(x),
    quantile: (q) => d.quantile(q),
    isf: (q) => d.isf(q),
    draw: (rng, n) => fam.random(spec.parameters, rng, n),
  };
}

export function makeModel(spec: ModelSpec): CapabilityModel {
  if (spec.kind === 'boxcox') return boxCoxModel(spec);
  if (spec.kind === 'johnson') return johnsonModel(spec);
  return familyModel(spec);
}

/** The mass of a Box–Cox model's normal that lies outside the transform's range (0 for the other kinds). */
export function massOutsideRange(spec: ModelSpec): number {
  if (spec.kind !== 'boxcox') return 0;
  const r = boxCoxRange(spec.lambda);
  return (Number.isFinite(r.lower) ? normalCdf((r.lower - spec.mean) / spec.sd) : 0) + (Number.isFinite(r.upper) ? normalCdf((spec.mean - r.upper) / spec.sd) : 0);
}

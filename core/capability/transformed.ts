/**
 * Capability on a transformation to normality: the data and the specification limits are put
 * through the same fitted transformation (Box–Cox or Johnson), the Anderson–Darling normality test is
 * repeated on the transformed values, and the indices are computed there:
 * - on the transformed scale, the normal-theory Pp/Ppk (indices.ts) of the transformed values
 *   against the transformed limits;
 * - in the original units, the ISO 22514-2 percentile indices of the back-transformed model
 *   (percentile.ts), whose parametric-bootstrap interval is bootstrap.ts;
 * - ppm out of spec from the model's cdf and survival function at the original limits.
 * A limit outside the model's support (a Box–Cox lower limit ≤ 0, a Johnson SB/SL limit beyond its
 * bounds) has no tail beyond it: it is dropped from the indices with a note, never invented.
 * The A² p-value on transformed values treats the transformation as known; estimating it makes the
 * test somewhat lenient (stated in `normality.caveat`).
 */
import { CompensatedSum } from '../compensated.js';
import { normal } from '../families/index.js';
import { andersonDarlingStatistic, tablePValue } from '../gof/index.js';
import { prepareSample } from '../sample.js';
import { boxCoxTransform, fitBoxCox } from './boxcox.js';
import { normalIndices, type IndexEstimate, type SpecLimits } from './indices.js';
import { fitJohnson, johnsonZ, type JohnsonType } from './johnson.js';
import { makeModel, massOutsideRange, supportText, type ModelSpec } from './model.js';
import { percentileCapability, type PercentileCapability } from './percentile.js';
import { ppmOutOfSpec, type PpmOutOfSpec } from './ppm.js';
import { transformedMoments } from './fit-model.js';

export type TransformKind = 'none' | 'boxcox' | 'johnson';

export interface TransformNormality {
  readonly statistic: number;
  readonly pValue: number;
  readonly pValueIs: 'estimate' | 'upper-bound' | 'lower-bound';
  readonly alpha: number;
  readonly passes: boolean;
  readonly method: string;
  readonly caveat: string;
}

export interface TransformedCapability {
  readonly kind: 'boxcox' | 'johnson';
  /** Box–Cox λ̂ and its profile-likelihood interval (null ends: not reached within |λ| ≤ 20). */
  readonly lambda?: number;
  readonly lambdaInterval?: { readonly lower: number | null; readonly upper: number | null; readonly confidence: number };
  /** Johnson curve type and parameters (z = γ + δ f((x - ξ)/λ)). */
  readonly type?: JohnsonType;
  readonly parameters?: { readonly gamma: number; readonly delta: number; readonly xi: number; readonly lambda: number };
  readonly johnsonRatio?: number;
  readonly model: ModelSpec;
  /** The limits on the transformed scale; null where absent or outside the model's support. */
  readonly transformedLimits: SpecLimits;
  readonly transformedMean: number;
  readonly transformedSd: number;
  readonly normality: TransformNormality;
  /** Normal-theory Pp/Ppk/Ppu/Ppl of the transformed values (sigma: their standard deviation, n - 1). */
  readonly indices: readonly IndexEstimate[];
  /** ISO 22514-2 percentile indices in the original units under the back-transformed model. */
  readonly percentile: PercentileCapability;
  readonly ppm: PpmOutOfSpec;
  readonly support: { readonly lower: number; readonly upper: number; readonly text: string };
  readonly notes: readonly string[];
  readonly method: string;
}

function normalityOf(z: Float64Array, alpha: number): TransformNormality {
  const sorted = Float64Array.from(z).sort();
  const sample = prepareSample(sorted, { alreadySorted: true });
  const fit = normal.fit(sample);
  if (!fit.ok) throw new Error('normal fit of transformed values failed');
  const a2 = andersonDarlingStatistic(normal.make(fit.parameters), sorted);
  const p = tablePValue('normal', fit.parameters, sample, a2);
  const pValue = p?.pValue ?? Number.NaN;
  return {
    statistic: a2,
    pValue,
    pValueIs: p?.pValueIs ?? 'estimate',
    alpha,
    passes: pValue > alpha,
    method: `Anderson–Darling A² of the transformed values against the normal with estimated mean and sd; ${p?.methodDetail ?? ''}`.trim(),
    caveat: 'The transformation was fitted to the same data, so the p-value treats it as known and is somewhat too large (the test is lenient).',
  };
}

/** Capability after a Box–Cox or Johnson transformation of positive/any values (ascending order not required). */
export function transformedCapability(values: ArrayLike<number>, kind: 'boxcox' | 'johnson', limits: SpecLimits, alpha = 0.05): TransformedCapability {
  const n = values.length;
  const sorted = Float64Array.from(values as ArrayLike<number>).sort();
  const notes: string[] = [];
  let model: ModelSpec;
  let zOf: (x: number) => number;
  let extra: Partial<TransformedCapability> = {};
  let method: string;
  if (kind === 'boxcox') {
    const fit = fitBoxCox(sorted, alpha);
    const m = transformedMoments(sorted, fit.lambda);
    model = { kind: 'boxcox', lambda: fit.lambda, ...m };
    zOf = (x) => (x > 0 ? boxCoxTransform(x, fit.lambda) : Number.NEGATIVE_INFINITY);
    extra = { lambda: fit.lambda, lambdaInterval: { lower: fit.lower, upper: fit.upper, confidence: fit.confidence } };
    method = `${fit.method}; the normal model on y(λ̂) with the mean and standard deviation (n - 1) of y`;
    if (fit.lower === null || fit.upper === null) notes.push('The likelihood of λ is too flat to bound it on at least one side within |λ| ≤ 20; the data say little about the shape.');
    const outside = massOutsideRange(model);
    if (outside > 1e-9) notes.push(`The normal on the Box–Cox scale puts ${(outside * 1e6).toPrecision(3)} ppm outside the transform's range; the model is that normal truncated to it.`);
  } else {
    const fit = fitJohnson(sorted);
    model = { kind: 'johnson', type: fit.type, gamma: fit.gamma, delta: fit.delta, xi: fit.xi, lambda: fit.lambda };
    zOf = (x) => johnsonZ(fit, x);
    extra = { type: fit.type, parameters: { gamma: fit.gamma, delta: fit.delta, xi: fit.xi, lambda: fit.lambda }, johnsonRatio: fit.ratio };
    method = fit.method;
  }
  const dist = makeModel(model);
  const z = new Float64Array(n);
  for (let i = 0; i < n; i++) z[i] = zOf(sorted[i] as number);
  if (!z.every(Number.isFinite)) {
    notes.push('Some values fall on or outside the fitted curve\'s bounds (transformed to ±∞); the normality test and the transformed-scale indices use the others.');
  }
  const zFinite = z.filter(Number.isFinite);
  const s = new CompensatedSum();
  for (const v of zFinite) s.add(v);
  const zMean = s.value / zFinite.length;
  const ss = new CompensatedSum();
  for (const v of zFinite) ss.add((v - zMean) * (v - zMean));
  const zSd = Math.sqrt(ss.value / (zFinite.length - 1));

  const inSupport = (v: number | null, side: 'lower' | 'upper'): number | null => {
    if (v === null) return null;
    const t = zOf(v);
    if (Number.isFinite(t)) return t;
    notes.push(
      `The ${side} specification limit ${v} lies outside the model's support (${supportText(dist.support)}): the model has no ${side} tail beyond it, so no ${side}-side index or ppm is computed for it.`,
    );
    return null;
  };
  const tl = inSupport(limits.lsl, 'lower');
  const tu = inSupport(limits.usl, 'upper');
  const transformedLimits: SpecLimits = { lsl: tl, usl: tu };
  // The percentile indices and ppm use only the limits that have a tail under the model.
  const effective: SpecLimits = { lsl: tl === null ? null : limits.lsl, usl: tu === null ? null : limits.usl };
  const indices = tl === null && tu === null ? [] : normalIndices(zMean, zSd, transformedLimits, zFinite.length, zFinite.length - 1, alpha, true);
  const percentile = percentileCapability(dist, effective);
  return {
    kind,
    ...extra,
    model,
    transformedLimits,
    transformedMean: zMean,
    transformedSd: zSd,
    normality: normalityOf(zFinite, alpha),
    indices,
    percentile,
    ppm: ppmOutOfSpec(dist, effective.lsl, effective.usl),
    support: { ...dist.support, text: supportText(dist.support) },
    notes,
    method,
  };
}

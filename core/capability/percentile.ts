/**
 * Capability of a non-normal fitted model by the percentile method of ISO 22514-2 (the formulas
 * below from memory, the standard not read; no worked example of it was found,
 * test/capability/worked-example.test.ts): the 6σ spread
 * of the normal case is replaced by the distance between the fitted 0.135 % and 99.865 %
 * quantiles, and the mean by the fitted median X50:
 *   Pp  = (USL - LSL) / (X99.865 - X0.135)
 *   Ppu = (USL - X50) / (X99.865 - X50),   Ppl = (X50 - LSL) / (X50 - X0.135),   Ppk = min.
 * The upper quantile is taken with the model's inverse survival function, so it is accurate.
 * The interval is a parametric bootstrap refitting each replicate (bootstrap.ts).
 */
import type { Distribution } from '../families/index.js';
import type { SpecLimits } from './indices.js';

/** The tail probability of the percentile method, 0.135 % (the normal's 3σ tail rounded). */
export const PERCENTILE_TAIL = 0.00135;

export interface PercentileIndex {
  readonly name: 'Pp' | 'Ppk' | 'Ppu' | 'Ppl';
  readonly estimate: number;
}

export interface PercentileCapability {
  readonly family: string;
  readonly parameters: Readonly<Record<string, number>>;
  /** Fitted X0.135, X50, X99.865. */
  readonly lowerQuantile: number;
  readonly median: number;
  readonly upperQuantile: number;
  readonly indices: readonly PercentileIndex[];
  readonly method: string;
}

/** What the percentile method needs of a model: its name, parameters and the two quantile functions. */
export type QuantileModel = Pick<Distribution, 'quantile' | 'isf'> & { readonly family: string; readonly parameters: Readonly<Record<string, number>> };

export function percentileCapability(dist: QuantileModel, limits: SpecLimits): PercentileCapability {
  const lo = dist.quantile(PERCENTILE_TAIL);
  const med = dist.quantile(0.5);
  const hi = dist.isf(PERCENTILE_TAIL);
  const { lsl, usl } = limits;
  const indices: PercentileIndex[] = [];
  if (lsl !== null && usl !== null) indices.push({ name: 'Pp', estimate: (usl - lsl) / (hi - lo) });
  const pu = usl !== null ? (usl - med) / (hi - med) : null;
  const pl = lsl !== null ? (med - lsl) / (med - lo) : null;
  const pk = pu === null ? pl : pl === null ? pu : Math.min(pu, pl);
  if (pk !== null) indices.push({ name: 'Ppk', estimate: pk });
  if (pu !== null) indices.push({ name: 'Ppu', estimate: pu });
  if (pl !== null) indices.push({ name: 'Ppl', estimate: pl });
  return {
    family: dist.family,
    parameters: dist.parameters,
    lowerQuantile: lo,
    median: med,
    upperQuantile: hi,
    indices,
    method: 'percentile method (ISO 22514-2): fitted quantiles at 0.135 % and 99.865 % and the median',
  };
}

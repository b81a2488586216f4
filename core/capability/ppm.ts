/**
 * Expected nonconforming fraction of a fitted model, in parts per million: below the lower limit
 * F(LSL) from the cdf, above the upper limit S(USL) from the survival function directly (never
 * 1 - F), so that a far tail (say 1e-9) keeps its full relative accuracy.
 */
import type { Distribution } from '../families/index.js';

export interface PpmOutOfSpec {
  /** 1e6·F(LSL); 0 when there is no lower limit. */
  readonly belowLsl: number;
  /** 1e6·S(USL); 0 when there is no upper limit. */
  readonly aboveUsl: number;
  readonly total: number;
}

export function ppmOutOfSpec(
  dist: Pick<Distribution, 'cdf' | 'sf'>,
  lsl: number | null | undefined,
  usl: number | null | undefined,
): PpmOutOfSpec {
  const below = lsl === null || lsl === undefined ? 0 : 1e6 * dist.cdf(lsl);
  const above = usl === null || usl === undefined ? 0 : 1e6 * dist.sf(usl);
  return { belowLsl: below, aboveUsl: above, total: below + above };
}

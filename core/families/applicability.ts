/**
 * Whether a family can be fitted to a sample: the checks shared by all five families. A family is
 * reported as not applicable (never thrown, never silently dropped) when some values lie outside
 * its support, when there are fewer than 2 values, or when every value is the same.
 *
 * The positive families (lognormal, gamma, Weibull, exponential) all require every value > 0.
 * Zero is excluded even for the exponential, whose density is finite there, so that all
 * candidates ranked by AICc are fitted to the same values (common practice, no source).
 */
import type { Sample } from '../sample.js';
import type { FamilyName, NotApplicable } from './types.js';

function plural(n: number, one: string, many: string): string {
  return `${n} ${n === 1 ? one : many}`;
}

export function checkApplicable(
  family: FamilyName,
  label: string,
  sample: Sample,
  support: 'real' | 'positive',
): NotApplicable | null {
  if (support === 'positive' && sample.nonPositive > 0) {
    const what =
      sample.negative === 0 ? 'zero' : sample.zeros === 0 ? 'negative' : 'zero or negative';
    return {
      ok: false,
      family,
      reason: `${plural(sample.nonPositive, 'value is', 'values are')} ${what}; the ${label} model needs every value > 0`,
      offendingCount: sample.nonPositive,
    };
  }
  if (sample.n < 2) {
    return {
      ok: false,
      family,
      reason: `the ${label} model needs at least 2 values; the sample has ${sample.n}`,
      offendingCount: 0,
    };
  }
  if (sample.distinct === 1) {
    return {
      ok: false,
      family,
      reason: `all ${sample.n} values are equal (${String(sample.min)}); there is no spread to fit a ${label} model`,
      offendingCount: 0,
    };
  }
  return null;
}

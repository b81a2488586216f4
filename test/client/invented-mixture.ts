/**
 * Invented life data for the mixture checks (test/client/life-recorded.test.ts and
 * test/browser/life-modes-bounds.test.ts): 4 early failures (40-110 h), 14 later failures at the
 * Weibull(shape 3.5, scale 1000 h) quantiles of (i + 0.7)/14.4, and 4 units still running at 1400 h.
 * The two-subpopulation mixture fits best by AICc but its early subpopulation has about 3 failures,
 * so the core flags it as not identified (core/life/mixture.ts). Invented for the checks; no source.
 */
const EARLY = [40, 62, 85, 110];
const LATE = Array.from({ length: 14 }, (_, i) => Number((1000 * Math.pow(-Math.log(1 - (i + 0.7) / 14.4), 1 / 3.5)).toFixed(1)));

export const FEW_EARLY: { readonly times: readonly number[]; readonly failed: readonly number[] } = {
  times: [...EARLY, ...LATE, 1400, 1400, 1400, 1400],
  failed: [...EARLY.map(() => 1), ...LATE.map(() => 1), 0, 0, 0, 0],
};

/** The data as a CSV with a unit, an hours and a status column. */
export function fewEarlyCsv(): string {
  return `unit,hours,status\n${FEW_EARLY.times.map((t, i) => `U${i + 1},${t},${FEW_EARLY.failed[i]}`).join('\n')}\n`;
}

/**
 * Invented series for the run-rule charts (test/client/charts-control.test.ts and
 * test/browser/run-rules.test.ts): a fill weight in grams with a small oscillating noise (24 values,
 * no run signal under Western Electric rules 1-4), then 12 values after a shift up of about one
 * sigma, which complete rules 2, 3 and 4 with no point beyond the 3-sigma limits (the core's
 * verdict, core/capability/run-rules.ts). Invented for the checks; no source.
 */
const NOISE = [0.3, -0.5, 0.8, -0.2, -0.9, 0.4, 0.1, -0.6, 0.7, -0.3, 0.5, -0.8, 0.2, 0.6, -0.4, -0.1, 0.9, -0.7, 0.3, -0.2, 0.4, -0.5, 0.1, -0.3];
export const STEADY: readonly number[] = NOISE.map((e) => 50 + e);
export const SHIFTED: readonly number[] = [...STEADY, ...[0.5, 0.9, 0.2, 0.8, 1.6, 0.3, 1.5, 0.7, 0.3, 0.9, 0.6, 0.5].map((e) => 50.6 + e)];

/** A CSV of the series with an order column first (the page is told to use it), values to 0.01 g. */
export function runCsv(values: readonly number[]): string {
  return `order,fill_g\n${values.map((v, i) => `${i + 1},${v.toFixed(2)}`).join('\n')}\n`;
}

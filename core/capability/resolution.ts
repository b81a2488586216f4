/**
 * Measurement-resolution check. Values read from a coarse gauge fall on a grid, so many are tied.
 * Ties put several observations at the same fitted probability, which inflates the
 * Anderson–Darling statistic (the empirical cdf jumps in steps the model cannot follow) and can
 * reject a model that describes the process well.
 *
 * Detected (thresholds are common practice, no source):
 * - the common grid step: the approximate greatest common divisor of the gaps between distinct
 *   sorted values (Euclid's algorithm with a tolerance of 1e-6 of the smallest gap);
 * - coarse when the step is at least a tenth of the standard deviation (the "ten-to-one" rule
 *   for gauge resolution), or when at least a quarter of the values repeat an earlier value
 *   (n ≥ 10), or when there are fewer than 10 distinct values among 30 or more.
 */
export interface ResolutionCheck {
  readonly n: number;
  readonly distinct: number;
  /** (n - distinct) / n. */
  readonly tieFraction: number;
  /** The common grid step, or null when the values do not sit on a common grid. */
  readonly gridStep: number | null;
  /** gridStep / standard deviation, or null. */
  readonly stepToSd: number | null;
  readonly coarse: boolean;
  /** Plain-words warning when coarse, else null. */
  readonly warning: string | null;
}

function approxGcd(a: number, b: number, tol: number): number {
  // Euclid on floats: remainders below tol (or within tol of the divisor) count as zero.
  let x = Math.max(a, b);
  let y = Math.min(a, b);
  for (let it = 0; it < 64 && y > tol; it++) {
    let r = x - Math.floor(x / y) * y;
    if (y - r <= tol) r = 0;
    x = y;
    y = r;
  }
  return x;
}

/** `sorted` ascending, `sd` the sample standard deviation. */
export function checkResolution(sorted: ArrayLike<number>, sd: number): ResolutionCheck {
  const n = sorted.length;
  let distinct = 0;
  let minGap = Number.POSITIVE_INFINITY;
  let prev = Number.NaN;
  for (let i = 0; i < n; i++) {
    const x = sorted[i] as number;
    if (x !== prev) {
      distinct++;
      if (i > 0) minGap = Math.min(minGap, x - prev);
    }
    prev = x;
  }
  const tieFraction = n > 0 ? (n - distinct) / n : 0;
  let gridStep: number | null = null;
  if (distinct >= 2 && Number.isFinite(minGap)) {
    const range = (sorted[n - 1] as number) - (sorted[0] as number);
    const tol = Math.max(1e-6 * minGap, 64 * Number.EPSILON * Math.max(Math.abs(sorted[0] as number), Math.abs(sorted[n - 1] as number)));
    let g = minGap;
    prev = sorted[0] as number;
    for (let i = 1; i < n && g > tol; i++) {
      const x = sorted[i] as number;
      if (x !== prev) g = approxGcd(g, x - prev, tol);
      prev = x;
    }
    // A "grid" finer than a millionth of the range is no grid (values carry full precision).
    if (g > tol && g >= 1e-6 * range) gridStep = g;
  }
  const stepToSd = gridStep !== null && sd > 0 ? gridStep / sd : null;
  const coarse =
    (stepToSd !== null && stepToSd >= 0.1) || (n >= 10 && tieFraction >= 0.25) || (n >= 30 && distinct < 10);
  let warning: string | null = null;
  if (coarse) {
    const grid = gridStep !== null ? `on a grid of step ${fmt(gridStep)}${stepToSd !== null ? ` (${fmt(stepToSd)} standard deviations)` : ''}, ` : '';
    warning =
      `The values look limited by measurement resolution: ${grid}${distinct} distinct values among ${n}. ` +
      'Tied values inflate the Anderson–Darling statistic, so a rejection may reflect the gauge rather than the process; ' +
      'judge the fit also by the plots and the chi-square test, and measure with a finer gauge if the decision depends on it.';
  }
  return { n, distinct, tieFraction, gridStep, stepToSd, coarse, warning };
}

function fmt(x: number): string {
  return String(Number(x.toPrecision(4)));
}

/**
 * Thinning of monotone series for drawing only (never for computing): keeps the first and the
 * last point (the extremes) and at most `cap` points in all. Both coordinates must be
 * nondecreasing in the index (sorted data against plotting positions, an ECDF). A point is kept
 * when the path from the last kept point, measured with each axis scaled to its range, has grown
 * by at least 2/(cap - 2); the whole path is at most 2 long (1 per axis), so at most cap - 2
 * points besides the first and the last are kept, and dense stretches are thinned while the
 * tails, where points are far apart, are kept. Common practice, no source.
 */

/** Smallest cap accepted. */
export const MIN_THIN_CAP = 16;

/** Indices (ascending) of the points to draw. */
export function thinMonotone(x: ArrayLike<number>, y: ArrayLike<number>, cap: number): number[] {
  const n = x.length;
  const c = Math.max(MIN_THIN_CAP, Math.floor(cap));
  if (n <= c) return Array.from({ length: n }, (_, i) => i);
  const x0 = x[0] as number;
  const y0 = y[0] as number;
  const xr = (x[n - 1] as number) - x0;
  const yr = (y[n - 1] as number) - y0;
  const sx = xr > 0 ? 1 / xr : 0;
  const sy = yr > 0 ? 1 / yr : 0;
  const step = 2 / (c - 2);
  const keep: number[] = [0];
  let lx = x0;
  let ly = y0;
  for (let i = 1; i < n - 1; i++) {
    const xi = x[i] as number;
    const yi = y[i] as number;
    if (Math.abs(xi - lx) * sx + Math.abs(yi - ly) * sy >= step) {
      if (keep.length >= c - 1) break;
      keep.push(i);
      lx = xi;
      ly = yi;
    }
  }
  keep.push(n - 1);
  return keep;
}

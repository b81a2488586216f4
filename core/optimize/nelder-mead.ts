/**
 * Nelder–Mead simplex search (Nelder & Mead 1965, Computer Journal 7:308-313), with the
 * adaptive coefficients of Gao & Han 2012 (Comput. Optim. Appl. 51:259-277) for n > 2.
 * Maximises f; non-finite values count as -∞ (outside the feasible region).
 */
import type { Objective } from './derivatives.js';

export interface SimplexResult {
  readonly x: Float64Array;
  readonly value: number;
  readonly iterations: number;
  readonly converged: boolean;
}

export function nelderMead(
  f: Objective,
  x0: Float64Array,
  opts: { maxIterations?: number; xtol?: number; ftol?: number; initialStep?: number } = {},
): SimplexResult {
  const n = x0.length;
  const maxIt = opts.maxIterations ?? 400 * n;
  const xtol = opts.xtol ?? 1e-8;
  const ftol = opts.ftol ?? 1e-12;
  const alpha = 1;
  const beta = n > 2 ? 1 + 2 / n : 2;
  const gamma = n > 2 ? 0.75 - 1 / (2 * n) : 0.5;
  const delta = n > 2 ? 1 - 1 / n : 0.5;
  const val = (x: Float64Array): number => {
    const v = f(x);
    return Number.isFinite(v) ? -v : Number.POSITIVE_INFINITY; // minimise -f
  };
  const pts: Float64Array[] = [Float64Array.from(x0)];
  for (let i = 0; i < n; i++) {
    const p = Float64Array.from(x0);
    const s = opts.initialStep ?? 0.1;
    p[i] = (p[i] as number) + s * Math.max(Math.abs(p[i] as number), 1);
    pts.push(p);
  }
  const fv = pts.map(val);
  const order = (): void => {
    const idx = pts.map((_, i) => i).sort((a, b) => (fv[a] as number) - (fv[b] as number));
    const p2 = idx.map((i) => pts[i] as Float64Array);
    const f2 = idx.map((i) => fv[i] as number);
    for (let i = 0; i <= n; i++) {
      pts[i] = p2[i] as Float64Array;
      fv[i] = f2[i] as number;
    }
  };
  const centroid = new Float64Array(n);
  const trial = (coef: number): Float64Array => {
    const worst = pts[n] as Float64Array;
    const r = new Float64Array(n);
    for (let j = 0; j < n; j++) r[j] = (centroid[j] as number) + coef * ((centroid[j] as number) - (worst[j] as number));
    return r;
  };
  let it = 0;
  let converged = false;
  order();
  for (; it < maxIt; it++) {
    const best = pts[0] as Float64Array;
    let spread = 0;
    for (let i = 1; i <= n; i++) {
      const p = pts[i] as Float64Array;
      for (let j = 0; j < n; j++) {
        spread = Math.max(spread, Math.abs((p[j] as number) - (best[j] as number)) / Math.max(Math.abs(best[j] as number), 1));
      }
    }
    const fspread = Math.abs((fv[n] as number) - (fv[0] as number));
    if (spread <= xtol && fspread <= ftol * Math.max(Math.abs(fv[0] as number), 1)) {
      converged = true;
      break;
    }
    centroid.fill(0);
    for (let i = 0; i < n; i++) {
      const p = pts[i] as Float64Array;
      for (let j = 0; j < n; j++) centroid[j] = (centroid[j] as number) + (p[j] as number) / n;
    }
    const xr = trial(alpha);
    const fr = val(xr);
    if (fr < (fv[0] as number)) {
      const xe = trial(alpha * beta);
      const fe = val(xe);
      if (fe < fr) {
        pts[n] = xe;
        fv[n] = fe;
      } else {
        pts[n] = xr;
        fv[n] = fr;
      }
    } else if (fr < (fv[n - 1] as number)) {
      pts[n] = xr;
      fv[n] = fr;
    } else {
      const outside = fr < (fv[n] as number);
      const xc = trial(outside ? alpha * gamma : -gamma);
      const fc = val(xc);
      if (fc < (outside ? fr : (fv[n] as number))) {
        pts[n] = xc;
        fv[n] = fc;
      } else {
        for (let i = 1; i <= n; i++) {
          const p = pts[i] as Float64Array;
          for (let j = 0; j < n; j++) p[j] = (best[j] as number) + delta * ((p[j] as number) - (best[j] as number));
          fv[i] = val(p);
        }
      }
    }
    order();
  }
  return { x: pts[0] as Float64Array, value: -(fv[0] as number), iterations: it, converged };
}

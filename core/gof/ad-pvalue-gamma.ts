/**
 * Anderson–Darling p-value for the gamma family with shape and scale estimated. The null
 * distribution depends on the true shape (not on n much; no n-correction, as in D'Agostino &
 * Stephens 1986, Table 4.21 [from memory]). The grid of upper critical values by shape is our own
 * seeded simulation (`scripts/simulate-ad-tables.ts`, output in `ad-gamma-table.ts`, refitting
 * every replicate), checked against the published shape-1 values. For a fitted shape κ the critical
 * values are interpolated linearly in 1/κ (the last row, 1/κ = 0, is the normal limit), then ln p
 * is interpolated against A² between them; outside the table a bound (p > 0.25 or p < 0.01).
 * Shapes below the smallest tabulated shape use that row (said in the method text).
 */
import { interpolateCriticalTable, type CriticalPoint } from './ad-pvalue-interpolate.js';
import { GAMMA_AD_TABLE } from './ad-gamma-table.js';

export interface GammaCriticalRow {
  readonly shape: number;
  readonly values: readonly number[];
}

/** Critical values for shape κ, interpolated in 1/κ; `clamped` when κ lies outside the grid. */
export function gammaCriticalValues(shape: number): { points: CriticalPoint[]; clamped: boolean } {
  const rows = GAMMA_AD_TABLE.rows; // increasing shape, the last being Infinity
  const alphas = GAMMA_AD_TABLE.alphas;
  const t = 1 / shape;
  const inv = (r: GammaCriticalRow): number => 1 / r.shape;
  const first = rows[0] as GammaCriticalRow;
  let values: readonly number[];
  let clamped = false;
  if (t >= inv(first)) {
    values = first.values;
    clamped = t > inv(first);
  } else {
    values = (rows[rows.length - 1] as GammaCriticalRow).values;
    for (let i = 1; i < rows.length; i++) {
      const a = rows[i - 1] as GammaCriticalRow;
      const b = rows[i] as GammaCriticalRow;
      if (t >= inv(b)) {
        const w = (inv(a) - t) / (inv(a) - inv(b));
        values = a.values.map((v, j) => v + w * ((b.values[j] as number) - v));
        break;
      }
    }
  }
  return { points: alphas.map((alpha, j) => ({ alpha, value: values[j] as number })), clamped };
}

export function gammaCasePValue(a2: number, shape: number): ReturnType<typeof interpolateCriticalTable> & { clamped: boolean } {
  const { points, clamped } = gammaCriticalValues(shape);
  return { ...interpolateCriticalTable(a2, points), clamped };
}

/**
 * Model sensitivity: every decision number (a B-life, a reliability, a return level, ppm out of
 * spec) under every candidate that no goodness-of-fit test rejects, side by side, so the user sees
 * how much the choice of model moves the answer. When every candidate is rejected, all of them are
 * listed and flagged (`passes: false`), since there is then no passing model to prefer.
 */
import type { FamilyName } from '../families/index.js';
import type { SensitivityRow } from './types.js';

export interface SensitivitySource {
  readonly family: FamilyName;
  readonly label: string;
  readonly rejectedBy: readonly string[];
}

export interface QuantityValue {
  readonly estimate: number;
  /** The row's name for this value when it is not the candidate's own fit (e.g. the normal with the n - 1 sd). */
  readonly label?: string;
  readonly lower?: number | null;
  readonly upper?: number | null;
}

/**
 * One row per quantity. `value(candidate)` returns the number under that candidate, or null when
 * the candidate does not carry it. Candidates come in rank order.
 */
export function sensitivityRows<C extends SensitivitySource>(
  candidates: readonly C[],
  quantities: readonly { readonly quantity: string; readonly value: (c: C) => QuantityValue | null }[],
): SensitivityRow[] {
  const passing = candidates.filter((c) => c.rejectedBy.length === 0);
  const basis: SensitivityRow['basis'] = passing.length > 0 ? 'passing' : 'all (none passes)';
  const listed = passing.length > 0 ? passing : candidates;
  const rows: SensitivityRow[] = [];
  for (const q of quantities) {
    const values: SensitivityRow['values'][number][] = [];
    for (const c of listed) {
      const v = q.value(c);
      if (v === null || !Number.isFinite(v.estimate)) continue;
      values.push({
        family: c.family,
        label: v.label ?? c.label,
        estimate: v.estimate,
        ...(v.lower !== undefined ? { lower: v.lower } : {}),
        ...(v.upper !== undefined ? { upper: v.upper } : {}),
        passes: c.rejectedBy.length === 0,
      });
    }
    if (values.length === 0) continue;
    const est = values.map((v) => v.estimate);
    rows.push({ quantity: q.quantity, basis, values, min: Math.min(...est), max: Math.max(...est) });
  }
  return rows;
}

/** A number for a quantity's name: plain, up to 6 significant digits. */
export function quantityNumber(x: number): string {
  return String(Number(x.toPrecision(6)));
}

/**
 * Grouped data: class limits with counts, as field data often comes ("12 failures between 100 and
 * 200 hours"). Classes must be contiguous and ascending: upper_j = lower_{j+1}; the first lower
 * limit may be -Infinity and the last upper limit +Infinity (open-ended classes). Counts are
 * finite and ≥ 0 (whole numbers in practice; fractional counts are accepted as weights).
 * A class holds the values in (lower, upper]; for continuous models the end convention does not
 * change any probability.
 */
import { InputError } from '../errors.js';

export interface GroupedClass {
  readonly lower: number;
  readonly upper: number;
  readonly count: number;
}

export interface GroupedData {
  readonly lower: Float64Array;
  readonly upper: Float64Array;
  readonly count: Float64Array;
  /** Σ count. */
  readonly total: number;
  readonly classes: number;
}

/** Validate and pack classes (rows as read from a `lower,upper,count` file). */
export function prepareGrouped(rows: readonly GroupedClass[]): GroupedData {
  const k = rows.length;
  if (k === 0) throw new InputError('No classes given: grouped data need at least one lower,upper,count row.', {}, 'too-few-values');
  const lower = new Float64Array(k);
  const upper = new Float64Array(k);
  const count = new Float64Array(k);
  let total = 0;
  for (let j = 0; j < k; j++) {
    const r = rows[j] as GroupedClass;
    const place = { row: j + 2 };
    if (Number.isNaN(r.lower) || Number.isNaN(r.upper) || r.lower === Number.POSITIVE_INFINITY || r.upper === Number.NEGATIVE_INFINITY) {
      throw new InputError(`Class ${j + 1}: the limits must be numbers (got ${String(r.lower)}, ${String(r.upper)}).`, place, 'not-a-number');
    }
    if (!(r.lower < r.upper)) throw new InputError(`Class ${j + 1}: the lower limit ${r.lower} must be below the upper limit ${r.upper}.`, place, 'bad-input');
    if (j > 0 && r.lower === Number.NEGATIVE_INFINITY) throw new InputError(`Class ${j + 1}: only the first class may be open below.`, place, 'bad-input');
    if (j < k - 1 && r.upper === Number.POSITIVE_INFINITY) throw new InputError(`Class ${j + 1}: only the last class may be open above.`, place, 'bad-input');
    if (!(Number.isFinite(r.count) && r.count >= 0)) throw new InputError(`Class ${j + 1}: the count must be a number ≥ 0 (got ${String(r.count)}).`, place, 'bad-input');
    if (j > 0 && r.lower !== (upper[j - 1] as number)) {
      throw new InputError(
        `Class ${j + 1} starts at ${r.lower} but class ${j} ends at ${upper[j - 1]}: classes must be ascending and contiguous (no gaps or overlaps).`,
        place,
        'bad-input',
      );
    }
    lower[j] = r.lower;
    upper[j] = r.upper;
    count[j] = r.count;
    total += r.count;
  }
  if (!(total > 0)) throw new InputError('All class counts are zero.', {}, 'too-few-values');
  return { lower, upper, count, total, classes: k };
}

/**
 * Life data as it is recorded in the field: each row gives the interval (start, end] in which a
 * unit (or `count` units) failed, from inspections.
 *   start = end         exact failure time;
 *   start = 0, end < ∞  failed before the first inspection at `end` (left-censored);
 *   0 < start < end < ∞ found failed at the inspection at `end`, running at `start` (interval-censored);
 *   end = ∞             still running at `start` (right-censored, a suspension).
 * (Meeker & Escobar 1998, "Statistical Methods for Reliability Data", §2.2 and §3.9; the same four
 * kinds as SciPy's `CensoredData`.) Rows are validated once; identical rows are merged with their
 * counts added, so the likelihood costs once per distinct row.
 */
import { InputError } from '../errors.js';
import type { LifeInput } from './data.js';

export type CensoringKind = 'exact' | 'left' | 'interval' | 'right';

export interface IntervalLifeInput {
  /** Start of each row's interval: 0 (or NaN, meaning empty) = before the first inspection. */
  readonly start: Float64Array | readonly number[];
  /** End of each row's interval: Infinity (or NaN, meaning empty) = still running. */
  readonly end: Float64Array | readonly number[];
  /** Units in each row (default 1 each); rows with count 0 carry no units and are skipped. */
  readonly counts?: Float64Array | readonly number[];
  /** Spreadsheet line of each row, for error messages (default: row index + 1). */
  readonly lines?: readonly number[];
  /**
   * Each row's inspection schedule as stated by the user (interval-inspection-schedule.ts): the
   * times, ascending, at which its unit(s) were due to be inspected up to the end of follow-up, also
   * those due after the unit was found failed; empty for an exact row (watched continuously). When
   * given, the goodness-of-fit bootstrap inspects every unit at exactly these times.
   */
  readonly inspections?: readonly (readonly number[])[];
}

export interface IntervalLifeData {
  /** Units (the counts added up). */
  readonly n: number;
  /** Units by kind. */
  readonly exact: number;
  readonly left: number;
  readonly interval: number;
  readonly right: number;
  /** Units with failure information (exact + left + interval). */
  readonly failures: number;
  /** Distinct rows, sorted by start then end; end = Infinity for right-censored rows. */
  readonly lower: Float64Array;
  readonly upper: Float64Array;
  readonly counts: Float64Array;
  readonly kinds: readonly CensoringKind[];
  /** Smallest positive end point and largest finite end point (the span of the data). */
  readonly minTime: number;
  readonly maxTime: number;
  /** Each distinct row's stated inspection schedule (IntervalLifeInput.inspections), or null when none was stated. */
  readonly schedules: readonly Float64Array[] | null;
}

export function censoringKind(lower: number, upper: number): CensoringKind {
  if (lower === upper) return 'exact';
  if (upper === Number.POSITIVE_INFINITY) return 'right';
  if (lower === 0) return 'left';
  return 'interval';
}

/**
 * `trusted`: rows the bootstrap simulated (not user input): the row checks are skipped, so an exact
 * time ≤ 0 drawn from a normal model stays a unit (as buildLifeData keeps it for right-censored data).
 */
export function prepareIntervalLifeData(input: IntervalLifeInput, options: { readonly trusted?: boolean } = {}): IntervalLifeData {
  const m = input.start.length;
  if (input.end.length !== m) {
    throw new InputError(`The end column has ${input.end.length} entries but the start column has ${m}.`, {}, 'bad-input');
  }
  if (input.counts && input.counts.length !== m) {
    throw new InputError(`The count column has ${input.counts.length} entries but there are ${m} rows.`, {}, 'bad-input');
  }
  if (input.inspections && input.inspections.length !== m) {
    throw new InputError(`The inspection-times column has ${input.inspections.length} entries but there are ${m} rows.`, {}, 'bad-input');
  }
  const rows: { lo: number; hi: number; c: number; s: readonly number[] | null }[] = [];
  for (let i = 0; i < m; i++) {
    const line = input.lines?.[i] ?? i + 1;
    const rawLo = input.start[i] as number;
    const rawHi = input.end[i] as number;
    const lo = Number.isNaN(rawLo) ? 0 : rawLo;
    const hi = Number.isNaN(rawHi) ? Number.POSITIVE_INFINITY : rawHi;
    const c = input.counts ? (input.counts[i] as number) : 1;
    const where = { row: line };
    const sched = input.inspections ? (input.inspections[i] as readonly number[]) : null;
    if (options.trusted) {
      rows.push({ lo, hi, c, s: sched });
      continue;
    }
    if (!(Number.isFinite(c) && c >= 0 && Number.isInteger(c))) {
      throw new InputError(`Row ${line}: count ${String(c)} must be a whole number ≥ 0.`, { ...where, value: String(c) }, 'bad-input');
    }
    if (!(lo >= 0) || lo === Number.POSITIVE_INFINITY) {
      throw new InputError(`Row ${line}: start ${String(lo)} must be a finite time ≥ 0 (empty or 0 = failed before the first inspection).`, { ...where, value: String(lo) }, 'bad-input');
    }
    if (!(hi >= lo)) {
      throw new InputError(`Row ${line}: end ${String(hi)} is before start ${String(lo)}.`, { ...where, value: String(hi) }, 'bad-input');
    }
    if (hi === 0) {
      throw new InputError(`Row ${line}: a unit failed at time 0 cannot be used (life times must be > 0).`, { ...where, value: '0' }, 'bad-input');
    }
    if (lo === 0 && hi === Number.POSITIVE_INFINITY) {
      throw new InputError(`Row ${line}: start and end are both empty, so the row says nothing about the unit's life.`, where, 'bad-input');
    }
    if (sched) checkSchedule(lo, hi, sched, line);
    if (c > 0) rows.push({ lo, hi, c, s: sched });
  }
  if (rows.length === 0) throw new InputError('No units to analyse: every row is empty or has count 0.', {}, 'too-few-values');
  // Rows merge only when their schedules are the same too (each unit keeps its own stated inspections).
  rows.sort((a, b) => a.lo - b.lo || a.hi - b.hi || compareSchedules(a.s, b.s));
  const merged: { lo: number; hi: number; c: number; s: readonly number[] | null }[] = [];
  for (const r of rows) {
    const last = merged[merged.length - 1];
    if (last && last.lo === r.lo && last.hi === r.hi && compareSchedules(last.s, r.s) === 0) last.c += r.c;
    else merged.push({ ...r });
  }
  const g = merged.length;
  const lower = new Float64Array(g);
  const upper = new Float64Array(g);
  const counts = new Float64Array(g);
  const kinds: CensoringKind[] = [];
  const tally: Record<CensoringKind, number> = { exact: 0, left: 0, interval: 0, right: 0 };
  let minTime = Number.POSITIVE_INFINITY;
  let maxTime = 0;
  merged.forEach((r, i) => {
    lower[i] = r.lo;
    upper[i] = r.hi;
    counts[i] = r.c;
    const k = censoringKind(r.lo, r.hi);
    kinds.push(k);
    tally[k] += r.c;
    for (const v of [r.lo, r.hi]) {
      if (v > 0 && v < minTime) minTime = v;
      if (Number.isFinite(v) && v > maxTime) maxTime = v;
    }
  });
  const n = tally.exact + tally.left + tally.interval + tally.right;
  return {
    n,
    ...tally,
    failures: n - tally.right,
    lower,
    upper,
    counts,
    kinds,
    minTime,
    maxTime,
    schedules: input.inspections ? merged.map((r) => Float64Array.from(r.s ?? [])) : null,
  };
}

/** Order of two schedules (shorter first, then by the first differing time); 0 when equal. */
function compareSchedules(a: readonly number[] | null, b: readonly number[] | null): number {
  if (!a || !b) return 0;
  if (a.length !== b.length) return a.length - b.length;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return (a[i] as number) - (b[i] as number);
  return 0;
}

/**
 * A row's stated schedule must be the one its interval was seen through: ascending times > 0; a left
 * row (0, R] found failed at the first, R; an interval row (L, R] running at one time and found failed
 * at the next; a suspension running at its last, L (follow-up ended there); an exact row watched
 * continuously (no times).
 */
function checkSchedule(lo: number, hi: number, s: readonly number[], line: number): void {
  const where = { row: line };
  const kind = censoringKind(lo, hi);
  for (let j = 0; j < s.length; j++) {
    const t = s[j] as number;
    if (!(t > 0 && Number.isFinite(t)) || (j > 0 && !(t > (s[j - 1] as number)))) {
      throw new InputError(`Row ${line}: the inspection times must be finite times > 0 in increasing order; ${String(t)} is not.`, { ...where, value: String(t) }, 'bad-input');
    }
  }
  if (kind === 'exact') {
    if (s.length > 0) throw new InputError(`Row ${line}: an exact failure time is watched continuously; leave its inspection times empty.`, where, 'bad-input');
    return;
  }
  const at = (v: number) => s.indexOf(v);
  const list = s.join('; ');
  if (s.length === 0) throw new InputError(`Row ${line}: no inspection times; every row found at inspections needs its unit's inspection times (separated by ;).`, where, 'bad-input');
  if (kind === 'left' && s[0] !== hi) throw new InputError(`Row ${line}: failed before the first inspection at ${hi}, but its first inspection time is ${s[0]} (${list}).`, where, 'bad-input');
  if (kind === 'interval' && !(at(lo) >= 0 && at(hi) === at(lo) + 1)) {
    throw new InputError(`Row ${line}: running at ${lo} and found failed at ${hi}, which must be consecutive inspection times of the unit (${list}).`, where, 'bad-input');
  }
  if (kind === 'right' && s[s.length - 1] !== lo) {
    throw new InputError(`Row ${line}: still running at ${lo}, which must be the unit's last inspection time (its follow-up ended there; ${list}).`, where, 'bad-input');
  }
}

/** Today's time + status columns as interval rows: a failure is exact, a suspension is right-censored. */
export function intervalInputFromTimes(input: LifeInput): IntervalLifeInput {
  const n = input.times.length;
  const start = new Float64Array(n);
  const end = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const t = input.times[i] as number;
    start[i] = t;
    end[i] = input.failed[i] ? t : Number.POSITIVE_INFINITY;
  }
  return { start, end };
}

/**
 * The inspection scheme behind interval rows, as the parametric bootstrap of interval-bootstrap.ts
 * reproduces it: when was each unit looked at, so that a replicate lifetime drawn from the fitted
 * model can be observed the way the data were. A row records only the inspections around its unit's
 * failure (running at L, found failed at R), not every inspection the unit had; a replicate that
 * used only those times sees its units more coarsely than the data did, and the test's size was far
 * below α (scripts/life-interval-size.ts, Weibull n = 50, B = 39, 200 samples, commit 818cb0e:
 * 0.5 % with each unit inspected at its own two times, 0 % with a common schedule, at α = 5 %).
 * So the scheme is rebuilt from the rows in one of two ways:
 *
 * 1. A common schedule. When every left row ends at the first inspection time, every interval row
 *    runs between consecutive inspection times, and every suspension is at an inspection time (the
 *    times being all the rows' finite end points > 0), the rows are what a fleet inspected at all of
 *    those times gives. Each unit is then inspected at every time up to its end of follow-up: a
 *    suspension's last inspection, and for a failed unit the last inspection in the data (its own
 *    end of follow-up is not recorded; exact when every unit was followed to the end).
 * 2. Each unit at its own times (case-2 interval censoring: two inspections U < V per unit,
 *    independent of its life; Sun 2006, The Statistical Analysis of Interval-censored Failure Time
 *    Data, §2.3 [from memory]). An interval row (U, V] keeps both; a left row (0, U] lost the later
 *    inspection V and a suspension at V lost the earlier U, so the missing one is imputed once for
 *    the whole bootstrap (imputeInspections), at a gap V − U drawn from the interval rows' widths,
 *    each weighted by 1/(F̂(V) − F̂(U)) under the fitted model (an interval row is recorded with
 *    probability F(V) − F(U), so wider gaps are over-represented among them; the weights undo that
 *    — inverse-probability weighting, Horvitz & Thompson 1952, J. Amer. Statist. Assoc.
 *    47:663-685); every replicate then sees the units through that one completed scheme, as the
 *    data were seen through theirs. Measured: 24 of 1000 samples rejected at α = 5 % (2.4 %); drawing
 *    the missing times afresh in every replicate (commit 4ff4bef) gave 16 of 750 (2.1 %): both still
 *    conservative, so for this scheme the test decides nothing (interval-gof-design.ts
 *    INTERVAL_GOF_SIZE). With no interval rows
 *    (current-status data: one inspection per unit) every row already records its unit's only
 *    inspection and is kept.
 * 3. Stated by the user (IntervalLifeInput.inspections, the inspection-times column): each unit is
 *    inspected at exactly its listed times, nothing rebuilt or imputed; this is the scheme the
 *    rows' units were really seen through when the list is complete (every inspection due up to the
 *    end of follow-up, also those after the unit was found failed), so the bootstrap reproduces it
 *    exactly and the own-times case can decide (size: interval-gof-design.ts).
 * Exact rows: watched continuously up to the last time in the data, τ (T exact when T ≤ τ).
 * Inspection times are assumed independent of the lives in all three.
 */
import type { Distribution } from '../families/index.js';
import { logClassProbability } from '../grouped/index.js';
import type { IntervalLifeData } from './interval-likelihood-data.js';

export type InspectionSchemeKind = 'common-schedule' | 'own-times' | 'stated';

export interface InspectionScheme {
  readonly kind: InspectionSchemeKind;
  /** Common schedule: the inspection times, ascending (empty for 'own-times'). */
  readonly schedule: Float64Array;
  /** The gaps V − U of the interval rows and their cumulative normalised weights (own-times; may be empty). */
  readonly gaps: Float64Array;
  readonly gapCumulative: Float64Array;
  /** Plain words for the report. */
  readonly description: string;
}

export const COMMON_SCHEDULE_TEXT =
  'the rows fit one common inspection schedule (each interval between consecutive inspection times), so every unit is taken as inspected at every one of those times up to its end of follow-up (a suspension: its last inspection; a failed unit: the last inspection in the data)';
export const OWN_TIMES_TEXT =
  'each unit at its own inspection times (case-2 interval censoring): an interval row keeps both times; the inspection a left row or a suspension does not record is imputed once, at a gap drawn from the interval rows’ widths weighted by 1/(F̂(R) − F̂(L)) under the fitted model';
export const STATED_SCHEDULE_TEXT =
  'each unit at exactly the inspection times stated for it (the inspection-times column), up to its last one; nothing imputed';
export const CURRENT_STATUS_TEXT = 'each unit at its one recorded inspection (no interval rows: current-status data)';

/** The sorted distinct finite end points > 0 of the censored rows (exact rows excluded). */
function inspectionTimes(data: IntervalLifeData): Float64Array {
  const s = new Set<number>();
  for (let i = 0; i < data.lower.length; i++) {
    if (data.kinds[i] === 'exact') continue;
    const lo = data.lower[i] as number;
    const hi = data.upper[i] as number;
    if (lo > 0) s.add(lo);
    if (Number.isFinite(hi) && hi > 0) s.add(hi);
  }
  return Float64Array.from([...s].sort((a, b) => a - b));
}

/** Index of `v` in the ascending array `xs` (−1 when absent). */
function indexOf(xs: Float64Array, v: number): number {
  let lo = 0;
  let hi = xs.length - 1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    const x = xs[mid] as number;
    if (x === v) return mid;
    if (x < v) lo = mid + 1;
    else hi = mid - 1;
  }
  return -1;
}

/** True when the censored rows are what one common schedule `times` gives (rule 1 above). */
export function fitsCommonSchedule(data: IntervalLifeData, times: Float64Array): boolean {
  if (times.length === 0) return false;
  let inspected = 0;
  for (let i = 0; i < data.lower.length; i++) {
    const kind = data.kinds[i];
    if (kind === 'exact' || kind === 'right') continue;
    inspected++;
    const lo = data.lower[i] as number;
    const hi = data.upper[i] as number;
    if (kind === 'left' && hi !== times[0]) return false;
    if (kind === 'interval' && indexOf(times, hi) !== indexOf(times, lo) + 1) return false;
  }
  return inspected > 0;
}

/** Which scheme the bootstrap uses for `data` (the same choice as inspectionScheme, without the model). */
export function inspectionSchemeKind(data: IntervalLifeData): InspectionSchemeKind {
  if (data.schedules) return 'stated';
  return fitsCommonSchedule(data, inspectionTimes(data)) ? 'common-schedule' : 'own-times';
}

/** The scheme in words. */
export function inspectionSchemeText(data: IntervalLifeData): string {
  if (data.schedules) return STATED_SCHEDULE_TEXT;
  if (inspectionSchemeKind(data) === 'common-schedule') return COMMON_SCHEDULE_TEXT;
  return data.interval > 0 ? OWN_TIMES_TEXT : CURRENT_STATUS_TEXT;
}

/** The scheme of `data`, with the fitted model `dist` for the gap weights. */
export function inspectionScheme(data: IntervalLifeData, dist: Distribution): InspectionScheme {
  const times = inspectionTimes(data);
  const empty = new Float64Array(0);
  if (data.schedules) return { kind: 'stated', schedule: empty, gaps: empty, gapCumulative: empty, description: STATED_SCHEDULE_TEXT };
  if (fitsCommonSchedule(data, times)) return { kind: 'common-schedule', schedule: times, gaps: empty, gapCumulative: empty, description: COMMON_SCHEDULE_TEXT };
  const gaps: number[] = [];
  const weights: number[] = [];
  for (let i = 0; i < data.lower.length; i++) {
    if (data.kinds[i] !== 'interval') continue;
    const lo = data.lower[i] as number;
    const hi = data.upper[i] as number;
    const lp = logClassProbability(dist, lo, hi);
    if (!(lp > Number.NEGATIVE_INFINITY)) continue; // a row the model gives no probability cannot weight
    gaps.push(hi - lo);
    weights.push((data.counts[i] as number) * Math.exp(-lp));
  }
  let total = 0;
  for (const w of weights) total += w;
  const cum = new Float64Array(weights.length);
  let acc = 0;
  for (let j = 0; j < weights.length; j++) {
    acc += (weights[j] as number) / total;
    cum[j] = acc;
  }
  if (cum.length > 0) cum[cum.length - 1] = 1;
  return {
    kind: 'own-times',
    schedule: empty,
    gaps: Float64Array.from(gaps),
    gapCumulative: cum,
    description: gaps.length > 0 ? OWN_TIMES_TEXT : CURRENT_STATUS_TEXT,
  };
}

/** A gap drawn from the weighted interval widths with the uniform `u`. */
function drawGap(scheme: InspectionScheme, u: number): number {
  const c = scheme.gapCumulative;
  let lo = 0;
  let hi = c.length - 1;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if ((c[mid] as number) >= u) hi = mid;
    else lo = mid + 1;
  }
  return scheme.gaps[lo] as number;
}

/** (a, z] of a lifetime T seen at the ascending inspection times times[0..m). */
function seenAt(T: number, times: Float64Array, m: number): [number, number] {
  // The first inspection at or after T (binary search over the first m times).
  let lo = 0;
  let hi = m;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if ((times[mid] as number) >= T) hi = mid;
    else lo = mid + 1;
  }
  if (lo === m) return [m > 0 ? (times[m - 1] as number) : 0, Number.POSITIVE_INFINITY];
  return [lo === 0 ? 0 : (times[lo - 1] as number), times[lo] as number];
}

/**
 * The missing inspection of each unit (units in row order, each row's count expanded), imputed once
 * from `uniform`: a left row's later inspection R + gap, a suspension's earlier one L − gap (NaN when
 * that is ≤ 0: no earlier inspection); NaN for every other unit and for current-status data.
 */
export function imputeInspections(scheme: InspectionScheme, data: IntervalLifeData, uniform: () => number): Float64Array {
  const out = new Float64Array(data.n).fill(Number.NaN);
  if (scheme.kind !== 'own-times' || scheme.gaps.length === 0) return out;
  let k = 0;
  for (let r = 0; r < data.lower.length; r++) {
    const kind = data.kinds[r];
    for (let c = 0; c < (data.counts[r] as number); c++, k++) {
      if (kind === 'left') out[k] = (data.upper[r] as number) + drawGap(scheme, uniform());
      else if (kind === 'right') {
        const u = (data.lower[r] as number) - drawGap(scheme, uniform());
        if (u > 0) out[k] = u;
      }
    }
  }
  return out;
}

/**
 * How a unit recorded as the row (L, R] of `kind` would have seen the lifetime T. `extra`: its
 * imputed inspection (imputeInspections; NaN for none). τ: the last time in the data. `own`: the
 * row's stated schedule (scheme 'stated').
 */
export function observeUnit(
  scheme: InspectionScheme,
  kind: IntervalLifeData['kinds'][number],
  L: number,
  R: number,
  T: number,
  tau: number,
  extra: number,
  own: Float64Array | null = null,
): [number, number] {
  if (kind === 'exact') return T <= tau ? [T, T] : [tau, Number.POSITIVE_INFINITY];
  if (scheme.kind === 'stated' && own) return seenAt(T, own, own.length);
  if (scheme.kind === 'common-schedule') {
    const s = scheme.schedule;
    const end = kind === 'right' ? indexOf(s, L) + 1 : s.length;
    return seenAt(T, s, end);
  }
  if (kind === 'interval') return T <= L ? [0, L] : T <= R ? [L, R] : [R, Number.POSITIVE_INFINITY];
  if (kind === 'left') {
    if (T <= R) return [0, R];
    if (Number.isNaN(extra)) return [R, Number.POSITIVE_INFINITY];
    return T <= extra ? [R, extra] : [extra, Number.POSITIVE_INFINITY];
  }
  // A suspension at L, with its earlier inspection `extra` when there was one.
  if (T > L) return [L, Number.POSITIVE_INFINITY];
  if (Number.isNaN(extra)) return [0, L];
  return T <= extra ? [0, extra] : [extra, L];
}

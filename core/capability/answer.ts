/**
 * Which model answers "can it meet the tolerance?": one decision, read by the page's headline, its
 * capability section, the exported report and the command line, so that they quote the same index
 * under the same model (issue 14: the headline ignored a transformation the section answered with).
 *
 * The rule, in order:
 * 1. a transformation the user asked for (Box–Cox or Johnson) whose transformed values pass the
 *    normality test;
 * 2. with every model rejected, none (no number is stated with a model behind it);
 * 3. the selected model's row (flagged by its `passes` when a test rejects it);
 * 4. without a selection or a row for it: the normal if it passes, else the best passing row.
 * The bootstrap interval quoted with it is the one computed for that very model: the
 * transformation's, or the percentile family's (core/workflow/complete.ts), never another row's.
 */
import type { FamilyName } from '../families/index.js';
import type { PercentileIntervals } from './bootstrap.js';
import type { ComparisonRow, ModelComparison } from './comparison.js';
import type { TransformSection } from './extensions.js';

/** The parts of the capability section the decision reads. */
export interface CapabilityAnswerSource {
  readonly comparison: ModelComparison;
  readonly transform: TransformSection;
  readonly percentileFamily: FamilyName | null;
  readonly percentileIntervals: PercentileIntervals | null;
}

/** A fitted candidate as the comparison names it (`label` is its row's `model`). */
export interface AnswerCandidate {
  readonly family: FamilyName;
  readonly label: string;
}

export type CapabilityAnswerBasis = 'transformation' | 'selected model' | 'normal' | 'best passing model' | 'no passing model';

export interface CapabilityAnswer {
  /** The row whose ppm and indices are the answer (null: no model passes the tests). */
  readonly row: ComparisonRow | null;
  /** The fitted family behind `row` (null for the normal row, a transformation, or no row). */
  readonly family: FamilyName | null;
  /** The bootstrap interval of that row's percentile indices, when one was computed for it. */
  readonly intervals: PercentileIntervals | null;
  readonly basis: CapabilityAnswerBasis;
  /**
   * Why the answer's Ppk has no interval (null: it has one, or it is the normal row with its
   * normal-theory bounds): the bootstrap's own note (withheld under a Johnson curve, too much work),
   * else NO_INTERVAL_NOTE. The safety caution asks for a lower bound; this says when there is none.
   */
  readonly intervalNote: string | null;
}

/** A fitted family's Ppk without an interval: the bootstrap runs for one model only (core/workflow/complete.ts, extensions.ts). */
export function noIntervalNote(model: string): string {
  return `No interval for the Ppk under ${model}: the bootstrap interval is computed for one model only (the transformation asked for, else the model of the percentile method when the normal model fails its test), and the normal-theory bounds belong to the normal model. A safety-critical decision needs a lower bound under the model used: ask for the Box–Cox transformation, whose interval is given when it passes its test.`;
}

function noteFor(row: ComparisonRow | null, intervals: PercentileIntervals | null): string | null {
  if (!row || row.kind === 'normal' || (intervals?.intervals && intervals.intervals.length > 0)) return null;
  return intervals?.note ?? noIntervalNote(row.model);
}

/** The comparison row of a candidate: the normal row for the normal, else the fitted row of the same label. */
export function comparisonRowOf(comparison: ModelComparison, c: AnswerCandidate): ComparisonRow | null {
  const rows = [...comparison.passing, ...comparison.rejected];
  const label = c.label.toLowerCase();
  return rows.find((r) => (c.family === 'normal' ? r.kind === 'normal' : r.kind === 'fitted model' && r.model.toLowerCase() === label)) ?? null;
}

/**
 * The answering row for the model selected among `candidates` (null selection: none chosen). See
 * the rule in the module comment.
 */
export function capabilityAnswer(cap: CapabilityAnswerSource, candidates: readonly AnswerCandidate[], selected: FamilyName | null): CapabilityAnswer {
  const passing = cap.comparison.passing;
  const t = cap.transform;
  const transformed = t.kind !== 'none' ? passing.find((r) => r.kind === 'transformation') : undefined;
  if (transformed && t.kind !== 'none') return { row: transformed, family: null, intervals: t.intervals, basis: 'transformation', intervalNote: noteFor(transformed, t.intervals) };
  if (passing.length === 0) return { row: null, family: null, intervals: null, basis: 'no passing model', intervalNote: null };
  const chosen = candidates.find((c) => c.family === selected);
  const own = chosen ? comparisonRowOf(cap.comparison, chosen) : null;
  const row = own ?? passing.find((r) => r.kind === 'normal') ?? (passing[0] as ComparisonRow);
  const basis: CapabilityAnswerBasis = own ? 'selected model' : row.kind === 'normal' ? 'normal' : 'best passing model';
  const family = row.kind === 'normal' ? null : row.kind === 'fitted model' ? (candidates.find((c) => c.label.toLowerCase() === row.model.toLowerCase())?.family ?? null) : null;
  const intervals = family !== null && family === cap.percentileFamily ? cap.percentileIntervals : null;
  return { row, family, intervals, basis, intervalNote: noteFor(row, intervals) };
}

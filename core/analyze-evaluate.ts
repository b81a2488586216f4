/**
 * One family on one sample, before any bootstrap: the maximum-likelihood fit, A², the chi-square
 * test and the table p-value; a family that cannot be fitted becomes its not-applicable entry with
 * the reason in words.
 */
import { PlumblineError } from './errors.js';
import { getFamily, type Family, type FamilyName, type FitSuccess } from './families/index.js';
import { andersonDarlingStatistic, chiSquareTest, tablePValue, type AdPValue } from './gof/index.js';
import { resolveOptions, type AnalyzeOptions, type ResolvedOptions } from './analyze-options.js';
import type { ChiSquareReport, NotApplicableReport } from './report.js';
import { prepareSample, type Sample } from './sample.js';

/** Fit, A² and chi-square of one family, as plain data (structured-clone safe). */
export type EvaluatedFamily =
  | { readonly family: FamilyName; readonly ok: true; readonly outcome: FitSuccess; readonly a2: number; readonly chiSquare: ChiSquareReport; readonly table: AdPValue | null }
  | { readonly family: FamilyName; readonly ok: false; readonly notApplicable: NotApplicableReport };

export type Evaluated =
  | { readonly ok: true; readonly outcome: FitSuccess; readonly a2: number; readonly chiSquare: ChiSquareReport; readonly table: AdPValue | null }
  | { readonly ok: false; readonly notApplicable: NotApplicableReport };

export function isSample(v: ArrayLike<number> | Sample): v is Sample {
  return typeof (v as Sample).logs === 'function' && (v as Sample).sorted instanceof Float64Array;
}

/**
 * The per-family part of planAnalysis (fit, A², chi-square, table p-value) for `families` only,
 * as plain data: what another thread computes for AnalyzeOptions.delegated. `values` must be the
 * same values (the Sample sorts them the same way, so every number is the same).
 */
export function evaluateFamilies(values: ArrayLike<number> | Sample, families: readonly FamilyName[], options: AnalyzeOptions = {}): EvaluatedFamily[] {
  const opts = resolveOptions({ ...options, families });
  const sample = isSample(values) ? values : prepareSample(values);
  return opts.families.map((name) => ({ family: name, ...evaluateFamily(getFamily(name), sample, opts) }));
}

/** Whether every number the report would carry for this fit is a real number (not NaN/±Infinity). */
function nonFiniteIn(outcome: FitSuccess, a2: number, chiSquare: ChiSquareReport, table: AdPValue | null): string | null {
  for (const [k, v] of Object.entries(outcome.parameters)) if (!Number.isFinite(v)) return `its estimate of ${k} is not a finite number`;
  if (!Number.isFinite(outcome.logLikelihood)) return 'its log-likelihood is not a finite number';
  if (!Number.isFinite(a2)) return 'its Anderson–Darling statistic is not a finite number';
  if (chiSquare.computable) {
    if (!Number.isFinite(chiSquare.statistic)) return 'its chi-square statistic is not a finite number';
    if (Number.isNaN(chiSquare.pValue) || Number.isNaN(chiSquare.pValueUpper)) return 'its chi-square p-value could not be computed';
  }
  if (table !== null && Number.isNaN(table.pValue)) return 'its Anderson–Darling p-value could not be computed';
  return null;
}

/** A typed error from inside a fit, in plain words (no NaN or internal names shown to the user). */
function plainFailure(e: PlumblineError): string {
  const m = /parameter (\w+) = (\S+) is invalid/.exec(e.message);
  if (m) {
    const v = Number(m[2]);
    return Number.isFinite(v) ? `its estimate of ${m[1]} came out as ${m[2]}, outside the allowed range` : `its estimate of ${m[1]} is not a finite number`;
  }
  if (e.name === 'BracketError') return 'its likelihood equation could not be solved (no bracketing interval)';
  return e.message.replace(/\.$/, '');
}

/**
 * Fit one family and compute its statistics. A fit that fails numerically (a family's own
 * parameter check throwing, or a NaN/infinite number in its results), which happens for data at
 * the edges of double precision (e.g. values near 1e-300 or 1e300 whose squared deviations
 * underflow or overflow), is reported as not applicable with the reason, never thrown as an
 * internal error and never reported as a fit (issue 6: nothing dropped without being reported).
 * Input errors (e.g. a user's bin count) still propagate.
 */
export function evaluateFamily(family: Family, sample: Sample, opts: ResolvedOptions): Evaluated {
  const failed = (what: string): Evaluated => {
    const extreme = Math.max(Math.abs(sample.min), Math.abs(sample.max));
    const tiny = sample.sorted.reduce((m, x) => (x !== 0 && Math.abs(x) < m ? Math.abs(x) : m), Infinity);
    const hint =
      extreme > 1e150 || tiny < 1e-150
        ? ` The values (from ${String(sample.min)} to ${String(sample.max)}) are near the limits of double precision; rescale them (change units) to fit this model.`
        : '';
    return {
      ok: false,
      notApplicable: { family: family.name, reason: `The ${family.label} fit failed numerically (${what}), so it is not reported.${hint}`, offendingCount: 0 },
    };
  };
  try {
    const outcome = family.fit(sample);
    if (!outcome.ok) {
      // No interior maximum (a threshold model on the edge) is its own kind: not ranked, not tested.
      const kind = 'kind' in outcome ? { kind: outcome.kind } : {};
      return { ok: false, notApplicable: { family: family.name, reason: outcome.reason, offendingCount: outcome.offendingCount, ...kind } };
    }
    const dist = family.make(outcome.parameters);
    // Families that can work from ln x get the sample's cached logs (same numbers, one Math.log a point saved).
    const a2 = andersonDarlingStatistic(dist, sample.sorted, 'logCdfSfFromLogsInto' in dist && sample.nonPositive === 0 ? sample.logs() : null);
    const chiSquare = chiSquareTest(dist, sample.sorted, {
      alpha: opts.alpha,
      estimatedParameters: family.estimatedParameters,
      bins: opts.bins,
    });
    const table = opts.pMethod === 'bootstrap' ? null : tablePValue(family.name, outcome.parameters, sample, a2);
    const bad = nonFiniteIn(outcome, a2, chiSquare, table);
    if (bad !== null) return failed(bad);
    return { ok: true, outcome, a2, chiSquare, table };
  } catch (e) {
    // The sample and the options were validated before this point, so a typed error raised inside a
    // family's fit or its statistics (a parameter check, a root finder without a bracket, an input
    // check on an intermediate array) is a numerical failure of that family on these data, not the
    // user's fault: report it per family. A user's bin count error still propagates (it is checked
    // up front, but keep it the user's), and so do untyped errors (true bugs).
    if (e instanceof PlumblineError && e.code !== 'bins-too-many' && e.code !== 'bad-option' && e.code !== 'cancelled') {
      return failed(plainFailure(e));
    }
    throw e;
  }
}

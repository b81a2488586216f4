/**
 * analyzeDataset: one call for every kind of input of issue 4. It decides what the data are
 * (grouped counts, life data with a status column, or a complete sample), runs the matching
 * analysis, and adds the sections its options ask for. The issue-2 report fields are unchanged;
 * the additions are documented in docs/report-fields.md.
 *
 * analyzeDatasetAsync hands the Anderson–Darling bootstrap of a complete sample to a runner (e.g.
 * worker threads), as analyzeAsync does; the censored bootstrap and grouped fits run in-process.
 */
import { runPlanBootstrap, type AnalyzeOptions, type BootstrapRunner } from '../analyze.js';
import { InputError, PlumblineError } from '../errors.js';
import { intervalInputFromTimes, type CensoredGofHook, type IntervalGofHook } from '../life/index.js';
import { finishComplete, planComplete, type CompleteInput } from './complete.js';
import { groupedReport } from './grouped.js';
import { lifeReport } from './life.js';
import { intervalLifeReport } from './life-interval.js';
import { withIntervalModes } from './life-modes.js';
import { potReport } from './flood-pot.js';
import { floodRecordReport } from './flood-record-report.js';
import { workflowSettings, type WorkflowSettings } from './options.js';
import type { AnyDatasetReport, DatasetInput, DatasetOptions, DatasetReport, GroupedDatasetReport } from './types.js';

/** What the data are and how they are analysed (also used by core/workflow/pipeline.ts). */
export type Route =
  | { readonly kind: 'grouped'; readonly run: () => GroupedDatasetReport }
  | { readonly kind: 'interval'; readonly run: (goodnessOfFit?: IntervalGofHook) => DatasetReport }
  | { readonly kind: 'pot'; readonly run: () => DatasetReport }
  | { readonly kind: 'flood-record'; readonly run: () => DatasetReport }
  | { readonly kind: 'life'; readonly run: (goodnessOfFit?: CensoredGofHook) => DatasetReport; readonly times: ArrayLike<number>; readonly status: ArrayLike<number> }
  | { readonly kind: 'complete'; readonly input: CompleteInput };

export function route(input: DatasetInput, options: DatasetOptions, settings: WorkflowSettings): Route {
  if (input.modes && !input.status && !input.interval) {
    throw new InputError('A failure-mode column needs times with a status column (1 = failed, 0 = still running or removed unfailed), or interval rows.', {}, 'bad-option');
  }
  if (input.floodRecord) {
    if (input.values || input.status || input.grouped || input.subgroups || input.order || input.interval || input.dates || input.modes) {
      throw new InputError('A peak file comes alone: its columns are read by their names (peak_dt, peak_va, peak_cd); no value, status, subgroup, order, interval, date or failure-mode column with it.', {}, 'bad-option');
    }
    const read = input.floodRecord;
    return { kind: 'flood-record', run: () => floodRecordReport(read, options, settings) };
  }
  if (input.interval) {
    if (input.values || input.status || input.grouped || input.subgroups || input.order) {
      throw new InputError('Interval rows come alone: no value, status, grouped, subgroup or order column with them.', {}, 'bad-option');
    }
    const rows = input.interval;
    const modes = input.modes ?? null;
    return {
      kind: 'interval',
      run: (gof?: IntervalGofHook) => (modes ? withIntervalModes(intervalLifeReport(rows, options, settings, gof), rows, modes, options, settings) : intervalLifeReport(rows, options, settings, gof)),
    };
  }
  if (input.dates) {
    if (input.status || input.grouped || input.subgroups || input.order || options.trend) {
      throw new InputError('A dated series (peaks over a threshold) comes alone: no status, grouped, subgroup or order column with it, and no trend check.', {}, 'bad-option');
    }
    const days = input.dates;
    const values = input.values;
    if (!values) throw new InputError('No values to analyse.', {}, 'too-few-values');
    return { kind: 'pot', run: () => potReport(days, values, options, settings) };
  }
  if (options.threshold !== undefined && options.threshold !== null) {
    throw new InputError('Peaks over a threshold need the date of each value: give the date column.', {}, 'bad-option');
  }
  if (input.grouped) {
    if (input.values || input.status || input.subgroups || input.order) {
      throw new InputError('Grouped counts come alone: no value, status, subgroup or order column with them.', {}, 'bad-option');
    }
    const rows = input.grouped;
    return { kind: 'grouped', run: () => groupedReport(rows, options, settings) };
  }
  const values = input.values;
  if (!values) throw new InputError('No values to analyse.', {}, 'too-few-values');
  if (input.status) {
    const status = input.status;
    if (status.length !== values.length) {
      throw new InputError(`The status column has ${status.length} entries but there are ${values.length} times.`, {}, 'bad-input');
    }
    if (input.subgroups || input.order || options.trend) {
      throw new InputError('Subgroups and the trend check apply to a complete sample, not to life data with a status column.', {}, 'bad-option');
    }
    const modes = input.modes ?? null;
    // Fewer than 2 failures: no model can be fitted. With a Weibull shape given from experience the
    // zero-failure (Weibayes; Nelson 1985) lower bounds are the answer, as the CLI gives them: the
    // units go through the recorded-life analysis as exact failures and right suspensions.
    const failures = failuresIn(status);
    if (failures !== null && failures < 2 && !modes) {
      if (options.assumedShape === undefined || options.assumedShape === null) throw tooFewFailures(failures, status.length);
      const rows = intervalInputFromTimes({ times: Float64Array.from(values), failed: Uint8Array.from(status) });
      return { kind: 'interval', run: (gof?: IntervalGofHook) => intervalLifeReport(rows, options, settings, gof) };
    }
    return { kind: 'life', run: (gof) => lifeReport(values, status, options, settings, gof, modes), times: values, status };
  }
  if (settings.bLifePercents !== null || settings.reliabilityTimes.length > 0 || options.boundMethod !== undefined || options.lifePlotPositions !== undefined) {
    throw new InputError('B-lives, reliability times and life bounds need life data: give a status column (1 = failed, 0 = still running or removed).', {}, 'bad-option');
  }
  return { kind: 'complete', input: { values, subgroups: input.subgroups ?? null, order: input.order ?? null, ...(input.sortInPlace === true ? { sortInPlace: true } : {}) } };
}

/** Failures in a status column (1 = failed); null when an entry is not 0 or 1 (lifeReport names it). */
function failuresIn(status: ArrayLike<number>): number | null {
  let failures = 0;
  for (let i = 0; i < status.length; i++) {
    const f = status[i] as number;
    if (f !== 0 && f !== 1) return null;
    failures += f;
  }
  return failures;
}

/** Fewer than 2 failures and no assumed shape: what is needed, said plainly. */
export function tooFewFailures(failures: number, units: number): InputError {
  return new InputError(
    `Only ${failures} failure${failures === 1 ? '' : 's'} among ${units} units: at least 2 failures are needed to fit a life model. With fewer, give a Weibull shape from experience (assumedShape, --assumed-shape) for the zero-failure (Weibayes) lower bounds on the scale and B-lives.`,
    {},
    'needs-assumed-shape',
  );
}

export function analyzeDataset(input: DatasetInput & { readonly grouped: NonNullable<DatasetInput['grouped']> }, options?: DatasetOptions): GroupedDatasetReport;
export function analyzeDataset(input: DatasetInput & { readonly values: ArrayLike<number>; readonly grouped?: null }, options?: DatasetOptions): DatasetReport;
export function analyzeDataset(input: DatasetInput, options?: DatasetOptions): AnyDatasetReport;
export function analyzeDataset(input: DatasetInput, options: DatasetOptions = {}): AnyDatasetReport {
  const settings = workflowSettings(options);
  const r = route(input, options, settings);
  if (r.kind !== 'complete') return r.run();
  const p = planComplete(r.input, options, settings);
  return finishComplete(p, runPlanBootstrap(p.plan));
}

/** As analyzeDataset, with the complete-sample bootstrap handed to `runner` (default: in-process). */
export async function analyzeDatasetAsync(
  input: DatasetInput,
  options: DatasetOptions & Pick<AnalyzeOptions, 'onProgress' | 'signal'> & { readonly runner?: BootstrapRunner } = {},
): Promise<AnyDatasetReport> {
  const { runner, onProgress, signal, ...rest } = options;
  const settings = workflowSettings(rest);
  const r = route(input, rest, settings);
  if (r.kind !== 'complete') return r.run();
  const p = planComplete(r.input, rest, settings);
  const hooks = { ...(onProgress ? { onProgress } : {}), ...(signal ? { signal } : {}) };
  const counts = runner ? await runner(p.plan.bootstrapJobs, hooks) : runPlanBootstrap(p.plan, hooks);
  for (const c of counts) if (c.cancelled) throw new PlumblineError('cancelled', 'The analysis was cancelled.');
  return finishComplete(p, counts);
}

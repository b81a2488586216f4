/**
 * analyzeDataset: one call for every kind of input of issue 4. It decides what the data are
 * (grouped counts, life data with a status column, or a complete sample), runs the matching
 * analysis, and adds the sections its options ask for. The issue-2 report fields are unchanged;
 * the additions are documented in docs/report-fields.md.
 */
import { InputError } from '../errors.js';
import { completeReport } from './complete.js';
import { groupedReport } from './grouped.js';
import { lifeReport } from './life.js';
import { workflowSettings } from './options.js';
import type { AnyDatasetReport, DatasetInput, DatasetOptions, DatasetReport, GroupedDatasetReport } from './types.js';

export function analyzeDataset(input: DatasetInput & { readonly grouped: NonNullable<DatasetInput['grouped']> }, options?: DatasetOptions): GroupedDatasetReport;
export function analyzeDataset(input: DatasetInput & { readonly values: ArrayLike<number>; readonly grouped?: null }, options?: DatasetOptions): DatasetReport;
export function analyzeDataset(input: DatasetInput, options?: DatasetOptions): AnyDatasetReport;
export function analyzeDataset(input: DatasetInput, options: DatasetOptions = {}): AnyDatasetReport {
  const settings = workflowSettings(options);
  if (input.grouped) {
    if (input.values || input.status || input.subgroups || input.order) {
      throw new InputError('Grouped counts come alone: no value, status, subgroup or order column with them.', {}, 'bad-option');
    }
    return groupedReport(input.grouped, options, settings);
  }
  const values = input.values;
  if (!values) throw new InputError('No values to analyse.', {}, 'too-few-values');
  if (input.status) {
    if (input.status.length !== values.length) {
      throw new InputError(`The status column has ${input.status.length} entries but there are ${values.length} times.`, {}, 'bad-input');
    }
    if (input.subgroups || input.order || options.trend) {
      throw new InputError('Subgroups and the trend check apply to a complete sample, not to life data with a status column.', {}, 'bad-option');
    }
    return lifeReport(values, input.status, options, settings);
  }
  if (settings.bLifePercents !== null || settings.reliabilityTimes.length > 0 || options.boundMethod !== undefined || options.lifePlotPositions !== undefined) {
    throw new InputError('B-lives, reliability times and life bounds need life data: give a status column (1 = failed, 0 = still running or removed).', {}, 'bad-option');
  }
  return completeReport({ values, subgroups: input.subgroups ?? null, order: input.order ?? null }, options, settings);
}

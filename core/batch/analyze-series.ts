/**
 * One series analysed: the same `analyzeDataset` call a single run makes on the same values and
 * options, so a batch's report of a series is the single run's report (same numbers). Used by the
 * CLI's batch threads and the page's many-series workers.
 */
import { isPlumblineError } from '../errors.js';
import { analyzeDataset } from '../workflow/index.js';
import type { DatasetOptions } from '../workflow/index.js';
import type { SeriesRecord } from './series.js';
import type { SeriesLine } from './summary.js';

export function analyzeSeries(record: SeriesRecord, options: DatasetOptions): SeriesLine {
  if (record.kind === 'error') {
    const { key, message, row, column, value } = record;
    return { series: key, error: { message, ...(row !== undefined ? { row } : {}), ...(column !== undefined ? { column } : {}), ...(value !== undefined ? { value } : {}) } };
  }
  try {
    const report = analyzeDataset(record.status ? { values: record.values, status: record.status } : { values: record.values }, options);
    return { series: record.key, report };
  } catch (e) {
    const message = e instanceof Error ? e.message : String(e);
    const place = isPlumblineError(e) ? e.place : {};
    return {
      series: record.key,
      error: {
        message: `series ${JSON.stringify(record.key)}: ${message}`,
        column: record.column,
        ...(place.value !== undefined ? { value: place.value } : {}),
      },
    };
  }
}

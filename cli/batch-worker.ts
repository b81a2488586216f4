/**
 * One series analysed: the same `analyzeDataset` call a single run makes on the same values and
 * options, so a batch's report of a series is the single run's report (same numbers). Used on the
 * main thread and inside the batch's worker threads.
 */
import { analyzeDataset, isPlumblineError, type DatasetOptions, type SeriesLine, type SeriesRecord } from '../core/index.js';

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
    // A row inside the series' own values is its position there; name the file row instead.
    const row = place.row !== undefined && record.rows[place.row - 1] !== undefined ? record.rows[place.row - 1] : undefined;
    return {
      series: record.key,
      error: {
        message: `series ${JSON.stringify(record.key)}: ${message}`,
        ...(row !== undefined ? { row } : {}),
        column: record.column,
        ...(place.value !== undefined ? { value: place.value } : {}),
      },
    };
  }
}

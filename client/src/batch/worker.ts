/**
 * A Web Worker of the many-series page: analyses the series it is sent with the core's analyzeSeries
 * (the single run's analysis) and posts back each series' one-line summary (core summarizeSeries).
 * The page keeps summaries only, so 10,000 series stay small; the full view of one series is the
 * single analysis of its values on the main page.
 */
import { analyzeSeries, summarizeSeries, type DatasetOptions, type SeriesRecord, type SeriesSummary } from '../../../core/index.js';

export interface WorkerTask {
  readonly id: number;
  readonly record: SeriesRecord;
  readonly options: DatasetOptions;
}

export interface WorkerDone {
  readonly id: number;
  readonly summary: SeriesSummary;
}

self.onmessage = (e: MessageEvent<WorkerTask>) => {
  const { id, record, options } = e.data;
  const summary = summarizeSeries(analyzeSeries(record, options));
  (self as unknown as Worker).postMessage({ id, summary } satisfies WorkerDone);
};

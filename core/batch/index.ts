/**
 * core/batch: many series in one run — splitting a table into series, the shard a series belongs
 * to, and the one-line summary of each series' report.
 */
export { splitLong, splitWide } from './series.js';
export type { CellColumn, SeriesFault, SeriesRecord, SeriesValues, SplitOptions } from './series.js';
export { fnv1a32, inShard, shardOf } from './shard.js';
export type { Shard } from './shard.js';
export { SUMMARY_COLUMNS, summarizeSeries, summaryCsv } from './summary.js';
export type { SeriesLine, SeriesSummary } from './summary.js';
export { analyzeSeries } from './analyze-series.js';
export { readBatch } from './read-table.js';
export type { BatchLayout, BatchRead } from './read-table.js';

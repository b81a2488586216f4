/**
 * Batch options: many series in one run (a key column naming each row's series, or one column per
 * series), a shard of them for batch schedulers, and the summary file. CLI only: the page sends one
 * series per request and shows the batch summary from the CLI's JSON Lines.
 */
import type { OptionSpec } from './spec.js';

export const BATCH_OPTIONS: readonly OptionSpec[] = [
  {
    name: 'by',
    cli: '--by',
    kind: 'column',
    default: null,
    appliesTo: ['batch'],
    surfaces: ['cli'],
    help: 'long table: the column naming the series of each row; every series gets the analysis a single run gives it',
    group: 'batch',
  },
  {
    name: 'columns',
    cli: '--columns',
    kind: 'columns',
    default: null,
    appliesTo: ['batch'],
    surfaces: ['cli'],
    help: 'wide table: the columns to analyse, one series each (names or 1-based numbers, comma-separated), or all-numeric',
    group: 'batch',
  },
  {
    name: 'shard',
    cli: '--shard',
    kind: 'text',
    pattern: '^(0|[1-9][0-9]{0,5})/([1-9][0-9]{0,5})$',
    patternWords: 'I/N with 0 <= I < N, e.g. 0/4 (shards are numbered from 0)',
    default: null,
    appliesTo: ['batch'],
    surfaces: ['cli'],
    help: 'analyse only the series whose key hashes (32-bit FNV-1a of its UTF-8 text, mod N) to shard I of N; run N such processes and join their output with plumbline merge',
    group: 'batch',
  },
  {
    name: 'summaryCsv',
    cli: '--summary-csv',
    kind: 'text',
    pattern: '^.+$',
    patternWords: 'a file name',
    default: null,
    appliesTo: ['batch'],
    surfaces: ['cli'],
    help: 'also write the batch summary (one row per series: n, best model, verdicts, decision number and interval) to this CSV file',
    group: 'batch',
  },
  {
    name: 'regional',
    cli: '--regional',
    kind: 'boolean',
    default: false,
    appliesTo: ['batch', 'flood'],
    surfaces: ['cli'],
    help: 'with --by: treat the series as the sites of one region (annual maxima): discordancy, heterogeneity H, the regional growth curve by L-moments and each site\'s index-flood quantiles at --return-periods (Hosking & Wallis 1997)',
    group: 'batch',
  },
];

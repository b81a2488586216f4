/**
 * `plumbline analyze FILE --by KEY | --columns LIST|all-numeric`: every series of the file gets the
 * analysis a single run gives it (cli/batch-worker.ts), on worker threads, isolated (a bad series
 * gets an error line; the others go on). With --json, JSON Lines on standard output, one object per
 * series written as it finishes (`{ "series", "report" }` or `{ "series", "error" }`), so memory does
 * not grow with the number of series; otherwise the summary table. `--summary-csv FILE` writes the
 * summary as CSV as well. `--shard I/N` keeps only the series whose key hashes to shard I of N
 * (core/batch/shard.ts), for batch schedulers; `plumbline merge` joins the shards' output.
 * `--regional` adds the regional frequency analysis of all series as one region's sites (core/regional):
 * a section after the summary, or with --json one last line `{ "region": … }`.
 */
import { writeFileSync } from 'node:fs';
import {
  inShard,
  readBatch,
  type BatchLayout,
  regionalAnalysis,
  summaryCsv,
  type CsvOptions,
  type DatasetOptions,
  type RegionalReport,
  type SeriesRecord,
  type SeriesSummary,
  type SeriesValues,
  type Shard,
} from '../core/index.js';
import { regionalText } from './regional-text.js';
import { analyzeAll } from './batch-pool.js';
import { summaryTable } from './batch-summary-text.js';
import { readInputText, type InputText } from './read-input.js';

export interface BatchArgs extends BatchLayout {
  readonly file: string;
  readonly json: boolean;
  readonly shard: Shard | null;
  readonly summaryCsv?: string;
  /** Also the regional frequency analysis of the series as one region's sites. */
  readonly regional?: boolean;
  readonly csv: CsvOptions;
  readonly options: DatasetOptions;
}

export interface BatchIo {
  out(s: string): void;
  err(s: string): void;
  readonly workerEntry?: URL;
  /** Milliseconds since some origin (tests pass a fake clock). */
  now?(): number;
}

/** Progress on standard error for a run longer than a second: done of total, rate, time left. */
function progressReporter(total: number, io: BatchIo): { tick(done: number): void; end(done: number): void } {
  const now = io.now ?? (() => performance.now());
  const start = now();
  let last = start;
  let shown = false;
  const line = (done: number): string => {
    const seconds = (now() - start) / 1000;
    const rate = done / Math.max(seconds, 1e-9);
    const left = rate > 0 ? (total - done) / rate : Number.NaN;
    return `plumbline: ${done} of ${total} series (${rate >= 10 ? Math.round(rate) : rate.toPrecision(2)}/s${done < total && Number.isFinite(left) ? `, about ${Math.ceil(left)} s left` : ''})\n`;
  };
  return {
    tick(done) {
      const t = now();
      if (t - last >= 1000) {
        last = t;
        shown = true;
        io.err(line(done));
      }
    },
    end(done) {
      if (shown) io.err(line(done));
    },
  };
}

export async function runBatch(args: BatchArgs, io: BatchIo, given?: InputText): Promise<number> {
  const fileLabel = args.file === '-' ? 'standard input' : args.file;
  const source = given ?? readInputText(args.file);
  const read = readBatch(source.text, args, args.csv);
  for (const w of [...source.warnings, ...read.warnings]) io.err(`plumbline: warning: ${w}\n`);
  const records: SeriesRecord[] = read.series.filter((s) => inShard(s.key, args.shard));
  const summaries: (SeriesSummary | undefined)[] = new Array<SeriesSummary | undefined>(records.length);
  const progress = progressReporter(records.length, io);
  let done = 0;
  await analyzeAll(records, args.options, io.workerEntry, (d) => {
    if (args.json) io.out(`${d.json}\n`);
    summaries[d.id] = d.summary;
    done++;
    progress.tick(done);
  });
  progress.end(done);
  const rows = summaries.filter((s): s is SeriesSummary => s !== undefined);
  if (args.summaryCsv !== undefined) writeFileSync(args.summaryCsv, summaryCsv(rows));
  // The region: every analysed series as a site (series with an error are left out and named).
  const region = args.regional ? regionalOf(records, args) : null;
  if (!args.json) {
    const shardText = args.shard ? `, shard ${args.shard.index} of ${args.shard.count} (${records.length} of ${read.series.length} series)` : '';
    io.out(summaryTable(rows, `${fileLabel}: ${read.layout}${shardText}`));
    if (region) io.out(regionalText(region));
  } else if (region) io.out(`${JSON.stringify({ region })}\n`);
  return 0;
}

function regionalOf(records: readonly SeriesRecord[], args: BatchArgs): RegionalReport {
  const sites = records.filter((r): r is SeriesValues => r.kind === 'values').map((r) => ({ name: r.key, values: r.values }));
  const periods = args.options.returnPeriods;
  return regionalAnalysis(sites, { ...(periods ? { periods } : {}), ...(args.options.seed !== undefined ? { seed: args.options.seed } : {}) });
}

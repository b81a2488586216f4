/**
 * `plumbline merge FILE...`: join the JSON Lines of a batch's shards (or of any batch runs) into one
 * summary. Lines are read one at a time, so memory holds one summary line per series, not the
 * reports. A series found twice (overlapping shards, a file given twice) is an error naming both
 * places. The summary is sorted by series key, so the merge of N shards equals the single run's
 * summary sorted the same way. `--json` passes the lines through (in file order) after the same checks;
 * `--csv` prints the summary as CSV.
 */
import { createReadStream } from 'node:fs';
import { createInterface } from 'node:readline';
import { InputError, summarizeSeries, summaryCsv, type SeriesLine, type SeriesSummary } from '../core/index.js';
import { summaryTable } from './batch-summary-text.js';

export interface MergeArgs {
  readonly files: readonly string[];
  readonly format: 'text' | 'csv' | 'json';
}

function isSeriesLine(v: unknown): v is SeriesLine {
  if (typeof v !== 'object' || v === null) return false;
  const o = v as Record<string, unknown>;
  return typeof o.series === 'string' && ((typeof o.report === 'object' && o.report !== null) || (typeof o.error === 'object' && o.error !== null));
}

export async function runMerge(args: MergeArgs, io: { out(s: string): void }): Promise<number> {
  if (args.files.length === 0) throw new InputError('merge needs the JSON Lines files of the runs to join (plumbline merge a.jsonl b.jsonl ...)', {}, 'bad-option');
  const where = new Map<string, string>();
  const rows: SeriesSummary[] = [];
  for (const file of args.files) {
    const stream = createReadStream(file === '-' ? '/dev/stdin' : file, { encoding: 'utf8' });
    const failed = new Promise<never>((_, reject) =>
      stream.on('error', (e: NodeJS.ErrnoException) => reject(new InputError(`cannot read ${JSON.stringify(file)}: ${e.code === 'ENOENT' ? 'no such file' : e.message}`, {}, 'bad-input'))),
    );
    const lines = createInterface({ input: stream, crlfDelay: Infinity });
    let lineNo = 0;
    const reading = (async () => {
      for await (const text of lines) {
        lineNo++;
        if (text.trim() === '') continue;
        let v: unknown;
        try {
          v = JSON.parse(text);
        } catch {
          throw new InputError(`${file}, line ${lineNo}: not a JSON object (a batch writes one { "series", "report" | "error" } object per line)`, { row: lineNo }, 'bad-input');
        }
        // A batch run with --regional ends with its region's line; it belongs to that run, not to a series.
        if (typeof v === 'object' && v !== null && 'region' in v) continue;
        if (!isSeriesLine(v)) throw new InputError(`${file}, line ${lineNo}: not a batch line (needs "series" and "report" or "error")`, { row: lineNo }, 'bad-input');
        const here = `${file}, line ${lineNo}`;
        const before = where.get(v.series);
        if (before !== undefined) throw new InputError(`series ${JSON.stringify(v.series)} is in ${before} and again in ${here}: the runs overlap`, { row: lineNo, value: v.series }, 'bad-input');
        where.set(v.series, here);
        rows.push(summarizeSeries(v));
        if (args.format === 'json') io.out(`${text}\n`);
      }
    })();
    await Promise.race([reading, failed]);
  }
  rows.sort((a, b) => (a.series < b.series ? -1 : a.series > b.series ? 1 : 0));
  if (args.format === 'csv') io.out(summaryCsv(rows));
  else if (args.format === 'text') io.out(summaryTable(rows, `merged ${args.files.length} file${args.files.length === 1 ? '' : 's'}`));
  return 0;
}

/**
 * The batch options of a parsed command line (core/options/batch.ts) as cli/batch.ts's arguments.
 */
import { InputError, datasetOptionsFrom, type OptionValue } from '../core/index.js';
import { columnArg, csvArgs, flagArg, type AnalyzeArgs } from './args.js';
import type { BatchArgs } from './batch.js';

/** Whether the command line asks for a batch (a key column or a list of series columns). */
export function isBatch(args: AnalyzeArgs): boolean {
  return args.options.has('by') || args.options.has('columns');
}

function shardOf(v: OptionValue | undefined): BatchArgs['shard'] {
  if (typeof v !== 'string') return null;
  const [i, n] = v.split('/').map(Number) as [number, number];
  if (!(i < n)) throw new InputError(`--shard ${v}: the shard index must be below the number of shards (shards are numbered 0 to ${n - 1})`, { value: v }, 'bad-option');
  return { index: i, count: n };
}

export function batchArgs(args: AnalyzeArgs): BatchArgs {
  const columns = args.options.get('columns');
  const list = Array.isArray(columns) ? (columns as readonly string[]) : typeof columns === 'string' ? [columns] : undefined;
  const by = columnArg(args, 'by');
  const column = columnArg(args, 'column');
  const censor = columnArg(args, 'statusColumn');
  const summary = args.options.get('summaryCsv');
  return {
    file: args.file,
    json: flagArg(args, 'json'),
    shard: shardOf(args.options.get('shard')),
    csv: csvArgs(args),
    options: datasetOptionsFrom(args.options),
    ...(by !== undefined ? { by } : {}),
    ...(column !== undefined ? { column } : {}),
    ...(censor !== undefined ? { censorColumn: censor } : {}),
    ...(list !== undefined ? { columns: list.length === 1 && list[0] === 'all-numeric' ? 'all-numeric' : list } : {}),
    ...(typeof summary === 'string' ? { summaryCsv: summary } : {}),
    ...(flagArg(args, 'regional') ? { regional: true } : {}),
  };
}

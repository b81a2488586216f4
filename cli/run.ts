/**
 * `plumbline` as a function of its arguments (so tests and main.ts share it): parse the options,
 * read the CSV column, analyse it, print the JSON or text report. Returns the exit code.
 */
import {
  InputError,
  PLUMBLINE_VERSION,
  datasetOptionsFrom,
  isPlumblineError,
  readColumn,
  type AnyDatasetReport,
  type ColumnResult,
  type DatasetInput,
  type DatasetOptions,
  type PlumblineError,
} from '../core/index.js';
import { analyzeWithProgress } from './analyze-progress.js';
import { columnArg, csvArgs, flagArg, parseArgs, type AnalyzeArgs } from './args.js';
import { helpText } from './help.js';
import { cliInput, type CliInput } from './input-summary.js';
import { needsTable, readDataset, withFileRow } from './read-dataset.js';
import { readInputText, type InputText } from './read-input.js';
import { isParquetFile, parquetAsText } from './read-parquet.js';
import { PIECES_MIN_BYTES, readColumnInPieces, regularFileSize } from './read-pieces.js';
import { createProgress, type Progress } from './progress.js';
import { batchArgs, isBatch } from './batch-args.js';
import { runBatch } from './batch.js';
import { runMerge } from './merge.js';
import { PARALLEL_MIN_N, secondThread, type SecondThread } from './second-thread.js';
import { statusColumnHint } from './status-hint.js';
import { groupedTextReport } from './grouped-text.js';
import { textReport } from './text-report.js';
import { isRecordedLife, runRecordedLife } from './life-recorded.js';
import { isFloodEma, runFloodEma } from './flood-ema.js';
import { isFloodPot, runFloodPot } from './flood-pot.js';
import { runPlanCommand } from './life-plan.js';

export interface CliIo {
  out(s: string): void;
  err(s: string): void;
  /** The command's own module file, to run the second thread from (cli/second-thread.ts); none: one thread. */
  readonly workerEntry?: URL;
  /** Show bootstrap progress on `err` when a run takes longer than a second (the command does; runCli's other callers choose). */
  readonly progress?: boolean;
  /** Standard error is a terminal (progress rewrites one line). */
  readonly errTty?: boolean;
}

const SILENT: Progress = { replicates: () => {}, end: () => {} };

/** Exit codes (sysexits.h style for the internal error). */
export const EXIT_OK = 0;
export const EXIT_USER = 2;
export const EXIT_INTERNAL = 70;

const USER_CODES = new Set([
  'bad-input',
  'bad-option',
  'csv-parse',
  'not-a-number',
  'too-few-values',
  'needs-assumed-shape',
  'no-column',
  'bins-too-many',
  'not-computable',
]);

/** The core speaks of settings; on the command line they are options. */
function asOptions(message: string): string {
  return message
    .replace(/the decimal-comma setting/g, '--decimal-comma')
    .replace(/set the delimiter/g, 'use --delimiter')
    .replace(/read it without one/g, 'use --no-header')
    .replace(/choose one by name or index/g, 'choose one with --column NAME or --column INDEX')
    .replace(/choose one by its index/g, 'choose one with --column INDEX')
    .replace(/choose such a column by index/g, 'choose such a column with --column INDEX');
}

function oneLine(s: string): string {
  return s.replace(/\s*[\r\n]+\s*/g, ' ').trim();
}

export type JsonReport = AnyDatasetReport & {
  readonly input: CliInput;
};

/**
 * Read the file and its value column (with the status, subgroup, order or grouped columns when
 * asked for); the file's text is not kept once the columns are read.
 */
function readInput(
  args: AnalyzeArgs,
  fileLabel: string,
  source: InputText = readInputText(args.file),
  /** The values on shared memory (read by the second thread without a copy). */
  shared = false,
): { read: ColumnResult; input: CliInput; dataset: DatasetInput; rowNumbers?: Int32Array; hint?: string | null } {
  const csv = csvArgs(args);
  if (needsTable(args)) {
    const d = readDataset(source.text, args, fileLabel, csv);
    const input = cliInput(fileLabel, d.column, csv.decimal, source.encoding, source.warnings);
    return { read: d.column, input: { ...input, otherColumns: d.extraColumns }, dataset: d.input, rowNumbers: d.rowNumbers };
  }
  const column = columnArg(args, 'column');
  // The values as the scanner grew them (no final copy): the core sorts them where they are.
  const read = readColumn(source.text, { ...(column !== undefined ? { column } : {}), ...csv }, { shared, handOff: true });
  const hint = statusColumnHint(source.text, read, csv);
  return { read, input: cliInput(fileLabel, read, csv.decimal, source.encoding, source.warnings), dataset: { values: read.values, sortInPlace: true }, hint };
}

/** A large file's one value column, read in pieces (cli/read-pieces.ts): never one string. */
function readLargeColumn(args: AnalyzeArgs, fileLabel: string, shared: boolean): { read: ColumnResult; input: CliInput; dataset: DatasetInput; rowNumbers?: Int32Array; hint?: string | null } {
  const csv = csvArgs(args);
  const column = columnArg(args, 'column');
  const r = readColumnInPieces(args.file, { ...(column !== undefined ? { column } : {}), ...csv }, undefined, undefined, shared);
  // The values are not needed in file order afterwards: the core sorts them where they are.
  return { read: r.read, input: cliInput(fileLabel, r.read, csv.decimal, r.encoding, r.warnings), dataset: { values: r.read.values, sortInPlace: true } };
}

/** Whether to read the file in pieces: one value column from a regular file past PIECES_MIN_BYTES. */
function readsInPieces(args: AnalyzeArgs): boolean {
  if (needsTable(args)) return false;
  const size = regularFileSize(args.file);
  return size !== null && size >= PIECES_MIN_BYTES;
}

function analyzeCommand(args: AnalyzeArgs, io: CliIo, source?: InputText): number {
  if (isRecordedLife(args)) return runRecordedLife(args, io);
  if (isFloodPot(args)) return runFloodPot(args, io);
  if (isFloodEma(args)) return runFloodEma(args, io);
  const fileLabel = args.file === '-' ? 'standard input' : args.file;
  const options = datasetOptionsFrom(args.options);
  // A file that may hold PARALLEL_MIN_N values: the second thread starts now, while the file is read.
  const size = source === undefined ? regularFileSize(args.file) : null;
  const second = io.workerEntry ? secondThread(io.workerEntry, options, size !== null && size >= EARLY_THREAD_MIN_BYTES) : null;
  try {
    return analyzeRead(args, io, fileLabel, options, second, source);
  } finally {
    second?.stop();
  }
}

/** Largest file whose values are read onto shared memory (about 2^24 rows of 8-10 characters; common practice, no source: measured here). */
const SHARED_MAX_BYTES = 192 * 2 ** 20;

/** Files at least this large start the second thread before reading (~10 bytes a row: PARALLEL_MIN_N rows). */
const EARLY_THREAD_MIN_BYTES = 10 * PARALLEL_MIN_N;

function analyzeRead(args: AnalyzeArgs, io: CliIo, fileLabel: string, options: DatasetOptions, second: SecondThread | null, source?: InputText): number {
  // Values on shared memory (read by the second thread without a copy) only up to SHARED_MAX_BYTES of
  // file: V8 sorts a typed array on shared memory through a copy of it, which 10^8 values cannot afford.
  const shared = second !== null && (regularFileSize(args.file) ?? Infinity) <= SHARED_MAX_BYTES;
  const { read, input, dataset, rowNumbers, hint } =
    source !== undefined ? readInput(args, fileLabel, source, shared) : readsInPieces(args) ? readLargeColumn(args, fileLabel, shared) : readInput(args, fileLabel, undefined, shared);
  if (hint) io.err(`plumbline: warning: ${hint}\n`);
  if (read.values.length === 0) {
    const dropped = read.skipped.reduce((a, s) => a + s.count, 0);
    throw new InputError(
      read.rowsRead === 0
        ? `${fileLabel} has no data rows under its header`
        : `column ${JSON.stringify(read.column)} has no usable values: all ${dropped} data rows were dropped (${read.skipped.map((s) => `${s.count} ${s.reason}`).join(', ')})`,
      { column: read.column },
      'too-few-values',
    );
  }
  let report: AnyDatasetReport;
  try {
    // The bootstrap reports progress on stderr when the run takes longer than a second (cli/progress.ts).
    const progress = io.progress === true ? createProgress((s) => io.err(s), { tty: io.errTty === true }) : SILENT;
    report = analyzeWithProgress(dataset, second !== null ? { ...options, delegated: second } : options, progress);
  } catch (e) {
    throw withFileRow(e, fileLabel, dataset.grouped ? rowNumbers : undefined);
  }
  const inputShown: CliInput = { ...input, warnings: input.warnings.map(asOptions) };
  if (flagArg(args, 'json')) {
    const out: JsonReport = { ...report, input: inputShown };
    io.out(`${JSON.stringify(out, null, 2)}\n`);
  } else {
    io.out(report.dataKind === 'grouped' ? groupedTextReport(report, inputShown) : textReport(report, inputShown));
  }
  return EXIT_OK;
}

function userMessage(e: PlumblineError, file: string | undefined): string {
  let m = oneLine(asOptions(e.message));
  if (e.code === 'not-a-number') m += '; rows like this can be dropped (and counted) with --skip-invalid';
  if (file !== undefined && (e.code === 'not-a-number' || e.code === 'csv-parse') && e.place.row !== undefined) {
    m = `${file}: ${m}`;
  }
  return m;
}

/**
 * Run the command. A single analysis returns its exit code at once; a batch (--by, --columns) and
 * `merge` run on worker threads and streams, and return a promise of it.
 */
export function runCli(argv: readonly string[], io: CliIo): number | Promise<number> {
  let file: string | undefined;
  const fail = (e: unknown): number => {
    if (isPlumblineError(e) && USER_CODES.has(e.code)) {
      io.err(`plumbline: error: ${userMessage(e, file)}\n`);
      return EXIT_USER;
    }
    const message = e instanceof Error ? e.message : String(e);
    io.err(`plumbline: internal error: ${oneLine(message)} (this is a bug; please report it with the command that caused it)\n`);
    if (process.env.PLUMBLINE_DEBUG && e instanceof Error && e.stack) io.err(`${e.stack}\n`);
    return EXIT_INTERNAL;
  };
  try {
    const args = parseArgs(argv);
    if (args.command === 'help') {
      io.out(helpText());
      return EXIT_OK;
    }
    if (args.command === 'version') {
      io.out(`plumbline ${PLUMBLINE_VERSION}\n`);
      return EXIT_OK;
    }
    if (args.command === 'merge') return runMerge(args, io).catch(fail);
    if (args.command === 'plan') return runPlanCommand(args.options, io);
    file = args.file === '-' ? 'standard input' : args.file;
    if (isParquetFile(args.file)) {
      return parquetAsText(args.file)
        .then((source) => (isBatch(args) ? runBatch(batchArgs(args), io, source) : analyzeCommand(args, io, source)))
        .catch(fail);
    }
    if (isBatch(args)) return runBatch(batchArgs(args), io).catch(fail);
    return analyzeCommand(args, io);
  } catch (e) {
    return fail(e);
  }
}

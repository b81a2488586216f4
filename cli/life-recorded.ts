/**
 * `plumbline analyze FILE` for life data as recorded: interval rows (--interval-columns START,END
 * with an optional --count-column), or times with --censor-column, optionally a --mode-column,
 * an --assumed-shape (Weibayes) and --estimation rank-regression; a test plan (--plan-*) is printed
 * after the analysis when asked for. Reads the columns with the one CSV reader, calls the core's
 * analyzeRecordedLife, prints the text or JSON report.
 */
import {
  InputError,
  analyzeRecordedLife,
  columnSelector,
  readIntervalRows,
  parseStrictNumber,
  readColumns,
  readFailureModes,
  readIntervalModes,
  type ColumnRequest,
  type NumberColumn,
  type OptionValue,
  type RecordedLifeInput,
  type RecordedLifeOptions,
  type RecordedLifeReport,
  type TextColumn,
} from '../core/index.js';
import { columnArg, csvArgs, flagArg, type AnalyzeArgs } from './args.js';
import { planFromOptions, type PlanOutcome } from './life-plan.js';
import { recordedLifeText } from './life-text.js';
import { readInputText } from './read-input.js';

export interface LifeCliIo {
  out(s: string): void;
}

/** Whether this run is life data as recorded (rather than today's complete or time + status analysis). */
export function isRecordedLife(args: AnalyzeArgs): boolean {
  const o = args.options;
  return o.has('intervalColumns') || o.has('modeColumn') || o.has('assumedShape') || o.has('planReliability') || (o.get('estimation') === 'rank-regression' && o.has('statusColumn'));
}

export interface RecordedLifeRead {
  readonly input: RecordedLifeInput;
  readonly columns: readonly { readonly role: string; readonly column: string }[];
  readonly rows: number;
  /** What the reading noticed in the failure-mode column (core readFailureModes), naming the rows. */
  readonly warnings: readonly string[];
}

export function readRecordedLife(text: string, args: AnalyzeArgs, file: string): RecordedLifeRead {
  const csv = csvArgs(args);
  const interval = args.options.get('intervalColumns') as readonly string[] | undefined;
  const count = columnArg(args, 'countColumn');
  const mode = columnArg(args, 'modeColumn');
  const inspections = columnArg(args, 'inspectionTimesColumn');
  if (interval) {
    if (interval.length !== 2) throw new InputError('--interval-columns takes two columns: START,END', {}, 'bad-option');
    const r = readIntervalRows(
      text,
      { start: columnSelector(interval[0]!), end: columnSelector(interval[1]!), ...(count !== undefined ? { count: columnSelector(count) } : {}), ...(mode !== undefined ? { mode: columnSelector(mode) } : {}), ...(inspections !== undefined ? { inspections: columnSelector(inspections) } : {}) },
      csv,
      file,
    );
    const read = readIntervalModes(r, (line) => `${file}: row ${line}`);
    return {
      input: { interval: r.interval, ...(read ? { modes: read.modes } : {}) },
      columns: r.columns.map((c) => ({ role: c.role, column: c.column })),
      rows: r.interval.start.length,
      warnings: read?.notes ?? [],
    };
  }
  const requests: ColumnRequest[] = [];
  const roles: string[] = [];
  const value = columnArg(args, 'column');
  const status = columnArg(args, 'statusColumn');
  if (value === undefined || status === undefined) {
    throw new InputError('life data need either --interval-columns START,END or --column TIMES with --censor-column STATUS', {}, 'bad-option');
  }
  requests.push({ select: columnSelector(value), kind: 'number' }, { select: columnSelector(status), kind: 'text' });
  roles.push('times', 'status');
  if (mode !== undefined) {
    requests.push({ select: columnSelector(mode), kind: 'text', keepBlank: true });
    roles.push('failure mode');
  }
  const t = readColumns(text, requests, csv);
  const rows = t.rowNumbers;
  const labels = t.columns.map((c, i) => ({ role: roles[i] as string, column: c.column }));
  const times = (t.columns[0] as NumberColumn).values;
  const st = t.columns[1] as TextColumn;
  const failed = st.texts.map((x, i) => {
    const v = parseStrictNumber(x, csv.decimal);
    if (v !== 0 && v !== 1) {
      throw new InputError(`${file}: row ${rows[i] as number}, column ${JSON.stringify(st.column)}: status ${JSON.stringify(x)} is not 1 (failed) or 0 (still running or removed unfailed)`, { row: rows[i] as number, column: st.column, value: x }, 'bad-input');
    }
    return v;
  });
  const mc = mode !== undefined ? (t.columns[2] as TextColumn) : undefined;
  const read = mc ? readFailureModes(mc.texts, failed, { row: (i) => rows[i] as number, cell: (i) => `${file}: row ${rows[i] as number}`, column: mc.column }) : null;
  return { input: { times, failed, ...(read ? { modes: read.modes } : {}) }, columns: labels, rows: rows.length, warnings: read?.notes ?? [] };
}

export function recordedLifeOptions(o: ReadonlyMap<string, OptionValue>): RecordedLifeOptions {
  const get = <T>(name: string): T | undefined => (o.has(name) ? (o.get(name) as T) : undefined);
  const out: Record<string, unknown> = {
    families: get('families'),
    bLifePercents: get('bLifePercents'),
    reliabilityTimes: get('reliabilityTimes'),
    confidence: get('confidence'),
    boundMethod: get('boundMethod'),
    estimation: get('estimation'),
    assumedShape: get('assumedShape'),
    replicates: get('replicates'),
    seed: get('seed'),
    alpha: get('alpha'),
  };
  for (const k of Object.keys(out)) if (out[k] === undefined || out[k] === null) delete out[k];
  if (out.estimation !== undefined && out.estimation !== 'ml' && out.estimation !== 'rank-regression') {
    throw new InputError(`--estimation ${String(out.estimation)} is for the flood section; life data take ml or rank-regression`, {}, 'bad-option');
  }
  return out as RecordedLifeOptions;
}

export interface RecordedLifeJson {
  readonly dataKind: 'recorded-life';
  readonly input: { readonly file: string; readonly rows: number; readonly columns: RecordedLifeRead['columns']; readonly warnings: readonly string[] };
  readonly life: RecordedLifeReport | null;
  readonly plan: PlanOutcome | null;
}

export function runRecordedLife(args: AnalyzeArgs, io: LifeCliIo): number {
  const file = args.file === '-' ? 'standard input' : args.file;
  const plan = planFromOptions(args.options);
  const analyses = args.options.has('intervalColumns') || args.options.has('statusColumn');
  let life: RecordedLifeReport | null = null;
  let read: RecordedLifeRead | null = null;
  if (analyses) {
    const source = readInputText(args.file);
    read = readRecordedLife(source.text, args, file);
    life = analyzeRecordedLife(read.input, recordedLifeOptions(args.options));
  } else if (!plan) {
    throw new InputError('give the life data (--interval-columns START,END, or --column with --censor-column) or a test plan (--plan-reliability with --plan-time and --assumed-shape)', {}, 'bad-option');
  }
  const json: RecordedLifeJson = { dataKind: 'recorded-life', input: { file, rows: read?.rows ?? 0, columns: read?.columns ?? [], warnings: read?.warnings ?? [] }, life, plan };
  if (flagArg(args, 'json')) io.out(`${JSON.stringify(json, null, 2)}\n`);
  else io.out(recordedLifeText(json));
  return 0;
}

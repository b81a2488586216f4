/**
 * `plumbline analyze FILE --threshold U --date-column DATE --column VALUE [--min-separation D]
 * [--estimation ml|lmoments] [--return-periods ...] [--confidence C] [--json]` — peaks over a
 * threshold (core peaksOverThreshold): runs declustering, generalized Pareto fit, return levels per
 * year with profile-likelihood intervals (ML), and the threshold diagnostics (mean excess and
 * parameter stability across thresholds) for choosing the threshold.
 */
import {
  EMA_CAUTIONS,
  InputError,
  peaksOverThreshold,
  readColumns,
  thresholdDiagnostics,
  type NumberColumn,
  type PotReturnLevel,
  type TextColumn,
  type ThresholdDiagnostic,
} from '../core/index.js';
import { columnArg, csvArgs, flagArg, type AnalyzeArgs } from './args.js';
import { readInputText } from './read-input.js';

export interface PotCliIo {
  out(s: string): void;
}

export function isFloodPot(args: AnalyzeArgs): boolean {
  return args.options.has('threshold');
}

function selector(s: string): string | number {
  return /^[1-9][0-9]*$/.test(s.trim()) ? Number(s.trim()) : s;
}

/** Days since 1970-01-01 of a YYYY-MM-DD date (UTC). */
function dayNumber(text: string, row: number, column: string): number {
  const m = /^(\d{4})-(\d{2})-(\d{2})/.exec(text.trim());
  if (!m) throw new InputError(`row ${row}, column ${JSON.stringify(column)}: the date ${JSON.stringify(text)} is not YYYY-MM-DD`, { row, column, value: text }, 'bad-input');
  return Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])) / 86_400_000;
}

export interface FloodPotJson {
  readonly dataKind: 'flood-pot';
  readonly input: { readonly file: string; readonly rows: number; readonly dateColumn: string; readonly valueColumn: string };
  readonly threshold: number;
  readonly minSeparationDays: number;
  readonly clusters: number;
  readonly years: number;
  readonly ratePerYear: number;
  readonly candidates: readonly {
    readonly family: 'genpareto';
    readonly estimation: 'ml' | 'lmoments';
    readonly parameters: { readonly threshold: number; readonly scale: number; readonly shape: number };
    readonly logLikelihood: number | null;
    readonly converged: boolean;
    readonly method: string;
    readonly returnLevels: readonly PotReturnLevel[];
  }[];
  readonly diagnostics: readonly ThresholdDiagnostic[];
  readonly cautions: readonly string[];
}

export function runFloodPotJson(args: AnalyzeArgs): FloodPotJson {
  const o = args.options;
  const threshold = o.get('threshold') as number;
  const sep = (o.get('minSeparation') as number | undefined) ?? 3;
  const dateCol = columnArg(args, 'dateColumn');
  const valueCol = columnArg(args, 'column');
  if (dateCol === undefined || valueCol === undefined) throw new InputError('peaks over a threshold need --date-column DATES and --column VALUES', {}, 'bad-option');
  const est = o.get('estimation') ?? 'ml';
  if (est !== 'ml' && est !== 'lmoments') throw new InputError(`--estimation ${String(est)} does not apply to peaks over a threshold; use ml or lmoments`, {}, 'bad-option');
  const file = args.file === '-' ? 'standard input' : args.file;
  const t = readColumns(readInputText(args.file).text, [{ select: selector(dateCol), kind: 'text' }, { select: selector(valueCol), kind: 'number' }], csvArgs(args));
  const dc = t.columns[0] as TextColumn;
  const vc = t.columns[1] as NumberColumn;
  const times = dc.texts.map((x, i) => dayNumber(x, t.rowNumbers[i] as number, dc.column));
  const values = Array.from(vc.values);
  const periods = (o.get('returnPeriods') as readonly number[] | undefined) ?? [2, 5, 10, 25, 50, 100];
  const confidence = (o.get('confidence') as number | undefined) ?? 0.95;
  const r = peaksOverThreshold(times, values, { threshold, minSeparation: sep, estimation: est, periods, confidence });
  // Diagnostics on 15 thresholds from the 80th percentile of the values up to the value with 15 exceedances.
  const sorted = [...values].sort((a, b) => a - b);
  const lo = sorted[Math.floor(0.8 * (sorted.length - 1))] as number;
  const hi = sorted[Math.max(0, sorted.length - 16)] as number;
  const grid = Array.from({ length: 15 }, (_, i) => lo + ((hi - lo) * i) / 14);
  const diagnostics = hi > lo ? thresholdDiagnostics(times, values, grid, sep) : [];
  return {
    dataKind: 'flood-pot',
    input: { file, rows: values.length, dateColumn: dc.column, valueColumn: vc.column },
    threshold,
    minSeparationDays: sep,
    clusters: r.exceedances,
    years: r.years,
    ratePerYear: r.rate,
    candidates: [
      {
        family: 'genpareto',
        estimation: est,
        parameters: { threshold, scale: r.fit.scale, shape: r.fit.shape },
        logLikelihood: r.fit.logLikelihood,
        converged: r.fit.converged,
        method: r.fit.method,
        returnLevels: r.returnLevels,
      },
    ],
    diagnostics,
    cautions: [
      'The threshold is a choice: the mean excess should be close to linear, and the shape and modified scale close to constant, above it (see the diagnostics); results change with it.',
      'Events are assumed independent after declustering; a minimum separation shorter than the time a flood takes to pass joins nothing and counts one flood several times.',
      ...EMA_CAUTIONS.slice(0, 1),
    ],
  };
}

function fmt(x: number | null, d = 4): string {
  return x === null || !Number.isFinite(x) ? '—' : String(Number(x.toPrecision(d)));
}

export function floodPotText(j: FloodPotJson): string {
  const c = j.candidates[0]!;
  const L: string[] = [];
  L.push(`Peaks over a threshold — ${j.input.file}: ${j.input.valueColumn} by ${j.input.dateColumn}, ${j.input.rows} rows`);
  L.push(`Threshold ${fmt(j.threshold)}, events separated by at least ${fmt(j.minSeparationDays)} days: ${j.clusters} event peaks in ${fmt(j.years)} years (${fmt(j.ratePerYear)} per year).`);
  L.push(`Generalized Pareto excesses (${c.method}): scale ${fmt(c.parameters.scale)}, shape ${fmt(c.parameters.shape)}${c.logLikelihood !== null ? `, log-likelihood ${fmt(c.logLikelihood, 8)}` : ''}${c.converged ? '' : ' (not converged)'}.`);
  L.push('');
  L.push(`Return levels (${c.returnLevels[0]?.method ?? ''}):`);
  L.push('  period (years)   level       lower       upper');
  for (const r of c.returnLevels) L.push(`  ${String(r.period).padEnd(16)} ${fmt(r.estimate).padEnd(11)} ${fmt(r.lower).padEnd(11)} ${fmt(r.upper)}`);
  if (j.diagnostics.length > 0) {
    L.push('');
    L.push('Threshold diagnostics (choose a threshold above which mean excess is near-linear and shape / modified scale near-constant):');
    L.push('  threshold    events   mean excess   shape     modified scale');
    for (const d of j.diagnostics) L.push(`  ${fmt(d.threshold).padEnd(12)} ${String(d.clusters).padEnd(8)} ${fmt(d.meanExcess).padEnd(13)} ${fmt(d.shape, 3).padEnd(9)} ${fmt(d.modifiedScale)}`);
  }
  L.push('');
  L.push('Cautions:');
  for (const w of j.cautions) L.push(`  - ${w}`);
  return `${L.join('\n')}\n`;
}

export function runFloodPot(args: AnalyzeArgs, io: PotCliIo): number {
  const j = runFloodPotJson(args);
  io.out(flagArg(args, 'json') ? `${JSON.stringify(j, null, 2)}\n` : floodPotText(j));
  return 0;
}

/**
 * `plumbline analyze FILE --threshold U --date-column DATE --column VALUE [--min-separation D]
 * [--estimation ml|lmoments] [--return-periods ...] [--confidence C] [--json]` — peaks over a
 * threshold (core peaksOverThreshold): runs declustering, generalized Pareto fit, return levels per
 * year with profile-likelihood intervals (ML), and the threshold diagnostics (mean excess and
 * parameter stability across thresholds) for choosing the threshold. The numbers are the report
 * section the API and the page get for a dated series (core/workflow/flood-pot.ts potSection).
 */
import {
  DEFAULT_CONFIDENCE,
  dayNumbers,
  InputError,
  potSection,
  readColumns,
  type NumberColumn,
  type PotSection,
  type TextColumn,
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

/** The CLI's JSON: where the series came from, then the report section the API and the page get (core/workflow potSection). */
export interface FloodPotJson extends PotSection {
  readonly dataKind: 'flood-pot';
  readonly input: { readonly file: string; readonly rows: number; readonly dateColumn: string; readonly valueColumn: string };
}

export function runFloodPotJson(args: AnalyzeArgs): FloodPotJson {
  const o = args.options;
  const threshold = o.get('threshold') as number;
  const sep = o.get('minSeparation') as number | undefined;
  const dateCol = columnArg(args, 'dateColumn');
  const valueCol = columnArg(args, 'column');
  if (dateCol === undefined || valueCol === undefined) throw new InputError('peaks over a threshold need --date-column DATES and --column VALUES', {}, 'bad-option');
  const est = o.get('estimation') ?? 'ml';
  if (est !== 'ml' && est !== 'lmoments') throw new InputError(`--estimation ${String(est)} does not apply to peaks over a threshold; use ml or lmoments`, {}, 'bad-option');
  const file = args.file === '-' ? 'standard input' : args.file;
  const t = readColumns(readInputText(args.file).text, [{ select: selector(dateCol), kind: 'text' }, { select: selector(valueCol), kind: 'number' }], csvArgs(args));
  const dc = t.columns[0] as TextColumn;
  const vc = t.columns[1] as NumberColumn;
  const days = dayNumbers(dc.texts, t.rowNumbers, dc.column);
  const periods = o.get('returnPeriods') as readonly number[] | undefined;
  const section = potSection(days, vc.values, {
    threshold,
    ...(sep !== undefined ? { minSeparation: sep } : {}),
    estimation: est,
    ...(periods !== undefined ? { periods } : {}),
    confidence: (o.get('confidence') as number | undefined) ?? DEFAULT_CONFIDENCE,
  });
  return { dataKind: 'flood-pot', input: { file, rows: vc.values.length, dateColumn: dc.column, valueColumn: vc.column }, ...section };
}

function fmt(x: number | null, d = 4): string {
  return x === null || !Number.isFinite(x) ? '—' : String(Number(x.toPrecision(d)));
}

export function floodPotText(j: FloodPotJson): string {
  const L: string[] = [];
  L.push(`Peaks over a threshold — ${j.input.file}: ${j.input.valueColumn} by ${j.input.dateColumn}, ${j.input.rows} rows`);
  L.push(`Threshold ${fmt(j.threshold)}, events separated by at least ${fmt(j.minSeparationDays)} days: ${j.clusters} event peaks in ${fmt(j.years)} years (${fmt(j.ratePerYear)} per year).`);
  for (const c of j.candidates) {
    L.push('');
    L.push(`Generalized Pareto excesses (${c.method}): scale ${fmt(c.parameters.scale)}, shape ${fmt(c.parameters.shape)}${c.logLikelihood !== null ? `, log-likelihood ${fmt(c.logLikelihood, 8)}` : ''}${c.converged ? '' : ' (not converged)'}.`);
    L.push(`Return levels (${c.returnLevels[0]?.method ?? ''}):`);
    L.push('  period (years)   level       lower       upper');
    for (const r of c.returnLevels) L.push(`  ${String(r.period).padEnd(16)} ${fmt(r.estimate).padEnd(11)} ${fmt(r.lower).padEnd(11)} ${fmt(r.upper)}`);
  }
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

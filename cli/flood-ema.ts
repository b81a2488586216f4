/**
 * `plumbline analyze FILE --estimation ema` — log-Pearson III by the expected moments algorithm
 * (core fitEma) on a peak file (tab-separated, '#' comments, qualification codes; core
 * readPeakFile) or on one CSV column of annual peaks (--column), with --regional-skew G
 * --regional-skew-mse M, --perception-threshold, --historical-start, --return-periods,
 * --confidence, --replicates, --seed; text report or --json.
 */
import {
  DEFAULT_EMA_REPLICATES,
  InputError,
  emaCandidateFields,
  fitFloodRecord,
  looksLikePeakFile,
  optionNamed,
  readColumns,
  readFloodRecord,
  regionalSkewOf,
  type CodeSummary,
  type EmaCandidateFields,
  type EmaRecord,
  type EmaReturnLevel,
  type NumberColumn,
} from '../core/index.js';
import { columnArg, csvArgs, flagArg, type AnalyzeArgs } from './args.js';
import { readInputText } from './read-input.js';

export interface FloodCliIo {
  out(s: string): void;
}

/** Whether this run is a log-Pearson III / EMA flood run. */
export function isFloodEma(args: AnalyzeArgs): boolean {
  const o = args.options;
  return o.get('estimation') === 'ema' || o.has('regionalSkew') || o.has('regionalSkewMse');
}

export interface FloodEmaJson {
  readonly dataKind: 'flood-ema';
  readonly input: {
    readonly file: string;
    readonly format: 'peak file' | 'csv column';
    readonly codes: readonly CodeSummary[];
    readonly historicalPeriod: { readonly firstYear: number; readonly threshold: number; readonly yearsBelow: number; readonly assumed: boolean } | null;
  };
  readonly candidates: readonly (EmaCandidateFields & { readonly returnLevels: readonly EmaReturnLevel[] })[];
  readonly warnings: readonly string[];
  readonly cautions: readonly string[];
}

/**
 * The run: a peak file read, or one CSV column taken as a systematic record, then the one fit and
 * return levels of core/workflow/flood-record.ts (the server's peak-file analysis uses the same
 * reading, pairing rule, defaults, seed and stream, so this JSON and the API's agree).
 */
export function runFloodEmaJson(args: AnalyzeArgs): FloodEmaJson {
  const file = args.file === '-' ? 'standard input' : args.file;
  const o = args.options;
  const num = (name: string): number | undefined => (typeof o.get(name) === 'number' ? (o.get(name) as number) : undefined);
  let regionalSkew: ReturnType<typeof regionalSkewOf>;
  try {
    regionalSkew = regionalSkewOf(num('regionalSkew'), num('regionalSkewMse'));
  } catch {
    throw new InputError('--regional-skew and --regional-skew-mse go together: the weighting needs both the regional skew and its mean square error', {}, 'bad-option');
  }
  const text = readInputText(args.file).text;
  let record: EmaRecord;
  let format: 'peak file' | 'csv column';
  let codes: readonly CodeSummary[] = [];
  let historicalPeriod: FloodEmaJson['input']['historicalPeriod'] = null;
  const warnings: string[] = [];
  if (looksLikePeakFile(text)) {
    const { file: f } = readFloodRecord(text, { perceptionThreshold: num('perceptionThreshold') ?? null, historicalStart: num('historicalStart') ?? null });
    record = f.record;
    format = 'peak file';
    codes = f.codes;
    historicalPeriod = f.historicalPeriod;
    warnings.push(...f.warnings);
  } else {
    const column = columnArg(args, 'column');
    const t = readColumns(text, [{ select: column === undefined ? 1 : /^[1-9][0-9]*$/.test(column) ? Number(column) : column, kind: 'number' }], csvArgs(args));
    record = { peaks: Array.from((t.columns[0] as NumberColumn).values) };
    format = 'csv column';
  }
  const periods = o.get('returnPeriods') as readonly number[] | undefined;
  const run = fitFloodRecord(record, {
    regionalSkew,
    ...(periods !== undefined ? { periods } : {}),
    confidence: num('confidence') ?? 0.9,
    replicates: num('replicates') ?? DEFAULT_EMA_REPLICATES,
    // The option table's seed when none is given: the API and the page use the same.
    seed: num('seed') ?? (optionNamed('seed')?.default as number),
  });
  if (run.notConverged) warnings.push(run.notConverged);
  return {
    dataKind: 'flood-ema',
    input: { file, format, codes, historicalPeriod },
    candidates: [{ ...emaCandidateFields(run.fit), returnLevels: run.returnLevels }],
    warnings,
    cautions: run.cautions,
  };
}

function fmt(x: number | null, digits = 4): string {
  if (x === null || !Number.isFinite(x)) return '—';
  return String(Number(x.toPrecision(digits)));
}

export function floodEmaText(j: FloodEmaJson): string {
  const c = j.candidates[0];
  if (!c) return '';
  const L: string[] = [];
  L.push(`Flood frequency: log-Pearson type III by the expected moments algorithm — ${j.input.file} (${j.input.format})`);
  L.push('');
  const k = c.counts;
  L.push(`Record: ${k.years} years — ${k.peaks} systematic peaks, ${k.historicalPeaks} historic peaks, ${k.historicalYearsBelow} historical years below the perception threshold, ${k.intervals} peaks known only within bounds, ${k.zeros} zero flows.`);
  if (j.input.historicalPeriod) {
    const h = j.input.historicalPeriod;
    L.push(`Historical period from ${h.firstYear}, perception threshold ${fmt(h.threshold)}${h.assumed ? ' (assumed; see the warnings)' : ''}.`);
  }
  L.push(
    c.lowOutliers.count > 0
      ? `Low outliers: ${c.lowOutliers.count} peaks below ${fmt(c.lowOutliers.threshold)} treated as censored (known only to lie below it) — ${c.lowOutliers.method ?? ''}.`
      : `Low outliers: none${c.lowOutliers.method ? ` (${c.lowOutliers.method})` : ''}.`,
  );
  if (j.input.codes.length > 0) {
    L.push('Qualification codes found:');
    for (const code of j.input.codes) L.push(`  ${code.code.padEnd(3)} ×${String(code.count).padEnd(4)} ${code.meaning} — ${code.effect}`);
  }
  L.push('');
  L.push(`Moments of log10 flow: mean ${fmt(c.parameters.mean, 6)}, standard deviation ${fmt(c.parameters.sd, 5)}, skew ${fmt(c.parameters.skew, 4)}${c.converged ? '' : ' (not converged)'} (${c.iterations} EMA steps).`);
  const s = c.skew;
  if (s.regionalSkew !== null) {
    L.push(
      `Skew: station ${fmt(s.stationSkew)} (MSE ${fmt(s.stationSkewMse, 3)}), regional ${fmt(s.regionalSkew)} (MSE ${fmt(s.regionalSkewMse, 3)}); weights ${fmt(s.stationWeight, 3)} station / ${fmt(s.regionalWeight, 3)} regional → weighted skew ${fmt(s.weightedSkew)}.`,
    );
  } else L.push(`Skew: station skew ${fmt(s.stationSkew)} (MSE ${fmt(s.stationSkewMse, 3)}); no regional skew given.`);
  L.push(`Station-skew MSE: ${s.mseMethod}.`);
  L.push('');
  if (c.effectiveRecordLength !== null) L.push(`Effective record length of the skew: ${fmt(c.effectiveRecordLength, 3)} of ${k.years} years.`);
  const m = c.returnLevels[0]?.method ?? '';
  const bm = c.returnLevels[0]?.bootstrap?.method;
  L.push(`Return levels (intervals: ${m}${bm ? `; beside them ${bm}` : ''}):`);
  L.push('  period (years)   AEP        flow        lower       upper       equiv. years  bootstrap lower  bootstrap upper');
  for (const r of c.returnLevels) {
    L.push(
      `  ${String(r.period).padEnd(16)} ${fmt(1 / r.period, 3).padEnd(10)} ${fmt(r.estimate).padEnd(11)} ${fmt(r.lower).padEnd(11)} ${fmt(r.upper).padEnd(11)} ${fmt(r.equivalentYears, 3).padEnd(13)} ${fmt(r.bootstrap?.lower ?? null).padEnd(16)} ${fmt(r.bootstrap?.upper ?? null)}`.trimEnd(),
    );
  }
  if (j.warnings.length > 0) {
    L.push('');
    L.push('Warnings:');
    for (const w of j.warnings) L.push(`  - ${w}`);
  }
  L.push('');
  L.push('Cautions:');
  for (const w of j.cautions) L.push(`  - ${w}`);
  return `${L.join('\n')}\n`;
}

export function runFloodEma(args: AnalyzeArgs, io: FloodCliIo): number {
  const json = runFloodEmaJson(args);
  if (flagArg(args, 'json')) io.out(`${JSON.stringify(json, null, 2)}\n`);
  else io.out(floodEmaText(json));
  return 0;
}

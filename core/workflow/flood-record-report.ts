/**
 * The dataset report of a peak file (the API's and the page's flood record): the file's make-up,
 * every qualification code found with its effect, the historical period, and log-Pearson III by
 * the expected moments algorithm with its weighted skew, low outliers, return levels, intervals and
 * cautions, fitted by core/workflow/flood-record.ts exactly as the CLI's `--estimation ema` run
 * fits it (same reading, defaults, seed and random stream). The EMA block has the shape of the
 * flood section's (flood-estimators.ts emaBlockOf), so the page draws both with one renderer.
 * Like a dated series' report, it has no ranked candidates.
 */
import { PLUMBLINE_VERSION, resolveOptions } from '../analyze.js';
import { InputError } from '../errors.js';
import { DEFAULT_EMA_REPLICATES } from '../flood/index.js';
import type { PeakFile } from '../gauge/peak-file.js';
import type { MethodNote } from '../report.js';
import { prepareSample } from '../sample.js';
import { emaBlockOf, type FloodEmaBlock } from './flood-estimators.js';
import { FLOOD_RECORD_PERIODS, fitFloodRecord, regionalSkewOf, type FloodRecordRead, type PeakFileMakeUp } from './flood-record.js';
import type { WorkflowSettings } from './options.js';
import type { DatasetOptions, DatasetReport } from './types.js';

export interface FloodRecordSection {
  readonly format: 'peak file';
  /** What was read: peaks, years, systematic record, historic and censored peaks, codes (with meaning and effect). */
  readonly makeUp: PeakFileMakeUp;
  /** The historical period and its perception threshold (assumed: from the defaults of core/gauge readPeakFile), or null. */
  readonly historicalPeriod: PeakFile['historicalPeriod'];
  readonly periods: readonly number[];
  readonly confidence: number;
  readonly ema: FloodEmaBlock;
  /** The record's warnings (an assumed historical period, codes of a record that may not be homogeneous, an unsettled iteration). */
  readonly warnings: readonly string[];
}

const bad = (message: string): InputError => new InputError(message, {}, 'bad-option');

/** Most annual peaks a flood record takes (a gauge's record is at most a few hundred years; the interval bootstrap refits the EMA per replicate). */
export const FLOOD_RECORD_MAX_PEAKS = 10_000;

/** Options that mean nothing for a peak file are refused, naming them (never silently ignored). */
function checkRecordOptions(options: DatasetOptions, settings: WorkflowSettings): void {
  const what = 'A peak file is analysed as a flood record (log-Pearson III by expected moments)';
  if (options.estimation !== undefined && options.estimation !== 'ema') throw bad(`${what}: estimation ${options.estimation} does not apply; leave it out or give ema.`);
  if (settings.capability) throw bad(`${what}: specification limits (capability) do not apply.`);
  if (settings.bLifePercents !== null || settings.reliabilityTimes.length > 0) throw bad(`${what}: B-lives and reliability need life data.`);
  if (options.threshold !== undefined && options.threshold !== null) throw bad(`${what}: a threshold applies to a dated series (peaks over a threshold), not to annual peaks.`);
  if (options.trend) throw bad(`${what}: the trend check is not run on a peak file.`);
  if (settings.designLife !== null) throw bad(`${what}: a design life is not reported for it.`);
  if (options.plottingPosition !== undefined) throw bad(`${what}: plotting positions are not drawn for it.`);
}

const RECORD_METHODS: readonly MethodNote[] = [
  {
    topic: 'peak file',
    description:
      'tab-separated: # comment lines, a header, a column-format line, then date (peak_dt), peak (peak_va) and qualification codes (peak_cd, several separated by commas); code 7 historic peak, 4 peak below the value, 8 peak above the value; the historical period and perception threshold default to the first historic peak\'s year and the smallest historic peak (listed as assumptions)',
    source: 'USGS peak-flow file layout and qualification codes [from memory]; core/gauge/peak-file.ts',
  },
  {
    topic: 'log-Pearson III by EMA',
    description: 'moments of log10 flows by the expected moments algorithm over known, interval and censored peaks and the historical years below the perception threshold; low outliers by the multiple Grubbs–Beck test treated as censored; the station skew weighted with the regional skew by mean square errors',
    source: 'Cohn, Lane & Baier (1997), WRR 33:2089-2096; Cohn et al. (2013), WRR 49:5047-5058; England et al. (2018), USGS Techniques and Methods 4-B5 (Bulletin 17C).',
  },
];

/** The report of a peak file read by readFloodRecord: the frame of its peaks, no ranked candidates, the `floodRecord` section. */
export function floodRecordReport(read: FloodRecordRead, options: DatasetOptions, settings: WorkflowSettings): DatasetReport {
  checkRecordOptions(options, settings);
  if (read.makeUp.peaks > FLOOD_RECORD_MAX_PEAKS) {
    throw new InputError(`A peak file holds one peak a year: this one has ${read.makeUp.peaks} peaks, more than the ${FLOOD_RECORD_MAX_PEAKS} a flood record takes here.`, { value: String(read.makeUp.peaks) }, 'bad-input');
  }
  const regionalSkew = regionalSkewOf(options.regionalSkew, options.regionalSkewMse);
  const opts = resolveOptions({ ...options, families: ['logpearson3'] });
  const periods = settings.returnPeriods ?? FLOOD_RECORD_PERIODS;
  const run = fitFloodRecord(read.file.record, { regionalSkew, periods, confidence: settings.confidence, replicates: options.bootstrapReplicates ?? DEFAULT_EMA_REPLICATES, seed: opts.seed });
  const ema = emaBlockOf(run.fit, run.returnLevels, run.confidence);
  const warnings = [...read.file.warnings, ...(run.notConverged ? [run.notConverged] : [])];
  const s = prepareSample(Float64Array.from(read.file.rows.map((r) => r.peak)));
  return {
    software: { name: 'plumbline', version: PLUMBLINE_VERSION },
    n: s.n,
    summary: { min: s.min, max: s.max, mean: s.mean, sd: s.n > 1 ? Math.sqrt(s.sumSqDev / (s.n - 1)) : 0, distinct: s.distinct },
    options: { ...opts, families: [...opts.families] },
    rankingRule: 'none: a peak file is analysed as one flood record by log-Pearson III and the expected moments algorithm (the floodRecord section), not ranked against other models',
    candidates: [],
    notApplicable: [],
    warnings,
    methods: [
      ...RECORD_METHODS,
      { topic: 'return-level intervals', description: `${ema.intervalMethod}; beside them ${ema.bootstrapMethod}`, source: 'Cohn, Lane & Stedinger (2001), Water Resources Research [from memory; the variance derived here without the paper\'s text]' },
      { topic: 'summary', description: 'n, min, max, mean, sd and distinct count are those of the peak values in the file (the values of peaks known only below or above them included as written), not of the EMA record', source: 'common practice, no source' },
    ],
    dataKind: 'complete',
    floodRecord: {
      format: 'peak file',
      makeUp: read.makeUp,
      historicalPeriod: read.file.historicalPeriod,
      periods,
      confidence: run.confidence,
      ema,
      warnings,
    },
  };
}

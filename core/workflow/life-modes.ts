/**
 * The failure-mode column of life data with a status column: read (which cells say what, and the
 * faults named by row, column and value) and analysed into the life section's `modes`, the report
 * core/life analyzeModes gives the CLI's --mode-column (each mode fitted with the other modes'
 * failures as suspensions, system reliability the product of the modes'; Meeker & Escobar 1998,
 * §15.2-15.4), with the same options, so the API's numbers are the CLI's.
 */
import { InputError } from '../errors.js';
import { analyzeIntervalModes, analyzeModes, LIFE_FAMILIES, type BoundMethod, type CompetingModesReport, type IntervalLifeInput, type IntervalRowsRead, type LifeFamilyName } from '../life/index.js';
import type { WorkflowSettings } from './options.js';
import type { DatasetOptions, DatasetReport } from './types.js';

/** Where a unit's mode cell is, for messages: its file row (or array index) and the column's name. */
export interface ModeCellPlace {
  readonly row: (unit: number) => number;
  /** 'Row 12' or '"modes[11]"'. */
  readonly cell: (unit: number) => string;
  readonly column: string;
}

export interface FailureModesRead {
  /** The trimmed mode of each unit; null where the cell is empty. */
  readonly modes: readonly (string | null)[];
  /** What the reading noticed but did not refuse (a mode on a unit that did not fail; a mode with no failure). */
  readonly notes: readonly string[];
}

/** Rows listed by name in a note before "and k more". */
const LISTED = 5;

/**
 * The failure modes of a status column's units. A failed unit (status 1) must name its mode (an
 * InputError naming the row, column and cell otherwise); a mode on a unit that did not fail is
 * ignored, with a note naming its rows, since the unit is a suspension for every mode; a mode that
 * appears only on such units has no failure and is not fitted, with a note.
 */
export function readFailureModes(texts: readonly (string | null)[], failed: ArrayLike<number>, place: ModeCellPlace): FailureModesRead {
  if (texts.length !== failed.length) throw new InputError(`The failure-mode column has ${texts.length} entries but there are ${failed.length} units.`, { column: place.column }, 'bad-input');
  const modes: (string | null)[] = [];
  const onRunning: number[] = [];
  const withFailure = new Set<string>();
  const onlyRunning = new Map<string, number[]>();
  for (let i = 0; i < texts.length; i++) {
    const raw = texts[i] ?? '';
    const m = raw.trim() === '' ? null : raw.trim();
    modes.push(m);
    if (failed[i] === 1) {
      if (m === null) {
        throw new InputError(
          `${place.cell(i)}, column ${JSON.stringify(place.column)}: the unit failed (status 1) but its failure mode is empty; give every failed unit its mode, or mark it 0 if it did not fail.`,
          { row: place.row(i), column: place.column, value: raw },
          'bad-input',
        );
      }
      withFailure.add(m);
    } else if (m !== null) {
      onRunning.push(i);
      onlyRunning.set(m, [...(onlyRunning.get(m) ?? []), i]);
    }
  }
  const notes: string[] = [];
  const list = (units: readonly number[]): string =>
    `${units.slice(0, LISTED).map((i) => `${place.cell(i)} (${JSON.stringify(modes[i])})`).join(', ')}${units.length > LISTED ? ` and ${units.length - LISTED} more` : ''}`;
  if (onRunning.length > 0) {
    notes.push(`Column ${JSON.stringify(place.column)}: ${onRunning.length} unit${onRunning.length === 1 ? '' : 's'} that did not fail (status 0) carr${onRunning.length === 1 ? 'ies' : 'y'} a mode: ${list(onRunning)}. A unit that did not fail counts as a suspension for every mode, so its mode is not used.`);
  }
  for (const [m, units] of onlyRunning) {
    if (!withFailure.has(m)) notes.push(`Mode ${JSON.stringify(m)} (column ${JSON.stringify(place.column)}) has no failed unit, only ${units.length} that did not fail: it has nothing to fit and is left out of the modes.`);
  }
  return { modes, notes };
}

/**
 * The failure modes of interval rows read with a mode column (core/life readIntervalRows), checked
 * as readFailureModes checks a status column's: a row failed unless it is still running (no end)
 * or counts no units. `cell` names a row in messages ('Row 12', or 'FILE: row 12'). Null without a
 * mode column.
 */
export function readIntervalModes(r: IntervalRowsRead, cell: (line: number) => string): FailureModesRead | null {
  const column = r.columns.find((c) => c.role === 'failure mode');
  if (!r.modes || !column) return null;
  const iv = r.interval;
  const line = (i: number): number => iv.lines?.[i] ?? i + 1;
  const failed = iv.end.map((e, i) => (Number.isNaN(e) || e === Number.POSITIVE_INFINITY || iv.counts?.[i] === 0 ? 0 : 1));
  return readFailureModes(r.modes, failed, { row: line, cell: (i) => cell(line(i)), column: column.column });
}

export interface LifeModesOptions {
  readonly families?: readonly string[];
  readonly bLifePercents: readonly number[];
  readonly reliabilityTimes: readonly number[];
  readonly confidence: number;
  readonly boundMethod: BoundMethod;
}

const lifeFamilies = (families: readonly string[] | undefined): LifeFamilyName[] => (families ?? LIFE_FAMILIES).filter((f): f is LifeFamilyName => (LIFE_FAMILIES as readonly string[]).includes(f));

/** The modes report of the life section: analyzeModes with the options the CLI's --mode-column run passes (cli/life-recorded.ts → analyzeRecordedLife). */
export function lifeModes(times: ArrayLike<number>, status: ArrayLike<number>, modes: readonly (string | null)[], o: LifeModesOptions): CompetingModesReport {
  if (modes.length !== times.length) throw new InputError(`The failure-mode column has ${modes.length} entries but there are ${times.length} times.`, {}, 'bad-input');
  return analyzeModes(
    { times: Array.from(times), failed: Array.from(status), modes },
    { families: lifeFamilies(o.families), bLifePercents: o.bLifePercents, reliabilityTimes: o.reliabilityTimes, confidence: o.confidence, boundMethod: o.boundMethod },
  );
}

/**
 * Interval rows with a failure-mode column: the interval-row report (core/workflow/life-interval.ts)
 * with `life.modes` added, core/life analyzeIntervalModes with the options the CLI's
 * --interval-columns --mode-column run passes to analyzeRecordedLife (same numbers as its
 * life.modes). Each row's mode names the failure of a failed row (left, interval or exact); a
 * suspension's is ignored.
 */
export function withIntervalModes(report: DatasetReport, rows: IntervalLifeInput, modes: readonly (string | null)[], options: DatasetOptions, settings: WorkflowSettings): DatasetReport {
  if (!report.life) return report;
  const m = analyzeIntervalModes(
    { interval: rows, modes },
    {
      families: lifeFamilies(options.families as readonly string[] | undefined),
      bLifePercents: settings.bLifePercents ?? [10],
      reliabilityTimes: settings.reliabilityTimes,
      confidence: settings.confidence,
      boundMethod: options.boundMethod ?? 'likelihood-ratio',
    },
  );
  return { ...report, life: { ...report.life, modes: m } };
}

/**
 * The page's state, explicit and immutable, and `update(state, action)`: the only way it changes.
 * Pure (no DOM, no fetch): every transition is unit-tested without a browser
 * (test/client/state.test.ts); main.ts dispatches actions and renders views of the state.
 *
 * Ownership rules the transitions keep:
 * - the settings belong to the source they were made for: a new source (file, paste, another demo)
 *   starts from the defaults, or from that demo's own settings, and `settingsNote` says which;
 * - a result belongs to one source and column: a new source or a failed load clears it, and a run
 *   that fails keeps the previous result only marked as the previous one (`result.current` false);
 * - a run is known by its generation: a late answer to a superseded request is dropped.
 */
import type { AnalyzeResponse } from './api.js';
import { guessDecimal, scanColumns, type ColumnChoice, type DecimalGuess } from './columns.js';
import { defaultGroupedColumns, guessGroupedColumns, type GroupedColumns } from './grouped-view.js';
import { defaultIntervalColumns, guessIntervalColumns, type IntervalColumns } from './interval-view.js';
import { ROLE_FIELDS } from './page-options.js';
import { DEFAULT_SETTINGS, demoSettings, type Settings } from './settings.js';

export interface Source {
  readonly kind: 'demo' | 'file' | 'paste';
  /** What the user knows it by: the demo's name or the file's name. */
  readonly name: string;
  readonly csv: string;
  /** About how many rows (line breaks counted while reading a file), for the progress line. */
  readonly rows?: number;
}

export type Shape = 'values' | 'grouped' | 'interval';

/** How the source's text is read: header, decimal mark, columns, and the shape of the data. */
export interface Reading {
  readonly header: boolean;
  readonly decimal: '.' | ',';
  /** What the text itself says about the decimal mark (shown and offered on screen). */
  readonly decimalGuess: DecimalGuess;
  readonly columns: readonly ColumnChoice[];
  /** The value column (1-based). */
  readonly column: number;
  /** One value per row; class limits with counts; or inspection intervals (start, end, count) of life data. */
  readonly shape: Shape;
  readonly grouped: GroupedColumns;
  readonly interval: IntervalColumns;
}

/** Whose settings are on screen, in words for the page. */
export interface SettingsNote {
  readonly kind: 'demo' | 'defaults' | 'from-result';
  readonly text: string;
}

/** A shown result and what it was computed for. */
export interface Result {
  readonly report: AnalyzeResponse;
  readonly source: string;
  readonly column: string;
  /** The bins asked for (null: automatic), for the report's record. */
  readonly requestedBins: number | null;
  /** False when a later run for the same source failed or was stopped: the page says the result is the previous one. */
  readonly current: boolean;
  /** The text the analysis read and how it was read, for the report's record of the data. */
  readonly data: { readonly csv: string; readonly header: boolean; readonly decimal: '.' | ',' };
  /** The request's options as sent (no data), for the report's record of the settings. */
  readonly sent?: Readonly<Record<string, unknown>>;
}

export interface RunState {
  /** Bumped by every run and by every new source; answers for an older generation are dropped. */
  readonly generation: number;
  readonly phase: 'idle' | 'running' | 'failed' | 'stopped';
}

/** The quantity and units shown on axes: suggested from the column name until the user types. */
export interface Labels {
  readonly quantity: string;
  readonly units: string;
  readonly typed: boolean;
}

export type EvidenceView = 'probability' | 'histogram' | 'cdf' | 'bins';

export interface PageState {
  readonly source: Source | null;
  readonly reading: Reading;
  readonly settings: Settings;
  readonly settingsNote: SettingsNote;
  readonly labels: Labels;
  readonly run: RunState;
  readonly result: Result | null;
  /** The selected model's family name. */
  readonly selected: string | null;
  /** Which evidence the user asked to see (views that do not apply to the data fall back to the probability plot). */
  readonly evidenceView: EvidenceView;
  /** The message of the last failure (load or analysis), or null. */
  readonly error: string | null;
}

const NO_GUESS: DecimalGuess = { mark: '.', ambiguous: false, example: '' };

export const INITIAL_STATE: PageState = {
  source: null,
  reading: { header: true, decimal: '.', decimalGuess: NO_GUESS, columns: [], column: 1, shape: 'values', grouped: { lower: 1, upper: 2, count: 3 }, interval: { start: 1, end: 2, count: 0 } },
  settings: DEFAULT_SETTINGS,
  settingsNote: { kind: 'defaults', text: '' },
  labels: { quantity: '', units: '', typed: false },
  run: { generation: 0, phase: 'idle' },
  result: null,
  selected: null,
  evidenceView: 'probability',
  error: null,
};

/** A demo as the server sends it (server/demo.ts): its value column and its own settings. */
export interface DemoInfo {
  readonly column: string;
  readonly fields: Readonly<Record<string, unknown>>;
  readonly description: string;
}

export type Action =
  | { readonly type: 'source-loaded'; readonly source: Source; readonly header?: boolean; readonly demo?: DemoInfo; readonly column?: number }
  | { readonly type: 'load-failed'; readonly name: string; readonly message: string }
  | { readonly type: 'reading-changed'; readonly header?: boolean; readonly decimal?: '.' | ','; readonly column?: number; readonly shape?: Shape; readonly grouped?: Partial<GroupedColumns>; readonly interval?: Partial<IntervalColumns> }
  | { readonly type: 'settings-edited'; readonly patch: Partial<Settings> }
  | { readonly type: 'labels-edited'; readonly quantity?: string; readonly units?: string }
  | { readonly type: 'run-started' }
  | { readonly type: 'run-finished'; readonly generation: number; readonly report: AnalyzeResponse; readonly column: string; readonly requestedBins: number | null; readonly sent?: Readonly<Record<string, unknown>> }
  | { readonly type: 'run-failed'; readonly generation: number; readonly message: string }
  | { readonly type: 'run-stopped' }
  | { readonly type: 'select'; readonly family: string }
  | { readonly type: 'view-chosen'; readonly view: EvidenceView };

/** The label of the chosen value column (or of the class columns for grouped counts). */
export function columnLabel(reading: Reading): string {
  const label = (i: number): string => reading.columns.find((c) => c.index === i)?.label ?? `#${i}`;
  if (reading.shape === 'grouped') return `${label(reading.grouped.lower)}–${label(reading.grouped.upper)}, ${label(reading.grouped.count)}`;
  if (reading.shape === 'interval') return `${label(reading.interval.start)}–${label(reading.interval.end)}${reading.interval.count > 0 ? `, ${label(reading.interval.count)}` : ''}`;
  return label(reading.column);
}

/** Read the columns of `csv` as `header` and `decimal` say, keeping `prefer` when it still exists. */
function scan(csv: string, header: boolean, decimal: '.' | ',', prefer?: number): Pick<Reading, 'columns' | 'column'> {
  try {
    const s = scanColumns(csv, { header, decimal });
    return { columns: s.columns, column: prefer !== undefined && s.columns.some((c) => c.index === prefer) ? prefer : s.suggested };
  } catch {
    // The reader could not even read the header: the analysis request will say exactly why.
    return { columns: [{ index: 1, label: '#1' }], column: 1 };
  }
}

/** Roles point at columns of this source only, never at the value column (with interval rows: at the interval and count columns). */
function keepRoles(settings: Settings, reading: Reading): Settings {
  const taken = reading.shape === 'interval' ? [reading.interval.start, reading.interval.end, reading.interval.count] : [reading.column];
  const ok = (i: number): number => (i > 0 && !taken.includes(i) && reading.columns.some((c) => c.index === i) ? i : 0);
  const next: Record<string, number> = {};
  for (const r of ROLE_FIELDS) {
    const now = settings[r.name];
    const kept = ok(typeof now === 'number' ? now : 0);
    if (kept !== now) next[r.name] = kept;
  }
  return Object.keys(next).length === 0 ? settings : ({ ...settings, ...next } as Settings);
}

function sourceLoaded(state: PageState, a: Extract<Action, { type: 'source-loaded' }>): PageState {
  const decimalGuess = guessDecimal(a.source.csv);
  const decimal = decimalGuess.mark;
  const header = a.header ?? true;
  const first = scan(a.source.csv, header, decimal, a.column);
  const demoColumn = a.demo ? first.columns.find((c) => c.label === a.demo!.column)?.index : undefined;
  const scanned = demoColumn !== undefined ? { ...first, column: demoColumn } : first;
  const grouped = guessGroupedColumns(scanned.columns);
  const interval = grouped ? null : guessIntervalColumns(scanned.columns, a.source.csv, { header, decimal });
  const reading: Reading = {
    header,
    decimal,
    decimalGuess,
    ...scanned,
    shape: grouped ? 'grouped' : interval ? 'interval' : 'values',
    grouped: grouped ?? defaultGroupedColumns(scanned.columns),
    interval: interval ?? defaultIntervalColumns(scanned.columns, a.source.csv, { header, decimal }),
  };
  const columnIndex = (name: string): number => scanned.columns.find((c) => c.label === name)?.index ?? 0;
  const settings = keepRoles(a.demo ? demoSettings(a.demo.fields, columnIndex) : DEFAULT_SETTINGS, reading);
  const previous = state.source && state.settingsNote.kind !== 'defaults' ? ` (the settings of ${state.source.name} stay with it)` : '';
  const settingsNote: SettingsNote = a.demo
    ? { kind: 'demo', text: `Demo settings: ${a.demo.description}. They belong to the ${a.source.name} demo; loading anything else starts from the defaults.` }
    : { kind: 'defaults', text: `Default settings for ${a.source.name}${previous}.${state.source ? ' Nothing is carried over from the previous data.' : ''}` };
  return {
    ...state,
    source: a.source,
    reading,
    settings,
    settingsNote,
    labels: state.labels.typed ? { ...state.labels, typed: false } : state.labels,
    run: { generation: state.run.generation + 1, phase: 'idle' },
    result: null,
    selected: null,
    error: null,
  };
}

export function update(state: PageState, action: Action): PageState {
  switch (action.type) {
    case 'source-loaded':
      return sourceLoaded(state, action);
    case 'load-failed':
      // Nothing shown may belong to a source that is no longer the one named on screen.
      return {
        ...state,
        source: null,
        reading: INITIAL_STATE.reading,
        settings: DEFAULT_SETTINGS,
        settingsNote: { kind: 'defaults', text: '' },
        run: { generation: state.run.generation + 1, phase: 'failed' },
        result: null,
        selected: null,
        error: `${action.name}: ${action.message}`,
      };
    case 'reading-changed': {
      if (!state.source) return state;
      const r = state.reading;
      const header = action.header ?? r.header;
      const decimal = action.decimal ?? r.decimal;
      const rescan = header !== r.header || decimal !== r.decimal;
      const scanned = rescan ? scan(state.source.csv, header, decimal, action.column ?? r.column) : { columns: r.columns, column: action.column ?? r.column };
      const reading: Reading = {
        ...r,
        header,
        decimal,
        ...scanned,
        shape: action.shape ?? r.shape,
        grouped: rescan ? defaultGroupedColumns(scanned.columns) : { ...r.grouped, ...action.grouped },
        interval: rescan ? defaultIntervalColumns(scanned.columns, state.source.csv, { header, decimal }) : { ...r.interval, ...action.interval },
      };
      return { ...state, reading, settings: keepRoles(state.settings, reading) };
    }
    case 'settings-edited':
      return { ...state, settings: { ...state.settings, ...action.patch } as Settings };
    case 'labels-edited':
      return {
        ...state,
        labels: { quantity: action.quantity ?? state.labels.quantity, units: action.units ?? state.labels.units, typed: true },
      };
    case 'run-started':
      return { ...state, run: { generation: state.run.generation + 1, phase: 'running' }, error: null };
    case 'run-finished': {
      if (action.generation !== state.run.generation || !state.source) return state;
      const families = action.report.candidates.map((c) => c.family as string);
      const selected = state.selected && families.includes(state.selected) ? state.selected : (families[0] ?? null);
      return {
        ...state,
        run: { ...state.run, phase: 'idle' },
        result: { report: action.report, source: state.source.name, column: action.column, requestedBins: action.requestedBins, current: true, data: { csv: state.source.csv, header: state.reading.header, decimal: state.reading.decimal }, ...(action.sent ? { sent: action.sent } : {}) },
        selected,
        error: null,
      };
    }
    case 'run-failed':
      if (action.generation !== state.run.generation) return state;
      return { ...state, run: { ...state.run, phase: 'failed' }, result: state.result ? { ...state.result, current: false } : null, error: action.message };
    case 'run-stopped':
      return { ...state, run: { generation: state.run.generation + 1, phase: 'stopped' }, result: state.result ? { ...state.result, current: false } : null };
    case 'view-chosen':
      return { ...state, evidenceView: action.view };
    case 'select':
      if (!state.result || !state.result.report.candidates.some((c) => c.family === action.family)) return state;
      return { ...state, selected: action.family };
  }
}

/** The settings a shown report was computed with, as the page's settings (the opening demo arrives already analysed). */
export function settingsFromReport(report: AnalyzeResponse, base: Settings): Settings {
  const o = report.options;
  return {
    ...base,
    families: [...o.families],
    alpha: String(o.alpha),
    bins: o.bins === null ? '' : String(o.bins),
    // A censored sample's A² is always bootstrapped; the setting stays on the published formula so a
    // bootstrap the user did not ask for is never started for the next data.
    pMethod: report.dataKind === 'censored' ? 'table' : o.pMethod,
    replicates: String(o.bootstrapReplicates),
    seed: String(o.seed),
  };
}

/** The quantity and units for axes and the report: what the user typed, else a guess from the column name. */
export function shownLabels(state: PageState, guess: (column: string) => { quantity: string; units: string }): { quantity: string; units: string; suggested: boolean } {
  if (state.labels.typed) return { quantity: state.labels.quantity, units: state.labels.units, suggested: false };
  const r = state.reading;
  if (!state.source) return { quantity: '', units: '', suggested: false };
  if (r.shape === 'grouped') {
    // Class counts: the quantity is named by the class limits, not by the count column.
    const raw = guess(r.columns.find((c) => c.index === r.grouped.lower)?.label ?? '');
    const bare = raw.quantity.replace(/\b(lower|low|lo|from|min|limit|bound|edge|class)\b/gi, ' ').replace(/\s+/g, ' ').trim();
    return { quantity: bare ? bare[0]!.toUpperCase() + bare.slice(1) : '', units: raw.units, suggested: true };
  }
  if (r.shape === 'interval') {
    // Inspection intervals: the quantity is named by the end column ("end_months" → time in months).
    const raw = guess(r.columns.find((c) => c.index === r.interval.end)?.label ?? '');
    const bare = raw.quantity.replace(/\b(end|start|stop|found|from|to|failed|by|at)\b/gi, ' ').replace(/\s+/g, ' ').trim();
    return { quantity: bare ? bare[0]!.toUpperCase() + bare.slice(1) : 'Time', units: raw.units, suggested: true };
  }
  return { ...guess(columnLabel(r)), suggested: true };
}

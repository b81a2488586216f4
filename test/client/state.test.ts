/**
 * The page's state transitions (client/src/state.ts), without a browser. Each case is one thing a
 * user did and what the page must then hold: a demo's settings stay with the demo, a failed load
 * leaves nothing of the previous source on screen, a late answer to a superseded run is dropped.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyzeDataset, readColumns, type NumberColumn } from '../../core/index.js';
import type { AnalyzeResponse } from '../../client/src/api.js';
import { DEFAULT_SETTINGS } from '../../client/src/settings.js';
import { INITIAL_STATE, settingsFromReport, shownLabels, update, type Action, type PageState } from '../../client/src/state.js';
import { guessFromColumn } from '../../client/src/units-guess.js';
import { unusedModeColumn } from '../../client/src/source-notes.js';

const dataset = (f: string): string => readFileSync(join(process.cwd(), 'datasets', f), 'utf8');
const RIVER = dataset('river-peaks.csv');
const SHAFT = dataset('shaft-diameter.csv');
/** server/demo.ts DEMO_SETTINGS['river-peaks'] and ['shaft-diameter'], as the server sends them. */
const RIVER_DEMO = {
  column: 'peak_flow_m3s',
  fields: { families: ['normal', 'lognormal', 'gamma', 'weibull', 'exponential', 'gumbel', 'gev'], orderColumn: 'year', returnPeriods: [2, 10, 50, 100, 200], designLife: 50, plottingPosition: 'gringorten', confidence: 0.9 },
  description: 'return periods 2 to 200 years',
};
const SHAFT_DEMO = { column: 'diameter_mm', fields: { subgroupColumn: 'subgroup', lsl: 24.99, usl: 25.01, target: 25, confidence: 0.9 }, description: 'invented tolerance 25 ± 0.010 mm' };
/** An invented bearing-fatigue file (hours), the kind of file loaded after a demo. */
const FATIGUE = 'specimen,hours\nF1,812\nF2,1290\nF3,655\nF4,1502\nF5,988\nF6,1120\nF7,743\n';

const run = (s: PageState, ...actions: Action[]): PageState => actions.reduce(update, s);
const values = readColumns(RIVER, [{ select: 'peak_flow_m3s', kind: 'number' }]).columns[0] as NumberColumn;
const REPORT = analyzeDataset({ values: values.values }, { families: ['gumbel', 'normal'], seed: 1 }) as AnalyzeResponse;

describe('settings belong to their source', () => {
  const river = run(INITIAL_STATE, { type: 'source-loaded', source: { kind: 'demo', name: 'river-peaks', csv: RIVER }, demo: RIVER_DEMO });

  it('a demo opens with its own settings, roles resolved to its columns, and a note that says they are the demo\'s', () => {
    expect(river.settings.returnPeriods).toBe('2, 10, 50, 100, 200');
    expect(river.settings.designLife).toBe('50');
    expect(river.settings.plottingPosition).toBe('gringorten');
    expect(river.settings.orderColumn).toBe(1); // year is column 1
    expect(river.reading.column).toBe(2); // peak_flow_m3s, not the year
    expect(river.settingsNote.kind).toBe('demo');
    expect(river.settingsNote.text).toMatch(/^Demo settings: .*belong to the river-peaks demo; loading anything else starts from the defaults/);
  });

  it('a file loaded after the river demo starts from the defaults: no return periods, design life or flood models, and says so', () => {
    const next = run(river, { type: 'source-loaded', source: { kind: 'file', name: 'fatigue.csv', csv: FATIGUE } });
    expect(next.settings).toEqual(DEFAULT_SETTINGS);
    expect(next.settings.families).not.toContain('gumbel');
    expect(next.settingsNote.kind).toBe('defaults');
    expect(next.settingsNote.text).toMatch(/Default settings for fatigue\.csv \(the settings of river-peaks stay with it\)/);
  });

  it('a paste after the shaft demo carries no tolerance (the invented tolerance gave "Ppk −3.78" to unrelated data)', () => {
    const shaft = run(INITIAL_STATE, { type: 'source-loaded', source: { kind: 'demo', name: 'shaft-diameter', csv: SHAFT }, demo: SHAFT_DEMO });
    expect(shaft.settings.lsl).toBe('24.99');
    expect(shaft.settings.subgroupColumn).toBe(1);
    const pasted = run(shaft, { type: 'source-loaded', source: { kind: 'paste', name: 'Pasted values', csv: '1.2\n3.4\n2.2\n' } });
    expect([pasted.settings.lsl, pasted.settings.usl, pasted.settings.target]).toEqual(['', '', '']);
    expect(pasted.settings.subgroupColumn).toBe(0);
  });

  it('another demo takes its own settings, not the previous demo\'s', () => {
    const shaft = run(river, { type: 'source-loaded', source: { kind: 'demo', name: 'shaft-diameter', csv: SHAFT }, demo: SHAFT_DEMO });
    expect(shaft.settings.returnPeriods).toBe('');
    expect(shaft.settings.orderColumn).toBe(0);
    expect(shaft.settings.usl).toBe('25.01');
  });

  it('edits made for one source are dropped with it', () => {
    const edited = run(INITIAL_STATE, { type: 'source-loaded', source: { kind: 'file', name: 'a.csv', csv: FATIGUE } }, { type: 'settings-edited', patch: { alpha: '0.1', usl: '2000' } });
    expect(edited.settings.alpha).toBe('0.1');
    const next = run(edited, { type: 'source-loaded', source: { kind: 'file', name: 'b.csv', csv: FATIGUE } });
    expect(next.settings.alpha).toBe('0.05');
    expect(next.settings.usl).toBe('');
  });

  it('a role column that does not exist in the new file is dropped, never pointed at another column', () => {
    const s = run(INITIAL_STATE, { type: 'source-loaded', source: { kind: 'file', name: 'a.csv', csv: FATIGUE } }, { type: 'settings-edited', patch: { orderColumn: 2 } });
    // Column 2 is the value column itself: choosing it as the value column clears the role.
    const moved = run(s, { type: 'reading-changed', column: 2 });
    expect(moved.settings.orderColumn).toBe(0);
  });

  it('interval rows: the mode role is kept on its own column, and dropped when it becomes an interval or count column', () => {
    // invented inspection rows with a mode column (the layout of test/fixtures/life-modes-interval.json)
    const csv = 'start,end,units,mode\n,25,1,B\n25,50,3,A\n50,75,14,A\n150,,4,\n';
    const s = run(INITIAL_STATE, { type: 'source-loaded', source: { kind: 'file', name: 'iv.csv', csv } }, { type: 'settings-edited', patch: { modeColumn: 4 } });
    expect(s.reading.shape).toBe('interval');
    // the value column the scan suggested does not matter for interval rows: a re-read keeps the role
    const reread = run(s, { type: 'reading-changed', column: 4 });
    expect(reread.settings.modeColumn).toBe(4);
    const clash = run(s, { type: 'reading-changed', interval: { count: 4 } });
    expect(clash.settings.modeColumn).toBe(0);
    // before the role is set, the mode-like column is pointed out (the page's "Use “mode” as the failure-mode column")
    const fresh = run(INITIAL_STATE, { type: 'source-loaded', source: { kind: 'file', name: 'iv.csv', csv } });
    expect(unusedModeColumn(fresh)).toEqual({ index: 4, label: 'mode' });
    expect(unusedModeColumn(s)).toBeUndefined();
  });
});

describe('results belong to one source', () => {
  const loaded = run(INITIAL_STATE, { type: 'source-loaded', source: { kind: 'file', name: 'river.csv', csv: RIVER } }, { type: 'run-started' });
  const shown = run(loaded, { type: 'run-finished', generation: loaded.run.generation, report: REPORT, column: 'peak_flow_m3s', requestedBins: null });

  it('a finished run shows its result for that source, with the best model selected', () => {
    expect(shown.result?.source).toBe('river.csv');
    expect(shown.result?.current).toBe(true);
    expect(shown.selected).toBe(REPORT.candidates[0]!.family);
  });

  it('a failed load clears the result, the selection and the source, and keeps the message', () => {
    const failed = run(shown, { type: 'load-failed', name: 'commas.csv', message: 'could not be read' });
    expect(failed.result).toBeNull();
    expect(failed.selected).toBeNull();
    expect(failed.source).toBeNull();
    expect(failed.error).toBe('commas.csv: could not be read');
  });

  it('a new source clears the previous source\'s result before its own arrives', () => {
    const next = run(shown, { type: 'source-loaded', source: { kind: 'file', name: 'other.csv', csv: FATIGUE } });
    expect(next.result).toBeNull();
  });

  it('a failed run for the same source keeps the result only marked as the previous one', () => {
    const again = run(shown, { type: 'run-started' });
    const failed = run(again, { type: 'run-failed', generation: again.run.generation, message: 'too many bins' });
    expect(failed.result?.current).toBe(false);
    expect(failed.error).toBe('too many bins');
    const stopped = run(shown, { type: 'run-stopped' });
    expect(stopped.result?.current).toBe(false);
  });

  it('a late answer to a superseded run is dropped', () => {
    const first = run(loaded, { type: 'run-started' });
    const second = run(first, { type: 'run-started' });
    const late = run(second, { type: 'run-finished', generation: first.run.generation, report: REPORT, column: 'x', requestedBins: null });
    expect(late.result).toBeNull();
    const lateFail = run(second, { type: 'run-failed', generation: first.run.generation, message: 'old' });
    expect(lateFail.error).toBeNull();
  });

  it('keeps the chosen evidence view across results and sources (a choice of how to look, not a setting of the data)', () => {
    const chosen = run(shown, { type: 'view-chosen', view: 'cdf' });
    expect(run(chosen, { type: 'source-loaded', source: { kind: 'file', name: 'other.csv', csv: FATIGUE } }).evidenceView).toBe('cdf');
  });

  it('selects only a model the shown result has', () => {
    const other = REPORT.candidates[1]!.family;
    expect(run(shown, { type: 'select', family: other }).selected).toBe(other);
    expect(run(shown, { type: 'select', family: 'gev' }).selected).toBe(shown.selected);
  });
});

describe('labels and the opening report', () => {
  it('suggests the quantity and units from the column name until the user types, and forgets typing on a new source', () => {
    const s = run(INITIAL_STATE, { type: 'source-loaded', source: { kind: 'file', name: 'r.csv', csv: RIVER } });
    expect(shownLabels(s, guessFromColumn).units).toBe('m³/s');
    const typed = run(s, { type: 'labels-edited', units: 'cumecs' });
    expect(shownLabels(typed, guessFromColumn)).toMatchObject({ units: 'cumecs', suggested: false });
    const next = run(typed, { type: 'source-loaded', source: { kind: 'file', name: 'f.csv', csv: FATIGUE } });
    expect(shownLabels(next, guessFromColumn).units).toBe('h');
  });

  it('takes the analysed options of the opening report as the settings (a censored report leaves the p-value method on the formula)', () => {
    const s = settingsFromReport(REPORT, DEFAULT_SETTINGS);
    expect(s.families).toEqual(['gumbel', 'normal']);
    expect(s.seed).toBe('1');
    const censored = { ...REPORT, dataKind: 'censored', options: { ...REPORT.options, pMethod: 'bootstrap' } } as AnalyzeResponse;
    expect(settingsFromReport(censored, DEFAULT_SETTINGS).pMethod).toBe('table');
  });
});

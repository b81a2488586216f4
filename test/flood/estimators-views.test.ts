// @vitest-environment jsdom
/**
 * The flood estimators on screen and in text: the page section (client/src/views/flood-estimators.ts,
 * registered in views/sections.ts, its 'lmoment-diagram' chart slot drawn by drawSlot) and the CLI
 * text (cli/flood-estimators-text.ts), from real core reports on the invented river-peaks demo
 * through the JSON round trip the page receives. The numbers themselves are checked against
 * SciPy in estimators.test.ts; here: each table names its estimator, the cautions are on screen,
 * and `--estimation lmoments` without return periods is refused instead of changing nothing.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyzeDataset, readColumns, type DatasetReport, type NumberColumn } from '../../core/index.js';
import { blockHtml, blockNode } from '../../client/src/views/block.js';
import { floodEstimatorsSection } from '../../client/src/views/flood-estimators.js';
import { SECTIONS } from '../../client/src/views/sections.js';
import { drawSlot } from '../../client/src/decision-charts.js';
import { resetIds } from '../../client/charts/frame.js';
import { floodEstimatorLines } from '../../cli/flood-estimators-text.js';

const flows = Array.from((readColumns(readFileSync('datasets/river-peaks.csv', 'utf8'), [{ select: 'peak_flow_m3s', kind: 'number' }]).columns[0] as NumberColumn).values);
const wire = (o: Record<string, unknown>) =>
  JSON.parse(JSON.stringify(analyzeDataset({ values: flows }, { returnPeriods: [10, 100], families: ['gumbel'], seed: 3, ...o }))) as DatasetReport;

describe('flood estimators on the page and in the text report', () => {
  const ema = wire({ estimation: 'ema', regionalSkew: -0.1, regionalSkewMse: 0.12 });
  const lmo = wire({ estimation: 'lmoments' });

  it('is a registered section right after the flood section', () => {
    const keys = SECTIONS.map((s) => s.key);
    expect(keys.indexOf('flood-estimators')).toBe(keys.indexOf('flood') + 1);
  });

  it('expected moments: the answer is the EMA level with its interval; the skew weighting, low outliers and cautions are on screen', () => {
    const b = floodEstimatorsSection({ report: ema, selected: undefined, units: 'm³/s' })!;
    const block = ema.flood!.estimators!.ema!;
    const top = block.applicable ? block.returnLevels[1]! : null;
    expect(b.answer).toMatch(/^100-year flow by log-Pearson III \(expected moments\): [\d.]+ m³\/s, 90 % interval [\d.]+ to [\d.]+\.$/);
    expect(b.answer).toContain(`: ${Number(top!.estimate.toPrecision(4))} m³/s,`);
    const text = b.lines.map((l) => l.text).join(' ');
    expect(text).toMatch(/regional −0\.1 \(MSE 0\.12\)/);
    expect(text).toMatch(/Low outliers: none found/);
    expect(b.lines.filter((l) => l.kind === 'caution').map((l) => l.text).join(' ')).toMatch(/governing agency.*licensed engineer/);
    expect(b.tables[0]!.caption).toMatch(/^Log-Pearson III by expected moments/);
    expect(b.tables[0]!.head[2]).toBe('Flow [m³/s]');
    expect(b.tables[1]!.head[0]).toBe('Model (L-moments)');
    expect(b.charts).toEqual(['ema-return-period', 'lmoment-diagram']);
    const node = blockNode(b, () => document.createElement('div'));
    expect(node.textContent).toContain('Flood levels by expected moments and L-moments');
    expect(blockHtml(b, () => '')).toContain('data-block="flood-estimators"');
  });

  it('L-moments: the answer is the spread of the five fits, said to be point estimates; a caution is still shown', () => {
    const b = floodEstimatorsSection({ report: lmo, selected: undefined, units: '' })!;
    expect(b.answer).toMatch(/^100-year level by L-moment fits: 1109 to 1300 across the 5 families \(point estimates, no intervals\)\.$/);
    expect(b.lines.some((l) => l.kind === 'caution' && /design flood is a safety decision/.test(l.text))).toBe(true);
    expect(b.tables[0]!.caption).toMatch(/point estimates/);
  });

  it('no estimators asked: no section', () => {
    expect(floodEstimatorsSection({ report: wire({}), selected: undefined, units: '' })).toBeNull();
  });

  it('the ratio-diagram slot draws the sample point and the family curves from the report', () => {
    resetIds();
    const box = document.createElement('div');
    const svg = drawSlot('lmoment-diagram', box, { report: lmo, selected: 'gumbel', lifeScale: 'weibull' }, { width: 640, height: 400, units: '' });
    expect(svg).not.toBeNull();
    expect(svg!.textContent).toContain('L-moment ratios');
    expect(drawSlot('lmoment-diagram', document.createElement('div'), { report: wire({}), selected: 'gumbel', lifeScale: 'weibull' }, { width: 640, height: 400, units: '' })).toBeNull();
  });

  it('the EMA return-period slot draws the log-Pearson III levels with their interval whiskers on the flood section\'s points; none without EMA', () => {
    resetIds();
    const svg = drawSlot('ema-return-period', document.createElement('div'), { report: ema, selected: 'gumbel', lifeScale: 'weibull' }, { width: 640, height: 400, units: 'm³/s' })!;
    expect(svg).not.toBeNull();
    expect(svg.querySelectorAll('path[data-kind="curve"][data-family="logpearson3"]').length).toBe(1);
    expect(svg.textContent).toContain('Log-Pearson III (expected moments)');
    expect(drawSlot('ema-return-period', document.createElement('div'), { report: lmo, selected: 'gumbel', lifeScale: 'weibull' }, { width: 640, height: 400, units: '' })).toBeNull();
    expect(floodEstimatorsSection({ report: lmo, selected: undefined, units: '' })!.charts).toEqual(['lmoment-diagram']);
  });

  it('CLI text: the L-moment table and the EMA table each name their estimator', () => {
    const t = floodEstimatorLines(ema).join('\n');
    expect(t).toMatch(/^Flood levels by expected moments and L-moments/);
    expect(t).toMatch(/flow \(expected moments\)/);
    expect(t).toMatch(/model \(L-moments\)/);
    expect(t).toMatch(/licensed engineer/);
    expect(floodEstimatorLines(wire({}))).toEqual([]);
  });

  it('estimation lmoments or ema without return periods, or a regional skew without ema, is refused, not ignored', () => {
    expect(() => analyzeDataset({ values: flows }, { estimation: 'lmoments', families: ['gumbel'] })).toThrow(/give return periods too/);
    expect(() => analyzeDataset({ values: flows }, { estimation: 'ema', families: ['gumbel'] })).toThrow(/give return periods too/);
    // A regional skew is refused before any fitting unless it can weigh an EMA skew (never silently ignored).
    expect(() => analyzeDataset({ values: flows }, { regionalSkew: -0.1, regionalSkewMse: 0.1, families: ['gumbel'] })).toThrow(/ask for estimation ema too/);
  });
});

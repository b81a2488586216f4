// @vitest-environment jsdom
/**
 * The recorded-life section on the page (client/src/views/life-recorded.ts) from real core reports
 * (recordedLifeExtras on the invented seal demo, datasets/README.md): the estimator named on every
 * candidate, the mixture flagged, Weibayes with its shape stated as assumed, the Turnbull boxes, the
 * plan; through the JSON round trip the page receives (NaN and Infinity arrive as null).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyzeDataset, analyzeRecordedLife, parseStrictNumber, readColumns, type NumberColumn, type TextColumn } from '../../core/index.js';
import { recordedLifeExtras } from '../../core/life/index.js';
import { blockHtml, blockNode } from '../../client/src/views/block.js';
import { recordedBlock } from '../../client/src/views/life-recorded.js';
import { SECTIONS } from '../../client/src/views/sections.js';
import { drawSlot } from '../../client/src/decision-charts.js';
import { resetIds } from '../../client/charts/frame.js';
import { FEW_EARLY } from './invented-mixture.js';
import { modelLabel } from '../../client/src/families.js';

const t = readColumns(readFileSync(join(process.cwd(), 'datasets', 'seal-failure-modes.csv'), 'utf8'), [
  { select: 'hours', kind: 'number' },
  { select: 'status', kind: 'text' },
]);
const times = (t.columns[0] as NumberColumn).values;
const failed = (t.columns[1] as TextColumn).texts.map(Number);

describe('recorded-life section', () => {
  it('is registered as a page section', () => {
    expect(SECTIONS.map((s) => s.key)).toContain('life-recorded');
  });

  it('ML with an assumed shape and a plan: estimator per candidate, mixture flagged, Weibayes assumed, plan table, safety caution', () => {
    const x = recordedLifeExtras({ times, failed }, { assumedShape: 3, planReliability: 0.9, planTime: 2000, bLifePercents: [10] })!;
    const wire = JSON.parse(JSON.stringify(x));
    const b = recordedBlock(wire.report, wire.plan, 'h');
    expect(b.answer).toMatch(/shape ASSUMED at β = 3: scale at least/);
    const cand = b.tables[0]!;
    expect(cand.rows.every((r) => r[2] === 'maximum likelihood')).toBe(true);
    expect(cand.rows.some((r) => /Weibull mixture/.test(r[1]!))).toBe(true);
    const lives = b.tables[1]!;
    // The mixture's B-life has no bounds: shown as '—', with the reason in the last column.
    const mixRow = lives.rows.find((r) => /mixture/.test(r[0]!))!;
    expect([mixRow[2], mixRow[3]]).toEqual(['—', '—']);
    expect(mixRow[4]).toMatch(/no bounds?\b/); // core/life/mixture-bounds.ts: 'no bound: the mixture’s components are not identified …' (Fisher bounds only when identified)
    expect(b.tables.some((tb) => /Weibayes with the shape ASSUMED/.test(tb.caption))).toBe(true);
    const turnbull = b.tables.find((tb) => /Turnbull/.test(tb.caption))!;
    expect(turnbull.folded).toBe(true);
    expect(turnbull.rows.at(-1)![1]).toBe('beyond');
    expect(b.tables.some((tb) => /Test plan/.test(tb.caption))).toBe(true);
    expect(b.lines.some((l) => l.kind === 'caution' && /licensed practice/.test(l.text))).toBe(true);
    const node = blockNode(b, () => document.createElement('div'));
    expect(node.textContent).toContain('Life: other estimators');
    expect(blockHtml(b, () => '')).toContain('Weibayes');
  });

  it('rank regression: the estimator column says so and the bounds are absent', () => {
    const x = recordedLifeExtras({ times, failed }, { estimation: 'rank-regression' })!;
    const b = recordedBlock(JSON.parse(JSON.stringify(x.report)), null, '');
    expect(b.lines[0]!.text).toMatch(/Estimator: rank regression/);
    expect(b.tables[0]!.head.at(-1)).toBe('r');
    expect(b.tables[0]!.rows.every((r) => r[2] === 'rank regression')).toBe(true);
    expect(b.tables[1]!.rows.every((r) => r[2] === '—' && r[3] === '—')).toBe(true);
  });

  it('lists the Turnbull chart slot, and the decision area draws it from the dataset report: one box per innermost interval, the selected model as the line', () => {
    resetIds();
    const report = JSON.parse(JSON.stringify(analyzeDataset({ values: times, status: failed }, { families: ['weibull', 'lognormal'], bootstrapReplicates: 19, seed: 1 })));
    const rec = report.life.recorded.report;
    const b = recordedBlock(rec, null, 'h');
    expect(b.charts).toEqual(['turnbull']);
    const box = document.body.appendChild(document.createElement('div'));
    const svg = drawSlot('turnbull', box, { report, selected: 'lognormal', lifeScale: 'weibull' }, { width: 640, height: 400, units: 'h' })!;
    expect(svg.querySelectorAll('rect[data-kind="box"]')).toHaveLength(rec.turnbull.intervals.length);
    expect(svg.querySelector('path[data-kind="curve"]')!.getAttribute('data-family')).toBe('lognormal');
    // Without the recorded extras there is nothing to draw.
    expect(drawSlot('turnbull', box, { report: { ...report, life: { ...report.life, recorded: undefined } }, selected: 'weibull', lifeScale: 'weibull' }, { width: 640, height: 400, units: '' })).toBeNull();
  });

  it('interval rows: the goodness-of-fit table gives A², p ± its Monte Carlo SE and the verdict by the inspection-scheme bootstrap; exact data say why there is none', () => {
    const v = readColumns(readFileSync(join(process.cwd(), 'datasets', 'valve-inspections.csv'), 'utf8'), [
      { select: 'start_months', kind: 'text', keepBlank: true },
      { select: 'end_months', kind: 'text', keepBlank: true },
      { select: 'valves', kind: 'number' },
    ]);
    const cell = (x: string, empty: number) => (x === '' ? empty : parseStrictNumber(x));
    const interval = { start: (v.columns[0] as TextColumn).texts.map((x) => cell(x, 0)), end: (v.columns[1] as TextColumn).texts.map((x) => cell(x, Number.POSITIVE_INFINITY)), counts: (v.columns[2] as NumberColumn).values };
    const rec = JSON.parse(JSON.stringify(analyzeRecordedLife({ interval }, { families: ['weibull', 'exponential'], replicates: 39, seed: 2 })));
    const b = recordedBlock(rec, null, 'months');
    const gof = b.tables.find((tb) => /Does each model fit/.test(tb.caption))!;
    // each model by the page's one label (client/src/families.ts), not the core's lower-case name
    expect(gof.rows.map((r) => r[0])).toEqual(rec.candidates.filter((c: { goodnessOfFit: unknown }) => c.goodnessOfFit).map((c: { family: string }) => modelLabel(c.family)));
    const expo = gof.rows.find((r) => r[0] === 'Exponential')!;
    expect(expo[3]).toBe('39');
    expect(expo[4]).toMatch(/^rejected/);
    const exact = recordedBlock(JSON.parse(JSON.stringify(recordedLifeExtras({ times, failed }, {})!.report)), null, 'h');
    expect(exact.tables.some((tb) => /Does each model fit/.test(tb.caption))).toBe(false);
    expect(exact.lines.some((l) => /Goodness of fit: .*life section/.test(l.text))).toBe(true);
  });

  it('a mixture ranked first but not identified is not called the best: the answer says why and names the best single model', () => {
    // Invented (test/client/invented-mixture.ts): 4 early failures and 14 late ones with 4 survivors;
    // the mixture ranks first by AICc but its early subpopulation has about 3 failures (core/life/mixture.ts flags it).
    const x = analyzeRecordedLife({ times: FEW_EARLY.times, failed: FEW_EARLY.failed }, { families: ['weibull', 'lognormal'], bLifePercents: [10] });
    const wire = JSON.parse(JSON.stringify(x));
    const mix = wire.candidates.find((c: { family: string }) => c.family === 'weibull-mixture');
    expect(mix.rank).toBe(1);
    expect(mix.identified).toBe(false);
    const b = recordedBlock(wire, null, 'h');
    expect(b.answer).toMatch(/^The Weibull mixture ranks first by AICc \(smallest first\) but its two subpopulations are not identified by these data, so its numbers are not to be used; best single model: (Weibull|Lognormal) \(maximum likelihood\)\.$/);
    const mixRow = b.tables[1]!.rows.find((r) => /mixture/.test(r[0]!))!;
    expect(mixRow.slice(2)).toEqual(['—', '—', 'no bound: the mixture’s components are not identified by these data']);
    expect(b.tables[0]!.rows.find((r) => /mixture/.test(r[1]!))![1]).toMatch(/— not identified$/);
    expect(b.lines.some((l) => l.kind === 'warning' && /not identified by these data .*do not use the mixture's numbers/.test(l.text))).toBe(true);
  });
});

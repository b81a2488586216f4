// @vitest-environment jsdom
/**
 * The decision area's charts and blocks (issue 4), drawn in jsdom from reports the core computes
 * here on the committed demo datasets: structure, what each chart shows, the cautions, escaping,
 * and SVG snapshots with rounded decimals.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeEach, describe, expect, it } from 'vitest';
import { analyzeDataset, computeEvidence, prepareSample, readColumns, type NumberColumn, type TextColumn } from '../../core/index.js';
import { capabilityHistogramChart, ppmText } from '../../client/charts/capability-histogram.js';
import { hazardChart } from '../../client/charts/hazard.js';
import { lifeProbabilityChart, logTicks } from '../../client/charts/life-probability.js';
import { returnPeriodChart } from '../../client/charts/return-period.js';
import { resetIds } from '../../client/charts/frame.js';
import { blockHtml, decisionBlocks } from '../../client/src/decision.js';
import { blockNode } from '../../client/src/views/block.js';
import { drawSlot } from '../../client/src/decision-charts.js';
import { normaliseSvg } from './svg-normalise.js';

const read = (f: string, cols: [string, 'number' | 'text'][]) =>
  readColumns(readFileSync(join(process.cwd(), 'datasets', f), 'utf8'), cols.map(([select, kind]) => ({ select, kind })));

const bt = read('bearing-life.csv', [['hours', 'number'], ['status', 'text']]);
const LIFE = analyzeDataset(
  { values: (bt.columns[0] as NumberColumn).values, status: (bt.columns[1] as TextColumn).texts.map(Number) },
  { families: ['weibull', 'lognormal'], bLifePercents: [10], reliabilityTimes: [1000], bootstrapReplicates: 19, seed: 1 },
);
const rv = read('river-peaks.csv', [['peak_flow_m3s', 'number']]);
const FLOOD = analyzeDataset({ values: (rv.columns[0] as NumberColumn).values }, { families: ['gumbel'], returnPeriods: [10, 100, 200], designLife: 50, seed: 1 });
const sh = read('shaft-diameter.csv', [['diameter_mm', 'number']]);
const shaftValues = (sh.columns[0] as NumberColumn).values;
const CAP = analyzeDataset({ values: shaftValues }, { families: ['normal'], lsl: 24.99, usl: 25.01, target: 25, seed: 1 });
const CAP_EV = computeEvidence(prepareSample(shaftValues), CAP);

const OPTS = { width: 640, height: 400, units: 'h', quantity: 'Time' };
const host = (): HTMLElement => document.body.appendChild(document.createElement('div'));
const texts = (svg: SVGSVGElement): string[] => [...svg.querySelectorAll('text')].map((t) => t.textContent ?? '');
const axisTitles = (svg: SVGSVGElement): string[] => [...svg.querySelectorAll('[data-kind="axis-title"]')].map((t) => (t.textContent ?? '').replace(/^↑ /, ''));

beforeEach(() => {
  document.body.innerHTML = '';
  resetIds();
});

describe('life charts', () => {
  it('probability paper: one point per failure (22 of 30 units, datasets/README.md), a fitted line per model, percent ticks', () => {
    const svg = lifeProbabilityChart(host(), { plot: LIFE.life!.plot, curves: LIFE.life!.curves, labels: { weibull: 'Weibull', lognormal: 'Lognormal' }, scale: 'weibull', selected: 'weibull', suspensions: 8 }, OPTS);
    expect(svg.querySelectorAll('circle[data-kind="point"]')).toHaveLength(22);
    expect(svg.querySelectorAll('path[data-kind="curve"]')).toHaveLength(2);
    expect(texts(svg)).toContain('Do the failures follow the lines on Weibull paper?');
    expect(texts(svg)).toContain('10 %');
    expect(axisTitles(svg)).toEqual(['Time [h] (log scale)', 'Fraction failed']);
    expect(normaliseSvg(svg.outerHTML)).toMatchSnapshot();
  });

  it('log ticks are the 1-2-5 sequence (common practice, no source)', () => {
    expect(logTicks([150, 3000])).toEqual([200, 500, 1000, 2000]);
  });

  it('hazard: a curve per model, rate axis per unit of time', () => {
    const svg = hazardChart(host(), { curves: LIFE.life!.curves, labels: { weibull: 'Weibull', lognormal: 'Lognormal' }, selected: 'weibull' }, OPTS);
    expect(svg.querySelectorAll('path[data-kind="curve"]')).toHaveLength(2);
    expect(axisTitles(svg)).toEqual(['Time [h] (log scale)', 'Failures per unit per h']);
    expect(normaliseSvg(svg.outerHTML)).toMatchSnapshot();
  });
});

describe('return-period chart', () => {
  it('plots the 60 annual maxima, the selected model\'s levels with intervals, and the 2 × record marker', () => {
    const svg = returnPeriodChart(host(), { flood: FLOOD.flood!, candidates: FLOOD.candidates, selected: 'gumbel' }, { ...OPTS, units: 'm³/s', quantity: 'Peak flow' });
    expect(svg.querySelectorAll('circle[data-kind="point"]')).toHaveLength(60);
    expect(svg.querySelectorAll('line[data-kind="interval"]')).toHaveLength(3);
    expect(svg.querySelectorAll('line[data-kind="record-edge"]')).toHaveLength(1);
    // Named in the legend, not written on the plot over the curves.
    expect(texts(svg)).toContain("2 × record (120 y): beyond it the model's tail decides");
    expect(svg.querySelector('[data-kind="record-edge"] title')?.textContent).toBe('2 × record (120 years)');
    expect(normaliseSvg(svg.outerHTML)).toMatchSnapshot();
  });
});

describe('capability histogram', () => {
  it('shades the out-of-tolerance regions with the model\'s ppm written in them, the target dashed, the bars inside the drawn range', () => {
    const ce = CAP_EV.candidates[0]!;
    const ppm = CAP.candidates[0]!.ppmOutOfSpec!;
    const svg = capabilityHistogramChart(host(), { histogram: ce.histogram, densities: CAP_EV.densities, lsl: 24.99, usl: 25.01, target: 25, dataMin: CAP_EV.min, dataMax: CAP_EV.max, selected: 'normal', ppm }, { ...OPTS, units: 'mm', quantity: 'Diameter' });
    const regions = [...svg.querySelectorAll('[data-kind="out-of-spec"]')];
    expect(regions).toHaveLength(2);
    expect(svg.querySelectorAll('line[data-kind="limit"]')).toHaveLength(2);
    expect(svg.querySelectorAll('line[data-kind="target"]')).toHaveLength(1);
    // The words in each region: the limit and the core's ppm beyond it (ppmText of belowLsl / aboveUsl).
    expect(regions[0]!.querySelector('[data-kind="region-label"]')!.textContent).toContain('LSL 24.99');
    expect(regions[0]!.querySelector('[data-kind="region-label"]')!.textContent).toContain(ppmText(ppm.belowLsl));
    expect(regions[1]!.querySelector('[data-kind="region-label"]')!.textContent).toContain('USL 25.01');
    expect(regions[1]!.querySelector('[data-kind="region-label"]')!.textContent).toContain(ppmText(ppm.aboveUsl));
    // The region lies beyond its limit: the lower one ends at the LSL line, the upper one starts at the USL line.
    const r0 = regions[0]!.querySelector('rect')!;
    const r1 = regions[1]!.querySelector('rect')!;
    const l = [...svg.querySelectorAll('line[data-kind="limit"]')].map((n) => Number(n.getAttribute('x1')));
    expect(Number(r0.getAttribute('x')) + Number(r0.getAttribute('width'))).toBeCloseTo(l[0]!, 1);
    expect(Number(r1.getAttribute('x'))).toBeCloseTo(l[1]!, 1);
    expect(texts(svg)).toContain('Target 25');
    expect(svg.querySelectorAll('rect[data-kind="bar"]').length).toBe(ce.histogram.bars.length);
    expect(normaliseSvg(svg.outerHTML)).toMatchSnapshot();
  });
});

describe('stability chart slot', () => {
  it('draws the control chart from the capability report when subgroups are given, and nothing without them', () => {
    const sg = read('shaft-diameter.csv', [['diameter_mm', 'number'], ['subgroup', 'text']]);
    const withGroups = analyzeDataset({ values: (sg.columns[0] as NumberColumn).values, subgroups: (sg.columns[1] as TextColumn).texts }, { families: ['normal'], lsl: 24.99, usl: 25.01, seed: 1 });
    const ctx = { report: withGroups, selected: 'normal', lifeScale: 'weibull' as const };
    const svg = drawSlot('control-chart', host(), ctx, { ...OPTS, units: 'mm', quantity: 'Diameter' });
    expect(withGroups.capability?.stability).toBeTruthy();
    expect(svg?.getAttribute('role')).toBe('img');
    // The shaft demo without subgroups has no stability chart to draw.
    expect(CAP.capability?.stability ?? null).toBeNull();
    expect(drawSlot('control-chart', host(), { report: CAP, selected: 'normal', lifeScale: 'weibull' }, OPTS)).toBeNull();
  });

  it('the capability block lists the control-chart slot when the report has a stability section, and the page draws it there', () => {
    const sg = read('shaft-diameter.csv', [['diameter_mm', 'number'], ['subgroup', 'text']]);
    const withGroups = analyzeDataset({ values: (sg.columns[0] as NumberColumn).values, subgroups: (sg.columns[1] as TextColumn).texts }, { families: ['normal'], lsl: 24.99, usl: 25.01, seed: 1 });
    const block = decisionBlocks(withGroups, 'normal', 'mm').find((b) => b.id === 'capability')!;
    expect(block.charts).toContain('control-chart');
    const ctx = { report: withGroups, selected: 'normal', lifeScale: 'weibull' as const };
    const node = blockNode(block, (slot) => {
      const box = document.createElement('div');
      box.dataset['slot'] = slot;
      drawSlot(slot, box, ctx, { ...OPTS, units: 'mm', quantity: 'Diameter' });
      return box;
    });
    document.body.append(node);
    expect(node.querySelector('[data-slot="control-chart"] svg[role="img"]')).not.toBeNull();
    // Without subgroups or an order there is no stability section and no slot for it.
    expect(decisionBlocks(CAP, 'normal', 'mm').find((b) => b.id === 'capability')!.charts).not.toContain('control-chart');
  });
});

describe('decision blocks', () => {
  it('life: counts, the B10 row with its bounds, reliability with a lower bound, the cautions', () => {
    const [life] = decisionBlocks(LIFE, 'weibull', 'h');
    expect(life!.id).toBe('life');
    const facts = life!.lines.map((l) => l.text).join('\n');
    expect(facts).toMatch(/30 units on test: 22 failed, 8 suspended/);
    expect(facts).toMatch(/Reliability at 1000 h under Weibull: .*lower bound/);
    expect(life!.lines.some((l) => l.kind === 'caution')).toBe(true);
    expect(life!.tables[0]!.rows[0]![0]).toBe('B10');
  });

  it('flood: the design-life table and the beyond-record warning (200 > 2 × 60 years)', () => {
    const blocks = decisionBlocks(FLOOD, 'gumbel', 'm³/s');
    const flood = blocks.find((b) => b.id === 'flood')!;
    // 1 - (1 - 1/100)^50 = 39.5 % (textbook formula, common practice).
    expect(flood.tables[1]!.rows[1]).toEqual(['100', '39.5 %']);
    expect(flood.lines.some((l) => l.kind === 'warning' && /200/.test(l.text))).toBe(true);
    expect(blocks.some((b) => b.id === 'sensitivity')).toBe(true);
  });

  it('capability: normality gate, indices table, ppm table; the report HTML escapes the text', () => {
    const cap = decisionBlocks(CAP, 'normal', '<mm>').find((b) => b.id === 'capability')!;
    expect(cap.lines.some((l) => /^Normality gate/.test(l.text))).toBe(true);
    expect(cap.tables[0]!.rows.map((r) => r[0])).toEqual(expect.arrayContaining(['Pp', 'Ppk']));
    const html = blockHtml(cap, () => '');
    expect(html).toContain('(&lt;mm&gt;)');
    expect(html).not.toContain('<mm>');
  });
});

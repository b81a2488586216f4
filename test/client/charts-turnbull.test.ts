// @vitest-environment jsdom
/**
 * The Turnbull chart (client/charts/turnbull.ts) from the core's estimate of the invented valve
 * inspections (datasets/README.md) through the JSON the page receives: one box per innermost
 * interval, each spanning F before → F after (the estimate's own numbers), the box past the last
 * inspection drawn open, the fitted cdf as the line.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeEach, describe, expect, it } from 'vitest';
import { analyzeRecordedLife, parseStrictNumber, readColumns, type NumberColumn, type TextColumn } from '../../core/index.js';
import { resetIds } from '../../client/charts/frame.js';
import { turnbullChart } from '../../client/charts/turnbull.js';

const t = readColumns(readFileSync(join(process.cwd(), 'datasets', 'valve-inspections.csv'), 'utf8'), [
  { select: 'start_months', kind: 'text', keepBlank: true },
  { select: 'end_months', kind: 'text', keepBlank: true },
  { select: 'valves', kind: 'number' },
]);
const cell = (s: string, empty: number) => (s === '' ? empty : parseStrictNumber(s));
const start = (t.columns[0] as TextColumn).texts.map((s) => cell(s, 0));
const end = (t.columns[1] as TextColumn).texts.map((s) => cell(s, Number.POSITIVE_INFINITY));
const REPORT = JSON.parse(JSON.stringify(analyzeRecordedLife({ interval: { start, end, counts: (t.columns[2] as NumberColumn).values } }, { families: ['weibull'] })));

beforeEach(() => {
  document.body.innerHTML = '';
  resetIds();
});

describe('Turnbull chart', () => {
  it('draws one box per innermost interval from F before to F after, the last one open, and the fitted line', () => {
    const box = document.createElement('div');
    document.body.append(box);
    const w = REPORT.candidates[0];
    const svg = turnbullChart(box, { turnbull: REPORT.turnbull, fitted: { family: w.family, label: w.label, time: w.curves.time, cdf: w.curves.cdf } }, { width: 640, height: 400, units: 'months' });
    const boxes = [...svg.querySelectorAll('rect[data-kind="box"]')];
    expect(boxes.length).toBe(REPORT.turnbull.intervals.length);
    // Heights follow the masses: the tallest box is the interval with the largest mass.
    const heights = boxes.map((b) => Number(b.getAttribute('height')));
    const masses: number[] = REPORT.turnbull.intervals.map((iv: { mass: number }) => iv.mass);
    expect(heights.indexOf(Math.max(...heights))).toBe(masses.indexOf(Math.max(...masses)));
    expect(boxes.at(-1)!.getAttribute('data-open')).toBe('true');
    expect(boxes.slice(0, -1).every((b) => b.getAttribute('data-open') === null)).toBe(true);
    expect(svg.querySelectorAll('path[data-kind="curve"][data-family="weibull"]').length).toBe(1);
    expect(svg.textContent).toContain('Where the failures are known to lie');
    expect(svg.textContent).toContain('Fraction failed');
  });
});

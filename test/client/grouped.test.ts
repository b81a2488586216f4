// @vitest-environment jsdom
/**
 * Grouped counts on the page and in the report (issue 4, "Grouped counts"): the ranking cells when
 * Anderson–Darling is not offered, the grouped text (k − 1 − m with an asymptotic p), the column guess,
 * the classes read with the core's CSV reader, the observed-vs-expected chart per class and the
 * report's class counts section. Built from a real core analysis of the invented demo tally
 * datasets/inspection-classes.csv (datasets/README.md: 180 pits in 12 classes of 0.25 mm).
 */
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { analyzeDataset } from '../../core/index.js';
import { candidateCells } from '../../client/src/candidate-cells.js';
import { cellRows, chartCells, classRows, groupedText, guessGroupedColumns, isGrouped, readGroupedClasses } from '../../client/src/grouped-view.js';
import { buildReportHtml } from '../../client/src/report-html.js';
import { binCountsChart } from '../../client/charts/bin-counts.js';
import type { AnalyzeResponse } from '../../client/src/api.js';

const CSV = readFileSync(join(dirname(fileURLToPath(import.meta.url)), '..', '..', 'datasets', 'inspection-classes.csv'), 'utf8');
const COLS = [
  { index: 1, label: 'lower' },
  { index: 2, label: 'upper' },
  { index: 3, label: 'count' },
];

function report(): AnalyzeResponse {
  const classes = readGroupedClasses(CSV, { lower: 1, upper: 2, count: 3 }, { header: true, decimal: '.' });
  const grouped = classes.map((c) => ({ lower: c.lower ?? -Infinity, upper: c.upper ?? Infinity, count: c.count }));
  // JSON round trip as over the API (infinite limits become null).
  return JSON.parse(JSON.stringify(analyzeDataset({ grouped }, { families: ['normal', 'lognormal', 'gamma', 'weibull', 'exponential'] }))) as AnalyzeResponse;
}

describe('grouped counts: columns and classes', () => {
  it('recognises lower, upper and count headers, and nothing else (common practice, no source)', () => {
    expect(guessGroupedColumns(COLS)).toEqual({ lower: 1, upper: 2, count: 3 });
    expect(guessGroupedColumns([{ index: 1, label: 'hours' }, { index: 2, label: 'status' }])).toBeNull();
  });

  it('reads the 12 classes and 180 counts of the demo tally (datasets/README.md)', () => {
    const c = readGroupedClasses(CSV, { lower: 1, upper: 2, count: 3 }, { header: true, decimal: '.' });
    expect(c).toHaveLength(12);
    expect(c.reduce((s, x) => s + x.count, 0)).toBe(180);
    expect(c[0]).toEqual({ lower: 0, upper: 0.25, count: 1 });
  });

  it('a non-numeric cell is an error, not a skipped row (the classes must stay contiguous)', () => {
    expect(() => readGroupedClasses('lower,upper,count\n0,1,x\n', { lower: 1, upper: 2, count: 3 }, { header: true, decimal: '.' })).toThrow();
  });
});

describe('grouped counts: ranking, text, chart and report', () => {
  const r = report();
  if (!isGrouped(r)) throw new Error('expected a grouped report');
  const best = r.candidates[0]!;

  it('the ranking cells say "not offered" for A², with the reason, and carry no NaN', () => {
    for (const c of r.candidates) {
      const k = candidateCells(c);
      expect(k.adOffered).toBe(false);
      expect(k.adStatistic).toBe('not offered');
      expect(k.adMethodDetail).toBe(r.grouped.andersonDarling.reason);
      expect(JSON.stringify(k)).not.toMatch(/NaN|undefined/);
      if (c.chiSquare.computable) {
        expect(k.dofMain).toBe(String(c.chiSquare.k - 1 - c.estimatedParameters));
        expect(k.dofBracket).toBe('k − 1 − m, asymptotic');
      }
    }
  });

  it('the grouped text states k − 1 − m with the numbers and the AD reason from the core', () => {
    const t = groupedText(r, best);
    const chi = best.chiSquare;
    if (!chi.computable) throw new Error('chi-square expected');
    expect(t.test).toContain(`k − 1 − m = ${chi.k} − 1 − ${best.estimatedParameters} = ${chi.dof}`);
    expect(t.adNote).toMatch(/not offered for grouped data/);
    expect(classRows(r)).toHaveLength(13);
    expect(cellRows(best)).toHaveLength(chi.k + 1);
  });

  it('draws one bar and one expected mark per merged class', () => {
    const box = document.createElement('div');
    const svg = binCountsChart(box, { bins: { rows: chartCells(best) }, family: best.family, label: best.label, cell: 'class' }, { width: 600, height: 360, units: 'mm', quantity: 'Pit depth' });
    const k = best.chiSquare.computable ? best.chiSquare.k : 0;
    expect(svg.querySelectorAll('rect[data-kind="bar"]')).toHaveLength(k);
    expect(svg.querySelectorAll('line[data-kind="expected"]')).toHaveLength(k);
    expect(svg.textContent).toContain('per class');
    expect(svg.outerHTML).not.toMatch(/NaN/);
  });

  it('the report has the class counts section, the AD note and no value-based evidence section', () => {
    const html = buildReportHtml({
      response: r,
      selected: best.family,
      sourceName: 'inspection-classes',
      column: 'lower–upper, count',
      units: 'mm',
      quantity: 'Pit depth',
      generatedAt: new Date('2026-12-01T00:00:00Z'),
      charts: [{ svg: '<svg data-test="chart"></svg>', caption: 'cap' }],
      binsTable: [],
      requestedBins: null,
    });
    expect(html).toContain('id="grouped-counts"');
    expect(html).toContain('Anderson–Darling not offered.');
    expect(html).toContain('dof k−1−m');
    expect(html).toContain('<svg data-test="chart">');
    expect(html).not.toContain('<h2>Evidence for');
    expect(html).not.toMatch(/NaN|undefined/);
  });
});

// @vitest-environment jsdom
/**
 * The evidence charts, the bins table and the bins CSV of a censored sample, drawn from the core's
 * evidence of the bearing-life demo (30 units, 22 failed, 8 suspended at 2500 h; datasets/README.md):
 * suspensions are marked where they are and never drawn as failures, the distribution function is
 * the Kaplan–Meier step (below 100 % since the largest times are suspensions), and nothing is binned.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeEach, describe, expect, it } from 'vitest';
import { analyzeDataset, computeEvidence, prepareSample, readColumns, type NumberColumn, type TextColumn } from '../../core/index.js';
import { resetIds } from '../../client/charts/frame.js';
import { binsCsv } from '../../client/src/bins-csv.js';
import { binsTableRows, drawEvidence, evidenceFor } from '../../client/src/evidence-render.js';

const t = readColumns(readFileSync(join(process.cwd(), 'datasets', 'bearing-life.csv'), 'utf8'), [
  { select: 'hours', kind: 'number' },
  { select: 'status', kind: 'text' },
]);
const times = (t.columns[0] as NumberColumn).values;
const failed = (t.columns[1] as TextColumn).texts.map(Number);
const REPORT = analyzeDataset({ values: times, status: failed }, { families: ['weibull', 'lognormal'], bootstrapReplicates: 19, seed: 1 });
const EV = computeEvidence(prepareSample(times), REPORT, {}, { times, failed });

beforeEach(() => {
  document.body.innerHTML = '';
  resetIds();
});

function draw() {
  const targets = { histogram: document.createElement('div'), probability: document.createElement('div'), bins: document.createElement('div'), cdf: document.createElement('div') };
  const [histogram, probability, bins, cdf] = drawEvidence(targets, EV, 'weibull', { units: 'h', quantity: 'Life', sizeOf: () => ({ width: 640, height: 400 }) });
  return { histogram: histogram!, probability: probability!, bins: bins!, cdf: cdf! };
}

describe('censored evidence charts (bearing-life demo: 22 failures, 8 suspensions at 2500 h)', () => {
  it('the demo is what the test assumes', () => {
    expect(failed.filter((f) => f === 1)).toHaveLength(22);
    expect(times.filter((_, i) => failed[i] === 0).every((v) => v === 2500)).toBe(true);
    expect(EV.censoring?.suspensions).toBe(8);
  });

  it('probability plot: 22 failure points, the suspensions only as marks along the axis', () => {
    const svg = draw().probability;
    expect(svg.querySelectorAll('circle[data-kind="point"]')).toHaveLength(22);
    expect(svg.querySelector('[data-kind="suspension-marks"]')).not.toBeNull();
    // No point at the suspensions' time: the largest point is the last failure, before 2500 h.
    const lastFailure = Math.max(...times.filter((_, i) => failed[i] === 1));
    expect(lastFailure).toBeLessThan(2500);
    const pp = evidenceFor(EV, 'weibull')!.probabilityPlot;
    expect(Math.max(...pp.points.x)).toBeCloseTo(Math.log(lastFailure), 12);
    expect(svg.textContent).toContain('Suspensions (time only)');
  });

  it('distribution function: the Kaplan–Meier step ends below 100 %, with the suspensions marked on it', () => {
    const svg = draw().cdf;
    const d = svg.querySelector('path[data-kind="ecdf"]')!.getAttribute('d')!;
    const vs = [...d.matchAll(/V(-?[\d.]+)/g)].map((m) => Number(m[1]));
    // y(1) = 0 is the top of the plot: the step never reaches it.
    expect(Math.min(...vs)).toBeGreaterThan(0);
    expect(EV.cdf.empirical.p.at(-1)).toBeLessThan(1);
    expect(svg.querySelector('path[data-kind="suspension"]')).not.toBeNull();
    expect(svg.textContent).toContain('Share failed (Kaplan–Meier)');
  });

  it('histogram: no bars, the fitted densities with failure ticks and suspension triangles', () => {
    const svg = draw().histogram;
    expect(svg.querySelectorAll('rect[data-kind="bar"]')).toHaveLength(0);
    expect(svg.querySelectorAll('path[data-kind="curve"]')).toHaveLength(2);
    const ticks = svg.querySelector('[data-kind="failure-marks"] path')!.getAttribute('d')!;
    expect(ticks.match(/M/g)).toHaveLength(EV.censoring!.failureTimes.x.length);
    expect(svg.querySelector('[data-kind="suspension-marks"]')).not.toBeNull();
    expect(svg.querySelector('[data-kind="notes"]')?.textContent).toMatch(/No bars: a censored sample cannot be binned/);
  });

  it('observed-vs-expected bins, the bins table and the bins CSV: "not applicable: censored" with the reason', () => {
    const svg = draw().bins;
    expect(svg.querySelectorAll('rect[data-kind="bar"]')).toHaveLength(0);
    expect(svg.querySelector('[data-kind="empty-note"]')?.textContent).toMatch(/Not applicable: censored/);
    const ce = evidenceFor(EV, 'weibull')!;
    const rows = binsTableRows(ce, (x) => String(x));
    expect(rows).toEqual([['Bins: not applicable (censored)'], [ce.bins.notApplicable!.reason]]);
    expect(rows.flat().join(' ')).not.toMatch(/χ²/);
    const csv = binsCsv(ce, 'bearing-life.csv', 'hours', 'h').trimEnd().split('\r\n');
    expect(csv).toHaveLength(2);
    expect(csv[0]).toBe('model,source,column,units,bins,reason');
    expect(csv[1]).toContain('not applicable: censored');
    expect(csv.join('\n')).not.toMatch(/chi_square/);
  });
});

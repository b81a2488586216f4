/**
 * The curve grid and the suggested x domain follow the data, not the furthest candidate's bins
 * (regression: on the shaft-diameter demo, 25 mm ± 0.003, the support edge 0 of the positive
 * families spread 400 grid points over [0, 25.003], so none fell on the data and the page said
 * "Fitted curves not drawn").
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyze, computeEvidence, prepareSample, readColumn } from '../../core/index.js';

const csv = readFileSync(new URL('../../datasets/shaft-diameter.csv', import.meta.url), 'utf8');
const values = readColumn(csv, { column: 'diameter_mm' }).values;

describe('evidence grid over the data range (shaft-diameter demo)', () => {
  const sample = prepareSample(values);
  const report = analyze(values, { seed: 1 });
  const ev = computeEvidence(sample, report);
  const spread = sample.max - sample.min;

  it('puts most of the grid points on the data and keeps the domain within one data range of it', () => {
    // Common practice, no source: a curve needs many points where the data are to be drawn
    // faithfully (the page refuses to draw fewer than 12, client/charts/frame.ts FEW_CURVE_POINTS).
    const inside = ev.densities.x.filter((x) => x >= sample.min && x <= sample.max).length;
    expect(inside).toBeGreaterThan(100);
    expect(ev.xDomain[0]).toBeGreaterThanOrEqual(sample.min - spread);
    expect(ev.xDomain[1]).toBeLessThanOrEqual(sample.max + spread);
    expect(ev.xDomain[0]).toBeLessThanOrEqual(sample.min);
    expect(ev.xDomain[1]).toBeGreaterThanOrEqual(sample.max);
  });

  it('widens the domain by the fitted normal 0.1 %/99.9 % quantiles when they lie within reach', () => {
    // Normal quantile z(0.999) = 3.0902 (NIST/SEMATECH e-Handbook, table of the normal distribution).
    const normal = report.candidates.find((c) => c.family === 'normal');
    expect(normal).toBeDefined();
    const { location, scale } = normal!.parameters as { location: number; scale: number };
    const q999 = location + 3.0902 * scale;
    if (q999 > sample.max && q999 < sample.max + spread) expect(ev.xDomain[1]).toBeGreaterThanOrEqual(q999 - 1e-4 * scale);
    const q001 = location - 3.0902 * scale;
    if (q001 < sample.min && q001 > sample.min - spread) expect(ev.xDomain[0]).toBeLessThanOrEqual(q001 + 1e-4 * scale);
  });

  it('draws a first bar whose support edge 0 lies far below the data like an open edge', () => {
    // Common practice, no source: a bar from 0 to 24.997 would be a sliver of height ~0 that hides the data.
    let checked = 0;
    for (const ce of ev.candidates) {
      const first = ce.histogram.bars[0]!;
      if (first.lowerEdge === 0) {
        checked++;
        expect(first.openLower).toBe(true);
        expect(first.lower).toBeGreaterThan(0);
      }
    }
    for (const ce of ev.candidates) for (const b of ce.histogram.bars) expect(Number.isFinite(b.lower) && Number.isFinite(b.upper)).toBe(true);
    expect(checked).toBeGreaterThan(0);
  });

  it('keeps a support edge 0 that lies close to the data (a life test starting near 0)', () => {
    // Common practice, no source: 0 is then a true edge of the data's picture.
    const life = [0.4, 1.1, 1.9, 2.5, 3.3, 4.8, 5.2, 6.9, 8.1, 9.4, 11.2, 13.0, 15.5, 18.1, 22.4, 27.0, 31.3, 40.2, 52.0, 66.7];
    const r = analyze(life, { families: ['exponential'], seed: 1 });
    const e = computeEvidence(prepareSample(life), r);
    const first = e.candidates[0]!.histogram.bars[0]!;
    expect(first.lowerEdge).toBe(0);
    expect(first.openLower).toBe(false);
    expect(first.lower).toBe(0);
  });
});

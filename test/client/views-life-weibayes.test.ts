/**
 * The life section with r ≥ 2 failures and a Weibull shape given from experience
 * (client/src/views/life.ts): beside the maximum-likelihood B-life, the Weibayes alternative is
 * stated with the shape said to be ASSUMED, its scale and B10 and their lower bounds equal to
 * Nelson's (1985, J. Quality Technology 17:140-146) closed form with SciPy's chi2.ppf
 * (test/fixtures/life-weibayes.json, scripts/fixtures/life-weibayes.py). Without the shape: no such line.
 */
import { describe, expect, it } from 'vitest';
import { analyzeDataset, type DatasetReport } from '../../core/index.js';
import { sig } from '../../client/src/format.js';
import { lifeSection } from '../../client/src/views/life.js';
import { readFixture } from '../helpers/fixtures.js';

const c = readFixture('life-weibayes.json').weibayes[2];
const report = (assumedShape?: number): DatasetReport =>
  JSON.parse(JSON.stringify(analyzeDataset({ values: c.times, status: c.failed }, { bLifePercents: [10], confidence: 0.9, ...(assumedShape ? { assumedShape } : {}), seed: 1 }))) as DatasetReport;

describe('Weibayes beside maximum likelihood in the life section', () => {
  it('states the alternative with the shape assumed and the closed-form numbers', () => {
    const r = report(c.shape);
    const block = lifeSection({ report: r, selected: r.candidates[0] ?? null, units: 'h' } as never)!;
    const line = block.lines.find((l) => l.text.startsWith('Alternative with the Weibull shape ASSUMED'));
    expect(line).toBeDefined();
    const a = Math.sqrt(-Math.log(0.9));
    expect(line!.text).toBe(
      `Alternative with the Weibull shape ASSUMED at β = 2, not estimated (Weibayes; Nelson 1985; 9 failures in 15 units): scale ${sig(c.scale)} h, at least ${sig(c.scaleLower)} h; B10 ${sig(c.scale * a)} h, at least ${sig(c.scaleLower * a)} h (one-sided 90 % lower bounds). The numbers above are by maximum likelihood, which estimates the shape; details under “Life: other estimators, subpopulations and few failures”.`,
    );
  });
  it('says nothing of it without an assumed shape', () => {
    const r = report();
    const block = lifeSection({ report: r, selected: r.candidates[0] ?? null, units: 'h' } as never)!;
    expect(block.lines.some((l) => /ASSUMED/.test(l.text))).toBe(false);
  });
});

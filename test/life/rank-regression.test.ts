import { describe, expect, it } from 'vitest';
import { fitRankRegression, johnsonBenardPositions, prepareLifeData, RANK_REGRESSION_FAMILIES } from '../../core/life/index.js';
import { readFixture, rel } from '../helpers/fixtures.js';

// Fixture: scripts/fixtures/life-rank-regression.py (Johnson adjusted ranks and Benard's median rank
// from their definitions; NumPy polyfit of x on y; SciPy linregress; SciPy logpdf/logsf).
const fx = readFixture('life-rank-regression.json');

describe('rank regression (median ranks, x on y)', () => {
  for (const set of ['nist', 'small'] as const) {
    const data = prepareLifeData({ times: fx[set].times, failed: fx[set].failed });
    it(`${set}: Johnson–Benard positions agree with their definitions`, () => {
      const pts = johnsonBenardPositions(data, 0.9);
      expect(pts.length).toBe(fx[set].positions.length);
      pts.forEach((p, i) => expect(rel(p.F, fx[set].positions[i])).toBeLessThan(1e-13));
    });
    for (const fam of RANK_REGRESSION_FAMILIES) {
      it(`${set}: ${fam} parameters, correlation and log-likelihood agree with NumPy polyfit / SciPy (1e-10)`, () => {
        const ref = fx[set].fits[fam];
        const f = fitRankRegression(fam, data);
        expect(f.ok).toBe(true);
        if (!f.ok) return;
        expect(f.estimation).toBe('rank-regression');
        // Least squares in double precision on ≤ 10 points: agreement to 1e-10 (rounding of sums).
        for (const [k, v] of Object.entries(ref.parameters as Record<string, number>)) expect(rel(f.parameters[k] as number, v), `${k}`).toBeLessThan(1e-10);
        expect(rel(f.correlation, ref.correlation)).toBeLessThan(1e-10);
        expect(rel(f.logLikelihood, ref.logLikelihood)).toBeLessThan(1e-9);
      });
    }
  }

  it('gamma has no straight-line paper: not offered, with the reason', () => {
    const f = fitRankRegression('gamma', prepareLifeData({ times: [1, 2, 3], failed: [1, 1, 1] }));
    expect(f.ok).toBe(false);
    if (!f.ok) expect(f.reason).toMatch(/no straight-line probability paper/);
  });
});

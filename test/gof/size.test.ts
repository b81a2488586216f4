import { describe, expect, it } from 'vitest';
import type { FamilyName } from '../../core/index.js';
import { SIZE_CHECK_PARAMETERS, sizeCheck } from '../../scripts/size-check.js';

// Monte Carlo size check (DEVELOPERS.md: seeded, tolerance from the binomial standard error).
// At α = 0.05 a test of the right size rejects 5 % of samples drawn from the model. We want ±1 %
// to be 3 binomial SE: R = 9·α(1 - α)/0.01² = 4275 replicates per family (n = 100).
const ALPHA = 0.05;
const TOL = 0.01;
const R = Math.ceil((9 * ALPHA * (1 - ALPHA)) / (TOL * TOL));
const SEED = 2026;

describe('size of the tests at α = 0.05 under each family (n = 100)', () => {
  for (const family of Object.keys(SIZE_CHECK_PARAMETERS) as FamilyName[]) {
    it(`${family}: Anderson–Darling and chi-square reject 5 % ± 1 %`, () => {
      const r = sizeCheck(family, R, 100, ALPHA, SEED);
      expect(r.replicates).toBe(4275);
      expect(r.chiSquareComputed).toBe(R);
      const ad = r.andersonDarling / R;
      const chi = r.chiSquare / r.chiSquareComputed;
      const chiUpper = r.chiSquareUpper / r.chiSquareComputed;
      expect(Math.abs(ad - ALPHA), `AD rate ${ad}`).toBeLessThanOrEqual(TOL);
      expect(Math.abs(chi - ALPHA), `chi-square (k-1-m) rate ${chi}`).toBeLessThanOrEqual(TOL);
      // Chernoff & Lehmann (1954): the k - 1 reference is conservative, so it rejects less often.
      expect(chiUpper).toBeLessThan(chi);
      expect(chiUpper).toBeLessThanOrEqual(ALPHA + TOL);
    });
  }
});

/**
 * Generalized Pareto vs SciPy `genpareto`, generalized logistic vs SciPy `fisk` (its log-logistic
 * form for shape > 0, mirrored for shape < 0) and `logistic` (shape 0), each value cross-checked
 * with 40-digit mpmath (test/fixtures/gpd-glo.json from scripts/fixtures/gpd-glo.py). Tolerance:
 * 1e-12 relative on log values (DEVELOPERS.md policy), 1e-10 where the value is a log of a
 * probability below 1e-20.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { getFamily } from '../../core/families/index.js';
import type { FamilyName } from '../../core/families/index.js';

interface V {
  value: number;
}
interface Case {
  family: FamilyName;
  parameters: Record<string, number>;
  points: { x: number; logpdf: V; logcdf: V; logsf: V }[];
  quantiles?: { p: number; ppf: V; isf: V }[];
}
const FIX = JSON.parse(readFileSync(new URL('../fixtures/gpd-glo.json', import.meta.url), 'utf8')) as { cases: Case[] };

function rel(a: number, b: number): number {
  return a === b ? 0 : Math.abs(a - b) / Math.abs(b);
}

describe('generalized Pareto and generalized logistic vs SciPy / mpmath', () => {
  for (const c of FIX.cases) {
    it(`${c.family} ${JSON.stringify(c.parameters)}`, () => {
      const d = getFamily(c.family).make(c.parameters);
      for (const p of c.points) {
        for (const [got, ref] of [
          [d.logPdf(p.x), p.logpdf.value],
          [d.logCdf(p.x), p.logcdf.value],
          [d.logSf(p.x), p.logsf.value],
        ] as const) {
          const tol = ref < -46 ? 1e-10 : 1e-12;
          expect(rel(got, ref), `x = ${p.x}`).toBeLessThanOrEqual(Math.max(tol, 1e-15 / Math.abs(ref)));
        }
      }
      for (const q of c.quantiles ?? []) {
        expect(rel(d.quantile(q.p), q.ppf.value)).toBeLessThanOrEqual(1e-12);
        expect(rel(d.isf(q.p), q.isf.value)).toBeLessThanOrEqual(1e-12);
      }
    });
  }
});

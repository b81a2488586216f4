/**
 * Size of the inspection-scheme Anderson–Darling bootstrap (core/life/interval-bootstrap.ts) from the
 * committed seeded simulation (scripts/life-interval-size.ts -> test/fixtures/life-interval-size.json):
 * each cell's rate recomputed from its stored p-values; the cell whose scheme may decide (a common
 * schedule) within 5 ± 1 points at α = 5 % (the target; SE = √(0.05·0.95/samples)); the
 * report's words (INTERVAL_GOF_SIZE) quoting these very counts, and a scheme marked as deciding only
 * when its measured size is within 5 ± 1; the first sample of each cell reproduced here, so a change
 * to the replicate scheme, the statistic or the refit shows as a changed p-value. Before the scheme
 * was rebuilt (commit 818cb0e) the same cells gave 0.5 % and 0 % in 200 samples.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { INTERVAL_GOF_SIZE } from '../../core/life/index.js';
import { OWN_TIMES_CELLS, lrPValue, sizePValue } from '../../scripts/life-interval-size.js';

interface Cell {
  scheme: 'case2' | 'periodic';
  samples: number;
  rejected: number;
  size: number;
  standardError: number;
  firstPValues: number[];
  pValues: (number | null)[];
}

/** The size study's designs and the scheme the bootstrap rebuilds for each (test/life/interval-inspection-scheme.test.ts). */
const KIND = { periodic: 'common-schedule', case2: 'own-times' } as const;

describe('size of the inspection-scheme bootstrap (scripts/life-interval-size.ts, committed seeded run)', () => {
  const fx = JSON.parse(readFileSync(join(process.cwd(), 'test', 'fixtures', 'life-interval-size.json'), 'utf8')) as { alpha: number; replicates: number; cells: Cell[] };

  for (const scheme of ['case2', 'periodic'] as const) {
    it(`${scheme}: the rate is the stored p-values'; the report quotes it and lets the scheme decide only within 5 ± 1 points`, () => {
      const c = fx.cells.find((x) => x.scheme === scheme)!;
      const ok = c.pValues.filter((p): p is number => p !== null);
      expect(ok.length).toBe(c.samples);
      expect(ok.filter((p) => p <= fx.alpha).length).toBe(c.rejected);
      expect(c.size).toBeCloseTo(c.rejected / c.samples, 12);
      expect(c.standardError).toBeCloseTo(Math.sqrt((0.05 * 0.95) / c.samples), 12);
      expect(c.samples).toBeGreaterThanOrEqual(1000);
      const words = INTERVAL_GOF_SIZE[KIND[scheme]];
      expect(words.text).toContain(`${c.rejected} of ${c.samples} seeded samples`);
      expect(words.text).toContain(`${(100 * c.size).toFixed(1)} %`);
      expect(words.text).toContain(`SE ${(100 * c.standardError).toFixed(2)} points`);
      expect(words.calibrated).toBe(Math.abs(c.size - 0.05) <= 0.01);
    });
  }

  it('the common schedule, which decides, is within 5 ± 1 points', () => {
    const c = fx.cells.find((x) => x.scheme === 'periodic')!;
    expect(Math.abs(c.size - 0.05)).toBeLessThanOrEqual(0.01);
  });

  it('the committed run is reproduced: the first sample of each cell gives the same p-value', { timeout: 60_000 }, () => {
    for (const c of fx.cells) expect(sizePValue(c.scheme, 0, fx.replicates)).toBe(c.pValues[0]);
  });
});

/**
 * The likelihood-ratio candidate for own-times rows (scripts/life-interval-size.ts LR cells ->
 * test/fixtures/life-interval-lr-size.json): every cell recomputed from its stored p-values; the
 * own-times words quote the pooled counts (by shape where each row records every inspection, own2 and
 * own2e; and where units had unrecorded inspections, ownk, for the ratio and for A²); the own-times scheme decides nothing
 * because no group is within 5 ± 0.5 points (the brief's tolerance), and would be marked to decide
 * only if every group were; each cell's first sample reproduced.
 */
describe('size of the likelihood-ratio candidate for own inspection times (committed seeded run)', () => {
  const fx = JSON.parse(readFileSync(join(process.cwd(), 'test', 'fixtures', 'life-interval-lr-size.json'), 'utf8')) as { alpha: number; replicates: number; cells: Cell[] };
  const pooled = (pick: (cell: string) => boolean) => {
    const cs = fx.cells.filter((c) => pick(c.scheme));
    const rejected = cs.reduce((a, c) => a + c.rejected, 0);
    const samples = cs.reduce((a, c) => a + c.samples, 0);
    return { rejected, samples, size: rejected / samples };
  };
  const groups = {
    'shape 0.8, every inspection recorded': pooled((c) => /^own2e?-0\.8-/.test(c)),
    'shape 2, every inspection recorded': pooled((c) => /^own2e?-2-/.test(c)),
    'inspections not recorded': pooled((c) => c.startsWith('ownk-')),
    'A², inspections not recorded': pooled((c) => c.startsWith('a2-ownk-')),
  };

  it('every cell of the design is there, its rate from its stored p-values', () => {
    expect(fx.cells.map((c) => c.scheme).sort()).toEqual([...OWN_TIMES_CELLS].sort());
    for (const c of fx.cells) {
      const ok = c.pValues.filter((p): p is number => p !== null);
      expect(ok.length).toBe(c.samples);
      expect(ok.filter((p) => p <= fx.alpha).length).toBe(c.rejected);
      expect(c.standardError).toBeCloseTo(Math.sqrt((0.05 * 0.95) / c.samples), 12);
      expect(c.samples).toBeGreaterThanOrEqual(c.scheme.startsWith('a2-') ? 100 : 200);
    }
  });

  it('the own-times words quote the pooled counts, and the scheme decides only if every group is within 5 ± 0.5 points', () => {
    const words = INTERVAL_GOF_SIZE['own-times'];
    for (const g of Object.values(groups)) expect(words.text).toContain(`${g.rejected} of ${g.samples} (${(100 * g.size).toFixed(1)} %)`);
    expect(words.text).toContain('24 of 1000 seeded samples');
    const lr = Object.entries(groups).filter(([k]) => !k.startsWith('A²')).map(([, g]) => g);
    expect(words.calibrated).toBe(lr.every((g) => Math.abs(g.size - 0.05) <= 0.005));
    expect(words.calibrated).toBe(false);
  });

  it('the committed run is reproduced: the first sample of each cell gives the same p-value', { timeout: 120_000 }, () => {
    for (const c of fx.cells) expect(lrPValue(c.scheme, 0, fx.replicates)).toBe(c.pValues[0]);
  });
});

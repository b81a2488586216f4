/**
 * Size of the inspection-scheme Anderson–Darling bootstrap (core/life/interval-bootstrap.ts) from the
 * committed seeded simulation (scripts/life-interval-size.ts -> test/fixtures/life-interval-size.json):
 * the committed rates, and the first sample of each cell reproduced here.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { sizePValue } from '../../scripts/life-interval-size.js';

describe('size of the inspection-scheme bootstrap (scripts/life-interval-size.ts, committed seeded run)', () => {
  const fx = JSON.parse(readFileSync(join(process.cwd(), 'test', 'fixtures', 'life-interval-size.json'), 'utf8')) as {
    replicates: number;
    cells: { scheme: 'case2' | 'periodic'; samples: number; rejected: number; size: number; standardError: number; firstPValues: number[] }[];
  };

  // Measured, not the nominal 5 %: in both designs the bootstrap rejects far less often than α (it is
  // conservative). Under the case-2 design the replicates turn a suspension at V into one inspection at V
  // (the unit's earlier inspection at U is not in its row), so they carry less information than the
  // data; this is the likely cause and is left open (see core/life/interval-bootstrap.ts).
  it('under each unit’s own two inspections (case 2) it is conservative: more than 2 SE below 5 %', () => {
    const c = fx.cells.find((x) => x.scheme === 'case2')!;
    expect(c.size).toBeCloseTo(c.rejected / c.samples, 12);
    expect(c.size).toBeLessThan(0.05 - 2 * c.standardError);
  });

  it('under a denser common schedule than the rows show it is conservative as well', () => {
    const c = fx.cells.find((x) => x.scheme === 'periodic')!;
    expect(c.size).toBeCloseTo(c.rejected / c.samples, 12);
    expect(c.size).toBeLessThan(0.05 - 2 * c.standardError);
  });

  it('the committed run is reproduced: the first sample of each cell gives the same p-value', { timeout: 60_000 }, () => {
    for (const c of fx.cells) expect(sizePValue(c.scheme, 0, fx.replicates)).toBe(c.firstPValues[0]);
  });
});

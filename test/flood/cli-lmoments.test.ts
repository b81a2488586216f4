/**
 * `plumbline analyze --estimation lmoments` on annual maxima (the invented river-peaks demo) through
 * the command's entry (runCli): with return periods the text report gains the L-moment section
 * (levels as point estimates, each table naming its estimator) and the JSON the
 * `flood.estimators.lmoments` block with the levels checked against SciPy in estimators.test.ts;
 * without return periods the option is refused with exit code 2 instead of changing nothing.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runCli, type CliIo } from '../../cli/run.js';

const fx = JSON.parse(readFileSync('test/fixtures/flood-estimators.json', 'utf8'));

async function cli(argv: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const io: CliIo = { out: (s: string) => void (out += s), err: (s: string) => void (err += s) };
  const code = await runCli(argv, io);
  return { code, out, err };
}

const BASE = ['analyze', 'datasets/river-peaks.csv', '--column', 'peak_flow_m3s', '--families', 'gumbel', '--seed', '5'];

describe('plumbline analyze --estimation lmoments', () => {
  it('text: the L-moment section after the flood section, the GEV 100-year level as SciPy gives it (4 significant digits)', async () => {
    const r = await cli([...BASE, '--return-periods', '10,100', '--estimation', 'lmoments']);
    expect(r.code).toBe(0);
    const flood = r.out.indexOf('Flood frequency');
    const lm = r.out.indexOf('Flood levels by L-moments (beside maximum likelihood)');
    expect(flood).toBeGreaterThanOrEqual(0);
    expect(lm).toBeGreaterThan(flood);
    const gevRow = r.out.split('\n').find((l) => /^\s+GEV\s/.test(l) && l.indexOf('GEV') > 0 && r.out.indexOf(l) > lm)!;
    const gev100 = fx.lmoments.levels.gev[3] as number; // periods [2, 10, 50, 100, 200]
    expect(gevRow).toContain(String(Number(gev100.toPrecision(4))));
  });

  it('JSON: flood.estimators with the five L-moment fits, no EMA block', async () => {
    const r = await cli([...BASE, '--return-periods', '100', '--estimation', 'lmoments', '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.flood.estimators.requested).toBe('lmoments');
    expect(j.flood.estimators.ema).toBeNull();
    expect(j.flood.estimators.lmoments.fits.map((f: { family: string }) => f.family)).toEqual(['gumbel', 'gev', 'genlogistic', 'genpareto', 'pearson3']);
  });

  it('without return periods: refused (exit 2), not silently ignored', async () => {
    const r = await cli([...BASE, '--estimation', 'lmoments']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/give return periods too/);
  });
});

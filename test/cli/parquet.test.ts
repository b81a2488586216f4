/**
 * Parquet input gives the report the same data give as CSV. Files: test/fixtures/parquet/, written by
 * scripts/fixtures/parquet.ts with hyparquet-writer (aircondit: the published Proschan 1963 intervals;
 * long: a format test of a quoted text key, doubles and one null).
 */
import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { runCli } from '../../cli/run.js';
import { root } from '../helpers/cli.js';

const dir = join(root, 'test/fixtures/parquet');

async function run(...args: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const code = await runCli(args, { out: (s) => (out += s), err: (s) => (err += s) });
  return { code, out, err };
}

const withoutInput = (json: string): unknown => {
  const { input: _i, ...rest } = JSON.parse(json) as Record<string, unknown>;
  return rest;
};

describe('Parquet input', () => {
  it('one DOUBLE column: the same report as the CSV of datasets/aircondit.csv (exponential mean 108.0833, Proschan 1963 via SciPy)', async () => {
    const p = await run('analyze', join(dir, 'aircondit.parquet'), '--json', '--families', 'exponential,gamma');
    const c = await run('analyze', join(root, 'datasets/aircondit.csv'), '--column', 'hours', '--json', '--families', 'exponential,gamma');
    expect(p.code, p.err).toBe(0);
    expect(withoutInput(p.out)).toEqual(withoutInput(c.out));
    const report = JSON.parse(p.out);
    const expo = report.candidates.find((x: { family: string }) => x.family === 'exponential');
    expect(1 / expo.parameters.rate).toBeCloseTo(108.0833, 4);
    expect(report.input.warnings.join(' ')).toMatch(/read from Parquet: 12 rows, 1 columns/);
  });

  it('a long table with a quoted key and a null: the batch lines equal those of the CSV', async () => {
    const opts = ['--by', 'gauge', '--column', 'peak', '--json', '--families', 'normal,gumbel', '--skip-invalid'];
    const p = await run('analyze', join(dir, 'long.parquet'), ...opts);
    const c = await run('analyze', join(dir, 'long.csv'), ...opts);
    expect(p.code, p.err).toBe(0);
    expect(c.code, c.err).toBe(0);
    const sort = (s: string): unknown[] => s.trim().split('\n').map((l) => JSON.parse(l)).sort((a, b) => (a.series < b.series ? -1 : 1));
    expect(sort(p.out)).toEqual(sort(c.out));
    expect(sort(p.out)).toHaveLength(3);
  });

  it('a damaged Parquet file is one clear error, exit 2', async () => {
    const { writeFileSync, mkdtempSync } = await import('node:fs');
    const { tmpdir } = await import('node:os');
    const bad = join(mkdtempSync(join(tmpdir(), 'pq-')), 'bad.parquet');
    writeFileSync(bad, 'PAR1 this is not really parquet');
    const r = await run('analyze', bad, '--json');
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/cannot read .* as Parquet/);
  });
});

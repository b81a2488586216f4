/**
 * A peak file through POST /api/analyze (issue 12): recognised before any CSV header is read and
 * analysed as one flood record by log-Pearson III and the expected moments algorithm, with the
 * numbers the CLI's `--estimation ema --json` prints for the same file and options (both call
 * core/workflow/flood-record.ts: same reading, regional-skew pairing, default periods, seed and
 * bootstrap stream). Bad peak files and options that do not apply are 400s naming the row, column
 * and value, never 500s. Data: the invented gauge datasets/invented-gauge-peaks.txt (README: 78
 * peaks 1888-2024, codes 2, 4, 6, 7 ×3, 8; demo regional skew −0.10 with MSE 0.12).
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { parseArgs, type AnalyzeArgs } from '../../cli/args.js';
import { runFloodEmaJson } from '../../cli/flood-ema.js';
import { looksLikePeakFile } from '../../core/index.js';
import { testApp } from './helpers.js';

const FILE = fileURLToPath(new URL('../../datasets/invented-gauge-peaks.txt', import.meta.url));
const TEXT = readFileSync(FILE, 'utf8');

const { app, logged } = testApp();
afterAll(async () => {
  await app.shutdown();
  expect(logged).toEqual([]);
});

function cli(extra: string[]): ReturnType<typeof runFloodEmaJson> {
  return runFloodEmaJson(parseArgs(['analyze', FILE, '--estimation', 'ema', ...extra]) as AnalyzeArgs);
}

describe('a peak file on the API', () => {
  it('is recognised by its header after the # comments, not by a # alone', () => {
    expect(looksLikePeakFile(TEXT)).toBe(true);
    // A CSV with a comment line but no peak_va column is not a peak file.
    expect(looksLikePeakFile('# notes\nyear,flow\n2001,5\n')).toBe(false);
    expect(looksLikePeakFile('year,flow\n2001,5\n')).toBe(false);
    // The header alone (no comments) names it.
    expect(looksLikePeakFile('agency_cd\tsite_no\tpeak_dt\tpeak_va\n5s\t15s\t10d\t8s\nXX\t1\t2001-01-01\t5\n')).toBe(true);
  });

  it('the API report equals the CLI JSON: parameters, skews and weights, return levels with intervals (default periods and seed)', { timeout: 120_000 }, async () => {
    const res = await request(app).post('/api/analyze').send({ csv: TEXT, regionalSkew: -0.1, regionalSkewMse: 0.12 });
    expect(res.status, JSON.stringify(res.body.error ?? null)).toBe(200);
    const rec = res.body.floodRecord;
    const c = cli(['--regional-skew', '-0.1', '--regional-skew-mse', '0.12']).candidates[0]!;
    expect(rec.ema.family).toBe('logpearson3');
    expect(rec.ema.parameters).toEqual(c.parameters);
    expect(rec.ema.skew).toEqual(c.skew);
    expect(rec.ema.skew.regionalSkew).toBe(-0.1);
    expect(rec.ema.skew.regionalSkewMse).toBe(0.12);
    expect(rec.ema.counts).toEqual(c.counts);
    expect(rec.ema.lowOutliers).toEqual(c.lowOutliers);
    expect(rec.periods).toEqual([2, 5, 10, 25, 50, 100, 200, 500]);
    expect(rec.ema.returnLevels.map((l: { period: number; estimate: number; lower: number; upper: number; bootstrapLower: number; bootstrapUpper: number }) => [l.period, l.estimate, l.lower, l.upper, l.bootstrapLower, l.bootstrapUpper])).toEqual(
      c.returnLevels.map((l) => [l.period, l.estimate, l.lower, l.upper, l.bootstrap?.lower ?? null, l.bootstrap?.upper ?? null]),
    );
    expect(rec.ema.intervalMethod).toBe(c.returnLevels[0]!.method);
    // The record's make-up, as datasets/README.md describes the invented gauge.
    expect(rec.makeUp.peaks).toBe(78);
    expect([rec.makeUp.firstYear, rec.makeUp.lastYear]).toEqual([1888, 2024]);
    expect(rec.makeUp.historicPeaks).toBe(3);
    expect([rec.makeUp.knownBelow, rec.makeUp.knownAbove]).toEqual([1, 1]);
    expect(rec.makeUp.systematic).toEqual({ peaks: 75, firstYear: 1950, lastYear: 2024 });
    expect(rec.makeUp.codes.map((x: { code: string }) => x.code)).toEqual(['2', '4', '6', '7', '8']);
    expect(rec.historicalPeriod).toMatchObject({ firstYear: 1888, assumed: true });
    expect(rec.ema.cautions.join(' ')).toMatch(/governing agency/);
    expect(res.body.input).toMatchObject({ column: 'peak_va', n: 78 });
    expect(res.body.candidates).toEqual([]);
  });

  it('the historical-period options reach the reading as on the CLI', { timeout: 120_000 }, async () => {
    const res = await request(app).post('/api/analyze').send({ csv: TEXT, perceptionThreshold: 5000, historicalStart: 1880, returnPeriods: [100] });
    expect(res.status, JSON.stringify(res.body.error ?? null)).toBe(200);
    const c = cli(['--perception-threshold', '5000', '--historical-start', '1880', '--return-periods', '100']).candidates[0]!;
    expect(res.body.floodRecord.historicalPeriod).toEqual({ firstYear: 1880, threshold: 5000, yearsBelow: 67, assumed: false });
    expect(res.body.floodRecord.ema.parameters).toEqual(c.parameters);
    expect(res.body.floodRecord.ema.returnLevels[0].estimate).toBe(c.returnLevels[0]!.estimate);
  });

  it('a bad peak is a 400 naming the row, the column and the value', async () => {
    const bad = TEXT.replace('1951-07-05\t2966', '1951-07-05\t29x6');
    const res = await request(app).post('/api/analyze').send({ csv: bad });
    expect(res.status).toBe(400);
    expect(res.body.error.place).toEqual({ row: 12, column: 'peak_va', value: '29x6' });
    const date = await request(app).post('/api/analyze').send({ csv: TEXT.replace('1952-10-03', '1952/10/03') });
    expect(date.status).toBe(400);
    expect(date.body.error.place).toEqual({ row: 13, column: 'peak_dt', value: '1952/10/03' });
  });

  it('column roles and options that do not apply to a peak file are 400s naming them', async () => {
    for (const [body, pattern] of [
      [{ statusColumn: 'peak_cd' }, /statusColumn does not apply/],
      [{ column: 'site_no' }, /peaks are column peak_va/],
      [{ usl: 5000 }, /specification limits/],
      [{ regionalSkew: -0.1 }, /regional skew|go together|needs/i],
      [{ estimation: 'ml' }, /estimation ml does not apply/],
    ] as const) {
      const res = await request(app).post('/api/analyze').send({ csv: TEXT, ...body });
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.body.error.message).toMatch(pattern);
    }
    const ok = await request(app).post('/api/analyze').send({ csv: TEXT, column: 'peak_va', returnPeriods: [10] });
    expect(ok.status).toBe(200);
  });
});

/**
 * Issue 13 through the API (the one pipeline the page uses):
 *  - time + status with r ≥ 2 failures and assumedShape: maximum-likelihood candidates AND the Weibayes
 *    alternative, its scale and bound equal to Nelson's (1985, J. Quality Technology 17:140-146)
 *    closed form with SciPy's chi2.ppf (test/fixtures/life-weibayes.json), equal to the CLI's;
 *  - interval rows with inspectionTimesColumn: the bootstrap reproduces each unit's stated schedule
 *    (scheme 'stated'), run on the worker pool as the in-process report gives it.
 */
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { analyzeRecordedLife } from '../../core/index.js';
import { readFixture, rel } from '../helpers/fixtures.js';
import { STATED_CSV } from '../helpers/stated-schedules.js';
import { testApp } from './helpers.js';

const { app, logged } = testApp();
afterAll(async () => {
  await app.shutdown();
  expect(logged).toEqual([]);
});
const fx = readFixture('life-weibayes.json');

describe('Weibayes beside maximum likelihood through the API', () => {
  it('r ≥ 2: candidates by maximum likelihood and life.recorded.report.weibayes as SciPy’s closed form; equal to the CLI’s', async () => {
    const c = fx.weibayes[2];
    const csv = `hours,status\n${c.times.map((t: number, i: number) => `${t},${c.failed[i]}`).join('\n')}\n`;
    const res = await request(app).post('/api/analyze').send({ csv, column: 'hours', statusColumn: 'status', assumedShape: c.shape, seed: 1 });
    expect(res.status).toBe(200);
    expect(res.body.candidates.map((x: { family: string }) => x.family)).toContain('weibull');
    const w = res.body.life.recorded.report.weibayes;
    expect(w.failures).toBe(9);
    expect(rel(w.scale, c.scale)).toBeLessThan(1e-13);
    expect(rel(w.scaleLower, c.scaleLower)).toBeLessThan(1e-12);
    const cli = analyzeRecordedLife({ times: c.times, failed: c.failed }, { assumedShape: c.shape });
    expect(w).toEqual(JSON.parse(JSON.stringify(cli.weibayes)));
    expect(res.body.life.recorded.report.cautions.some((x: string) => x.startsWith('Weibayes is an alternative beside maximum likelihood'))).toBe(true);
  });
});

describe('stated inspection schedules through the API', () => {
  const csv = STATED_CSV;
  it('inspectionTimesColumn: scheme stated, the column listed among the input columns; the pool gives the in-process p-value', async () => {
    const res = await request(app).post('/api/analyze').send({ csv, intervalColumns: ['start', 'end'], inspectionTimesColumn: 'seen', families: ['weibull'], replicates: 39, seed: 3 });
    expect(res.status).toBe(200);
    const g = res.body.life.recorded.report.candidates.find((x: { family: string }) => x.family === 'weibull').goodnessOfFit;
    expect(g.scheme).toBe('stated');
    expect(res.body.input.otherColumns).toContainEqual({ role: 'inspection times', column: 'seen' });
    const rows = csv.split('\n').slice(1).map((l) => l.split(','));
    const here = analyzeRecordedLife(
      { interval: { start: rows.map((r) => (r[0] === '' ? 0 : Number(r[0]))), end: rows.map((r) => (r[1] === '' ? Infinity : Number(r[1]))), inspections: rows.map((r) => r[2]!.split(';').map(Number)) } },
      { families: ['weibull'], replicates: 39, seed: 3, mixture: false },
    );
    expect(g.pValue).toBe(here.candidates[0]!.goodnessOfFit!.pValue);
  });
  it('refuses the column without interval rows, and a row its times cannot give, naming the row', async () => {
    const a = await request(app).post('/api/analyze').send({ csv: 'x\n1\n2\n3\n', column: 'x', inspectionTimesColumn: 'x' });
    expect(a.status).toBe(400);
    expect(a.body.error.message).toMatch(/inspection/i);
    const b = await request(app).post('/api/analyze').send({ csv: 'start,end,seen\n45,70,15; 45; 60; 70\n', intervalColumns: ['start', 'end'], inspectionTimesColumn: 'seen' });
    expect(b.status).toBe(400);
    expect(b.body.error.message).toMatch(/^Row 2: running at 45 and found failed at 70/);
  });
});

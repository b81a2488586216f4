/**
 * POST /api/analyze and /api/jobs with the trade-workflow fields (issue 4): the report is the core's
 * analyzeDataset report (what `plumbline analyze --json` prints), and every bad field is a 400
 * naming it.
 */
import { readFileSync } from 'node:fs';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { analyzeDataset, readColumns, type NumberColumn, type TextColumn } from '../../core/index.js';
import { testApp } from './helpers.js';

const { app, logged } = testApp();
afterAll(async () => {
  await app.shutdown();
  expect(logged).toEqual([]);
});

const bearing = readFileSync(new URL('../../datasets/bearing-life.csv', import.meta.url), 'utf8');
const river = readFileSync(new URL('../../datasets/river-peaks.csv', import.meta.url), 'utf8');
const shaft = readFileSync(new URL('../../datasets/shaft-diameter.csv', import.meta.url), 'utf8');

function strip<T extends { input?: unknown; evidence?: unknown }>(r: T): Omit<T, 'input' | 'evidence'> {
  const { input: _i, evidence: _e, ...rest } = r;
  return rest;
}

describe('workflow fields through the API', () => {
  it('life data: statusColumn gives the censored report; counts as documented in datasets/README.md (22 failed, 8 censored)', async () => {
    const res = await request(app)
      .post('/api/analyze')
      .send({ csv: bearing, column: 'hours', statusColumn: 'status', bLifePercents: [10, 50], reliabilityTimes: [1000], families: ['weibull', 'lognormal'], seed: 7, replicates: 19 });
    expect(res.status).toBe(200);
    expect(res.body.dataKind).toBe('censored');
    expect(res.body.life.failures).toBe(22);
    expect(res.body.life.suspensions).toBe(8);
    expect(res.body.input.otherColumns).toEqual([{ role: 'status', column: 'status' }]);
    // Same report as the core in-process (the CLI's --json is analyzeDataset's report).
    const t = readColumns(bearing, [{ select: 'hours', kind: 'number' }, { select: 'status', kind: 'text' }]);
    const status = (t.columns[1] as TextColumn).texts.map(Number);
    const core = analyzeDataset({ values: (t.columns[0] as NumberColumn).values, status }, { bLifePercents: [10, 50], reliabilityTimes: [1000], families: ['weibull', 'lognormal'], seed: 7, bootstrapReplicates: 19 });
    expect(strip(res.body)).toEqual(JSON.parse(JSON.stringify(core)));
    const w = res.body.candidates.find((c: { family: string }) => c.family === 'weibull');
    expect(w.bLives.map((b: { percent: number }) => b.percent)).toEqual([10, 50]);
  });

  it('flood and capability with arrays/columns, and a job gives the same report', async () => {
    const body = { csv: river, column: 'peak_flow_m3s', orderColumn: 'year', returnPeriods: [10, 100], designLife: 50, plottingPosition: 'gringorten', seed: 3 };
    const res = await request(app).post('/api/analyze').send(body);
    expect(res.status).toBe(200);
    expect(res.body.flood.periods).toEqual([10, 100]);
    expect(res.body.flood.plottingPositions.formula).toBe('gringorten');
    expect(res.body.trend.orderFrom).toBe('column');
    // 1 - (1 - 1/T)^L, T = 100, L = 50: 0.39499 (textbook formula, common practice).
    expect(res.body.flood.designLife.exceedance[1].probability).toBeCloseTo(1 - 0.99 ** 50, 10);
    const job = await request(app).post('/api/jobs').send(body);
    expect(job.status).toBe(202);
    let state = job.body;
    for (let i = 0; i < 200 && state.state === 'running'; i++) {
      await new Promise((r) => setTimeout(r, 50));
      state = (await request(app).get(`/api/jobs/${job.body.id}`)).body;
    }
    state = (await request(app).get(`/api/jobs/${job.body.id}`)).body;
    expect(state.state).toBe('done');
    expect(strip(state.result)).toEqual(strip(res.body));
    const cap = await request(app).post('/api/analyze').send({ csv: shaft, column: 'diameter_mm', subgroupColumn: 'subgroup', lsl: 24.99, usl: 25.01, evidence: true });
    expect(cap.status).toBe(200);
    expect(cap.body.capability.within.subgroups).toBe(25);
    expect(cap.body.evidence.candidates.length).toBe(cap.body.candidates.length);
  });

  it('a plain request carries dataKind "complete" like analyzeDataset', async () => {
    const values = [3, 5, 7, 18, 43, 85, 91, 98, 100, 130, 230, 487]; // Proschan 1963 (datasets/README.md)
    const res = await request(app).post('/api/analyze').send({ values, families: ['exponential', 'gamma'] });
    expect(res.status).toBe(200);
    expect(res.body.dataKind).toBe('complete');
    expect(strip(res.body)).toEqual(JSON.parse(JSON.stringify(analyzeDataset({ values }, { families: ['exponential', 'gamma'] }))));
  });

  it('grouped classes (null = open class)', async () => {
    const grouped = [{ lower: null, upper: 10, count: 8 }, { lower: 10, upper: 20, count: 15 }, { lower: 20, upper: 30, count: 12 }, { lower: 30, upper: null, count: 6 }];
    const res = await request(app).post('/api/analyze').send({ grouped, families: ['normal'] });
    expect(res.status).toBe(200);
    expect(res.body.dataKind).toBe('grouped');
    expect(res.body.n).toBe(41);
  });

  it.each([
    [{ values: [1, 2, 3], status: [1, 2, 0] }, 'status[1]'],
    [{ values: [1, 2, 3], statusColumn: 'status' }, 'statusColumn'],
    [{ csv: bearing, column: 'hours', status: [1] }, 'status'],
    [{ values: [1, 2, 3], bLifePercents: [0] }, 'bLifePercents[0]'],
    [{ values: [1, 2, 3], returnPeriods: [10, 10] }, 'returnPeriods[1]'],
    [{ values: [1, 2, 3], confidence: 1 }, 'confidence'],
    [{ values: [1, 2, 3], boundMethod: 'wald' }, 'boundMethod'],
    [{ values: [1, 2, 3], plottingPosition: 'hazen' }, 'plottingPosition'],
    [{ values: [1, 2, 3], lsl: 'x' }, 'lsl'],
    [{ values: [1, 2, 3], grouped: [] }, 'grouped'],
    [{ grouped: [{ lower: 0, upper: 1, count: 1.5 }] }, 'grouped[0].count'],
    [{ values: [1, 2, 3], returnPeriod: [10] }, 'returnPeriod'],
  ])('rejects %j naming %s', async (body, field) => {
    // Strict body validation (server/API.md), common practice, no source.
    const res = await request(app).post('/api/analyze').send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe(field);
    expect(res.body.error.message).toContain(field.replace(/\[.*$/, ''));
  });

  it('refuses an option combination the option table forbids with 400 (a design life without return periods)', async () => {
    const res = await request(app).post('/api/analyze').send({ values: [1, 2, 3, 4, 5, 6, 7, 8, 9, 10], designLife: 50 });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('designLife');
    expect(res.body.error.message).toMatch(/"designLife" needs "returnPeriods"/);
  });
});

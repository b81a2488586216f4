/**
 * One pipeline: requests with workflow options (life data with a status column, flood options)
 * run plan → bootstrap ranges on the worker pool → finish like plain ones, so their jobs report
 * progress and their result is the core's analyzeDataset report (the reference; the CLI prints
 * the same). Seeded data, so the comparison is exact.
 */
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { analyzeDataset, createRng, getFamily } from '../../core/index.js';
import { sleep, testApp } from './helpers.js';

const { app, logged } = testApp({ workers: 2 });
afterAll(async () => {
  await app.shutdown();
  expect(logged).toEqual([]);
});

const weibull = (n: number, seed: number): number[] => Array.from(getFamily('weibull').random({ shape: 1.6, scale: 80 }, createRng(seed), n));

async function finished(id: string): Promise<{ state: string; progress: number; result?: Record<string, unknown>; seen: number[] }> {
  const seen: number[] = [];
  // Bounded polling (at most 120 s), not a timing assertion.
  for (let k = 0; k < 6000; k++) {
    const r = await request(app).get(`/api/jobs/${id}`);
    seen.push(r.body.progress as number);
    if (r.body.state !== 'running') return { ...r.body, seen };
    await sleep(20);
  }
  throw new Error('job did not finish');
}

describe('workflow requests on the worker pool', () => {
  it('life data with a status column: the censored bootstrap runs as a job with progress, result = analyzeDataset', async () => {
    const times = weibull(40, 31);
    const status = times.map((_, i) => (i % 5 === 0 ? 0 : 1));
    const body = { values: times, status, families: ['weibull', 'lognormal'], replicates: 199, bLifePercents: [10] };
    const created = await request(app).post('/api/jobs').send(body);
    expect(created.status, JSON.stringify(created.body)).toBe(202);
    expect(created.body.state).toBe('running');
    const done = await finished(created.body.id as string);
    expect(done.state).toBe('done');
    expect(done.progress).toBe(1);
    for (let j = 1; j < done.seen.length; j++) expect(done.seen[j] as number).toBeGreaterThanOrEqual(done.seen[j - 1] as number);
    const { input: _i, ...report } = done.result as Record<string, unknown>;
    const reference = analyzeDataset({ values: times, status }, { families: ['weibull', 'lognormal'], bootstrapReplicates: 199, bLifePercents: [10] });
    expect(report).toEqual(JSON.parse(JSON.stringify(reference)));
    expect(report.dataKind).toBe('censored');
  }, 150_000);

  it('life data with evidence: the evidence follows the status column (failures and suspensions counted as sent)', async () => {
    const times = weibull(30, 34);
    const status = times.map((_, i) => (i % 3 === 0 ? 0 : 1));
    const res = await request(app).post('/api/analyze').send({ values: times, status, families: ['weibull'], replicates: 19, evidence: true });
    expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(200);
    expect(res.body.evidence.censoring).toMatchObject({ failures: 20, suspensions: 10 });
  }, 120_000);

  it('a censored job can be cancelled', async () => {
    const times = weibull(300, 32);
    const status = times.map((_, i) => (i % 3 === 0 ? 0 : 1));
    const created = await request(app).post('/api/jobs').send({ values: times, status, replicates: 3000 });
    expect(created.status, JSON.stringify(created.body)).toBe(202);
    const del = await request(app).delete(`/api/jobs/${created.body.id as string}`);
    expect(del.body.state).toBe('cancelled');
    for (let k = 0; k < 3000 && app.pool.pending > 0; k++) await sleep(20);
    expect(app.pool.pending).toBe(0);
  }, 120_000);

  it('flood options: the job reports progress and equals analyzeDataset', async () => {
    const peaks = weibull(40, 33);
    const order = peaks.map((_, i) => 1960 + i);
    const body = { values: peaks, order, returnPeriods: [10, 100], families: ['gumbel', 'gev'], pMethod: 'bootstrap', replicates: 39 };
    const created = await request(app).post('/api/jobs').send(body);
    expect(created.status, JSON.stringify(created.body)).toBe(202);
    const done = await finished(created.body.id as string);
    expect(done.state).toBe('done');
    const { input: _i, ...report } = done.result as Record<string, unknown>;
    const reference = analyzeDataset({ values: peaks, order }, { returnPeriods: [10, 100], families: ['gumbel', 'gev'], pMethod: 'bootstrap', bootstrapReplicates: 39 });
    expect(report).toEqual(JSON.parse(JSON.stringify(reference)));
  }, 150_000);
});

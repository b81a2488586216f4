import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { analyze, createRng, getFamily } from '../../core/index.js';
import { sleep, testApp } from './helpers.js';

// Job API of server/API.md; determinism rule of issue 5 ("seeded so the result is the same for any
// number of workers"); the reference is the core's in-process bootstrap (core/analyze.ts).
const two = testApp({ workers: 2 });
const one = testApp({ workers: 1 });
afterAll(async () => {
  await two.app.shutdown();
  await one.app.shutdown();
  expect(two.logged).toEqual([]);
  expect(one.logged).toEqual([]);
});

const app = two.app;

async function waitFor(id: string, pred: (b: { state: string; progress: number }) => boolean, seen: number[] = []): Promise<{ state: string; progress: number; result?: unknown; error?: unknown }> {
  // Bounded polling (at most 60 s), not a timing assertion.
  for (let k = 0; k < 3000; k++) {
    const res = await request(app).get(`/api/jobs/${id}`);
    expect(res.status).toBe(200);
    seen.push(res.body.progress);
    if (pred(res.body)) return res.body;
    await sleep(20);
  }
  throw new Error(`job ${id} never reached the expected state`);
}

const weibull = (n: number, seed: number): number[] => Array.from(getFamily('weibull').random({ shape: 1.6, scale: 80 }, createRng(seed), n));

describe('bootstrap jobs on worker threads', () => {
  it('a job completes with progress from 0 to 1 and its report equals the in-process bootstrap', async () => {
    const x = weibull(150, 1);
    const body = { values: x, families: ['weibull', 'gamma', 'normal'], pMethod: 'bootstrap', replicates: 149, seed: 2024 };
    const created = await request(app).post('/api/jobs').send(body);
    expect(created.status).toBe(202);
    expect(created.body.state).toBe('running');
    const seen: number[] = [];
    const done = await waitFor(created.body.id, (b) => b.state !== 'running', seen);
    expect(done.state).toBe('done');
    expect(done.progress).toBe(1);
    for (let j = 1; j < seen.length; j++) expect(seen[j] as number).toBeGreaterThanOrEqual(seen[j - 1] as number);
    expect(seen.every((p) => p >= 0 && p <= 1)).toBe(true);
    const { input: _i, ...report } = done.result as Record<string, unknown>;
    const inProcess = analyze(x, { families: ['weibull', 'gamma', 'normal'], pMethod: 'bootstrap', bootstrapReplicates: 149, seed: 2024 });
    expect(report).toEqual({ ...JSON.parse(JSON.stringify(inProcess)), dataKind: 'complete' });
  });

  it('the result is the same with one worker and with two', async () => {
    const x = weibull(80, 2);
    const body = { values: x, families: ['weibull', 'lognormal'], pMethod: 'bootstrap', replicates: 101, seed: 9 };
    const a = await request(two.app).post('/api/analyze').send(body);
    const b = await request(one.app).post('/api/analyze').send(body);
    expect(a.status).toBe(200);
    expect(b.status).toBe(200);
    expect(a.body).toEqual(b.body);
    expect(one.app.pool.size).toBe(1);
  });

  it('the server answers while a job runs, and a cancelled job stops', async () => {
    const x = weibull(2000, 3);
    // B = 20000 replicates of n = 2000 (within server/limits.ts) would take about a minute: it is cancelled long before.
    const created = await request(app).post('/api/jobs').send({ values: x, families: ['weibull'], pMethod: 'bootstrap', replicates: 20000 });
    expect(created.status).toBe(202);
    const id = created.body.id as string;
    const running = await waitFor(id, (b) => b.progress > 0);
    expect(running.state).toBe('running');
    const t0 = performance.now();
    const health = await request(app).get('/api/health');
    const latency = performance.now() - t0;
    expect(health.status).toBe(200);
    expect(health.body.jobsRunning).toBeGreaterThanOrEqual(1);
    // Recorded for the note (issue 5 asks for < 100 ms); not asserted, timing is not tested here.
    console.info(`GET /api/health while a bootstrap runs: ${latency.toFixed(1)} ms`);
    // A new analysis is served ahead of the queued bootstrap ranges (pool.ts scheduling): it comes
    // back while the job, which needs minutes, is still running.
    const quick = await request(app).post('/api/analyze').send({ values: weibull(200, 6), families: ['normal', 'weibull'] });
    expect(quick.status).toBe(200);
    expect(quick.body.n).toBe(200);
    const still = await request(app).get(`/api/jobs/${id}`);
    expect(still.body.state).toBe('running');
    const del = await request(app).delete(`/api/jobs/${id}`);
    expect(del.status).toBe(200);
    expect(del.body).toEqual({ id, state: 'cancelled' });
    await app.jobs.settled(id);
    // The workers go idle (bounded wait; uncancelled, the 2·10^4 replicates would keep them busy for a minute).
    for (let k = 0; k < 500 && app.pool.pending > 0; k++) await sleep(20);
    expect(app.pool.pending).toBe(0);
    const after1 = await request(app).get(`/api/jobs/${id}`);
    await sleep(100);
    const after2 = await request(app).get(`/api/jobs/${id}`);
    expect(after1.body.state).toBe('cancelled');
    expect(after2.body.progress).toBe(after1.body.progress);
    expect(after1.body.progress).toBeLessThan(0.5);
    expect(after1.body.result).toBeUndefined();
  });

  it('a new job from the same client cancels its previous one', async () => {
    const big = await request(app).post('/api/jobs').send({ values: weibull(2000, 4), families: ['weibull'], pMethod: 'bootstrap', replicates: 20000, client: 'tab-1' });
    expect(big.status).toBe(202);
    const small = await request(app).post('/api/jobs').send({ values: weibull(50, 5), families: ['normal'], client: 'tab-1' });
    expect(small.status).toBe(202);
    const first = await request(app).get(`/api/jobs/${big.body.id}`);
    expect(first.body.state).toBe('cancelled');
    await app.jobs.settled(big.body.id);
    const second = await waitFor(small.body.id, (b) => b.state !== 'running');
    expect(second.state).toBe('done');
    for (let k = 0; k < 500 && app.pool.pending > 0; k++) await sleep(20);
    expect(app.pool.pending).toBe(0);
  });

  it('bad job bodies are refused at once; unknown ids are 404', async () => {
    const bad = await request(app).post('/api/jobs').send({ values: [1, 2, 3], replicates: 10 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe('replicates');
    const badClient = await request(app).post('/api/jobs').send({ values: [1, 2, 3, 4, 5], client: 'a b' });
    expect(badClient.status).toBe(400);
    expect(badClient.body.error.field).toBe('client');
    const data = await request(app).post('/api/jobs').send({ values: [5, 5, 5, 5] });
    expect(data.status).toBe(400);
    expect(data.body.error.message).toMatch(/equal/);
    const nf = await request(app).get('/api/jobs/00000000-0000-0000-0000-000000000000');
    expect(nf.status).toBe(404);
    const nd = await request(app).delete('/api/jobs/nope');
    expect(nd.status).toBe(404);
  });
});

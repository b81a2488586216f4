/**
 * The capability bootstrap runs on the server's worker pool as jobs of the one pipeline: a job
 * asking for a Box–Cox capability interval reports progress while its replicates run in ranges on
 * two workers, and its result is the core's analyzeDataset report (the reference: the same seeded
 * replicate streams run inline), so the numbers do not depend on the pool.
 */
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { analyzeDataset, createRng, getFamily, planDataset } from '../../core/index.js';
import { sleep, testApp } from '../server/helpers.js';

const { app, logged } = testApp({ workers: 2 });
afterAll(async () => {
  await app.shutdown();
  expect(logged).toEqual([]);
});

describe('capability bootstrap on the worker pool', () => {
  it('Box–Cox interval: a job with progress, result = analyzeDataset', async () => {
    const values = Array.from(getFamily('lognormal').random({ meanlog: 1, sdlog: 0.5 }, createRng(41), 60));
    const options = { usl: 12, lsl: 0.8, transform: 'boxcox' as const, capabilityReplicates: 1999 };
    const plan = planDataset({ values }, { families: ['normal', 'lognormal'], ...options });
    if (plan.kind !== 'complete') throw new Error('expected a complete-sample plan');
    expect(plan.plan.plan.bootstrapJobs).toEqual([]);
    expect(plan.capabilityJobs).toHaveLength(1);
    const created = await request(app).post('/api/jobs').send({ values, families: ['normal', 'lognormal'], ...options });
    expect(created.status, JSON.stringify(created.body)).toBe(202);
    // no family needs the goodness-of-fit bootstrap here: the job is still running only because the capability replicates run on the pool
    expect(created.body.state).toBe('running');
    const seen: number[] = [];
    let body: Record<string, unknown> = {};
    // Bounded polling (at most 120 s), not a timing assertion.
    for (let k = 0; k < 6000; k++) {
      const r = await request(app).get(`/api/jobs/${created.body.id as string}`);
      body = r.body as Record<string, unknown>;
      seen.push(body.progress as number);
      if (body.state !== 'running') break;
      await sleep(20);
    }
    expect(body.state).toBe('done');
    for (let j = 1; j < seen.length; j++) expect(seen[j] as number).toBeGreaterThanOrEqual(seen[j - 1] as number);
    const { input: _i, ...report } = body.result as Record<string, unknown>;
    const reference = analyzeDataset({ values }, { families: ['normal', 'lognormal'], ...options });
    expect(report).toEqual(JSON.parse(JSON.stringify(reference)));
    const tr = reference.capability!.transform;
    if (tr.kind === 'none') throw new Error('expected a Box–Cox section');
    expect(tr.intervals.intervals!.map((x) => x.replicates)).toEqual([1999, 1999, 1999, 1999]);
  }, 150_000);
});

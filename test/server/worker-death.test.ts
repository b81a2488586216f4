/**
 * A worker thread that dies under an analysis (a crash or out of memory; here its thread is ended
 * from outside, as the OS would) stops the whole analysis: the job's other replicate ranges are
 * cancelled at once instead of running on, and the client is told that the analysis stopped
 * because a worker failed and can be retried (a job's error, or a 503 for /api/analyze). The pool
 * starts a new worker, so the next request is served. Common practice, no source.
 */
import type { Worker } from 'node:worker_threads';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { createRng, getFamily } from '../../core/index.js';
import { WORKER_FAILED_MESSAGE } from '../../server/errors.js';
import { sleep, testApp } from './helpers.js';

const { app, logged } = testApp({ workers: 2 });
afterAll(async () => {
  await app.shutdown();
  // The deaths are logged (as worker failures), never as internal errors.
  expect(logged.filter((l) => /internal error/.test(l))).toEqual([]);
});

const values = Array.from(getFamily('weibull').random({ shape: 1.6, scale: 80 }, createRng(7), 200));
const longJob = { values, families: ['weibull', 'gamma'], pMethod: 'bootstrap', replicates: 100000 };

/** The pool's worker threads (private; reached here only to end one from outside). */
function workers(): { worker: Worker; task: unknown; kept: Set<number> }[] {
  return (app.pool as unknown as { slots: { worker: Worker; task: unknown; kept: Set<number> }[] }).slots;
}

async function until<T>(f: () => T | undefined | false, what: string): Promise<T> {
  // Bounded polling (at most 30 s), not a timing assertion.
  for (let k = 0; k < 1500; k++) {
    const v = f();
    if (v !== undefined && v !== false) return v;
    await sleep(20);
  }
  throw new Error(`never: ${what}`);
}

describe('a worker that dies under a job', () => {
  it('fails the job with the retry message and cancels its other ranges (a worker that does not keep the plan dies)', async () => {
    const created = await request(app).post('/api/jobs').send(longJob);
    expect(created.status).toBe(202);
    const id = created.body.id as string;
    // Both workers busy with this job's ranges.
    await until(() => workers().length === 2 && workers().every((w) => w.task !== null), 'both workers busy');
    // The worker that does NOT keep the job's plan: its death must stop the ranges on the other one.
    const victim = workers().find((w) => w.kept.size === 0) as { worker: Worker };
    expect(victim).toBeDefined();
    await victim.worker.terminate();
    const failed = await until(() => {
      const v = app.jobs.get(id);
      return v && v.state !== 'running' ? v : undefined;
    }, 'job stopped');
    expect(failed.state).toBe('failed');
    expect(failed.error).toEqual({ message: WORKER_FAILED_MESSAGE, code: 'worker-failed' });
    const polled = await request(app).get(`/api/jobs/${id}`);
    expect(polled.body.error.message).toMatch(/stopped because a worker failed; it can be retried/);
    // The surviving worker drops the job's ranges: nothing of it is left queued or running.
    await until(() => app.pool.pending === 0, 'no task of the failed job left');
    expect(app.pool.pending).toBe(0);
  }, 60_000);

  it('the next request is served by a fresh worker', async () => {
    const r = await request(app).post('/api/analyze').send({ values: values.slice(0, 40), families: ['normal'] });
    expect(r.status).toBe(200);
    expect(r.body.n).toBe(40);
  });

  it('/api/analyze whose worker dies answers 503 with the retry message', async () => {
    const pending = request(app).post('/api/analyze').send(longJob);
    const done = pending.then((r) => r);
    await until(() => workers().some((w) => w.task !== null), 'a worker busy');
    await sleep(50);
    for (const w of workers()) if (w.task !== null) await w.worker.terminate();
    const res = await done;
    expect(res.status).toBe(503);
    expect(res.headers['retry-after']).toBe('1');
    expect(res.body.error).toEqual({ message: WORKER_FAILED_MESSAGE, code: 'worker-failed' });
    await until(() => app.pool.pending === 0, 'nothing left running');
  }, 60_000);
});

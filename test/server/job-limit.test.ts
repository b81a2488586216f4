/**
 * The running-job limit (server/API.md: "429: more than N jobs running at once") must hold for any
 * interleaving of requests: a slot is reserved before the awaited planning step, so simultaneous
 * requests cannot all pass the check before any of them is counted. Also fails if the limit is
 * switched off (the mutation check in scripts/mutation-server.ts relies on these tests).
 */
import type { Server } from 'node:http';
import request from 'supertest';
import { afterEach, describe, expect, it } from 'vitest';
import { createRng, getFamily } from '../../core/index.js';
import { listen, testApp } from './helpers.js';
import type { PlumblineApp } from '../../server/app.js';

// A job that runs for many seconds on one worker: 200 Weibull values, a 100000-replicate bootstrap
// (each replicate refits the model). It is cancelled as soon as the test has seen it running.
const values = Array.from(getFamily('weibull').random({ shape: 1.6, scale: 80 }, createRng(11), 200));
const longJob = { values, families: ['weibull'], pMethod: 'bootstrap', replicates: 100000 };
const normal = Array.from(getFamily('normal').random({ mean: 10, sd: 2 }, createRng(12), 200));

let apps: { app: PlumblineApp; logged: string[] }[] = [];
afterEach(async () => {
  for (const a of apps) {
    await a.app.shutdown();
    expect(a.logged).toEqual([]);
  }
  apps = [];
});

function make(maxRunningJobs?: number): PlumblineApp {
  const a = testApp({ workers: 2, ...(maxRunningJobs !== undefined ? { maxRunningJobs } : {}) });
  apps.push(a);
  return a.app;
}

describe('the running-job limit', () => {
  it('one request after another: the third of a limit of 2 is 429 naming the limit; a cancel frees a slot', async () => {
    const app = make(2);
    const a = await request(app).post('/api/jobs').send(longJob);
    const b = await request(app).post('/api/jobs').send(longJob);
    expect([a.status, b.status]).toEqual([202, 202]);
    const c = await request(app).post('/api/jobs').send(longJob);
    expect(c.status).toBe(429);
    expect(c.body.error.code).toBe('too-many-jobs');
    expect(c.body.error.message).toMatch(/\b2\b/);
    expect(app.jobs.running).toBe(2);
    await request(app).delete(`/api/jobs/${a.body.id as string}`).expect(200);
    const d = await request(app).post('/api/jobs').send(longJob);
    expect(d.status).toBe(202);
  });

  for (const simultaneous of [20, 64]) {
    it(`${simultaneous} simultaneous requests: at most the limit (8) get 202, the rest 429, and never more than 8 run`, async () => {
      const app = make();
      const server: Server = await listen(app);
      try {
        let most = 0;
        const watch = setInterval(() => (most = Math.max(most, app.jobs.running)), 1);
        const replies = await Promise.all(Array.from({ length: simultaneous }, () => request(server).post('/api/jobs').send(longJob)));
        clearInterval(watch);
        most = Math.max(most, app.jobs.running);
        const statuses = replies.map((r) => r.status);
        const accepted = statuses.filter((s) => s === 202).length;
        expect(statuses.every((s) => s === 202 || s === 429), statuses.join(',')).toBe(true);
        expect(accepted).toBe(8);
        expect(statuses.filter((s) => s === 429).length).toBe(simultaneous - 8);
        expect(app.jobs.running).toBe(8);
        expect(most).toBeLessThanOrEqual(8);
      } finally {
        server.close();
      }
    });
  }

  it('a request that needs no bootstrap frees its reserved slot at once', async () => {
    const app = make(1);
    for (let k = 0; k < 3; k++) {
      // 200 normal values: table p-values, no bootstrap (n >= 50, so the chi-square decision is not bootstrapped either).
      const r = await request(app).post('/api/jobs').send({ values: normal, families: ['normal'] });
      expect(r.status).toBe(202);
      expect(r.body.state).toBe('done');
    }
    // a refused body frees its slot as well
    const bad = await request(app).post('/api/jobs').send({ values: [1, 2, 'x'] });
    expect(bad.status).toBe(400);
    expect(app.jobs.running).toBe(0);
    const ok = await request(app).post('/api/jobs').send(longJob);
    expect(ok.status).toBe(202);
  });
});

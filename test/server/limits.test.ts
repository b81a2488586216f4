/**
 * The work one request may ask for is bounded (server/limits.ts, stated in server/API.md): too
 * many values or grouped classes are 413, too much bootstrap work is 422, each naming the limit
 * and the field, refused before the work starts. Also the server's own finite-number check on
 * `values` (JSON numbers past the double range, e.g. 1e400, parse to Infinity): it must answer
 * with the server's field-level message, so switching that check off makes this suite fail.
 * The limits are the server's choice (common practice, no source); the boundary values below
 * are computed from them.
 */
import { request as httpRequest, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { createRng, getFamily } from '../../core/index.js';
import { REQUEST_LIMITS } from '../../server/limits.js';
import { listen, sleep, testApp } from './helpers.js';

const { app, logged } = testApp({ workers: 2 });
afterAll(async () => {
  await app.shutdown();
  expect(logged).toEqual([]);
});

const weibull = (n: number, seed: number): number[] => Array.from(getFamily('weibull').random({ shape: 1.6, scale: 80 }, createRng(seed), n));

/** k classes of width 0.01 from 10, open at both ends, with a bell of counts. */
function classes(k: number): { lower: number | null; upper: number | null; count: number }[] {
  return Array.from({ length: k }, (_, i) => ({
    lower: i === 0 ? null : 10 + i * 0.01,
    upper: i === k - 1 ? null : 10 + (i + 1) * 0.01,
    count: 1 + ((i * 7919) % 13) + Math.round(100 * Math.exp(-(((i - k / 2) / (k / 6)) ** 2))),
  }));
}

describe('bounded work per request', () => {
  it(`grouped counts: ${REQUEST_LIMITS.classes} classes are analysed, one more is 413 naming the limit`, async () => {
    const ok = await request(app).post('/api/analyze').send({ grouped: classes(REQUEST_LIMITS.classes), families: ['normal'] });
    expect(ok.status, JSON.stringify(ok.body).slice(0, 300)).toBe(200);
    expect(ok.body.dataKind).toBe('grouped');
    const big = await request(app).post('/api/analyze').send({ grouped: classes(REQUEST_LIMITS.classes + 1) });
    expect(big.status).toBe(413);
    expect(big.body.error).toMatchObject({ field: 'grouped', code: 'too-much-work' });
    expect(big.body.error.message).toMatch(/at most 1,000 classes/);
  });

  it(`more than ${REQUEST_LIMITS.values} values is 413 naming the limit (job API too)`, async () => {
    const many = `{"values":[${'1,'.repeat(REQUEST_LIMITS.values)}2]}`;
    for (const path of ['/api/analyze', '/api/jobs']) {
      const res = await request(app).post(path).set('Content-Type', 'application/json').send(many);
      expect(res.status).toBe(413);
      expect(res.body.error).toMatchObject({ field: 'values', code: 'too-much-work' });
      expect(res.body.error.message).toMatch(/at most 2,000,000 values/);
    }
  });

  it('bootstrap work: replicates × n past the limit is 422 naming it and the most replicates allowed', async () => {
    const x = weibull(1000, 1);
    const B = REQUEST_LIMITS.bootstrapValues / 1000 + 1; // one replicate over
    const res = await request(app).post('/api/jobs').send({ values: x, families: ['weibull'], pMethod: 'bootstrap', replicates: B });
    expect(res.status).toBe(422);
    expect(res.body.error).toMatchObject({ field: 'replicates', code: 'too-much-work' });
    expect(res.body.error.message).toMatch(/50,000,000/);
    expect(res.body.error.message).toMatch(/at most 50,000 replicates/);
    // Exactly at the limit is accepted (and cancelled at once).
    const at = await request(app).post('/api/jobs').send({ values: x, families: ['weibull'], pMethod: 'bootstrap', replicates: B - 1 });
    expect(at.status).toBe(202);
    await request(app).delete(`/api/jobs/${at.body.id as string}`).expect(200);
  });

  it('bootstrap work counts only the families that need it: a 10^5-value table request is not refused', async () => {
    const x = weibull(100_000, 2);
    const res = await request(app).post('/api/analyze').send({ values: x, families: ['normal', 'weibull'], replicates: 999 });
    expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(200);
    expect(res.body.n).toBe(100_000);
  });

  it('censored bootstrap work: replicates × units × families past the limit is 422', async () => {
    // 1002 units × 999 replicates × 5 families = 5,004,990 > 5,000,000.
    const times = weibull(1002, 3);
    const status = times.map((_, i) => (i % 4 === 0 ? 0 : 1));
    const res = await request(app).post('/api/analyze').send({ values: times, status });
    expect(res.status).toBe(422);
    expect(res.body.error).toMatchObject({ field: 'replicates', code: 'too-much-work' });
    expect(res.body.error.message).toMatch(/5,004,990.*5,000,000.*at most 998 replicates/);
  });
});

describe("the server's finite-number check on values", () => {
  for (const [text, index] of [
    ['[1,2,1e400,4,5,6]', 2],
    ['[-1e309,2,3,4,5,6]', 0],
  ] as const) {
    it(`${text}: 400 naming values[${index}] (not left to the core)`, async () => {
      const res = await request(app).post('/api/analyze').set('Content-Type', 'application/json').send(`{"values":${text}}`);
      expect(res.status).toBe(400);
      expect(res.body.error.field).toBe(`values[${index}]`);
      expect(res.body.error.message).toMatch(new RegExp(`values\\[${index}\\].*not a finite number`));
    });
  }
});

describe('a client that goes away while its request is planned', () => {
  it('stops the planning (its worker is ended and replaced), and the next request is served', async () => {
    const { app: lone, logged: lonelog } = testApp({ workers: 1 });
    try {
      const server: Server = await listen(lone);
      // About a second or more of planning: grouped maximum likelihood on 1000 classes, five families.
      const body = JSON.stringify({ grouped: classes(REQUEST_LIMITS.classes) });
      const { port } = server.address() as AddressInfo;
      const req = httpRequest({ host: '127.0.0.1', port, path: '/api/analyze', method: 'POST', headers: { 'content-type': 'application/json' } });
      req.on('error', () => {});
      req.end(body);
      const slots = (): { task: unknown }[] => (lone.pool as unknown as { slots: { task: unknown }[] }).slots;
      for (let k = 0; k < 1500 && !slots().some((s) => s.task !== null); k++) await sleep(20);
      expect(slots().some((s) => s.task !== null)).toBe(true);
      req.destroy();
      for (let k = 0; k < 1500 && lone.pool.stoppedPlans === 0; k++) await sleep(20);
      expect(lone.pool.stoppedPlans).toBe(1);
      const next = await request(server).post('/api/analyze').send({ values: weibull(14, 5), families: ['normal'] });
      expect(next.status).toBe(200);
      server.close();
    } finally {
      await lone.shutdown();
    }
    expect(lonelog).toEqual([]);
  });
});

import fc from 'fast-check';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { listen, rawPost, testApp } from './helpers.js';

// Issue 6: every hostile input gets correct handling or one clear 4xx error, never a 5xx, and
// nothing is logged as an internal error.
const { app, logged } = testApp();
afterAll(async () => {
  await app.shutdown();
  expect(logged).toEqual([]);
});

async function post(body: string): Promise<request.Response> {
  return request(app).post('/api/analyze').set('Content-Type', 'application/json').send(body);
}

function expectClear(res: request.Response): void {
  expect(res.status).toBeLessThan(500);
  if (res.status >= 400) {
    expect(typeof res.body.error.message).toBe('string');
    expect(res.body.error.message.length).toBeGreaterThan(10);
  }
}

describe('hostile input through the API', () => {
  it('CSV oddities: BOM, CRLF, lone CR, quotes, semicolons, decimal comma, garbage, blank cells', async () => {
    const cases: { csv: string; column?: string | number; csvOptions?: Record<string, unknown>; families?: string[]; n?: number }[] = [
      { csv: '\uFEFFx\r\n1\r\n2\r\n3\r\n4\r\n5\r\n', column: 'x', n: 5 },
      { csv: 'x\r1\r2\r3\r4\r5\r', column: 'x', n: 5 },
      { csv: 'name,"v, mm"\n"a, b",1\n"c\nd",2\ne,3\nf,4\ng,5\n', column: 'v, mm', n: 5 },
      { csv: 'a;b\n1;2,5\n2;3,5\n3;4,5\n4;5,5\n5;6,25\n', column: 'b', csvOptions: { decimal: ',' }, n: 5 },
      { csv: 'x\n1\n\n2\n \n3\n4\n5\n', column: 'x', n: 5 },
      { csv: 'x\n1\nNA\n2\n-\n3\nn/a\n4\ninf\n5\nNaN\n', column: 'x', csvOptions: { skipInvalid: true }, n: 5 },
      { csv: 'x\n1\nNA\n2\n', column: 'x' },
      { csv: '\u0000\u0001\u00ff\ufffd\u0007garbage\u0000,\u0002\n\u0003', column: 1 },
      { csv: 'x\n', column: 'x' },
      { csv: 'x,x\n1,2\n3,4\n', column: 'x' },
      { csv: 'x\n1e-300\n2e-300\n5e-300\n1e-299\n3e-299\n', column: 'x', n: 5 },
      { csv: 'x\n1e300\n2e300\n5e300\n1e301\n3e301\n', column: 'x', n: 5 },
      { csv: 'x\n1e400\n2\n3\n', column: 'x' },
      { csv: 'x\n7\n7\n7\n7\n', column: 'x' },
      { csv: 'x\n1\n2\n', column: 'x' },
      { csv: 'x\n1\n2\n3\n', column: 'x' },
      { csv: 'x\n1\n2\n3\n', column: 'x', families: ['exponential'], n: 3 },
      { csv: 'x\n0\n0\n1\n2\n3\n-4\n', column: 'x', n: 6 },
    ];
    for (const c of cases) {
      const { n: _n, ...body } = c;
      const res = await post(JSON.stringify(body));
      expectClear(res);
      if (c.n !== undefined) {
        expect(res.status, JSON.stringify(c.csv).slice(0, 60)).toBe(200);
        expect(res.body.n).toBe(c.n);
      }
    }
  });

  it('invalid UTF-8 and deep nesting are 400s', async () => {
    const server = await listen(app);
    const bad = await rawPost(server, '/api/analyze', Buffer.from([0x7b, 0x22, 0xff, 0xfe, 0x22, 0x3a, 0x31, 0x7d]));
    await new Promise((r) => server.close(r));
    expect(bad.status).toBe(400);
    expect(JSON.parse(bad.body).error.message).toMatch(/UTF-8/);
    const deep = await post(`{"values":${'['.repeat(5000)}${']'.repeat(5000)}}`);
    expectClear(deep);
    expect(deep.status).toBe(400);
  });

  it('any JSON body whatsoever gets 200 or a clear 4xx (fast-check, seeded)', async () => {
    const fieldArb = fc.record(
      {
        values: fc.oneof(fc.array(fc.double({ noNaN: true, noDefaultInfinity: true }), { maxLength: 30 }), fc.anything()),
        csv: fc.oneof(fc.string(), fc.anything()),
        column: fc.oneof(fc.string(), fc.integer(), fc.anything()),
        families: fc.oneof(fc.subarray(['normal', 'lognormal', 'gamma', 'weibull', 'exponential']), fc.anything()),
        alpha: fc.oneof(fc.double(), fc.anything()),
        bins: fc.oneof(fc.integer({ min: -5, max: 50 }), fc.constant(null), fc.anything()),
        seed: fc.oneof(fc.integer(), fc.anything()),
        pMethod: fc.oneof(fc.constantFrom('table', 'bootstrap'), fc.anything()),
        replicates: fc.oneof(fc.integer({ min: 0, max: 40 }), fc.anything()),
        evidence: fc.oneof(fc.boolean(), fc.anything()),
        zzz: fc.anything(),
      },
      { requiredKeys: [] },
    );
    await fc.assert(
      fc.asyncProperty(fc.oneof(fieldArb, fc.anything()), async (body) => {
        const text = JSON.stringify(body);
        if (text === undefined) return;
        expectClear(await post(text));
      }),
      { seed: 6, numRuns: 150 },
    );
  });
});

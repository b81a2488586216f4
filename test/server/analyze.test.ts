import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { analyze, createRng, getFamily, readColumn } from '../../core/index.js';
import { testApp } from './helpers.js';

const { app, logged } = testApp();
afterAll(async () => {
  await app.shutdown();
  expect(logged).toEqual([]); // no 500 was logged by any test in this file
});

// Proschan (1963) air-conditioning intervals (references.md): exponential MLE mean 108.0833.
const AIRCONDIT = [3, 5, 7, 18, 43, 85, 91, 98, 100, 130, 230, 487];

describe('POST /api/analyze', () => {
  it('with values: the CLI report shape, ranked candidates, published exponential MLE', async () => {
    const res = await request(app).post('/api/analyze').send({ values: AIRCONDIT, families: ['exponential', 'normal', 'weibull'] });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/application\/json/);
    expect(res.body.n).toBe(12);
    expect(res.body.input).toEqual({ source: 'values', n: 12 });
    expect(res.body.candidates.map((c: { rank: number }) => c.rank)).toEqual([1, 2, 3]);
    const aiccs = res.body.candidates.map((c: { aicc: number }) => c.aicc);
    expect([...aiccs].sort((a, b) => a - b)).toEqual(aiccs);
    const ex = res.body.candidates.find((c: { family: string }) => c.family === 'exponential');
    // Proschan 1963 / references.md: exponential mean 108.0833 (rate = 1/mean).
    expect(Math.abs(1 / ex.parameters.rate - 108.0833)).toBeLessThan(5e-5);
    expect(res.body.notApplicable).toEqual([]);
    expect(res.body.evidence).toBeUndefined();
    // Same numbers as the core in-process (the CLI's --json is that report).
    const { input: _input, ...report } = res.body;
    expect(report).toEqual({ ...JSON.parse(JSON.stringify(analyze(AIRCONDIT, { families: ['exponential', 'normal', 'weibull'] }))), dataKind: 'complete' });
  });

  it('with csv + column: parsed by the core reader, skipped rows counted with reasons', async () => {
    const csv = 'id;life h\n1;3\n2;5\n3;NA\n4;7\n5;18\n6;43\n7;85\n8;91\n9;98\n10;100\n11;130\n12;230\n13;487\n';
    const res = await request(app)
      .post('/api/analyze')
      .send({ csv, column: 'life h', csvOptions: { skipInvalid: true }, families: ['exponential'] });
    expect(res.status).toBe(200);
    expect(res.body.n).toBe(12);
    expect(res.body.input.source).toBe('csv');
    expect(res.body.input.column).toBe('life h');
    expect(res.body.input.rowsRead).toBe(13);
    expect(res.body.input.delimiter).toBe(';');
    expect(res.body.input.skipped).toHaveLength(1);
    expect(res.body.input.skipped[0].count).toBe(1);
    expect(res.body.input.skipped[0].firstRow).toBe(4);
    expect(typeof res.body.input.skipped[0].description).toBe('string');
    const direct = readColumn(csv, { column: 'life h', skipInvalid: true });
    expect(Array.from(direct.values)).toEqual(AIRCONDIT);
    expect(Math.abs(1 / res.body.candidates[0].parameters.rate - 108.0833)).toBeLessThan(5e-5);
  });

  it('lists positive-only families as not applicable with the count of offending values', async () => {
    const values = [-2.1, -0.4, 0, 0.3, 1.1, 1.9, 2.2, 3.5, 4.1, 0.8, -1.3, 2.7];
    const res = await request(app).post('/api/analyze').send({ values });
    expect(res.status).toBe(200);
    const na = res.body.notApplicable.map((x: { family: string; offendingCount: number }) => [x.family, x.offendingCount]);
    expect(na).toEqual(expect.arrayContaining([['lognormal', 4], ['weibull', 4], ['exponential', 4], ['gamma', 4]]));
    expect(res.body.candidates.map((c: { family: string }) => c.family)).toEqual(['normal']);
  });

  it('adds evidence when asked, for every candidate, JSON-clean', async () => {
    const x = Array.from(getFamily('gamma').random({ shape: 3, scale: 2 }, createRng(21), 300));
    const res = await request(app).post('/api/analyze').send({ values: x, evidence: true, evidenceOptions: { maxPoints: 100 } });
    expect(res.status).toBe(200);
    const ev = res.body.evidence;
    expect(ev.n).toBe(300);
    expect(ev.candidates.map((c: { family: string }) => c.family)).toEqual(res.body.candidates.map((c: { family: string }) => c.family));
    for (const c of ev.candidates) {
      expect(c.probabilityPlot.points.x.length).toBeLessThanOrEqual(100);
      expect(c.histogram.bars.length).toBeGreaterThan(2);
    }
    expect(ev.densities.curves).toHaveLength(res.body.candidates.length);
  });

  it('a bootstrap sent to /api/analyze runs on the workers and equals the in-process result', async () => {
    const x = Array.from(getFamily('weibull').random({ shape: 1.4, scale: 50 }, createRng(4), 60));
    const opts = { families: ['weibull', 'normal'] as const, pMethod: 'bootstrap' as const, bootstrapReplicates: 59, seed: 77 };
    const res = await request(app).post('/api/analyze').send({ values: x, families: [...opts.families], pMethod: 'bootstrap', replicates: 59, seed: 77 });
    expect(res.status).toBe(200);
    const { input: _i, ...report } = res.body;
    expect(report).toEqual({ ...JSON.parse(JSON.stringify(analyze(x, { ...opts, families: [...opts.families] }))), dataKind: 'complete' });
    expect(res.body.candidates[0].andersonDarling.method).toBe('bootstrap');
    expect(res.body.candidates[0].andersonDarling.replicates).toBe(59);
  });
});

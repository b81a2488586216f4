/**
 * Time + status data with fewer than 2 failures through the API: with an assumed Weibull shape the
 * zero-failure (Weibayes) analysis the CLI gives (--column --censor-column --assumed-shape runs
 * core analyzeRecordedLife), its scale bound checked against Nelson's (1985, J. Quality Technology
 * 17:140-146) closed form for r = 0: η_L = (Σ tᵢ^β / −ln(1 − C))^{1/β} (χ²_{C;2} = −2 ln(1 − C));
 * without an assumed shape a 422 saying one is needed. Data: invented (ten units, none failed).
 */
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { analyzeRecordedLife } from '../../core/index.js';
import { testApp } from './helpers.js';

const { app, logged } = testApp();
afterAll(async () => {
  await app.shutdown();
  expect(logged).toEqual([]);
});

const hours = [410, 520, 600, 750, 800, 950, 1000, 1200, 1300, 1500];
const csv = (status: readonly number[]): string => `hours,status\n${hours.map((h, i) => `${h},${status[i]}`).join('\n')}\n`;
const none = hours.map(() => 0);

describe('time + status with no failures through the API', () => {
  it('with an assumed shape: the Weibayes lower bounds, as the CLI computes them and as Nelson (1985) gives them for r = 0', async () => {
    const res = await request(app).post('/api/analyze').send({ csv: csv(none), column: 'hours', statusColumn: 'status', assumedShape: 2, families: ['weibull'], seed: 1, replicates: 19 });
    expect(res.status).toBe(200);
    const w = res.body.life.recorded.report.weibayes;
    expect(w.failures).toBe(0);
    expect(w.units).toBe(10);
    expect(w.shapeIs).toBe('assumed');
    const c = w.confidence;
    const closed = Math.sqrt(hours.reduce((a, t) => a + t * t, 0) / -Math.log(1 - c));
    expect(w.scaleLower).toBeCloseTo(closed, 8);
    expect(res.body.candidates).toEqual([]);
    // the CLI's analysis (cli/life-recorded.ts: analyzeRecordedLife on times + status) gives the same bounds
    const cli = analyzeRecordedLife({ times: hours, failed: none }, { assumedShape: 2, families: ['weibull'], seed: 1, replicates: 19 });
    expect(w).toEqual(JSON.parse(JSON.stringify(cli.weibayes)));
    // the caution matches: nothing is estimated with no failures (not "estimates, especially a shape, are uncertain")
    for (const list of [res.body.life.cautions, res.body.life.recorded.report.cautions] as string[][]) {
      expect(list.some((c) => /especially a shape/.test(c))).toBe(false);
      expect(list.filter((c) => c.startsWith('Only 0 failures among 10 units: no model can be fitted and no shape is estimated; the Weibull shape β = 2 is assumed'))).toHaveLength(1);
    }
  });
  it('with one failure and an assumed shape: Weibayes with r = 1 (η̂ = (E / r)^{1/β}, Nelson 1985)', async () => {
    const one = none.map((_, i) => (i === 3 ? 1 : 0));
    const res = await request(app).post('/api/analyze').send({ csv: csv(one), column: 'hours', statusColumn: 'status', assumedShape: 2, seed: 1, replicates: 19 });
    expect(res.status).toBe(200);
    const w = res.body.life.recorded.report.weibayes;
    expect(w.failures).toBe(1);
    expect(w.scale).toBeCloseTo(Math.sqrt(hours.reduce((a, t) => a + t * t, 0)), 6);
  });
  it('without an assumed shape: a 422 saying an assumed Weibull shape is needed', async () => {
    const res = await request(app).post('/api/analyze').send({ csv: csv(none), column: 'hours', statusColumn: 'status', seed: 1 });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('needs-assumed-shape');
    expect(res.body.error.message).toMatch(/^Only 0 failures among 10 units: at least 2 failures are needed to fit a life model\. With fewer, give a Weibull shape from experience \(assumedShape/);
  });
});

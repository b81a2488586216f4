import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { REPO_ROOT } from '../../server/app.js';
import { DEMO_SETTINGS } from '../../server/demo.js';
import { testApp } from './helpers.js';

const { app, logged } = testApp({ demo: undefined });
afterAll(async () => {
  await app.shutdown();
  expect(logged).toEqual([]);
});

describe('demo datasets', () => {
  it('lists the CSV files in datasets/ with their value column', async () => {
    const res = await request(app).get('/api/demo');
    expect(res.status).toBe(200);
    const names = res.body.datasets.map((d: { name: string }) => d.name);
    expect(names).toEqual(expect.arrayContaining(['shaft-diameter', 'river-peaks', 'bearing-life']));
    const river = res.body.datasets.find((d: { name: string }) => d.name === 'river-peaks');
    // The measurement, not the year counter (rule in server/demo.ts).
    expect(river.defaultColumn).toBe('peak_flow_m3s');
  });

  it('returns a dataset\'s text as stored in datasets/', async () => {
    const res = await request(app).get('/api/demo/shaft-diameter');
    expect(res.status).toBe(200);
    expect(res.body.csv).toBe(readFileSync(join(REPO_ROOT, 'datasets', 'shaft-diameter.csv'), 'utf8'));
    expect(res.body.defaultColumn).toBe('diameter_mm');
  });

  it('refuses names that are not a listed dataset (no traversal)', async () => {
    for (const name of ['..%2Fpackage', '..%2F..%2Fetc%2Fpasswd', 'README', 'shaft-diameter.csv', '%2e%2e', 'nope']) {
      const res = await request(app).get(`/api/demo/${name}`);
      expect(res.status, name).toBe(404);
      expect(res.body.error.message).toMatch(/No demo dataset|No API route|Not found/);
    }
  });

  it('every demo\'s own settings are accepted by the API with its file (a demo never opens on a refused option)', async () => {
    // The settings are sent as the page sends them: the file, its value column, and the fields.
    // Demos without fields (the class counts) are read by the page's data card alone.
    const withFields = Object.entries(DEMO_SETTINGS).filter(([, settings]) => Object.keys(settings.fields).length > 0);
    expect(withFields.length).toBeGreaterThanOrEqual(5);
    const files = new Map<string, string>((await request(app).get('/api/demo')).body.datasets.map((d: { name: string; file: string }) => [d.name, d.file]));
    for (const [name, settings] of withFields) {
      // The file the demo list names (a CSV, or the tab-separated peak file of the flood record).
      const csv = readFileSync(join(REPO_ROOT, 'datasets', files.get(name) ?? `${name}.csv`), 'utf8');
      const body = { csv, column: settings.column, ...settings.fields };
      const res = await request(app).post('/api/analyze').send(body);
      expect(res.status, `${name}: ${JSON.stringify(res.body.error ?? null)}`).toBe(200);
    }
  }, 120_000);

  it('the pre-analysed demo opens with a complete result and evidence', async () => {
    const res = await request(app).get('/api/demo-analysis');
    expect(res.status).toBe(200);
    // The default demo is the bearing life test with its demo settings (server/demo.ts DEMO_SETTINGS):
    // datasets/README.md says 30 units, 22 failed and 8 still running.
    expect(res.body.name).toBe('bearing-life');
    expect(res.body.column).toBe('hours');
    expect(res.body.settings.fields.statusColumn).toBe('status');
    expect(res.body.result.dataKind).toBe('censored');
    expect(res.body.result.life.failures).toBe(22);
    expect(res.body.result.life.suspensions).toBe(8);
    expect(res.body.result.candidates[0].bLives[0].percent).toBe(10);
    expect(res.body.result.n).toBe(30);
    expect(res.body.result.candidates.length).toBeGreaterThan(0);
    expect(res.body.result.evidence.candidates.length).toBe(res.body.result.candidates.length);
  });
});

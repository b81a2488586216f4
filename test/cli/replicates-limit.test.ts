/**
 * One upper limit for the bootstrap replicates, from the option table (core/options: replicates
 * 19..100000): the command line refuses 10^9 (it once ran for ten minutes with no output) with one
 * line and exit 2, and the API refuses the same values with a 400 naming the field. Common
 * practice, no source: the limit is the project's own.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { runCli } from '../../cli/run.js';
import { optionNamed } from '../../core/index.js';
import { testApp } from '../server/helpers.js';

const file = join(mkdtempSync(join(tmpdir(), 'plumbline-reps-')), 'x.csv');
writeFileSync(file, 'x\n1\n2\n3\n4\n5\n6\n7\n8\n');
const { app } = testApp({ workers: 1 });
afterAll(async () => app.shutdown());

const max = optionNamed('replicates')?.max as number;

describe('--replicates / replicates: one limit', () => {
  it('the table states it', () => {
    expect(max).toBe(100_000);
  });

  for (const text of ['1000000000', String(max + 1), '1e9']) {
    it(`${text}: refused by the CLI (one line, exit 2) and by the API (400, field replicates)`, async () => {
      const err: string[] = [];
      const code = (await runCli(['analyze', file, '--replicates', text], { out: () => {}, err: (s) => err.push(s) })) as number;
      expect(code).toBe(2);
      expect(err.join('').trim().split('\n')).toHaveLength(1);
      expect(err.join('')).toMatch(new RegExp(`--replicates .*${max}`));
      const res = await request(app).post('/api/analyze').send({ values: [1, 2, 3, 4, 5, 6, 7, 8], replicates: Number(text) });
      expect(res.status).toBe(400);
      expect(res.body.error.field).toBe('replicates');
    });
  }

  it(`${max} itself is accepted by both (the run itself is not started here: a quick table analysis)`, async () => {
    const err: string[] = [];
    const code = (await runCli(['analyze', file, '--replicates', String(max), '--families', 'normal'], { out: () => {}, err: (s) => err.push(s) })) as number;
    expect(code, err.join('')).toBe(0);
    const res = await request(app).post('/api/analyze').send({ values: [1, 2, 3, 4, 5, 6, 7, 8], replicates: max, families: ['normal'] });
    expect(res.status).toBe(200);
  });
});

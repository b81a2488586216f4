/**
 * Hostile requests and command lines around the data (issue 6): malformed or oversized bodies,
 * wrong types, unknown fields, out-of-range options, non-finite numbers, odd encodings and paths.
 * Each must be one clear 4xx (server/API.md) or exit 2 with one line (cli/run.ts); never a 5xx,
 * an internal error (exit 70) or a stack trace.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runCli } from '../../cli/run.js';
import { createApp, type PlumblineApp } from '../../server/app.js';

const thirty = Array.from({ length: 30 }, (_, i) => 10 + ((i * 37) % 29) * 0.7 + (i % 3) * 0.11);

describe('API: hostile request bodies', () => {
  let app: PlumblineApp;
  let small: PlumblineApp;
  beforeAll(() => {
    app = createApp({ demo: null, workers: 1, log: () => {} });
    small = createApp({ demo: null, workers: 1, log: () => {}, bodyLimitBytes: 1024 });
  });
  afterAll(async () => {
    await app.shutdown();
    await small.shutdown();
  });

  const post = (a: PlumblineApp, raw: string, type = 'application/json') => request(a).post('/api/analyze').set('Content-Type', type).send(raw);
  const expectClientError = (res: request.Response, status: number, message: RegExp) => {
    expect(res.status, JSON.stringify(res.body)).toBe(status);
    const err = (res.body as { error?: { message?: unknown } }).error;
    expect(typeof err?.message).toBe('string');
    expect(err?.message as string).toMatch(message);
    expect(JSON.stringify(res.body)).not.toMatch(/\bat .+:\d+:\d+/); // no stack trace leaks
  };

  // [body, expected status, message pattern]; rationale: API.md's table of statuses and fields.
  const cases: [string, string, number, RegExp][] = [
    ['truncated JSON', '{"values":[1,2,3', 400, /not valid JSON/],
    ['NaN literal', '{"values":[NaN,1,2,3]}', 400, /not valid JSON/],
    ['Infinity literal', '{"values":[1,2,Infinity]}', 400, /not valid JSON/],
    ['array body', '[1,2,3]', 400, /JSON object/],
    ['null body', 'null', 400, /JSON object/],
    ['a string among the values', JSON.stringify({ values: [1, 2, '3', 4] }), 400, /values\[2\]/],
    ['null among the values', JSON.stringify({ values: [1, 2, null, 4] }), 400, /values\[2\]/],
    ['values not an array', JSON.stringify({ values: { a: 1 } }), 400, /array/],
    ['values and csv together', JSON.stringify({ values: thirty, csv: 'x\n1\n' }), 400, /values|csv/],
    ['neither values nor csv', JSON.stringify({ alpha: 0.05 }), 400, /values|csv/],
    ['unknown field', JSON.stringify({ values: thirty, colour: 'red' }), 400, /Unknown field "colour"/],
    ['__proto__ field', '{"values":[1,2,3,4,5],"__proto__":{"polluted":true}}', 400, /__proto__|Unknown field/],
    ['alpha 1', JSON.stringify({ values: thirty, alpha: 1 }), 400, /alpha/],
    ['alpha as text', JSON.stringify({ values: thirty, alpha: '0.05' }), 400, /alpha/],
    ['bins huge', JSON.stringify({ values: thirty, bins: 1e9 }), 400, /bins/],
    ['too many bins for n', JSON.stringify({ values: thirty, bins: 7 }), 400, /largest number of bins allowed is 6/],
    ['unknown family', JSON.stringify({ values: thirty, families: ['cauchy'] }), 400, /not a known family/],
    ['replicates huge', JSON.stringify({ values: thirty, replicates: 1e9 }), 400, /replicates/],
    ['seed negative', JSON.stringify({ values: thirty, seed: -1 }), 400, /seed/],
    ['column 0', JSON.stringify({ csv: 'x\n1\n2\n', column: 0 }), 400, /column/],
    ['column past the end', JSON.stringify({ csv: 'a,b\n1,2\n3,4\n', column: 9 }), 400, /column/],
    ['delimiter two characters', JSON.stringify({ csv: 'x\n1\n', csvOptions: { delimiter: ';;' } }), 400, /delimiter/],
    ['all values equal', JSON.stringify({ values: [3, 3, 3, 3, 3] }), 400, /equal/],
    ['empty values', JSON.stringify({ values: [] }), 400, /empty/],
    ['values at the double limits', JSON.stringify({ values: [1.7976931348623157e308, -1.7976931348623157e308, 0, 1, 2] }), 200, /./],
  ];
  for (const [name, raw, status, message] of cases) {
    it(name, async () => {
      const res = await post(app, raw);
      if (status === 200) {
        expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(200);
        return;
      }
      expectClientError(res, status, message);
    });
  }

  it('a body over the limit is a 413 with a clear message', async () => {
    expectClientError(await post(small, JSON.stringify({ values: Array(2000).fill(1.25) })), 413, /larger than the server's limit/);
  });
  it('a body that is not JSON is a 415', async () => {
    expectClientError(await post(app, 'x\n1\n2\n', 'text/csv'), 415, /JSON/);
  });
  it('binary bytes declared as JSON are a 400', async () => {
    const res = await request(app).post('/api/analyze').set('Content-Type', 'application/json').send(Buffer.from([0xff, 0xfe, 0x00, 0x7b, 0x80, 0x81]));
    expect(res.status).toBeGreaterThanOrEqual(400);
    expect(res.status).toBeLessThan(500);
  });
});

describe('CLI: hostile command lines and files', () => {
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-args-'));
  const good = join(dir, 'good.csv');
  writeFileSync(good, `x\n${thirty.join('\n')}\n`);
  const utf16 = join(dir, 'utf16.csv');
  writeFileSync(utf16, Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(`x\r\n${thirty.join('\r\n')}\r\n`, 'utf16le')]));
  const latin1 = join(dir, 'latin1.csv');
  writeFileSync(latin1, Buffer.from(`Länge µm\n${thirty.join('\n')}\n`, 'latin1'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  const run = (args: string[]) => {
    let out = '';
    let err = '';
    const code = runCli(args, { out: (s) => (out += s), err: (s) => (err += s) });
    return { code, out, err };
  };

  // [name, args, expected exit, stderr pattern]; exit codes per cli/run.ts (2 = the user's input or options).
  const cases: [string, string[], number, RegExp][] = [
    ['missing file', ['analyze', join(dir, 'nope.csv')], 2, /no such file/],
    ['a folder as the file', ['analyze', dir], 2, /folder/],
    ['column index 0', ['analyze', good, '--column', '0'], 2, /column/],
    ['column index past the end', ['analyze', good, '--column', '5'], 2, /column/],
    ['unknown column name', ['analyze', good, '--column', 'y'], 2, /no column named "y"/],
    ['alpha 2', ['analyze', good, '--alpha', '2'], 2, /alpha/],
    ['bins 1', ['analyze', good, '--bins', '1'], 2, /bins/],
    ['bins too many', ['analyze', good, '--bins', '50'], 2, /largest number of bins allowed is 6/],
    ['unknown family', ['analyze', good, '--families', 'normal,cauchy'], 2, /cauchy/],
    ['unknown option', ['analyze', good, '--colour', 'red'], 2, /colour/],
    ['no file', ['analyze'], 2, /file/],
  ];
  for (const [name, args, code, pattern] of cases) {
    it(name, () => {
      const r = run(args);
      expect(r.code, r.err).toBe(code);
      expect(r.out).toBe('');
      const lines = r.err.split('\n').filter((l) => l !== '');
      expect(lines).toHaveLength(1);
      expect(lines[0]).toMatch(/^plumbline: error: /);
      expect(lines[0]).toMatch(pattern);
    });
  }

  it('a UTF-16 file with its byte-order mark is read', () => {
    const r = run(['analyze', utf16, '--json']);
    expect(r.code, r.err).toBe(0);
    expect((JSON.parse(r.out) as { n: number }).n).toBe(30);
  });
  it('a Latin-1 file is read with a warning that says so', () => {
    const r = run(['analyze', latin1, '--json']);
    expect(r.code, r.err).toBe(0);
    const j = JSON.parse(r.out) as { n: number; input: { column: string; warnings: string[] } };
    expect(j.n).toBe(30);
    expect(j.input.column).toBe('Länge µm');
    expect(j.input.warnings.join(' ')).toMatch(/Latin-1/);
  });
});

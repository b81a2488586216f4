import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { testApp } from './helpers.js';

// Rules: issue 6 ("strict validation of the JSON body; unknown fields rejected with a message";
// "4xx { error: { message } } for the client's faults") and server/API.md.
const { app, logged } = testApp();
const small = testApp({ bodyLimitBytes: 2048 });
afterAll(async () => {
  await app.shutdown();
  await small.app.shutdown();
  expect(logged).toEqual([]);
  expect(small.logged).toEqual([]);
});

const VALUES = [3, 5, 7, 18, 43, 85, 91, 98, 100, 130, 230, 487];

async function expectError(body: unknown, status: number, pattern: RegExp, field?: string): Promise<void> {
  const res = await request(app).post('/api/analyze').set('Content-Type', 'application/json').send(JSON.stringify(body));
  expect(res.status).toBe(status);
  expect(res.body.error.message).toMatch(pattern);
  if (field !== undefined) expect(res.body.error.field).toBe(field);
}

describe('request validation', () => {
  it('missing body → 400 saying what to send', async () => {
    const res = await request(app).post('/api/analyze');
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/no JSON body/);
  });

  it('malformed JSON → 400; non-JSON content type → 415', async () => {
    const bad = await request(app).post('/api/analyze').set('Content-Type', 'application/json').send('{"values": [1, 2,');
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/not valid JSON/);
    const text = await request(app).post('/api/analyze').set('Content-Type', 'text/plain').send('1,2,3');
    expect(text.status).toBe(415);
    expect(text.body.error.message).toMatch(/application\/json/);
    const form = await request(app).post('/api/analyze').type('form').send({ values: '1' });
    expect(form.status).toBe(415);
  });

  it('a body that is not an object → 400', async () => {
    await expectError([1, 2, 3], 400, /must be a JSON object/);
  });

  it('unknown fields are named, top level and nested', async () => {
    await expectError({ values: VALUES, colour: 'red' }, 400, /Unknown field "colour"/, 'colour');
    await expectError({ values: VALUES, __proto__x: 1 }, 400, /Unknown field "__proto__x"/);
    const proto = await request(app).post('/api/analyze').set('Content-Type', 'application/json').send('{"values":[1,2,3,4,5],"__proto__":{"alpha":2}}');
    expect(proto.status).toBe(400);
    expect(proto.body.error.message).toMatch(/Unknown field "__proto__"/);
    await expectError({ csv: 'x\n1\n2\n', column: 'x', csvOptions: { quote: "'" } }, 400, /Unknown field "csvOptions.quote"/, 'csvOptions.quote');
    await expectError({ values: VALUES, evidence: true, evidenceOptions: { colours: 3 } }, 400, /Unknown field "evidenceOptions.colours"/);
  });

  it('wrong types and out-of-range values name the field', async () => {
    await expectError({ values: '1,2,3' }, 400, /"values" must be an array of numbers/, 'values');
    await expectError({ values: [1, 2, 'three', 4] }, 400, /"values\[2\]" \(value #3\) is not a finite number/, 'values[2]');
    await expectError({ values: [1, 2, null, 4] }, 400, /value #3/);
    await expectError({ values: VALUES, alpha: '0.05' }, 400, /"alpha" must be a number between 0 and 1/, 'alpha');
    await expectError({ values: VALUES, alpha: 1 }, 400, /"alpha"/, 'alpha');
    await expectError({ values: VALUES, alpha: 0 }, 400, /"alpha"/, 'alpha');
    await expectError({ values: VALUES, families: 'normal' }, 400, /"families" must be an array/, 'families');
    await expectError({ values: VALUES, families: ['normal', 'cauchy'] }, 400, /"families\[1\]" is not a known family/, 'families[1]');
    await expectError({ values: VALUES, families: [] }, 400, /"families" is empty/);
    await expectError({ values: VALUES, families: ['normal', 'normal'] }, 400, /twice/);
    await expectError({ values: VALUES, bins: 3.5 }, 400, /"bins" must be a whole number/, 'bins');
    await expectError({ values: VALUES, seed: -1 }, 400, /"seed"/, 'seed');
    await expectError({ values: VALUES, pMethod: 'exact' }, 400, /"pMethod" must be "table" or "bootstrap"/, 'pMethod');
    await expectError({ values: VALUES, replicates: 5 }, 400, /"replicates" must be a whole number from 19/, 'replicates');
    await expectError({ values: VALUES, evidence: 'yes' }, 400, /"evidence" must be true or false/, 'evidence');
    await expectError({ values: VALUES, evidenceOptions: { maxPoints: 100 } }, 400, /needs "evidence": true/);
    await expectError({ csv: 'a\n1\n', column: 0 }, 400, /"column" must be a header name or a 1-based column number/, 'column');
    await expectError({ csv: 42, column: 'a' }, 400, /"csv" must be the CSV file's text/, 'csv');
    await expectError({ csv: 'a\n1\n', csvOptions: { decimal: ';' } }, 400, /"csvOptions.decimal"/);
  });

  it('no data, both kinds of data, empty data → 400', async () => {
    await expectError({ alpha: 0.05 }, 400, /No data/);
    await expectError({ values: VALUES, csv: 'x\n1\n' }, 400, /either "values" or "csv"/);
    await expectError({ values: [] }, 400, /"values" is empty/, 'values');
    await expectError({ csv: '   \n' }, 400, /"csv" is empty/);
  });

  it('data the core refuses → 400 with the core\'s message (too many bins, one value, all equal, bad CSV cell)', async () => {
    // Cochran (1952): at least 5 expected per bin, so 12 values allow at most 2 bins.
    await expectError({ values: VALUES, bins: 10 }, 400, /too many/);
    await expectError({ values: [4.2] }, 400, /one value/i);
    await expectError({ values: [2, 2, 2, 2, 2] }, 400, /equal/);
    const res = await request(app).post('/api/analyze').send({ csv: 'h\n1\n2\nabc\n4\n5\n6\n', column: 'h' });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/abc/);
    expect(res.body.error.place.row).toBe(4);
    const none = await request(app).post('/api/analyze').send({ csv: 'h\nNA\n-\nn/a\n', column: 'h', csvOptions: { skipInvalid: true } });
    expect(none.status).toBe(400);
    expect(none.body.error.message).toMatch(/no usable values: all 3 data rows were dropped/);
    const col = await request(app).post('/api/analyze').send({ csv: 'h\n1\n2\n', column: 'nope' });
    expect(col.status).toBe(400);
    expect(col.body.error.message).toMatch(/nope/);
  });

  it('body over the limit → 413 with a clear message', async () => {
    const big = { values: Array.from({ length: 1000 }, (_, i) => i + 0.5) };
    const res = await request(small.app).post('/api/analyze').send(big);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('body-too-large');
    expect(res.body.error.message).toMatch(/larger than the server's limit of 2 KiB/);
  });

  it('the default limit admits 10^6 values (about 19 MB of JSON)', async () => {
    // Sizing rule of issue 6 ("default sized for a 10^6-row upload"); checked on the parser only
    // (evidence off, one family) so the suite stays fast.
    const values = Array.from({ length: 1_000_000 }, (_, i) => 1000 + ((i * 7919) % 100_003) / 97.13);
    const body = JSON.stringify({ values, families: ['normal'] });
    expect(body.length).toBeGreaterThan(10_000_000);
    const res = await request(app).post('/api/analyze').set('Content-Type', 'application/json').send(body);
    expect(res.status).toBe(200);
    expect(res.body.n).toBe(1_000_000);
  });

  it('unknown API routes → 404 JSON; wrong method → 405', async () => {
    const nf = await request(app).get('/api/nothing-here');
    expect(nf.status).toBe(404);
    expect(nf.body.error.message).toMatch(/No API route/);
    const m = await request(app).get('/api/analyze');
    expect(m.status).toBe(405);
    expect(m.headers.allow).toBe('POST');
  });
});

/**
 * Request framing the routes never see as data: a Content-Encoding header on a plain JSON body,
 * and route parameters whose percent-encoding is not valid UTF-8. Each is a client fault (one
 * clear 4xx, server/API.md's table), never a 500 and never an internal error in the log.
 * Sources: RFC 9110 §8.4 (Content-Encoding names a coding applied to the content; a server that
 * cannot decode it answers 4xx, §15.5.16 415 Unsupported Media Type or 400), RFC 3986 §2.1 and
 * RFC 3629 (a percent-encoded octet sequence must decode to valid UTF-8 to name a resource).
 */
import { deflateSync, gzipSync } from 'node:zlib';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { listen, rawGet, rawPost, testApp } from '../server/helpers.js';

const { app, logged } = testApp({ workers: 1 });
afterAll(async () => {
  await app.shutdown();
  expect(logged).toEqual([]);
});

const plain = JSON.stringify({ values: [1, 2, 3, 4, 5, 6, 7, 8] });

describe('a Content-Encoding the body does not have', () => {
  for (const coding of ['gzip', 'deflate', 'br']) {
    it(`plain JSON sent as ${coding}: 400 saying the body could not be decoded`, async () => {
      const res = await request(app).post('/api/analyze').set('Content-Type', 'application/json').set('Content-Encoding', coding).send(plain);
      expect(res.status, JSON.stringify(res.body)).toBe(400);
      expect(res.body.error.message).toMatch(new RegExp(`Content-Encoding[^]*${coding}`, 'i'));
      expect(res.body.error.code).toBe('bad-request');
    });
  }

  for (const coding of ['x-gzip', 'compress', 'zstd']) {
    it(`a coding the server does not decode (${coding}) is 415 naming it (RFC 9110 §15.5.16)`, async () => {
      const res = await request(app).post('/api/analyze').set('Content-Type', 'application/json').set('Content-Encoding', coding).send(plain);
      expect(res.status).toBe(415);
      expect(res.body.error.message).toMatch(new RegExp(`Content-Encoding[^]*${coding}`));
    });
  }

  it('a body that really is gzip or deflate is still read', async () => {
    const server = await listen(app);
    try {
      const g = await rawPost(server, '/api/analyze', gzipSync(plain), { 'content-encoding': 'gzip' });
      expect(g.status, g.body).toBe(200);
      expect((JSON.parse(g.body) as { n: number }).n).toBe(8);
      const d = await rawPost(server, '/api/jobs', deflateSync(plain), { 'content-encoding': 'deflate' });
      expect(d.status, d.body).toBe(202);
    } finally {
      server.close();
    }
  });
});

describe('bad percent-encoding in a route parameter', () => {
  const paths: [string, string][] = [
    ['GET', '/api/jobs/%ff'],
    ['DELETE', '/api/jobs/%ff'],
    ['GET', '/api/jobs/%E0%A4%A'],
    ['GET', '/api/demo/%c0%af'],
    ['GET', '/api/demo/%'],
    ['GET', '/api/jobs/%zz'],
  ];
  for (const [method, path] of paths) {
    it(`${method} ${path}: 400 or 404 with a message, not 500`, async () => {
      const server = await listen(app);
      try {
        const res = method === 'GET' ? await rawGet(server, path) : await request(server).delete(path);
        const status = 'statusCode' in res ? (res as { statusCode: number }).statusCode : (res as { status: number }).status;
        const text = 'text' in res ? String((res as { text: string }).text) : (res as { body: string }).body;
        expect([400, 404], text).toContain(status);
        expect((JSON.parse(text) as { error: { message: string } }).error.message).toMatch(/percent-encoding|No job|No demo/);
      } finally {
        server.close();
      }
    });
  }
});

import { mkdirSync, mkdtempSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import type { Server } from 'node:http';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { listen, rawGet, testApp } from './helpers.js';

// A throw-away page folder with a secret file beside it (and a symlink pointing out of it).
const base = mkdtempSync(join(tmpdir(), 'plumbline-static-'));
const dist = join(base, 'dist');
mkdirSync(join(dist, 'assets'), { recursive: true });
writeFileSync(join(dist, 'index.html'), '<!doctype html><title>t</title><p>page</p>');
writeFileSync(join(dist, 'assets', 'app.js'), 'console.log(1)');
writeFileSync(join(dist, '.env'), 'SECRET=1');
writeFileSync(join(base, 'secret.txt'), 'TOP SECRET');
symlinkSync(join(base, 'secret.txt'), join(dist, 'link.txt'));

const { app, logged } = testApp({ staticRoot: dist });
let server: Server;
beforeAll(async () => {
  server = await listen(app);
});
afterAll(async () => {
  await new Promise((r) => server.close(r));
  await app.shutdown();
  rmSync(base, { recursive: true, force: true });
  expect(logged).toEqual([]);
});

describe('security headers (issue 6)', () => {
  it('are on API, static and error responses', async () => {
    for (const res of [await request(app).get('/api/health'), await request(app).get('/'), await request(app).get('/missing.js'), await request(app).post('/api/analyze')]) {
      const csp = String(res.headers['content-security-policy']);
      expect(csp).toMatch(/script-src 'self'(;|$)/);
      expect(csp).not.toMatch(/unsafe-inline|unsafe-eval/);
      expect(csp).toMatch(/frame-ancestors 'none'/);
      expect(res.headers['x-content-type-options']).toBe('nosniff');
      expect(res.headers['referrer-policy']).toBe('no-referrer');
      expect(res.headers['x-powered-by']).toBeUndefined();
    }
  });

  it('refuses a Host header naming another machine (DNS rebinding)', async () => {
    const res = await request(app).get('/api/health').set('Host', 'attacker.example:5178');
    expect(res.status).toBe(421);
    expect(res.body.error.message).toMatch(/only answers requests addressed to this machine/);
    const ok = await request(app).get('/api/health').set('Host', 'localhost:5178');
    expect(ok.status).toBe(200);
  });
});

describe('static files only from the built page', () => {
  it('serves index.html and assets with their types', async () => {
    const root = await request(app).get('/');
    expect(root.status).toBe(200);
    expect(root.headers['content-type']).toMatch(/text\/html/);
    expect(root.text).toContain('<p>page</p>');
    const js = await request(app).get('/assets/app.js');
    expect(js.status).toBe(200);
    expect(js.headers['content-type']).toMatch(/javascript/);
  });

  it('refuses traversal, encoded traversal, dot files and symlinks out of the folder', async () => {
    const attempts = [
      '/../package.json',
      '/../secret.txt',
      '/%2e%2e/secret.txt',
      '/%2E%2E%2Fsecret.txt',
      '/..%2fsecret.txt',
      '/..%5csecret.txt',
      '/assets/../../secret.txt',
      '/assets/%2e%2e/%2e%2e/secret.txt',
      '/%252e%252e/secret.txt',
      '/..%00/secret.txt',
      '/%c0%ae%c0%ae/secret.txt',
      '//etc/passwd',
      '/.env',
      '/link.txt',
      '/C:%5cWindows',
    ];
    // Positive control: the same raw client does get a file that is inside the folder.
    const inside = await rawGet(server, '/assets/%61pp.js');
    expect(inside.status).toBe(200);
    expect(inside.body).toBe('console.log(1)');
    for (const path of attempts) {
      const res = await rawGet(server, path);
      expect(res.status, path).toBe(404);
      expect(res.body, path).not.toContain('TOP SECRET');
      expect(res.body, path).not.toContain('SECRET=1');
      expect(res.body, path).not.toContain('"dependencies"');
    }
  });

  it('says the page is not built when client/dist is missing', async () => {
    const bare = testApp({ staticRoot: join(base, 'no-such-dist') });
    const res = await request(bare.app).get('/');
    expect(res.status).toBe(404);
    expect(res.body.error.message).toMatch(/not been built/);
    await bare.app.shutdown();
  });
});

/**
 * runner.ts without a browser or a server: fetch is replaced by a stub that answers as
 * server/API.md says (POST /api/analyze, POST /api/jobs, GET and DELETE /api/jobs/:id). A newer
 * run abandons the older, a bootstrap job is polled with its progress, Stop cancels the job.
 */
import { afterEach, describe, expect, it, vi } from 'vitest';
import { Runner, type RunProgress } from '../../client/src/runner.js';
import type { BuiltRequest } from '../../client/src/request.js';
import type { AnalyzeRequest } from '../../client/src/api.js';

const REPORT = { candidates: [], n: 3 };
const request = (pMethod: 'table' | 'bootstrap'): BuiltRequest => ({
  kind: 'values',
  request: { csv: 'x\n1\n2\n3\n', column: 1, csvOptions: {}, families: ['normal'], alpha: 0.05, bins: null, pMethod, evidence: true } as AnalyzeRequest,
  column: 'x',
  requestedBins: null,
});
const json = (body: unknown, status = 200): Response => new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

afterEach(() => vi.unstubAllGlobals());

describe('Runner', () => {
  it('returns the report of a plain request', async () => {
    const calls: string[] = [];
    vi.stubGlobal('fetch', async (url: string, init: RequestInit) => {
      calls.push(`${init.method} ${url}`);
      return json(REPORT);
    });
    const out = await new Runner('page-t').run(request('table'), () => undefined, 'the values');
    expect(out).toEqual(REPORT);
    expect(calls).toEqual(['POST /api/analyze']);
  });

  it('a newer run abandons the older one: its request is aborted and it answers null', async () => {
    let first = true;
    vi.stubGlobal('fetch', (_url: string, init: RequestInit) => {
      if (first) {
        first = false;
        return new Promise((_, reject) => init.signal?.addEventListener('abort', () => reject(new DOMException('aborted', 'AbortError'))));
      }
      return Promise.resolve(json(REPORT));
    });
    const runner = new Runner('page-t');
    const older = runner.run(request('table'), () => undefined, '');
    const newer = runner.run(request('table'), () => undefined, '');
    expect(await older).toBeNull();
    expect(await newer).toEqual(REPORT);
  });

  it('follows a bootstrap job to its result, reporting progress', async () => {
    let polls = 0;
    vi.stubGlobal('fetch', async (url: string, init: RequestInit) => {
      if (init.method === 'POST') return json({ id: 'j1', state: 'running', progress: 0 }, 202);
      polls++;
      return polls < 2 ? json({ id: 'j1', state: 'running', progress: 0.5 }) : json({ id: 'j1', state: 'done', progress: 1, result: REPORT });
    });
    const seen: (RunProgress | null)[] = [];
    const out = await new Runner('page-t').run(request('bootstrap'), (p) => seen.push(p), '');
    expect(out).toEqual(REPORT);
    expect(seen.map((p) => p?.text)).toEqual(['0%', '50%', '100%']);
  });

  it('Stop cancels the running job on the server', async () => {
    const calls: string[] = [];
    vi.stubGlobal('fetch', async (url: string, init: RequestInit) => {
      calls.push(`${init.method} ${url}`);
      if (init.method === 'POST') return json({ id: 'j2', state: 'running', progress: 0 }, 202);
      if (init.method === 'DELETE') return json({ id: 'j2', state: 'cancelled' });
      return json({ id: 'j2', state: 'running', progress: 0.1 });
    });
    const runner = new Runner('page-t');
    const run = runner.run(request('bootstrap'), () => undefined, '');
    await new Promise((r) => setTimeout(r, 300));
    runner.stop();
    expect(await run).toBeNull();
    expect(calls).toContain('DELETE /api/jobs/j2');
  });

  it('a failed job becomes an error with the server\'s message', async () => {
    vi.stubGlobal('fetch', async (_url: string, init: RequestInit) =>
      init.method === 'POST' ? json({ id: 'j3', state: 'running', progress: 0 }, 202) : json({ id: 'j3', state: 'failed', progress: 0, error: { message: 'too many bins', code: 'bad-option' } }),
    );
    await expect(new Runner('page-t').run(request('bootstrap'), () => undefined, '')).rejects.toThrow('too many bins');
  });
});

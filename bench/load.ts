/**
 * Load test of the local server on loopback: 16 (or --connections C) concurrent connections posting
 * 10^4-point analyses, every response checked (status 200 and the report equal to the core's own
 * analysis of the same values, analyzeDataset), the share of 2xx, p50/p99 latency, and the server's resident memory before and
 * after. Run: node --import tsx bench/load.ts [--requests N] [--seconds S] [--connections C]
 *
 * Bounded in count and time: at most N requests (default 10^4) and at most S seconds of load
 * (default 120); whichever comes first ends the run, and the output says which. The server runs
 * as a child process (this file with --serve) so that the load generator does not share its
 * event loop, listens on 127.0.0.1 port 0 (an ephemeral port) and is only ever reached there.
 * Bodies are seeded (createRng): Weibull, lognormal, gamma and normal samples of 10^4 values.
 */
import { fork, type ChildProcess } from 'node:child_process';
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';
import { analyzeDataset, createRng, type AnalysisReport } from '../core/index.js';

const HOST = '127.0.0.1';
const POINTS = 10_000;

interface MemMessage {
  readonly type: 'mem';
  readonly rss: number;
  readonly heapUsed: number;
  readonly external: number;
}

// ---- server side -------------------------------------------------------------------------------
async function serve(): Promise<void> {
  const { createApp } = await import('../server/app.js');
  const app = createApp({ demo: null, log: (m) => process.stderr.write(`[server] ${m}\n`) });
  const server = app.listen(0, HOST, () => {
    const addr = server.address();
    if (addr === null || typeof addr === 'string') throw new Error('no port');
    process.send?.({ type: 'listening', port: addr.port });
  });
  process.on('message', (m: { type: string }) => {
    if (m.type === 'mem') {
      // Settle the heap first if the process was started with --expose-gc, so that the figure is
      // the live size rather than garbage not yet collected.
      const g = (globalThis as { gc?: () => void }).gc;
      if (g) g();
      const u = process.memoryUsage();
      process.send?.({ type: 'mem', rss: u.rss, heapUsed: u.heapUsed, external: u.external } satisfies MemMessage);
    } else if (m.type === 'stop') {
      server.close();
      void app.shutdown().then(() => process.exit(0));
    }
  });
}

// ---- load side ---------------------------------------------------------------------------------
interface AutocannonResult {
  readonly latency: { readonly p50: number; readonly p99: number; readonly p97_5: number; readonly max: number; readonly mean: number };
  readonly requests: { readonly total: number; readonly average: number };
  readonly non2xx: number;
  readonly errors: number;
  readonly timeouts: number;
  readonly duration: number;
  readonly mismatches: number;
}
interface AutocannonInstance extends PromiseLike<AutocannonResult> {
  stop(): void;
}
type Autocannon = (opts: Record<string, unknown>) => AutocannonInstance;

function sample(seed: number, kind: number): number[] {
  const rng = createRng(seed);
  const out = new Array<number>(POINTS);
  for (let i = 0; i < POINTS; i++) {
    out[i] =
      kind === 0
        ? Math.pow(rng.exponential(), 1 / 1.5) * 700 // Weibull(1.5, 700), e.g. hours to failure
        : kind === 1
          ? Math.exp(3 + 0.4 * rng.normal()) // lognormal
          : kind === 2
            ? rng.gamma(3) * 12 // gamma(3, 12)
            : 25 + 0.02 * rng.normal(); // normal, e.g. a diameter in mm
  }
  return out;
}

function arg(name: string, fallback: number): number {
  const i = process.argv.indexOf(name);
  if (i < 0) return fallback;
  const v = Number(process.argv[i + 1]);
  if (!Number.isFinite(v) || v <= 0) throw new Error(`${name} needs a positive number`);
  return v;
}

function ask<T>(child: ChildProcess, type: string): Promise<T> {
  return new Promise((resolve) => {
    const on = (m: { type: string }) => {
      if (m.type === type) {
        child.off('message', on);
        resolve(m as T);
      }
    };
    child.on('message', on);
    child.send({ type });
  });
}

const mib = (b: number) => `${(b / 2 ** 20).toFixed(1)} MiB`;

async function main(): Promise<void> {
  const maxRequests = arg('--requests', 10_000);
  const maxSeconds = arg('--seconds', 120);
  const connections = arg('--connections', 16);
  const require = createRequire(import.meta.url);
  const autocannon = require('autocannon') as Autocannon;

  // Four seeded bodies and the report the core itself gives for each (the server must agree).
  const bodies = [0, 1, 2, 3].map((kind) => {
    const values = sample(1000 + kind, kind);
    const expected = analyzeDataset({ values }); // what the server runs (core/workflow/pipeline.ts)
    return { body: JSON.stringify({ values }), expected: JSON.stringify(expected.candidates) };
  });

  const child = fork(fileURLToPath(import.meta.url), ['--serve'], { execArgv: ['--import', 'tsx', '--expose-gc'], stdio: ['ignore', 'inherit', 'inherit', 'ipc'] });
  const { port } = await new Promise<{ port: number }>((resolve, reject) => {
    child.once('message', (m: { type: string; port: number }) => (m.type === 'listening' ? resolve(m) : reject(new Error('unexpected message'))));
    child.once('exit', (code) => reject(new Error(`server exited (${code})`)));
  });
  const url = `http://${HOST}:${port}/api/analyze`;
  console.log(`server on ${HOST}:${port} (child pid ${child.pid}); ${connections} connections, ${POINTS} points per analysis, at most ${maxRequests} requests or ${maxSeconds} s`);

  // Warm up (JIT, first allocations), then measure the baseline.
  await autocannon({ url, method: 'POST', headers: { 'content-type': 'application/json' }, body: bodies[0]?.body, connections: 4, amount: 40 });
  const before = await ask<MemMessage>(child, 'mem');

  let wrong = 0;
  let checked = 0;
  const firstWrong: string[] = [];
  const requests = bodies.map((b, i) => ({
    method: 'POST',
    path: '/api/analyze',
    headers: { 'content-type': 'application/json' },
    body: b.body,
    onResponse: (status: number, body: string) => {
      checked++;
      let ok = status === 200;
      if (ok) {
        try {
          const got = JSON.parse(body) as AnalysisReport;
          ok = got.n === POINTS && JSON.stringify(got.candidates) === b.expected;
        } catch {
          ok = false;
        }
      }
      if (!ok) {
        wrong++;
        if (firstWrong.length < 3) firstWrong.push(`body ${i}: status ${status}, ${body.slice(0, 200)}`);
      }
    },
  }));

  const started = Date.now();
  const instance = autocannon({ url, connections, amount: maxRequests, requests, timeout: 60 });
  let stoppedByTime = false;
  const timer = setTimeout(() => {
    stoppedByTime = true;
    instance.stop();
  }, maxSeconds * 1000);
  // Resident size every 20 s during the run: a plateau after warm-up is allocator growth, a steady
  // climb would be a leak.
  const series: string[] = [];
  const sampler = setInterval(() => {
    void ask<MemMessage>(child, 'mem').then((m) => series.push(`${((Date.now() - started) / 1000).toFixed(0)} s: ${mib(m.rss)}`));
  }, 20_000);
  const result = await instance;
  clearTimeout(timer);
  clearInterval(sampler);
  const elapsed = (Date.now() - started) / 1000;
  const after = await ask<MemMessage>(child, 'mem');
  child.send({ type: 'stop' });

  const total = result.requests.total;
  console.log(
    [
      `requests answered: ${total}${stoppedByTime ? ` (stopped at the ${maxSeconds} s bound, before ${maxRequests})` : ''} in ${elapsed.toFixed(1)} s (${(total / elapsed).toFixed(1)} req/s)`,
      `2xx share: ${total > 0 ? ((100 * (total - result.non2xx)) / total).toFixed(1) : '0'} % (${total - result.non2xx} of ${total})`,
      `responses checked: ${checked}; wrong (not 200 or report differing from the core's): ${wrong}; non-2xx ${result.non2xx}, errors ${result.errors}, timeouts ${result.timeouts}`,
      `latency: p50 ${result.latency.p50} ms, p97.5 ${result.latency.p97_5} ms, p99 ${result.latency.p99} ms, max ${result.latency.max} ms, mean ${result.latency.mean.toFixed(1)} ms`,
      `server resident memory: before ${mib(before.rss)} (heap ${mib(before.heapUsed)}, external ${mib(before.external)}), after ${mib(after.rss)} (heap ${mib(after.heapUsed)}, external ${mib(after.external)}); change ${mib(after.rss - before.rss)}`,
      `resident memory during the run: ${series.join(', ')}`,
    ].join('\n'),
  );
  for (const w of firstWrong) console.log(`  wrong: ${w}`);
  process.exitCode = wrong > 0 || result.errors > 0 || result.timeouts > 0 || checked !== total ? 1 : 0;
}

if (process.argv.includes('--serve')) void serve();
else
  main().catch((e: unknown) => {
    console.error(e);
    process.exitCode = 1;
  });

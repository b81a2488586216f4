/**
 * Load check of the local server on loopback (issue 6), bounded in count and time:
 *   node --import tsx server/load-check.ts [--requests N] [--memory-requests N]
 * 1. 16 concurrent analyses of 10^4 points (autocannon, 16 connections, N requests in all, default
 *    64): every response is checked (200, n = 10000, five candidates ranked 1..5); latency
 *    percentiles are printed.
 * 2. Memory: the server's resident size (VmRSS of its process, workers included) before and after
 *    each of R rounds (default 4) of M/R further analyses (M default 10^4, of 100 points each so the
 *    run stays short).
 * The server runs as a child process (server/main.ts on a free port); nothing is written to disk.
 * Not part of `npm test`: a measurement, not an assertion.
 */
import { spawn } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import autocannon from 'autocannon';
import { createRng, getFamily } from '../core/index.js';

function arg(name: string, dflt: number): number {
  const i = process.argv.indexOf(name);
  const v = i >= 0 ? Number(process.argv[i + 1]) : dflt;
  if (!Number.isInteger(v) || v < 1) throw new Error(`${name} must be a whole number ≥ 1`);
  return v;
}

function rssMiB(pid: number): number {
  const m = /VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
  return m ? Number(m[1]) / 1024 : Number.NaN;
}

function body(n: number, seed: number): string {
  return JSON.stringify({ values: Array.from(getFamily('normal').random({ mean: 50, sd: 4 }, createRng(seed), n)) });
}

async function main(): Promise<void> {
  const requests = arg('--requests', 64);
  const memoryRequests = arg('--memory-requests', 10_000);
  const mainTs = fileURLToPath(new URL('./main.ts', import.meta.url));
  const child = spawn(process.execPath, ['--import', 'tsx', mainTs, '--port', '0'], { stdio: ['ignore', 'pipe', 'inherit'] });
  const url = await new Promise<string>((resolve, reject) => {
    let out = '';
    child.stdout.on('data', (c: Buffer) => {
      out += c.toString();
      const m = /(http:\/\/127\.0\.0\.1:\d+)\//.exec(out);
      if (m) resolve(m[1] as string);
    });
    child.on('exit', (code) => reject(new Error(`server exited (${code})`)));
  });
  const pid = child.pid as number;
  try {
    let wrong = 0;
    const big = body(10_000, 1);
    const r1 = await autocannon({
      url: `${url}/api/analyze`,
      connections: 16,
      amount: requests,
      timeout: 120,
      requests: [
        {
          method: 'POST',
          headers: { 'content-type': 'application/json' },
          body: big,
          onResponse: (status: number, text: string) => {
            let ok = status === 200;
            if (ok) {
              const r = JSON.parse(text) as { n: number; candidates: { rank: number }[] };
              ok = r.n === 10_000 && r.candidates.length === 5 && r.candidates.every((c, i) => c.rank === i + 1);
            }
            if (!ok) wrong++;
          },
        },
      ],
    });
    console.log(`16 concurrent analyses of 10^4 points: ${r1.requests.total} requests, ${r1.non2xx} non-2xx, ${wrong} wrong or failed, errors ${r1.errors}, timeouts ${r1.timeouts}`);
    console.log(`  latency ms: p50 ${r1.latency.p50}, p90 ${r1.latency.p90}, p99 ${r1.latency.p99}, max ${r1.latency.max}; ${r1.requests.average} req/s`);
    // Memory: M analyses in `rounds` rounds; the resident size after each round shows whether it
    // keeps growing (a leak) or levels off (heaps reaching their working size).
    const rounds = arg('--rounds', 4);
    const small = body(100, 2);
    const sizes = [rssMiB(pid)];
    let total = 0;
    let non2xx = 0;
    let p99 = 0;
    for (let r = 0; r < rounds; r++) {
      const res = await autocannon({
        url: `${url}/api/analyze`,
        connections: 8,
        amount: Math.ceil(memoryRequests / rounds),
        timeout: 60,
        requests: [{ method: 'POST', headers: { 'content-type': 'application/json' }, body: small }],
      });
      total += res.requests.total;
      non2xx += res.non2xx;
      p99 = Math.max(p99, res.latency.p99);
      sizes.push(rssMiB(pid));
    }
    console.log(`memory over ${total} analyses of 100 points (${non2xx} non-2xx, p99 ≤ ${p99} ms): resident MiB after each round ${sizes.map((v) => v.toFixed(1)).join(' → ')}`);
  } finally {
    child.kill('SIGTERM');
  }
}

void main().catch((e: unknown) => {
  console.error(e);
  process.exit(1);
});

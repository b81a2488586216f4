/**
 * The built command's second thread (cli/second-thread.ts: lognormal and gamma evaluated on a
 * worker_thread for large samples, started while the file is read) gives the report byte for byte
 * as one thread does. PLUMBLINE_SECOND_THREAD=on|off forces either way whatever the machine's load.
 * Needs the built bundle (dist/cli/main.js: `npm ci` builds it through `prepare`; the thread runs
 * only from the one-file bundle).
 */
import { spawn } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { createRng } from '../../core/index.js';
import { root, scratchCsv, type SpawnedCli } from '../helpers/cli.js';

const bundle = join(root, 'dist', 'cli', 'main.js');

function built(mode: 'on' | 'off', ...args: string[]): Promise<SpawnedCli> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [bundle, ...args], {
      cwd: root,
      env: { ...process.env, PLUMBLINE_DEBUG: '', PLUMBLINE_SECOND_THREAD: mode },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let stdout = '';
    let stderr = '';
    child.stdout.setEncoding('utf8').on('data', (d: string) => (stdout += d));
    child.stderr.setEncoding('utf8').on('data', (d: string) => (stderr += d));
    child.on('error', reject);
    child.on('close', (status) => resolve({ status, stdout, stderr }));
  });
}

const write = scratchCsv('plumbline-thread-');

describe('the second thread', () => {
  it('the bundle is built (npm run build)', () => {
    expect(existsSync(bundle), `${bundle} is missing: run npm run build`).toBe(true);
  });

  it('250,000 values: the same JSON report with and without it', async () => {
    const rng = createRng(20261204, 7);
    const rows = Array.from({ length: 250_000 }, () => (12.5 * rng.gamma(4)).toFixed(5));
    const file = write('large.csv', `load\n${rows.join('\n')}\n`);
    const [on, off] = [await built('on', 'analyze', file, '--json'), await built('off', 'analyze', file, '--json')];
    expect(off.status, off.stderr).toBe(0);
    expect(on.status, on.stderr).toBe(0);
    const report = JSON.parse(on.stdout) as { n: number; candidates: { family: string }[] };
    expect(report.n).toBe(250_000);
    expect(report.candidates.map((c) => c.family)).toEqual(expect.arrayContaining(['lognormal', 'gamma', 'weibull', 'normal']));
    expect(on.stdout).toBe(off.stdout);
  }, 120_000);

  it('started early for a large file that holds few values: ended unused, the same report', async () => {
    const rng = createRng(20261204, 8);
    const pad = 'x'.repeat(400); // ~2.4 MB for 6,000 rows: past the early-start size, below the thread's sample size
    const rows = Array.from({ length: 6000 }, (_, i) => `${(12.5 * rng.gamma(4)).toFixed(5)},${pad}${i}`);
    const file = write('wide.csv', `load,note\n${rows.join('\n')}\n`);
    const [on, off] = [await built('on', 'analyze', file, '--column', 'load', '--json'), await built('off', 'analyze', file, '--column', 'load', '--json')];
    expect(on.status, on.stderr).toBe(0);
    expect(on.stdout).toBe(off.stdout);
  }, 120_000);
});

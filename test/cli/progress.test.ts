/**
 * CLI progress on standard error (cli/progress.ts, cli/analyze-progress.ts): silent for a run
 * shorter than a second, then the bootstrap's replicates done of the total at most every half
 * second; the report is the one analyzeDataset gives. Common practice, no source; the clock is
 * injected, so nothing here depends on the machine's speed.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { analyzeWithProgress } from '../../cli/analyze-progress.js';
import { createProgress } from '../../cli/progress.js';
import { analyzeDataset, createRng, getFamily } from '../../core/index.js';

function clock(): { now: () => number; advance: (ms: number) => void } {
  let t = 0;
  return { now: () => t, advance: (ms) => (t += ms) };
}

describe('createProgress', () => {
  it('says nothing during the first second, then one line per half second, and the last update always', () => {
    const c = clock();
    const out: string[] = [];
    const p = createProgress((s) => out.push(s), { tty: false, now: c.now });
    p.replicates(10, 1000, 'weibull');
    c.advance(999);
    p.replicates(100, 1000, 'weibull');
    expect(out).toEqual([]);
    c.advance(1);
    p.replicates(200, 1000, 'weibull');
    c.advance(100);
    p.replicates(300, 1000, 'weibull'); // within half a second: skipped
    c.advance(400);
    p.replicates(400, 1000, 'gamma');
    c.advance(10);
    p.replicates(1000, 1000, 'gamma'); // the end is always shown
    p.end();
    expect(out).toEqual([
      'plumbline: bootstrap 20 % (200 of 1,000 replicates; weibull)\n',
      'plumbline: bootstrap 40 % (400 of 1,000 replicates; gamma)\n',
      'plumbline: bootstrap 100 % (1,000 of 1,000 replicates; gamma)\n',
    ]);
  });

  it('on a terminal rewrites one line and clears it at the end; a quick run leaves nothing', () => {
    const c = clock();
    const out: string[] = [];
    const p = createProgress((s) => out.push(s), { tty: true, now: c.now });
    c.advance(1500);
    p.replicates(5, 10, 'normal');
    p.end();
    expect(out).toEqual(['\rplumbline: bootstrap 50 % (5 of 10 replicates; normal)\u001b[K', '\r\u001b[K']);
    const quick: string[] = [];
    const q = createProgress((s) => quick.push(s), { tty: true, now: clock().now });
    q.replicates(10, 10, 'normal');
    q.end();
    expect(quick).toEqual([]);
  });
});

describe('analyzeWithProgress', () => {
  it('reports replicates over all families in order and gives analyzeDataset’s report', () => {
    const x = Array.from(getFamily('weibull').random({ shape: 1.6, scale: 80 }, createRng(21), 40));
    const options = { families: ['weibull', 'gamma'] as const, pMethod: 'bootstrap' as const, bootstrapReplicates: 19 };
    const seen: [number, number, string][] = [];
    const report = analyzeWithProgress({ values: x }, { ...options, families: [...options.families] }, { replicates: (d, t, f) => seen.push([d, t, f]), end: () => seen.push([-1, -1, 'end']) });
    expect(JSON.parse(JSON.stringify(report))).toEqual(JSON.parse(JSON.stringify(analyzeDataset({ values: x }, { ...options, families: [...options.families] }))));
    expect(seen[0]).toEqual([1, 38, 'weibull']);
    expect(seen[18]).toEqual([19, 38, 'weibull']);
    expect(seen[19]).toEqual([20, 38, 'gamma']);
    expect(seen[37]).toEqual([38, 38, 'gamma']);
    expect(seen[38]).toEqual([-1, -1, 'end']);
  });
});

describe('plumbline analyze: progress on standard error, the report on standard output', () => {
  it('a bootstrap of a few seconds prints progress lines on stderr and the unchanged JSON on stdout', () => {
    // 2000 Weibull values, 1000 bootstrap replicates of one family: about 3 s of work or more (2·10^6
    // sampled values at about 1.4 µs each, measured for server/limits.ts), so past the quiet second.
    const x = Array.from(getFamily('weibull').random({ shape: 1.6, scale: 80 }, createRng(22), 2000));
    const file = join(mkdtempSync(join(tmpdir(), 'plumbline-progress-')), 'x.csv');
    writeFileSync(file, `x\n${x.join('\n')}\n`);
    const main = fileURLToPath(new URL('../../cli/main.ts', import.meta.url));
    // The quiet first second is shortened to 0 so that the lines appear however fast the machine is
    // (on an idle CI machine this run can end inside one second).
    const r = spawnSync(process.execPath, ['--import', 'tsx', main, 'analyze', file, '--families', 'weibull', '--p-method', 'bootstrap', '--replicates', '1000', '--json'], {
      encoding: 'utf8',
      timeout: 300_000,
      env: { ...process.env, PLUMBLINE_PROGRESS_QUIET_MS: '0' },
    });
    expect(r.status, r.stderr).toBe(0);
    const lines = r.stderr.trim().split('\n');
    expect(lines.length).toBeGreaterThan(0);
    for (const l of lines) expect(l).toMatch(/^plumbline: bootstrap \d+ % \([\d,]+ of 1,000 replicates; weibull\)$/);
    expect(lines[lines.length - 1]).toMatch(/100 %/);
    expect((JSON.parse(r.stdout) as { n: number }).n).toBe(2000);
  }, 300_000);
});

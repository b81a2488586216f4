/**
 * The capability bootstrap on the command line runs as a job of the one pipeline, with progress on
 * standard error (cli/analyze-progress.ts) naming it, and the report on standard output.
 */
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

describe('plumbline analyze: the capability interval reports progress', () => {
  it('pump-seal-wear, Box–Cox, 2000 replicates: progress lines name the capability bootstrap; the JSON interval has 2000 replicates', () => {
    const main = fileURLToPath(new URL('../../cli/main.ts', import.meta.url));
    // The quiet first second is shortened to 0 so that the lines appear however fast the machine is.
    const r = spawnSync(process.execPath, ['--import', 'tsx', main, 'analyze', 'datasets/pump-seal-wear.csv', '--families', 'normal', '--usl', '120', '--transform', 'boxcox', '--capability-replicates', '2000', '--json'], {
      encoding: 'utf8',
      timeout: 300_000,
      env: { ...process.env, PLUMBLINE_PROGRESS_QUIET_MS: '0' },
    });
    expect(r.status, r.stderr).toBe(0);
    const lines = r.stderr.trim().split('\n');
    expect(lines.some((l) => /^plumbline: bootstrap \d+ % \([\d,]+ of [\d,]+ replicates; capability\)$/.test(l))).toBe(true);
    expect(lines[lines.length - 1]).toMatch(/100 %/);
    const iv = JSON.parse(r.stdout).capability.transform.intervals.intervals as { replicates: number; failed: number }[];
    expect(iv.length).toBeGreaterThan(0);
    for (const x of iv) expect(x.replicates + x.failed).toBe(2000);
  }, 300_000);
});

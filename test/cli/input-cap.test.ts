/**
 * Standard input and devices (pipes, /dev/zero, FIFOs) have no size to check before reading, so
 * the CLI reads them in chunks and stops at a stated cap (cli/read-input.ts
 * STREAM_INPUT_MAX_BYTES): one line on standard error and exit 2, instead of reading until memory
 * runs out (`yes 1 | plumbline analyze -` reached 4.8 GB). The commands run the CLI from its
 * sources in a child process (node --import tsx cli/main.ts), as a user would run it.
 */
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { readInputText, STREAM_INPUT_MAX_BYTES } from '../../cli/read-input.js';

const MAIN = fileURLToPath(new URL('../../cli/main.ts', import.meta.url));
const CAP_MIB = STREAM_INPUT_MAX_BYTES / 2 ** 20;

function shell(command: string): { status: number | null; stdout: string; stderr: string } {
  const r = spawnSync('bash', ['-c', command], { encoding: 'utf8', timeout: 120_000, env: { ...process.env, MAIN } });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

describe('a cap on standard input and devices', () => {
  it(`the cap is stated (${CAP_MIB} MiB) and sensible: above the 50 MiB server body limit, below one string's limit`, () => {
    expect(STREAM_INPUT_MAX_BYTES).toBeGreaterThanOrEqual(50 * 2 ** 20);
    expect(STREAM_INPUT_MAX_BYTES).toBeLessThan(0x1fffffe8);
  });

  it('an endless pipe (yes 1): one line, exit 2, naming the cap', () => {
    const r = shell('yes 1 | node --import tsx "$MAIN" analyze -');
    expect(r.status).toBe(2);
    const lines = r.stderr.trim().split('\n');
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatch(new RegExp(`^plumbline: error: standard input is larger than ${CAP_MIB} MiB`));
    expect(r.stdout).toBe('');
  }, 120_000);

  it('a device that never ends (/dev/zero): one line, exit 2', () => {
    const r = shell('node --import tsx "$MAIN" analyze /dev/zero');
    expect(r.status).toBe(2);
    const lines = r.stderr.trim().split('\n');
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatch(new RegExp(`"/dev/zero" is larger than ${CAP_MIB} MiB`));
  }, 120_000);

  it('a small cap passed in stops a pipe at that size; a pipe under it is read whole', () => {
    expect(() => readInputText('/dev/zero', { maxStreamBytes: 1 << 20 })).toThrow(/larger than 1 MiB/);
    const r = shell('printf "x\\n1\\n2\\n3\\n4\\n5\\n" | node --import tsx "$MAIN" analyze - --json');
    expect(r.status, r.stderr).toBe(0);
    expect((JSON.parse(r.stdout) as { n: number }).n).toBe(5);
  }, 120_000);
});

/**
 * The warning on standard error when a 0/1 column sits beside the values and --censor-column is not
 * given (without it every value is analysed as a failure time). Rule from the product brief;
 * common practice, no source.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { HINT_ROWS } from '../../cli/status-hint.js';
import { runCli } from '../../cli/run.js';

const dir = mkdtempSync(join(tmpdir(), 'plumbline-hint-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function file(name: string, text: string): string {
  const p = join(dir, name);
  writeFileSync(p, text);
  return p;
}

async function run(args: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const code = await runCli(['analyze', ...args, '--json'], { out: (s) => (out += s), err: (s) => (err += s) });
  return { code, out, err };
}

const TIMES = [112, 230, 318, 402, 455, 520, 611, 700, 812, 930, 1004, 1200];

describe('a 0/1 column without --censor-column', () => {
  it('is named on stderr with the option to add, and the run goes on (datasets/bearing-life.csv)', async () => {
    const r = await run(['datasets/bearing-life.csv', '--column', 'hours']);
    expect(r.code).toBe(0);
    expect(r.err).toMatch(/^plumbline: warning: column "status" holds only 0 and 1: .*add --censor-column "status"/);
    expect(r.err.trim().split('\n')).toHaveLength(1);
    expect(JSON.parse(r.out).dataKind).toBe('complete');
  });

  it('no warning once --censor-column is given', async () => {
    const r = await run(['datasets/bearing-life.csv', '--column', 'hours', '--censor-column', 'status']);
    expect(r.code).toBe(0);
    expect(r.err).toBe('');
  });

  it('no warning when the other column holds anything but 0 and 1', async () => {
    const p = file('codes.csv', `t,code\n${TIMES.map((t, i) => `${t},${i === 3 ? 2 : i % 2}`).join('\n')}\n`);
    const r = await run([p, '--column', 't']);
    expect(r.code).toBe(0);
    expect(r.err).toBe('');
  });

  it('a column of only 1 (every unit failed) is named too', async () => {
    const p = file('ones.csv', `t,failed\n${TIMES.map((t) => `${t},1`).join('\n')}\n`);
    const r = await run([p, '--column', 't']);
    expect(r.err).toMatch(/column "failed" holds only 0 and 1/);
  });

  it('on a long file only the first rows are looked at, and the warning says so', async () => {
    const rows = Array.from({ length: HINT_ROWS + 50 }, (_, i) => `${100 + (i % 977)},${i % 2}`);
    const p = file('long.csv', `t,s\n${rows.join('\n')}\n`);
    const r = await run([p, '--column', 't', '--families', 'normal']);
    expect(r.code).toBe(0);
    expect(r.err).toMatch(new RegExp(`column "s" holds only 0 and 1 in its first ${HINT_ROWS} rows`));
  });
});

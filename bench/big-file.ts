/**
 * The 10^7-row file of issue 6, kept out of the test suite: writes a seeded 10^7-row CSV to the
 * system's temporary folder, runs the CLI on it as a user would (a separate process, --json), checks
 * the exit status and that every row was read and analysed, prints the wall time and the CLI's
 * peak resident memory (from /usr/bin/time when present, else not shown), then deletes the file.
 * Run: node --import tsx bench/big-file.ts [--rows N]
 */
import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, openSync, closeSync, rmSync, statSync, writeSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createRng } from '../core/index.js';

const i = process.argv.indexOf('--rows');
const ROWS = i > 0 ? Number(process.argv[i + 1]) : 10_000_000;
if (!Number.isSafeInteger(ROWS) || ROWS < 10) throw new Error('--rows needs a whole number ≥ 10');

const dir = mkdtempSync(join(tmpdir(), 'plumbline-big-'));
const file = join(dir, 'wear-hours.csv');
try {
  // Weibull(1.6, 900) hours with a blank line and an NA row every 10^6 rows (skipped and counted).
  const rng = createRng(7);
  const fd = openSync(file, 'w');
  writeSync(fd, 'unit,hours\r\n');
  let chunk = '';
  let markers = 0;
  const t0 = Date.now();
  for (let r = 0; r < ROWS; r++) {
    if (r > 0 && r % 1_000_000 === 0) {
      chunk += `m${r},NA\r\n\r\n`;
      markers++;
    }
    chunk += `u${r},${(Math.pow(rng.exponential(), 1 / 1.6) * 900).toFixed(3)}\r\n`;
    if (chunk.length > 1 << 20) {
      writeSync(fd, chunk);
      chunk = '';
    }
  }
  writeSync(fd, chunk);
  closeSync(fd);
  const bytes = statSync(file).size;
  console.log(`wrote ${ROWS} value rows + ${markers} NA rows + ${markers} blank lines, ${(bytes / 2 ** 20).toFixed(0)} MiB, in ${((Date.now() - t0) / 1000).toFixed(1)} s`);

  const timeBin = existsSync('/usr/bin/time') ? '/usr/bin/time' : null;
  const cli = [process.execPath, '--import', 'tsx', 'cli/main.ts', 'analyze', file, '--column', 'hours', '--skip-invalid', '--json'];
  const cmd = timeBin ? [timeBin, '-f', 'PEAK_RSS_KB=%M WALL=%e', ...cli] : cli;
  const started = Date.now();
  const child = spawn(cmd[0] as string, cmd.slice(1), { stdio: ['ignore', 'pipe', 'pipe'] });
  let out = '';
  let err = '';
  child.stdout.on('data', (d: Buffer) => (out += d.toString()));
  child.stderr.on('data', (d: Buffer) => (err += d.toString()));
  const code = await new Promise<number | null>((resolve) => child.on('close', resolve));
  const wall = (Date.now() - started) / 1000;
  const peak = /PEAK_RSS_KB=(\d+)/.exec(err);
  const report = code === 0 ? (JSON.parse(out) as { n: number; input: { rowsRead: number; skipped: { count: number }[]; blankLines: number }; candidates: { family: string }[] }) : null;
  console.log(`CLI exit ${code} in ${wall.toFixed(1)} s${peak ? `, peak resident memory ${(Number(peak[1]) / 1024).toFixed(0)} MiB` : ''}`);
  if (!report) {
    console.log(err.split('\n').slice(0, 3).join('\n'));
    process.exitCode = 1;
  } else {
    const skipped = report.input.skipped.reduce((s, x) => s + x.count, 0);
    const ok = report.n === ROWS && skipped === markers && report.input.rowsRead === ROWS + markers && report.input.blankLines === markers;
    console.log(`n = ${report.n}, rows read ${report.input.rowsRead}, skipped ${skipped}, blank lines ${report.input.blankLines}; best fit ${report.candidates[0]?.family}; accounting ${ok ? 'correct' : 'WRONG'}`);
    if (!ok) process.exitCode = 1;
  }
} finally {
  rmSync(dir, { recursive: true, force: true });
}

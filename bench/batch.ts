/**
 * `npm run bench` (second part): many series and large single series, measured.
 *
 *  1. 10,000 series × 50 values (long table `series,load`, gamma(shape 4) × 12.5, seeded) through the
 *     whole CLI process `plumbline analyze FILE --by series --column load --json` (five families,
 *     table p-values; JSON Lines to /dev/null), under /usr/bin/time; and the same per-series work in
 *     SciPy (scripts/bench-scipy-batch.py: five `fit`s, chi-square, A² per series) on the first
 *     SCIPY_SERIES series, its time scaled to all series (stated as such). Goal: ≤ 0.1 of SciPy.
 *  2. One series of 10^7 values (and 10^8 with --huge: a file of about 1.4 GB): the whole CLI process,
 *     wall, CPU and peak memory, read in pieces (cli/read-pieces.ts). Goals: 10^7 ≤ 8 × the 10^6 time
 *     and ≤ 400 MiB; 10^8 completes within 1.5 GiB.
 * Appends its table to bench/RESULTS.md under its own heading (replacing an earlier one).
 * Options: --no-build, --huge, --scipy-series N (default 200).
 */
import { spawnSync } from 'node:child_process';
import { closeSync, existsSync, mkdirSync, openSync, readFileSync, renameSync, writeFileSync, writeSync } from 'node:fs';
import { loadavg } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { createRng } from '../core/index.js';
import { timedProcess, type ProcRun } from './timed.js';

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..');
const DATA = join(ROOT, 'bench', 'data');
const CLI = join(ROOT, 'dist', 'cli', 'main.js');
const SEED = 20261204;
const argv = process.argv.slice(2);
const HUGE = argv.includes('--huge');
const at = argv.indexOf('--scipy-series');
const SCIPY_SERIES = at >= 0 ? Math.max(10, Number(argv[at + 1])) : 200;
const log = (s: string): void => void process.stdout.write(`${s}\n`);
const load = (): string => loadavg().map((x) => x.toFixed(1)).join(' / ');

/** Write `rows` lines produced by `line(i)` under `header` to `file` (once; reused while it exists). */
function writeOnce(file: string, header: string, rows: number, line: (i: number) => string): string {
  if (existsSync(file)) return file;
  mkdirSync(DATA, { recursive: true });
  const fd = openSync(`${file}.tmp`, 'w');
  let chunk = `${header}\n`;
  for (let i = 0; i < rows; i++) {
    chunk += `${line(i)}\n`;
    if (chunk.length > 1 << 22) {
      writeSync(fd, chunk);
      chunk = '';
    }
  }
  writeSync(fd, chunk);
  closeSync(fd);
  renameSync(`${file}.tmp`, file);
  return file;
}

const shell = (command: string): Promise<ProcRun> => timedProcess('sh', ['-c', `exec ${command}`], ROOT);

interface Row {
  what: string;
  wall: number;
  cpu: number;
  rssMiB: number;
  note: string;
}

async function main(): Promise<void> {
  if (!argv.includes('--no-build')) spawnSync('npm', ['run', 'build'], { cwd: ROOT, stdio: 'inherit' });
  const rows: Row[] = [];
  const loadStart = load();

  // 1. Many series.
  const series = 10_000;
  const per = 50;
  const rng = createRng(SEED, 1);
  const batchFile = writeOnce(join(DATA, `batch-seed${SEED}-${series}x${per}.csv`), 'series,load', series * per, (i) => `S${Math.floor(i / per)},${(12.5 * rng.gamma(4)).toFixed(5)}`);
  log(`batch: ${series} series × ${per} values (load ${load()})`);
  const ours = await shell(`node ${CLI} analyze ${batchFile} --by series --column load --json > /dev/null`);
  rows.push({ what: `CLI batch, ${series} series × ${per}`, wall: ours.wall, cpu: ours.cpu, rssMiB: ours.rssMiB, note: 'JSON Lines to /dev/null' });
  const py = spawnSync('python3', ['-c', 'import scipy'], { encoding: 'utf8' });
  if (py.status === 0) {
    const sci = await shell(`python3 scripts/bench-scipy-batch.py ${batchFile} ${SCIPY_SERIES}`);
    const scaled = (sci.wall * series) / SCIPY_SERIES;
    rows.push({ what: `SciPy loop, first ${SCIPY_SERIES} series`, wall: sci.wall, cpu: sci.cpu, rssMiB: sci.rssMiB, note: `scaled to ${series} series: ${scaled.toFixed(0)} s` });
    rows.push({ what: 'ratio ours / SciPy (scaled)', wall: ours.wall / scaled, cpu: Number.NaN, rssMiB: Number.NaN, note: 'goal ≤ 0.1' });
  } else rows.push({ what: 'SciPy', wall: Number.NaN, cpu: Number.NaN, rssMiB: Number.NaN, note: 'python3 with SciPy not found: skipped' });

  // 2. Large single series.
  const sizes = HUGE ? [1e6, 1e7, 1e8] : [1e6, 1e7];
  let t6 = Number.NaN;
  for (const n of sizes) {
    const r2 = createRng(SEED, n);
    const file = writeOnce(join(DATA, `single-seed${SEED}-n${n}.csv`), 'load', n, () => (12.5 * r2.gamma(4)).toFixed(5));
    log(`single series n = ${n} (load ${load()})`);
    const run = await shell(`node ${CLI} analyze ${file} --column load --json > /dev/null`);
    if (n === 1e6) t6 = run.wall;
    const goal = n === 1e7 ? `goal ≤ 8 × 10^6 time (${(run.wall / t6).toFixed(2)}×) and ≤ 400 MiB` : n === 1e8 ? 'goal: completes, ≤ 1.5 GiB' : '';
    rows.push({ what: `CLI single series n = ${n.toExponential(0)}`, wall: run.wall, cpu: run.cpu, rssMiB: run.rssMiB, note: goal });
  }

  const fmt = (x: number, d = 2): string => (Number.isFinite(x) ? x.toFixed(d) : '–');
  const table = [
    `## Batch and large series (bench/batch.ts), ${new Date().toISOString().slice(0, 16)}Z`,
    '',
    `Load average (1/5/15 min) at start ${loadStart}, at end ${load()}; 2 cores.`,
    '',
    '| what | wall s | CPU s | peak MiB | note |',
    '|---|---|---|---|---|',
    ...rows.map((r) => `| ${r.what} | ${fmt(r.wall, r.what.startsWith('ratio') ? 3 : 2)} | ${fmt(r.cpu)} | ${fmt(r.rssMiB, 0)} | ${r.note} |`),
    '',
  ].join('\n');
  log(table);
  const results = join(ROOT, 'bench', 'RESULTS.md');
  const before = existsSync(results) ? readFileSync(results, 'utf8') : '';
  const cut = before.indexOf('## Batch and large series');
  writeFileSync(results, `${(cut >= 0 ? before.slice(0, cut) : before).trimEnd()}\n\n${table}`);
}

void main();

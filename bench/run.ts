/**
 * `npm run bench` (issue 5): the speed targets, measured.
 *
 *  1. Seeded data: two-column CSVs (`part,load`) with 10^3, 10^4, 10^5 and 10^6 rows under
 *     bench/data/ (git-ignored; written once and reused while the seed and format stay the same).
 *     Values: gamma(shape 4) × 12.5 printed with 5 decimals, so all five families apply.
 *  2. CLI startup (`node dist/cli/main.js --version`), then the whole CLI process
 *     `node dist/cli/main.js analyze FILE --column load --json` for each n (five families, formula
 *     p-values), each run under /usr/bin/time for wall time, CPU time (user + system) and peak
 *     resident memory; medians over repeated runs. Runs `npm run build` first so that dist/ is the
 *     current source (--no-build to skip).
 *  3. In-process, warm: the full analysis of n = 10^4 values (core `analyze`, and the CLI's
 *     `analyzeDataset`), medians of wall and CPU time after warm-up.
 *  4. Bootstrap: B = 999 Anderson–Darling replicates for each of the five families at n = 1000, over
 *     the server's worker_threads pool (server/pool.ts) with 1 and 2 workers; the reports must be
 *     identical.
 *  5. Checks the hot paths against their straightforward forms: prepareSample's sort vs the
 *     built-in sort (element for element) and each family's A² from the batch logCdfSfInto vs
 *     per-point logCdf/logSf (10^4 and 10^6 rows); and checks that the CLI's JSON report (streamed CSV reader, prepared sample) equals, to 1e-12
 *     relative in every number, the analysis of a plain JS array read the straightforward way
 *     (split lines, Number() of each cell) for every n.
 *  6. When `python3` with SciPy is present: scripts/bench-scipy.py on the same 10^6-row file (five
 *     MLE fits, equiprobable chi-square and Anderson–Darling each), whole process, and the ratio.
 *     Skipped with a note otherwise.
 * Prints a table and writes it to bench/RESULTS.md.
 *
 * The machine is shared: the load average at start and end is recorded, and CPU time is given
 * beside wall time because it is less disturbed by other processes.
 * Options: --reps N (CLI runs per n, default 5), --quick (reps 3, skips 10^6 straightforward check
 * and SciPy), --no-build (use dist/ as it is).
 * Run: npm run bench [-- --reps 7]
 */
import { spawn, spawnSync } from 'node:child_process';
import { closeSync, existsSync, mkdirSync, openSync, readFileSync, writeFileSync, writeSync } from 'node:fs';
import { cpus, loadavg } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import {
  DEFAULT_FAMILIES,
  analyze,
  analyzeDataset,
  andersonDarlingStatistic,
  createRng,
  getFamily,
  prepareSample,
  finishAnalysis,
  planAnalysis,
  runBootstrapRange,
  type AnalysisReport,
} from '../core/index.js';
import type { WorkerPool as WorkerPoolType } from '../server/pool.js';
import { timedProcess, type ProcRun } from './timed.js';

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..');
const DATA = join(ROOT, 'bench', 'data');
const CLI = join(ROOT, 'dist', 'cli', 'main.js');
const SIZES = [1_000, 10_000, 100_000, 1_000_000] as const;
const SEED = 20261201;
const COLUMN = 'load';

const argv = process.argv.slice(2);
const QUICK = argv.includes('--quick');
const repsAt = argv.indexOf('--reps');
const REPS = repsAt >= 0 ? Math.max(1, Number(argv[repsAt + 1])) : QUICK ? 3 : 5;

const median = (xs: readonly number[]): number => {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? (s[m] as number) : ((s[m - 1] as number) + (s[m] as number)) / 2;
};
const load = (): string => loadavg().map((x) => x.toFixed(1)).join(' / ');
const log = (s: string): void => void process.stdout.write(`${s}\n`);

// ---------------------------------------------------------------- data
function dataFile(n: number): string {
  return join(DATA, `gamma4-seed${SEED}-n${n}.csv`);
}

function writeData(n: number): string {
  const file = dataFile(n);
  if (existsSync(file)) return file;
  mkdirSync(DATA, { recursive: true });
  const rng = createRng(SEED, n);
  const fd = openSync(`${file}.tmp`, 'w');
  let chunk = `part,${COLUMN}\n`;
  for (let r = 0; r < n; r++) {
    chunk += `P${r + 1},${(12.5 * rng.gamma(4)).toFixed(5)}\n`;
    if (chunk.length > 1 << 20) {
      writeSync(fd, chunk);
      chunk = '';
    }
  }
  writeSync(fd, chunk);
  closeSync(fd);
  spawnSync('mv', [`${file}.tmp`, file]);
  return file;
}

/** The straightforward read: split lines, split cells, Number() of the value cell. */
function plainValues(file: string): number[] {
  const lines = readFileSync(file, 'utf8').split('\n');
  const col = (lines[0] as string).split(',').indexOf(COLUMN);
  const out: number[] = [];
  for (let i = 1; i < lines.length; i++) {
    const line = lines[i] as string;
    if (line === '') continue;
    out.push(Number(line.split(',')[col]));
  }
  return out;
}

// ---------------------------------------------------------------- processes
const timed = (cmd: string, args: readonly string[]): Promise<ProcRun> => timedProcess(cmd, args, ROOT);

interface Row {
  readonly what: string;
  readonly wall: number;
  readonly cpu: number | null;
  readonly rssMiB: number | null;
  readonly target: string;
  readonly runs: number;
}
const rows: Row[] = [];
const notes: string[] = [];

async function repeated(what: string, cmd: string, args: readonly string[], reps: number, target: string): Promise<ProcRun[]> {
  const runs: ProcRun[] = [];
  for (let k = 0; k < reps; k++) runs.push(await timed(cmd, args));
  const row: Row = {
    what,
    wall: median(runs.map((r) => r.wall)),
    cpu: median(runs.map((r) => r.cpu)),
    rssMiB: median(runs.map((r) => r.rssMiB)),
    target,
    runs: reps,
  };
  rows.push(row);
  log(`  ${what}: wall ${fmtS(row.wall)}, CPU ${fmtS(row.cpu as number)}, peak RSS ${(row.rssMiB as number).toFixed(0)} MiB (median of ${reps}; walls ${runs.map((r) => r.wall.toFixed(2)).join(' ')})`);
  return runs;
}

const fmtS = (s: number): string => (s < 1 ? `${(s * 1000).toFixed(s < 0.1 ? 1 : 0)} ms` : `${s.toFixed(2)} s`);

// ---------------------------------------------------------------- identical results
/** Differences between two JSON values: numbers to `rel` relative, everything else exactly. */
function differences(a: unknown, b: unknown, path: string, rel: number, out: string[]): void {
  if (out.length > 10) return;
  if (typeof a === 'number' && typeof b === 'number') {
    if (a === b || (Number.isNaN(a) && Number.isNaN(b))) return;
    if (Math.abs(a - b) <= rel * Math.max(Math.abs(a), Math.abs(b))) return;
    out.push(`${path}: ${a} vs ${b}`);
    return;
  }
  if (Array.isArray(a) && Array.isArray(b)) {
    if (a.length !== b.length) out.push(`${path}: length ${a.length} vs ${b.length}`);
    else a.forEach((x, i) => differences(x, b[i], `${path}[${i}]`, rel, out));
    return;
  }
  if (a !== null && b !== null && typeof a === 'object' && typeof b === 'object') {
    const ka = Object.keys(a).sort();
    const kb = Object.keys(b).sort();
    if (ka.join() !== kb.join()) out.push(`${path}: keys ${ka.join()} vs ${kb.join()}`);
    else for (const k of ka) differences((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k], `${path}.${k}`, rel, out);
    return;
  }
  if (a !== b) out.push(`${path}: ${JSON.stringify(a)?.slice(0, 80)} vs ${JSON.stringify(b)?.slice(0, 80)}`);
}

function check(label: string, a: unknown, b: unknown): boolean {
  const diffs: string[] = [];
  differences(JSON.parse(JSON.stringify(a)), JSON.parse(JSON.stringify(b)), '$', 1e-12, diffs);
  const ok = diffs.length === 0;
  const line = `${label}: ${ok ? 'identical (1e-12 relative)' : `DIFFERENT: ${diffs.slice(0, 5).join('; ')}`}`;
  notes.push(line);
  log(`  ${line}`);
  if (!ok) process.exitCode = 1;
  return ok;
}

/**
 * The hot paths against their straightforward forms on the same data: the sample sorted by
 * prepareSample vs the built-in sort, and each family's A² from the batch form (logCdfSfInto)
 * vs per-point logCdf/logSf calls.
 */
function hotPathChecks(label: string, values: readonly number[]): void {
  const sample = prepareSample(values);
  const plainSorted = Float64Array.from(values).sort();
  let sortOk = sample.sorted.length === plainSorted.length;
  for (let i = 0; sortOk && i < plainSorted.length; i++) sortOk = Object.is(sample.sorted[i], plainSorted[i]);
  const a2s: Record<string, number> = {};
  const plain: Record<string, number> = {};
  for (const name of DEFAULT_FAMILIES) {
    const family = getFamily(name);
    if (family.applicable(sample)) continue;
    const fit = family.fit(sample);
    if (!fit.ok) continue;
    const dist = family.make(fit.parameters);
    a2s[name] = andersonDarlingStatistic(dist, sample.sorted);
    plain[name] = andersonDarlingStatistic({ logCdf: (x) => dist.logCdf(x), logSf: (x) => dist.logSf(x) }, sample.sorted);
  }
  if (!sortOk) {
    notes.push(`${label}: prepareSample order DIFFERS from Float64Array.prototype.sort`);
    process.exitCode = 1;
  }
  check(`${label}: sorted sample ${sortOk ? 'same as the built-in sort' : 'DIFFERENT'}; A² of each family, batch vs per-point logCdf/logSf`, a2s, plain);
}

// ---------------------------------------------------------------- in-process
function inProcess(what: string, f: () => unknown, warm: number, reps: number, target: string): void {
  for (let k = 0; k < warm; k++) f();
  const wall: number[] = [];
  const cpu: number[] = [];
  for (let k = 0; k < reps; k++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    f();
    wall.push((performance.now() - t0) / 1000);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1e6);
  }
  const row: Row = { what, wall: median(wall), cpu: median(cpu), rssMiB: null, target, runs: reps };
  rows.push(row);
  log(`  ${what}: wall ${fmtS(row.wall)}, CPU ${fmtS(row.cpu as number)} (median of ${reps} after ${warm} warm-up runs)`);
}

async function bootstrapCase(values: readonly number[]): Promise<void> {
  const opts = { pMethod: 'bootstrap' as const, bootstrapReplicates: 999 };
  const reports: AnalysisReport[] = [];
  for (const workers of [1, 2]) {
    // The built pool (dist/server), whose workers load the built core: the code the CLI runs too.
    const { WorkerPool } = (await import(join(ROOT, 'dist', 'server', 'pool.js'))) as { WorkerPool: typeof WorkerPoolType };
    const pool = new WorkerPool(workers);
    try {
      // Warm the pool once (the server keeps its workers), then time plan + replicates + finish.
      const c0 = performance.now();
      {
        const plan = planAnalysis(values, { ...opts, bootstrapReplicates: 20 });
        finishAnalysis(plan, await pool.run(plan.bootstrapJobs));
      }
      log(`  pool of ${workers} started and warmed in ${fmtS((performance.now() - c0) / 1000)}`);
      const reps = QUICK ? 2 : 3;
      const wall: number[] = [];
      const cpu: number[] = [];
      for (let k = 0; k < reps; k++) {
        const u0 = process.resourceUsage();
        const t0 = performance.now();
        // A new seed each repetition: the workers remember the replicates of parameter-free families
        // (core/gof/bootstrap-memo.ts), and a repeated seed would time the memo, not the bootstrap.
        const plan = planAnalysis(values, { ...opts, seed: 1000 + k });
        const report = finishAnalysis(plan, await pool.run(plan.bootstrapJobs));
        wall.push((performance.now() - t0) / 1000);
        const u = process.resourceUsage();
        // resourceUsage covers every thread of this process, so the workers' CPU is included.
        cpu.push((u.userCPUTime - u0.userCPUTime + u.systemCPUTime - u0.systemCPUTime) / 1e6);
        if (k === 0) reports.push(report);
      }
      const row: Row = { what: `bootstrap B = 999 × 5 families, n = 1000, ${workers} worker${workers > 1 ? 's' : ''}`, wall: median(wall), cpu: median(cpu), rssMiB: null, target: workers === 2 ? '≤ 2 s' : '', runs: reps };
      rows.push(row);
      log(`  ${row.what}: wall ${fmtS(row.wall)}, CPU (all threads) ${fmtS(row.cpu as number)} (median of ${reps}; walls ${wall.map((w) => w.toFixed(2)).join(' ')})`);
    } finally {
      await pool.close();
    }
  }
  check('bootstrap report, 1 worker vs 2 workers', reports[0], reports[1]);
  const inline = analyze(values, { ...opts, seed: 1000 }); // the seed of the first timed repetition
  check('bootstrap report, worker pool vs in-process analyze()', reports[0], inline);
}

/**
 * Cost of one bootstrap p-value (A² and chi-square together, as the analysis runs them): B = 999
 * replicates of a gamma sample, each drawn, refitted by maximum likelihood, A² and X² recomputed;
 * one thread, in-process (the worker pool splits the same ranges).
 */
function pValueBootstrapCases(): void {
  for (const n of [20, 200, 2000]) {
    const x = getFamily('gamma').random({ shape: 2, scale: 3 }, createRng(SEED, n), n);
    const plan = planAnalysis(x, { families: ['gamma'], pMethod: 'bootstrap', bootstrapReplicates: 999 });
    const c = plan.candidates[0];
    const job = plan.bootstrapJobs[0];
    if (!c || !job || !c.chiSquare.computable) throw new Error(`bench: no bootstrap job at n = ${n}`);
    const withChi = { ...job, chiSquare: { observed: c.chiSquare.statistic, k: c.chiSquare.k } };
    inProcess(`bootstrap p-values (A² + χ², B = 999, gamma), n = ${n.toLocaleString('en-US')}, 1 thread`, () => runBootstrapRange(withChi), 1, QUICK ? 1 : 3, '');
  }
}

// ---------------------------------------------------------------- SciPy
async function scipyCase(file: string, ours: number): Promise<void> {
  const probe = spawnSync('python3', ['-c', 'import scipy, numpy; print(scipy.__version__)'], { encoding: 'utf8' });
  if (probe.status !== 0) {
    notes.push('SciPy comparison skipped: python3 with SciPy not found.');
    log('  SciPy not found: skipped');
    return;
  }
  const reps = 3;
  const runs = await repeated(`SciPy ${probe.stdout.trim()} script, 10^6 rows (scripts/bench-scipy.py)`, 'python3', [join(ROOT, 'scripts', 'bench-scipy.py'), file, COLUMN], reps, '');
  const wall = median(runs.map((r) => r.wall));
  const line = `SciPy script / Plumbline CLI at 10^6 rows, median wall: ${(wall / ours).toFixed(1)}×`;
  notes.push(line);
  log(`  ${line}`);
}

// ---------------------------------------------------------------- main
async function main(): Promise<void> {
  const loadStart = load();
  log(`Plumbline bench — ${new Date().toISOString()}, node ${process.version}, ${cpus().length} CPUs, load average ${loadStart}`);
  if (!argv.includes('--no-build') || !existsSync(CLI)) {
    log('building dist/ (npm run build)…');
    const b = spawnSync('npm', ['run', 'build'], { cwd: ROOT, stdio: 'inherit' });
    if (b.status !== 0) throw new Error('npm run build failed');
  }
  log('data:');
  const files = SIZES.map((n) => writeData(n));
  log(`  ${files.map((f) => f.replace(`${ROOT}/`, '')).join(', ')}`);

  log('CLI startup and whole process:');
  await repeated('CLI startup (`--version`)', process.execPath, [CLI, '--version'], REPS, '');
  let wall6 = Number.NaN;
  for (let i = 0; i < SIZES.length; i++) {
    const n = SIZES[i] as number;
    const file = files[i] as string;
    const runs = await repeated(`CLI analyze, n = ${n.toLocaleString('en-US')}`, process.execPath, [CLI, 'analyze', file, '--column', COLUMN, '--json'], REPS, n === 1e6 ? '≤ 1.35 s, ≤ 300 MiB' : '');
    if (n === 1e6) wall6 = median(runs.map((r) => r.wall));
    if (n === 1e6 && QUICK) continue;
    const cli = JSON.parse((runs[0] as ProcRun).stdout) as Record<string, unknown>;
    delete cli.input;
    const plain = analyzeDataset({ values: plainValues(file) });
    check(`n = ${n}: CLI (streamed reader) vs analyzeDataset of a plain array`, cli, plain);
  }

  log('hot paths vs straightforward forms:');
  hotPathChecks('n = 10^4', plainValues(files[1] as string));
  if (!QUICK) hotPathChecks('n = 10^6', plainValues(files[3] as string));

  log('in-process, warm:');
  const v4 = plainValues(files[1] as string);
  const f4 = new Float64Array(v4);
  inProcess('in-process analyze(), n = 10^4, warm', () => analyze(f4), 10, 31, '≤ 50 ms');
  inProcess('in-process analyzeDataset() (CLI path), n = 10^4, warm', () => analyzeDataset({ values: f4 }), 10, 31, '');

  log('bootstrap:');
  await bootstrapCase(plainValues(files[0] as string));
  pValueBootstrapCases();

  log('SciPy:');
  if (QUICK) notes.push('SciPy comparison skipped (--quick).');
  else await scipyCase(files[3] as string, wall6);

  const loadEnd = load();
  const table = [
    '| case | median wall | median CPU | peak RSS | target | runs |',
    '|---|---:|---:|---:|---|---:|',
    ...rows.map((r) => `| ${r.what} | ${fmtS(r.wall)} | ${r.cpu === null ? '–' : fmtS(r.cpu)} | ${r.rssMiB === null ? '–' : `${r.rssMiB.toFixed(0)} MiB`} | ${r.target} | ${r.runs} |`),
  ].join('\n');
  const md = [
    '# Benchmark results',
    '',
    'Written by `npm run bench` (bench/run.ts); see that file for what each case measures.',
    '',
    `Measured ${new Date().toISOString()} with node ${process.version} on ${cpus().length} CPUs (${cpus()[0]?.model ?? 'unknown CPU'}); load average (1/5/15 min) ${loadStart} at start, ${loadEnd} at end. The machine was shared with other work, so wall times can be inflated; CPU time (user + system) is the steadier figure. CLI rows are whole processes (\`node dist/cli/main.js analyze FILE --column ${COLUMN} --json\`, five families, formula p-values) timed with /usr/bin/time; peak RSS is its maximum resident set size.`,
    '',
    table,
    '',
    ...notes.map((n) => `- ${n}`),
    '',
  ].join('\n');
  log('');
  log(table);
  for (const n of notes) log(`- ${n}`);
  writeFileSync(join(ROOT, 'bench', 'RESULTS.md'), md);
  log('\nwritten to bench/RESULTS.md');
}

await main();

/**
 * Size of the censored Anderson–Darling bootstrap p-value (core/life/bootstrap.ts): Weibull
 * lifetimes (shape 1.5, scale 100), n = 40 units, censored about 30 % or 70 % of the time either at
 * one fixed time (Type I) or at staggered withdrawal times (uniform on (0, W)); for each of R seeded
 * samples the Weibull is fitted by censored maximum likelihood and its bootstrap p-value (B
 * replicates, refitted) compared with α = 0.05. SE = √(0.05·0.95/R). The size is also split by
 * how the sample ends (its largest time a failure or a suspension), because the statistic's tail
 * after a last failure once made the two parts differ by a factor of 50 (docs/size-study.md).
 *
 *   npx tsx scripts/size-study-censored.ts [R=1000] [B=99] [--write]
 *
 * --write puts the table into docs/size-study.md (between its size-study:censored markers); the
 * cells can also run in separate processes and be merged (see the usage at the end).
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { getFamily } from '../core/families/index.js';
import { createRng } from '../core/random/index.js';
import { censoredGofBootstrap, fitCensored, prepareLifeData } from '../core/life/index.js';
import type { LifeData } from '../core/life/data.js';
import type { CensoredFitSuccess } from '../core/life/fit.js';
import { writeSection } from './size-study-write.js';

const SHAPE = 1.5;
const SCALE = 100;
const N = 40;
const SEED = 20261204;
/** Samples per cell whose single-bootstrap p-value the fixture keeps beside the deciding one. */
const FIRST_LEVEL_KEPT = 200;

/** Type I time T with P(X > T) = q. */
function fixedTime(q: number): number {
  return SCALE * Math.pow(-Math.log(q), 1 / SHAPE);
}

/** W with P(U·W < X) = q for U uniform, by bisection on a seeded Monte Carlo estimate (200,000 draws). */
export function staggeredWidth(q: number): number {
  const xs = getFamily('weibull').random({ shape: SHAPE, scale: SCALE }, createRng(SEED, 999999), 200000);
  const frac = (w: number): number => {
    let s = 0;
    for (const x of xs) s += Math.min(1, x / w);
    return s / xs.length;
  };
  let lo = 1;
  let hi = 1e6;
  for (let k = 0; k < 100; k++) {
    const mid = Math.sqrt(lo * hi);
    if (frac(mid) > q) lo = mid;
    else hi = mid;
  }
  return Math.sqrt(lo * hi);
}

/** Sample i of a cell: the data and its Weibull fit (null when the fit fails), from the cell's own stream. */
export function censoredSizeSample(kind: 'fixed' | 'staggered', q: number, i: number, w = kind === 'fixed' ? fixedTime(q) : staggeredWidth(q)): { data: LifeData; fit: CensoredFitSuccess | null; censored: number } {
  const rng = createRng(SEED + (kind === 'fixed' ? 0 : 100) + Math.round(q * 10), i);
  const life = getFamily('weibull').random({ shape: SHAPE, scale: SCALE }, rng, N);
  const times: number[] = [];
  const failed: number[] = [];
  let censored = 0;
  for (let j = 0; j < N; j++) {
    const c = kind === 'fixed' ? w : rng.uniform() * w;
    const x = life[j] as number;
    times.push(Math.min(x, c));
    failed.push(x <= c ? 1 : 0);
    if (x > c) censored++;
  }
  const data = prepareLifeData({ times, failed });
  const fit = fitCensored('weibull', data);
  return { data, fit: fit.ok ? fit : null, censored };
}

/** The p-value the analysis gives sample i of a cell (B replicates, seed 5000 + i), or null when the fit fails. */
export function censoredSizePValue(
  kind: 'fixed' | 'staggered',
  q: number,
  i: number,
  replicates: number,
  sample: ReturnType<typeof censoredSizeSample> = censoredSizeSample(kind, q, i),
): { pValue: number; firstLevelPValue: number; unrefitted: number; lastFailed: boolean } | null {
  const { data, fit } = sample;
  if (!fit) return null;
  const r = censoredGofBootstrap(fit, data, { replicates, seed: 5000 + i });
  return { pValue: r.pValue, firstLevelPValue: r.firstLevelPValue ?? r.pValue, unrefitted: r.failedReplicates, lastFailed: data.failed[N - 1] === 1 };
}

export function censoredSizeCell(
  kind: 'fixed' | 'staggered',
  q: number,
  samples: number,
  replicates: number,
): {
  rejected: number;
  samples: number;
  censoredShare: number;
  skipped: number;
  unrefitted: number;
  endsFailed: number;
  rejectedEndsFailed: number;
  /** The single (first-level) bootstrap's rejections on the same samples (staggered: the fast double bootstrap decides). */
  rejectedFirstLevel: number;
  /** Every sample's p-value times B + 1 (a whole number), null where the fit failed. */
  pCounts: (number | null)[];
  /** The same for the single (first-level) bootstrap p-value. */
  firstLevelCounts: (number | null)[];
} {
  const w = kind === 'fixed' ? fixedTime(q) : staggeredWidth(q);
  let rejected = 0;
  let censored = 0;
  let skipped = 0;
  let unrefitted = 0;
  let endsFailed = 0;
  let rejectedEndsFailed = 0;
  let rejectedFirstLevel = 0;
  const pCounts: (number | null)[] = [];
  const firstLevelCounts: (number | null)[] = [];
  for (let i = 0; i < samples; i++) {
    const sample = censoredSizeSample(kind, q, i, w);
    censored += sample.censored;
    const r = censoredSizePValue(kind, q, i, replicates, sample);
    if (!r) {
      skipped++;
      pCounts.push(null);
      firstLevelCounts.push(null);
      continue;
    }
    pCounts.push(Math.round(r.pValue * (replicates + 1)));
    firstLevelCounts.push(Math.round(r.firstLevelPValue * (replicates + 1)));
    unrefitted += r.unrefitted;
    if (r.lastFailed) endsFailed++;
    if (r.firstLevelPValue <= 0.05) rejectedFirstLevel++;
    if (r.pValue <= 0.05) {
      rejected++; // the analysis's rule for a Monte Carlo p-value
      if (r.lastFailed) rejectedEndsFailed++;
    }
    if (process.env.SIZE_STUDY_PROGRESS && (i + 1) % 1000 === 0) console.error(`${kind} ${q}: ${i + 1} samples, ${rejected} rejected`);
  }
  return { rejected, samples: samples - skipped, censoredShare: censored / (samples * N), skipped, unrefitted, endsFailed, rejectedEndsFailed, rejectedFirstLevel, pCounts, firstLevelCounts };
}

type CellResult = ReturnType<typeof censoredSizeCell> & { kind: 'fixed' | 'staggered'; q: number };

const CELLS: readonly ['fixed' | 'staggered', number][] = [
  ['fixed', 0.3],
  ['fixed', 0.7],
  ['staggered', 0.3],
  ['staggered', 0.7],
];

function table(results: readonly CellResult[], samples: number, replicates: number, seconds: number): string {
  const part = (k: number, m: number): string => (m > 0 ? `${((100 * k) / m).toFixed(1)} (${m})` : '— (0)');
  const lines = [
    '| censoring | target censored | censored (measured) | samples | p-value that decides | A² size % | samples ending in a failure: size % (count) | ending in a suspension: size % (count) | single bootstrap on the same samples: size % | unrefitted replicates | SE % |',
    '|---|---|---|---|---|---|---|---|---|---|---|',
  ];
  for (const r of results) {
    const se = 100 * Math.sqrt((0.05 * 0.95) / r.samples);
    const size = r.rejected / r.samples;
    const fdb = r.kind === 'staggered';
    lines.push(
      `| ${r.kind} | ${100 * r.q} % | ${(100 * r.censoredShare).toFixed(1)} % | ${r.samples}${r.skipped ? ` (+${r.skipped} not fitted)` : ''} | ${fdb ? 'fast double bootstrap' : 'bootstrap'} | ${(100 * size).toFixed(2)}${Math.abs(size - 0.05) > 0.005 ? ' ⚠' : ''} | ${part(r.rejectedEndsFailed, r.endsFailed)} | ${part(r.rejected - r.rejectedEndsFailed, r.samples - r.endsFailed)} | ${fdb ? (100 * r.rejectedFirstLevel / r.samples).toFixed(2) : '—'} | ${r.unrefitted} | ${se.toFixed(2)} |`,
    );
  }
  lines.push(
    `\nWeibull shape ${SHAPE}, scale ${SCALE}, n = ${N}; R = ${samples}, B = ${replicates}, α = 0.05, seed ${SEED}; ${seconds.toFixed(0)} s of run time. ⚠ marks a size more than 0.5 points from 5 %. Staggered withdrawals: the fast double bootstrap decides (core/life/fast-double-bootstrap.ts); the single bootstrap's size on the same samples and replicates is beside it.`,
  );
  return lines.join('\n');
}

/**
 *   npx tsx scripts/size-study-censored.ts R B [--write]                 all four cells in one process
 *   npx tsx scripts/size-study-censored.ts R B --cells 0,1 --out a.json  some cells (indexes into CELLS), results to a file
 *   npx tsx scripts/size-study-censored.ts --merge a.json b.json [--write] [--fixture F]  one table from the files (cells in CELLS order)
 *   npx tsx scripts/size-study-censored.ts --cost    CPU of one staggered p-value (B = 999) at n = 20, 200, 2000
 *   --fixture F (whole runs and --merge): every sample's p-value by cell into F (test/fixtures/censored-size.json)
 */
if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const argv = process.argv.slice(2);
  const flag = (name: string): string | undefined => {
    const i = argv.indexOf(name);
    return i >= 0 ? argv[i + 1] : undefined;
  };
  const write = argv.includes('--write');
  const fixture = flag('--fixture');
  /** The committed fixture test/life/censored-size.test.ts reads: every sample's p-value (times B + 1) by cell. */
  const writeFixture = (results: readonly CellResult[], replicates: number): void => {
    if (!fixture) return;
    // The single bootstrap's p-values of the first FIRST_LEVEL_KEPT samples only (the test reproduces samples where the two differ).
    const cells = results.map((r) => ({
      kind: r.kind,
      q: r.q,
      samples: r.samples,
      skipped: r.skipped,
      rejected: r.rejected,
      rejectedFirstLevel: r.rejectedFirstLevel,
      pCounts: r.pCounts,
      firstLevelCounts: r.firstLevelCounts.slice(0, FIRST_LEVEL_KEPT),
    }));
    writeFileSync(fixture, `${JSON.stringify({ generator: 'scripts/size-study-censored.ts', alpha: 0.05, replicates, seed: SEED, shape: SHAPE, scale: SCALE, n: N, cells })}\n`);
  };
  if (argv[0] === '--cost') {
    // CPU time of one staggered-withdrawal p-value (the fast double bootstrap, B = 999, Weibull, one
    // thread) at n = 20, 200, 2000: a sample of the study's staggered 30 % design scaled to n units.
    const w = staggeredWidth(0.3);
    for (const n of [20, 200, 2000]) {
      const rng = createRng(SEED + 777, n);
      const life = getFamily('weibull').random({ shape: SHAPE, scale: SCALE }, rng, n);
      const times = Array.from(life, (x) => Math.min(x, rng.uniform() * w));
      const failed = Array.from(life, (x, j) => (x <= (times[j] as number) ? 1 : 0));
      const data = prepareLifeData({ times, failed });
      const fit = fitCensored('weibull', data);
      if (!fit.ok) throw new Error(`cost: no fit at n = ${n}`);
      const cpu: number[] = [];
      for (let k = 0; k < 3; k++) {
        const c0 = process.cpuUsage();
        censoredGofBootstrap(fit, data, { replicates: 999, seed: 1 + k });
        const c1 = process.cpuUsage(c0);
        cpu.push((c1.user + c1.system) / 1e6);
      }
      console.log(`n = ${n}: CPU ${cpu.map((x) => x.toFixed(2)).join(', ')} s (3 runs, B = 999, fast double bootstrap)`);
    }
  } else if (argv[0] === '--merge') {
    const files = argv.slice(1).filter((a, i, all) => a !== '--write' && a !== '--fixture' && all[i - 1] !== '--fixture');
    const parts = files.map((f) => JSON.parse(readFileSync(f, 'utf8')) as { samples: number; replicates: number; seconds: number; results: CellResult[] });
    const results = parts.flatMap((p) => p.results).sort((a, b) => CELLS.findIndex(([k, q]) => k === a.kind && q === a.q) - CELLS.findIndex(([k, q]) => k === b.kind && q === b.q));
    const text = table(results, parts[0]!.samples, parts[0]!.replicates, parts.reduce((a, p) => a + p.seconds, 0));
    console.log(text);
    if (write) writeSection('censored', text);
    writeFixture(results, parts[0]!.replicates);
  } else {
    const samples = Number(argv[0] ?? 1000);
    const replicates = Number(argv[1] ?? 99);
    const which = (flag('--cells') ?? '0,1,2,3').split(',').map(Number);
    const out = flag('--out');
    const started = Date.now();
    const results: CellResult[] = [];
    for (const c of which) {
      const [kind, q] = CELLS[c]!;
      results.push({ kind, q, ...censoredSizeCell(kind, q, samples, replicates) });
      console.error(`${kind} ${q}: done`);
    }
    const seconds = (Date.now() - started) / 1000;
    if (out) writeFileSync(out, JSON.stringify({ samples, replicates, seconds, results }));
    const text = table(results, samples, replicates, seconds);
    console.log(text);
    if (write && !out) writeSection('censored', text);
    if (!out) writeFixture(results, replicates);
  }
}

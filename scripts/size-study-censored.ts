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
import { writeSection } from './size-study-write.js';

const SHAPE = 1.5;
const SCALE = 100;
const N = 40;
const SEED = 20261204;

/** Type I time T with P(X > T) = q. */
function fixedTime(q: number): number {
  return SCALE * Math.pow(-Math.log(q), 1 / SHAPE);
}

/** W with P(U·W < X) = q for U uniform, by bisection on a seeded Monte Carlo estimate (200,000 draws). */
function staggeredWidth(q: number): number {
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

export function censoredSizeCell(
  kind: 'fixed' | 'staggered',
  q: number,
  samples: number,
  replicates: number,
): { rejected: number; samples: number; censoredShare: number; skipped: number; unrefitted: number; endsFailed: number; rejectedEndsFailed: number } {
  const w = kind === 'fixed' ? fixedTime(q) : staggeredWidth(q);
  let rejected = 0;
  let censored = 0;
  let skipped = 0;
  let unrefitted = 0;
  let endsFailed = 0;
  let rejectedEndsFailed = 0;
  for (let i = 0; i < samples; i++) {
    const rng = createRng(SEED + (kind === 'fixed' ? 0 : 100) + Math.round(q * 10), i);
    const life = getFamily('weibull').random({ shape: SHAPE, scale: SCALE }, rng, N);
    const times: number[] = [];
    const failed: number[] = [];
    for (let j = 0; j < N; j++) {
      const c = kind === 'fixed' ? w : rng.uniform() * w;
      const x = life[j] as number;
      times.push(Math.min(x, c));
      failed.push(x <= c ? 1 : 0);
      if (x > c) censored++;
    }
    const data = prepareLifeData({ times, failed });
    const fit = fitCensored('weibull', data);
    if (!fit.ok) {
      skipped++;
      continue;
    }
    const r = censoredGofBootstrap(fit, data, { replicates, seed: 5000 + i });
    unrefitted += r.failedReplicates;
    const lastFailed = data.failed[N - 1] === 1;
    if (lastFailed) endsFailed++;
    if (r.pValue <= 0.05) {
      rejected++; // the analysis's rule for a Monte Carlo p-value
      if (lastFailed) rejectedEndsFailed++;
    }
    if (process.env.SIZE_STUDY_PROGRESS && (i + 1) % 1000 === 0) console.error(`${kind} ${q}: ${i + 1} samples, ${rejected} rejected`);
  }
  return { rejected, samples: samples - skipped, censoredShare: censored / (samples * N), skipped, unrefitted, endsFailed, rejectedEndsFailed };
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
    '| censoring | target censored | censored (measured) | samples | A² size % | samples ending in a failure: size % (count) | ending in a suspension: size % (count) | unrefitted replicates | SE % |',
    '|---|---|---|---|---|---|---|---|---|',
  ];
  for (const r of results) {
    const se = 100 * Math.sqrt((0.05 * 0.95) / r.samples);
    const size = r.rejected / r.samples;
    lines.push(
      `| ${r.kind} | ${100 * r.q} % | ${(100 * r.censoredShare).toFixed(1)} % | ${r.samples}${r.skipped ? ` (+${r.skipped} not fitted)` : ''} | ${(100 * size).toFixed(2)}${Math.abs(size - 0.05) > 0.005 ? ' ⚠' : ''} | ${part(r.rejectedEndsFailed, r.endsFailed)} | ${part(r.rejected - r.rejectedEndsFailed, r.samples - r.endsFailed)} | ${r.unrefitted} | ${se.toFixed(2)} |`,
    );
  }
  lines.push(
    `\nWeibull shape ${SHAPE}, scale ${SCALE}, n = ${N}; R = ${samples}, B = ${replicates}, α = 0.05, seed ${SEED}; ${seconds.toFixed(0)} s of run time. ⚠ marks a size more than 0.5 points from 5 %.`,
  );
  return lines.join('\n');
}

/**
 *   npx tsx scripts/size-study-censored.ts R B [--write]                 all four cells in one process
 *   npx tsx scripts/size-study-censored.ts R B --cells 0,1 --out a.json  some cells (indexes into CELLS), results to a file
 *   npx tsx scripts/size-study-censored.ts --merge a.json b.json [--write]  one table from the files (cells in CELLS order)
 */
if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const argv = process.argv.slice(2);
  const flag = (name: string): string | undefined => {
    const i = argv.indexOf(name);
    return i >= 0 ? argv[i + 1] : undefined;
  };
  const write = argv.includes('--write');
  if (argv[0] === '--merge') {
    const files = argv.slice(1).filter((a) => a !== '--write');
    const parts = files.map((f) => JSON.parse(readFileSync(f, 'utf8')) as { samples: number; replicates: number; seconds: number; results: CellResult[] });
    const results = parts.flatMap((p) => p.results).sort((a, b) => CELLS.findIndex(([k, q]) => k === a.kind && q === a.q) - CELLS.findIndex(([k, q]) => k === b.kind && q === b.q));
    const text = table(results, parts[0]!.samples, parts[0]!.replicates, Math.max(...parts.map((p) => p.seconds)));
    console.log(text);
    if (write) writeSection('censored', text);
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
  }
}

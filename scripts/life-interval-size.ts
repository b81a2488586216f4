/**
 * Size of the inspection-scheme Anderson–Darling bootstrap for interval-censored life data
 * (core/life/interval-bootstrap.ts). Weibull lifetimes (shape 2, scale 100), n = 50 units, observed
 * through inspections in one of two ways:
 *   case2:    each unit is inspected at its own two times U ~ uniform(20, 120), V = U + uniform(10, 60)
 *             (the scheme the bootstrap assumes: the rows record every inspection there was);
 *   periodic: every unit is inspected every 25 h up to 150 h, and its row records only the two
 *             inspections around its failure (a denser schedule than the rows show: the bootstrap's
 *             assumption does not hold, measured to see what that costs).
 * For each of R seeded samples the Weibull is fitted by interval maximum likelihood, its p-value
 * computed with B refitted replicates, and rejected at p ≤ α = 0.05 (α(B + 1) whole for B = 39 or 99).
 * The share rejected estimates the size; its binomial SE is √(0.05·0.95/R).
 *
 *   npx tsx scripts/life-interval-size.ts 200 39 case2 > a.json; npx tsx scripts/life-interval-size.ts 200 39 periodic > b.json
 *   npx tsx scripts/life-interval-size.ts --merge a.json b.json > test/fixtures/life-interval-size.json
 *
 * test/life/interval-gof.test.ts reads the committed JSON and reproduces the first sample of each cell.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { createRng, getFamily } from '../core/index.js';
import { fitInterval, intervalGofBootstrap, prepareIntervalLifeData, type IntervalLifeData } from '../core/life/index.js';

export const SIZE_SHAPE = 2;
export const SIZE_SCALE = 100;
export const SIZE_N = 50;
export const SIZE_SEED = 20261204;
export type SizeScheme = 'case2' | 'periodic';

/** Sample i of a cell: the units' rows as interval data. */
export function sizeSample(scheme: SizeScheme, i: number): IntervalLifeData {
  const rng = createRng(SIZE_SEED + (scheme === 'case2' ? 0 : 1), i);
  const life = getFamily('weibull').random({ shape: SIZE_SHAPE, scale: SIZE_SCALE }, rng, SIZE_N);
  const start: number[] = [];
  const end: number[] = [];
  for (const t of life) {
    if (scheme === 'case2') {
      const u = 20 + 100 * rng.uniform();
      const v = u + 10 + 50 * rng.uniform();
      if (t <= u) start.push(0), end.push(u);
      else if (t <= v) start.push(u), end.push(v);
      else start.push(v), end.push(Number.POSITIVE_INFINITY);
    } else {
      const k = Math.ceil(t / 25);
      if (k > 6) start.push(150), end.push(Number.POSITIVE_INFINITY);
      else start.push(25 * (k - 1)), end.push(25 * k);
    }
  }
  return prepareIntervalLifeData({ start, end });
}

/** The p-value of sample i (null when the Weibull fit fails). */
export function sizePValue(scheme: SizeScheme, i: number, replicates: number): number | null {
  const data = sizeSample(scheme, i);
  const fit = fitInterval('weibull', data);
  if (!fit.ok) return null;
  return intervalGofBootstrap('weibull', fit.parameters, data, { replicates, seed: SIZE_SEED + 17 * i }).pValue;
}

export interface SizeCell {
  readonly scheme: SizeScheme;
  readonly samples: number;
  readonly skipped: number;
  readonly rejected: number;
  readonly size: number;
  readonly standardError: number;
  readonly firstPValues: readonly number[];
}

function runCell(scheme: SizeScheme, R: number, B: number, alpha: number): SizeCell {
  let rejected = 0;
  let skipped = 0;
  const first: number[] = [];
  for (let i = 0; i < R; i++) {
    const p = sizePValue(scheme, i, B);
    if (p === null) {
      skipped++;
      continue;
    }
    if (i < 3) first.push(p);
    if (p <= alpha) rejected++;
    if ((i + 1) % 25 === 0) process.stderr.write(`${scheme}: ${i + 1}/${R}, rejected ${rejected}\n`);
  }
  const m = R - skipped;
  return { scheme, samples: m, skipped, rejected, size: rejected / m, standardError: Math.sqrt((alpha * (1 - alpha)) / m), firstPValues: first };
}

/**
 * npx tsx scripts/life-interval-size.ts R B [case2|periodic] — one cell (or both) as JSON;
 * npx tsx scripts/life-interval-size.ts --merge a.json b.json — the cells of separate runs in one file
 * (so the two cells can run side by side on two cores).
 */
function main(): void {
  const alpha = 0.05;
  if (process.argv[2] === '--merge') {
    const parts = process.argv.slice(3).map((f) => JSON.parse(readFileSync(f, 'utf8')) as { replicates: number; cells: SizeCell[] });
    if (new Set(parts.map((x) => x.replicates)).size !== 1) throw new Error('the runs to merge used different replicates');
    process.stdout.write(`${JSON.stringify({ ...parts[0], cells: parts.flatMap((x) => x.cells) }, null, 2)}\n`);
    return;
  }
  const R = Number(process.argv[2] ?? 400);
  const B = Number(process.argv[3] ?? 99);
  const schemes: SizeScheme[] = process.argv[4] ? [process.argv[4] as SizeScheme] : ['case2', 'periodic'];
  const out = {
    generator: 'scripts/life-interval-size.ts',
    model: { family: 'weibull', shape: SIZE_SHAPE, scale: SIZE_SCALE, n: SIZE_N, seed: SIZE_SEED },
    alpha,
    replicates: B,
    rule: 'reject at p <= alpha (alpha(B + 1) whole); SE = sqrt(0.05*0.95/samples)',
    cells: schemes.map((x) => runCell(x, R, B, alpha)),
  };
  process.stdout.write(`${JSON.stringify(out, null, 2)}\n`);
}

if (process.argv[1] === fileURLToPath(import.meta.url)) main();

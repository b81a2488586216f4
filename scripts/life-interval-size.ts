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
 *   nice -n 10 npx tsx scripts/life-interval-size.ts 0 500 39 case2 > c0.json   (samples 0-499; and so on)
 *   npx tsx scripts/life-interval-size.ts --merge c*.json p*.json > test/fixtures/life-interval-size.json
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
  /** Every sample's p-value in sample order (null: the Weibull fit failed), so the uniformity can be checked too. */
  readonly pValues: readonly (number | null)[];
}

/** A cell from the p-values of samples 0, 1, ... (in order). */
export function cellOf(scheme: SizeScheme, pValues: readonly (number | null)[], alpha: number): SizeCell {
  const ok = pValues.filter((p): p is number => p !== null);
  const rejected = ok.filter((p) => p <= alpha).length;
  const m = ok.length;
  return {
    scheme,
    samples: m,
    skipped: pValues.length - m,
    rejected,
    size: rejected / m,
    standardError: Math.sqrt((alpha * (1 - alpha)) / m),
    firstPValues: pValues.slice(0, 3).map((p) => p ?? Number.NaN),
    pValues,
  };
}

/** Samples [from, to) of a cell. */
function runRange(scheme: SizeScheme, from: number, to: number, B: number): (number | null)[] {
  const ps: (number | null)[] = [];
  for (let i = from; i < to; i++) {
    ps.push(sizePValue(scheme, i, B));
    if ((i + 1) % 25 === 0) process.stderr.write(`${scheme}: ${i + 1}/${to}\n`);
  }
  return ps;
}

interface Part {
  readonly scheme: SizeScheme;
  readonly replicates: number;
  readonly from: number;
  readonly pValues: (number | null)[];
}

/**
 * npx tsx scripts/life-interval-size.ts FROM TO B case2|periodic > part.json — samples [FROM, TO) of
 * one cell (so a long run goes in resumable pieces, two at a time on two cores);
 * npx tsx scripts/life-interval-size.ts --merge part*.json — the cells from contiguous pieces.
 */
function main(): void {
  const alpha = 0.05;
  if (process.argv[2] === '--merge') {
    const parts = process.argv.slice(3).map((f) => JSON.parse(readFileSync(f, 'utf8')) as Part);
    if (new Set(parts.map((x) => x.replicates)).size !== 1) throw new Error('the runs to merge used different replicates');
    const cells: SizeCell[] = [];
    for (const scheme of ['case2', 'periodic'] as const) {
      const mine = parts.filter((x) => x.scheme === scheme).sort((a, b) => a.from - b.from);
      if (mine.length === 0) continue;
      const ps: (number | null)[] = [];
      for (const x of mine) {
        if (x.from !== ps.length) throw new Error(`${scheme}: pieces are not contiguous (a piece starts at ${x.from}, expected ${ps.length})`);
        ps.push(...x.pValues);
      }
      cells.push(cellOf(scheme, ps, alpha));
    }
    const out = {
      generator: 'scripts/life-interval-size.ts',
      model: { family: 'weibull', shape: SIZE_SHAPE, scale: SIZE_SCALE, n: SIZE_N, seed: SIZE_SEED },
      alpha,
      replicates: parts[0]!.replicates,
      rule: 'reject at p <= alpha (alpha(B + 1) whole); SE = sqrt(0.05*0.95/samples)',
      cells,
    };
    process.stdout.write(`${JSON.stringify(out, null, 1)}\n`);
    return;
  }
  const from = Number(process.argv[2]);
  const to = Number(process.argv[3]);
  const B = Number(process.argv[4] ?? 39);
  const scheme = process.argv[5] as SizeScheme;
  if (!(Number.isInteger(from) && Number.isInteger(to) && to > from && (scheme === 'case2' || scheme === 'periodic'))) {
    throw new Error('usage: life-interval-size.ts FROM TO B case2|periodic  |  --merge part.json ...');
  }
  const part: Part = { scheme, replicates: B, from, pValues: runRange(scheme, from, to, B) };
  process.stdout.write(`${JSON.stringify(part)}\n`);
}

if (process.argv[1] === fileURLToPath(import.meta.url)) main();

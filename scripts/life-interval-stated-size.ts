/**
 * Size of the inspection-scheme Anderson–Darling bootstrap (core/life/interval-bootstrap.ts) when
 * each unit's inspection schedule is STATED (IntervalLifeInput.inspections, the inspection-times
 * column), so that the bootstrap inspects every unit at exactly its own times
 * (core/life/interval-inspection-scheme.ts, scheme 'stated'). Weibull lifetimes (scale 100), n = 50
 * units, each on a schedule of its own, independent of its life:
 *   ownk:  first inspection at uniform(5, 50), then gaps of uniform(20, 60) up to 250; the row keeps
 *          the two inspections around the failure (a left row before the first, a suspension at the
 *          last), the schedule column lists all of them (also those due after the failure was found)
 *          — the design in which the rows alone hide inspections (scripts/life-interval-size.ts ownk
 *          cells: A² rejected 0 of 600 at α = 5 % with the scheme rebuilt from the rows);
 *   case2: two inspections per unit, U ~ uniform(20, 120), V = U + uniform(10, 60), both listed.
 * For each of R seeded samples the Weibull is fitted by interval maximum likelihood, its p-value
 * computed with B refitted replicates, and rejected at p ≤ α = 0.05 (α(B + 1) whole for B = 39).
 * Size = share rejected; SE = √(0.05·0.95/R), the Monte Carlo error if the size were 5 %.
 *
 *   nice -n 10 npx tsx scripts/life-interval-stated-size.ts 0 500 39 ownk-2 > s0.json   (and so on)
 *   npx tsx scripts/life-interval-stated-size.ts --merge s*.json > test/fixtures/life-interval-stated-size.json
 * test/life/interval-stated-schedule.test.ts reads the committed JSON and reproduces the first samples.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { createRng, getFamily } from '../core/index.js';
import { fitInterval, intervalGofBootstrap, prepareIntervalLifeData, type IntervalLifeData } from '../core/life/index.js';
import { sizeFixture, SIZE_N, SIZE_SCALE, SIZE_SEED, type Part } from './life-interval-size.js';

export const STATED_CELLS = ['ownk-2', 'ownk-0.8', 'case2-2'] as const;
export type StatedCell = (typeof STATED_CELLS)[number];

/** Sample i of a cell: rows (start, end) and each row's stated schedule (seed stream SIZE_SEED + 300 + the cell's index). */
export function statedSample(cell: StatedCell, i: number): IntervalLifeData {
  const [design, shapeText] = cell.split('-') as [string, string];
  const rng = createRng(SIZE_SEED + 300 + STATED_CELLS.indexOf(cell), i);
  const life = getFamily('weibull').random({ shape: Number(shapeText), scale: SIZE_SCALE }, rng, SIZE_N);
  const start: number[] = [];
  const end: number[] = [];
  const inspections: number[][] = [];
  for (const t of life) {
    const times: number[] = [];
    if (design === 'case2') {
      const u = 20 + 100 * rng.uniform();
      times.push(u, u + 10 + 50 * rng.uniform());
    } else {
      for (let x = 5 + 45 * rng.uniform(); x <= 250; x += 20 + 40 * rng.uniform()) times.push(x);
    }
    const k = times.findIndex((x) => t <= x);
    if (k < 0) start.push(times[times.length - 1] as number), end.push(Number.POSITIVE_INFINITY);
    else start.push(k === 0 ? 0 : (times[k - 1] as number)), end.push(times[k] as number);
    inspections.push(times);
  }
  return prepareIntervalLifeData({ start, end, inspections });
}

/** The A² p-value of sample i (null when the Weibull fit fails). */
export function statedPValue(cell: StatedCell, i: number, replicates: number): number | null {
  const data = statedSample(cell, i);
  const fit = fitInterval('weibull', data);
  if (!fit.ok) return null;
  return intervalGofBootstrap('weibull', fit.parameters, data, { replicates, seed: SIZE_SEED + 17 * i }).pValue;
}

function main(): void {
  const alpha = 0.05;
  if (process.argv[2] === '--merge') {
    const parts = process.argv.slice(3).map((f) => JSON.parse(readFileSync(f, 'utf8')) as Part);
    const model = { family: 'weibull', scale: SIZE_SCALE, n: SIZE_N, seed: SIZE_SEED, statistic: 'Anderson–Darling A², each unit inspected at its stated times', cells: 'DESIGN-SHAPE; designs in the script header' };
    process.stdout.write(sizeFixture('scripts/life-interval-stated-size.ts', model, parts, STATED_CELLS, alpha));
    return;
  }
  const from = Number(process.argv[2]);
  const to = Number(process.argv[3]);
  const B = Number(process.argv[4] ?? 39);
  const cell = process.argv[5] as StatedCell;
  if (!(Number.isInteger(from) && Number.isInteger(to) && to > from && STATED_CELLS.includes(cell))) {
    throw new Error(`usage: life-interval-stated-size.ts FROM TO B ${STATED_CELLS.join('|')}  |  --merge part.json ...`);
  }
  const ps: (number | null)[] = [];
  for (let i = from; i < to; i++) {
    ps.push(statedPValue(cell, i, B));
    if ((i + 1) % 50 === 0) process.stderr.write(`${cell}: ${i + 1}/${to}\n`);
  }
  const part: Part = { scheme: cell, replicates: B, from, pValues: ps };
  process.stdout.write(`${JSON.stringify(part)}\n`);
}

if (process.argv[1] === fileURLToPath(import.meta.url)) main();

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
 * (Those two cells bootstrap A²: the case2 cell is where A² was measured conservative, 2.4 %, which
 * is why own-times rows now use the likelihood ratio; sizePValue forces A² to reproduce them.)
 *
 * The likelihood-ratio test against the Turnbull estimate (core/life/interval-likelihood-ratio.ts),
 * the candidate for own-times rows (not adopted: core/life/interval-gof-design.ts), is measured in the cells own2|own2e|ownk-SHAPE-N (Weibull scale 100, shape 0.8
 * or 2, n = 30 or 100), each unit on its own inspection times, independent of its life:
 *   own2: two inspections per unit, U ~ uniform(20, 120), V = U + uniform(10, 60) (case 2: the rows
 *         record every inspection there was, the scheme the bootstrap assumes);
 *   own2e: the same with skewed times, U = 10 + exponential(mean 60), V = U + 5 + exponential(mean 40)
 *         (a second case-2 law: a long tail of late first inspections and of wide gaps);
 *   ownk: a schedule of its own per unit: first inspection at uniform(5, 50), then gaps of
 *         uniform(20, 60) up to 250; the row records only the two inspections around the failure
 *         (left row before the first, a suspension at the last), so the unit had more inspections
 *         than its row shows (mixed-case interval censoring, Schick & Yu 2000, Scand. J. Statist.
 *         27:45-55 [from memory]) and the bootstrap's imputed scheme is only an approximation.
 * and A² on the ownk samples (cells a2-ownk-SHAPE-N: the same samples and seeds), what the product
 * shows for information on such rows.
 *   nice -n 10 npx tsx scripts/life-interval-size.ts 0 500 39 own2-0.8-30 > o0.json   (and so on)
 *   npx tsx scripts/life-interval-size.ts --merge o*.json > test/fixtures/life-interval-lr-size.json
 * test/life/interval-gof-size.test.ts reads that JSON too and reproduces each cell's first sample.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { createRng, getFamily } from '../core/index.js';
import { fitInterval, intervalGofBootstrap, prepareIntervalLifeData, type IntervalLifeData } from '../core/life/index.js';

export const SIZE_SHAPE = 2;
export const SIZE_SCALE = 100;
export const SIZE_N = 50;
export const SIZE_SEED = 20261204;
export type SizeScheme = 'case2' | 'periodic';

/** The likelihood-ratio cells: own-times design, Weibull shape, units. */
export type LrDesign = 'own2' | 'own2e' | 'ownk';
export const LR_SHAPES = [0.8, 2] as const;
export const LR_SIZES = [30, 100] as const;
export const LR_CELLS: readonly string[] = (['own2', 'own2e', 'ownk'] as const).flatMap((d) => LR_SHAPES.flatMap((b) => LR_SIZES.map((n) => `${d}-${b}-${n}`)));
/** A² on the same samples as the ownk cells (prefix a2-): what the product shows, for information, on such rows. */
export const A2_OWNK_CELLS: readonly string[] = LR_CELLS.filter((c) => c.startsWith('ownk-')).map((c) => `a2-${c}`);
export const OWN_TIMES_CELLS: readonly string[] = [...LR_CELLS, ...A2_OWNK_CELLS];

/** The design, shape and n of a cell name such as 'ownk-0.8-30'. */
export function parseLrCell(cell: string): { design: LrDesign; shape: number; n: number; index: number } {
  const index = LR_CELLS.indexOf(cell);
  const [design, shape, n] = cell.split('-');
  if (index < 0) throw new Error(`unknown cell ${cell}; one of ${LR_CELLS.join(', ')}`);
  return { design: design as LrDesign, shape: Number(shape), n: Number(n), index };
}

/** Sample i of a likelihood-ratio cell (seed stream SIZE_SEED + 100 + the cell's index). */
export function lrSample(cell: string, i: number): IntervalLifeData {
  const { design, shape, n, index } = parseLrCell(cell);
  const rng = createRng(SIZE_SEED + 100 + index, i);
  const life = getFamily('weibull').random({ shape, scale: SIZE_SCALE }, rng, n);
  const start: number[] = [];
  const end: number[] = [];
  for (const t of life) {
    if (design === 'own2' || design === 'own2e') {
      const u = design === 'own2' ? 20 + 100 * rng.uniform() : 10 - 60 * Math.log1p(-rng.uniform());
      const v = design === 'own2' ? u + 10 + 50 * rng.uniform() : u + 5 - 40 * Math.log1p(-rng.uniform());
      if (t <= u) start.push(0), end.push(u);
      else if (t <= v) start.push(u), end.push(v);
      else start.push(v), end.push(Number.POSITIVE_INFINITY);
    } else {
      // The unit's own schedule: every inspection is drawn (a fixed number of uniforms per unit is not
      // needed: the stream is the sample's own), and the row keeps the two around the failure.
      let prev = 0;
      let x = 5 + 45 * rng.uniform();
      let done = false;
      while (x <= 250) {
        if (!done && t <= x) {
          start.push(prev), end.push(x);
          done = true;
        }
        prev = x;
        x += 20 + 40 * rng.uniform();
      }
      if (!done) start.push(prev), end.push(Number.POSITIVE_INFINITY);
    }
  }
  return prepareIntervalLifeData({ start, end });
}

/** The p-value of the likelihood-ratio test on sample i of a cell, or of A² for an a2- cell (null when the Weibull fit fails). */
export function lrPValue(cell: string, i: number, replicates: number): number | null {
  const a2 = cell.startsWith('a2-');
  const data = lrSample(a2 ? cell.slice(3) : cell, i);
  const fit = fitInterval('weibull', data);
  if (!fit.ok) return null;
  return intervalGofBootstrap('weibull', fit.parameters, data, { replicates, seed: SIZE_SEED + 17 * i, statistic: a2 ? 'anderson-darling' : 'likelihood-ratio' }).pValue;
}

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
  return intervalGofBootstrap('weibull', fit.parameters, data, { replicates, seed: SIZE_SEED + 17 * i, statistic: 'anderson-darling' }).pValue;
}

export interface SizeCell {
  /** case2 | periodic (A²) or a likelihood-ratio cell such as own2-0.8-30. */
  readonly scheme: string;
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
export function cellOf(scheme: string, pValues: readonly (number | null)[], alpha: number): SizeCell {
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
function runRange(scheme: string, from: number, to: number, B: number): (number | null)[] {
  const ps: (number | null)[] = [];
  for (let i = from; i < to; i++) {
    ps.push(scheme === 'case2' || scheme === 'periodic' ? sizePValue(scheme, i, B) : lrPValue(scheme, i, B));
    if ((i + 1) % 25 === 0) process.stderr.write(`${scheme}: ${i + 1}/${to}\n`);
  }
  return ps;
}

/** The fixture's JSON text: the cells `schemes` merged from the pieces `parts`, with the run's settings. */
export function sizeFixture(generator: string, model: Record<string, unknown>, parts: readonly Part[], schemes: readonly string[], alpha: number): string {
  if (new Set(parts.map((x) => x.replicates)).size !== 1) throw new Error('the runs to merge used different replicates');
  const out = { generator, model, alpha, replicates: parts[0]!.replicates, rule: 'reject at p <= alpha (alpha(B + 1) whole); SE = sqrt(0.05*0.95/samples)', cells: mergeCells(parts, schemes, alpha) };
  return `${JSON.stringify(out, null, 1)}\n`;
}

/** The cells `schemes` from contiguous pieces of runs (each piece: samples [from, from + its length) of one cell). */
export function mergeCells(parts: readonly Part[], schemes: readonly string[], alpha: number): SizeCell[] {
  const cells: SizeCell[] = [];
  for (const scheme of schemes) {
    const mine = parts.filter((x) => x.scheme === scheme).sort((a, b) => a.from - b.from);
    if (mine.length === 0) continue;
    const ps: (number | null)[] = [];
    for (const x of mine) {
      if (x.from !== ps.length) throw new Error(`${scheme}: pieces are not contiguous (a piece starts at ${x.from}, expected ${ps.length})`);
      ps.push(...x.pValues);
    }
    cells.push(cellOf(scheme, ps, alpha));
  }
  return cells;
}

export interface Part {
  readonly scheme: string;
  readonly replicates: number;
  readonly from: number;
  readonly pValues: (number | null)[];
}

/**
 * npx tsx scripts/life-interval-size.ts FROM TO B CELL > part.json — samples [FROM, TO) of
 * one cell (so a long run goes in resumable pieces, two at a time on two cores);
 * npx tsx scripts/life-interval-size.ts --merge part*.json — the cells from contiguous pieces.
 */
/** The size table of docs/size-study.md from the two committed fixtures (every cell, its count and SE). */
export function sizeTable(root: string): string {
  const read = (f: string) => JSON.parse(readFileSync(`${root}/test/fixtures/${f}`, 'utf8')) as { replicates: number; cells: SizeCell[] };
  const ad = read('life-interval-size.json');
  const lr = read('life-interval-lr-size.json');
  const design: Record<string, string> = {
    periodic: 'common schedule, every 25 h to 150 h',
    case2: 'own two times, U ~ U(20, 120), V = U + U(10, 60)',
    own2: 'own two times, U ~ U(20, 120), V = U + U(10, 60)',
    own2e: 'own two times, U = 10 + Exp(60), V = U + 5 + Exp(40)',
    ownk: 'own schedule, first U(5, 50), gaps U(20, 60) to 250; row keeps the two around the failure',
  };
  const pc = (x: number) => (100 * x).toFixed(1);
  const mark = (c: SizeCell) => (Math.abs(c.size - 0.05) > 0.005 ? ' ⚠' : '');
  const rows = [
    '| statistic | inspections | Weibull shape | n | samples (fit failed) | rejected | size % | SE % |',
    '|---|---|---|---|---|---|---|---|',
  ];
  for (const c of ad.cells) rows.push(`| A² | ${design[c.scheme]} | 2 | 50 | ${c.samples} (${c.skipped}) | ${c.rejected} | ${pc(c.size)}${mark(c)} | ${(100 * c.standardError).toFixed(2)} |`);
  // Stated schedules (scripts/life-interval-stated-size.ts): the bootstrap inspects each unit at its listed times.
  const statedDesign: Record<string, string> = {
    ownk: 'own schedule, first U(5, 50), gaps U(20, 60) to 250; every time stated (inspection-times column)',
    case2: 'own two times, U ~ U(20, 120), V = U + U(10, 60); both stated (inspection-times column)',
  };
  for (const c of read('life-interval-stated-size.json').cells) {
    const [d, b] = c.scheme.split('-');
    rows.push(`| A² | ${statedDesign[d!]} | ${b} | 50 | ${c.samples} (${c.skipped}) | ${c.rejected} | ${pc(c.size)}${mark(c)} | ${(100 * c.standardError).toFixed(2)} |`);
  }
  for (const c of lr.cells) {
    const a2 = c.scheme.startsWith('a2-');
    const [d, b, n] = (a2 ? c.scheme.slice(3) : c.scheme).split('-');
    rows.push(`| ${a2 ? 'A²' : 'likelihood ratio'} | ${design[d!]} | ${b} | ${n} | ${c.samples} (${c.skipped}) | ${c.rejected} | ${pc(c.size)}${mark(c)} | ${(100 * c.standardError).toFixed(2)} |`);
  }
  return [
    ...rows,
    '',
    `Scale 100; α = 0.05, B = ${lr.replicates} (A² cells B = ${ad.replicates}; stated-schedule cells B = ${read('life-interval-stated-size.json').replicates}); reject at p ≤ α. SE = √(0.05·0.95/samples), the Monte Carlo error if the size were 5 %. ⚠ marks a size more than 0.5 points from 5 %. A sample whose Weibull fit has no maximum is left out (counted in brackets).`,
  ].join('\n');
}

function main(): void {
  const alpha = 0.05;
  if (process.argv[2] === '--write-doc') {
    const file = 'docs/size-study.md';
    const doc = readFileSync(file, 'utf8');
    const begin = '<!-- size-study:interval:begin (written by scripts/life-interval-size.ts --write-doc; do not edit by hand) -->';
    const end = '<!-- size-study:interval:end -->';
    const a = doc.indexOf(begin);
    const b = doc.indexOf(end);
    if (a < 0 || b < a) throw new Error(`${file}: the interval markers are missing`);
    writeFileSync(file, `${doc.slice(0, a + begin.length)}\n${sizeTable('.')}\n${doc.slice(b)}`);
    return;
  }
  if (process.argv[2] === '--merge') {
    const parts = process.argv.slice(3).map((f) => JSON.parse(readFileSync(f, 'utf8')) as Part);
    const lr = parts.some((x) => OWN_TIMES_CELLS.includes(x.scheme));
    if (lr && !parts.every((x) => OWN_TIMES_CELLS.includes(x.scheme))) throw new Error('merge the n = 50 A² cells and the own-times cells into separate fixtures');
    const model = lr
      ? { family: 'weibull', scale: SIZE_SCALE, shapes: LR_SHAPES, n: LR_SIZES, seed: SIZE_SEED, statistic: 'likelihood-ratio against the Turnbull estimate; A² in the a2- cells (same samples as ownk)', cells: '[a2-]DESIGN-SHAPE-N; designs in the script header' }
      : { family: 'weibull', shape: SIZE_SHAPE, scale: SIZE_SCALE, n: SIZE_N, seed: SIZE_SEED };
    process.stdout.write(sizeFixture('scripts/life-interval-size.ts', model, parts, lr ? OWN_TIMES_CELLS : ['case2', 'periodic'], alpha));
    return;
  }
  const from = Number(process.argv[2]);
  const to = Number(process.argv[3]);
  const B = Number(process.argv[4] ?? 39);
  const scheme = process.argv[5] ?? '';
  if (!(Number.isInteger(from) && Number.isInteger(to) && to > from && (scheme === 'case2' || scheme === 'periodic' || OWN_TIMES_CELLS.includes(scheme)))) {
    throw new Error(`usage: life-interval-size.ts FROM TO B case2|periodic|${OWN_TIMES_CELLS.join('|')}  |  --merge part.json ...`);
  }
  const part: Part = { scheme, replicates: B, from, pValues: runRange(scheme, from, to, B) };
  process.stdout.write(`${JSON.stringify(part)}\n`);
}

if (process.argv[1] === fileURLToPath(import.meta.url)) main();

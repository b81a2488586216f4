/**
 * Size study of every p-value that drives a decision: for each family and true parameter set and
 * each n, draw R seeded samples from the model, run the complete analysis of that family alone
 * (planAnalysis → bootstrap → finishAnalysis, exactly as the CLI and server do), and count how
 * often the Anderson–Darling and chi-square tests reject at α = 0.05. A test with the right size
 * rejects 5 % of the time; the binomial standard error is √(0.05·0.95/R).
 *
 *   nice -n 10 npx tsx scripts/size-study.ts [R=2000] [B=99] [families|labels=all] [ns=all] [--write]
 *
 * --write puts the table into docs/size-study.md (between its size-study:complete markers); a run of
 * some cells only (e.g. 'gamma shape 2,gamma shape 8' 10) replaces their rows there and says so. Sample i of a cell uses random stream createRng(SEED + 1000·cell + n, i);
 * its bootstrap seed is 1000 + i. B = 99 is enough for the bootstrap decisions: a Monte Carlo test
 * that rejects at p ≤ α with α(B + 1) whole has exact size at any B (Davison & Hinkley 1997 §4.2.5;
 * Davidson & MacKinnon 2000, Econometric Reviews 19:55-68) — provided the bootstrap decides wherever
 * its own decision is random (core/analyze.ts, chiSquareNeedsBootstrap).
 */
import { fileURLToPath } from 'node:url';
import { analyze, createRng, getFamily, type FamilyName, type Parameters } from '../core/index.js';
import { readSection, writeSection } from './size-study-write.js';

export const SIZE_STUDY_SEED = 20261204;
export const SIZE_STUDY_NS = [10, 20, 50, 100, 200] as const;

/** The cells the issue asks for (true parameters; scale parameters arbitrary, the tests are scale-free). */
export const SIZE_STUDY_CELLS: readonly { family: FamilyName; parameters: Parameters; label: string }[] = [
  { family: 'normal', parameters: { mean: 10, sd: 2 }, label: 'normal' },
  { family: 'lognormal', parameters: { meanlog: 1, sdlog: 0.5 }, label: 'lognormal σ 0.5' },
  { family: 'gamma', parameters: { shape: 0.1, scale: 3 }, label: 'gamma shape 0.1' },
  { family: 'gamma', parameters: { shape: 0.5, scale: 3 }, label: 'gamma shape 0.5' },
  { family: 'gamma', parameters: { shape: 2, scale: 3 }, label: 'gamma shape 2' },
  { family: 'gamma', parameters: { shape: 8, scale: 3 }, label: 'gamma shape 8' },
  { family: 'weibull', parameters: { shape: 0.8, scale: 4 }, label: 'Weibull shape 0.8' },
  { family: 'weibull', parameters: { shape: 1.5, scale: 4 }, label: 'Weibull shape 1.5' },
  { family: 'weibull', parameters: { shape: 3.5, scale: 4 }, label: 'Weibull shape 3.5' },
  { family: 'exponential', parameters: { rate: 0.5 }, label: 'exponential' },
];

export interface SizeCell {
  readonly label: string;
  readonly n: number;
  readonly samples: number;
  /** Rejections by the Anderson–Darling decision, and how many decisions came from the bootstrap. */
  readonly ad: number;
  readonly adBootstrap: number;
  /** Rejections by the chi-square decision among samples where it was computable. */
  readonly chi: number;
  readonly chiComputed: number;
  readonly chiBootstrap: number;
  /** Samples where the family could not be fitted or was not ranked. */
  readonly notFitted: number;
  /** Bootstrap replicates that could not be refitted, summed over the cell (A² and χ² share them). */
  readonly unrefitted: number;
}

export function sizeCell(cellIndex: number, n: number, samples: number, replicates: number, alpha = 0.05): SizeCell {
  const cell = SIZE_STUDY_CELLS[cellIndex];
  if (!cell) throw new Error(`no cell ${cellIndex}`);
  const fam = getFamily(cell.family);
  let ad = 0;
  let adBootstrap = 0;
  let chi = 0;
  let chiComputed = 0;
  let chiBootstrap = 0;
  let notFitted = 0;
  let unrefitted = 0;
  for (let i = 0; i < samples; i++) {
    const x = fam.random(cell.parameters, createRng(SIZE_STUDY_SEED + cellIndex * 1000 + n, i), n);
    const r = analyze(x, { families: [cell.family], alpha, bootstrapReplicates: replicates, seed: 1000 + i });
    const c = r.candidates[0];
    if (!c) {
      notFitted++;
      continue;
    }
    if (c.andersonDarling.rejected) ad++;
    if (c.andersonDarling.method === 'bootstrap') adBootstrap++;
    const chiFailed = c.chiSquare.computable && c.chiSquare.bootstrap ? c.chiSquare.bootstrap.unrefitted : 0;
    unrefitted += Math.max(c.andersonDarling.failedReplicates ?? 0, chiFailed);
    if (c.chiSquare.computable) {
      chiComputed++;
      if (c.chiSquare.rejected) chi++;
      if (c.chiSquare.decidedBy === 'bootstrap') chiBootstrap++;
    }
  }
  return { label: cell.label, n, samples, ad, adBootstrap, chi, chiComputed, chiBootstrap, notFitted, unrefitted };
}

const pct = (k: number, d: number): string => (d === 0 ? '—' : ((100 * k) / d).toFixed(2));
const se = (d: number): string => (d === 0 ? '—' : (100 * Math.sqrt((0.05 * 0.95) / d)).toFixed(2));
const flag = (k: number, d: number): string => (d > 0 && Math.abs(k / d - 0.05) > 0.005 ? ' ⚠' : '');

/**
 * The written table with the rows of `rerun` (same model and n) replaced, and a line saying so; the
 * other rows stay as the full run wrote them.
 */
export function mergeRows(section: string, rerun: readonly string[], note: string): string {
  const key = (row: string): string => row.split('|').slice(1, 3).map((c) => c.trim()).join('|');
  const fresh = new Map(rerun.map((r) => [key(r), r]));
  const lines = section.split('\n').map((l) => (l.startsWith('| ') && fresh.has(key(l)) ? (fresh.get(key(l)) as string) : l));
  return `${lines.join('\n').trimEnd()}\n${note}`;
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const args = process.argv.slice(2).filter((a) => a !== '--write');
  const write = process.argv.includes('--write');
  const samples = Number(args[0] ?? 2000);
  const replicates = Number(args[1] ?? 99);
  const only = args[2] && args[2] !== 'all' ? new Set(args[2].split(',')) : null;
  const ns = args[3] ? args[3].split(',').map(Number) : [...SIZE_STUDY_NS];
  const started = Date.now();
  const lines = [
    '| model | n | samples | A² size % | A² by bootstrap | χ² size % | χ² by bootstrap | unrefitted replicates | SE % |',
    '|---|---|---|---|---|---|---|---|---|',
  ];
  console.log(lines.join('\n'));
  const rows: string[] = [];
  SIZE_STUDY_CELLS.forEach((cell, ci) => {
    if (only && !only.has(cell.label) && !only.has(cell.family)) return;
    for (const n of ns) {
      const t0 = Date.now();
      const r = sizeCell(ci, n, samples, replicates);
      const used = r.samples - r.notFitted;
      const line = `| ${r.label} | ${n} | ${used}${r.notFitted ? ` (+${r.notFitted} not fitted)` : ''} | ${pct(r.ad, used)}${flag(r.ad, used)} | ${r.adBootstrap} | ${pct(r.chi, r.chiComputed)}${flag(r.chi, r.chiComputed)} | ${r.chiBootstrap} | ${r.unrefitted} | ${se(used)} |`;
      rows.push(line);
      console.log(line);
      console.error(`${r.label} n = ${n}: ${((Date.now() - t0) / 1000).toFixed(0)} s`);
    }
  });
  const seconds = ((Date.now() - started) / 1000).toFixed(0);
  const tail = `\nR = ${samples} samples a cell, B = ${replicates} bootstrap replicates, α = 0.05, seed ${SIZE_STUDY_SEED}; ${seconds} s. ⚠ marks a size more than 0.5 points from 5 %.`;
  console.log(tail);
  if (write && !only && ns.length === SIZE_STUDY_NS.length) writeSection('complete', [...lines, ...rows, tail].join('\n'));
  else if (write) {
    // A partial run replaces its own rows in the written table and says which (script arguments given).
    const note = `Rows re-run by \`scripts/size-study.ts ${args.join(' ')}\` (${seconds} s): ${rows.map((r) => r.split('|').slice(1, 3).map((c) => c.trim()).join(' n = ')).join('; ')}.`;
    writeSection('complete', mergeRows(readSection('complete'), rows, note));
  }
}

/**
 * Size study of every p-value that drives a decision: for each family and true parameter set and
 * each n, draw R seeded samples from the model, run the complete analysis of that family alone
 * (planAnalysis → bootstrap → finishAnalysis, exactly as the CLI and server do), and count how
 * often the Anderson–Darling and chi-square tests reject at α = 0.05. A test with the right size
 * rejects 5 % of the time; the binomial standard error is √(0.05·0.95/R).
 *
 *   npx tsx scripts/size-study.ts [R=2000] [B=99] [families=all] > docs/size-study.md
 *
 * Sample i of a cell uses random stream createRng(SEED + cell, i); bootstrap seed 1000 + i.
 */
import { fileURLToPath } from 'node:url';
import { analyze, createRng, getFamily, type FamilyName, type Parameters } from '../core/index.js';

export const SIZE_STUDY_SEED = 20261204;
export const SIZE_STUDY_NS = [10, 20, 50, 200] as const;

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
    if (c.chiSquare.computable) {
      chiComputed++;
      if (c.chiSquare.rejected) chi++;
      if (c.chiSquare.decidedBy === 'bootstrap') chiBootstrap++;
    }
  }
  return { label: cell.label, n, samples, ad, adBootstrap, chi, chiComputed, chiBootstrap, notFitted };
}

const pct = (k: number, d: number): string => (d === 0 ? '—' : ((100 * k) / d).toFixed(2));
const se = (d: number): string => (d === 0 ? '—' : (100 * Math.sqrt((0.05 * 0.95) / d)).toFixed(2));
const flag = (k: number, d: number): string => (d > 0 && Math.abs(k / d - 0.05) > 0.005 ? ' ⚠' : '');

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const samples = Number(process.argv[2] ?? 2000);
  const replicates = Number(process.argv[3] ?? 99);
  const only = process.argv[4] ? new Set(process.argv[4].split(',')) : null;
  const started = Date.now();
  console.log(`| model | n | samples | A² size % | A² by bootstrap | χ² size % | χ² by bootstrap | SE % |`);
  console.log(`|---|---|---|---|---|---|---|---|`);
  SIZE_STUDY_CELLS.forEach((cell, ci) => {
    if (only && !only.has(cell.family)) return;
    for (const n of SIZE_STUDY_NS) {
      const r = sizeCell(ci, n, samples, replicates);
      const used = r.samples - r.notFitted;
      console.log(
        `| ${r.label} | ${n} | ${used}${r.notFitted ? ` (+${r.notFitted} not fitted)` : ''} | ${pct(r.ad, used)}${flag(r.ad, used)} | ${r.adBootstrap} | ${pct(r.chi, r.chiComputed)}${flag(r.chi, r.chiComputed)} | ${r.chiBootstrap} | ${se(used)} |`,
      );
    }
  });
  console.log(`\nR = ${samples} samples a cell, B = ${replicates} bootstrap replicates, α = 0.05, seed ${SIZE_STUDY_SEED}; ${((Date.now() - started) / 1000).toFixed(0)} s. ⚠ marks a size more than 0.5 points from 5 %.`);
}

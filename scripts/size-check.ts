/**
 * Monte Carlo size check of the goodness-of-fit tests: draw samples from each family at fixed
 * parameters, run the full analysis for that family (fit, chi-square, Anderson–Darling with table
 * p-values), and count how often each test rejects at α. A test with the right size rejects about
 * α of the time; the binomial standard error is √(α(1 - α)/R).
 *
 * Replicate i uses the random stream createRng(seed, i). The suite runs a short version
 * (test/gof/size.test.ts); this script runs a longer one:
 *   npx tsx scripts/size-check.ts [replicates=20000] [n=100] [alpha=0.05]
 */
import { fileURLToPath } from 'node:url';
import { createRng, finishAnalysis, getFamily, planAnalysis, type FamilyName, type Parameters } from '../core/index.js';

/** The true parameters each family is simulated from (arbitrary, common practice, no source). */
export const SIZE_CHECK_PARAMETERS: Readonly<Partial<Record<FamilyName, Parameters>>> = {
  normal: { mean: 10, sd: 2 },
  lognormal: { meanlog: 1, sdlog: 0.5 },
  gamma: { shape: 2.5, scale: 3 },
  weibull: { shape: 1.5, scale: 4 },
  exponential: { rate: 0.5 },
  gumbel: { location: 100, scale: 20 },
};

export interface SizeCheckResult {
  readonly family: FamilyName;
  readonly replicates: number;
  /** Rejections by Anderson–Darling (table p-values; a bound p < 0.01 counts as a rejection). */
  readonly andersonDarling: number;
  /** Rejections by chi-square with k - 1 - m dof (pValue). */
  readonly chiSquare: number;
  /** Rejections by chi-square with k - 1 dof (pValueUpper). */
  readonly chiSquareUpper: number;
  /** Replicates where chi-square was computable. */
  readonly chiSquareComputed: number;
}

export function sizeCheck(family: FamilyName, replicates: number, n: number, alpha: number, seed: number): SizeCheckResult {
  const fam = getFamily(family);
  const params = SIZE_CHECK_PARAMETERS[family];
  if (!params) throw new Error(`no size-check parameters for ${family}`);
  let ad = 0;
  let chi = 0;
  let chiUp = 0;
  let chiN = 0;
  for (let i = 0; i < replicates; i++) {
    const x = fam.random(params, createRng(seed, i), n);
    const report = finishAnalysis(planAnalysis(x, { families: [family], alpha }));
    const c = report.candidates[0];
    if (!c) throw new Error(`replicate ${i}: ${family} not fitted`);
    if (c.andersonDarling.rejected) ad++;
    if (c.chiSquare.computable) {
      chiN++;
      if (c.chiSquare.pValue < alpha) chi++;
      if (c.chiSquare.pValueUpper < alpha) chiUp++;
    }
  }
  return { family, replicates, andersonDarling: ad, chiSquare: chi, chiSquareUpper: chiUp, chiSquareComputed: chiN };
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const replicates = Number(process.argv[2] ?? 20000);
  const n = Number(process.argv[3] ?? 100);
  const alpha = Number(process.argv[4] ?? 0.05);
  const seed = 7;
  const se = Math.sqrt((alpha * (1 - alpha)) / replicates);
  console.log(`Size check: R = ${replicates}, n = ${n}, alpha = ${alpha}, seed ${seed}; binomial SE ${(100 * se).toFixed(2)} %`);
  console.log('family        AD %    chi2(k-1-m) %   chi2(k-1) %');
  for (const f of Object.keys(SIZE_CHECK_PARAMETERS) as FamilyName[]) {
    const r = sizeCheck(f, replicates, n, alpha, seed);
    const pct = (c: number, d: number): string => ((100 * c) / d).toFixed(2).padStart(6);
    console.log(`${f.padEnd(12)} ${pct(r.andersonDarling, r.replicates)}   ${pct(r.chiSquare, r.chiSquareComputed)}          ${pct(r.chiSquareUpper, r.chiSquareComputed)}`);
  }
}

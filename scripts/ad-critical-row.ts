/**
 * Shared by the simulated Anderson–Darling tables (scripts/simulate-ad-tables.ts for the gamma
 * shape grid, scripts/simulate-ad-extreme-value-table.ts for the Weibull/Gumbel table by n): the
 * empirical upper critical values of A² with every replicate refitted by maximum likelihood, exactly
 * as the parametric bootstrap does (`replicateStatistic`, core/gof/bootstrap.ts). The critical value
 * at level α is the order statistic ⌈(1 - α)R⌉ of the R valid replicates. Replicate i uses stream i
 * of `seed`.
 */
import { getFamily, type FamilyName, type Parameters } from '../core/index.js';
import { replicateStatistic } from '../core/gof/index.js';

export function criticalRow(
  family: FamilyName,
  parameters: Parameters,
  n: number,
  replicates: number,
  alphas: readonly number[],
  seed: number,
): { values: number[]; failed: number } {
  const fam = getFamily(family);
  const a2 = new Float64Array(replicates);
  let m = 0;
  let failed = 0;
  for (let i = 0; i < replicates; i++) {
    const v = replicateStatistic(fam, { parameters, n, seed }, i);
    if (Number.isNaN(v)) failed++;
    else a2[m++] = v;
  }
  const s = a2.subarray(0, m).sort();
  const values = alphas.map((alpha) => s[Math.min(m - 1, Math.ceil((1 - alpha) * m) - 1)] as number);
  return { values, failed };
}

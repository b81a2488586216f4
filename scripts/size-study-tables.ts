/**
 * The size of the parameter-free Anderson–Darling table decisions, measured to a small standard
 * error: normal (D'Agostino & Stephens 1986, Table 4.9 formula, A* = A²(1 + 0.75/n + 2.25/n²);
 * the lognormal test is the same test on ln x), exponential (ibid., ch. 4, A* = A²(1 + 0.6/n)) and
 * Weibull (Stephens 1977, Biometrika 64:583-588, through the extreme-value test of ln x,
 * A* = A²(1 + 0.2/√n)). With the parameters estimated by maximum likelihood, the null distribution
 * of A² does not depend on the true parameters in these families (location-scale on x or ln x;
 * D'Agostino & Stephens 1986, ch. 4), so one long run per n gives the size of every cell of that
 * family in scripts/size-study.ts, and tells whether a cell's distance from 5 % is the table's own
 * error or Monte Carlo error. The Weibull table is measured at every n although the analysis uses
 * it only from n = 100 (below, the bootstrap decides: core/analyze-decisions.ts).
 *
 *   nice -n 10 npx tsx scripts/size-study-tables.ts [R=100000] [--write]
 *
 * Sample i of family f at n uses createRng(SEED + 1000·f + n, i); the p-value is the analysis's own
 * table p (evaluateFamilies: the fit, A² and the table exactly as planAnalysis computes them),
 * rejecting at p < α.
 */
import { fileURLToPath } from 'node:url';
import { createRng, evaluateFamilies, getFamily, type FamilyName, type Parameters } from '../core/index.js';
import { writeSection } from './size-study-write.js';

const SEED = 20261205;
export const TABLE_STUDY_NS = [10, 20, 50, 100, 200, 500] as const;
export const TABLE_STUDY_FAMILIES: readonly { family: FamilyName; parameters: Parameters; label: string }[] = [
  { family: 'normal', parameters: { mean: 0, sd: 1 }, label: 'normal and lognormal (Table 4.9)' },
  { family: 'exponential', parameters: { rate: 1 }, label: 'exponential (ch. 4)' },
  { family: 'weibull', parameters: { shape: 1, scale: 1 }, label: 'Weibull (Stephens 1977)' },
];

export function tableSize(index: number, n: number, samples: number, alpha = 0.05): { rejected: number; samples: number } {
  const cell = TABLE_STUDY_FAMILIES[index];
  if (!cell) throw new Error(`no family ${index}`);
  let rejected = 0;
  let used = 0;
  for (let i = 0; i < samples; i++) {
    const x = getFamily(cell.family).random(cell.parameters, createRng(SEED + 1000 * index + n, i), n);
    const [e] = evaluateFamilies(x, [cell.family], { alpha });
    if (!e?.ok || !e.table) continue;
    used++;
    if (e.table.pValue < alpha) rejected++;
  }
  return { rejected, samples: used };
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const args = process.argv.slice(2).filter((a) => a !== '--write');
  const samples = Number(args[0] ?? 100000);
  const started = Date.now();
  const lines = ['| table | n | samples | size % | SE % |', '|---|---|---|---|---|'];
  console.log(lines.join('\n'));
  TABLE_STUDY_FAMILIES.forEach((cell, index) => {
    for (const n of TABLE_STUDY_NS) {
      const r = tableSize(index, n, samples);
      const size = r.rejected / r.samples;
      const line = `| ${cell.label} | ${n} | ${r.samples} | ${(100 * size).toFixed(2)}${Math.abs(size - 0.05) > 0.005 ? ' ⚠' : ''} | ${(100 * Math.sqrt((0.05 * 0.95) / r.samples)).toFixed(2)} |`;
      lines.push(line);
      console.log(line);
    }
  });
  const tail = `\nR = ${samples} samples per cell, α = 0.05, seed ${SEED}; ${((Date.now() - started) / 1000).toFixed(0)} s. ⚠ marks a size more than 0.5 points from 5 %.`;
  lines.push(tail);
  console.log(tail);
  if (process.argv.includes('--write')) writeSection('tables', lines.join('\n'));
}

/**
 * Writes datasets/river-daily-flows.csv: an INVENTED river's daily mean flows for the
 * peaks-over-threshold demo (a date column and a value column). Seeded (createRng(20261204, 13));
 * rerun with `node --import tsx scripts/make-pot-dataset.ts [OUT_DIR]` (default datasets/) to rewrite it
 * byte for byte; scripts/make-datasets.ts imports it, so test/cli/datasets.test.ts compares its bytes.
 *
 * Model (m³/s), 1999-01-01 to 2023-12-31: a seasonal base flow, exp(ln 45 + 0.35 sin(2π(d − 60)/365.25)
 * + e_d) with e_d an AR(1) (coefficient 0.9, innovation sd 0.12); storms start on a day with
 * chance 3.5/365.25, their peak 140 + a generalized Pareto excess (scale 55, shape ξ = 0.1 in
 * S(y) = (1 + ξy/σ)^(−1/ξ)), receding by a factor 0.55 a day over the next five days; the day's
 * flow is the larger of base and storm, rounded to 0.1 m³/s.
 */
import { writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { createRng } from '../core/random/index.js';

const outDir = process.argv[2] ?? join(dirname(fileURLToPath(import.meta.url)), '..', 'datasets');

const rng = createRng(20261204, 13);
const start = Date.UTC(1999, 0, 1);
const endDay = Date.UTC(2023, 11, 31);
const days = Math.round((endDay - start) / 86_400_000) + 1;
const flows = new Float64Array(days);
let e = 0;
for (let d = 0; d < days; d++) {
  e = 0.9 * e + 0.12 * rng.normal();
  flows[d] = Math.exp(Math.log(45) + 0.35 * Math.sin((2 * Math.PI * (d - 60)) / 365.25) + e);
}
const SIGMA = 55;
const XI = 0.1;
for (let d = 0; d < days; d++) {
  if (rng.uniform() >= 3.5 / 365.25) continue;
  const peak = 140 + (SIGMA / XI) * Math.expm1(-XI * Math.log1p(-rng.uniform()));
  for (let j = 0; j < 6 && d + j < days; j++) flows[d + j] = Math.max(flows[d + j] as number, peak * 0.55 ** j);
}
const lines = ['date,flow_m3s'];
for (let d = 0; d < days; d++) lines.push(`${new Date(start + d * 86_400_000).toISOString().slice(0, 10)},${(Math.round((flows[d] as number) * 10) / 10).toFixed(1)}`);
writeFileSync(join(outDir, 'river-daily-flows.csv'), `${lines.join('\n')}\n`);
console.log(`wrote ${join(outDir, 'river-daily-flows.csv')}: ${days} rows`);

/**
 * Writes the invented demo scenarios in datasets/ (and the one published dataset, typed in from
 * its publication). Seeded: running it again writes the same bytes.
 *   node --import tsx scripts/make-datasets.ts [OUT_DIR]      (default: datasets/)
 * Every scenario here is INVENTED for demonstration; none is a measurement of anything real.
 * The models and parameters below are documented in datasets/README.md.
 */
import { writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { createRng, type Rng } from '../core/index.js';
// The life-data-as-recorded scenarios (valve inspections, seal failure modes) have their own generator, same OUT_DIR.
import './make-life-datasets.js';
// The peaks-over-a-threshold daily series (river-daily-flows.csv) has its own generator, same OUT_DIR.
import './make-pot-dataset.js';

export const SEED = 20261201;
const here = dirname(fileURLToPath(import.meta.url));
const outDir = process.argv[2] ?? join(here, '..', 'datasets');

function write(name: string, header: string[], rows: (string | number)[][]): void {
  const text = [header.join(','), ...rows.map((r) => r.join(','))].join('\n') + '\n';
  writeFileSync(join(outDir, name), text);
  console.log(`wrote ${join(outDir, name)}: ${rows.length} rows`);
}

/** Weibull(shape k, scale λ) by inversion: λ(-ln U)^(1/k). */
function weibull(rng: Rng, shape: number, scale: number): number {
  return scale * Math.pow(-Math.log(rng.uniform()), 1 / shape);
}

/** GEV(μ, σ, ξ ≠ 0), F(x) = exp(-(1 + ξ(x - μ)/σ)^(-1/ξ)), by inversion. */
function gev(rng: Rng, mu: number, sigma: number, xi: number): number {
  return mu + (sigma * (Math.pow(-Math.log(rng.uniform()), -xi) - 1)) / xi;
}

// 1. bearing-life.csv: 30 rolling bearings on a rig, Weibull(shape 1.8, scale 2200 h) lives,
//    the test stopped at 2500 h (type I censoring): status 1 = failed, 0 = still running.
{
  const rng = createRng(SEED, 1);
  const end = 2500;
  const rows: (string | number)[][] = [];
  for (let u = 1; u <= 30; u++) {
    const life = weibull(rng, 1.8, 2200);
    const failed = life < end;
    rows.push([`B${String(u).padStart(2, '0')}`, failed ? Math.max(1, Math.round(life)) : end, failed ? 1 : 0]);
  }
  write('bearing-life.csv', ['unit', 'hours', 'status'], rows);
}

// 2. river-peaks.csv: 60 annual peak flows (1964-2023) of an invented river,
//    GEV(location 420, scale 130, shape 0.08) m³/s, rounded to 1 m³/s.
{
  const rng = createRng(SEED, 2);
  const rows: (string | number)[][] = [];
  for (let y = 1964; y <= 2023; y++) rows.push([y, Math.round(gev(rng, 420, 130, 0.08))]);
  write('river-peaks.csv', ['year', 'peak_flow_m3s'], rows);
}

// 3. shaft-diameter.csv: 125 machined shafts in 25 subgroups of 5 (nominal 25 mm), normal with
//    mean 25.0012 mm, within-subgroup sd 0.0030 mm, subgroup-to-subgroup sd 0.0008 mm,
//    recorded to 0.0001 mm.
{
  const rng = createRng(SEED, 3);
  const rows: (string | number)[][] = [];
  let part = 0;
  for (let g = 1; g <= 25; g++) {
    const shift = 0.0008 * rng.normal();
    for (let j = 0; j < 5; j++) {
      part++;
      const d = 25.0012 + shift + 0.003 * rng.normal();
      rows.push([g, part, d.toFixed(4)]);
    }
  }
  write('shaft-diameter.csv', ['subgroup', 'part', 'diameter_mm'], rows);
}

// 4. pump-seal-wear.csv: one column, wear depth of 80 pump seals after 2000 h of service,
//    gamma(shape 3.5, scale 12 µm), recorded to 0.1 µm.
{
  const rng = createRng(SEED, 4);
  const rows: (string | number)[][] = [];
  for (let s = 0; s < 80; s++) rows.push([(12 * rng.gamma(3.5)).toFixed(1)]);
  write('pump-seal-wear.csv', ['wear_um'], rows);
}

// 5. aircondit.csv: PUBLISHED data, not generated: Proschan (1963), Technometrics 5:375-383,
//    intervals (hours) between failures of the air-conditioning of one aircraft, as shipped in
//    R's boot package (`aircondit`).
write('aircondit.csv', ['hours'], [3, 5, 7, 18, 43, 85, 91, 98, 100, 130, 230, 487].map((h) => [h]));

// 6. inspection-classes.csv: GROUPED counts. An inspection crew's tally of 180 corrosion pit
//    depths on a tank floor of 3.0 mm plate, in 0.25 mm classes from 0 to 3.0 mm (lower, upper,
//    count): lognormal depths, median 0.8 mm, log-sd 0.45 (a depth beyond the plate is drawn again).
{
  const rng = createRng(SEED, 6);
  const width = 0.25;
  const classes = 12;
  const counts = new Array<number>(classes).fill(0);
  for (let p = 0; p < 180; p++) {
    let depth: number;
    do depth = 0.8 * Math.exp(0.45 * rng.normal());
    while (depth >= classes * width);
    counts[Math.floor(depth / width)]! += 1;
  }
  write('inspection-classes.csv', ['lower', 'upper', 'count'], counts.map((c, j) => [(j * width).toFixed(2), ((j + 1) * width).toFixed(2), c]));
}

// 7. gauge-peaks.csv: a LONG table (gauge, year, peak) of 12 invented gauges in one invented
//    region, 28 to 45 annual maxima each (ending 2023): every gauge's peaks are its index flood
//    (a mean annual maximum between 80 and 600 m³/s) times one regional GEV growth curve (mean 1,
//    L-CV 0.22, shape 0.1 in the ξ sign used above, i.e. heavy-tailed), except gauge G12 whose
//    growth curve has L-CV 0.38 (a gauge that does not belong to the region); a draw below 5 % of the
//    index flood is drawn again. Rounded to 0.1 m³/s.
{
  const rng = createRng(SEED, 7);
  const rows: (string | number)[][] = [];
  for (let g = 1; g <= 12; g++) {
    const index = 80 + 520 * rng.uniform();
    const years = 28 + Math.floor(18 * rng.uniform());
    const lcv = g === 12 ? 0.38 : 0.22;
    // GEV with shape ξ = 0.1: λ2/λ1 = lcv fixes σ for a mean-1 curve (Hosking & Wallis 1997, appendix, k = -ξ).
    const k = -0.1;
    const g1 = Math.exp(lnGamma1(1 + k));
    const sigma = (lcv * k) / (g1 * (1 - Math.pow(2, -k)));
    const mu = 1 - (sigma * (1 - g1)) / k;
    for (let y = 2024 - years; y <= 2023; y++) {
      let q: number;
      do q = gev(rng, mu, sigma, 0.1);
      while (q < 0.05);
      rows.push([`G${String(g).padStart(2, '0')}`, y, (index * q).toFixed(1)]);
    }
  }
  write('gauge-peaks.csv', ['gauge', 'year', 'peak_m3s'], rows);
}

/** ln Γ(x) for 0.5 ≤ x ≤ 3 (Stirling's series after shifting up by 6; ample for a demo's parameters). */
function lnGamma1(x: number): number {
  let p = 1;
  let y = x;
  while (y < 8) {
    p *= y;
    y += 1;
  }
  return (y - 0.5) * Math.log(y) - y + 0.5 * Math.log(2 * Math.PI) + 1 / (12 * y) - 1 / (360 * y ** 3) - Math.log(p);
}

/**
 * Writes the invented demo scenarios for life data as recorded (inspection intervals with counts;
 * field failures with failure modes). Seeded: running it again writes the same bytes.
 *   node --import tsx scripts/make-life-datasets.ts [OUT_DIR]      (default: datasets/)
 * Every scenario here is INVENTED for demonstration; none is a measurement of anything real.
 * The models and parameters below are documented in datasets/README.md.
 */
import { writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { createRng, type Rng } from '../core/index.js';

export const LIFE_SEED = 20261204;
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

// 1. valve-inspections.csv: 150 relief valves on an invented site, Weibull(shape 2.2, scale 40
//    months) lives, proof-tested every 6 months up to 48 months. A valve found failed at a test
//    failed somewhere since the previous test (start, end]; one found failed at the first test has
//    an empty start; a valve still working at 48 months has an empty end. About one failure in
//    eight is seen as it happens (exact month, to 0.1). Identical rows are merged with a count.
{
  const rng = createRng(LIFE_SEED, 1);
  const looks = [6, 12, 18, 24, 30, 36, 42, 48];
  const tally = new Map<string, number>();
  for (let u = 0; u < 150; u++) {
    const life = weibull(rng, 2.2, 40);
    const seen = rng.uniform() < 0.125;
    let key: string;
    if (life > 48) key = '48,';
    else if (seen) key = `${(Math.max(0.1, Math.round(life * 10) / 10)).toFixed(1)},${(Math.max(0.1, Math.round(life * 10) / 10)).toFixed(1)}`;
    else {
      const hi = looks.find((l) => life <= l) as number;
      key = hi === 6 ? ',6' : `${hi - 6},${hi}`;
    }
    tally.set(key, (tally.get(key) ?? 0) + 1);
  }
  const num = (s: string) => (s === '' ? Number.NaN : Number(s));
  const rows = [...tally.entries()]
    .map(([k, c]) => [...k.split(','), c] as [string, string, number])
    .sort((a, b) => (num(a[0]) || 0) - (num(b[0]) || 0) || (num(a[1]) || Infinity) - (num(b[1]) || Infinity));
  write('valve-inspections.csv', ['start_months', 'end_months', 'valves'], rows);
}

// 2. seal-failure-modes.csv: 120 pump seals in invented field service; each fails by the earlier of
//    a wear-out leak, Weibull(shape 3.2, scale 9000 h), and an early face crack, Weibull(shape 0.9,
//    scale 40000 h); each seal leaves observation (overhaul for other reasons) at a time drawn
//    uniform on (2000, 12000) h. status 1 = failed, with its mode; 0 = removed unfailed (mode empty).
{
  const rng = createRng(LIFE_SEED, 2);
  const rows: (string | number)[][] = [];
  for (let u = 1; u <= 120; u++) {
    const leak = weibull(rng, 3.2, 9000);
    const crack = weibull(rng, 0.9, 40000);
    const out = 2000 + 10000 * rng.uniform();
    const t = Math.min(leak, crack, out);
    const failed = t < out;
    rows.push([`S${String(u).padStart(3, '0')}`, Math.max(1, Math.round(t)), failed ? 1 : 0, failed ? (leak < crack ? 'leak' : 'crack') : '']);
  }
  write('seal-failure-modes.csv', ['seal', 'hours', 'status', 'mode'], rows);
}

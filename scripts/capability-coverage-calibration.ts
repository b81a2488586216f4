/**
 * Can the Johnson capability interval be calibrated? Interval rules tried on the Johnson setup of
 * scripts/capability-coverage.ts (SU process, Slifker–Shapiro percentile fit re-choosing its curve
 * type on every replicate, limits at its 0.05 % and 99.98 % points, nominal 95 %), each on the same
 * seeded samples as the committed coverage run:
 *  - smoothed (--smoothed H,...): the smoothed bootstrap (Silverman 1986, Density Estimation for
 *    Statistics and Data Analysis, §6.4.1; Hall, DiCiccio & Romano 1989, Annals of Statistics
 *    17:692-704 [both from memory]): resample the data and add N(0, h²) noise, shrunk so the
 *    replicate keeps the sample variance, y = x̄ + (x_I - x̄ + hε)/√(1 + h²/s²), with h = H times
 *    Silverman's rule 0.9·min(s, IQR/1.34)·n^(-1/5) (H = 0: the plain nonparametric bootstrap). The
 *    percentile indices are a smooth function of four sample quantiles (johnson.ts), which the
 *    smoothed bootstrap reproduces without the parametric curve's type; ends: percentile, BC, BCa.
 *  - double (--double B1,B2): the parametric bootstrap of the report, calibrated by a second level
 *    (Beran 1987, Biometrika 74:457-468 prepivoting; Hall 1986, Annals of Statistics 14:1431-1452
 *    [both from memory]): each outer replicate's refitted curve is bootstrapped again (B2
 *    replicates), u_b = share of its inner values below the sample's estimate, and the percentile
 *    ends are taken at the α/2 and 1 - α/2 quantiles of the u_b ('calibrated'); the same inner
 *    values give a bootstrap-t on ln(index) (sd of the inner ln values as the standard error, 'boot-t').
 *
 * Committed (test/fixtures/capability-coverage-johnson-calibration.json; Pp/Ppk/Ppu/Ppl coverage for a nominal 95 %):
 *   smoothed h = 0 (plain resampling), BCa ends, 1000 samples: n = 50 95.5/93.3/96.2/94.3, n = 125 93.2/91.1/94.7/92.6;
 *     percentile ends 97.3-100 % at both n; h = 0.5 and 1: BC/BCa 77-92 % (the kernel moves the four-quantile fit);
 *   double bootstrap, 299 × 99, 500 samples (se about 1 point): calibrated n = 50 95.6/93.8/94.4/94.2,
 *     n = 125 93.4/90.0/93.2/91.4 (the truth below the lower end 4.4-6.8 %); boot-t n = 50 94.8/89.6/91.4/86.6,
 *     n = 125 91.2/88.2/92.2/87.4; the outer percentile ends alone n = 50 95.8/97.8/94.8/96.0, n = 125 93.4/94.0/92.6/92.4.
 * None is within 1.5 points for every index at both n, so the report withholds the Johnson interval.
 * CPU: the smoothed runs about 1 minute per n; the double bootstrap 0.55 s (n = 50) and 0.9 s (n = 125) per sample.
 *
 * Run: npx tsx scripts/capability-coverage-calibration.ts N SIMULATIONS B [--smoothed 0,1] [--double 199,99] [--from S] [--boxcox]
 * Prints JSON: coverage and truth-below/above shares per rule and index (Monte Carlo se √(c(1-c)/M)).
 */
import { fitModelSpec, jackknifeIndices, makeModel, percentileCapability, type ModelSpec, type PercentileIndexName } from '../core/capability/index.js';
import { CompensatedSum } from '../core/compensated.js';
import { PlumblineError } from '../core/errors.js';
import { createRng, type Rng } from '../core/random/index.js';
import { normalCdf, normalQuantile } from '../core/special/index.js';
import { COVERAGE_SETUP, JOHNSON_SETUP } from './capability-coverage.js';

type Idx = Partial<Record<PercentileIndexName, number>>;

const args = process.argv.slice(2);
const VALUED = ['--smoothed', '--double', '--from'];
const positional = args.filter((a, i) => !a.startsWith('--') && !VALUED.includes(args[i - 1] ?? ''));
const n = Number(positional[0] ?? 50);
const simulations = Number(positional[1] ?? 200);
const replicates = Number(positional[2] ?? 999);
const opt = (name: string): number[] | null => {
  const i = args.indexOf(name);
  return i < 0 ? null : (args[i + 1] as string).split(',').map(Number);
};
const smoothedH = opt('--smoothed') ?? [];
const double = opt('--double');
const firstSample = opt('--from')?.[0] ?? 0;
const setup = args.includes('--boxcox') ? COVERAGE_SETUP : JOHNSON_SETUP;
const kind = setup.truth.kind === 'johnson' ? ({ kind: 'johnson' } as const) : ({ kind: 'boxcox' } as const);
const { truth, limits, alpha, dataSeed, bootstrapSeedBase } = setup;
const NAMES: PercentileIndexName[] = ['Pp', 'Ppk', 'Ppu', 'Ppl'];
const trueIndices = Object.fromEntries(percentileCapability(makeModel(truth), limits).indices.map((i) => [i.name, i.estimate])) as Record<PercentileIndexName, number>;

function indicesOf(spec: ModelSpec): Idx {
  const out: Idx = {};
  for (const ix of percentileCapability(makeModel(spec), limits).indices) out[ix.name] = ix.estimate;
  return out;
}

/** Refit and index a sorted replicate; {} when it cannot be refitted. */
function refit(x: Float64Array): { spec: ModelSpec | null; idx: Idx } {
  try {
    const spec = fitModelSpec(kind, x);
    return { spec, idx: indicesOf(spec) };
  } catch (e) {
    if (e instanceof PlumblineError) return { spec: null, idx: {} };
    throw e;
  }
}

function orderStatistic(sorted: readonly number[], p: number): number {
  const b = sorted.length;
  const k = Math.min(b, Math.max(1, Math.ceil((b + 1) * p - 1e-9)));
  return sorted[k - 1] as number;
}

/** Percentile / BC / BCa ends of replicate values (plain z). */
function ends(reps: readonly number[], est: number, accel: number, rule: 'percentile' | 'bc' | 'bca'): [number, number] | null {
  const ok = reps.filter((v) => Number.isFinite(v)).sort((a, b) => a - b);
  if (ok.length < 19) return null;
  const z = -normalQuantile(alpha / 2);
  if (rule === 'percentile') return [orderStatistic(ok, alpha / 2), orderStatistic(ok, 1 - alpha / 2)];
  let below = 0;
  for (const v of ok) below += v < est ? 1 : v === est ? 0.5 : 0;
  const z0 = normalQuantile(below / ok.length);
  if (!Number.isFinite(z0)) return [orderStatistic(ok, alpha / 2), orderStatistic(ok, 1 - alpha / 2)];
  const a = rule === 'bca' ? accel : 0;
  const level = (zz: number): number => normalCdf(z0 + (z0 + zz) / (1 - a * (z0 + zz)));
  return [orderStatistic(ok, level(-z)), orderStatistic(ok, level(z))];
}

function acceleration(jk: readonly number[] | undefined): number {
  if (!jk || jk.length < 3) return 0;
  const s = new CompensatedSum();
  for (const u of jk) s.add(u);
  const m = s.value / jk.length;
  const s2 = new CompensatedSum();
  const s3 = new CompensatedSum();
  for (const u of jk) {
    s2.add((m - u) ** 2);
    s3.add((m - u) ** 3);
  }
  return s2.value > 0 ? s3.value / (6 * Math.pow(s2.value, 1.5)) : 0;
}

function smoothedReplicate(x: Float64Array, h: number, mean: number, sd: number, rng: Rng): Float64Array {
  const shrink = 1 / Math.sqrt(1 + (h * h) / (sd * sd));
  const r = new Float64Array(x.length);
  for (let k = 0; k < x.length; k++) {
    const xi = x[Math.min(x.length - 1, Math.floor(rng.uniform() * x.length))] as number;
    r[k] = h > 0 ? mean + (xi - mean + h * rng.normal()) * shrink : xi;
  }
  return r.sort();
}

const tally: Record<string, Record<string, { covered: number; below: number; above: number; samples: number }>> = {};
function count(rule: string, name: PercentileIndexName, iv: [number, number] | null): void {
  if (!iv) return;
  const t = trueIndices[name];
  const c = ((tally[rule] ??= {})[name] ??= { covered: 0, below: 0, above: 0, samples: 0 });
  c.samples++;
  if (t < iv[0]) c.below++;
  else if (t > iv[1]) c.above++;
  else c.covered++;
}

const t0 = process.cpuUsage();
let counted = 0;
for (let s = firstSample; s < firstSample + simulations; s++) {
  const x = makeModel(truth).draw(createRng(dataSeed, s), n).sort();
  const fitted = refit(x);
  if (!fitted.spec) continue;
  const spec = fitted.spec;
  const est = fitted.idx;
  counted++;
  const seed = bootstrapSeedBase + s;
  const jk = jackknifeIndices(spec, x, limits);

  if (smoothedH.length > 0) {
    const ms = new CompensatedSum();
    for (const v of x) ms.add(v);
    const mean = ms.value / n;
    const vs = new CompensatedSum();
    for (const v of x) vs.add((v - mean) ** 2);
    const sd = Math.sqrt(vs.value / (n - 1));
    const iqr = (x[Math.floor(0.75 * n)] as number) - (x[Math.floor(0.25 * n)] as number);
    const silverman = 0.9 * Math.min(sd, iqr / 1.34) * Math.pow(n, -0.2);
    for (const H of smoothedH) {
      const reps: Record<string, number[]> = {};
      for (let i = 0; i < replicates; i++) {
        const r = refit(smoothedReplicate(x, H * silverman, mean, sd, createRng(seed + 600_000_000, i)));
        for (const k of NAMES) if (est[k] !== undefined) (reps[k] ??= []).push(r.idx[k] ?? Number.NaN);
      }
      for (const k of NAMES) {
        if (est[k] === undefined) continue;
        for (const rule of ['percentile', 'bc', 'bca'] as const) count(`smoothed-${H}-${rule}`, k, ends(reps[k] as number[], est[k] as number, acceleration(jk[k]), rule));
      }
    }
  }

  if (double) {
    const [b1, b2] = double as [number, number];
    const outer: Record<string, number[]> = {};
    const u: Record<string, number[]> = {};
    const tstat: Record<string, number[]> = {};
    for (let i = 0; i < b1; i++) {
      const r = refit(makeModel(spec).draw(createRng(seed, i), n).sort());
      for (const k of NAMES) if (est[k] !== undefined) (outer[k] ??= []).push(r.idx[k] ?? Number.NaN);
      if (!r.spec) continue;
      const inner: Record<string, number[]> = {};
      for (let j = 0; j < b2; j++) {
        const q = refit(makeModel(r.spec).draw(createRng(seed + 900_000_000 + i, j), n).sort());
        for (const k of NAMES) if (q.idx[k] !== undefined) (inner[k] ??= []).push(q.idx[k] as number);
      }
      for (const k of NAMES) {
        const e = est[k];
        const list = inner[k];
        const ok = r.idx[k];
        if (e === undefined || !list || list.length < 10 || ok === undefined) continue;
        let below = 0;
        for (const v of list) below += v < e ? 1 : v === e ? 0.5 : 0;
        (u[k] ??= []).push(below / list.length);
        const logs = list.filter((v) => v > 0).map(Math.log);
        if (logs.length < 10 || !(ok > 0)) continue;
        const m = logs.reduce((a, b) => a + b, 0) / logs.length;
        const se = Math.sqrt(logs.reduce((a, b) => a + (b - m) ** 2, 0) / (logs.length - 1));
        if (se > 0) (tstat[k] ??= []).push((Math.log(ok) - Math.log(e)) / se);
      }
    }
    for (const k of NAMES) {
      const e = est[k];
      if (e === undefined) continue;
      const reps = (outer[k] ?? []).filter(Number.isFinite).sort((a, b) => a - b);
      count('double-percentile', k, ends(reps, e, 0, 'percentile'));
      const us = (u[k] ?? []).sort((a, b) => a - b);
      if (us.length >= 19 && reps.length >= 19) {
        const lo = orderStatistic(us, alpha / 2);
        const hi = orderStatistic(us, 1 - alpha / 2);
        count('double-calibrated', k, [orderStatistic(reps, Math.max(lo, 0.5 / reps.length)), orderStatistic(reps, Math.min(hi, 1 - 0.5 / reps.length))]);
      }
      const ts = (tstat[k] ?? []).sort((a, b) => a - b);
      const logs = reps.filter((v) => v > 0).map(Math.log);
      if (ts.length >= 19 && logs.length >= 19 && e > 0) {
        const m = logs.reduce((a, b) => a + b, 0) / logs.length;
        const se = Math.sqrt(logs.reduce((a, b) => a + (b - m) ** 2, 0) / (logs.length - 1));
        count('double-boot-t', k, [Math.exp(Math.log(e) - orderStatistic(ts, 1 - alpha / 2) * se), Math.exp(Math.log(e) - orderStatistic(ts, alpha / 2) * se)]);
      }
    }
  }
  if ((s + 1) % 50 === 0) process.stderr.write(`sample ${s + 1}\n`);
}
const cpu = process.cpuUsage(t0);
const pct = (k: number, m: number): number => Math.round((1000 * k) / m) / 10;
const out = {
  generator: 'scripts/capability-coverage-calibration.ts',
  argv: args,
  setup: { ...setup, simulations, replicates, firstSample },
  n,
  samples: counted,
  trueIndices,
  rules: Object.fromEntries(
    Object.entries(tally).map(([rule, cells]) => [
      rule,
      Object.fromEntries(
        Object.entries(cells).map(([k, c]) => [k, { samples: c.samples, covered: c.covered, truthBelow: c.below, truthAbove: c.above, coverage: pct(c.covered, c.samples), below: pct(c.below, c.samples), above: pct(c.above, c.samples), se: pct(Math.sqrt((c.covered / c.samples) * (1 - c.covered / c.samples) * c.samples), c.samples) }]),
      ),
    ]),
  ),
  cpuSeconds: Math.round((cpu.user + cpu.system) / 1e4) / 100,
};
process.stdout.write(JSON.stringify(out, null, 1) + '\n');

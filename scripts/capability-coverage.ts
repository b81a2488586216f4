/**
 * Coverage of the capability bootstrap interval (core/capability/bootstrap.ts: parametric bootstrap,
 * model refitted per replicate, BCa ends) in a seeded simulation.
 *
 * True process: lognormal, ln x ~ Normal(0, 0.25²) (a Box–Cox model with λ = 0), limits LSL 0.45 and
 * USL 2.3, so Pp, Ppk (= Ppl, the lower side binds), Ppu and Ppl are all measured; Ppu does not
 * depend on the LSL, so its row is also the one-sided (upper limit only) case. Each simulated
 * sample of n is fitted by Box–Cox (λ by maximum likelihood), its intervals computed exactly as the
 * report does (bootstrapPercentileIntervals, the report's computation, with the default 999 replicates), and the true ISO 22514-2 indices
 * of the true model are checked against them. Coverage standard error √(c(1 - c)/M).
 *
 * Weibull setup (--weibull, test/fixtures/capability-coverage-weibull.json, same counts; the percentile
 * method on a fitted family, as the report gives it without a transformation):
 *   n = 50:  Pp 94.9, Ppk 95.2, Ppu 95.0, Ppl 95.1 %
 *   n = 125: Pp 95.7, Ppk 95.8, Ppu 95.8, Ppl 95.2 %  (4 and 7 CPU minutes)
 *
 * Run: npx tsx scripts/capability-coverage.ts 50 > a.json and ... 125 > b.json (one n per process so two
 * cores share the work; 15 and 24 minutes on a loaded 2-core machine), then merge the two `results`
 * arrays into test/fixtures/capability-coverage.json (`earlierMethod` there records the plain-BCa run).
 *
 * Result (committed, 1000 samples × 999 replicates each, nominal 95 %; Monte Carlo se ≈ 0.7 point):
 *   n = 50:  Pp 94.0, Ppk 95.3, Ppu 94.8, Ppl 94.7 %
 *   n = 125: Pp 93.7, Ppk 94.7, Ppu 94.6, Ppl 95.3 %
 * (plain BCa without the small-sample expansion, n = 50: Pp 93.1, Ppk 94.9, Ppu 93.5, Ppl 94.4 %).
 * Pp runs about 1 point low at both sizes.
 * Other fitted families (--gamma, --lognormal, --exponential; test/fixtures/capability-coverage-families.json,
 * same counts, each output stored under setups.<family>; 1-2 CPU minutes each), Pp/Ppk/Ppu/Ppl:
 *   gamma       n = 50: 95.2/95.3/95.5/95.1,  n = 125: 94.2/96.4/93.9/95.5 %
 *   lognormal   n = 50: 94.8/96.6/94.9/96.0,  n = 125: 95.5/96.5/95.2/95.7 % (Ppk wide by 1.5-1.6 points)
 *   exponential n = 50: 96.0/89.5/96.0/96.4,  n = 125: 95.2/90.1/95.2/95.5 % (Ppk: truth below the lower
 *   end in 8.1 and 7.0 % of samples, so with both limits the report withholds it: bootstrap.ts)
 * Each index also counts its misses by side (truthBelowLower: the interval overstates capability).
 * Johnson setup (--johnson, test/fixtures/capability-coverage-johnson.json, same counts):
 *   n = 50:  Pp 97.8, Ppk 97.1, Ppu 95.4, Ppl 97.3 % (over-covers)
 *   n = 125: Pp 94.8, Ppk 94.5, Ppu 93.5, Ppl 94.6 %
 * Why, and why the two-sided rate hides a short lower end when the sample is fitted as SB: see
 * scripts/capability-coverage-variants.ts (coverage split by the Johnson type fitted to the sample);
 * the rules tried to calibrate it: scripts/capability-coverage-calibration.ts. None came within 1.5
 * points at both sizes, so the report withholds the Johnson interval (bootstrap.ts intervalWithheld);
 * this run measures what the interval would be.
 */
import { makeModel, percentileCapability, bootstrapPercentileIntervals, fitModelSpec, kindOf, type ModelSpec } from '../core/capability/index.js';
import { PlumblineError } from '../core/errors.js';
import { createRng } from '../core/random/index.js';

export const COVERAGE_SETUP = {
  truth: { kind: 'boxcox', lambda: 0, mean: 0, sd: 0.25 } as ModelSpec,
  limits: { lsl: 0.45, usl: 2.3 },
  alpha: 0.05,
  replicates: 999,
  simulations: 1000,
  dataSeed: 20260501,
  bootstrapSeedBase: 7_000_000,
};

/**
 * A second setup (`--johnson`): a Johnson SU process (γ = -1, δ = 2, ξ = 1, λ = 0.5) fitted by the
 * Slifker–Shapiro percentile method, limits at its 0.05 % and 99.98 % points. The interval misses the
 * 1.5-point rule at n = 50, the four-quantile fit often picks the wrong curve type (SB for 30-37 % of
 * these SU samples) and the interval's placement depends on that choice, so the report withholds it.
 */
export const JOHNSON_SETUP = {
  truth: { kind: 'johnson', type: 'SU', gamma: -1, delta: 2, xi: 1, lambda: 0.5 } as ModelSpec,
  limits: { lsl: 0.2937177605757968, usl: 3.3941246335467676 },
  alpha: 0.05,
  replicates: 999,
  simulations: 1000,
  dataSeed: 20260502,
  bootstrapSeedBase: 8_000_000,
};

/**
 * A third setup (`--weibull`): the percentile method on a fitted family (what the report gives
 * without a transformation): a Weibull process (shape 2, scale 1) refitted by maximum likelihood as
 * a Weibull on every sample and replicate, limits LSL 0.02 and USL 2.8 (Ppk = Ppl, both sides measured).
 */
export const WEIBULL_SETUP = {
  truth: { kind: 'family', family: 'weibull', parameters: { shape: 2, scale: 1 } } as ModelSpec,
  limits: { lsl: 0.02, usl: 2.8 },
  alpha: 0.05,
  replicates: 999,
  simulations: 1000,
  dataSeed: 20260503,
  bootstrapSeedBase: 9_000_000,
};

/**
 * The other fitted families the percentile method can use without a transformation (--gamma,
 * --lognormal, --exponential; test/fixtures/capability-coverage-families.json), each refitted as its
 * own family by maximum likelihood on every sample and replicate, limits with both sides measured:
 * gamma (shape 4, scale 1), LSL 0.3, USL 14; lognormal (meanlog 0, sdlog 0.25), the Box–Cox setup's
 * limits; exponential (rate 1), LSL 0.0005, USL 7.5.
 */
export const FAMILY_SETUPS = {
  gamma: { truth: { kind: 'family', family: 'gamma', parameters: { shape: 4, scale: 1 } } as ModelSpec, limits: { lsl: 0.3, usl: 14 }, alpha: 0.05, replicates: 999, simulations: 1000, dataSeed: 20260504, bootstrapSeedBase: 10_000_000 },
  lognormal: { truth: { kind: 'family', family: 'lognormal', parameters: { meanlog: 0, sdlog: 0.25 } } as ModelSpec, limits: { lsl: 0.45, usl: 2.3 }, alpha: 0.05, replicates: 999, simulations: 1000, dataSeed: 20260505, bootstrapSeedBase: 11_000_000 },
  exponential: { truth: { kind: 'family', family: 'exponential', parameters: { rate: 1 } } as ModelSpec, limits: { lsl: 0.0005, usl: 7.5 }, alpha: 0.05, replicates: 999, simulations: 1000, dataSeed: 20260506, bootstrapSeedBase: 12_000_000 },
};

export interface SimulationResult {
  readonly sample: number;
  readonly intervals: Record<string, [number, number]>;
}

/** Simulated sample s at size n: its intervals (the same code path as the report). */
export function simulateOne(n: number, s: number, setup: typeof COVERAGE_SETUP = COVERAGE_SETUP): SimulationResult {
  const { truth, limits, alpha, replicates, dataSeed, bootstrapSeedBase } = setup;
  const x = makeModel(truth).draw(createRng(dataSeed, s), n).sort();
  let spec: ModelSpec;
  try {
    spec = fitModelSpec(kindOf(truth), x);
  } catch (e) {
    if (e instanceof PlumblineError) return { sample: s, intervals: {} }; // the sample itself cannot be fitted: counted apart
    throw e;
  }
  const r = bootstrapPercentileIntervals(spec, x, limits, alpha, bootstrapSeedBase + s, replicates);
  const intervals: Record<string, [number, number]> = {};
  for (const iv of r.intervals ?? []) intervals[iv.name] = [iv.lower, iv.upper];
  return { sample: s, intervals };
}

function main(): void {
  const family = (Object.keys(FAMILY_SETUPS) as (keyof typeof FAMILY_SETUPS)[]).find((f) => process.argv.includes(`--${f}`));
  const setup = family ? FAMILY_SETUPS[family] : process.argv.includes('--johnson') ? JOHNSON_SETUP : process.argv.includes('--weibull') ? WEIBULL_SETUP : COVERAGE_SETUP;
  const ns = process.argv.slice(2).filter((a) => !a.startsWith('--')).map(Number);
  const { truth, limits, simulations } = setup;
  const trueIndices = Object.fromEntries(percentileCapability(makeModel(truth), limits).indices.map((i) => [i.name, i.estimate]));
  const results = [];
  for (const n of ns) {
    const covered: Record<string, number> = {};
    const counted: Record<string, number> = {};
    // misses by side: the true index below the lower end (the interval overstates capability) or above the upper end
    const below: Record<string, number> = {};
    const above: Record<string, number> = {};
    const first: SimulationResult[] = [];
    const t0 = Date.now();
    for (let s = 0; s < simulations; s++) {
      const r = simulateOne(n, s, setup);
      if (s < 3) first.push(r);
      for (const [name, [lo, hi]] of Object.entries(r.intervals)) {
        const t = trueIndices[name] as number;
        counted[name] = (counted[name] ?? 0) + 1;
        covered[name] = (covered[name] ?? 0) + (lo <= t && t <= hi ? 1 : 0);
        if (t < lo) below[name] = (below[name] ?? 0) + 1;
        if (t > hi) above[name] = (above[name] ?? 0) + 1;
      }
    }
    const coverage = Object.fromEntries(
      Object.keys(counted).map((k) => {
        const m = counted[k] as number;
        const c = (covered[k] as number) / m;
        return [k, { covered: covered[k], simulations: m, coverage: c, standardError: Math.sqrt((c * (1 - c)) / m), truthBelowLower: below[k] ?? 0, truthAboveUpper: above[k] ?? 0 }];
      }),
    );
    results.push({ n, coverage, samplesWithoutInterval: simulations - Math.max(0, ...Object.values(counted)), firstSamples: first, seconds: (Date.now() - t0) / 1000 });
  }
  process.stdout.write(JSON.stringify({ generator: 'scripts/capability-coverage.ts', setup, trueIndices, results }, null, 1) + '\n');
}

if (process.argv[1] && import.meta.url.endsWith(process.argv[1].split('/').pop() as string)) main();

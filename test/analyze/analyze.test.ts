import { describe, expect, it } from 'vitest';
import {
  InputError,
  PlumblineError,
  analyze,
  analyzeAsync,
  analyzeDataset,
  createRng,
  getFamily,
  combineBootstrapCounts,
  finishAnalysis,
  planAnalysis,
  prepareSample,
  runBootstrapRange,
  splitBootstrapJob,
  type AnalysisReport,
  type BootstrapRunner,
} from '../../core/index.js';
import { readFixture } from '../helpers/fixtures.js';

// D1 of shared/references.md (made up only to check arithmetic).
const D1 = [12.4, 15.1, 9.8, 22.7, 18.3, 11.6, 14.9, 27.5, 10.2, 13.7, 19.8, 8.9, 16.4, 24.1, 12.9, 17.6, 14.2, 31.3, 11.1, 15.8];
// references.md AIC (SciPy) with m parameters; AICc = AIC + 2m(m + 1)/(n - m - 1) (Hurvich & Tsai 1989).
const REF = {
  lognormal: { aic: 126.7967, logL: -61.39836, m: 2 },
  gamma: { aic: 127.8717, logL: -61.93586, m: 2 },
  weibull: { aic: 131.0283, logL: -63.51416, m: 2 },
  normal: { aic: 131.7173, logL: -63.85863, m: 2 },
  exponential: { aic: 153.9278, logL: -75.96391, m: 1 },
} as const;

function allFiniteNumbers(v: unknown, path = 'report'): string[] {
  if (typeof v === 'number') return Number.isFinite(v) ? [] : [path];
  if (Array.isArray(v)) return v.flatMap((x, i) => allFiniteNumbers(x, `${path}[${i}]`));
  if (v && typeof v === 'object') return Object.entries(v).flatMap(([k, x]) => allFiniteNumbers(x, `${path}.${k}`));
  return [];
}

describe('analyze, D1 end to end', () => {
  const r = analyze(D1);

  it('ranks lognormal, gamma, weibull, normal, exponential by AICc, matching references.md AIC converted to AICc', () => {
    expect(r.n).toBe(20);
    expect(r.candidates.map((c) => c.family)).toEqual(['lognormal', 'gamma', 'weibull', 'normal', 'exponential']);
    for (const c of r.candidates) {
      const ref = REF[c.family as keyof typeof REF];
      const aicc = ref.aic + (2 * ref.m * (ref.m + 1)) / (20 - ref.m - 1);
      expect(Math.abs(c.aic - ref.aic), c.family).toBeLessThanOrEqual(0.5e-4);
      expect(Math.abs(c.aicc - aicc), c.family).toBeLessThanOrEqual(0.5e-4);
      expect(Math.abs(c.logLikelihood - ref.logL), c.family).toBeLessThanOrEqual(0.5e-5);
    }
    expect(r.candidates.map((c) => c.rank)).toEqual([1, 2, 3, 4, 5]);
    expect(r.candidates[0]?.deltaAicc).toBe(0);
    expect(r.rankingRule).toMatch(/AICc/);
  });

  it('has the agreed JSON shape with no infinite or NaN numbers', () => {
    const json = JSON.parse(JSON.stringify(r)) as AnalysisReport;
    expect(allFiniteNumbers(r)).toEqual([]);
    for (const c of json.candidates) {
      expect(Object.keys(c)).toEqual(expect.arrayContaining(['family', 'parameters', 'logLikelihood', 'aic', 'aicc', 'bic', 'chiSquare', 'andersonDarling']));
      const chi = c.chiSquare;
      if (!chi.computable) throw new Error('chi-square should be computable for n = 20');
      expect(Object.keys(chi)).toEqual(expect.arrayContaining(['statistic', 'dof', 'pValue', 'pValueUpper', 'bins']));
      expect(Object.keys(chi.bins[0] ?? {})).toEqual(['lower', 'upper', 'observed', 'expected']);
      expect(chi.bins[chi.bins.length - 1]?.upper).toBeNull();
      expect(Object.keys(c.andersonDarling)).toEqual(expect.arrayContaining(['statistic', 'pValue', 'method']));
    }
    expect(json.notApplicable).toEqual([]);
  });

  it('every number can be recomputed from the report (AIC, AICc, BIC, X², delta)', () => {
    for (const c of r.candidates) {
      const m = c.estimatedParameters;
      expect(c.aic).toBeCloseTo(2 * m - 2 * c.logLikelihood, 10);
      expect(c.aicc).toBeCloseTo(c.aic + (2 * m * (m + 1)) / (20 - m - 1), 10);
      expect(c.bic).toBeCloseTo(m * Math.log(20) - 2 * c.logLikelihood, 10);
      expect(c.deltaAicc).toBeCloseTo(c.aicc - (r.candidates[0]?.aicc as number), 12);
      if (c.chiSquare.computable) {
        const x2 = c.chiSquare.bins.reduce((s, b) => s + (b.observed - b.expected) ** 2 / b.expected, 0);
        expect(c.chiSquare.statistic).toBeCloseTo(x2, 12);
        expect(c.chiSquare.dof).toBe(c.chiSquare.bins.length - 1 - m);
      }
    }
  });

  it('A² and table p-values as in references.md; exponential rejected by both tests', () => {
    const by = Object.fromEntries(r.candidates.map((c) => [c.family, c]));
    expect(by['normal']?.andersonDarling.statistic).toBeCloseTo(0.61625, 5);
    expect(by['normal']?.andersonDarling.tableStatistic).toBeCloseTo(0.60668, 5);
    expect(by['normal']?.andersonDarling.modifiedStatistic).toBeCloseTo(0.63284, 5);
    expect(by['normal']?.andersonDarling.pValue).toBeCloseTo(0.0991, 4);
    expect(by['exponential']?.andersonDarling.statistic).toBeCloseTo(4.12317, 5);
    expect(by['exponential']?.rejectedBy).toEqual(['chi-square', 'anderson-darling']);
    expect(by['exponential']?.verdict).toMatch(/rejected at α = 0.05/);
    expect(by['lognormal']?.rejectedBy).toEqual([]);
    expect(by['lognormal']?.verdict).toMatch(/^Best by AICc; not rejected/);
    // Gamma A² 0.28443 is below the smallest tabulated critical value: a bound, flagged as such.
    expect(by['gamma']?.andersonDarling).toMatchObject({ pValue: 0.25, pValueIs: 'lower-bound', method: 'table' });
    expect(r.warnings.some((w) => /gamma.*bound/i.test(w))).toBe(true);
    expect(r.methods.some((m) => /Table 4.9/.test(m.source))).toBe(true);
  });

  it('a table bound that cannot decide at α falls back to the bootstrap', () => {
    // At α = 0.3 "p > 0.25" decides nothing (common practice, no source).
    const q = analyze(D1, { families: ['gamma'], alpha: 0.3, bootstrapReplicates: 99 });
    expect(q.candidates[0]?.andersonDarling.method).toBe('bootstrap');
    expect(q.candidates[0]?.andersonDarling.methodDetail).toMatch(/cannot decide/);
  });
});

describe('analyze: not applicable families and warnings', () => {
  it('reports positive-only families as not applicable with the offending count', () => {
    const x = [-1.5, 0, 2.1, 3.3, 0.7, 1.9, 2.8, 4.1, 1.2, 2.2, 3.0, 0.4];
    const r = analyze(x);
    expect(r.candidates.map((c) => c.family)).toEqual(['normal']);
    expect(r.notApplicable.map((n) => n.family).sort()).toEqual(['exponential', 'gamma', 'lognormal', 'weibull']);
    for (const n of r.notApplicable) {
      expect(n.offendingCount).toBe(2);
      expect(n.reason.length).toBeGreaterThan(10);
    }
  });

  it('warns about many ties and a small sample', () => {
    const x = [1, 1, 2, 2, 2, 3, 3, 3, 3, 4, 4, 5];
    const r = analyze(x, { families: ['normal'] });
    expect(r.summary.distinct).toBe(5);
    expect(r.warnings.some((w) => /tied values/.test(w))).toBe(true);
    expect(r.warnings.some((w) => /Small sample/.test(w))).toBe(true);
    // n = 12 cannot support a valid binning for a 2-parameter model (needs 20): not computable, with reason.
    expect(r.candidates[0]?.chiSquare.computable).toBe(false);
  });
});

describe('analyze: bad input', () => {
  const cases: [string, ArrayLike<number>, object, RegExp, string][] = [
    ['empty', [], {}, /empty/, 'too-few-values'],
    ['one value', [3.2], {}, /one value/i, 'too-few-values'],
    ['all equal', [2, 2, 2, 2, 2], {}, /equal/, 'bad-input'],
    ['NaN', [1, 2, Number.NaN, 4], {}, /not a finite number/, 'not-a-number'],
    ['Infinity', [1, 2, Number.POSITIVE_INFINITY, 4], {}, /not a finite number/, 'not-a-number'],
    ['alpha 0', D1, { alpha: 0 }, /alpha/, 'bad-option'],
    ['alpha 1', D1, { alpha: 1 }, /alpha/, 'bad-option'],
    ['alpha NaN', D1, { alpha: Number.NaN }, /alpha/, 'bad-option'],
    ['alpha string', D1, { alpha: '0.05' }, /alpha/, 'bad-option'],
    ['unknown family', D1, { families: ['cauchy'] }, /Unknown family/, 'bad-option'],
    ['duplicate family', D1, { families: ['normal', 'normal'] }, /twice/, 'bad-option'],
    ['too many bins', D1, { bins: 5 }, /largest number of bins allowed is 4/, 'bins-too-many'],
    ['bad replicates', D1, { bootstrapReplicates: 0 }, /replicates/, 'bad-option'],
    ['bad seed', D1, { seed: -1 }, /seed/, 'bad-option'],
    ['bad method', D1, { pMethod: 'guess' }, /p-value method/, 'bad-option'],
  ];
  for (const [name, values, options, message, code] of cases) {
    it(name, () => {
      let err: unknown;
      try {
        analyze(values, options);
      } catch (e) {
        err = e;
      }
      expect(err).toBeInstanceOf(InputError);
      expect((err as InputError).message).toMatch(message);
      expect((err as InputError).code).toBe(code);
    });
  }
});

describe('plan / execute split', () => {
  const options = { pMethod: 'bootstrap' as const, bootstrapReplicates: 120, seed: 9 };

  it('gives the same report with the bootstrap split over any number of "workers"', async () => {
    const direct = analyze(D1, options);
    const runner: BootstrapRunner = async (jobs) =>
      jobs.map((job) => combineBootstrapCounts(splitBootstrapJob(JSON.parse(JSON.stringify(job)), job.end - job.start, 4).map((j) => runBootstrapRange(j))));
    const split = await analyzeAsync(D1, { ...options, runner });
    expect(split).toEqual(direct);
    const plan = planAnalysis(D1, options);
    expect(plan.bootstrapJobs).toHaveLength(5);
    const report = finishAnalysis(
      plan,
      new Map(plan.bootstrapJobs.map((j) => [j.family, runBootstrapRange(j)])),
    );
    expect(report).toEqual(direct);
  });

  it('accepts an already prepared sample and gives the same report', () => {
    expect(analyze(prepareSample(D1))).toEqual(analyze(D1));
  });

  it('at n = 20 every job carries the chi-square decision; A² by table (Weibull: the simulated table by n)', () => {
    const jobs = planAnalysis(D1).bootstrapJobs;
    expect(jobs.length).toBe(5);
    for (const j of jobs) expect(j.chiSquare?.k).toBe(4);
    const r = finishAnalysis(planAnalysis(D1), jobs.map((j) => runBootstrapRange(j)));
    for (const c of r.candidates) {
      expect(c.andersonDarling.method).toBe('table');
      if (!c.chiSquare.computable) throw new Error('chi-square');
      expect(c.chiSquare.decidedBy).toBe('bootstrap');
    }
  });

  it('reports progress and can be cancelled', () => {
    const seen = new Set<string>();
    analyze(D1, { ...options, families: ['normal', 'exponential'], onProgress: (p) => seen.add(`${p.family}:${p.total}`) });
    expect([...seen].sort()).toEqual(['exponential:120', 'normal:120']);
    const signal = { aborted: false };
    let err: unknown;
    try {
      analyze(D1, { ...options, signal, onProgress: (p) => { if (p.done === 5) signal.aborted = true; } });
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(PlumblineError);
    expect((err as PlumblineError).code).toBe('cancelled');
  });
});

describe('a threshold fit with no interior maximum is not ranked or tested', () => {
  // Fixture: scripts/fixtures/threshold.py — 30 values from an exponential with mean 40 (numpy
  // default_rng(1)); SciPy's weibull_min profile log-likelihood is still rising at a threshold
  // 1e-14 × range below the smallest value (Smith 1985, Biometrika 72:67-90: unbounded for shape < 1).
  const sample: number[] = readFixture('threshold.json').exponentialMean40.sample;

  it('weibull3 is listed as no-interior-maximum, absent from the ranking, and the verdicts are the two-parameter models\'', () => {
    const r = analyze(sample, { families: ['exponential', 'weibull', 'weibull3'], bootstrapReplicates: 19 });
    expect(r.candidates.map((c) => c.family).sort()).toEqual(['exponential', 'weibull']);
    expect(r.candidates[0]?.rank).toBe(1);
    const na = r.notApplicable.find((x) => x.family === 'weibull3');
    expect(na?.kind).toBe('no-interior-maximum');
    expect(na?.reason).toMatch(/no interior maximum/);
    expect(r.warnings.join('\n')).toMatch(/weibull3: not ranked or tested/);
  });

  it('and stays out of the decision numbers and the sensitivity table', () => {
    const r = analyzeDataset({ values: sample }, { families: ['exponential', 'weibull', 'weibull3'], usl: 200, bootstrapReplicates: 19 });
    expect(r.candidates.some((c) => c.family === 'weibull3')).toBe(false);
    const rows = JSON.stringify(r.sensitivity ?? []);
    expect(rows).not.toMatch(/weibull3/);
    expect(rows).toMatch(/exponential/);
  });
});

describe('the chi-square decision at small n has the right size (parametric bootstrap, refitting raw values)', () => {
  it('normal, n = 20, k = 4: rejection rate at α = 0.05 within 4 binomial SE of 5 % (was about 10 % with k - 1 - m dof)', () => {
    // Seeded Monte Carlo, R = 1000 samples, B = 99 bootstrap replicates each: SE = √(0.05·0.95/R) = 0.69 %.
    // Measured size of the k - 1 - m reference at n = 20: 10.0-10.8 % (20,000 samples per family).
    const R = 1000;
    let rejected = 0;
    let asymptotic = 0;
    for (let i = 0; i < R; i++) {
      const xs = getFamily('normal').random({ mean: 10, sd: 2 }, createRng(31, i), 20);
      const r = analyze(xs, { families: ['normal'], bootstrapReplicates: 99, seed: 1000 + i });
      const c = r.candidates[0]?.chiSquare;
      if (!c?.computable) throw new Error('chi-square not computable');
      expect(c.decidedBy).toBe('bootstrap');
      if (c.rejected) rejected++;
      if (c.pValue < 0.05) asymptotic++;
    }
    const se = Math.sqrt((0.05 * 0.95) / R);
    expect(Math.abs(rejected / R - 0.05)).toBeLessThan(4 * se);
    expect(asymptotic / R).toBeGreaterThan(0.05 + 4 * se); // the asymptotic k - 1 - m reference is too liberal here
  });
});

describe('A² tables whose size is off switch to the bootstrap automatically, and say so', () => {
  it('Weibull below the simulated table (n < 5) and gamma with a fitted shape below 0.5: bootstrap, with a warning', () => {
    const w = analyze(getFamily('weibull').random({ shape: 1.5, scale: 4 }, createRng(5, 0), 4), { families: ['weibull'], bootstrapReplicates: 19 });
    expect(w.candidates[0]?.andersonDarling.method).toBe('bootstrap');
    expect(w.warnings.join('\n')).toMatch(/Weibull: Anderson–Darling p-value by bootstrap, not the table/);
    const g = analyze(getFamily('gamma').random({ shape: 0.1, scale: 3 }, createRng(5, 1), 200), { families: ['gamma'], bootstrapReplicates: 19 });
    expect(g.candidates[0]?.andersonDarling.method).toBe('bootstrap');
    expect(g.warnings.join('\n')).toMatch(/below the simulated table's smallest shape/);
    const w200 = analyze(getFamily('weibull').random({ shape: 1.5, scale: 4 }, createRng(5, 2), 200), { families: ['weibull'] });
    expect(w200.candidates[0]?.andersonDarling.method).toBe('table');
  });
  it('gamma below n = 20: bootstrap, with a warning (the n = 200 table rejected 4.03 % at n = 10, shape 2; docs/size-study.md)', () => {
    const g10 = analyze(getFamily('gamma').random({ shape: 2, scale: 3 }, createRng(5, 3), 10), { families: ['gamma'], bootstrapReplicates: 19 });
    expect(g10.candidates[0]?.andersonDarling.method).toBe('bootstrap');
    expect(g10.warnings.join('\n')).toMatch(/[Gg]amma: Anderson–Darling p-value by bootstrap, not the table: the simulated gamma table was built at n = 200/);
    const g20 = analyze(getFamily('gamma').random({ shape: 2, scale: 3 }, createRng(5, 4), 20), { families: ['gamma'], bootstrapReplicates: 19 });
    expect(g20.candidates[0]?.andersonDarling.method).toBe('table');
  });
  it('gamma shape 0.1, n = 200: A² rejection rate within 4 binomial SE of 5 % (the table gave 9.6 %)', () => {
    // Seeded Monte Carlo, R = 600, B = 99: SE = √(0.05·0.95/R) = 0.89 %.
    const R = 600;
    let rejected = 0;
    for (let i = 0; i < R; i++) {
      const xs = getFamily('gamma').random({ shape: 0.1, scale: 3 }, createRng(77, i), 200);
      const r = analyze(xs, { families: ['gamma'], bootstrapReplicates: 99, seed: 500 + i });
      if (r.candidates[0]?.andersonDarling.rejected) rejected++;
    }
    expect(Math.abs(rejected / R - 0.05)).toBeLessThan(4 * Math.sqrt((0.05 * 0.95) / R));
  });
});

/**
 * analyzeDataset: the trade workflows composed into one report (issue 4), checked through the
 * report itself. Every check names its source.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyze, analyzeDataset, analyzeDatasetAsync, combineBootstrapCounts, InputError, readColumns, runBootstrapRange, type DatasetCandidate, type NumberColumn } from '../../core/index.js';

// NIST/SEMATECH e-Handbook §8.4.1.3 (values in ../shared/references.md): 20 units, 10 failures,
// 10 still running at 500 h; Weibull MLE shape 1.7208, scale 606.53.
const NIST_FAILURES = [54, 187, 216, 240, 244, 335, 361, 373, 375, 386];
const NIST_TIMES = [...NIST_FAILURES, ...Array.from({ length: 10 }, () => 500)];
const NIST_STATUS = [...NIST_FAILURES.map(() => 1), ...Array.from({ length: 10 }, () => 0)];

// references.md "A small check set computed with SciPy", D1 (made up, n = 20).
const D1 = [12.4, 15.1, 9.8, 22.7, 18.3, 11.6, 14.9, 27.5, 10.2, 13.7, 19.8, 8.9, 16.4, 24.1, 12.9, 17.6, 14.2, 31.3, 11.1, 15.8];

/** Φ(z) by composite Simpson integration of the standard normal density from -40 (independent of the core). */
function phi(z: number): number {
  const a = -40;
  const m = 200000;
  const h = (z - a) / m;
  const f = (x: number): number => Math.exp(-0.5 * x * x) / Math.sqrt(2 * Math.PI);
  let s = f(a) + f(z);
  for (let i = 1; i < m; i++) s += (i % 2 === 1 ? 4 : 2) * f(a + i * h);
  return (s * h) / 3;
}

function byFamily(cs: readonly DatasetCandidate[], f: string): DatasetCandidate {
  const c = cs.find((x) => x.family === f);
  if (!c) throw new Error(`no ${f} candidate`);
  return c;
}

describe('life data with suspensions (NIST e-Handbook §8.4.1.3)', () => {
  const r = analyzeDataset({ values: NIST_TIMES, status: NIST_STATUS }, { bLifePercents: [1, 10, 50], reliabilityTimes: [100, 300], bootstrapReplicates: 19 });

  it('n counts all units; failures and suspensions reported separately (issue 4)', () => {
    expect(r.dataKind).toBe('censored');
    expect(r.n).toBe(20);
    expect(r.life?.units).toBe(20);
    expect(r.life?.failures).toBe(10);
    expect(r.life?.suspensions).toBe(10);
  });

  it('Weibull censored MLE shape 1.7208, scale 606.53 (references.md, NIST §8.4.1.3 via SciPy CensoredData), to the digits printed', () => {
    const w = byFamily(r.candidates, 'weibull');
    expect(Math.abs((w.parameters.shape as number) - 1.7208)).toBeLessThan(5e-5);
    expect(Math.abs((w.parameters.scale as number) - 606.53)).toBeLessThan(5e-3);
  });

  it('bLives equal the fitted quantiles scale·(-ln(1 - p))^(1/shape), with lower < estimate < upper (Weibull quantile, closed form)', () => {
    const w = byFamily(r.candidates, 'weibull');
    const shape = w.parameters.shape as number;
    const scale = w.parameters.scale as number;
    expect(w.bLives?.map((b) => b.percent)).toEqual([1, 10, 50]);
    for (const b of w.bLives ?? []) {
      const q = scale * Math.pow(-Math.log1p(-b.percent / 100), 1 / shape);
      expect(Math.abs(b.estimate - q) / q).toBeLessThan(1e-12);
      expect(b.lower).toBeLessThan(b.estimate);
      expect(b.upper).toBeGreaterThan(b.estimate);
      expect(b.confidence).toBe(0.9);
    }
    // B10 from the published parameters 1.7208 / 606.53 (references.md): 606.53·(-ln 0.9)^(1/1.7208);
    // agrees to the 4 to 5 digits of those parameters.
    const b10 = (w.bLives ?? [])[1]!.estimate;
    const published = 606.53 * Math.pow(-Math.log(0.9), 1 / 1.7208);
    expect(Math.abs(b10 - published) / published).toBeLessThan(2e-4);
    expect(w.bLifeMethod).toMatch(/likelihood-ratio/);
  });

  it('reliability at the chosen times is S(t) of the fit with lower < estimate, and mean life = ∫ S(t) dt (definition of the mean of a positive variable)', () => {
    const w = byFamily(r.candidates, 'weibull');
    const shape = w.parameters.shape as number;
    const scale = w.parameters.scale as number;
    for (const rel of w.reliability ?? []) {
      const s = Math.exp(-Math.pow(rel.time / scale, shape));
      expect(Math.abs(rel.estimate - s)).toBeLessThan(1e-12);
      expect(rel.lower).toBeLessThan(rel.estimate);
    }
    // Exponential mean 1/rate (closed form); the Weibull mean through its definition ∫ S(t) dt
    // (trapezoid rule on a fine grid, common practice, no source).
    const e = byFamily(r.candidates, 'exponential');
    expect(Math.abs((e.meanLife as number) - 1 / (e.parameters.rate as number))).toBeLessThan(1e-9);
    let integral = 0;
    const h = 0.05;
    for (let t = 0; t < 20 * scale; t += h) integral += (h * (Math.exp(-Math.pow(t / scale, shape)) + Math.exp(-Math.pow((t + h) / scale, shape)))) / 2;
    expect(Math.abs((w.meanLife as number) - integral) / integral).toBeLessThan(1e-6);
  });

  it('chi-square is not computable with the censored-sample reason; AD is the censoring-reproducing bootstrap (issue 4)', () => {
    for (const c of r.candidates) {
      expect(c.chiSquare.computable).toBe(false);
      if (!c.chiSquare.computable) expect(c.chiSquare.reason).toMatch(/censored samples cannot be binned/);
      expect(c.andersonDarling.method).toBe('bootstrap');
      expect(c.andersonDarling.replicates).toBeGreaterThan(0);
      expect(c.rejectedBy.every((t) => t === 'anderson-darling')).toBe(true);
    }
    expect(r.life?.chiSquare.applies).toBe(false);
    expect(r.life?.plot.method).toBe('johnson-benard');
    expect(r.life?.plot.points).toHaveLength(10);
    expect(r.life?.cautions.join(' ')).toMatch(/representative/);
  });

  it('candidates are ranked by AICc with n = all units: AICc = AIC + 2m(m+1)/(n-m-1) with n = 20 (Hurvich & Tsai 1989)', () => {
    for (const c of r.candidates) {
      const m = c.estimatedParameters;
      expect(Math.abs(c.aicc - (c.aic + (2 * m * (m + 1)) / (20 - m - 1)))).toBeLessThan(1e-9 * Math.abs(c.aicc));
    }
    const aiccs = r.candidates.map((c) => c.aicc);
    expect([...aiccs].sort((a, b) => a - b)).toEqual(aiccs);
  });

  it('bounds widen as the confidence rises (property, issue 4)', () => {
    const narrow = analyzeDataset({ values: NIST_TIMES, status: NIST_STATUS }, { families: ['weibull'], confidence: 0.8, bootstrapReplicates: 1 });
    const wide = analyzeDataset({ values: NIST_TIMES, status: NIST_STATUS }, { families: ['weibull'], confidence: 0.95, bootstrapReplicates: 1 });
    const a = narrow.candidates[0]!.bLives![0]!;
    const b = wide.candidates[0]!.bLives![0]!;
    expect(b.lower).toBeLessThan(a.lower);
    expect(b.upper).toBeGreaterThan(a.upper);
  });

  it('censoring nothing reproduces the uncensored Weibull fit of the plain analysis (property, issue 4)', () => {
    const all = analyzeDataset({ values: NIST_FAILURES, status: NIST_FAILURES.map(() => 1) }, { families: ['weibull'], bootstrapReplicates: 1 });
    const plain = analyze(NIST_FAILURES, { families: ['weibull'] });
    for (const k of ['shape', 'scale']) {
      const x = all.candidates[0]!.parameters[k] as number;
      const y = plain.candidates[0]!.parameters[k] as number;
      expect(Math.abs(x - y) / y).toBeLessThan(1e-7);
    }
  });

  it('the sensitivity table lists each B-life under every passing candidate and only those (issue 4)', () => {
    const passing = r.candidates.filter((c) => c.rejectedBy.length === 0).map((c) => c.family);
    const row = r.sensitivity?.find((s) => s.quantity === 'B10 life');
    expect(row).toBeDefined();
    if (passing.length > 0) {
      expect(row!.basis).toBe('passing');
      expect(row!.values.map((v) => v.family)).toEqual(passing);
    }
    for (const v of row!.values) expect(v.estimate).toBe(byFamily(r.candidates, v.family).bLives![1]!.estimate);
    expect(row!.min).toBe(Math.min(...row!.values.map((v) => v.estimate)));
  });

  it('a status other than 0/1 and B-lives without a status column are input errors', () => {
    expect(() => analyzeDataset({ values: [1, 2, 3, 4], status: [1, 1, 2, 0] })).toThrow(InputError);
    expect(() => analyzeDataset({ values: D1 }, { bLifePercents: [10] })).toThrow(/status column/);
  });
});

describe('capability on D1 with LSL 5, USL 35 (references.md)', () => {
  const r = analyzeDataset({ values: D1 }, { lsl: 5, usl: 35 });

  it('Pp 0.826792 and Ppk 0.629189 (references.md, SciPy), to the digits printed', () => {
    const pp = r.capability?.overall.find((i) => i.name === 'Pp');
    const ppk = r.capability?.overall.find((i) => i.name === 'Ppk');
    expect(Math.abs(pp!.estimate - 0.826792)).toBeLessThan(5e-7);
    expect(Math.abs(ppk!.estimate - 0.629189)).toBeLessThan(5e-7);
    expect(pp!.lower).toBeLessThan(pp!.estimate);
    expect(ppk!.intervalMethod).toMatch(/Bissell/);
  });

  it('ppm of the normal candidate = 1e6·(Φ((5-μ)/s) + Φ((μ-35)/s)) at its fitted μ and the overall sample sd s (n − 1) (Φ by Simpson integration here)', () => {
    const n = byFamily(r.candidates, 'normal');
    const mu = n.parameters.mean as number;
    const sd = n.parameters.sd as number;
    // references.md: normal MLE mean 16.415, sd 5.894343.
    expect(Math.abs(mu - 16.415)).toBeLessThan(5e-4);
    expect(Math.abs(sd - 5.894343)).toBeLessThan(5e-7);
    // The ppm uses the overall sample sd (n - 1) that Pp/Ppk use (one normal model, one ppm): σ = sd_ML·√(n/(n-1)).
    const s = sd * Math.sqrt(D1.length / (D1.length - 1));
    const expected = 1e6 * (phi((5 - mu) / s) + phi((mu - 35) / s));
    expect(n.ppmOutOfSpec!.total).toBeCloseTo(r.capability!.normalPpm.total, 9);
    expect(Math.abs(n.ppmOutOfSpec!.total - expected) / expected).toBeLessThan(1e-8);
    for (const c of r.candidates) expect(c.ppmOutOfSpec).toBeDefined();
  });

  it('normality gate: the normal passes AD at 0.05 with Table 4.9 p = 0.0991 (references.md), so no percentile method', () => {
    expect(r.capability?.normality?.passes).toBe(true);
    expect(Math.abs((r.capability?.normality?.pValue as number) - 0.0991)).toBeLessThan(5e-5);
    expect(r.capability?.percentile).toBeNull();
    expect(r.capability?.cautions.join(' ')).toMatch(/safety-critical/);
  });

  it('when the normal is not a candidate, the percentile method (ISO 22514-2) of the best passing non-normal candidate is given', () => {
    const nn = analyzeDataset({ values: D1 }, { lsl: 5, usl: 35, families: ['lognormal', 'gamma', 'weibull'] });
    const best = nn.candidates.find((c) => c.rejectedBy.length === 0)!;
    expect(nn.capability?.percentileFamily).toBe(best.family);
    expect(nn.capability?.percentile?.indices.find((i) => i.name === 'Pp')).toBeDefined();
  });

  it('the sensitivity table lists ppm only under candidates that pass both tests (issue 4)', () => {
    const row = r.sensitivity?.find((s) => s.quantity === 'ppm out of spec');
    const passing = r.candidates.filter((c) => c.rejectedBy.length === 0).map((c) => c.family);
    // references.md D1: the exponential fit (A² 4.12) is rejected; the other four are not.
    expect(passing).not.toContain('exponential');
    expect(row?.basis).toBe('passing');
    expect(row?.values.map((v) => v.family)).toEqual(passing);
    expect(row?.values.every((v) => v.passes)).toBe(true);
  });
});

describe('flood frequency through analyzeDataset', () => {
  const csv = readFileSync(new URL('../../datasets/river-peaks.csv', import.meta.url), 'utf8');
  const t = readColumns(csv, [
    { select: 'peak_flow_m3s', kind: 'number' },
    { select: 'year', kind: 'number' },
  ]);
  const peaks = (t.columns[0] as NumberColumn).values;
  const years = (t.columns[1] as NumberColumn).values;
  const periods = [2, 10, 50, 100, 500];
  const r = analyzeDataset({ values: peaks, order: years }, { returnPeriods: periods, designLife: 50, plottingPosition: 'gringorten', bootstrapReplicates: 49 });

  it('adds gumbel and gev to the default families', () => {
    expect(r.options.families).toEqual(['normal', 'lognormal', 'gamma', 'weibull', 'exponential', 'gumbel', 'gev']);
  });

  it('return levels increase with T under every candidate, with lower < estimate < upper where bounded (property, issue 4)', () => {
    for (const c of r.candidates) {
      const rl = c.returnLevels!;
      expect(rl.map((l) => l.period)).toEqual(periods);
      for (let i = 1; i < rl.length; i++) expect(rl[i]!.estimate).toBeGreaterThan(rl[i - 1]!.estimate);
      for (const l of rl) {
        if (l.lower !== null) expect(l.lower).toBeLessThan(l.estimate);
        if (l.upper !== null) expect(l.upper).toBeGreaterThan(l.estimate);
      }
    }
  });

  it('Gumbel return level z_T = μ - β ln(-ln(1 - 1/T)) (Coles 2001 eq. 3.4 with ξ = 0) and profile intervals', () => {
    const g = byFamily(r.candidates, 'gumbel');
    const mu = g.parameters.location as number;
    const beta = g.parameters.scale as number;
    for (const l of g.returnLevels!) {
      const z = mu - beta * Math.log(-Math.log1p(-1 / l.period));
      expect(Math.abs(l.estimate - z) / z).toBeLessThan(1e-12);
    }
    expect(g.returnLevelMethod).toMatch(/profile/);
  });

  it('design-life exceedance 1 - (1 - 1/T)^L, the far-beyond-record warning, the GEV sign note and the caution', () => {
    for (const e of r.flood!.designLife!.exceedance) expect(Math.abs(e.probability - (1 - Math.pow(1 - 1 / e.period, 50)))).toBeLessThan(1e-12);
    expect(r.flood!.beyondRecord).toEqual([500]); // 60-year record: T > 120 (RECORD_MULTIPLE 2, common practice)
    expect(r.flood!.warnings.join(' ')).toMatch(/twice the 60-year record/);
    expect(r.flood!.gevSignNote).toMatch(/ξ > 0 is a heavy upper tail/);
    expect(r.flood!.cautions.join(' ')).toMatch(/governing guideline/);
    expect(r.flood!.plottingPositions.formula).toBe('gringorten');
    // Gringorten (1963): p_1 = (1 - 0.44)/(n + 0.12).
    expect(Math.abs(r.flood!.plottingPositions.points[0]!.nonExceedance - 0.56 / 60.12)).toBeLessThan(1e-15);
  });

  it('trend from the year column: reversing the years negates S (Mann–Kendall definition, Kendall 1975)', () => {
    expect(r.trend?.orderFrom).toBe('column');
    expect(r.trend?.n).toBe(60);
    const rev = analyzeDataset({ values: peaks, order: Array.from(years, (y) => -y) }, { families: ['normal'] });
    expect(rev.trend?.s).toBe(-(r.trend?.s as number));
  });

  it('trend: true uses the row order: the same S as an order column 1..n (Mann–Kendall definition)', () => {
    const a = analyzeDataset({ values: peaks }, { families: ['normal'], trend: true });
    const b = analyzeDataset({ values: peaks, order: Array.from(peaks, (_, i) => i + 1) }, { families: ['normal'] });
    expect(a.trend?.orderFrom).toBe('row order');
    expect(a.trend?.s).toBe(b.trend?.s);
  });

  it('sensitivity: one row per return period, only passing candidates', () => {
    const passing = r.candidates.filter((c) => c.rejectedBy.length === 0).map((c) => c.family);
    const rows = r.sensitivity!.filter((s) => s.quantity.startsWith('return level'));
    expect(rows.map((s) => s.quantity)).toEqual(periods.map((T) => `return level T=${T}`));
    for (const row of rows) {
      if (passing.length > 0) expect(row.values.map((v) => v.family)).toEqual(passing);
      expect(row.max).toBeGreaterThanOrEqual(row.min);
    }
  });
});

describe('threshold models', () => {
  it('weibull3 and lognormal3 are selectable; their AD p-value is by bootstrap (no published table, references.md)', () => {
    const r = analyzeDataset({ values: D1 }, { families: ['weibull3', 'lognormal3', 'weibull'], bootstrapReplicates: 19 });
    for (const f of ['weibull3', 'lognormal3']) {
      const c = r.candidates.find((x) => x.family === f) ?? null;
      const na = r.notApplicable.find((x) => x.family === f) ?? null;
      expect(c !== null || na !== null).toBe(true);
      if (c) {
        expect(c.andersonDarling.method).toBe('bootstrap');
        expect(c.parameters.threshold as number).toBeLessThan(Math.min(...D1));
        // Fit warnings appear with the candidate and, prefixed by its label, in the report warnings.
        for (const w of c.warnings ?? []) expect(r.warnings.some((x) => x.endsWith(w))).toBe(true);
      }
    }
  });
});

describe('the plain report keeps the issue-2 shape', () => {
  it('a column without workflow options gives exactly the issue-2 report plus dataKind (same numbers as analyze)', () => {
    const r = analyzeDataset({ values: D1 });
    const plain = analyze(D1);
    const { dataKind, ...rest } = r;
    expect(dataKind).toBe('complete');
    expect(Object.keys(rest).sort()).toEqual(['candidates', 'methods', 'n', 'notApplicable', 'options', 'rankingRule', 'software', 'summary', 'warnings']);
    expect(rest).toEqual(plain);
  });
});

describe('analyzeDatasetAsync', () => {
  it('with a runner that splits each bootstrap job in two gives the same report as analyzeDataset (bootstrap streams per replicate, core/gof)', async () => {
    const opts = { families: ['gumbel', 'gev'] as const, returnPeriods: [10, 100], bootstrapReplicates: 20 };
    const sync = analyzeDataset({ values: D1 }, { ...opts, families: [...opts.families] });
    let jobsSeen = 0;
    const asyncReport = await analyzeDatasetAsync(
      { values: D1 },
      {
        ...opts,
        families: [...opts.families],
        runner: async (jobs) =>
          jobs.map((job) => {
            jobsSeen++;
            const mid = Math.floor((job.start + job.end) / 2);
            return combineBootstrapCounts([runBootstrapRange({ ...job, end: mid }), runBootstrapRange({ ...job, start: mid })]);
          }),
      },
    );
    expect(jobsSeen).toBeGreaterThan(0);
    expect(asyncReport).toEqual(sync);
  });
});

describe('grouped counts', () => {
  // Classes invented for the check (common practice, no source); the numbers checked are rules.
  const classes = [
    { lower: 0, upper: 100, count: 12 },
    { lower: 100, upper: 200, count: 30 },
    { lower: 200, upper: 300, count: 25 },
    { lower: 300, upper: 400, count: 10 },
    { lower: 400, upper: 600, count: 5 },
  ];
  const r = analyzeDataset({ grouped: classes }, { lsl: 20, usl: 500 });

  it('n is the total count; chi-square dof = k - 1 - m on the merged cells (Cramér 1946 §30.3); AD not offered with the reason', () => {
    expect(r.dataKind).toBe('grouped');
    expect(r.n).toBe(82);
    expect(r.grouped.total).toBe(82);
    for (const c of r.candidates) {
      expect(c.andersonDarling.offered).toBe(false);
      expect(c.andersonDarling.reason).toMatch(/individual values/);
      if (c.chiSquare.computable) {
        expect(c.chiSquare.dof).toBe(c.chiSquare.k - 1 - c.estimatedParameters);
        for (const b of c.chiSquare.bins) expect(b.expected).toBeGreaterThanOrEqual(5 - 1e-9);
        expect(c.chiSquare.bins.reduce((a, b) => a + b.observed, 0)).toBe(82);
      }
    }
    expect(r.grouped.chiSquareRule).toMatch(/exact/);
  });

  it('ranked by AICc with n = total count (Hurvich & Tsai 1989) and ppm for every candidate', () => {
    for (const c of r.candidates) {
      const m = c.estimatedParameters;
      expect(Math.abs(c.aicc - (c.aic + (2 * m * (m + 1)) / (82 - m - 1)))).toBeLessThan(1e-9 * Math.abs(c.aicc));
      expect(c.ppmOutOfSpec).toBeDefined();
    }
    expect(r.candidates.map((c) => c.rank)).toEqual(r.candidates.map((_, i) => i + 1));
  });
});

/**
 * The fast double bootstrap p-value (core/life/fast-double-bootstrap.ts) against the definition of
 * Davidson & MacKinnon (2007, Computational Statistics & Data Analysis 51:3259-3281 [from memory]),
 * written here in its own notation: p̂* = (1/B) Σ I(τ*_j > τ̂), Q̂** = the (1 − p̂*) quantile of the
 * τ**_j (the smallest x whose empirical distribution function reaches 1 − p̂*), p̂** = (1/B) Σ
 * I(τ*_j > Q̂**). The product's counting form is (1 + B·p̂**)/(B + 1); and the staggered censored
 * bootstrap, which decides by it, on the worker path (ranges combined) and against one replicate
 * pair recomputed from its definition.
 */
import { describe, expect, it } from 'vitest';
import { getFamily } from '../../core/families/index.js';
import { combineBootstrapCounts } from '../../core/gof/index.js';
import { censoredGofBootstrap, fitCensored, prepareLifeData } from '../../core/life/index.js';
import { censoredGofStatistic, censoringDistribution } from '../../core/life/bootstrap.js';
import { censoredGofFromCounts, censoredReplicateDrawer, runCensoredReplicates } from '../../core/life/bootstrap-range.js';
import { buildLifeData } from '../../core/life/data.js';
import { fastDoubleBootstrapPValue } from '../../core/life/fast-double-bootstrap.js';
import { createRng } from '../../core/random/index.js';

/** Davidson & MacKinnon's p̂** with shares and an empirical quantile (no NaN handling: finite inputs only). */
function definition(observed: number, first: readonly number[], second: readonly number[]): number {
  const B = first.length;
  const pStar = first.filter((x) => x > observed).length / B;
  const ecdf = (x: number): number => second.filter((y) => y <= x).length / B;
  const candidates = [...second].sort((a, b) => a - b);
  const q = candidates.find((x) => ecdf(x) >= 1 - pStar - 1e-12) ?? Number.NEGATIVE_INFINITY;
  return first.filter((x) => x > q).length / B;
}

describe('fast double bootstrap p-value', () => {
  it("equals Davidson & MacKinnon's definition (counting form (1 + B p**)/(B + 1)) on seeded statistics", () => {
    const rng = createRng(77, 0);
    for (let k = 0; k < 200; k++) {
      const B = 19 + (k % 5) * 20;
      const shift = (k % 7) * 0.15 - 0.45; // second level drifted either way from the first
      const first = Array.from({ length: B }, () => -Math.log(rng.uniform()));
      const second = Array.from({ length: B }, () => -Math.log(rng.uniform()) + shift);
      const observed = -Math.log(rng.uniform());
      const r = fastDoubleBootstrapPValue(observed, first, second);
      // Where every τ* exceeds τ̂ (p̂* = 1) the quantile of order 0 is a convention; the counting form gives p = 1 there,
      // as the ordinary p-value is 1 (and with equal levels p** must equal it: next test).
      if (first.every((x) => x >= observed)) expect(r.pValue).toBe(1);
      else expect(r.pValue).toBeCloseTo((1 + B * definition(observed, first, second)) / (B + 1), 12);
      expect(r.firstLevelPValue).toBeCloseTo((1 + first.filter((x) => x >= observed).length) / (B + 1), 12);
    }
  });

  it('a worked case: τ̂ = 3.2, τ* = 5..1, τ** = 4.5..0.5: two τ* exceed, Q = 2.5 (third largest τ**), three τ* exceed Q, p = 4/6', () => {
    const r = fastDoubleBootstrapPValue(3.2, [5, 4, 3, 2, 1], [4.5, 3.5, 2.5, 1.5, 0.5]);
    expect(r.firstLevelPValue).toBeCloseTo(3 / 6, 15);
    expect(r.pValue).toBeCloseTo(4 / 6, 15);
  });

  it('with the same statistics at both levels it is the ordinary bootstrap p-value', () => {
    const rng = createRng(78, 0);
    const first = Array.from({ length: 99 }, () => rng.normal());
    for (const observed of [-3, -0.5, 0, 0.7, 1.9, 5]) {
      const r = fastDoubleBootstrapPValue(observed, first, first);
      expect(r.pValue).toBeCloseTo(r.firstLevelPValue, 15);
    }
  });

  it('replicates that could not be drawn or refitted can only raise it (first level +∞, second level −∞)', () => {
    const rng = createRng(79, 0);
    for (let k = 0; k < 100; k++) {
      const first = Array.from({ length: 39 }, () => rng.normal());
      const second = Array.from({ length: 39 }, () => rng.normal() + 0.3);
      const observed = 1 + rng.normal();
      const base = fastDoubleBootstrapPValue(observed, first, second).pValue;
      const j = k % 39;
      const f2 = [...first];
      f2[j] = Number.NaN;
      const s2 = [...second];
      s2[j] = Number.NaN;
      expect(fastDoubleBootstrapPValue(observed, f2, second).pValue).toBeGreaterThanOrEqual(base);
      expect(fastDoubleBootstrapPValue(observed, first, s2).pValue).toBeGreaterThanOrEqual(base);
      // JSON turns NaN into null: read the same.
      expect(fastDoubleBootstrapPValue(observed, JSON.parse(JSON.stringify(f2)), second).pValue).toBe(fastDoubleBootstrapPValue(observed, f2, second).pValue);
    }
    expect(fastDoubleBootstrapPValue(0, [1, 2, 3], [Number.NaN, Number.NaN, Number.NaN]).pValue).toBe(1);
  });
});

describe('staggered censored bootstrap: decided by the fast double bootstrap', () => {
  // Staggered design (withdrawals at 5, 10, 15, 30 between and after failures), as in test/life/gof.test.ts.
  const times = [5, 8, 10, 12, 15, 20, 25, 30, 6.5, 17, 22, 27];
  const failed = [0, 1, 0, 1, 0, 1, 1, 0, 1, 1, 1, 0];

  it('p-value from both levels, the same when the replicates run in ranges and are combined (the worker path)', () => {
    // A staggered set the Weibull fits only fairly (p near the middle, where the two p-values differ at this seed).
    const d = prepareLifeData({
      times: [3, 4, 4.5, 5, 8, 10, 12, 15, 20, 25, 30, 6.5, 17, 22, 27, 40, 45, 60],
      failed: [1, 1, 1, 0, 1, 0, 1, 0, 1, 1, 0, 1, 1, 1, 0, 1, 0, 1],
    });
    const fit = fitCensored('weibull', d);
    if (!fit.ok) throw new Error('fit');
    const r = censoredGofBootstrap(fit, d, { replicates: 39, seed: 11 });
    const whole = runCensoredReplicates('weibull', fit.parameters, d, r.statistic, 11, 0, 39);
    expect(whole.firstLevel).toHaveLength(39);
    expect(whole.secondLevel).toHaveLength(39);
    const fdb = fastDoubleBootstrapPValue(r.statistic, whole.firstLevel!, whole.secondLevel!);
    expect(r.pValue).toBe(fdb.pValue);
    expect(r.firstLevelPValue).toBe((1 + whole.exceed + whole.failed) / 40);
    expect(r.pValue).not.toBe(r.firstLevelPValue);
    const parts = [
      runCensoredReplicates('weibull', fit.parameters, d, r.statistic, 11, 20, 39),
      runCensoredReplicates('weibull', fit.parameters, d, r.statistic, 11, 0, 7),
      runCensoredReplicates('weibull', fit.parameters, d, r.statistic, 11, 7, 20),
    ];
    const combined = combineBootstrapCounts(parts);
    expect(combined.firstLevel).toEqual(whole.firstLevel);
    expect(combined.secondLevel).toEqual(whole.secondLevel);
    expect(censoredGofFromCounts(r.statistic, combined, 'staggered').pValue).toBe(r.pValue);
    // Type I data (every suspension at the end) keep the single bootstrap: no second level.
    const t1 = prepareLifeData({ times: [3, 5, 8, 12, 15, 15, 15], failed: [1, 1, 1, 1, 0, 0, 0] });
    const f1 = fitCensored('weibull', t1);
    if (!f1.ok) throw new Error('fit');
    expect(runCensoredReplicates('weibull', f1.parameters, t1, 1, 11, 0, 5).firstLevel).toBeUndefined();
  });

  it("replicate b's pair recomputed from the definition: its statistic, then one second-level replicate from its own refit and Kaplan–Meier censoring estimate, same r", () => {
    const d = prepareLifeData({ times, failed });
    const fit = fitCensored('weibull', d);
    if (!fit.ok) throw new Error('fit');
    const stat = censoredGofStatistic('staggered');
    const fam = getFamily('weibull');
    const counts = runCensoredReplicates('weibull', fit.parameters, d, 0, 5, 0, 4);
    for (let b = 0; b < 4; b++) {
      const rng = createRng(5, b);
      const t = new Float64Array(d.n);
      const f = new Uint8Array(d.n);
      expect(censoredReplicateDrawer('weibull', fit.parameters, d)(rng, t, f)).toBe(true);
      const sim = buildLifeData(Float64Array.from(t), Uint8Array.from(f));
      const rf = fitCensored('weibull', sim, { warmStart: fit.parameters });
      if (!rf.ok) throw new Error('refit');
      expect(counts.firstLevel![b]).toBe(stat(fam.make(rf.parameters), sim));
      // Second level: units drawn from the replicate's fit, censoring from the replicate's own Kaplan–Meier estimate, r failures.
      const G = censoringDistribution(sim);
      const dist = fam.make(rf.parameters);
      for (let i = 0; i < d.n; i++) {
        const fails = i < d.failures;
        for (;;) {
          const x = dist.quantile(rng.uniform());
          const c = G.draw(rng.uniform());
          if ((x <= c) === fails) {
            t[i] = fails ? x : c;
            f[i] = fails ? 1 : 0;
            break;
          }
        }
      }
      const sim2 = buildLifeData(t, f);
      const rf2 = fitCensored('weibull', sim2, { warmStart: rf.parameters });
      if (!rf2.ok) throw new Error('refit 2');
      expect(counts.secondLevel![b]).toBe(stat(fam.make(rf2.parameters), sim2));
    }
  });
});

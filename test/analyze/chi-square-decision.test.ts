/**
 * Where the chi-square decision is taken by the parametric bootstrap at n ≥ 50: wherever the
 * asymptotic Chernoff–Lehmann bracket [p(k - 1 - m), p(k - 1)] (Chernoff & Lehmann 1954, Ann. Math.
 * Stat. 25:579-586) comes within α ± 4·√(α(1 - α)/B) — the band in which a Monte Carlo test with B
 * replicates still decides at random (Dufour 2006, J. Econometrics 133:443-477 [from memory]).
 * Deciding by the bracket everywhere outside its straddle made the test conservative: 4.0-4.3 % at
 * B = 99 for a nominal 5 % (docs/size-study.md).
 */
import { describe, expect, it } from 'vitest';
import { analyze, createRng, getFamily, planAnalysis } from '../../core/index.js';
import { CHI_SQUARE_BAND_MAX_WORK, CHI_SQUARE_MONTE_CARLO_BAND, chiSquareNeedsBootstrap } from '../../core/analyze.js';
import { chiSquareBootstrapPValue, runBootstrapRange } from '../../core/gof/index.js';
import type { ChiSquareReport } from '../../core/report.js';

/** A computed chi-square report with the two asymptotic p-values given (the rest is not read by the rule). */
function bracket(pValue: number, pValueUpper: number): ChiSquareReport {
  return { computable: true, statistic: 10, dof: 7, pValue, dofUpper: 9, pValueUpper, criticalValue: 14.07, alpha: 0.05, rejected: pValue < 0.05, decision: '', k: 10, kRule: 'moore', bins: [] } as unknown as ChiSquareReport;
}

describe('the chi-square decision: bootstrap wherever its own decision would still be random', () => {
  it('the band is α ± 4·√(α(1 - α)/B): 0.05 ± 0.02242 at B = 999 and up to 0.1376 at B = 99 (hand computation)', () => {
    // 4·√(0.05·0.95/999) = 0.022418; 4·√(0.05·0.95/99) = 0.087617 (by hand).
    expect(CHI_SQUARE_MONTE_CARLO_BAND).toBe(4);
    const cases: [number, number, number, boolean][] = [
      [0.04, 0.06, 999, true], // straddles α
      [0.06, 0.12, 999, true], // above α but inside the band (was decided "not rejected" by the bracket)
      [0.01, 0.03, 999, true], // below α but inside the band (was decided "rejected" by the bracket)
      [0.0776, 0.2, 999, false], // wholly above 0.07758
      [0.005, 0.0224, 999, false], // wholly below 0.02242
      [0.13, 0.3, 99, true], // inside 0.1376 at B = 99
      [0.14, 0.3, 99, false],
      [1e-6, 1e-4, 99, true], // at B = 99 the band's lower edge is below 0: every rejection is the bootstrap's
    ];
    for (const [p, pu, B, boot] of cases) {
      const why = chiSquareNeedsBootstrap(bracket(p, pu), 60, B);
      expect(why !== null, `p in [${p}, ${pu}], B = ${B}`).toBe(boot);
    }
    expect(chiSquareNeedsBootstrap(bracket(0.04, 0.06), 60, 999)).toMatch(/straddles α = 0.05/);
    expect(chiSquareNeedsBootstrap(bracket(0.06, 0.12), 60, 999)).toMatch(/within 4 Monte Carlo standard errors of α = 0.05 \(0.02242 to 0.07758 at B = 999\)/);
    expect(chiSquareNeedsBootstrap(bracket(0.5, 0.7), 49, 999)).toMatch(/n = 49 is below 50/);
    // Past B·n = 2·10^6 sampled values (CHI_SQUARE_BAND_MAX_WORK) only the straddle sends it to the bootstrap.
    expect(CHI_SQUARE_BAND_MAX_WORK).toBe(2_000_000);
    expect(chiSquareNeedsBootstrap(bracket(0.06, 0.12), 2002, 999)).not.toBeNull();
    expect(chiSquareNeedsBootstrap(bracket(0.06, 0.12), 2003, 999)).toBeNull();
    expect(chiSquareNeedsBootstrap(bracket(0.04, 0.06), 150_001, 999)).toMatch(/straddles/);
  });

  it('normal samples of n = 60 whose bracket lies just above or just below α are decided by the bootstrap, the asymptotic p-values kept beside it', () => {
    // Seeded normal samples (createRng(61, i)); their brackets, from the analysis itself:
    // i = 78: p in [0.0574, 0.1347] (the bracket alone said "not rejected");
    // i = 0: p in [0.0174, 0.0487] (the bracket alone said "rejected"); i = 1: [0.579, 0.773], far from α.
    const sample = (i: number): Float64Array => getFamily('normal').random({ mean: 10, sd: 2 }, createRng(61, i), 60);
    for (const i of [78, 0]) {
      const r = analyze(sample(i), { families: ['normal'], bootstrapReplicates: 999 });
      const c = r.candidates[0]?.chiSquare;
      if (!c?.computable) throw new Error('chi-square');
      expect(c.decidedBy, `sample ${i}`).toBe('bootstrap');
      expect(c.bootstrap?.replicates).toBe(999);
      expect(c.rejected).toBe((c.bootstrap?.pValue as number) <= 0.05);
      expect(c.decision).toMatch(/Monte Carlo standard errors of α/);
      expect(c.decision).toMatch(/The asymptotic p-values are/);
    }
    const far = planAnalysis(sample(1), { families: ['normal'], bootstrapReplicates: 999 });
    expect(far.candidates[0]?.chiSquareBootstrapReason).toBeNull();
    expect(far.bootstrapJobs).toHaveLength(0);
  });

  it('exponential, n = 50, B = 19: the decision is the Monte Carlo test\'s own on 3000 of 3000 seeded samples (the straddle-only rule disagreed on 63)', () => {
    // The Monte Carlo test (Dufour 2006 [from memory]) is the bootstrap run on every sample,
    // computed here beside the analysis with the same seed. Outside the band the bracket decides;
    // there the bootstrap would disagree with probability at most 0.004 at B = 19 (binomial, SciPy),
    // so a handful of disagreements at most is allowed; the old rule (bracket everywhere outside its
    // straddle) disagreed on 63 of these 3000 samples, always by not rejecting.
    const R = 3000;
    let disagree = 0;
    for (let i = 0; i < R; i++) {
      const xs = getFamily('exponential').random({ rate: 0.5 }, createRng(53, i), 50);
      const opts = { families: ['exponential' as const], bootstrapReplicates: 19, seed: 7000 + i };
      const cand = planAnalysis(xs, opts).candidates[0];
      if (!cand?.chiSquare.computable) throw new Error('chi-square not computable');
      const counts = runBootstrapRange({ family: 'exponential', parameters: cand.fit.parameters, n: 50, observed: cand.a2, seed: opts.seed, start: 0, end: 19, chiSquare: { observed: cand.chiSquare.statistic, k: cand.chiSquare.k } });
      const monteCarlo = chiSquareBootstrapPValue(counts).pValue <= 0.05;
      const c = analyze(xs, opts).candidates[0]?.chiSquare;
      if (!c?.computable) throw new Error('chi-square not computable');
      if (c.rejected !== monteCarlo) disagree++;
    }
    expect(disagree).toBeLessThanOrEqual(3);
  });

  it('exponential, n = 50, B = 19: rejection rate at α = 0.05 within 4 binomial SE of 5 %', () => {
    // Seeded Monte Carlo, R = 10,000 samples: SE = √(0.05·0.95/R) = 0.22 points. Measured 4.68 %
    // (the straddle-only rule: 4.16 % on the same samples; at B = 99 and n ≥ 50 it gave 4.0-4.3 %).
    const R = 10000;
    let rejected = 0;
    for (let i = 0; i < R; i++) {
      const xs = getFamily('exponential').random({ rate: 0.5 }, createRng(53, i), 50);
      const c = analyze(xs, { families: ['exponential'], bootstrapReplicates: 19, seed: 7000 + i }).candidates[0]?.chiSquare;
      if (!c?.computable) throw new Error('chi-square not computable');
      if (c.rejected) rejected++;
    }
    expect(Math.abs(rejected / R - 0.05)).toBeLessThan(4 * Math.sqrt((0.05 * 0.95) / R));
  });
});

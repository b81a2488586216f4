import { describe, expect, it } from 'vitest';
import { createRng } from '../../core/index.js';
import { kappaQuantile } from '../../core/lmoments/kappa.js';
import { discordancy, gevShapeFromT3, heterogeneity, regionalAnalysis } from '../../core/regional/index.js';
import { sampleLMoments } from '../../core/lmoments/sample-lmoments.js';

/** A region of `sites` sites × `years` values from a GEV (kappa h = 0) whose L-CV may vary by site. */
function region(seed: number, sites: number, years: number, lcvAt: (i: number) => number) {
  const rng = createRng(seed);
  return Array.from({ length: sites }, (_, i) => {
    // GEV with k = 0.1 (τ3 ≈ 0.14); scale chosen so the L-CV is lcvAt(i) with mean 1.
    const k = 0.1;
    const g1 = Math.exp(lnG(1 + k));
    const g2 = g1 * 2 ** -k;
    const lcv = lcvAt(i);
    const scale = (lcv * k) / (g1 - g2);
    const loc = 1 - (scale * (1 - g1)) / k;
    const values = Array.from({ length: years }, () => kappaQuantile({ location: loc, scale, shape: k, shape2: 0 }, rng.uniform()));
    return { name: `S${i}`, values };
  });
}
function lnG(x: number): number {
  // ln Γ for 1 ≤ x ≤ 2 by Stirling on x + 6 (test helper; accuracy ~1e-10 is plenty here).
  let p = 1;
  let y = x;
  while (y < 7) {
    p *= y;
    y += 1;
  }
  return (y - 0.5) * Math.log(y) - y + 0.5 * Math.log(2 * Math.PI) + 1 / (12 * y) - 1 / (360 * y ** 3) - Math.log(p);
}

describe('discordancy (Hosking & Wallis 1997 §3.2)', () => {
  it('the D_i average exactly 1 (H&W: Σ D_i = N)', () => {
    const rng = createRng(3);
    const sites = Array.from({ length: 9 }, (_, i) => ({ name: `S${i}`, t: 0.2 + 0.05 * rng.normal(), t3: 0.15 + 0.05 * rng.normal(), t4: 0.12 + 0.04 * rng.normal() }));
    const d = discordancy(sites);
    expect(d.computed).toBe(true);
    if (!d.computed) return;
    const mean = d.sites.reduce((a, s) => a + s.d, 0) / d.sites.length;
    expect(mean).toBeCloseTo(1, 12);
    expect(d.critical).toBe(2.329); // Table 3.1, N = 9 [from memory]
  });

  it('flags a site whose ratios sit far from the others', () => {
    const sites = Array.from({ length: 12 }, (_, i) => ({ name: `S${i}`, t: 0.2 + 0.01 * Math.sin(i), t3: 0.15 + 0.01 * Math.cos(i * 1.7), t4: 0.12 + 0.01 * Math.sin(i * 2.3) }));
    sites.push({ name: 'odd', t: 0.45, t3: -0.1, t4: 0.3 });
    const d = discordancy(sites);
    if (!d.computed) throw new Error(d.reason);
    expect(d.sites.find((s) => s.name === 'odd')?.discordant).toBe(true);
    expect(d.sites.filter((s) => s.discordant).map((s) => s.name)).toEqual(['odd']);
  });

  it('is not computed below 5 sites', () => {
    expect(discordancy([{ name: 'a', t: 0.1, t3: 0.1, t4: 0.1 }]).computed).toBe(false);
  });
});

describe('GEV shape from L-skewness', () => {
  it('agrees with the Hosking, Wallis & Wood (1985) approximation to its stated 9e-4 where −0.5 ≤ k ≤ 0.5 [accuracy from memory]', () => {
    // τ3 from −0.05 to 0.5 is k from about 0.36 to −0.46; outside that range the approximation drifts
    // (k = 1.49 vs 1.41 at τ3 = −0.5), which is why the exact root is used.
    for (const t3 of [-0.05, 0, 0.1, 0.3, 0.5]) {
      const c = 2 / (3 + t3) - Math.LN2 / Math.log(3);
      expect(Math.abs(gevShapeFromT3(t3) - (7.859 * c + 2.9554 * c * c))).toBeLessThan(9e-4);
    }
  });
});

describe('heterogeneity H checked by simulation (Hosking & Wallis 1997 §4.3.3)', () => {
  it('homogeneous regions give H1 near 0 on average and rarely ≥ 2; regions whose L-CV varies from 0.1 to 0.35 give H1 ≥ 2', () => {
    // 40 homogeneous and 20 heterogeneous seeded regions of 12 sites × 30 years, 200 simulations each.
    // Under homogeneity H1 is roughly standardised: the mean of 40 has SE ≈ 0.16, so |mean| < 0.6 is
    // about 4 SE; P(H1 ≥ 2) is a few per cent, so at most 4 of 40 (common practice, no source).
    const homo = Array.from({ length: 40 }, (_, s) => {
      const sites = region(1000 + s, 12, 30, () => 0.25).map((x) => {
        const l = sampleLMoments(Float64Array.from(x.values).sort());
        return { name: x.name, n: 30, t: l.t, t3: l.t3, t4: l.t4 };
      });
      return heterogeneity(sites, 200, 77 + s).h1;
    });
    const mean = homo.reduce((a, b) => a + b, 0) / homo.length;
    expect(Math.abs(mean)).toBeLessThan(0.6);
    expect(homo.filter((h) => h >= 2).length).toBeLessThanOrEqual(4);
    const hetero = Array.from({ length: 20 }, (_, s) => {
      const sites = region(5000 + s, 12, 30, (i) => 0.1 + (0.25 * i) / 11).map((x) => {
        const l = sampleLMoments(Float64Array.from(x.values).sort());
        return { name: x.name, n: 30, t: l.t, t3: l.t3, t4: l.t4 };
      });
      return heterogeneity(sites, 200, 99 + s).h1;
    });
    expect(hetero.filter((h) => h >= 2).length).toBeGreaterThanOrEqual(18);
  });
});

describe('regionalAnalysis', () => {
  it('site quantiles are the index flood times the growth curve, growth(2-year) near the median of a mean-1 curve', () => {
    const report = regionalAnalysis(region(42, 10, 40, () => 0.2), { periods: [2, 100], simulations: 100 });
    expect(report.sites).toHaveLength(10);
    for (const s of report.siteQuantiles) {
      const site = report.sites.find((x) => x.name === s.name);
      expect(s.levels[1]?.level).toBeCloseTo((site?.l1 ?? 0) * (report.growthCurve.rows[1]?.growth ?? 0), 10);
    }
    // A growth curve has mean 1: the 2-year growth (the median) of a right-skewed curve is below 1.
    expect(report.growthCurve.rows[0]?.growth).toBeLessThan(1);
    expect(report.growthCurve.rows[1]?.growth).toBeGreaterThan(1.4);
    expect(report.cautions.join(' ')).toMatch(/governing agency/);
  });
});

describe('Z goodness of fit of the growth curve (Hosking & Wallis 1997 §5.2.3)', () => {
  it('regions drawn from a GEV accept the GEV (|Z| ≤ 1.64, nominal 90 %) in most of 20 seeded regions', () => {
    // Binomial(20, 0.9): at least 15 accepted has probability ≈ 0.99 (common practice, no source).
    let accepted = 0;
    for (let s = 0; s < 20; s++) {
      const report = regionalAnalysis(region(9000 + s, 12, 40, () => 0.12), { simulations: 200, seed: 5 + s });
      if (report.fits.find((f) => f.family === 'gev')?.acceptable) accepted++;
    }
    expect(accepted).toBeGreaterThanOrEqual(15);
  });
});

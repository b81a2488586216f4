/**
 * The heterogeneity measure of a region (Hosking & Wallis 1997, §4.3.3). With record lengths n_i and
 * sample L-moment ratios of each site, the regional averages weighted by record length are t^R,
 * t3^R, t4^R, and the observed dispersion
 *
 *   V1 = { Σ n_i (t_i − t^R)² / Σ n_i }^{1/2}            (L-CV)
 *   V2 = Σ n_i {(t_i − t^R)² + (t3_i − t3^R)²}^{1/2} / Σ n_i
 *   V3 = Σ n_i {(t3_i − t3^R)² + (t4_i − t4^R)²}^{1/2} / Σ n_i.
 *
 * A kappa distribution fitted to (1, t^R, t3^R, t4^R) is the homogeneous region's parent; regions
 * with the same record lengths are simulated from it (seeded), giving the mean μ_V and standard
 * deviation σ_V of each V under homogeneity, and H = (V − μ_V)/σ_V. H < 1: acceptably homogeneous;
 * 1 ≤ H < 2: possibly heterogeneous; H ≥ 2: definitely heterogeneous (H&W's guide). When no kappa
 * has the regional L-moments (τ4 on or above the logistic curve), the generalized logistic (the
 * kappa with h = −1) is the parent, as H&W's programs do [from memory]; the report says so.
 * The same simulation gives the bias B4 and spread σ4 of the regional t4 used by the Z goodness-of-fit
 * measure (H&W §5.2.3).
 */
import { createRng } from '../random/index.js';
import { sampleLMoments } from '../lmoments/sample-lmoments.js';
import { fitKappa, kappaFromShapes, kappaQuantile, type KappaParameters } from '../lmoments/kappa.js';

export interface SiteSample {
  readonly name: string;
  readonly n: number;
  readonly t: number;
  readonly t3: number;
  readonly t4: number;
}

export interface RegionalAverages {
  readonly t: number;
  readonly t3: number;
  readonly t4: number;
}

export interface Heterogeneity {
  readonly observed: { readonly v1: number; readonly v2: number; readonly v3: number };
  readonly simulated: { readonly mean: readonly [number, number, number]; readonly sd: readonly [number, number, number] };
  readonly h1: number;
  readonly h2: number;
  readonly h3: number;
  /** H1 in H&W's words. */
  readonly verdict: 'acceptably homogeneous' | 'possibly heterogeneous' | 'definitely heterogeneous';
  readonly parent: { readonly family: 'kappa' | 'generalized logistic'; readonly parameters: KappaParameters; readonly note: string };
  readonly simulations: number;
  readonly seed: number;
  /** Bias of the regional t4 and its spread over the simulated regions (for Z, H&W §5.2.3). */
  readonly t4Bias: number;
  readonly t4Sd: number;
}

/** Regional average ratios weighted by record length (H&W eq. 4.3). */
export function regionalAverages(sites: readonly SiteSample[]): RegionalAverages {
  let w = 0;
  let t = 0;
  let t3 = 0;
  let t4 = 0;
  for (const s of sites) {
    w += s.n;
    t += s.n * s.t;
    t3 += s.n * s.t3;
    t4 += s.n * s.t4;
  }
  return { t: t / w, t3: t3 / w, t4: t4 / w };
}

function dispersion(sites: readonly SiteSample[], r: RegionalAverages): [number, number, number] {
  let w = 0;
  let s1 = 0;
  let s2 = 0;
  let s3 = 0;
  for (const s of sites) {
    w += s.n;
    s1 += s.n * (s.t - r.t) ** 2;
    s2 += s.n * Math.hypot(s.t - r.t, s.t3 - r.t3);
    s3 += s.n * Math.hypot(s.t3 - r.t3, s.t4 - r.t4);
  }
  return [Math.sqrt(s1 / w), s2 / w, s3 / w];
}

function verdictOf(h: number): Heterogeneity['verdict'] {
  return h < 1 ? 'acceptably homogeneous' : h < 2 ? 'possibly heterogeneous' : 'definitely heterogeneous';
}

/** The homogeneous parent: a kappa fitted to the regional L-moments, else the generalized logistic. */
export function regionalParent(r: RegionalAverages): Heterogeneity['parent'] {
  const fit = fitKappa(1, r.t, r.t3, r.t4);
  if (fit.ok) return { family: 'kappa', parameters: fit.parameters, note: 'kappa fitted to the regional average L-moments (Hosking 1994)' };
  return {
    family: 'generalized logistic',
    parameters: kappaFromShapes(1, r.t, -r.t3, -1),
    note: `no kappa distribution has the regional L-moments (${fit.reason}); the generalized logistic with the same λ1, λ2 and τ3 is used instead`,
  };
}

export function heterogeneity(sites: readonly SiteSample[], simulations = 500, seed = 20261204): Heterogeneity {
  const r = regionalAverages(sites);
  const observed = dispersion(sites, r);
  const parent = regionalParent(r);
  const rng = createRng(seed, 0x6865);
  const maxN = Math.max(...sites.map((s) => s.n));
  const buf = new Float64Array(maxN);
  const sums = [0, 0, 0];
  const sq = [0, 0, 0];
  let t4Sum = 0;
  let t4Sq = 0;
  for (let m = 0; m < simulations; m++) {
    const sim: SiteSample[] = [];
    for (const s of sites) {
      const x = buf.subarray(0, s.n);
      for (let i = 0; i < s.n; i++) x[i] = kappaQuantile(parent.parameters, rng.uniform());
      x.sort();
      const l = sampleLMoments(x);
      sim.push({ name: s.name, n: s.n, t: l.t, t3: l.t3, t4: l.t4 });
    }
    const rs = regionalAverages(sim);
    const v = dispersion(sim, rs);
    for (let j = 0; j < 3; j++) {
      sums[j] = (sums[j] as number) + (v[j] as number);
      sq[j] = (sq[j] as number) + (v[j] as number) ** 2;
    }
    t4Sum += rs.t4 - r.t4;
    t4Sq += (rs.t4 - r.t4) ** 2;
  }
  const mean = sums.map((s) => s / simulations) as [number, number, number];
  const sd = sq.map((q, j) => Math.sqrt(Math.max(0, (q - simulations * (mean[j] as number) ** 2) / (simulations - 1)))) as [number, number, number];
  const h = observed.map((v, j) => (v - (mean[j] as number)) / (sd[j] as number)) as [number, number, number];
  const t4Bias = t4Sum / simulations;
  const t4Sd = Math.sqrt(Math.max(0, (t4Sq - simulations * t4Bias * t4Bias) / (simulations - 1)));
  return {
    observed: { v1: observed[0], v2: observed[1], v3: observed[2] },
    simulated: { mean, sd },
    h1: h[0],
    h2: h[1],
    h3: h[2],
    verdict: verdictOf(h[0]),
    parent,
    simulations,
    seed,
    t4Bias,
    t4Sd,
  };
}

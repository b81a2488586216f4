/**
 * Normal-theory capability indices with confidence intervals.
 *
 *   Cp  = (USL - LSL) / (6σ)            Cpu = (USL - x̄) / (3σ)     Cpl = (x̄ - LSL) / (3σ)
 *   Cpk = min(Cpu, Cpl) over the limits that are given
 * with σ the within-subgroup sigma (Cp, Cpk) or the overall sample standard deviation with
 * divisor n - 1 (Pp, Ppk; same formulas). Intervals, two-sided at confidence 1 - α:
 * - Cp / Pp: the chi-square interval C_s·√(χ²_{α/2,ν}/ν) to C_s·√(χ²_{1-α/2,ν}/ν), where C_s is the
 *   index computed with the standard deviation s for which ν s²/σ² ~ χ²_ν (the n - 1 sd overall; the
 *   pooled s_p within, before any c4 bias correction). Exact for normal data (e.g. Kotz & Johnson
 *   1993, Process Capability Indices, ch. 2 [from memory]). The point estimate may use a
 *   bias-corrected σ̂ = s/c4; the interval must not (it would be c4 times the exact one). For R̄/d2
 *   the chi-square law holds only approximately (effective ν), and the method text says so.
 * - Cpk / Ppk and the one-sided Cpu, Cpl: Bissell's (1990) normal approximation,
 *   Ĉ ± z_{1-α/2}·√(1/(9N) + Ĉ²/(2ν)) (Bissell, A. F. 1990, "How reliable is your capability index?",
 *   Applied Statistics 39:331-340). The 1/(9N) term is the mean's uncertainty (N all values) and
 *   Ĉ²/(2ν) the sigma's (ν its degrees of freedom: n - 1 overall, Σ(n_i - 1) pooled within).
 * - Cpm = (USL - LSL) / (6τ̂), τ̂² = Σ(x - T)²/n (Chan, Cheng & Spiring 1988, J. Quality Technology
 *   20:162-175), with Boyles' (1991, JQT 23:17-26) chi-square approximation on
 *   ν* = n(1 + λ²)²/(1 + 2λ²), λ = (x̄ - T)/σ̂ₙ (both from memory).
 * The lower end of a two-sided 1 - α interval is a one-sided 1 - α/2 lower confidence bound.
 */
import { chiSquareIsf, normalQuantile } from '../special/index.js';

export type IndexName = 'Cp' | 'Cpk' | 'Cpu' | 'Cpl' | 'Pp' | 'Ppk' | 'Ppu' | 'Ppl' | 'Cpm';

export interface IndexEstimate {
  readonly name: IndexName;
  readonly estimate: number;
  /** Lower end of the two-sided interval (a one-sided 1 - α/2 lower confidence bound). */
  readonly lower: number;
  readonly upper: number;
  /** Two-sided confidence level, 1 - α. */
  readonly confidence: number;
  /** The interval method in words with its source. */
  readonly intervalMethod: string;
}

export interface SpecLimits {
  readonly lsl: number | null;
  readonly usl: number | null;
}

export const CHI_SQUARE_METHOD = 'chi-square interval on ν degrees of freedom (exact for normal data)';
export const CHI_SQUARE_APPROXIMATE_METHOD = 'chi-square interval on the effective degrees of freedom ν (approximate: the within sigma is not exactly chi-square distributed)';

/** The standard deviation whose law is ν s²/σ² ~ χ²_ν (exactly or approximately), for the Cp/Pp interval. */
export interface ChiSquareBasis {
  readonly sd: number;
  readonly exact: boolean;
}
export const BISSELL_METHOD = "Bissell (1990) normal approximation, Ĉ ± z·√(1/(9N) + Ĉ²/(2ν))";
export const BOYLES_METHOD = 'Boyles (1991) chi-square approximation on ν* = n(1 + λ²)²/(1 + 2λ²)';

/** Cp-type interval: chi-square on ν. */
export function chiSquareInterval(name: IndexName, estimate: number, nu: number, alpha: number, method = CHI_SQUARE_METHOD): IndexEstimate {
  const lo = chiSquareIsf(1 - alpha / 2, nu);
  const hi = chiSquareIsf(alpha / 2, nu);
  return {
    name,
    estimate,
    lower: estimate * Math.sqrt(lo / nu),
    upper: estimate * Math.sqrt(hi / nu),
    confidence: 1 - alpha,
    intervalMethod: method,
  };
}

/** Cpk-type interval: Bissell (1990). */
export function bissellInterval(name: IndexName, estimate: number, nTotal: number, nu: number, alpha: number): IndexEstimate {
  const z = -normalQuantile(alpha / 2);
  const se = Math.sqrt(1 / (9 * nTotal) + (estimate * estimate) / (2 * nu));
  return {
    name,
    estimate,
    lower: estimate - z * se,
    upper: estimate + z * se,
    confidence: 1 - alpha,
    intervalMethod: BISSELL_METHOD,
  };
}

/**
 * The indices for one sigma: [Cp, Cpk, Cpu, Cpl] (or the P- names when `overall`), each present
 * only when its limits are given. `nu` is σ̂'s degrees of freedom, `nTotal` the number of values.
 */
export function normalIndices(
  mean: number,
  sigma: number,
  limits: SpecLimits,
  nTotal: number,
  nu: number,
  alpha: number,
  overall: boolean,
  /** The sd with ν s²/σ² ~ χ²_ν when it differs from `sigma` (default: `sigma`, exact). */
  basis: ChiSquareBasis = { sd: sigma, exact: true },
): IndexEstimate[] {
  const names = overall
    ? ({ p: 'Pp', k: 'Ppk', u: 'Ppu', l: 'Ppl' } as const)
    : ({ p: 'Cp', k: 'Cpk', u: 'Cpu', l: 'Cpl' } as const);
  const out: IndexEstimate[] = [];
  const { lsl, usl } = limits;
  if (lsl !== null && usl !== null) {
    const onBasis = chiSquareInterval(names.p, (usl - lsl) / (6 * basis.sd), nu, alpha, basis.exact ? CHI_SQUARE_METHOD : CHI_SQUARE_APPROXIMATE_METHOD);
    out.push({ ...onBasis, estimate: (usl - lsl) / (6 * sigma) });
  }
  const cu = usl !== null ? (usl - mean) / (3 * sigma) : null;
  const cl = lsl !== null ? (mean - lsl) / (3 * sigma) : null;
  const ck = cu === null ? cl : cl === null ? cu : Math.min(cu, cl);
  if (ck !== null) out.push(bissellInterval(names.k, ck, nTotal, nu, alpha));
  if (cu !== null) out.push(bissellInterval(names.u, cu, nTotal, nu, alpha));
  if (cl !== null) out.push(bissellInterval(names.l, cl, nTotal, nu, alpha));
  return out;
}

/** Cpm with Boyles' interval; `sumSqFromTarget` is Σ(x - T)². */
export function cpm(
  limits: { lsl: number; usl: number },
  mean: number,
  sumSqDev: number,
  n: number,
  target: number,
  alpha: number,
): IndexEstimate {
  const sdN2 = sumSqDev / n;
  const tau2 = sdN2 + (mean - target) * (mean - target);
  const estimate = (limits.usl - limits.lsl) / (6 * Math.sqrt(tau2));
  const lambda2 = ((mean - target) * (mean - target)) / sdN2;
  const nu = (n * (1 + lambda2) * (1 + lambda2)) / (1 + 2 * lambda2);
  return chiSquareInterval('Cpm', estimate, nu, alpha, BOYLES_METHOD);
}

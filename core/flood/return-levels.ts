/**
 * Return levels of a fitted annual-maximum model: the T-year level z_T is the value exceeded with
 * probability 1/T in a year, z_T = isf(1/T) of the fitted model (Coles 2001, §3.1.3).
 *
 * Intervals (two-sided, `level` default 0.95):
 * - 'profile' (default for Gumbel and GEV): profile likelihood (Coles 2001, §3.3.3 and §2.6.6
 *   [section numbers from memory]). The model is reparametrised by z_T itself: with
 *   y = -ln(1 - 1/T) the location is μ = z_T - σ·q(ξ, y), q = (y^{-ξ} - 1)/ξ (q = -ln y at ξ = 0),
 *   and the interval is the set of z_T whose profile deviance 2[ℓ̂ - max ℓ(z_T, σ, ξ)] stays
 *   below the χ²₁ quantile (core/optimize profileInterval, Brent on each side). The interval is
 *   usually asymmetric, wider above, as the data warrant. An end the profile never reaches is
 *   reported as ±Infinity with `lowerFound`/`upperFound` false.
 * - 'delta': the delta method (Coles 2001, §3.3.3): Var ẑ_T = ∇z_Tᵀ V ∇z_T with V the inverse of
 *   the observed information (numerical Hessian of ℓ) and ∇z_T by central differences; for any
 *   family. It is the method behind Coles's printed Port Pirie intervals. Symmetric, so it can
 *   understate the upper uncertainty of long return periods.
 * Families other than Gumbel and GEV always use 'delta'.
 */
import { InputError } from '../errors.js';
import { getFamily, type FamilyName, type Parameters } from '../families/index.js';
import { above, affine, between, LOG, numericalGradient, observedInformation, profileInterval, type Transform } from '../optimize/index.js';
import type { Sample } from '../sample.js';
import { CompensatedSum } from '../compensated.js';
import { normalQuantile } from '../special/index.js';

export type ReturnLevelMethod = 'profile' | 'delta';

export interface ReturnLevel {
  /** Return period T in years (blocks). */
  readonly period: number;
  /** Annual exceedance probability 1/T. */
  readonly exceedanceProbability: number;
  readonly estimate: number;
  readonly lower: number;
  readonly upper: number;
  readonly level: number;
  readonly method: ReturnLevelMethod;
  /** False when that end of a profile interval could not be closed (reported as ±Infinity). */
  readonly lowerFound: boolean;
  readonly upperFound: boolean;
  /** T exceeds twice the record length. */
  readonly beyondRecord: boolean;
}

export interface ReturnLevelOptions {
  /** Two-sided confidence level (default 0.95). */
  readonly level?: number;
  /** Interval method (default 'profile' for Gumbel/GEV; other families always 'delta'). */
  readonly method?: ReturnLevelMethod;
  /** Advisory GEV shape size (default 0.5); kept for callers, it does not constrain the profile. */
  readonly shapeGuard?: number;
  /**
   * A constraint |ξ| ≤ c that the fit used (none by default): the profile then stays inside it,
   * and the method text and warnings say the interval is that of the constrained model.
   */
  readonly shapeConstraint?: number | null;
}

export interface ReturnLevelReport {
  readonly family: FamilyName;
  readonly parameters: Parameters;
  readonly recordLength: number;
  readonly levels: readonly ReturnLevel[];
  /** The interval method in words with its source. */
  readonly methodDetail: string;
  readonly warnings: readonly string[];
  readonly cautions: readonly string[];
}

export const FLOOD_CAUTION =
  'Design floods support dam, levee and floodplain decisions: follow the governing guideline for flood-frequency analysis and have the analysis reviewed by a qualified hydrologist before it is used.';

export const GEV_SIGN_NOTE =
  'GEV shape ξ as in Coles (2001): ξ > 0 is a heavy upper tail, ξ < 0 a bounded one. Many hydrology texts and SciPy\'s genextreme use the opposite sign (κ = c = -ξ).';

/** Multiple of the record length beyond which a return period is flagged (common practice, no source). */
export const RECORD_MULTIPLE = 2;

/** q(ξ, y) = (y^{-ξ} - 1)/ξ = expm1(-ξ ln y)/ξ, and -ln y at ξ = 0. */
export function gevQuantileOffset(xi: number, y: number): number {
  const ly = Math.log(y);
  return xi === 0 ? -ly : Math.expm1(-xi * ly) / xi;
}

function sumLogPdf(sorted: Float64Array, logPdf: (x: number) => number): number {
  const sum = new CompensatedSum();
  for (let i = 0; i < sorted.length; i++) {
    const v = logPdf(sorted[i] as number);
    if (!Number.isFinite(v)) return Number.NEGATIVE_INFINITY;
    sum.add(v);
  }
  return sum.value;
}

function validatePeriods(periods: readonly number[]): void {
  if (periods.length === 0) throw new InputError('Give at least one return period.', {}, 'bad-option');
  for (const T of periods) {
    if (!(Number.isFinite(T) && T > 1)) {
      throw new InputError(`A return period must be a number greater than 1 (got ${String(T)}).`, { value: String(T) }, 'bad-option');
    }
  }
}

/** Return levels with intervals for a fitted model (`fit.parameters` must be its MLE on `sample`). */
export function returnLevels(
  sample: Sample,
  fit: { readonly family: FamilyName; readonly parameters: Parameters },
  periods: readonly number[],
  opts: ReturnLevelOptions = {},
): ReturnLevelReport {
  validatePeriods(periods);
  const level = opts.level ?? 0.95;
  if (!(level > 0 && level < 1)) throw new InputError(`The confidence level must lie strictly between 0 and 1 (got ${String(level)}).`, { value: String(level) }, 'bad-option');
  const family = getFamily(fit.family);
  const dist = family.make(fit.parameters);
  const xs = sample.sorted;
  const n = sample.n;
  const extreme = fit.family === 'gumbel' || fit.family === 'gev';
  const method: ReturnLevelMethod = extreme ? (opts.method ?? 'profile') : 'delta';
  const warnings: string[] = [];
  if (!extreme && opts.method === 'profile') warnings.push(`Profile intervals are offered for the Gumbel and GEV models; the ${family.label} return levels use the delta method.`);
  const levels: ReturnLevel[] = [];
  const names = family.parameterNames;
  const theta0 = Float64Array.from(names.map((k) => fit.parameters[k] as number));
  const llNatural = (th: Float64Array): number => {
    const p: Record<string, number> = {};
    for (let i = 0; i < names.length; i++) p[names[i] as string] = th[i] as number;
    let d;
    try {
      d = family.make(p);
    } catch {
      return Number.NEGATIVE_INFINITY;
    }
    return sumLogPdf(xs, (x) => d.logPdf(x));
  };
  const ll0 = llNatural(theta0);
  let cov: Float64Array | null = null;
  if (method === 'delta') {
    cov = observedInformation(llNatural, theta0).covariance;
    if (!cov) warnings.push('The observed information is not positive definite at the fit, so no delta-method interval can be given.');
  }
  const z = -normalQuantile((1 - level) / 2);
  let constrainedNote: string | null = null;
  for (const T of periods) {
    const pExc = 1 / T;
    const estimate = dist.isf(pExc);
    let lower = Number.NaN;
    let upper = Number.NaN;
    let lowerFound = false;
    let upperFound = false;
    if (method === 'delta') {
      if (cov) {
        const zt = (th: Float64Array): number => {
          const p: Record<string, number> = {};
          for (let i = 0; i < names.length; i++) p[names[i] as string] = th[i] as number;
          try {
            return family.make(p).isf(pExc);
          } catch {
            return Number.NaN;
          }
        };
        const g = numericalGradient(zt, theta0);
        let v = 0;
        const m = names.length;
        for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) v += (g[i] as number) * (cov[i * m + j] as number) * (g[j] as number);
        const se = Math.sqrt(v);
        if (Number.isFinite(se)) {
          lower = estimate - z * se;
          upper = estimate + z * se;
          lowerFound = upperFound = true;
        }
      }
    } else {
      const y = -Math.log1p(-pExc);
      let ll: (th: Float64Array) => number;
      let start: number[];
      let transforms: Transform[];
      if (fit.family === 'gumbel') {
        const beta0 = fit.parameters.scale as number;
        ll = (th) => {
          const beta = th[1] as number;
          return beta > 0 ? llNatural(Float64Array.of((th[0] as number) + beta * Math.log(y), beta)) : Number.NEGATIVE_INFINITY;
        };
        start = [estimate, beta0];
        // z_T from the estimate in units of the fitted scale: scale-free steps and stopping tests.
        transforms = [affine(estimate, beta0), LOG];
      } else {
        const constraint = opts.shapeConstraint ?? null;
        const sigma0 = fit.parameters.scale as number;
        const xi0 = fit.parameters.shape as number;
        const held = constraint !== null && Math.abs(xi0) >= constraint * (1 - 1e-9);
        if (held) {
          // ξ is held at the constraint: profile over σ alone (the constrained model's interval).
          ll = (th) => {
            const s = th[1] as number;
            return s > 0 ? llNatural(Float64Array.of((th[0] as number) - s * gevQuantileOffset(xi0, y), s, xi0)) : Number.NEGATIVE_INFINITY;
          };
          start = [estimate, sigma0];
          transforms = [affine(estimate, sigma0), LOG];
        } else {
          // Unconstrained: ξ > -1 (below it the likelihood is unbounded, Smith 1985); or inside the constraint.
          const lo = constraint === null ? -1 : -constraint;
          const hi = constraint;
          ll = (th) => {
            const s = th[1] as number;
            const xi = th[2] as number;
            if (!(s > 0) || !(xi > lo) || (hi !== null && !(xi < hi))) return Number.NEGATIVE_INFINITY;
            return llNatural(Float64Array.of((th[0] as number) - s * gevQuantileOffset(xi, y), s, xi));
          };
          start = [estimate, sigma0, xi0];
          transforms = [affine(estimate, sigma0), LOG, hi === null ? above(lo) : between(lo, hi)];
        }
        if (constraint !== null) constrainedNote = held ? `with ξ held at the constraint ${xi0}` : `with ξ constrained to |ξ| ≤ ${constraint}`;
      }
      const r = profileInterval(ll, { x: start, value: ll0 }, 0, level, { transforms, tolerance: 1e-10 });
      lowerFound = r.lowerFound;
      upperFound = r.upperFound;
      lower = lowerFound ? r.lower : Number.NEGATIVE_INFINITY;
      upper = upperFound ? r.upper : Number.POSITIVE_INFINITY;
      if (!lowerFound) warnings.push(`The ${T}-year level has no lower profile-likelihood bound at ${level} within the model's feasible range.`);
      if (!upperFound) warnings.push(`The ${T}-year level has no finite upper profile-likelihood bound at ${level}: the record cannot exclude very large values.`);
    }
    const beyondRecord = T > RECORD_MULTIPLE * n;
    levels.push({ period: T, exceedanceProbability: pExc, estimate, lower, upper, level, method, lowerFound, upperFound, beyondRecord });
  }
  const far = levels.filter((l) => l.beyondRecord).map((l) => l.period);
  if (far.length > 0) {
    warnings.push(
      `Return period${far.length > 1 ? 's' : ''} ${far.join(', ')} exceed${far.length > 1 ? '' : 's'} twice the ${n}-year record: those levels are extrapolations that rest on the model's tail rather than on the data (a rule of thumb; common practice, no source).`,
    );
  }
  if (constrainedNote !== null) warnings.push(`The GEV return-level intervals are those of the constrained model (${constrainedNote}); the unconstrained profile likelihood can give a different, usually wider, interval.`);
  const cautions = [FLOOD_CAUTION];
  if (fit.family === 'gev') cautions.push(GEV_SIGN_NOTE);
  return {
    family: fit.family,
    parameters: fit.parameters,
    recordLength: n,
    levels,
    methodDetail:
      method === 'profile'
        ? `profile likelihood of the return level (reparametrised by z_T; Coles 2001 §3.3.3), χ²₁ at ${level}${constrainedNote !== null ? `, of the constrained model (${constrainedNote}): the interval is conditional on that constraint, not an unconstrained profile interval` : ''}`
        : `delta method on the observed information (Coles 2001 §3.3.3), normal interval at ${level}`,
    warnings,
    cautions,
  };
}

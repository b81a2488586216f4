/**
 * Process capability of one characteristic against its specification limits.
 *
 * Overall (long-term) indices Pp, Ppk, Ppu, Ppl use the sample standard deviation with divisor
 * n - 1; with subgroup labels, the short-term indices Cp, Cpk, Cpu, Cpl use the within-subgroup
 * sigma (pooled s / c4 by default, or R̄/d2; see within.ts). Cpm is added when a target is given
 * with both limits. Intervals: see indices.ts. Normal-theory indices describe the process only if
 * the normal model fits: the caller passes the verdict of the Anderson–Darling test at α (the
 * "normality gate"); when it fails and a non-normal fitted model is supplied, that model's
 * capability by the ISO 22514-2 percentile method is reported as well, and ppm out of spec from
 * the fitted tails of every model is available through `ppmOutOfSpec`.
 */
import { CompensatedSum } from '../compensated.js';
import { InputError } from '../errors.js';
import type { Distribution } from '../families/index.js';
import type { Sample } from '../sample.js';
import { prepareSample } from '../sample.js';
import { normalCdf } from '../special/index.js';
import { cpm, normalIndices, type IndexEstimate, type SpecLimits } from './indices.js';
import { c4 } from './constants.js';
import { percentileCapability, type PercentileCapability } from './percentile.js';
import type { PpmOutOfSpec } from './ppm.js';
import { checkResolution, type ResolutionCheck } from './resolution.js';
import { groupByLabel, withinSigma, type WithinMethod, type WithinSigma } from './within.js';

export interface NormalityGate {
  /** Whether the normal model passes the Anderson–Darling test at `alpha`. */
  readonly passes: boolean;
  readonly alpha: number;
  readonly pValue?: number;
}

export interface CapabilityOptions {
  readonly lsl?: number | null;
  readonly usl?: number | null;
  readonly target?: number | null;
  /** Subgroup label of each value, aligned with the values (requires values in their original order). */
  readonly subgroups?: Int32Array | readonly (number | string)[] | null;
  readonly withinMethod?: WithinMethod;
  /** Intervals are two-sided at 1 - alpha (default 0.05). */
  readonly alpha?: number;
  /** The verdict of the normal model's AD test. */
  readonly normality?: NormalityGate | null;
  /** The best non-normal fitted model, for the percentile method when the normal fails. */
  readonly nonNormal?: Distribution | null;
}

export interface CapabilityReport {
  readonly n: number;
  readonly mean: number;
  /** Overall sample standard deviation, divisor n - 1. */
  readonly sdOverall: number;
  readonly lsl: number | null;
  readonly usl: number | null;
  readonly target: number | null;
  readonly confidence: number;
  /** Pp (both limits), Ppk, Ppu / Ppl (as limits allow), Cpm (target and both limits). */
  readonly overall: readonly IndexEstimate[];
  /** Within-subgroup sigma and Cp, Cpk, Cpu, Cpl; null without subgroups. */
  readonly within: (WithinSigma & { readonly indices: readonly IndexEstimate[] }) | null;
  /** ppm out of spec under the normal model with the overall mean and sd. */
  readonly normalPpm: PpmOutOfSpec;
  readonly normality: (NormalityGate & { readonly statement: string }) | null;
  /** Percentile-method capability of the supplied non-normal model (when the gate fails or no gate is given). */
  readonly percentile: PercentileCapability | null;
  readonly resolution: ResolutionCheck;
  readonly warnings: readonly string[];
  readonly cautions: readonly string[];
}

export const CAPABILITY_CAUTION =
  'For safety-critical characteristics, decide on the lower confidence bound, not the estimate, and confirm conformance by inspection; follow the governing standard and customer requirements.';

function optionalNumber(name: string, v: number | null | undefined): number | null {
  if (v === null || v === undefined) return null;
  if (!Number.isFinite(v)) throw new InputError(`The ${name} must be a finite number (got ${String(v)}).`, { value: String(v) }, 'bad-option');
  return v;
}

export function capability(input: Sample | ArrayLike<number>, opts: CapabilityOptions = {}): CapabilityReport {
  const lsl = optionalNumber('lower specification limit', opts.lsl);
  const usl = optionalNumber('upper specification limit', opts.usl);
  const target = optionalNumber('target', opts.target);
  const alpha = opts.alpha ?? 0.05;
  if (!(alpha > 0 && alpha < 1)) throw new InputError(`alpha must lie strictly between 0 and 1 (got ${String(alpha)}).`, { value: String(alpha) }, 'bad-option');
  if (lsl === null && usl === null) {
    throw new InputError('Capability needs at least one specification limit (a lower or an upper limit).', {}, 'bad-option');
  }
  if (lsl !== null && usl !== null && !(lsl < usl)) {
    throw new InputError(`The lower specification limit (${lsl}) must be below the upper one (${usl}).`, {}, 'bad-option');
  }
  const isSample = (x: Sample | ArrayLike<number>): x is Sample => typeof (x as Sample).sumSqDev === 'number' && (x as Sample).sorted instanceof Float64Array;
  const hasGroups = opts.subgroups !== null && opts.subgroups !== undefined;
  if (hasGroups && isSample(input)) {
    throw new InputError('Subgroups need the values in their original order; pass the values, not a prepared (sorted) sample.', {}, 'bad-input');
  }
  const sample = isSample(input) ? input : prepareSample(input);
  const n = sample.n;
  if (n < 2 || !(sample.sumSqDev > 0)) {
    throw new InputError('Capability needs at least 2 values that are not all equal.', {}, 'not-computable');
  }
  const mean = sample.mean;
  const sd = Math.sqrt(sample.sumSqDev / (n - 1));
  const limits: SpecLimits = { lsl, usl };
  const warnings: string[] = [];

  const overall = normalIndices(mean, sd, limits, n, n - 1, alpha, true);
  if (target !== null) {
    if (lsl !== null && usl !== null) {
      if (!(target > lsl && target < usl)) warnings.push(`The target ${target} lies outside the specification limits.`);
      const ss = new CompensatedSum();
      for (const x of sample.sorted) ss.add((x - mean) * (x - mean));
      overall.push(cpm({ lsl, usl }, mean, ss.value, n, target, alpha));
    } else warnings.push('Cpm needs both specification limits; it is not computed for a one-sided specification.');
  }

  let within: CapabilityReport['within'] = null;
  if (hasGroups) {
    const values = input as ArrayLike<number>;
    const groups = groupByLabel(values, opts.subgroups as ArrayLike<number | string>);
    const w = withinSigma(groups, opts.withinMethod ?? 'pooled');
    if (w.singletons > 0) warnings.push(`${w.singletons} subgroup(s) of a single value carry no within-subgroup information and were skipped.`);
    if (w.method === 'range') warnings.push('The R̄/d2 intervals use approximate degrees of freedom (0.9·k·(n̄ - 1)).');
    // The Cp interval uses the sd with the chi-square law: pooled s_p (= σ̂·c4), not the c4-corrected σ̂.
    const basis = w.method === 'pooled' ? { sd: w.sigma * c4(w.dof + 1), exact: true } : { sd: w.sigma, exact: false };
    within = { ...w, indices: normalIndices(mean, w.sigma, limits, n, w.dof, alpha, false, basis) };
  }

  const normalPpm: PpmOutOfSpec = (() => {
    const below = lsl === null ? 0 : 1e6 * normalCdf((lsl - mean) / sd);
    const above = usl === null ? 0 : 1e6 * normalCdf((mean - usl) / sd);
    return { belowLsl: below, aboveUsl: above, total: below + above };
  })();

  let normality: CapabilityReport['normality'] = null;
  if (opts.normality) {
    const g = opts.normality;
    const p = g.pValue !== undefined ? ` (p = ${String(Number(g.pValue.toPrecision(3)))})` : '';
    normality = {
      ...g,
      statement: g.passes
        ? `The normal model passes the Anderson–Darling test at α = ${g.alpha}${p}; the normal-theory indices apply.`
        : `The normal model fails the Anderson–Darling test at α = ${g.alpha}${p}; the normal-theory indices and their intervals do not describe this process. Use the percentile-method indices of the best non-normal model.`,
    };
    if (!g.passes) warnings.push('The normal model is rejected; normal-theory Cp/Cpk/Pp/Ppk are shown for reference only.');
  }
  let percentile: PercentileCapability | null = null;
  if (opts.nonNormal && !(opts.normality?.passes ?? false)) percentile = percentileCapability(opts.nonNormal, limits);

  const resolution = checkResolution(sample.sorted, sd);
  if (resolution.warning) warnings.push(resolution.warning);
  if (n < 30) warnings.push(`Only ${n} values: capability indices from fewer than about 30 values are very uncertain; read the intervals (common practice, no source).`);

  return {
    n,
    mean,
    sdOverall: sd,
    lsl,
    usl,
    target,
    confidence: 1 - alpha,
    overall,
    within,
    normalPpm,
    normality,
    percentile,
    resolution,
    warnings,
    cautions: [CAPABILITY_CAUTION],
  };
}

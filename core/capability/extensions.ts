/**
 * The parts of the capability section beyond the normal-theory report (capability.ts), composed
 * for the workflow in one call:
 * - `transform`: the data and limits through a Box–Cox or Johnson transformation (transformed.ts),
 *   with the bootstrap interval of its percentile indices (bootstrap.ts); `{ kind: 'none' }` when
 *   no transformation was asked for;
 * - `percentileIntervals`: without a transformation, the bootstrap interval of the percentile
 *   indices of the best non-normal fitted family (the model capability.ts reports);
 * - `comparison`: every model side by side, rejected ones apart (comparison.ts);
 * - `stability`: an individuals or subgroup chart when an order or subgroup column is given
 *   (control-chart.ts); with subgroups also `rangeChart`, the X̄ and R chart beside it;
 * - `bounds`: how a one-sided specification with a natural lower bound was handled.
 */
import type { FamilyName, Parameters } from '../families/index.js';
import { PlumblineError } from '../errors.js';
import { capabilityBootstrapJob, percentileIntervals, type CapabilityBootstrapJob, type CapabilityBootstrapValues, type PercentileIntervals } from './bootstrap.js';
import { compareModels, type ComparisonCandidate, type ModelComparison } from './comparison.js';
import { individualsChart, subgroupChart, subgroupRangeChart, type StabilityChart } from './control-chart.js';
import type { SpecLimits } from './indices.js';
import { makeModel, type ModelSpec } from './model.js';
import { boxCoxTransform } from './boxcox.js';
import { johnsonZ } from './johnson.js';
import { transformedCapability, type TransformedCapability } from './transformed.js';

export interface ExtensionCandidate {
  readonly family: FamilyName;
  readonly label: string;
  readonly parameters: Parameters;
  readonly rejectedBy: readonly string[];
}

export interface CapabilityExtensionsInput {
  /** Values in file order. */
  readonly values: ArrayLike<number>;
  readonly sorted: Float64Array;
  readonly subgroups: readonly (string | number)[] | null;
  readonly order: ArrayLike<number> | null;
  readonly limits: SpecLimits;
  /** 1 - confidence of the intervals. */
  readonly alpha: number;
  /** α of the goodness-of-fit tests. */
  readonly testAlpha: number;
  readonly transform: 'none' | 'boxcox' | 'johnson';
  readonly naturalLowerBound: number | null;
  readonly seed: number;
  readonly replicates: number;
  /** The ranked candidates, normal included. */
  readonly candidates: readonly ExtensionCandidate[];
  /** Overall mean and sd (n - 1) for the one normal row. */
  readonly mean: number;
  readonly sd: number;
  /** The family the percentile method used (capability.ts), or null. */
  readonly percentileFamily: FamilyName | null;
  /**
   * The combined values of a bootstrap job run elsewhere (the worker pool), or null when that job
   * was not run there: the interval is then computed here, within INLINE_BOOTSTRAP_WORK.
   */
  readonly ran?: (job: CapabilityBootstrapJob) => CapabilityBootstrapValues | null;
}

export type TransformSection =
  /** No transformation: none asked for, or (`requested`, `reason`) the one asked for could not be fitted. */
  | { readonly kind: 'none'; readonly requested?: 'boxcox' | 'johnson'; readonly reason?: string }
  | (TransformedCapability & { readonly intervals: PercentileIntervals });

export interface BoundHandling {
  readonly naturalLowerBound: number;
  readonly statement: string;
}

export interface CapabilityExtensions {
  readonly transform: TransformSection;
  readonly percentileIntervals: PercentileIntervals | null;
  readonly comparison: ModelComparison;
  readonly stability: StabilityChart | null;
  /** With subgroups: the X̄ and R chart beside the X̄ and S one (`stability`), on the same scale. */
  readonly rangeChart: StabilityChart | null;
  readonly bounds: BoundHandling | null;
  readonly warnings: readonly string[];
}

const fmt = (v: number): string => String(Number(v.toPrecision(4)));

function transformValue(model: ModelSpec, x: number): number {
  if (model.kind === 'boxcox') return boxCoxTransform(x, model.lambda);
  if (model.kind === 'johnson') return johnsonZ(model, x);
  return x;
}

/**
 * The transformation of the data and the limits its percentile interval uses (a limit that has no
 * image on the transformed scale is dropped). Throws a PlumblineError when it cannot be fitted.
 */
export function transformTarget(sorted: Float64Array, kind: 'boxcox' | 'johnson', limits: SpecLimits, testAlpha: number): { readonly fitted: TransformedCapability; readonly limits: SpecLimits } {
  const fitted = transformedCapability(sorted, kind, limits, testAlpha);
  return {
    fitted,
    limits: { lsl: fitted.transformedLimits.lsl === null ? null : limits.lsl, usl: fitted.transformedLimits.usl === null ? null : limits.usl },
  };
}

export function capabilityExtensions(input: CapabilityExtensionsInput): CapabilityExtensions {
  const { limits, alpha, sorted } = input;
  const intervalsOf = (model: ModelSpec, on: SpecLimits): PercentileIntervals =>
    percentileIntervals(model, sorted, on, alpha, input.seed, input.replicates, input.ran?.(capabilityBootstrapJob(model, sorted.length, on, input.seed, input.replicates)) ?? null);
  const warnings: string[] = [];
  let bounds: BoundHandling | null = null;
  const b = input.naturalLowerBound;
  if (b !== null) {
    const below = sorted[0] as number;
    if (below < b) warnings.push(`Some values (smallest ${below}) lie below the stated natural lower bound ${b}; check the data or the bound.`);
    if (limits.lsl === null) {
      bounds = {
        naturalLowerBound: b,
        statement: `Upper limit only, with a natural lower bound at ${b}: there is no lower tail to fall out of, so only Ppu (and Ppk = Ppu) is computed and no ppm below is counted. Models whose support reaches below ${b} are flagged in the comparison with the share they put there.`,
      };
    } else if (limits.lsl <= b) {
      warnings.push(`The lower specification limit ${limits.lsl} is at or below the natural lower bound ${b}: no value can fall below it, so its side of the indices only describes the model's tail, not the process.`);
    }
  }

  let transform: TransformSection = { kind: 'none' };
  const extraRows: ComparisonCandidate[] = [];
  if (input.transform !== 'none') {
    try {
      const { fitted: t, limits: effective } = transformTarget(sorted, input.transform, limits, input.testAlpha);
      const intervals = intervalsOf(t.model, effective);
      transform = { ...t, intervals };
      const name = t.kind === 'boxcox' ? `Box–Cox normal (λ = ${fmt(t.lambda as number)})` : `Johnson ${t.type as string}`;
      extraRows.push({ model: name, dist: makeModel(t.model), rejectedBy: t.normality.passes ? [] : ['Anderson–Darling on the transformed values'] });
      if (!t.normality.passes) warnings.push(`The ${name} transformation does not make the data normal (Anderson–Darling p = ${fmt(t.normality.pValue)} at α = ${t.normality.alpha}); its indices do not describe the process.`);
      warnings.push(...t.notes);
    } catch (e) {
      if (!(e instanceof PlumblineError) || e.code === 'cancelled') throw e;
      transform = { kind: 'none', requested: input.transform, reason: e.message };
      warnings.push(`The ${input.transform === 'boxcox' ? 'Box–Cox' : 'Johnson'} transformation could not be fitted: ${e.message}`);
    }
  }

  let pIntervals: PercentileIntervals | null = null;
  if (input.transform === 'none' && input.percentileFamily !== null) {
    const c = input.candidates.find((x) => x.family === input.percentileFamily);
    if (c) pIntervals = intervalsOf({ kind: 'family', family: c.family, parameters: c.parameters }, limits);
  }

  const normal = input.candidates.find((c) => c.family === 'normal');
  const rows: ComparisonCandidate[] = [
    ...input.candidates.filter((c) => c.family !== 'normal').map((c) => ({ model: c.label, dist: makeModel({ kind: 'family', family: c.family, parameters: c.parameters }), rejectedBy: c.rejectedBy })),
    ...extraRows,
  ];
  const comparison = compareModels({ mean: input.mean, sd: input.sd, rejectedBy: normal ? normal.rejectedBy : [] }, rows, limits, b);

  // Shewhart limits assume roughly normal values: with a fitted transformation the chart is drawn on
  // the transformed scale (where the model is normal), so a long tail does not raise false alarms.
  let stability: StabilityChart | null = null;
  let rangeChart: StabilityChart | null = null;
  const candidateTr = transform.kind !== 'none' && transform.normality.passes ? transform : null;
  const transformed = candidateTr ? Float64Array.from(input.values as ArrayLike<number>, (x) => transformValue(candidateTr.model, x)) : null;
  // a value outside a Johnson SB/SL curve's bounds has no finite transformed value: chart the original scale then
  const tr = transformed && transformed.every(Number.isFinite) ? candidateTr : null;
  const scaled: ArrayLike<number> = tr && transformed ? transformed : input.values;
  const scaleName = tr ? (tr.kind === 'boxcox' ? `Box–Cox transformed (λ = ${fmt(tr.lambda as number)})` : `Johnson ${tr.type as string} transformed`) : 'original';
  try {
    let chart: StabilityChart | null = null;
    if (input.subgroups) {
      const map = new Map<string | number, number[]>();
      for (let i = 0; i < scaled.length; i++) {
        const k = input.subgroups[i] as string | number;
        const list = map.get(k) ?? [];
        list.push(scaled[i] as number);
        map.set(k, list);
      }
      const groups = [...map.entries()].map(([label, values]) => ({ label, values }));
      const subgrouped = groups.some((g) => g.values.length >= 2);
      chart = subgrouped ? subgroupChart(groups) : individualsChart(scaled, input.order);
      if (subgrouped) rangeChart = subgroupRangeChart(groups);
    } else if (input.order) chart = individualsChart(scaled, input.order);
    if (chart) {
      const normal = input.candidates.find((c) => c.family === 'normal');
      const skewNote = !tr && normal && normal.rejectedBy.length > 0 ? ' The limits assume roughly normal values and the normal model is rejected here: points beyond on the long-tail side may be false alarms; a transformation (Box–Cox or Johnson) charts the data on a scale where they are normal.' : '';
      stability = { ...chart, scale: scaleName, statement: chart.statement + skewNote };
      if (rangeChart) rangeChart = { ...rangeChart, scale: scaleName, statement: rangeChart.statement + skewNote };
    }
  } catch (e) {
    if (!(e instanceof PlumblineError) || e.code === 'cancelled') throw e;
    warnings.push(`No stability chart: ${e.message}`);
  }
  if (stability && !stability.stable) warnings.push(`Stability: ${stability.statement}`);
  else if (rangeChart && !rangeChart.stable) warnings.push(`Stability (subgroup means and ranges): ${rangeChart.statement}`);

  return { transform, percentileIntervals: pIntervals, comparison, stability, rangeChart, bounds, warnings };
}

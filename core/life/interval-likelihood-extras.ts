/**
 * What the dataset workflow adds to its life section when the options ask for the recorded-life
 * methods: an assumed Weibull shape (Weibayes), rank regression as the estimator, a test plan; or,
 * for up to MIXTURE_UNITS units, always the two-subpopulation mixture and the Turnbull estimate.
 * One call, so the workflow needs one line: `recordedLifeExtras({ times, failed }, options)`.
 */
import type { LifeInput } from './data.js';
import { analyzeRecordedLife, type LifeEstimation, type RecordedLifeReport } from './interval-likelihood-report.js';
import type { BoundMethod } from './bounds.js';
import type { LifeFamilyName } from './models.js';
import { planTest, type TestPlan } from './test-plan.js';

/** Above this many units the extras run only when asked for (the mixture's EM costs O(n) per iteration). */
export const MIXTURE_UNITS = 2000;

export interface RecordedLifeExtrasOptions {
  readonly families?: readonly string[];
  readonly bLifePercents?: readonly number[];
  readonly reliabilityTimes?: readonly number[] | null;
  readonly confidence?: number;
  readonly boundMethod?: BoundMethod;
  readonly estimation?: string;
  readonly assumedShape?: number | null;
  readonly planReliability?: number | null;
  readonly planTime?: number | null;
  readonly planConfidence?: number | null;
  readonly planFailures?: number | null;
}

export interface RecordedLifeExtras {
  /** The recorded-life report (estimator named on every number); null when not asked for and n > MIXTURE_UNITS. */
  readonly report: RecordedLifeReport | null;
  /** The test plan, when --plan-reliability (planReliability) is given with a time and an assumed shape. */
  readonly plan: TestPlan | null;
}

export function recordedLifeExtras(input: LifeInput, o: RecordedLifeExtrasOptions): RecordedLifeExtras | null {
  const estimation: LifeEstimation = o.estimation === 'rank-regression' ? 'rank-regression' : 'ml';
  const asked = (o.assumedShape ?? null) !== null || estimation === 'rank-regression' || (o.planReliability ?? null) !== null;
  if (!asked && input.times.length > MIXTURE_UNITS) return null;
  const plan =
    o.planReliability != null && o.planTime != null && o.assumedShape != null
      ? planTest({ reliability: o.planReliability, time: o.planTime, confidence: o.planConfidence ?? 0.9, shape: o.assumedShape, failuresAllowed: o.planFailures ?? 0 })
      : null;
  const life = ['weibull', 'lognormal', 'gamma', 'normal', 'exponential'];
  const run = (): RecordedLifeReport => analyzeRecordedLife(input, {
    ...(o.families ? { families: o.families.filter((f) => life.includes(f)) as LifeFamilyName[] } : {}),
    ...(o.bLifePercents ? { bLifePercents: o.bLifePercents } : {}),
    ...(o.reliabilityTimes ? { reliabilityTimes: o.reliabilityTimes } : {}),
    ...(o.confidence !== undefined ? { confidence: o.confidence } : {}),
    ...(o.boundMethod ? { boundMethod: o.boundMethod } : {}),
    estimation,
    ...(o.assumedShape != null ? { assumedShape: o.assumedShape } : {}),
  });
  if (asked) return { report: run(), plan };
  // Not asked for: an extra must never stop the report it rides on.
  try {
    return { report: run(), plan };
  } catch {
    return null;
  }
}

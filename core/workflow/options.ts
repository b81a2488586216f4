/**
 * Validation of the workflow options, with one clear message per problem (InputError 'bad-option').
 */
import { InputError } from '../errors.js';
import type { DatasetOptions } from './types.js';

/** Default two-sided confidence of every workflow interval (issue 4: "two-sided 90 % by default"). */
export const DEFAULT_CONFIDENCE = 0.9;

function bad(message: string, value?: unknown): InputError {
  return new InputError(message, value === undefined ? {} : { value: String(value) }, 'bad-option');
}

export interface WorkflowSettings {
  readonly confidence: number;
  readonly bLifePercents: readonly number[] | null;
  readonly reliabilityTimes: readonly number[];
  readonly returnPeriods: readonly number[] | null;
  readonly designLife: number | null;
  readonly lsl: number | null;
  readonly usl: number | null;
  readonly target: number | null;
  readonly capability: boolean;
}

function list(name: string, v: readonly number[] | undefined, ok: (x: number) => boolean, rule: string): readonly number[] | null {
  if (v === undefined) return null;
  if (v.length === 0) throw bad(`${name}: give at least one value.`);
  const seen = new Set<number>();
  for (const x of v) {
    if (typeof x !== 'number' || !ok(x)) throw bad(`${name}: every value must be ${rule}; got ${String(x)}.`, x);
    if (seen.has(x)) throw bad(`${name}: ${String(x)} is listed twice.`, x);
    seen.add(x);
  }
  return [...v];
}

function finiteOrNull(name: string, v: number | null | undefined): number | null {
  if (v === null || v === undefined) return null;
  if (typeof v !== 'number' || !Number.isFinite(v)) throw bad(`The ${name} must be a finite number; got ${String(v)}.`, v);
  return v;
}

export function workflowSettings(o: DatasetOptions): WorkflowSettings {
  const confidence = o.confidence ?? DEFAULT_CONFIDENCE;
  if (typeof confidence !== 'number' || !(confidence > 0 && confidence < 1)) {
    throw bad(`The confidence level must be a number between 0 and 1 (exclusive), e.g. 0.90; got ${String(confidence)}.`, confidence);
  }
  if (o.boundMethod !== undefined && o.boundMethod !== 'likelihood-ratio' && o.boundMethod !== 'fisher-matrix') {
    throw bad(`The bound method must be "likelihood-ratio" or "fisher-matrix"; got ${JSON.stringify(o.boundMethod)}.`, o.boundMethod);
  }
  const bLifePercents = list('B-life percents', o.bLifePercents, (x) => x > 0 && x < 100, 'a percent strictly between 0 and 100');
  const reliabilityTimes = list('Reliability times', o.reliabilityTimes, (x) => Number.isFinite(x) && x > 0, 'a time > 0') ?? [];
  const returnPeriods = list('Return periods', o.returnPeriods, (x) => Number.isFinite(x) && x > 1, 'a number of years greater than 1');
  let designLife: number | null = null;
  if (o.designLife !== undefined && o.designLife !== null) {
    if (!(typeof o.designLife === 'number' && Number.isFinite(o.designLife) && o.designLife > 0)) {
      throw bad(`The design life must be a number of years > 0; got ${String(o.designLife)}.`, o.designLife);
    }
    if (returnPeriods === null) throw bad('A design life needs return periods (the chance of exceeding each return level within the design life).');
    designLife = o.designLife;
  }
  const lsl = finiteOrNull('lower specification limit', o.lsl);
  const usl = finiteOrNull('upper specification limit', o.usl);
  const target = finiteOrNull('target', o.target);
  if (lsl !== null && usl !== null && !(lsl < usl)) throw bad(`The lower specification limit (${lsl}) must be below the upper one (${usl}).`);
  const capability = lsl !== null || usl !== null;
  if (!capability && target !== null) throw bad('A target needs a specification limit (lsl and/or usl).');
  if (!capability && o.withinMethod !== undefined) throw bad('A within-subgroup sigma method needs a specification limit (lsl and/or usl).');
  if (o.withinMethod !== undefined && o.withinMethod !== 'pooled' && o.withinMethod !== 'range') {
    throw bad(`The within-subgroup sigma method must be "pooled" or "range"; got ${JSON.stringify(o.withinMethod)}.`, o.withinMethod);
  }
  if (o.plottingPosition !== undefined && returnPeriods === null) throw bad('A plotting position applies to the return-period plot: give return periods too.');
  return { confidence, bLifePercents, reliabilityTimes, returnPeriods, designLife, lsl, usl, target, capability };
}

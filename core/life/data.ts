/**
 * Right-censored life data: each unit's time and whether it failed (1) or was a suspension (0,
 * still running or removed unfailed). Validated once and sorted by time (failures before
 * suspensions at equal times, the usual convention for ranks and the Kaplan–Meier estimator).
 */
import { InputError } from '../errors.js';

export interface LifeInput {
  readonly times: Float64Array | readonly number[];
  /** 1 = failure, 0 = right-censored suspension. */
  readonly failed: Uint8Array | readonly number[];
}

export interface LifeData {
  /** All units, n = failures + suspensions. */
  readonly n: number;
  readonly failures: number;
  readonly suspensions: number;
  /** Times sorted ascending (failures first among ties). */
  readonly times: Float64Array;
  readonly failed: Uint8Array;
  /** Failure times only (ascending). */
  readonly failureTimes: Float64Array;
  /** Suspension times only (ascending). */
  readonly suspensionTimes: Float64Array;
  readonly maxTime: number;
  readonly minTime: number;
  /**
   * Distinct (time, status) pairs with their counts, in the same order: the likelihood is summed
   * over these, so tied times (rounded hours, a batch of suspensions at the end of test) cost once.
   */
  readonly groups: { readonly times: Float64Array; readonly failed: Uint8Array; readonly counts: Float64Array };
}

/**
 * Build LifeData from trusted arrays (the bootstrap's simulated samples) without the user-input
 * checks: times may be ≤ 0 under a normal model.
 */
export function buildLifeData(times: Float64Array, failed: Uint8Array): LifeData {
  return assemble(times, failed);
}

export function prepareLifeData(input: LifeInput): LifeData {
  const n = input.times.length;
  if (input.failed.length !== n) {
    throw new InputError(`The status column has ${input.failed.length} entries but there are ${n} times.`, {}, 'bad-input');
  }
  if (n === 0) throw new InputError('No units to analyse: the life data are empty.', {}, 'too-few-values');
  for (let i = 0; i < n; i++) {
    const t = input.times[i] as number;
    const f = input.failed[i] as number;
    if (!Number.isFinite(t)) throw new InputError(`Unit #${i + 1}: time ${String(t)} is not a finite number.`, { value: String(t) }, 'not-a-number');
    if (!(t > 0)) throw new InputError(`Unit #${i + 1}: time ${String(t)} must be > 0 for life data.`, { value: String(t) }, 'bad-input');
    if (f !== 0 && f !== 1) throw new InputError(`Unit #${i + 1}: status ${String(f)} must be 1 (failed) or 0 (suspended).`, { value: String(f) }, 'bad-input');
  }
  return assemble(input.times, input.failed);
}

function assemble(inTimes: LifeInput['times'], inFailed: LifeInput['failed']): LifeData {
  const n = inTimes.length;
  const idx = new Array<number>(n);
  for (let i = 0; i < n; i++) idx[i] = i;
  idx.sort((a, b) => {
    const d = (inTimes[a] as number) - (inTimes[b] as number);
    return d !== 0 ? d : (inFailed[b] as number) - (inFailed[a] as number);
  });
  const times = new Float64Array(n);
  const failed = new Uint8Array(n);
  let r = 0;
  for (let i = 0; i < n; i++) {
    const j = idx[i] as number;
    times[i] = inTimes[j] as number;
    failed[i] = inFailed[j] as number;
    r += failed[i] as number;
  }
  const failureTimes = new Float64Array(r);
  const suspensionTimes = new Float64Array(n - r);
  for (let i = 0, a = 0, b = 0; i < n; i++) {
    if (failed[i]) failureTimes[a++] = times[i] as number;
    else suspensionTimes[b++] = times[i] as number;
  }
  let g = 0;
  for (let i = 0; i < n; i++) if (i === 0 || times[i] !== times[i - 1] || failed[i] !== failed[i - 1]) g++;
  const gt = new Float64Array(g);
  const gf = new Uint8Array(g);
  const gc = new Float64Array(g);
  for (let i = 0, k = -1; i < n; i++) {
    if (i === 0 || times[i] !== times[i - 1] || failed[i] !== failed[i - 1]) {
      k++;
      gt[k] = times[i] as number;
      gf[k] = failed[i] as number;
    }
    gc[k] = (gc[k] as number) + 1;
  }
  return {
    groups: { times: gt, failed: gf, counts: gc },
    n,
    failures: r,
    suspensions: n - r,
    times,
    failed,
    failureTimes,
    suspensionTimes,
    minTime: times[0] as number,
    maxTime: times[n - 1] as number,
  };
}

/**
 * Visit each distinct failure time in ascending order with the number at risk just before it and the
 * number of failures at it (the Kaplan–Meier risk sets, Kaplan & Meier 1958); times at which only
 * suspensions occur are passed over (they only shrink the later risk sets).
 */
export function forEachFailureTime(data: LifeData, visit: (time: number, atRisk: number, failures: number) => void): void {
  const n = data.n;
  let i = 0;
  while (i < n) {
    const t = data.times[i] as number;
    let d = 0;
    let m = 0;
    while (i + m < n && data.times[i + m] === t) {
      d += data.failed[i + m] as number;
      m++;
    }
    if (d > 0) visit(t, n - i, d);
    i += m;
  }
}

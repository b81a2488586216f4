/**
 * Grouped-data maximum likelihood: with class counts c_j on contiguous classes (a_j, b_j],
 *   ℓ(θ) = Σ_j c_j ln P_θ(a_j < X ≤ b_j)
 * (the multinomial likelihood of the counts; e.g. Kulldorff 1961, Contributions to the Theory
 * of Estimation from Grouped and Partially Grouped Samples [from memory]). When the classes do not
 * reach the ends of the model's support, the mass beyond them is an implicit class with count 0,
 * which is what the sum above already expresses. The class probabilities are taken in log space
 * (class-probability.ts). Maximised with core/optimize (Nelder–Mead then Newton) in free
 * coordinates: ln of every parameter whose lower bound is 0, identity for the others. Start: the
 * family's own complete-sample fit to pseudo-values at the class midpoints (open classes
 * represented one neighbouring class width beyond their finite limit), repeated in proportion to
 * the counts (at most about 2000 pseudo-values).
 */
import { getFamily, type Family, type FamilyName, type FitSuccess, type NotApplicable, type Parameters } from '../families/index.js';
import { CompensatedSum } from '../compensated.js';
import { IDENTITY, LOG, maximize, type Transform } from '../optimize/index.js';
import { prepareSample } from '../sample.js';
import { logClassProbability } from './class-probability.js';
import type { GroupedData } from './classes.js';

/** A family's fit result (core/families) without warnings; `logLikelihood` is the grouped one. */
export type GroupedFitSuccess = Omit<FitSuccess, 'warnings'>;

export type GroupedFitOutcome = GroupedFitSuccess | NotApplicable;

/** ℓ(θ) = Σ c_j ln P_j (compensated); -Infinity when a class with a count has zero probability. */
export function groupedLogLikelihood(family: Family, parameters: Parameters, data: GroupedData): number {
  let d;
  try {
    d = family.make(parameters);
  } catch {
    return Number.NEGATIVE_INFINITY;
  }
  const sum = new CompensatedSum();
  for (let j = 0; j < data.classes; j++) {
    const cnt = data.count[j] as number;
    if (cnt === 0) continue;
    const v = cnt * logClassProbability(d, data.lower[j] as number, data.upper[j] as number);
    if (!(v > Number.NEGATIVE_INFINITY)) return Number.NEGATIVE_INFINITY;
    sum.add(v);
  }
  return sum.value;
}

/** Representative points of the classes, for the starting values. */
export function classMidpoints(data: GroupedData): Float64Array {
  const k = data.classes;
  const mids = new Float64Array(k);
  for (let j = 0; j < k; j++) {
    const a = data.lower[j] as number;
    const b = data.upper[j] as number;
    if (Number.isFinite(a) && Number.isFinite(b)) mids[j] = 0.5 * (a + b);
    else {
      const neighbour = k > 1 ? (j === 0 ? (data.upper[1] as number) - (data.lower[1] as number) : (data.upper[j - 1] as number) - (data.lower[j - 1] as number)) : 1;
      const w = Number.isFinite(neighbour) ? neighbour : 1;
      mids[j] = Number.isFinite(a) ? a + 0.5 * w : b - 0.5 * w;
    }
  }
  return mids;
}

function pseudoSample(data: GroupedData, positive: boolean): Float64Array | null {
  const mids = classMidpoints(data);
  const scale = Math.min(1, 2000 / data.total);
  const out: number[] = [];
  for (let j = 0; j < data.classes; j++) {
    const cnt = data.count[j] as number;
    if (cnt === 0) continue;
    let m = mids[j] as number;
    if (positive && !(m > 0)) {
      const b = data.upper[j] as number;
      if (!(b > 0)) return null;
      m = b / 2;
    }
    const reps = Math.max(1, Math.round(cnt * scale));
    for (let r = 0; r < reps; r++) out.push(m);
  }
  return Float64Array.from(out);
}

function notApplicable(family: FamilyName, reason: string, offendingCount = 0): NotApplicable {
  return { ok: false, family, reason, offendingCount };
}

export function fitGrouped(name: FamilyName, data: GroupedData): GroupedFitOutcome {
  const family = getFamily(name);
  const names = family.parameterNames;
  const positive = family.make(startParameters(family)).support.lower === 0;
  // A positive family gives zero probability to classes at or below 0.
  if (positive) {
    let offending = 0;
    for (let j = 0; j < data.classes; j++) if ((data.upper[j] as number) <= 0 && (data.count[j] as number) > 0) offending += data.count[j] as number;
    if (offending > 0) return notApplicable(name, `${offending} counted value(s) lie in classes at or below 0; the ${family.label} model needs values > 0`, offending);
  }
  let nonEmpty = 0;
  for (let j = 0; j < data.classes; j++) if ((data.count[j] as number) > 0) nonEmpty++;
  if (nonEmpty < 2 && names.length > 1) {
    return notApplicable(name, `all counts fall in one class; the ${names.length} parameters of the ${family.label} model cannot be estimated`);
  }
  const pseudo = pseudoSample(data, positive);
  let start: Parameters | null = null;
  if (pseudo && pseudo.length >= 2) {
    const s = prepareSample(pseudo);
    const f = family.fit(s);
    if (f.ok) start = f.parameters;
  }
  if (!start) return notApplicable(name, `no starting values for the ${family.label} model could be formed from the class midpoints`);
  const transforms: Transform[] = names.map((k) => ((family.parameterBounds[k]?.lower ?? Number.NEGATIVE_INFINITY) === 0 ? LOG : IDENTITY));
  const toParams = (th: Float64Array): Parameters => {
    const p: Record<string, number> = {};
    for (let i = 0; i < names.length; i++) p[names[i] as string] = th[i] as number;
    return p;
  };
  const ll = (th: Float64Array): number => groupedLogLikelihood(family, toParams(th), data);
  const theta0 = names.map((k) => start[k] as number);
  if (!Number.isFinite(ll(Float64Array.from(theta0)))) {
    return notApplicable(name, `the ${family.label} model fitted to the class midpoints gives some counted class zero probability`);
  }
  const r = maximize(ll, theta0, { transforms, xtol: 1e-10 });
  return {
    ok: true,
    family: name,
    parameters: Object.freeze(toParams(r.x)),
    logLikelihood: r.value,
    iterations: r.iterations,
    converged: r.converged,
    method: 'grouped-data maximum likelihood Σ count·ln(F(upper) - F(lower)) (Nelder–Mead then Newton)',
  };
}

/** Any valid parameter set of the family, to read its support (the bounds' interior). */
function startParameters(family: Family): Parameters {
  const p: Record<string, number> = {};
  for (const k of family.parameterNames) {
    const b = family.parameterBounds[k];
    p[k] = b && b.lower === 0 ? 1 : 0;
  }
  // A threshold-type or shape parameter may need other values; fall back to 1 for all.
  try {
    family.make(p);
    return p;
  } catch {
    for (const k of family.parameterNames) p[k] = 1;
    return p;
  }
}

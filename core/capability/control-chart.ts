/**
 * Stability before capability: a Shewhart chart of the characteristic with 3-sigma limits
 * (Montgomery, Introduction to Statistical Quality Control, ch. 6 [from memory]).
 * - Individuals and moving range (values in time order, no subgroups): MRᵢ = |xᵢ - xᵢ₋₁|,
 *   σ̂ = MR̄/d2(2); individuals limits x̄ ± 3σ̂; moving-range limits 0 and D4·MR̄ with
 *   D4 = 1 + 3·d3(2)/d2(2), d3(2) = √(2(1 - 2/π)) the standard deviation of the range of two
 *   standard normals (closed form), so D4 = 3.2665 (Montgomery's table: 3.267).
 * - X̄ and S (subgroups): σ̂ = mean of sᵢ/c4(nᵢ); X̄ limits x̿ ± 3σ̂/√nᵢ; S limits
 *   c4(nᵢ)σ̂ ± 3σ̂√(1 - c4(nᵢ)²) (lower end floored at 0). With equal sizes these are Montgomery's
 *   x̿ ± A3·s̄, B3·s̄ and B4·s̄ with A3 = 3/(c4√n), B3,4 = 1 ∓ 3√(1 - c4²)/c4.
 * - X̄ and R (subgroups, shown beside X̄ and S): σ̂ = mean of Rᵢ/d2(nᵢ); X̄ limits x̿ ± 3σ̂/√nᵢ; R limits
 *   d2(nᵢ)σ̂ ± 3d3(nᵢ)σ̂ (lower end floored at 0). With equal sizes these are Montgomery's x̿ ± A2·R̄,
 *   D3·R̄ and D4·R̄ with A2 = 3/(d2√n), D3 = max(0, 1 - 3d3/d2), D4 = 1 + 3d3/d2 (Montgomery,
 *   Appendix VI, factors for variables control charts [from memory; edition not checked]; d2 and d3
 *   are integrated here, constants.ts, and checked against that table and SciPy in
 *   test/capability/control-constants.test.ts). The range uses only two values of each subgroup, so
 *   Montgomery advises the S chart beyond about 10 per subgroup.
 * A point beyond a limit (the first Western Electric rule), or a run on the location panel completing
 * Western Electric rules 2-4 (run-rules.ts), marks the process as not shown to be in control; indices
 * of an unstable process do not predict its future output.
 */
import { CompensatedSum } from '../compensated.js';
import { InputError } from '../errors.js';
import { c4, d2, d3 } from './constants.js';
import { RUN_RULE_WORDS, RUN_RULES_SOURCE, runRuleSignals, type RunRule } from './run-rules.js';

export interface ChartPoint {
  /** Time/order value or subgroup label. */
  readonly label: string | number;
  readonly value: number;
  readonly lower: number;
  readonly upper: number;
  readonly beyond: 'above' | 'below' | null;
  /** Location panel: the Western Electric run rules (2-4) this point completes; absent when none. */
  readonly runRules?: readonly RunRule[];
}

export interface ChartPanel {
  readonly statistic: 'individual value' | 'moving range' | 'subgroup mean' | 'subgroup standard deviation' | 'subgroup range';
  readonly center: number;
  readonly points: readonly ChartPoint[];
}

export interface StabilityChart {
  readonly kind: 'individuals and moving range' | 'subgroup means and standard deviations' | 'subgroup means and ranges';
  readonly location: ChartPanel;
  readonly dispersion: ChartPanel;
  /** The within-process sigma behind the limits and how it was estimated. */
  readonly sigma: number;
  readonly sigmaMethod: string;
  readonly pointsBeyond: number;
  /** Location points that complete a run-rule signal (Western Electric rules 2-4). */
  readonly runSignals: number;
  /** No point beyond a limit and no run signal. */
  readonly stable: boolean;
  readonly orderFrom: 'order column' | 'row order' | 'subgroup column';
  /** The scale charted: 'original' or the transformation's name (set by the caller). */
  readonly scale?: string;
  readonly statement: string;
  readonly source: string;
  /** X̄ and R with equal subgroup sizes: the table factors behind the limits. */
  readonly factors?: RangeChartFactors;
}

/** Montgomery's factors for an X̄ and R chart with subgroups of n. */
export interface RangeChartFactors {
  readonly n: number;
  readonly d2: number;
  readonly d3: number;
  readonly A2: number;
  readonly D3: number;
  readonly D4: number;
}

/** A2, D3, D4 (and d2, d3) for subgroups of n, from the integrated d2 and d3. */
export function rangeChartFactors(n: number): RangeChartFactors {
  const a = d2(n);
  const b = d3(n);
  return { n, d2: a, d3: b, A2: 3 / (a * Math.sqrt(n)), D3: Math.max(0, 1 - (3 * b) / a), D4: 1 + (3 * b) / a };
}

export const D3_PAIR = Math.sqrt(2 * (1 - 2 / Math.PI));
/** D4 for moving ranges of two; computed when first asked (d2 is a numerical integral; not at module load). */
export function d4Pair(): number {
  return 1 + (3 * D3_PAIR) / d2(2);
}

export const STABILITY_SOURCE = 'Montgomery, Introduction to Statistical Quality Control, ch. 6 (Shewhart charts, 3-sigma limits; constants c4, d2 computed exactly); run rules: Western Electric Statistical Quality Control Handbook (1956)';
export const UNSTABLE_WARNING =
  'The chart shows points beyond its 3-sigma limits: the process is not shown to be stable, and capability indices of an unstable process do not predict its future output. Find and remove the special causes first.';

const beyond = (v: number, lo: number, hi: number): ChartPoint['beyond'] => (v > hi ? 'above' : v < lo ? 'below' : null);

export const UNSTABLE_RUNS_WARNING =
  'Runs of points signal a shift or trend (Western Electric rules 2-4): the process is not shown to be stable, and capability indices of an unstable process do not predict its future output. With all four rules an in-control chart gives a false signal about once in 92 points, so check the signalled stretch for a cause.';

/** Attach the run rules (2-4) to the location points; the number of points that complete one. */
function withRunRules(points: ChartPoint[], center: number, sigmas: readonly number[]): { points: ChartPoint[]; signals: number; rules: Set<RunRule> } {
  const sig = runRuleSignals(points.map((p) => p.value), center, sigmas);
  const rules = new Set<RunRule>();
  let signals = 0;
  const out = points.map((p, i) => {
    const r = sig[i] as RunRule[];
    if (r.length === 0) return p;
    signals++;
    for (const k of r) rules.add(k);
    return { ...p, runRules: r };
  });
  return { points: out, signals, rules };
}

function statement(n: number, runs: { signals: number; rules: Set<RunRule> }, what: string): string {
  if (n === 0 && runs.signals === 0) return `No point lies beyond the 3-sigma limits, and no run of ${what} signals (${RUN_RULES_SOURCE}).`;
  const parts: string[] = [];
  if (n > 0) parts.push(`${n} point(s) lie beyond the 3-sigma limits. ${UNSTABLE_WARNING}`);
  if (runs.signals > 0) {
    const words = [...runs.rules].sort().map((k) => `rule ${k}: ${RUN_RULE_WORDS[k]}`).join('; ');
    parts.push(`${runs.signals} ${what} complete a run signal (${words}). ${n > 0 ? 'With all four rules an in-control chart gives a false signal about once in 92 points.' : UNSTABLE_RUNS_WARNING}`);
  }
  return parts.join(' ');
}

/** Individuals and moving-range chart of values in time order (sorted by `order` when given). */
export function individualsChart(values: ArrayLike<number>, order: ArrayLike<number> | null): StabilityChart {
  const n = values.length;
  if (n < 3) throw new InputError('A control chart needs at least 3 values.', {}, 'not-computable');
  const idx = Array.from({ length: n }, (_, i) => i);
  if (order) idx.sort((a, b) => (order[a] as number) - (order[b] as number));
  const x = idx.map((i) => values[i] as number);
  const labels = idx.map((i) => (order ? (order[i] as number) : i + 1));
  const s = new CompensatedSum();
  for (const v of x) s.add(v);
  const mean = s.value / n;
  const mr = new CompensatedSum();
  for (let i = 1; i < n; i++) mr.add(Math.abs((x[i] as number) - (x[i - 1] as number)));
  const mrBar = mr.value / (n - 1);
  const sigma = mrBar / d2(2);
  const lo = mean - 3 * sigma;
  const hi = mean + 3 * sigma;
  const mrHi = d4Pair() * mrBar;
  const location: ChartPoint[] = x.map((v, i) => ({ label: labels[i] as number, value: v, lower: lo, upper: hi, beyond: beyond(v, lo, hi) }));
  const dispersion: ChartPoint[] = [];
  for (let i = 1; i < n; i++) {
    const v = Math.abs((x[i] as number) - (x[i - 1] as number));
    dispersion.push({ label: labels[i] as number, value: v, lower: 0, upper: mrHi, beyond: beyond(v, 0, mrHi) });
  }
  const count = [...location, ...dispersion].filter((p) => p.beyond !== null).length;
  const runs = withRunRules(location, mean, location.map(() => sigma));
  return {
    kind: 'individuals and moving range',
    location: { statistic: 'individual value', center: mean, points: runs.points },
    dispersion: { statistic: 'moving range', center: mrBar, points: dispersion },
    sigma,
    sigmaMethod: `mean moving range / d2(2) = ${String(Number(mrBar.toPrecision(6)))} / ${d2(2).toFixed(6)}`,
    pointsBeyond: count,
    runSignals: runs.signals,
    stable: count === 0 && runs.signals === 0,
    orderFrom: order ? 'order column' : 'row order',
    statement: statement(count, runs, 'values'),
    source: STABILITY_SOURCE,
  };
}

/** X̄ and S chart of subgroups (first-seen label order); subgroups of one value are skipped. */
export function subgroupChart(groups: readonly { readonly label: string | number; readonly values: readonly number[] }[]): StabilityChart {
  const usable = groups.filter((g) => g.values.length >= 2);
  if (usable.length < 2) throw new InputError('A subgroup chart needs at least 2 subgroups of 2 or more values.', {}, 'not-computable');
  const stats = usable.map((g) => {
    const m = new CompensatedSum();
    for (const v of g.values) m.add(v);
    const mean = m.value / g.values.length;
    const ss = new CompensatedSum();
    for (const v of g.values) ss.add((v - mean) * (v - mean));
    return { label: g.label, n: g.values.length, mean, s: Math.sqrt(ss.value / (g.values.length - 1)) };
  });
  const grand = new CompensatedSum();
  let total = 0;
  for (const g of stats) {
    grand.add(g.mean * g.n);
    total += g.n;
  }
  const xbarbar = grand.value / total;
  const sig = new CompensatedSum();
  for (const g of stats) sig.add(g.s / c4(g.n));
  const sigma = sig.value / stats.length;
  const sBar = new CompensatedSum();
  for (const g of stats) sBar.add(g.s);
  const location: ChartPoint[] = stats.map((g) => {
    const h = (3 * sigma) / Math.sqrt(g.n);
    return { label: g.label, value: g.mean, lower: xbarbar - h, upper: xbarbar + h, beyond: beyond(g.mean, xbarbar - h, xbarbar + h) };
  });
  const dispersion: ChartPoint[] = stats.map((g) => {
    const c = c4(g.n);
    const lo = Math.max(0, c * sigma - 3 * sigma * Math.sqrt(1 - c * c));
    const hi = c * sigma + 3 * sigma * Math.sqrt(1 - c * c);
    return { label: g.label, value: g.s, lower: lo, upper: hi, beyond: beyond(g.s, lo, hi) };
  });
  const count = [...location, ...dispersion].filter((p) => p.beyond !== null).length;
  const runs = withRunRules(location, xbarbar, stats.map((g) => sigma / Math.sqrt(g.n)));
  return {
    kind: 'subgroup means and standard deviations',
    location: { statistic: 'subgroup mean', center: xbarbar, points: runs.points },
    dispersion: { statistic: 'subgroup standard deviation', center: sBar.value / stats.length, points: dispersion },
    sigma,
    sigmaMethod: 'mean of sᵢ / c4(nᵢ) over the subgroups',
    pointsBeyond: count,
    runSignals: runs.signals,
    stable: count === 0 && runs.signals === 0,
    orderFrom: 'subgroup column',
    statement: statement(count, runs, 'subgroup means'),
    source: STABILITY_SOURCE,
  };
}

/**
 * X̄ and R chart of subgroups (first-seen label order); subgroups of one value are skipped. With
 * equal sizes the limits are x̿ ± A2·R̄, D3·R̄ and D4·R̄ (`factors`).
 */
export function subgroupRangeChart(groups: readonly { readonly label: string | number; readonly values: readonly number[] }[]): StabilityChart {
  const usable = groups.filter((g) => g.values.length >= 2);
  if (usable.length < 2) throw new InputError('A subgroup chart needs at least 2 subgroups of 2 or more values.', {}, 'not-computable');
  const stats = usable.map((g) => {
    const m = new CompensatedSum();
    let lo = Number.POSITIVE_INFINITY;
    let hi = Number.NEGATIVE_INFINITY;
    for (const v of g.values) {
      m.add(v);
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
    return { label: g.label, n: g.values.length, mean: m.value / g.values.length, range: hi - lo };
  });
  const grand = new CompensatedSum();
  let total = 0;
  for (const g of stats) {
    grand.add(g.mean * g.n);
    total += g.n;
  }
  const xbarbar = grand.value / total;
  const sig = new CompensatedSum();
  const rSum = new CompensatedSum();
  for (const g of stats) {
    sig.add(g.range / d2(g.n));
    rSum.add(g.range);
  }
  const sigma = sig.value / stats.length;
  const rBar = rSum.value / stats.length;
  const location: ChartPoint[] = stats.map((g) => {
    const h = (3 * sigma) / Math.sqrt(g.n);
    return { label: g.label, value: g.mean, lower: xbarbar - h, upper: xbarbar + h, beyond: beyond(g.mean, xbarbar - h, xbarbar + h) };
  });
  const dispersion: ChartPoint[] = stats.map((g) => {
    const center = d2(g.n) * sigma;
    const half = 3 * d3(g.n) * sigma;
    const lo = Math.max(0, center - half);
    const hi = center + half;
    return { label: g.label, value: g.range, lower: lo, upper: hi, beyond: beyond(g.range, lo, hi) };
  });
  const count = [...location, ...dispersion].filter((p) => p.beyond !== null).length;
  const runs = withRunRules(location, xbarbar, stats.map((g) => sigma / Math.sqrt(g.n)));
  const sizes = new Set(stats.map((g) => g.n));
  const equal = sizes.size === 1 ? (stats[0] as { n: number }).n : null;
  const large = Math.max(...sizes) > 10 ? ' Subgroups of more than 10: the S chart is the better one here (the range uses two values of each).' : '';
  return {
    kind: 'subgroup means and ranges',
    location: { statistic: 'subgroup mean', center: xbarbar, points: runs.points },
    dispersion: { statistic: 'subgroup range', center: rBar, points: dispersion },
    sigma,
    sigmaMethod: equal !== null ? `mean range / d2(${equal}) = ${String(Number(rBar.toPrecision(6)))} / ${d2(equal).toFixed(6)}` : 'mean of Rᵢ / d2(nᵢ) over the subgroups',
    pointsBeyond: count,
    runSignals: runs.signals,
    stable: count === 0 && runs.signals === 0,
    orderFrom: 'subgroup column',
    statement: statement(count, runs, 'subgroup means') + large,
    source: STABILITY_SOURCE.replace('constants c4, d2 computed exactly', 'constants c4, d2, d3 computed exactly; A2, D3, D4 from them'),
    ...(equal !== null ? { factors: rangeChartFactors(equal) } : {}),
  };
}

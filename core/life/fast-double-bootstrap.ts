/**
 * The fast double bootstrap p-value (Davidson & MacKinnon 2007, "Improving the reliability of
 * bootstrap tests with the fast double bootstrap", Computational Statistics & Data Analysis
 * 51:3259-3281 [from memory]), used for the censored A² under staggered withdrawals
 * (bootstrap-range.ts). Every first-level replicate j (statistic τ*_j, drawn from the fit to the data)
 * draws ONE second-level replicate from its own refit and its own censoring estimate (statistic
 * τ**_j). With p̂* the ordinary bootstrap p-value and Q** the value that τ** exceeds as often as
 * τ* exceeds the observed τ̂,
 *   p** = share of the τ*_j above Q**(p̂*),
 * i.e. the ordinary p-value corrected by how far the second-level distribution (replicates of a
 * replicate) has drifted from the first-level one (replicates of the data): it is the double
 * bootstrap's calibration with one inner replicate instead of many, at twice the ordinary cost.
 *
 * In the counting form of the ordinary p = (1 + #{τ*_j ≥ τ̂})/(B + 1) used everywhere here:
 *   c = #{τ*_j ≥ τ̂},  Q = the (c + 1)-th largest τ**_j (−∞ when c = B),
 *   p** = (1 + #{τ*_j > Q})/(B + 1),
 * so that p** equals the ordinary p when the two levels have the same statistics. The bookkeeping
 * of replicates that cannot be drawn or refitted is conservative at both levels (either can only
 * raise p**): a first-level one counts as +∞ (it exceeds τ̂ and Q), a second-level one (or the
 * missing second level of a failed first-level replicate) as −∞ (it lowers Q).
 */

export interface FastDoubleBootstrapPValue {
  /** p** (the decision's p-value). */
  readonly pValue: number;
  /** The ordinary (single) bootstrap p-value (1 + #{τ* ≥ τ̂})/(B + 1), for reference. */
  readonly firstLevelPValue: number;
  readonly replicates: number;
}

/** `first[j]`, `second[j]`: replicate j's statistic and its second-level replicate's (NaN or null: not drawn or refitted). */
export function fastDoubleBootstrapPValue(observed: number, first: readonly number[], second: readonly number[]): FastDoubleBootstrapPValue {
  const B = first.length;
  if (second.length !== B) throw new RangeError(`fast double bootstrap: ${B} first-level and ${second.length} second-level statistics`);
  const up = (x: number | null): number => (x !== null && Number.isFinite(x) ? x : Number.POSITIVE_INFINITY);
  const down = (x: number | null): number => (x !== null && Number.isFinite(x) ? x : Number.NEGATIVE_INFINITY);
  let c = 0;
  for (const x of first) if (up(x) >= observed) c++;
  const sorted = second.map(down).sort((a, b) => b - a);
  const q = c < B ? (sorted[c] as number) : Number.NEGATIVE_INFINITY;
  let m = 0;
  for (const x of first) if (up(x) > q) m++;
  return { pValue: (1 + m) / (B + 1), firstLevelPValue: (1 + c) / (B + 1), replicates: B };
}

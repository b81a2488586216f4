/**
 * Capability under every model, side by side, kept honest:
 * - one normal row, with the overall sample standard deviation (n - 1) that Pp/Ppk use; its
 *   verdict is the normal candidate's Anderson–Darling test (the normal candidate's own MLE sigma,
 *   divisor n, is not listed a second time with a different total);
 * - one row per other fitted candidate and for the transformation when one is fitted, with the
 *   ISO 22514-2 percentile indices and ppm from its fitted quantiles and tails;
 * - rows whose model a test rejects are kept apart (`passes: false`) and never enter the spread;
 * - the spread is the range of total ppm over the passing rows only;
 * - each row says which model and which sigma its numbers use;
 * - with a natural lower bound and no lower limit, no lower tail is invented: ppm below is 0 and
 *   the mass a model puts below the bound is reported as a flaw of that model.
 */
import { normalCdf } from '../special/index.js';
import type { SpecLimits } from './indices.js';
import { supportText, type CapabilityModel } from './model.js';
import { percentileCapability } from './percentile.js';

export interface ComparisonCandidate {
  /** Name of the model as shown (family label or transformation). */
  readonly model: string;
  readonly dist: CapabilityModel;
  /** Names of the tests that reject the model (empty: it passes). */
  readonly rejectedBy: readonly string[];
}

export interface ComparisonRow {
  readonly model: string;
  readonly kind: 'normal' | 'fitted model' | 'transformation';
  /** Which sigma or spread the indices use, in words. */
  readonly sigma: string;
  readonly ppmBelow: number;
  readonly ppmAbove: number;
  readonly ppmTotal: number;
  readonly indices: readonly { readonly name: string; readonly estimate: number }[];
  /** The model's 0.135 % and 99.865 % points (the normal row: mean ∓ 3 overall sd), in the data's units: the room to each limit is read from these. */
  readonly lowerQuantile: number;
  readonly upperQuantile: number;
  readonly passes: boolean;
  readonly rejectedBy: readonly string[];
  readonly support: string;
  /** ppm the model puts below the natural lower bound (null without a bound). */
  readonly ppmBelowNaturalBound: number | null;
}

export interface ModelComparison {
  /** Rows that pass the tests (the spread is over these). */
  readonly passing: readonly ComparisonRow[];
  /** Rows a test rejects, shown apart. */
  readonly rejected: readonly ComparisonRow[];
  /** Range of total ppm over the passing rows; null with fewer than two. */
  readonly spread: { readonly lowest: number; readonly highest: number; readonly lowestModel: string; readonly highestModel: string } | null;
  readonly note: string;
}

export const PERCENTILE_SIGMA = 'fitted quantiles X0.135 %, X50 %, X99.865 % (ISO 22514-2 percentile method)';
export const OVERALL_SIGMA = 'overall sample standard deviation (n - 1)';

export interface NormalRowInput {
  readonly mean: number;
  readonly sd: number;
  readonly rejectedBy: readonly string[];
}

export function compareModels(
  normalRow: NormalRowInput | null,
  candidates: readonly ComparisonCandidate[],
  limits: SpecLimits,
  naturalLowerBound: number | null,
): ModelComparison {
  const bound = naturalLowerBound;
  const effLsl = limits.lsl;
  const rows: ComparisonRow[] = [];
  if (normalRow) {
    const { mean, sd } = normalRow;
    const below = effLsl === null ? 0 : 1e6 * normalCdf((effLsl - mean) / sd);
    const above = limits.usl === null ? 0 : 1e6 * normalCdf((mean - limits.usl) / sd);
    const idx: { name: string; estimate: number }[] = [];
    const pu = limits.usl !== null ? (limits.usl - mean) / (3 * sd) : null;
    const pl = effLsl !== null ? (mean - effLsl) / (3 * sd) : null;
    if (pu !== null && pl !== null) idx.push({ name: 'Pp', estimate: (limits.usl! - effLsl!) / (6 * sd) });
    idx.push({ name: 'Ppk', estimate: pu === null ? (pl as number) : pl === null ? pu : Math.min(pu, pl) });
    if (pu !== null) idx.push({ name: 'Ppu', estimate: pu });
    if (pl !== null) idx.push({ name: 'Ppl', estimate: pl });
    rows.push({
      model: 'normal',
      kind: 'normal',
      sigma: OVERALL_SIGMA,
      ppmBelow: below,
      ppmAbove: above,
      ppmTotal: below + above,
      indices: idx,
      lowerQuantile: mean - 3 * sd,
      upperQuantile: mean + 3 * sd,
      passes: normalRow.rejectedBy.length === 0,
      rejectedBy: normalRow.rejectedBy,
      support: 'all real x',
      ppmBelowNaturalBound: bound === null ? null : 1e6 * normalCdf((bound - mean) / sd),
    });
  }
  for (const c of candidates) {
    const d = c.dist;
    const below = effLsl === null ? 0 : 1e6 * d.cdf(effLsl);
    const above = limits.usl === null ? 0 : 1e6 * d.sf(limits.usl);
    const pc = percentileCapability(d, limits);
    rows.push({
      model: c.model,
      kind: d.spec.kind === 'family' ? 'fitted model' : 'transformation',
      sigma: PERCENTILE_SIGMA,
      ppmBelow: below,
      ppmAbove: above,
      ppmTotal: below + above,
      indices: pc.indices.map((i) => ({ name: i.name, estimate: i.estimate })),
      lowerQuantile: pc.lowerQuantile,
      upperQuantile: pc.upperQuantile,
      passes: c.rejectedBy.length === 0,
      rejectedBy: c.rejectedBy,
      support: supportText(d.support),
      ppmBelowNaturalBound: bound === null ? null : d.support.lower >= bound ? 0 : 1e6 * d.cdf(bound),
    });
  }
  const passing = rows.filter((r) => r.passes);
  const rejected = rows.filter((r) => !r.passes);
  let spread: ModelComparison['spread'] = null;
  if (passing.length >= 2) {
    const sorted = [...passing].sort((a, b) => a.ppmTotal - b.ppmTotal);
    const lo = sorted[0] as ComparisonRow;
    const hi = sorted[sorted.length - 1] as ComparisonRow;
    spread = { lowest: lo.ppmTotal, highest: hi.ppmTotal, lowestModel: lo.model, highestModel: hi.model };
  }
  const note =
    passing.length === 0
      ? 'No model passes the tests: every row is shown apart and there is no spread to read; the ppm figures describe no model that fits.'
      : `The spread of ppm is over the ${passing.length} model(s) that pass the tests; rejected models are listed apart and never enter it.`;
  return { passing, rejected, spread, note };
}

/**
 * Regional frequency analysis of a set of sites by the L-moment index-flood method (Hosking & Wallis
 * 1997): each site's sample L-moments, the discordancy of each site (§3.2), the heterogeneity
 * measure H by simulation (§4.3.3), the GEV and generalized logistic growth curves fitted to the
 * regional average L-moments with their Z goodness-of-fit (§5.2.3), and each site's quantiles as its
 * index flood (mean) times the growth curve. Cautions: the region is the user's choice, H and D only
 * question it; a design flood rests on the governing agency's guidance.
 */
import { InputError } from '../errors.js';
import { sampleLMoments } from '../lmoments/sample-lmoments.js';
import { discordancy, type DiscordancyResult } from './discordancy.js';
import { fitGrowth, growthAt, type GrowthFit } from './growth-curve.js';
import { heterogeneity, regionalAverages, type Heterogeneity, type SiteSample } from './heterogeneity.js';

export interface RegionalSiteInput {
  readonly name: string;
  /** The site's annual maxima (any order). */
  readonly values: ArrayLike<number>;
}

export interface RegionalOptions {
  readonly periods?: readonly number[];
  readonly simulations?: number;
  readonly seed?: number;
}

export interface RegionalReport {
  readonly sites: readonly (SiteSample & { readonly l1: number; readonly t5: number })[];
  readonly regional: { readonly t: number; readonly t3: number; readonly t4: number; readonly totalYears: number };
  readonly discordancy: DiscordancyResult;
  readonly heterogeneity: Heterogeneity;
  readonly fits: readonly GrowthFit[];
  /** The growth curve of the acceptable fit with the smallest |Z| (or of the smallest |Z| flagged as not acceptable). */
  readonly growthCurve: {
    readonly family: GrowthFit['family'];
    readonly label: string;
    readonly acceptable: boolean;
    readonly rows: readonly { readonly period: number; readonly growth: number }[];
  };
  /** Each site's quantiles: index flood (site mean) × growth factor. */
  readonly siteQuantiles: readonly { readonly name: string; readonly indexFlood: number; readonly levels: readonly { readonly period: number; readonly level: number }[] }[];
  readonly methods: readonly string[];
  readonly cautions: readonly string[];
}

export const DEFAULT_REGIONAL_PERIODS: readonly number[] = [2, 10, 50, 100];

export function regionalAnalysis(input: readonly RegionalSiteInput[], options: RegionalOptions = {}): RegionalReport {
  if (input.length < 2) throw new InputError(`a region needs at least 2 sites; got ${input.length}`, {}, 'too-few-values');
  const sites = input.map((s) => {
    const sorted = Float64Array.from(s.values).sort();
    if (sorted.length < 5) throw new InputError(`site ${JSON.stringify(s.name)} has ${sorted.length} values; L-moment ratios need at least 5`, { value: s.name }, 'too-few-values');
    if (!((sorted[0] as number) > 0)) throw new InputError(`site ${JSON.stringify(s.name)} has a value ≤ 0; the index-flood method scales positive flows by their mean`, { value: s.name }, 'bad-input');
    const l = sampleLMoments(sorted);
    return { name: s.name, n: sorted.length, l1: l.l1, t: l.t, t3: l.t3, t4: l.t4, t5: l.t5 };
  });
  const periods = options.periods ?? DEFAULT_REGIONAL_PERIODS;
  const r = regionalAverages(sites);
  const het = heterogeneity(sites, options.simulations ?? 500, options.seed ?? 20261204);
  const fits = (['gev', 'genlogistic'] as const).map((f) => fitGrowth(f, r, het.t4Bias, het.t4Sd));
  const ranked = [...fits].sort((a, b) => Number(b.acceptable) - Number(a.acceptable) || Math.abs(a.z) - Math.abs(b.z));
  const chosen = ranked[0] as GrowthFit;
  const rows = periods.map((period) => ({ period, growth: growthAt(chosen, period) }));
  const cautions = [
    'The region is the analyst’s choice: discordancy and heterogeneity only question it; they do not prove it homogeneous.',
    'A design flood rests on the governing agency’s guidance and licensed engineering judgement; these numbers are inputs to that judgement, not a substitute for it.',
  ];
  if (het.h1 >= 1) cautions.unshift(`H1 = ${het.h1.toFixed(2)}: the region is ${het.verdict}; consider subdividing it before using the regional growth curve.`);
  if (!chosen.acceptable) cautions.unshift('Neither the GEV nor the generalized logistic fits the regional L-moments acceptably (|Z| > 1.64).');
  return {
    sites,
    regional: { ...r, totalYears: sites.reduce((a, s) => a + s.n, 0) },
    discordancy: discordancy(sites),
    heterogeneity: het,
    fits,
    growthCurve: { family: chosen.family, label: chosen.label, acceptable: chosen.acceptable, rows },
    siteQuantiles: sites.map((s) => ({ name: s.name, indexFlood: s.l1, levels: rows.map((g) => ({ period: g.period, level: s.l1 * g.growth })) })),
    methods: [
      'Sample L-moments from unbiased probability-weighted moments (Hosking 1990, JRSS B 52:105-124).',
      'Discordancy D_i and its critical values (Hosking & Wallis 1997, §3.2, Table 3.1).',
      `Heterogeneity H from ${het.simulations} regions simulated from a ${het.parent.family} parent with the sites’ record lengths (Hosking & Wallis 1997, §4.3.3; seed ${het.seed}).`,
      'Growth curves fitted by L-moments; goodness of fit Z = (τ4 − t4R + B4)/σ4 (Hosking & Wallis 1997, §5.2.3); index flood = site mean.',
    ],
    cautions,
  };
}

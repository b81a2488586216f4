/**
 * A complete sample as a dataset report: the issue-2 analysis (planAnalysis → bootstrap →
 * finishAnalysis, unchanged) with the workflow sections added on top of it:
 *  - flood: return levels of every candidate (core/flood: profile likelihood for Gumbel/GEV,
 *    delta method otherwise), plotting positions, design-life exceedance, far-beyond-record warning;
 *  - capability: core/capability with the normality gate taken from the normal candidate's
 *    Anderson–Darling test, the percentile method on the best non-normal candidate, and ppm out of
 *    spec under every candidate;
 *  - trend: core/trend's Mann–Kendall test and Sen's slope on the values in time order;
 *  - sensitivity: each decision number under every candidate that passes the tests.
 */
import { finishAnalysis, planAnalysis, type AnalysisPlan } from '../analyze.js';
import type { BootstrapCounts } from '../gof/index.js';
import { capability, capabilityAnswer, capabilityExtensions, CAPABILITY_BOOTSTRAP_REPLICATES, ppmOutOfSpec, type CapabilityExtensionsInput } from '../capability/index.js';
import { InputError } from '../errors.js';
import { DEFAULT_FAMILIES, EXTREME_VALUE_FAMILIES, GEV_SHAPE_GUARD, getFamily, type FamilyName } from '../families/index.js';
import { exceedanceRisk, floodFrequency, FLOOD_CAUTION, GEV_SIGN_NOTE, plottingPositions, RECORD_MULTIPLE, returnLevels, type ReturnLevelMethod } from '../flood/index.js';
import type { MethodNote } from '../report.js';
import { prepareSample } from '../sample.js';
import { mannKendall } from '../trend/index.js';
import { checkFloodEstimation, floodEstimatorsFor } from './flood-estimators.js';
import type { WorkflowSettings } from './options.js';
import { quantityNumber, sensitivityRows, type QuantityValue } from './sensitivity.js';
import type { CapabilitySection, DatasetCandidate, DatasetOptions, DatasetReport, FloodSection, ReturnLevelRow, TrendSection } from './types.js';

export interface CompleteInput {
  readonly values: ArrayLike<number>;
  readonly subgroups?: readonly (string | number)[] | null;
  readonly order?: ArrayLike<number> | null;
  /** See DatasetInput.sortInPlace: used only when there is no order and no subgroup column. */
  readonly sortInPlace?: boolean;
}

/** Everything before the bootstrap of a complete sample (the bootstrap jobs can run anywhere). */
export interface CompletePlan {
  readonly input: CompleteInput;
  readonly options: DatasetOptions;
  readonly settings: WorkflowSettings;
  readonly plan: AnalysisPlan;
}

export function planComplete(input: CompleteInput, options: DatasetOptions, settings: WorkflowSettings): CompletePlan {
  const { values } = input;
  checkFloodEstimation(options, settings.returnPeriods);
  if (input.subgroups && !settings.capability) {
    throw new InputError('Subgroup labels are used for capability: give a specification limit (lsl and/or usl) too.', {}, 'bad-option');
  }
  if (input.subgroups && input.subgroups.length !== values.length) {
    throw new InputError(`There are ${input.subgroups.length} subgroup labels for ${values.length} values.`, {}, 'bad-input');
  }
  if (input.order && input.order.length !== values.length) {
    throw new InputError(`There are ${input.order.length} order values for ${values.length} values.`, {}, 'bad-input');
  }
  const sample = prepareSample(values, { inPlace: input.sortInPlace === true && !input.order && !input.subgroups });
  const families: readonly FamilyName[] =
    options.families ?? (settings.returnPeriods !== null ? [...DEFAULT_FAMILIES, ...EXTREME_VALUE_FAMILIES] : DEFAULT_FAMILIES);
  const { confidence: _c, bLifePercents: _b, boundMethod: _m, reliabilityTimes: _r, lifePlotPositions: _l, returnPeriods: _p, designLife: _d, plottingPosition: _pp, lsl: _ls, usl: _us, target: _t, withinMethod: _w, trend: _tr, transform: _tf, naturalLowerBound: _nb, capabilityReplicates: _cr, ...analyzeOptions } = options;
  return { input, options, settings, plan: planAnalysis(sample, { ...analyzeOptions, families }) };
}

/**
 * The report from a plan and its bootstrap counts (one per job, each covering its whole range);
 * `ran`: the capability bootstrap jobs run elsewhere (core/workflow/capability-jobs.ts), looked up
 * by job; one not found there is run inline.
 */
export function finishComplete(p: CompletePlan, counts: readonly BootstrapCounts[], ran: CapabilityExtensionsInput['ran'] = undefined): DatasetReport {
  const { input, options, settings, plan } = p;
  const { values } = input;
  const sample = plan.sample;
  const base = finishAnalysis(plan, counts);
  const fitWarnings = new Map<FamilyName, readonly string[]>();
  for (const c of plan.candidates) if (c.fit.warnings && c.fit.warnings.length > 0) fitWarnings.set(c.family.name, c.fit.warnings);

  const extraWarnings: string[] = [];
  const methods: MethodNote[] = [...base.methods];
  const candidateWarnings = new Map<FamilyName, string[]>();
  const addCandidateWarning = (family: FamilyName, label: string, w: string): void => {
    const list = candidateWarnings.get(family) ?? [];
    list.push(w);
    candidateWarnings.set(family, list);
    extraWarnings.push(`${label}: ${w}`);
  };

  // Flood: return levels under every candidate.
  let flood: FloodSection | undefined;
  const levelsByFamily = new Map<FamilyName, { rows: ReturnLevelRow[]; detail: string; method: ReturnLevelMethod }>();
  if (settings.returnPeriods !== null) {
    const periods = settings.returnPeriods;
    const sectionWarnings = new Set<string>();
    const intervalMethods: FloodSection['intervalMethods'][number][] = [];
    for (const c of base.candidates) {
      try {
        const r = returnLevels(sample, { family: c.family, parameters: c.parameters }, periods, { level: settings.confidence, shapeGuard: GEV_SHAPE_GUARD });
        const rows: ReturnLevelRow[] = r.levels.map((l) => ({
          period: l.period,
          exceedanceProbability: l.exceedanceProbability,
          estimate: l.estimate,
          lower: l.lowerFound && Number.isFinite(l.lower) ? l.lower : null,
          upper: l.upperFound && Number.isFinite(l.upper) ? l.upper : null,
          confidence: l.level,
          beyondRecord: l.beyondRecord,
        }));
        const method = r.levels[0]?.method ?? 'delta';
        levelsByFamily.set(c.family, { rows, detail: r.methodDetail, method });
        intervalMethods.push({ family: c.family, method, detail: r.methodDetail });
        for (const w of r.warnings) {
          if (/twice the \d+-year record/.test(w)) sectionWarnings.add(w);
          else addCandidateWarning(c.family, c.label, w);
        }
      } catch (e) {
        if (e instanceof InputError && e.code === 'bad-option') throw e;
        addCandidateWarning(c.family, c.label, `return levels could not be computed (${e instanceof Error ? e.message.replace(/\.$/, '') : String(e)}).`);
      }
    }
    const pp = plottingPositions(sample.sorted, options.plottingPosition ?? 'weibull');
    const hasGev = base.candidates.some((c) => c.family === 'gev');
    const hasGumbel = base.candidates.some((c) => c.family === 'gumbel');
    // The Gumbel-inside-GEV likelihood-ratio test, as core/flood computes it (its own Gumbel and GEV fits).
    const gumbelVersusGev = hasGev && hasGumbel ? floodFrequency(values, { periods, level: settings.confidence, alpha: base.options.alpha, shapeGuard: GEV_SHAPE_GUARD }).gumbelVersusGev : null;
    const far = periods.filter((T) => T > RECORD_MULTIPLE * sample.n);
    const warnings = [...sectionWarnings];
    const estimators = floodEstimatorsFor(values, options, { periods, confidence: settings.confidence, seed: base.options.seed });
    if (estimators) warnings.push(...estimators.section.warnings);
    extraWarnings.push(...warnings);
    const cautions = [
      FLOOD_CAUTION,
      'Return levels assume that the annual maxima are independent and identically distributed (no trend, no change of regime); check the trend section when the years are given.',
    ];
    flood = {
      recordLength: sample.n,
      periods: [...periods],
      confidence: settings.confidence,
      intervalMethods,
      plottingPositions: { formula: pp.formula, description: pp.description, a: pp.a, points: pp.points },
      designLife:
        settings.designLife === null
          ? null
          : { years: settings.designLife, exceedance: periods.map((T) => ({ period: T, probability: exceedanceRisk(T, settings.designLife as number) })) },
      beyondRecord: far,
      gumbelVersusGev,
      gevSignNote: hasGev ? GEV_SIGN_NOTE : null,
      ...(estimators ? { estimators: estimators.section } : {}),
      warnings,
      cautions,
    };
    if (estimators) methods.push(...estimators.methods);
    methods.push(
      {
        topic: 'return levels',
        description: `z_T = isf(1/T) of each fitted model; two-sided ${quantityNumber(100 * settings.confidence)} % intervals by profile likelihood for Gumbel and GEV (the model reparametrised by z_T, χ²₁), by the delta method on the observed information for the other families.`,
        source: 'Coles (2001), An Introduction to Statistical Modeling of Extreme Values, §3.1.3 and §3.3.3.',
      },
      {
        topic: 'plotting positions',
        description: `${pp.description}: p_i = (i - a)/(n + 1 - 2a) with a = ${pp.a}, return period 1/(1 - p_i).`,
        source: 'Weibull i/(n + 1); Gringorten (1963), J. Geophys. Res. 68:813-814; Cunnane (1978), J. Hydrology 37:205-222.',
      },
    );
    if (settings.designLife !== null) {
      methods.push({ topic: 'design-life exceedance', description: 'Chance of at least one exceedance of the T-year level in L independent years: 1 - (1 - 1/T)^L.', source: 'Common practice (binomial risk), no source.' });
    }
  }

  // Capability: the gate from the normal candidate, the percentile method on the best non-normal one.
  let capabilitySection: CapabilitySection | undefined;
  const ppmByFamily = new Map<FamilyName, ReturnType<typeof ppmOutOfSpec>>();
  if (settings.capability) {
    for (const c of base.candidates) ppmByFamily.set(c.family, ppmOutOfSpec(getFamily(c.family).make(c.parameters), settings.lsl, settings.usl));
    const normal = base.candidates.find((c) => c.family === 'normal');
    const nonNormal = base.candidates.filter((c) => c.family !== 'normal');
    const chosen = nonNormal.find((c) => c.rejectedBy.length === 0) ?? nonNormal[0] ?? null;
    const gateRule =
      'The normality gate is the normal candidate\'s Anderson–Darling test at α. The percentile method uses the best-ranked non-normal candidate that no test rejects (else the best-ranked non-normal candidate, flagged in the warnings).' +
      (normal ? '' : ' The normal model is not among the candidates, so there is no gate and the percentile method is shown.');
    const rep = capability(input.subgroups ? values : sample, {
      lsl: settings.lsl,
      usl: settings.usl,
      target: settings.target,
      subgroups: input.subgroups ?? null,
      ...(options.withinMethod !== undefined ? { withinMethod: options.withinMethod } : {}),
      alpha: 1 - settings.confidence,
      normality: normal ? { passes: !normal.andersonDarling.rejected, alpha: normal.andersonDarling.alpha, pValue: normal.andersonDarling.pValue } : null,
      nonNormal: chosen ? getFamily(chosen.family).make(chosen.parameters) : null,
    });
    // One normal model on the page and in the report: the normal candidate's ppm uses the overall
    // sample sd (n - 1) that Pp/Ppk and the comparison's normal row use, not the ML sd (divisor n);
    // otherwise the headline and the capability section printed two ppm under 'Normal' (issue 14 item 4).
    if (normal) ppmByFamily.set('normal', rep.normalPpm);
    const warnings = [...rep.warnings];
    if (rep.percentile !== null && chosen !== null && chosen.rejectedBy.length > 0) {
      warnings.push(`Every non-normal candidate is rejected; the percentile method uses the best-ranked one (${chosen.label}), which does not describe the data well either.`);
    }
    const percentileFamily = rep.percentile !== null && chosen ? chosen.family : null;
    // Transformation, bootstrap intervals of the percentile indices, the model comparison and the stability chart.
    const { warnings: extWarnings, ...ext } = capabilityExtensions({
      values,
      sorted: sample.sorted,
      subgroups: input.subgroups ?? null,
      order: input.order ?? null,
      limits: { lsl: settings.lsl, usl: settings.usl },
      alpha: 1 - settings.confidence,
      testAlpha: base.options.alpha,
      transform: options.transform ?? 'none',
      naturalLowerBound: options.naturalLowerBound ?? null,
      seed: base.options.seed,
      replicates: options.capabilityReplicates ?? CAPABILITY_BOOTSTRAP_REPLICATES,
      candidates: base.candidates,
      mean: rep.mean,
      sd: rep.sdOverall,
      percentileFamily,
      ...(ran ? { ran } : {}),
    });
    warnings.push(...extWarnings);
    // The answer for the best-ranked candidate (the page's first selection), one decision with the page and the CLI.
    const selected = base.candidates[0]?.family ?? null;
    const answer = { ...capabilityAnswer({ ...ext, percentileFamily }, base.candidates, selected), selected };
    capabilitySection = { ...rep, ...ext, warnings, percentileFamily, gateRule, answer };
    extraWarnings.push(...warnings);
    methods.push({
      topic: 'capability',
      description: `Pp/Ppk from the overall standard deviation (n - 1)${input.subgroups ? `; Cp/Cpk from the within-subgroup sigma (${rep.within?.description ?? ''})` : ''}; two-sided ${quantityNumber(100 * settings.confidence)} % intervals (chi-square on ν for Cp/Pp, Bissell 1990 for Cpk/Ppk, Boyles 1991 for Cpm). Percentile method: fitted quantiles at 0.135 % and 99.865 % and the median. ppm out of spec: 1e6·F(LSL) + 1e6·S(USL) under each fitted model.`,
      source: 'Bissell (1990), Applied Statistics 39:331-340; Boyles (1991), JQT 23:17-26; ISO 22514-2 (percentile method); NIST/SEMATECH e-Handbook §6.1.6.',
    });
  }

  // Trend: Mann–Kendall on the values in time order.
  let trend: TrendSection | undefined;
  if (input.order || options.trend) {
    const r = mannKendall(values, { times: input.order ?? null, alpha: base.options.alpha });
    trend = { ...r, orderFrom: input.order ? 'column' : 'row order' };
    if (r.warning) extraWarnings.push(r.warning);
    methods.push({ topic: 'trend', description: r.method, source: 'Mann (1945), Econometrica 13:245-259; Kendall (1975), Rank Correlation Methods; Sen (1968), JASA 63:1379-1389.' });
  }

  const candidates: DatasetCandidate[] = base.candidates.map((c) => {
    const w = [...(fitWarnings.get(c.family) ?? []), ...(candidateWarnings.get(c.family) ?? [])];
    const rl = levelsByFamily.get(c.family);
    const ppm = ppmByFamily.get(c.family);
    return {
      ...c,
      ...(rl ? { returnLevels: rl.rows, returnLevelMethod: rl.detail } : {}),
      ...(ppm ? { ppmOutOfSpec: ppm } : {}),
      ...(w.length > 0 ? { warnings: w } : {}),
    };
  });

  const quantities: { quantity: string; value: (c: DatasetCandidate) => QuantityValue | null }[] = [];
  for (const [j, T] of (settings.returnPeriods ?? []).entries()) {
    quantities.push({
      quantity: `return level T=${quantityNumber(T)}`,
      value: (c) => {
        const r = c.returnLevels?.[j];
        return r ? { estimate: r.estimate, lower: r.lower, upper: r.upper } : null;
      },
    });
  }
  if (settings.capability) {
    // One normal number per report: the normal's ppm is the capability comparison's (overall sd, n - 1), named so.
    const normalRow = capabilitySection ? [...capabilitySection.comparison.passing, ...capabilitySection.comparison.rejected].find((row) => row.kind === 'normal') : undefined;
    quantities.push({
      quantity: 'ppm out of spec',
      value: (c) => (c.family === 'normal' && normalRow ? { estimate: normalRow.ppmTotal, label: `${c.label} (sd n - 1)` } : c.ppmOutOfSpec ? { estimate: c.ppmOutOfSpec.total } : null),
    });
  }
  const sensitivity = quantities.length > 0 ? sensitivityRows(candidates, quantities) : undefined;

  return {
    ...base,
    candidates,
    warnings: [...base.warnings, ...extraWarnings],
    methods,
    dataKind: 'complete',
    ...(flood ? { flood } : {}),
    ...(capabilitySection ? { capability: capabilitySection } : {}),
    ...(trend ? { trend } : {}),
    ...(sensitivity ? { sensitivity } : {}),
  };
}

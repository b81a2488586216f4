/**
 * Life data with suspensions as a dataset report: core/life's `analyzeLife` (censored maximum
 * likelihood, B-lives and reliability with likelihood-ratio or Fisher-matrix bounds, plot
 * positions that respect suspensions, the censoring-reproducing Anderson–Darling bootstrap) laid
 * out in the issue-2 frame: the censored fits are the ranked `candidates`, their chi-square is
 * "not computable" with the reason, their Anderson–Darling entry is the censored bootstrap.
 */
import { PLUMBLINE_VERSION, resolveOptions } from '../analyze.js';
import { InputError } from '../errors.js';
import { formatNumber } from '../gof/index.js';
import { analyzeLife, recordedLifeExtras, CHI_SQUARE_NOT_APPLICABLE, LIFE_FAMILIES, type BLife, type CensoredGofHook, type CensoredGofResult, type LifeCandidate, type LifeFamilyName, type ReliabilityAt } from '../life/index.js';
import { RANKING_RULE, verdict } from '../rank.js';
import type { AndersonDarlingReport, MethodNote, NotApplicableReport } from '../report.js';
import { prepareSample } from '../sample.js';
import { lifeModes } from './life-modes.js';
import type { WorkflowSettings } from './options.js';
import { quantityNumber, sensitivityRows } from './sensitivity.js';
import type { DatasetCandidate, DatasetOptions, DatasetReport, LifeSection } from './types.js';

/** Censored bootstrap replicates when none are asked for (each replicate refits a censored MLE). */
export const DEFAULT_LIFE_REPLICATES = 999;

export const BOUND_TEXT = {
  'likelihood-ratio': 'likelihood-ratio (profile likelihood of the B-life, χ²₁; Meeker & Escobar 1998 §8.3)',
  'fisher-matrix': 'Fisher matrix (observed information, delta method on ln x_p; Meeker & Escobar 1998 §8.4)',
} as const;

function summaryOf(times: ArrayLike<number>): DatasetReport['summary'] {
  const s = prepareSample(times);
  return { min: s.min, max: s.max, mean: s.mean, sd: s.n > 1 ? Math.sqrt(s.sumSqDev / (s.n - 1)) : 0, distinct: s.distinct };
}

/** `goodnessOfFit`: where the censored bootstrap runs (default in-process; see core/workflow/pipeline.ts). */
export function lifeReport(
  times: ArrayLike<number>,
  status: ArrayLike<number>,
  options: DatasetOptions,
  settings: WorkflowSettings,
  goodnessOfFit?: CensoredGofHook,
  modes?: readonly (string | null)[] | null,
): DatasetReport {
  if (settings.returnPeriods !== null) throw new InputError('Return periods need a complete sample of annual maxima, not life data with a status column.', {}, 'bad-option');
  if (settings.capability) throw new InputError('Capability needs a complete sample of measurements, not life data with a status column.', {}, 'bad-option');
  const families = (options.families ?? LIFE_FAMILIES) as readonly string[];
  for (const f of families) {
    if (!(LIFE_FAMILIES as readonly string[]).includes(f)) {
      throw new InputError(`Family "${f}" is not offered for censored life data; use ${LIFE_FAMILIES.join(', ')}.`, { value: f }, 'bad-option');
    }
  }
  const replicates = options.bootstrapReplicates ?? DEFAULT_LIFE_REPLICATES;
  const opts = resolveOptions({ ...options, families: families as LifeFamilyName[], bootstrapReplicates: replicates, pMethod: 'bootstrap' });
  const bLifePercents = settings.bLifePercents ?? [10];
  const boundMethod = options.boundMethod ?? 'likelihood-ratio';
  let failures = 0;
  for (let i = 0; i < status.length; i++) {
    const f = status[i] as number;
    if (f !== 0 && f !== 1) throw new InputError(`Unit #${i + 1}: status ${String(f)} must be 1 (failed) or 0 (suspended).`, { value: String(f) }, 'bad-input');
    if (f === 1) failures++;
  }
  if (failures < 2) {
    throw new InputError(`Only ${failures} failure${failures === 1 ? '' : 's'} among ${status.length} units: at least 2 failures are needed to fit a life model.`, {}, 'too-few-values');
  }
  const life = analyzeLife(
    { times: Array.from(times), failed: Array.from(status) },
    {
      families: families as LifeFamilyName[],
      bLifePercents,
      confidence: settings.confidence,
      boundMethod,
      reliabilityTimes: settings.reliabilityTimes,
      bootstrapReplicates: replicates,
      seed: opts.seed,
      ...(options.lifePlotPositions !== undefined ? { plotPositions: options.lifePlotPositions } : {}),
      ...(goodnessOfFit ? { goodnessOfFit } : {}),
    },
  );
  const alpha = opts.alpha;
  const notApplicable: NotApplicableReport[] = life.notFitted.map((f) => ({ family: f.family, reason: f.reason, offendingCount: 0 }));
  const kept: LifeCandidate[] = [];
  for (const c of life.candidates) {
    if (c.goodnessOfFit !== null && c.goodnessOfFit.replicates === 0) {
      notApplicable.push({ family: c.family, reason: `The ${c.label} fit has no Anderson–Darling p-value: none of the ${replicates} bootstrap replicates could be refitted, so it is not reported.`, offendingCount: 0 });
    } else kept.push(c);
  }
  const best = kept[0]?.aicc ?? 0;
  const ctx = { alpha: opts.alpha, seed: opts.seed, replicates, boundMethod, confidence: settings.confidence };
  const candidates: DatasetCandidate[] = kept.map((c, i) => lifeCandidate(c, i + 1, c.aicc - best, ctx));
  const warnings: string[] = [...life.warnings];
  for (const c of candidates) for (const w of c.warnings ?? []) warnings.push(`${c.label}: ${w}`);
  if (candidates.length > 0 && candidates.every((c) => c.rejectedBy.length > 0)) {
    warnings.push(`Every candidate is rejected at α = ${formatNumber(alpha)}: none of these models describes the data well; the ranking only says which is least bad.`);
  }
  for (const na of notApplicable) warnings.push(`${na.family}: not applicable. ${na.reason}`);
  const methods: MethodNote[] = life.methods.map((m) => ({ topic: m.topic, description: m.text, source: m.source }));
  const section: LifeSection = {
    units: life.n,
    failures: life.failures,
    suspensions: life.suspensions,
    confidence: life.confidence,
    boundMethod: life.boundMethod,
    bLifePercents: [...bLifePercents],
    reliabilityTimes: [...settings.reliabilityTimes],
    plot: life.plot,
    curves: kept.map((c) => ({ family: c.family, ...c.curves })),
    chiSquare: life.chiSquare,
    warnings: life.warnings,
    cautions: life.cautions,
    ...(modes ? { modes: lifeModes(times, status, modes, { families, bLifePercents, reliabilityTimes: settings.reliabilityTimes, confidence: settings.confidence, boundMethod }) } : {}),
    ...withRecorded(recordedLifeExtras({ times: Array.from(times), failed: Array.from(status) }, { ...options, bLifePercents, reliabilityTimes: settings.reliabilityTimes, confidence: settings.confidence })),
  };
  const sensitivity = sensitivityRows(candidates, [
    ...bLifePercents.map((pct, j) => ({
      quantity: `B${quantityNumber(pct)} life`,
      value: (c: DatasetCandidate) => {
        const b = c.bLives?.[j];
        return b ? { estimate: b.estimate, lower: b.lower, upper: b.upper } : null;
      },
    })),
    ...settings.reliabilityTimes.map((t, j) => ({
      quantity: `reliability at t=${quantityNumber(t)}`,
      value: (c: DatasetCandidate) => {
        const r = c.reliability?.[j];
        return r ? { estimate: r.estimate, lower: r.lower, upper: r.upper } : null;
      },
    })),
    { quantity: 'mean life', value: (c: DatasetCandidate) => (c.meanLife !== undefined ? { estimate: c.meanLife } : null) },
  ]);
  return {
    software: { name: 'plumbline', version: PLUMBLINE_VERSION },
    n: life.n,
    summary: summaryOf(times),
    options: { ...opts, families: [...opts.families] },
    rankingRule: `${RANKING_RULE} For life data with suspensions n counts all units.`,
    candidates,
    notApplicable,
    warnings,
    methods,
    dataKind: 'censored',
    life: section,
    sensitivity,
  };
}

/** The recorded-life extras (core/life recordedLifeExtras: mixture, Turnbull, Weibayes, rank regression, test plan) when they ran. */
function withRecorded(r: ReturnType<typeof recordedLifeExtras>): Pick<LifeSection, 'recorded'> {
  return r ? { recorded: r } : {};
}

/** What a life candidate needs to become a dataset candidate (core/life LifeCandidate and RecordedLifeCandidate both have it). */
export interface LifeCandidateLike {
  readonly family: LifeFamilyName;
  readonly label: string;
  readonly parameters: Readonly<Record<string, number>>;
  readonly estimatedParameters: number;
  readonly logLikelihood: number;
  readonly aic: number;
  readonly aicc: number;
  readonly bic: number;
  readonly method: string;
  readonly iterations?: number;
  readonly converged: boolean;
  /** The inspection-scheme test adds whether its size is calibrated (core/life IntervalGofResult). */
  readonly goodnessOfFit: (CensoredGofResult & { readonly sizeCalibrated?: boolean; readonly sizeNote?: string; readonly testLabel?: string }) | null;
  readonly bLives: readonly BLife[];
  readonly reliability: readonly ReliabilityAt[];
  readonly meanLife: number;
  readonly warnings: readonly string[];
}

/**
 * A life candidate in the issue-2 frame: chi-square not computable (with the reason), the
 * Anderson–Darling entry its bootstrap (right-censored or inspection-scheme; rejected at p ≤ α),
 * its B-lives and reliabilities with bounds. Shared by the status-column and the interval-row reports.
 */
export function lifeCandidate(
  c: LifeCandidateLike,
  rank: number,
  deltaAicc: number,
  ctx: { readonly alpha: number; readonly seed: number; readonly replicates: number; readonly boundMethod: keyof typeof BOUND_TEXT; readonly confidence: number },
): DatasetCandidate {
  const { alpha } = ctx;
  const g = c.goodnessOfFit;
  const pValue = g?.pValue ?? Number.NaN;
  // The inspection-scheme test decides only where its size was measured near α (core/life INTERVAL_GOF_SIZE).
  const uncalibrated = g?.sizeCalibrated === false ? (g.sizeNote ?? 'not size-calibrated here') : null;
  const rejected = uncalibrated === null && pValue <= alpha; // a Monte Carlo p-value (1 + #)/(B + 1): reject at p ≤ α (exact size, Davison & Hinkley 1997 §4.2.5 [from memory])
  const p = `p = ${formatNumber(pValue)}`;
  // Which statistic the test bootstrapped, in words (interval rows: the testLabel of core/life interval-gof-design.ts; status-column data: censored A²).
  const named = `${g?.testLabel ?? 'censored A²'} = ${formatNumber(g?.statistic ?? Number.NaN)}`;
  const ad: AndersonDarlingReport = {
    statistic: g?.statistic ?? Number.NaN,
    pValue,
    pValueIs: 'estimate',
    method: 'bootstrap',
    methodDetail: `${g?.method ?? ''}. ${g?.replicates ?? 0} replicates; seed derived from ${ctx.seed} for each family.`,
    replicates: g?.replicates ?? 0,
    monteCarloStandardError: g?.monteCarloError ?? Number.NaN,
    ...(g && g.failedReplicates > 0 ? { failedReplicates: g.failedReplicates } : {}),
    seed: ctx.seed,
    alpha,
    rejected,
    decision:
      uncalibrated !== null
        ? `No decision: the test is ${uncalibrated}. ${named.charAt(0).toUpperCase()}${named.slice(1)}, ${p}.`
        : `${rejected ? 'Rejected' : 'Not rejected'} at α = ${formatNumber(alpha)}: ${named}, ${p}.`,
  };
  const rejectedBy = rejected ? (['anderson-darling'] as const) : ([] as const);
  return {
    rank,
    family: c.family,
    label: c.label,
    parameters: c.parameters,
    estimatedParameters: c.estimatedParameters,
    logLikelihood: c.logLikelihood,
    aic: c.aic,
    aicc: c.aicc,
    bic: c.bic,
    deltaAicc,
    fit: { method: c.method, iterations: c.iterations ?? 0, converged: c.converged },
    chiSquare: { computable: false, reason: CHI_SQUARE_NOT_APPLICABLE },
    andersonDarling: ad,
    rejectedBy: [...rejectedBy],
    verdict: verdict(rank, deltaAicc, rejectedBy, alpha, false),
    bLives: c.bLives.map((b) => ({ percent: b.percent, estimate: b.estimate, lower: b.lower, upper: b.upper, confidence: b.confidence, boundsFound: b.boundsFound })),
    bLifeMethod: `${BOUND_TEXT[ctx.boundMethod]}, two-sided ${formatNumber(100 * ctx.confidence)} %`,
    reliability: c.reliability.map((r) => ({ time: r.time, estimate: r.estimate, lower: r.lower, upper: r.upper, confidence: r.confidence, boundsFound: r.boundsFound })),
    meanLife: c.meanLife,
    ...(c.warnings.length > 0 ? { warnings: [...c.warnings] } : {}),
  };
}

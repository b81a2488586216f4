/**
 * analyzeRecordedLife: life data as recorded — exact, left-, interval- and right-censored units
 * with counts (or today's time + status), optionally a failure-mode column and an assumed Weibull
 * shape — as one report: every life family fitted (maximum likelihood by default, rank regression
 * on request), a two-subpopulation Weibull mixture as a candidate, ranked; B-lives and reliability
 * with likelihood-ratio bounds; the Turnbull estimate for the plot; Weibayes when a shape is
 * assumed; the modes and the system when a mode column is given; cautions and the method behind
 * each number.
 */
import { InputError } from '../errors.js';
import { getFamily } from '../families/index.js';
import { informationCriteria } from '../rank.js';
import { bLife, reliabilityAt, type BLife, type BoundMethod, type LikelihoodSource, type ReliabilityAt } from './bounds.js';
import { analyzeIntervalModes, analyzeModes, type CompetingModesReport } from './competing-modes.js';
import { lifeCurves, logGrid, type LifeCurves } from './curves.js';
import { buildLifeData, type LifeData, type LifeInput } from './data.js';
import { intervalInputFromTimes, prepareIntervalLifeData, type IntervalLifeData, type IntervalLifeInput } from './interval-likelihood-data.js';
import { intervalLogLikelihoodOf } from './interval-likelihood.js';
import { fitInterval } from './interval-likelihood-fit.js';
import { fitWeibullMixture, mixtureDistribution } from './mixture.js';
import { mixtureBLife } from './mixture-bounds.js';
import { LIFE_FAMILIES, lifeModel, type LifeFamilyName } from './models.js';
import { fitRankRegression, RANK_REGRESSION_REASON } from './rank-regression.js';
import { turnbull, type TurnbullEstimate } from './turnbull.js';
import { weibayes, type WeibayesResult } from './weibayes.js';
import { weibayesInterval } from './weibayes-interval.js';
import { intervalGofBootstrap, type IntervalGofHook, type IntervalGofResult } from './interval-bootstrap.js';
import { INTERVAL_GOF_DEFAULT_STATISTIC, INTERVAL_GOF_METHOD, INTERVAL_GOF_SIZE } from './interval-gof-design.js';
import { inspectionSchemeKind, inspectionSchemeText } from './interval-inspection-scheme.js';

/** Default replicates of the inspection-scheme bootstrap: α(B + 1) whole at α = 0.05 and 0.01 (Monte Carlo SE of p near 0.05: 0.015). */
export const INTERVAL_GOF_REPLICATES = 199;

export type LifeEstimation = 'ml' | 'rank-regression';

export interface RecordedLifeInput {
  /** Interval rows (start, end, counts); or give `times` + `failed`. */
  readonly interval?: IntervalLifeInput;
  readonly times?: LifeInput['times'];
  readonly failed?: LifeInput['failed'];
  /** Failure mode per unit (times + failed) or per row (interval rows; blank for a suspension). */
  readonly modes?: readonly (string | null)[];
}

export interface RecordedLifeOptions {
  readonly families?: readonly LifeFamilyName[];
  readonly bLifePercents?: readonly number[];
  readonly reliabilityTimes?: readonly number[];
  readonly confidence?: number;
  readonly boundMethod?: BoundMethod;
  readonly estimation?: LifeEstimation;
  readonly assumedShape?: number;
  /**
   * Replicates of the inspection-scheme Anderson–Darling bootstrap (interval-bootstrap.ts), run when
   * the data hold left- or interval-censored rows (default INTERVAL_GOF_REPLICATES; 0 = off). Exact
   * failures with suspensions only are tested by the dataset's life section (bootstrap.ts) instead.
   */
  readonly replicates?: number;
  readonly seed?: number;
  /** Significance level of the A² decision (default 0.05). */
  readonly alpha?: number;
  /** Try the two-subpopulation Weibull mixture (default true; needs exact failures and ≥ 10 of them). */
  readonly mixture?: boolean;
  readonly curvePoints?: number;
  /** Where the inspection-scheme bootstrap runs (default: here, in one piece; core/workflow/pipeline.ts runs it as jobs). */
  readonly goodnessOfFit?: IntervalGofHook;
}

export interface RecordedLifeCandidate {
  readonly rank: number;
  readonly family: LifeFamilyName | 'weibull-mixture';
  readonly label: string;
  /** The estimator behind every number of this candidate. */
  readonly estimation: LifeEstimation;
  readonly parameters: Readonly<Record<string, number>>;
  readonly estimatedParameters: number;
  /** Maximum of the log-likelihood (ML), or its value at the rank-regression parameters. */
  readonly logLikelihood: number;
  readonly aic: number;
  readonly aicc: number;
  readonly bic: number;
  readonly deltaAicc: number;
  /** Rank regression: correlation of the points on the family's paper. */
  readonly correlation: number | null;
  readonly converged: boolean;
  readonly method: string;
  readonly bLives: readonly BLife[];
  readonly reliability: readonly ReliabilityAt[];
  readonly meanLife: number;
  readonly curves: LifeCurves;
  /** Mixture only: whether the two subpopulations are identified, and why not. */
  readonly identified: boolean | null;
  /**
   * Anderson–Darling on the Turnbull estimate with its inspection-scheme bootstrap p-value (interval
   * rows, maximum likelihood only); null when not run (see `goodnessOfFitNote` of the report).
   */
  readonly goodnessOfFit: IntervalGofResult | null;
  /** p ≤ α of the bootstrap (Monte Carlo exact size when α(B + 1) is whole); null when not run. */
  readonly rejected: boolean | null;
  readonly flags: readonly string[];
  readonly warnings: readonly string[];
}

export interface RecordedLifeReport {
  readonly n: number;
  readonly exact: number;
  readonly left: number;
  readonly interval: number;
  readonly right: number;
  readonly failures: number;
  readonly confidence: number;
  readonly boundMethod: BoundMethod;
  readonly estimation: LifeEstimation;
  /** α of the goodness-of-fit decisions. */
  readonly alpha: number;
  /** Why the candidates carry no goodness-of-fit test, when they do not; null when they do. */
  readonly goodnessOfFitNote: string | null;
  /** How the candidates are ordered. */
  readonly rankedBy: string;
  readonly candidates: readonly RecordedLifeCandidate[];
  readonly notFitted: readonly { readonly family: string; readonly reason: string }[];
  readonly turnbull: TurnbullEstimate;
  readonly weibayes: WeibayesResult | null;
  readonly modes: CompetingModesReport | null;
  readonly warnings: readonly string[];
  readonly cautions: readonly string[];
  readonly methods: readonly { readonly topic: string; readonly text: string; readonly source: string }[];
}

export const SAFETY_CAUTION =
  'Where a life estimate supports a maintenance interval or a safety decision, use the lower bound, follow the governing codes and standards, and have the analysis reviewed under licensed practice.';

const fmt = (x: number) => (Number.isFinite(x) ? String(Number(x.toPrecision(4))) : String(x));

/** Exact failures and suspensions as unit-level right-censored data (counts expanded). */
export function rightCensoredOf(d: IntervalLifeData): LifeData | null {
  if (d.left > 0 || d.interval > 0) return null;
  const times = new Float64Array(d.n);
  const failed = new Uint8Array(d.n);
  let k = 0;
  for (let i = 0; i < d.lower.length; i++) {
    for (let c = 0; c < (d.counts[i] as number); c++) {
      times[k] = d.lower[i] as number;
      failed[k++] = d.kinds[i] === 'exact' ? 1 : 0;
    }
  }
  return buildLifeData(times, failed);
}

/**
 * Too few failures for any model and a shape given from experience: only Weibayes answers. Said as
 * the page says it (core/workflow answer and section read the same list): nothing is estimated from
 * the shape, the shape is assumed, the bound is a bound, and safety practice.
 */
export function weibayesOnlyCaution(w: WeibayesResult, n: number): string {
  const r = w.failures;
  const pct = `one-sided ${fmt(100 * w.confidence)} %`;
  const what =
    r === 0
      ? `the numbers below are lower bounds (${pct}) on the scale and the B-lives, not estimates of them: with no failure there is no estimate`
      : `the scale estimate rests on ${r === 1 ? 'one failure' : `${r} failures`} and the assumed shape; rely on its lower bound (${pct}), which is a bound, not an estimate`;
  return `Only ${r} failure${r === 1 ? '' : 's'} among ${n} units: no model can be fitted and no shape is estimated; the Weibull shape β = ${w.shape} is assumed, so ${what}, and every number holds only if β is right (Weibayes; Nelson 1985). Where it supports a maintenance interval or a safety decision, the bound does not cover a wrong β: check β against earlier failures of the same design.`;
}

/** With a Weibull fitted by maximum likelihood too: Weibayes named as the alternative it is, the two shapes and B-lives side by side. */
export function weibayesBesideMl(w: WeibayesResult, ml: Pick<RecordedLifeCandidate, 'parameters' | 'bLives'>): string {
  const b = w.bLives[0];
  const mb = b ? ml.bLives.find((x) => x.percent === b.percent) : undefined;
  const lives = b && mb && b.estimate !== null ? `; B${fmt(b.percent)}: ${fmt(b.estimate)} with β assumed, ${fmt(mb.estimate)} by maximum likelihood` : '';
  return `Weibayes is an alternative beside maximum likelihood, not an estimate of the shape: it assumes β = ${w.shape}, while maximum likelihood estimates β̂ = ${fmt(ml.parameters.shape as number)} from these ${w.failures} failures${lives}. A β far from β̂ is not supported by these data.`;
}

function noBounds(estimate: number, confidence: number): { lower: number; upper: number; confidence: number; method: string; boundsFound: false; estimate: number } {
  return { estimate, lower: Number.NaN, upper: Number.NaN, confidence, method: 'no bounds: rank-regression estimate (point value only)', boundsFound: false };
}

function ranked<T extends { aicc: number; estimatedParameters: number; family: string; correlation: number | null }>(xs: T[], by: LifeEstimation): (T & { rank: number; deltaAicc: number })[] {
  const sorted = [...xs].sort((a, b) =>
    by === 'rank-regression'
      ? (b.correlation ?? -1) - (a.correlation ?? -1) || a.family.localeCompare(b.family)
      : a.aicc - b.aicc || a.estimatedParameters - b.estimatedParameters || a.family.localeCompare(b.family),
  );
  const best = Math.min(...xs.map((x) => x.aicc));
  return sorted.map((c, i) => ({ ...c, rank: i + 1, deltaAicc: c.aicc - best }));
}

export function analyzeRecordedLife(input: RecordedLifeInput, options: RecordedLifeOptions = {}): RecordedLifeReport {
  let rows: IntervalLifeInput;
  if (input.interval) rows = input.interval;
  else if (input.times && input.failed) {
    if (input.times.length !== input.failed.length) throw new InputError(`The status column has ${input.failed.length} entries but there are ${input.times.length} times.`, {}, 'bad-input');
    for (let i = 0; i < input.times.length; i++) {
      const t = input.times[i] as number;
      const f = input.failed[i] as number;
      if (!(t > 0) || !Number.isFinite(t)) throw new InputError(`Unit #${i + 1}: time ${String(t)} must be a finite number > 0 for life data.`, { value: String(t) }, 'bad-input');
      if (f !== 0 && f !== 1) throw new InputError(`Unit #${i + 1}: status ${String(f)} must be 1 (failed) or 0 (suspended).`, { value: String(f) }, 'bad-input');
    }
    rows = intervalInputFromTimes({ times: input.times, failed: input.failed });
  } else throw new InputError('Give either interval rows (start, end) or times with a status column.', {}, 'bad-input');
  const data = prepareIntervalLifeData(rows);
  const confidence = options.confidence ?? 0.9;
  if (!(confidence > 0 && confidence < 1)) throw new InputError(`confidence must be in (0, 1), got ${confidence}`, {}, 'bad-option');
  const boundMethod = options.boundMethod ?? 'likelihood-ratio';
  const estimation = options.estimation ?? 'ml';
  const percents = options.bLifePercents ?? [10];
  const relTimes = options.reliabilityTimes ?? [];
  const families = options.families ?? LIFE_FAMILIES;
  const alpha = options.alpha ?? 0.05;
  const gofReplicates = data.left + data.interval > 0 && estimation === 'ml' ? (options.replicates ?? INTERVAL_GOF_REPLICATES) : 0;
  const gofSeed = (name: string) => (options.seed ?? 20261201) + 7919 * LIFE_FAMILIES.indexOf(name as LifeFamilyName);
  const gofNote =
    gofReplicates > 0
      ? null
      : data.left + data.interval === 0
        ? 'exact failures and suspensions only: the goodness-of-fit test of these data is the censored Anderson–Darling bootstrap of the life section'
        : estimation !== 'ml'
          ? 'no goodness-of-fit test for rank-regression estimates'
          : 'goodness-of-fit test not asked for (replicates = 0)';
  const warnings: string[] = [];
  const cautions: string[] = [];
  const notFitted: { family: string; reason: string }[] = [];
  const rc = rightCensoredOf(data);
  const grid = logGrid(data.minTime / 2, data.maxTime * 1.5, Math.max(2, options.curvePoints ?? 60));
  const source: LikelihoodSource = { logLikelihoodOf: (f) => intervalLogLikelihoodOf(f, data) };
  const lastEvidence = data.maxTime;
  type Raw = Omit<RecordedLifeCandidate, 'rank' | 'deltaAicc'>;
  const raw: Raw[] = [];
  const ic = (ll: number, k: number) => {
    const c = informationCriteria(ll, k, data.n);
    return { aic: c.aic, aicc: data.n - k - 1 > 0 ? c.aicc : Number.POSITIVE_INFINITY, bic: c.bic };
  };
  if (estimation === 'rank-regression' && !rc) {
    throw new InputError('Rank regression needs exact failure times; these data hold left- or interval-censored rows, so use maximum likelihood (--estimation ml).', {}, 'bad-option');
  }
  for (const name of families) {
    const fam = getFamily(name);
    const k = lifeModel(name).names.length;
    const w: string[] = [];
    if (estimation === 'rank-regression') {
      const f = fitRankRegression(name, rc as LifeData);
      if (!f.ok) {
        notFitted.push({ family: name, reason: f.reason });
        continue;
      }
      const dist = fam.make(f.parameters);
      raw.push({
        family: name,
        label: fam.label,
        estimation,
        parameters: f.parameters,
        estimatedParameters: k,
        logLikelihood: f.logLikelihood,
        ...ic(f.logLikelihood, k),
        correlation: f.correlation,
        converged: true,
        method: f.method,
        bLives: percents.map((percent) => ({ percent, ...noBounds(dist.quantile(percent / 100), confidence) })),
        reliability: relTimes.map((time) => ({ time, ...noBounds(dist.sf(time), confidence) })),
        meanLife: dist.mean(),
        curves: lifeCurves(dist, grid),
        identified: null,
        goodnessOfFit: null,
        rejected: null,
        flags: [],
        warnings: w,
      });
      continue;
    }
    const f = fitInterval(name, data);
    if (!f.ok) {
      notFitted.push({ family: name, reason: f.reason });
      continue;
    }
    const dist = fam.make(f.parameters);
    const bLives = percents.map((p) => {
      const b = bLife(f, source, p, confidence, boundMethod);
      if (!b.boundsFound) w.push(`B${fmt(p)}: a bound could not be closed; the reported end is the range limit.`);
      if (b.estimate > lastEvidence) w.push(`B${fmt(p)} = ${fmt(b.estimate)} lies beyond the last time in the data (${fmt(lastEvidence)}): it is extrapolated by the ${fam.label} model.`);
      if (name === 'normal' && b.estimate <= 0) w.push(`B${fmt(p)} under the normal model is ≤ 0, impossible for a life: the normal model does not suit these data at this percent.`);
      else if (name === 'normal' && b.lower <= 0) w.push(`The lower bound of B${fmt(p)} under the normal model is ≤ 0, impossible for a life: the normal model puts probability on negative lives here.`);
      return b;
    });
    const gofHook: IntervalGofHook = options.goodnessOfFit ?? ((fam, params, d, replicates, seed) => intervalGofBootstrap(fam, params, d, { replicates, seed }));
    const gof = gofReplicates > 0 ? gofHook(name, f.parameters, data, gofReplicates, gofSeed(name)) : null;
    // Only a size-calibrated p-value decides (INTERVAL_GOF_SIZE); otherwise no verdict either way.
    const rejected = gof && gof.sizeCalibrated ? gof.pValue <= alpha : null;
    if (gof && gof.failedReplicates > 0) w.push(`${gof.failedReplicates} of ${gof.replicates} bootstrap replicates could not be refitted and count as exceeding the observed statistic (conservative).`);
    raw.push({
      family: name,
      label: fam.label,
      estimation,
      parameters: f.parameters,
      estimatedParameters: k,
      logLikelihood: f.logLikelihood,
      ...ic(f.logLikelihood, k),
      goodnessOfFit: gof,
      rejected,
      correlation: null,
      converged: f.converged,
      method: f.method,
      bLives,
      reliability: relTimes.map((t) => reliabilityAt(f, source, t, confidence, boundMethod)),
      meanLife: dist.mean(),
      curves: lifeCurves(dist, grid),
      identified: null,
      flags: [],
      warnings: w,
    });
  }
  if (estimation === 'ml' && (options.mixture ?? true)) {
    if (!rc) notFitted.push({ family: 'weibull-mixture', reason: 'the mixture is fitted only to exact failures and suspensions, not to interval rows' });
    else {
      const m = fitWeibullMixture(rc);
      if (!m.ok) notFitted.push({ family: 'weibull-mixture', reason: m.reason });
      else {
        const md = mixtureDistribution(m.parameters);
        const p = m.parameters;
        raw.push({
          family: 'weibull-mixture',
          label: 'Weibull mixture (two subpopulations)',
          estimation,
          parameters: p as unknown as Record<string, number>,
          estimatedParameters: 5,
          logLikelihood: m.logLikelihood,
          ...ic(m.logLikelihood, 5),
          correlation: null,
          converged: m.converged,
          method: m.method,
          bLives: percents.map((percent) => mixtureBLife(m, rc, percent, confidence)),
          reliability: relTimes.map((time) => ({ time, estimate: md.sf(time), lower: Number.NaN, upper: Number.NaN, confidence, method: 'no bounds for the mixture (point value only)', boundsFound: false })),
          meanLife: md.mean(),
          curves: lifeCurves(md, grid),
          identified: m.identified,
          goodnessOfFit: null,
          rejected: null,
          flags: m.flags,
          warnings: m.identified ? [] : [`The two subpopulations are not identified by these data (${m.flags.join('; ')}): do not use the mixture's numbers.`],
        });
      }
    }
  }
  const candidates = ranked(raw, estimation);
  const tested = candidates.filter((c) => c.rejected !== null);
  for (const c of tested) {
    if (c.rejected) warnings.push(`${c.label}: rejected at α = ${fmt(alpha)} by the inspection-scheme bootstrap of the ${c.goodnessOfFit!.testLabel} (${fmt(c.goodnessOfFit!.statistic)}, p = ${fmt(c.goodnessOfFit!.pValue)}): its B-lives describe a model these data contradict.`);
  }
  const uncalibrated = candidates.find((c) => c.goodnessOfFit && !c.goodnessOfFit.sizeCalibrated);
  if (uncalibrated) warnings.push(`The inspection-scheme test (${uncalibrated.goodnessOfFit!.testLabel}) is ${uncalibrated.goodnessOfFit!.sizeNote}; no model is rejected or supported by it here.`);
  if (tested.length > 0 && tested.every((c) => c.rejected)) warnings.push(`Every tested model is rejected at α = ${fmt(alpha)}: none describes these data well; the ranking only says which is least bad.`);
  const np = turnbull(data);
  let wb: WeibayesResult | null = null;
  if (options.assumedShape !== undefined) {
    // Exact failures and suspensions: the exact χ² form; with inspection intervals: ML given β and a likelihood-ratio bound.
    const wo = { shape: options.assumedShape, confidence, bLifePercents: percents, reliabilityTimes: relTimes };
    wb = rc ? weibayes(rc, wo) : weibayesInterval(data, wo);
    cautions.push(wb.statement);
    const ml = candidates.find((c) => c.family === 'weibull' && c.estimation === 'ml');
    if (ml) cautions.push(weibayesBesideMl(wb, ml));
  }
  let modes: CompetingModesReport | null = null;
  if (input.modes) {
    const mo = { families, bLifePercents: percents, reliabilityTimes: relTimes, confidence, boundMethod };
    modes = input.interval ? analyzeIntervalModes({ interval: input.interval, modes: input.modes }, mo) : analyzeModes({ times: input.times!, failed: input.failed!, modes: input.modes }, mo);
    cautions.push(...modes.cautions.filter((c) => !c.startsWith('Where')));
  }
  if (wb && !candidates.some((c) => c.family !== 'weibull-mixture')) cautions.push(weibayesOnlyCaution(wb, data.n));
  else if (data.failures < 10) {
    cautions.push(`Only ${data.failures} unit${data.failures === 1 ? '' : 's'} with failure information among ${data.n}: estimates, especially a shape, are uncertain, the bounds rest on large-sample approximations, and the ranking of models is weak (fewer than 10; common practice, no source).`);
  }
  if (data.left + data.interval > 0) {
    cautions.push(`${data.left + data.interval} of ${data.n} failures are known only to an inspection interval: the data say nothing about where in each interval they failed, so the model's shape inside the first interval (and any B-life below the first inspection) rests on the model, not on the data.`);
  }
  if (estimation === 'rank-regression') warnings.push(RANK_REGRESSION_REASON);
  cautions.push(
    'Bounds and B-lives assume that the fitted model is right and that the units represent the population (same design, manufacture and use); they do not include the uncertainty of choosing the model. Compare the B-lives under every candidate that fits.',
    SAFETY_CAUTION,
  );
  const methods = [
    { topic: 'likelihood', text: 'exact ln f(t); left-censored ln F(R); interval ln(F(R) − F(L)); right-censored ln S(L); each times its count', source: 'Meeker & Escobar 1998, Statistical Methods for Reliability Data, §2.4; Lawless 2003, §2.2' },
    {
      topic: 'estimation',
      text: estimation === 'ml' ? 'maximum likelihood (the default) for every candidate' : `rank regression for every candidate: ${RANK_REGRESSION_REASON}`,
      source: estimation === 'ml' ? 'Meeker & Escobar 1998, ch. 8' : 'Benard & Bos-Levenbach 1953; Johnson 1964 [from memory]',
    },
    {
      topic: 'ranking',
      text: estimation === 'ml' ? 'AICc with n = all units' : 'correlation coefficient on each family’s paper (largest first); AICc is shown from the likelihood at the regression parameters',
      source: 'Hurvich & Tsai 1989; correlation ranking is common practice, no source',
    },
    {
      topic: 'bounds',
      text:
        estimation === 'ml'
          ? `${boundMethod === 'likelihood-ratio' ? 'likelihood-ratio (profile likelihood)' : 'Fisher-matrix'} bounds, two-sided ${fmt(100 * confidence)} %, on the full likelihood above; the mixture's B-lives by the Fisher matrix (delta method on ln t_p) when its components are identified, its reliabilities point values`
          : 'no bounds: rank regression gives point values only',
      source: 'Meeker & Escobar 1998, §8.3–8.4',
    },
    { topic: 'nonparametric', text: np.method, source: np.source },
    ...(gofReplicates > 0
      ? [{ topic: 'goodness of fit', text: `${INTERVAL_GOF_METHOD[INTERVAL_GOF_DEFAULT_STATISTIC]}; inspection scheme of these rows: ${inspectionSchemeText(data)}; ${INTERVAL_GOF_SIZE[inspectionSchemeKind(data)].text}; ${gofReplicates} replicates, seed ${options.seed ?? 20261201} + 7919 × the family's index; reject at p ≤ ${fmt(alpha)}`, source: 'Turnbull 1976; Ren 2003, Scand. J. Statist. 30:211-226 [from memory]; Davison & Hinkley 1997 §4.2.5 [from memory]; size: test/fixtures/life-interval-size.json, life-interval-lr-size.json, life-interval-stated-size.json' }]
      : []),
  ];
  return {
    n: data.n,
    exact: data.exact,
    left: data.left,
    interval: data.interval,
    right: data.right,
    failures: data.failures,
    confidence,
    boundMethod,
    estimation,
    alpha,
    goodnessOfFitNote: gofNote,
    rankedBy: estimation === 'ml' ? 'AICc (smallest first)' : 'correlation coefficient (largest first)',
    candidates,
    notFitted,
    turnbull: np,
    weibayes: wb,
    modes,
    warnings,
    cautions,
    methods,
  };
}

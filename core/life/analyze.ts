/**
 * analyzeLife: fit every candidate family to right-censored life data, rank by AICc, and report
 * the decision numbers (B-lives, reliability at chosen times, mean life) with bounds, curve data,
 * probability-plot positions, the bootstrap goodness of fit, and the cautions that go with them.
 */
import { getFamily } from '../families/index.js';
import { informationCriteria, rankCandidates } from '../rank.js';
import { censoredGofBootstrap, CENSORED_AD_METHOD } from './bootstrap.js';
import { bLife, parameterInterval, reliabilityAt, type BoundMethod } from './bounds.js';
import { lifeCurves, logGrid } from './curves.js';
import { prepareLifeData, type LifeInput } from './data.js';
import { fitCensored, type CensoredFitSuccess } from './fit.js';
import { LIFE_FAMILIES, lifeModel } from './models.js';
import { plotPositions } from './positions.js';
import type { LifeCandidate, LifeMethodNote, LifeNotFitted, LifeOptions, LifeReport } from './types.js';

/** Fewer failures than this draw the small-sample caution (common practice, no source). */
export const FEW_FAILURES = 10;

export const CHI_SQUARE_NOT_APPLICABLE =
  'The equiprobable chi-square test is not reported: it needs every observation in a known class, and a suspension is known only to lie beyond its run time, so censored samples cannot be binned that way. Goodness of fit is judged by the censored Anderson–Darling statistic with a bootstrap p-value instead.';

function fmt(x: number): string {
  return Number.isFinite(x) ? String(Number(x.toPrecision(4))) : String(x);
}

export function analyzeLife(input: LifeInput, options: LifeOptions = {}): LifeReport {
  const data = prepareLifeData(input);
  const confidence = options.confidence ?? 0.9;
  if (!(confidence > 0 && confidence < 1)) throw new RangeError(`confidence must be in (0, 1), got ${confidence}`);
  const boundMethod: BoundMethod = options.boundMethod ?? 'likelihood-ratio';
  const percents = options.bLifePercents ?? [10];
  const relTimes = options.reliabilityTimes ?? [];
  const B = options.bootstrapReplicates ?? 999;
  const families = options.families ?? LIFE_FAMILIES;
  const warnings: string[] = [];
  const cautions: string[] = [];
  const notFitted: LifeNotFitted[] = [];
  const fits: CensoredFitSuccess[] = [];
  for (const name of families) {
    const f = fitCensored(name, data);
    if (f.ok) fits.push(f);
    else notFitted.push({ family: name, reason: f.reason });
  }
  const lastFailure = data.failures > 0 ? (data.failureTimes[data.failures - 1] as number) : Number.NaN;
  const grid = logGrid(data.minTime / 2, data.maxTime * 1.5, Math.max(2, options.curvePoints ?? 60));
  const raw = fits.map((fit) => {
    const fam = getFamily(fit.family);
    const model = lifeModel(fit.family);
    const k = model.names.length;
    const dist = fam.make(fit.parameters);
    const ic = informationCriteria(fit.logLikelihood, k, data.n);
    const w: string[] = [];
    if (!fit.converged) w.push(`The ${fam.label} fit did not converge to the requested tolerance (${fit.method}); treat its numbers as approximate.`);
    if (!(data.n - k - 1 > 0)) w.push(`AICc is undefined with n = ${data.n} units and ${k} parameters.`);
    const bLives = percents.map((pct) => {
      const b = bLife(fit, data, pct, confidence, boundMethod);
      if (!b.boundsFound) w.push(`B${fmt(pct)}: a bound could not be closed; the reported end is the range limit.`);
      if (b.estimate > lastFailure) w.push(`B${fmt(pct)} = ${fmt(b.estimate)} lies beyond the last observed failure (${fmt(lastFailure)}): it is extrapolated by the ${fam.label} model.`);
      if (fit.family === 'normal' && b.estimate <= 0) w.push(`B${fmt(pct)} under the normal model is ≤ 0, which is impossible for a life: the normal model does not suit these data at this percent.`);
      return b;
    });
    const reliability = relTimes.map((t) => reliabilityAt(fit, data, t, confidence, boundMethod));
    const shapeInterval = fit.family === 'weibull' ? parameterInterval(fit, data, 'shape', confidence) : null;
    const gofSeed = (options.seed ?? 20261201) + 7919 * LIFE_FAMILIES.indexOf(fit.family);
    const goodnessOfFit = B > 0 ? (options.goodnessOfFit ? options.goodnessOfFit(fit, data, B, gofSeed) : censoredGofBootstrap(fit, data, { replicates: B, seed: gofSeed })) : null;
    if (goodnessOfFit && goodnessOfFit.failedReplicates > 0) {
      w.push(`${goodnessOfFit.failedReplicates} of ${B} bootstrap replicates could not be refitted; they are counted as exceeding the observed statistic (conservative), so the p-value is if anything too large.`);
    }
    return {
      family: fit.family,
      label: fam.label,
      parameters: fit.parameters,
      estimatedParameters: k,
      logLikelihood: fit.logLikelihood,
      aic: ic.aic,
      aicc: data.n - k - 1 > 0 ? ic.aicc : Number.POSITIVE_INFINITY,
      bic: ic.bic,
      converged: fit.converged,
      iterations: fit.iterations,
      method: fit.method,
      bLives,
      reliability,
      meanLife: dist.mean(),
      shapeInterval,
      curves: lifeCurves(dist, grid),
      goodnessOfFit,
      warnings: w,
    };
  });
  const candidates = rankCandidates(raw) as LifeCandidate[];
  if (data.failures < FEW_FAILURES) {
    cautions.push(
      `Only ${data.failures} failure${data.failures === 1 ? '' : 's'} among ${data.n} units: estimates, especially a shape parameter, are uncertain, the bounds rest on large-sample approximations, and the ranking of models is weak (fewer than ${FEW_FAILURES} failures; common practice, no source).`,
    );
  }
  const wb = candidates.find((c) => c.family === 'weibull');
  if (wb?.shapeInterval) {
    const s = wb.shapeInterval;
    if (s.lower < 1 && s.upper > 1) {
      cautions.push(`The Weibull shape interval (${fmt(s.lower)} to ${fmt(s.upper)}, ${fmt(100 * confidence)} %) contains 1: the data cannot tell a rising failure rate from a falling one.`);
    } else if (s.upper / s.lower > 2) {
      cautions.push(`The Weibull shape interval (${fmt(s.lower)} to ${fmt(s.upper)}, ${fmt(100 * confidence)} %) is wide: the shape, and with it every extrapolated B-life, is poorly determined.`);
    }
  }
  if (data.suspensions > data.failures) {
    warnings.push(`${data.suspensions} of ${data.n} units are suspensions: the upper tail is extrapolated beyond the last failure at ${fmt(lastFailure)}.`);
  }
  cautions.push(
    'Bounds and B-lives assume that the fitted model is right and that the units are representative of the population (same design, manufacture and use); they do not include the uncertainty of choosing the model. Compare the B-lives under every candidate that fits.',
  );
  cautions.push(
    'Where a life estimate supports a safety decision, use the lower bound, follow the governing codes and standards, and have the analysis reviewed under licensed practice.',
  );
  const methods: LifeMethodNote[] = [
    { topic: 'likelihood', text: 'Maximum likelihood with censored terms: Σ ln f over failures + Σ ln S over suspensions; n counts all units.', source: 'Lawless 2003, Statistical Models and Methods for Lifetime Data, 2nd ed., §2.2' },
    { topic: 'ranking', text: 'Ranked by AICc with n = all units (failures and suspensions).', source: 'Hurvich & Tsai 1989; n = all units is common practice, no source' },
    {
      topic: 'bounds',
      text:
        boundMethod === 'likelihood-ratio'
          ? `Likelihood-ratio (profile likelihood) bounds, two-sided ${fmt(100 * confidence)} %: the quantity replaces one parameter and its profile deviance is set to the χ²₁ quantile.`
          : `Fisher-matrix bounds, two-sided ${fmt(100 * confidence)} %: observed information, delta method on ln x_p and on ln(-ln R).`,
      source: 'Meeker & Escobar 1998, Statistical Methods for Reliability Data, §8.3–8.4; Lawless 2003, §B.2–B.4',
    },
    { topic: 'goodness of fit', text: CENSORED_AD_METHOD, source: 'Koziol & Green 1976, Biometrika 63:465-474 (Cramér–von Mises form) [from memory]; bootstrap: Stute, González Manteiga & Presedo Quindimil 1993 [memory]' },
    { topic: 'chi-square', text: CHI_SQUARE_NOT_APPLICABLE, source: 'common practice, no source' },
  ];
  const plot = plotPositions(data, options.plotPositions ?? 'johnson-benard', confidence);
  methods.splice(3, 0, {
    topic: 'plot positions',
    text: plot.description,
    source:
      plot.method === 'kaplan-meier'
        ? 'Kaplan & Meier 1958, JASA 53:457-481; Greenwood 1926 [from memory]'
        : 'Johnson 1964, The Statistical Treatment of Fatigue Experiments; Benard & Bos-Levenbach 1953 [from memory]',
  });
  return {
    n: data.n,
    failures: data.failures,
    suspensions: data.suspensions,
    confidence,
    boundMethod,
    candidates,
    notFitted,
    plot,
    chiSquare: { applies: false, reason: CHI_SQUARE_NOT_APPLICABLE },
    warnings,
    cautions,
    methods,
  };
}

/**
 * Life data as recorded at inspections (interval rows: start, end, count) as a dataset report, so
 * the API and the page get what the CLI's --interval-columns gives: core/life analyzeRecordedLife
 * (every life family by maximum likelihood on exact, left-, interval- and right-censored units;
 * B-lives and reliability with likelihood-ratio or Fisher bounds; the Turnbull estimate; the
 * inspection-scheme Anderson–Darling bootstrap) laid out in the frame of the status-column report
 * (life.ts): the fits are the ranked candidates (chi-square not computable, A² by the bootstrap),
 * the life section carries no failure points (a unit's failure time is known only to its interval)
 * and the recorded-life extras (`life.recorded`: the Turnbull boxes and the goodness-of-fit table).
 * The bootstrap runs in process by default, or as one job per family on the worker pool (core/workflow/pipeline.ts).
 */
import { PLUMBLINE_VERSION, resolveOptions } from '../analyze.js';
import { InputError } from '../errors.js';
import {
  analyzeRecordedLife,
  CHI_SQUARE_NOT_APPLICABLE,
  INTERVAL_GOF_REPLICATES,
  LIFE_FAMILIES,
  planTest,
  prepareIntervalLifeData,
  type IntervalGofHook,
  type IntervalLifeInput,
  type LifeFamilyName,
} from '../life/index.js';
import { RANKING_RULE } from '../rank.js';
import type { MethodNote, NotApplicableReport } from '../report.js';
import { prepareSample } from '../sample.js';
import { lifeCandidate } from './life.js';
import type { WorkflowSettings } from './options.js';
import { quantityNumber, sensitivityRows } from './sensitivity.js';
import type { DatasetCandidate, DatasetOptions, DatasetReport, LifeSection } from './types.js';

export const NO_POINTS_WITH_INTERVALS =
  'none: with interval rows a unit’s failure time is known only to its inspection interval, so no failure is drawn as a point; the nonparametric estimate is drawn as Turnbull boxes (recorded-life section), which reduce to Kaplan–Meier steps for exact times';

/** `goodnessOfFit`: where the inspection-scheme bootstrap runs (default in-process; core/workflow/pipeline.ts runs it as jobs). */
export function intervalLifeReport(rows: IntervalLifeInput, options: DatasetOptions, settings: WorkflowSettings, goodnessOfFit?: IntervalGofHook): DatasetReport {
  if (settings.returnPeriods !== null) throw new InputError('Return periods need a complete sample of annual maxima, not interval rows of life data.', {}, 'bad-option');
  if (settings.capability) throw new InputError('Capability needs a complete sample of measurements, not interval rows of life data.', {}, 'bad-option');
  const families = (options.families ?? LIFE_FAMILIES) as readonly string[];
  for (const f of families) {
    if (!(LIFE_FAMILIES as readonly string[]).includes(f)) {
      throw new InputError(`Family "${f}" is not offered for life data; use ${LIFE_FAMILIES.join(', ')}.`, { value: f }, 'bad-option');
    }
  }
  if (options.estimation === 'lmoments' || options.estimation === 'ema') throw new InputError(`estimation ${options.estimation} is for the flood section; life data take ml or rank-regression.`, {}, 'bad-option');
  const replicates = options.bootstrapReplicates ?? INTERVAL_GOF_REPLICATES;
  const opts = resolveOptions({ ...options, families: families as LifeFamilyName[], bootstrapReplicates: replicates, pMethod: 'bootstrap' });
  const bLifePercents = settings.bLifePercents ?? [10];
  const boundMethod = options.boundMethod ?? 'likelihood-ratio';
  const data = prepareIntervalLifeData(rows);
  // Too few failures for a model with a shape assumed: the core's caution says so (weibayesOnlyCaution), as the CLI prints it.
  const rec = analyzeRecordedLife(
    { interval: rows },
    {
      families: families as LifeFamilyName[],
      bLifePercents,
      reliabilityTimes: settings.reliabilityTimes,
      confidence: settings.confidence,
      boundMethod,
      ...(options.estimation === 'rank-regression' ? { estimation: 'rank-regression' as const } : {}),
      ...(options.assumedShape !== undefined ? { assumedShape: options.assumedShape } : {}),
      replicates,
      seed: opts.seed,
      alpha: opts.alpha,
      ...(goodnessOfFit ? { goodnessOfFit } : {}),
    },
  );
  const plan =
    options.planReliability != null && options.planTime != null && options.assumedShape != null
      ? planTest({ reliability: options.planReliability, time: options.planTime, confidence: options.planConfidence ?? 0.9, shape: options.assumedShape, failuresAllowed: options.planFailures ?? 0 })
      : null;
  const single = rec.candidates.filter((c) => c.family !== 'weibull-mixture');
  const ctx = { alpha: opts.alpha, seed: opts.seed, replicates, boundMethod, confidence: settings.confidence };
  const best = single[0]?.aicc ?? 0;
  const candidates: DatasetCandidate[] = single.map((c, i) => lifeCandidate({ ...c, family: c.family as LifeFamilyName }, i + 1, c.aicc - best, ctx));
  const notApplicable: NotApplicableReport[] = rec.notFitted
    .filter((x) => x.family !== 'weibull-mixture')
    .map((x) => ({ family: x.family as LifeFamilyName, reason: x.reason, offendingCount: 0 }));
  const warnings: string[] = [...rec.warnings];
  for (const c of candidates) for (const w of c.warnings ?? []) warnings.push(`${c.label}: ${w}`);
  for (const na of notApplicable) warnings.push(`${na.family}: not applicable. ${na.reason}`);
  const methods: MethodNote[] = [
    ...rec.methods.map((m) => ({ topic: m.topic, description: m.text, source: m.source })),
    { topic: 'summary', description: 'min, max, mean, sd and distinct count are those of the recorded times (the rows’ finite end points > 0), not of the lives, which interval rows do not give', source: 'common practice, no source' },
  ];
  const section: LifeSection = {
    units: rec.n,
    failures: rec.failures,
    suspensions: rec.right,
    confidence: rec.confidence,
    boundMethod: rec.boundMethod,
    bLifePercents: [...bLifePercents],
    reliabilityTimes: [...settings.reliabilityTimes],
    plot: { method: 'kaplan-meier', description: NO_POINTS_WITH_INTERVALS, bandLevel: settings.confidence, points: [], weibull: [], lognormal: [] },
    curves: single.map((c) => ({ family: c.family as LifeFamilyName, ...c.curves })),
    chiSquare: { applies: false, reason: CHI_SQUARE_NOT_APPLICABLE },
    warnings: [...rec.warnings],
    cautions: [...rec.cautions],
    recorded: { report: rec, plan },
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
  ]);
  const ends: number[] = [];
  for (let i = 0; i < data.lower.length; i++) for (const v of [data.lower[i] as number, data.upper[i] as number]) if (v > 0 && Number.isFinite(v)) ends.push(v);
  const s = prepareSample(ends);
  return {
    software: { name: 'plumbline', version: PLUMBLINE_VERSION },
    n: rec.n,
    summary: { min: s.min, max: s.max, mean: s.mean, sd: s.n > 1 ? Math.sqrt(s.sumSqDev / (s.n - 1)) : 0, distinct: s.distinct },
    options: { ...opts, families: [...opts.families] },
    rankingRule: `${RANKING_RULE} For interval rows of life data n counts all units.`,
    candidates,
    notApplicable,
    warnings,
    methods,
    dataKind: 'censored',
    life: section,
    sensitivity,
  };
}

/**
 * The recorded-life section (core/life recordedLifeExtras in the life section): every candidate
 * with the estimator behind its numbers, the two-subpopulation mixture ranked beside the single
 * models (flagged when not identified), Weibayes with the shape stated as assumed, the Turnbull
 * boxes, and a test plan when one was asked for. Pure: report → block.
 */
import type { RecordedLifeCandidate, RecordedLifeReport, TestPlan } from '../../../core/index.js';
import { modelLabel } from '../families.js';
import { sig } from '../format.js';
import type { BlockLine, BlockTable, SectionBlock, SectionView } from './block.js';
import { pct, withU } from './numbers.js';

/** A number from the report, or '—' where there is none (no bound for this estimator; JSON null). */
const n = (x: number | null | undefined, d = 4): string => (x === null || x === undefined || Number.isNaN(x) ? '—' : sig(x, d));

const ESTIMATOR = { ml: 'maximum likelihood', 'rank-regression': 'rank regression' } as const;

/** The page's one label per model (client/src/families.ts); the mixture keeps the core's name. */
const labelOf = (c: Pick<RecordedLifeCandidate, 'family' | 'label'>): string => (c.family === 'weibull-mixture' ? c.label : modelLabel(c.family));

function params(c: RecordedLifeCandidate): string {
  return Object.entries(c.parameters)
    .map(([k, v]) => `${k} ${n(v, 4)}`)
    .join(', ');
}

function answerOf(r: RecordedLifeReport, u: string): string | undefined {
  if (r.weibayes) {
    const w = r.weibayes;
    const b = w.bLives[0];
    return `With the Weibull shape ASSUMED at β = ${w.shape}: scale at least ${withU(n(w.scaleLower), u)} (one-sided ${pct(w.confidence)})${b ? `, so B${n(b.percent, 3)} at least ${withU(n(b.lower), u)}` : ''}; ${w.failures} failure${w.failures === 1 ? '' : 's'} in ${w.units} units.`;
  }
  const top = r.candidates[0];
  if (!top) return undefined;
  const mix = r.candidates.find((c) => c.family === 'weibull-mixture');
  if (mix && mix.rank === 1 && mix.identified) return `Two subpopulations fit better than any single model (Weibull mixture ranked first by ${r.rankedBy}); ${n(100 * (mix.parameters.fraction ?? Number.NaN), 3)} % of units belong to the earlier-failing one.`;
  if (mix && mix.rank === 1 && mix.identified === false) {
    // Ranked first but not identified: its numbers are not to be used, so the answer names the best single model.
    const single = r.candidates.find((c) => c.family !== 'weibull-mixture');
    return `The Weibull mixture ranks first by ${r.rankedBy} but its two subpopulations are not identified by these data, so its numbers are not to be used${single ? `; best single model: ${labelOf(single)} (${ESTIMATOR[single.estimation]})` : ''}.`;
  }
  return `Best by ${r.rankedBy}: ${labelOf(top)} (${ESTIMATOR[top.estimation]}).`;
}

export function recordedBlock(r: RecordedLifeReport, plan: TestPlan | null, u: string): SectionBlock {
  const lines: BlockLine[] = [
    {
      kind: 'fact',
      text: `Estimator: ${ESTIMATOR[r.estimation]}${r.estimation === 'ml' ? ' (the default)' : ''}; every number below is by that estimator except where the table says otherwise.`,
    },
  ];
  const tables: BlockTable[] = [];
  if (r.candidates.length > 0) {
    tables.push({
      caption: `Candidates ranked by ${r.rankedBy}, the estimator named on each`,
      head: ['Rank', 'Model', 'Estimator', 'Parameters', 'ln L', 'AICc', r.estimation === 'rank-regression' ? 'r' : 'ΔAICc'],
      rows: r.candidates.map((c) => [
        String(c.rank),
        labelOf(c) + (c.identified === false ? ' — not identified' : ''),
        ESTIMATOR[c.estimation],
        params(c),
        n(c.logLikelihood, 6),
        n(c.aicc, 6),
        r.estimation === 'rank-regression' ? n(c.correlation, 4) : n(c.deltaAicc, 3),
      ]),
    });
    const tested = r.candidates.filter((c) => c.goodnessOfFit);
    if (tested.length > 0) {
      tables.push({
        caption: `Does each model fit? Anderson–Darling on the nonparametric estimate, p by a bootstrap that re-inspects every unit ${tested[0]!.goodnessOfFit!.scheme === 'stated' ? 'at exactly its stated inspection times' : 'at its own recorded times'} (α = ${n(r.alpha, 3)})`,
        head: ['Model', 'A²', 'p', 'Replicates', 'Verdict'],
        rows: tested.map((c) => {
          const g = c.goodnessOfFit!;
          return [labelOf(c), n(g.statistic), `${n(g.pValue, 3)} ± ${n(g.monteCarloError, 2)}`, String(g.replicates), c.rejected === null ? 'no decision: test not size-calibrated for these rows' : c.rejected ? 'rejected: the data contradict it' : 'not rejected'];
        }),
      });
    } else if (r.goodnessOfFitNote) lines.push({ kind: 'note', text: `Goodness of fit: ${r.goodnessOfFitNote}.` });
    const rows: string[][] = [];
    for (const c of r.candidates) for (const b of c.bLives) rows.push([`${labelOf(c)}: B${n(b.percent, 3)}`, n(b.estimate), n(b.lower), n(b.upper), b.method]);
    if (rows.length > 0) tables.push({ caption: `B-lives${u ? ` [${u}]` : ''} with two-sided ${pct(r.confidence)} bounds where the estimator gives them`, head: ['Life', 'Estimate', 'Lower', 'Upper', 'Estimator and bounds'], rows });
  }
  for (const c of r.candidates) for (const f of c.flags) lines.push({ kind: 'warning', text: `${labelOf(c)}: ${f}` });
  for (const c of r.candidates) for (const w of c.warnings) lines.push({ kind: 'warning', text: `${labelOf(c)}: ${w}` });
  for (const x of r.notFitted) lines.push({ kind: 'note', text: `${x.family === 'weibull-mixture' ? 'The Weibull mixture (two subpopulations)' : modelLabel(x.family)} not fitted: ${x.reason}` });
  if (r.weibayes) {
    const w = r.weibayes;
    tables.push({
      caption: `Weibayes with the shape ASSUMED at β = ${w.shape} (not estimated); lower bounds one-sided ${pct(w.confidence)}`,
      head: ['Quantity', 'Estimate', 'Lower bound'],
      rows: [
        ['Scale', w.scale === null ? 'none (no failures)' : n(w.scale), n(w.scaleLower)],
        ...w.bLives.map((b) => [`B${n(b.percent, 3)}`, n(b.estimate), n(b.lower)]),
        ...w.reliability.map((x) => [`R(${n(x.time)})`, n(x.estimate), n(x.lower)]),
      ],
    });
    lines.push({ kind: 'caution', text: w.statement }, { kind: 'note', text: `${w.method} (${w.source}).` });
  }
  tables.push({
    caption: 'Turnbull nonparametric estimate: the mass in each box is known, not where inside it lies',
    head: ['From', 'To', 'Mass', 'F before', 'F after'],
    rows: r.turnbull.intervals.map((iv) => [n(iv.lower), iv.upper === null || !Number.isFinite(iv.upper) ? 'beyond' : n(iv.upper), n(iv.mass, 4), n(iv.cdfBefore, 4), n(iv.cdfAfter, 4)]),
    folded: true,
  });
  if (plan) {
    tables.push({
      caption: `Test plan: show R(${n(plan.input.time)}) ≥ ${plan.input.reliability} with ${pct(plan.input.confidence)} confidence, β = ${plan.input.shape} assumed, at most ${plan.input.failuresAllowed} failure${plan.input.failuresAllowed === 1 ? '' : 's'}`,
      head: ['Test time per unit', 'k', 'Units (binomial)', 'Units (Weibayes form)'],
      rows: plan.rows.map((x) => [n(x.testTime), n(x.timeRatio), String(x.unitsBinomial), String(x.unitsWeibayes)]),
    });
    for (const d of plan.derivation) lines.push({ kind: 'fact', text: d });
    for (const c of plan.cautions) lines.push({ kind: 'caution', text: c });
  }
  for (const w of r.warnings) lines.push({ kind: 'note', text: w });
  // The core repeats Weibayes' statement among the cautions: said once.
  for (const c of r.cautions) if (!lines.some((l) => l.text === c)) lines.push({ kind: 'caution', text: c });
  const answer = answerOf(r, u);
  return {
    id: 'life-recorded',
    title: 'Life: other estimators, subpopulations and few failures',
    ...(answer ? { answer } : {}),
    lead: 'The same units seen another way: a two-subpopulation mixture beside the single models, rank regression when asked for, Weibayes when the shape is assumed, and the nonparametric estimate.',
    lines,
    tables,
    charts: r.turnbull.intervals.length > 0 ? ['turnbull'] : [],
    terms: ['blife', 'censored', 'bounds'],
  };
}

export const lifeRecordedSection: SectionView = ({ report, units }) => {
  const rec = report.life?.recorded;
  if (!rec || !rec.report) return null;
  return recordedBlock(rec.report, rec.plan, units);
};

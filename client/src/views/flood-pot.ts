/**
 * Peaks over a threshold (report `pot`, a dated series): the events found above the threshold,
 * the generalized Pareto fits of their excesses by maximum likelihood and by L-moments, return
 * levels per year (profile-likelihood intervals for maximum likelihood), the threshold diagnostics
 * as charts and table, and the cautions (a design flood defers to the governing guidance). Pure.
 */
import { sig } from '../format.js';
import type { BlockLine, BlockTable, SectionView } from './block.js';
import { end, pct, withU } from './numbers.js';

const ESTIMATOR: Readonly<Record<string, string>> = { ml: 'maximum likelihood', lmoments: 'L-moments' };

export const floodPotSection: SectionView = ({ report: r, units: u }) => {
  const p = r.pot;
  if (!p) return null;
  const unitHead = u ? ` [${u}]` : '';
  const first = p.candidates[0];
  const lines: BlockLine[] = [];
  const tables: BlockTable[] = [];
  lines.push({
    kind: 'fact',
    text: `Threshold ${withU(sig(p.threshold), u)}; values above it closer than ${sig(p.minSeparationDays)} days form one event, whose peak is kept: ${p.clusters} event peaks in ${sig(p.years, 4)} years, ${sig(p.ratePerYear, 3)} per year.`,
  });
  for (const c of p.candidates) {
    lines.push({
      kind: 'fact',
      text: `Generalized Pareto excesses by ${ESTIMATOR[c.estimation] ?? c.estimation}: scale ${sig(c.parameters.scale, 4)}, shape ξ ${sig(c.parameters.shape, 3)}${c.logLikelihood !== null ? `, log-likelihood ${sig(c.logLikelihood, 6)}` : ''}${c.converged ? '' : ' (the fit did not converge)'}.`,
    });
  }
  const periods = first?.returnLevels.map((l) => l.period) ?? [];
  const byEstimator = p.candidates.map((c) => new Map(c.returnLevels.map((l) => [l.period, l])));
  const ml = p.candidates.findIndex((c) => c.estimation === 'ml');
  tables.push({
    caption: `Levels by return period (years, from ${sig(p.ratePerYear, 3)} events per year); two-sided ${pct(p.confidence)} profile-likelihood intervals for maximum likelihood, the exceedance rate taken as known; L-moments give point estimates only.`,
    head: ['Return period T [years]', `Maximum likelihood${unitHead}`, 'Lower', 'Upper', `L-moments${unitHead}`],
    rows: periods.map((T) => {
      const m = ml >= 0 ? byEstimator[ml]?.get(T) : undefined;
      const l = byEstimator[ml === 0 ? 1 : 0]?.get(T);
      const num = (x: number | undefined): string => (x === undefined || !Number.isFinite(x) ? 'not defined' : sig(x));
      return [sig(T), num(m?.estimate), end(m?.lower, 'not closed'), end(m?.upper, 'not closed'), num(l?.estimate)];
    }),
  });
  const undefinedPeriods = periods.filter((T) => !Number.isFinite(first?.returnLevels.find((l) => l.period === T)?.estimate ?? Number.NaN));
  if (undefinedPeriods.length > 0) lines.push({ kind: 'note', text: `No level for T = ${undefinedPeriods.map((T) => sig(T)).join(', ')} years: fewer than one event is expected in that time.` });
  if (p.diagnostics.length > 0) {
    tables.push({
      caption: `Threshold diagnostics: ${p.diagnosticsRule}.`,
      head: [`Threshold${unitHead}`, 'Events', `Mean excess${unitHead}`, 'Shape ξ', 'Modified scale σ − ξu'],
      rows: p.diagnostics.map((d) => [sig(d.threshold), String(d.clusters), sig(d.meanExcess), end(d.shape, 'too few events'), end(d.modifiedScale, 'too few events')]),
      folded: true,
    });
    lines.push({ kind: 'note', text: 'Choose the lowest threshold above which the mean excess is close to a straight line and the fitted shape is close to constant; a higher threshold leaves fewer events and wider intervals.' });
  } else {
    lines.push({ kind: 'warning', text: 'No threshold diagnostics: the values do not spread enough above their 80th percentile.' });
  }
  for (const k of p.cautions) lines.push({ kind: 'caution', text: k });
  const top = ml >= 0 ? p.candidates[ml]?.returnLevels.filter((l) => Number.isFinite(l.estimate)).at(-1) : undefined;
  return {
    id: 'pot',
    title: 'Peaks over a threshold',
    ...(top
      ? { answer: `${sig(top.period)}-year level from the events above ${withU(sig(p.threshold), u)}: ${withU(sig(top.estimate), u)} by maximum likelihood, ${pct(p.confidence)} interval ${end(top.lower, 'not closed')} to ${end(top.upper, 'not closed')}.` }
      : {}),
    lead: 'A dated series, declustered into independent events above the threshold; the excesses of the event peaks are fitted by a generalized Pareto model, and the number of events per year turns its quantiles into levels per year.',
    lines,
    tables,
    charts: [...(p.diagnostics.length > 0 ? (['threshold-mean-excess'] as const) : []), ...(p.diagnostics.some((d) => d.shape !== null) ? (['threshold-stability'] as const) : [])],
    terms: ['return'],
  };
};

/**
 * The flood section's estimators beside maximum likelihood (report `flood.estimators`, present when
 * the run asked for expected moments or L-moments): log-Pearson III by the expected moments
 * algorithm with its skew weighting and low-outlier decision, the L-moment fits with their return
 * levels, and the L-moment ratio diagram. Each number says which estimator produced it. Pure.
 */
import { sig } from '../format.js';
import type { BlockLine, BlockTable, SectionView } from './block.js';
import { end, pct, withU } from './numbers.js';
import type { FloodEmaBlock } from '../../../core/workflow/flood-estimators.js';

export const floodEstimatorsSection: SectionView = ({ report: r, units: u }) => {
  const f = r.flood;
  const est = f?.estimators;
  if (!f || !est) return null;
  const lines: BlockLine[] = [];
  const tables: BlockTable[] = [];
  const unitHead = u ? ` [${u}]` : '';
  const ema = est.ema;
  const lm = est.lmoments;
  let answer: string | undefined;
  const top = f.periods[f.periods.length - 1];

  if (ema && ema.applicable) {
    const shown = emaLines(ema, u);
    if (est.requested === 'ema') answer = shown.answer;
    lines.push(...shown.lines);
    tables.push(...shown.tables);
  } else if (ema && !ema.applicable) {
    lines.push({ kind: 'warning', text: `Log-Pearson III by expected moments was not fitted: ${ema.reason}.` });
  }

  if (lm.applicable) {
    const byFamily = lm.fits.map((fit) => fit.returnLevels[fit.returnLevels.length - 1]?.estimate ?? Number.NaN);
    if (!answer && top !== undefined && lm.fits.length > 0) {
      const finite = byFamily.filter((x) => Number.isFinite(x));
      answer = `${sig(top)}-year level by L-moment fits: ${withU(sig(Math.min(...finite)), u)} to ${withU(sig(Math.max(...finite)), u)} across the ${lm.fits.length} families (point estimates, no intervals).`;
    }
    lines.push({
      kind: 'fact',
      text: `Sample L-moments (n = ${lm.sample.n}): l1 ${sig(lm.sample.l1)}, l2 ${sig(lm.sample.l2)}, L-CV ${sig(lm.sample.t, 3)}, L-skewness τ3 ${sig(lm.sample.t3, 3)}, L-kurtosis τ4 ${sig(lm.sample.t4, 3)}.`,
    });
    tables.push({
      caption: `Fits by L-moments: levels by return period (${lm.intervalMethod}).`,
      head: ['Model (L-moments)', ...f.periods.map((T) => `T = ${sig(T)}${unitHead}`)],
      rows: lm.fits.map((fit) => [fit.label, ...fit.returnLevels.map((x) => sig(x.estimate))]),
    });
    tables.push({
      caption: 'Parameters of the L-moment fits (each fit\'s own parameter names).',
      head: ['Model (L-moments)', 'Parameters', 'Method'],
      rows: lm.fits.map((fit) => [fit.label, Object.entries(fit.parameters).map(([k, v]) => `${k} ${sig(v)}`).join(', '), fit.method]),
      folded: true,
    });
    for (const n of lm.notFitted) lines.push({ kind: 'warning', text: `${n.family}: no L-moment fit (${n.reason}).` });
    lines.push({ kind: 'note', text: 'The ratio diagram places the sample\'s L-skewness and L-kurtosis among the families\' curves: a short record scatters widely about its family\'s curve, so the nearest curve is a hint, not a test.' });
  } else {
    lines.push({ kind: 'warning', text: `No L-moment fits: ${lm.reason}.` });
  }
  lines.push({ kind: 'note', text: 'The maximum-likelihood levels above and these levels come from different estimators; each table names its own.' });
  for (const w of est.warnings) lines.push({ kind: 'warning', text: w });
  if (ema && ema.applicable) for (const k of ema.cautions) lines.push({ kind: 'caution', text: k });
  else lines.push({ kind: 'caution', text: 'A design flood is a safety decision: these numbers support, and do not replace, the procedures of the governing agency, local regulations and review by a licensed engineer or hydrologist.' });
  return {
    id: 'flood-estimators',
    title: est.requested === 'ema' ? 'Flood levels by expected moments and L-moments' : 'Flood levels by L-moments',
    ...(answer ? { answer } : {}),
    lead: 'The estimators flood agencies prescribe, beside maximum likelihood: log-Pearson III by expected moments (on request) and fits by L-moments, with the L-moment ratio diagram.',
    lines,
    tables,
    charts: [...(ema && ema.applicable ? (['ema-return-period'] as const) : []), ...(lm.applicable ? (['lmoment-diagram'] as const) : [])],
    terms: ['return'],
  };
};

/**
 * The log-Pearson III / EMA block in words and one table: the moments, the weighted skew with the
 * station and regional skews and weights, the low outliers with their test, the effective record
 * length, the intervals' method and the return levels. Shared by this section and the flood record
 * of a peak file (flood-record.ts).
 */
export function emaLines(ema: FloodEmaBlock, u: string): { answer: string | undefined; lines: BlockLine[]; tables: BlockTable[] } {
  const lines: BlockLine[] = [];
  const tables: BlockTable[] = [];
  const unitHead = u ? ` [${u}]` : '';
  let answer: string | undefined;
  const s = ema.skew;
  const last = ema.returnLevels[ema.returnLevels.length - 1];
  if (last) {
    answer = `${sig(last.period)}-year flow by log-Pearson III (expected moments): ${withU(sig(last.estimate), u)}, ${pct(ema.confidence)} interval ${end(last.lower, 'not computed')} to ${end(last.upper, 'not computed')}.`;
  }
  lines.push({
    kind: 'fact',
    text: `Log-Pearson III on log10 of the ${ema.counts.years} annual maxima, by the expected moments algorithm: mean ${sig(ema.parameters.mean, 5)}, standard deviation ${sig(ema.parameters.sd, 4)}, skew ${sig(ema.parameters.skew, 3)}${ema.converged ? '' : ' (the iteration did not settle)'}.`,
  });
  lines.push({
    kind: 'fact',
    text:
      s.regionalSkew !== null
        ? `Skew weighted by mean square errors: station ${sig(s.stationSkew, 3)} (MSE ${sig(s.stationSkewMse, 3)}) with weight ${sig(s.stationWeight, 3)}, regional ${sig(s.regionalSkew, 3)} (MSE ${sig(s.regionalSkewMse, 3)}) with weight ${sig(s.regionalWeight, 3)}, giving ${sig(s.weightedSkew, 3)}.`
        : `Station skew ${sig(s.stationSkew, 3)} (MSE ${sig(s.stationSkewMse, 3)}), not weighted: no regional skew was given.`,
  });
  lines.push({
    kind: 'fact',
    text:
      ema.lowOutliers.count > 0
        ? `Low outliers: ${ema.lowOutliers.count} peaks below ${withU(sig(ema.lowOutliers.threshold), u)} are treated as known only to lie below it (${ema.lowOutliers.method ?? ''}).`
        : `Low outliers: none found (${ema.lowOutliers.method ?? 'no test'}).`,
  });
  lines.push({ kind: 'note', text: `Station-skew MSE: ${s.mseMethod}.` });
  if (ema.effectiveRecordLength !== null) {
    lines.push({
      kind: 'fact',
      text: `Effective record length of the skew: ${sig(ema.effectiveRecordLength, 3)} years of the ${ema.counts.years} (the years of a record with no censored years whose skew would be as precise).`,
    });
  }
  lines.push({
    kind: 'note',
    text: `Intervals: ${ema.intervalMethod}; exact for a normal record with the skew held and no censored years, otherwise an approximation (in a seeded simulation a nominal 90 % interval covered 86–96 % over ten record designs, short and censored records furthest off). The variance is derived here after Cohn, Lane & Stedinger (2001); the Bulletin's own text was not at hand, so agreement with its tables is not claimed. Beside them: ${ema.bootstrapMethod}.`,
  });
  tables.push({
    caption: `Log-Pearson III by expected moments: flows by return period with two-sided ${pct(ema.confidence)} intervals (EMA variance; bootstrap beside).`,
    head: ['Return period T [years]', 'Chance per year', `Flow${unitHead}`, `${pct(ema.confidence)} interval`, 'Equivalent years', 'Bootstrap interval'],
    rows: ema.returnLevels.map((x) => [
      sig(x.period),
      sig(1 / x.period, 3),
      sig(x.estimate),
      x.lower !== null && x.upper !== null ? `${sig(x.lower)} to ${sig(x.upper)}` : 'not computed',
      sig(x.equivalentYears, 3),
      x.bootstrapLower !== null && x.bootstrapUpper !== null ? `${sig(x.bootstrapLower)} to ${sig(x.bootstrapUpper)}` : 'not computed',
    ]),
  });
  return { answer, lines, tables };
}

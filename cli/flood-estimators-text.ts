/**
 * The text of the flood section's estimators beside maximum likelihood (report
 * `flood.estimators`: `--estimation lmoments` with return periods; the page and the API also ask
 * for `ema`): the L-moment fits with their levels (point estimates), the sample L-moment ratios,
 * log-Pearson III by expected moments when present, and the cautions. Every table names the
 * estimator that produced its numbers.
 */
import { formatNumber, type DatasetReport } from '../core/index.js';

function cell(x: number | null | undefined): string {
  return x === null || x === undefined || !Number.isFinite(x) ? '—' : formatNumber(x);
}

function grid(head: readonly string[], rows: readonly (readonly string[])[]): string[] {
  const w = head.map((h, j) => Math.max(h.length, ...rows.map((r) => (r[j] ?? '').length)));
  const line = (cells: readonly string[]) => `  ${cells.map((s, j) => (j === 0 ? s.padEnd(w[j] as number) : s.padStart(w[j] as number))).join('  ')}`.trimEnd();
  return [line(head), ...rows.map(line)];
}

export function floodEstimatorLines(r: DatasetReport): string[] {
  const est = r.flood?.estimators;
  if (!r.flood || !est) return [];
  const periods = r.flood.periods;
  const out: string[] = [est.requested === 'ema' ? 'Flood levels by expected moments and L-moments (beside maximum likelihood)' : 'Flood levels by L-moments (beside maximum likelihood)'];
  const ema = est.ema;
  if (ema && ema.applicable) {
    const s = ema.skew;
    out.push(`  Log-Pearson III by expected moments on log10 flows: mean ${formatNumber(ema.parameters.mean)}, sd ${formatNumber(ema.parameters.sd)}, skew ${formatNumber(ema.parameters.skew)}.`);
    out.push(
      s.regionalSkew !== null
        ? `  Skew: station ${formatNumber(s.stationSkew)} (MSE ${formatNumber(s.stationSkewMse)}), regional ${formatNumber(s.regionalSkew)} (MSE ${formatNumber(s.regionalSkewMse as number)}), weights ${formatNumber(s.stationWeight)} / ${formatNumber(s.regionalWeight)}.`
        : `  Skew: station ${formatNumber(s.stationSkew)} (MSE ${formatNumber(s.stationSkewMse)}), no regional skew.`,
    );
    out.push(`  Low outliers: ${ema.lowOutliers.count > 0 ? `${ema.lowOutliers.count} below ${cell(ema.lowOutliers.threshold)}, treated as censored` : 'none'}.`);
    if (ema.effectiveRecordLength !== null) out.push(`  Effective record length of the skew: ${formatNumber(ema.effectiveRecordLength)} of ${ema.counts.years} years.`);
    out.push(`  Intervals: ${ema.intervalMethod}, two-sided ${formatNumber(100 * ema.confidence)} %; beside them ${ema.bootstrapMethod}.`);
    out.push(
      ...grid(
        ['period (years)', 'flow (expected moments)', 'lower', 'upper', 'equiv. years', 'bootstrap lower', 'bootstrap upper'],
        ema.returnLevels.map((l) => [formatNumber(l.period), cell(l.estimate), cell(l.lower), cell(l.upper), cell(l.equivalentYears), cell(l.bootstrapLower), cell(l.bootstrapUpper)]),
      ),
    );
  } else if (ema && !ema.applicable) out.push(`  Log-Pearson III by expected moments: not fitted (${ema.reason}).`);
  const lm = est.lmoments;
  if (lm.applicable) {
    out.push(`  Sample L-moments (n = ${lm.sample.n}): l1 ${formatNumber(lm.sample.l1)}, l2 ${formatNumber(lm.sample.l2)}, t3 ${formatNumber(lm.sample.t3)}, t4 ${formatNumber(lm.sample.t4)}.`);
    out.push(`  Levels of the fits by L-moments (${lm.intervalMethod}):`);
    out.push(...grid(['model (L-moments)', ...periods.map((T) => `T = ${formatNumber(T)}`)], lm.fits.map((f) => [f.label, ...f.returnLevels.map((l) => cell(l.estimate))])));
    for (const f of lm.fits) out.push(`    ${f.label}: ${Object.entries(f.parameters).map(([k, v]) => `${k} ${formatNumber(v)}`).join(', ')}`);
    for (const n of lm.notFitted) out.push(`  ${n.family}: no L-moment fit (${n.reason}).`);
  } else out.push(`  No L-moment fits: ${lm.reason}.`);
  for (const w of est.warnings) out.push(`  Warning: ${w}`);
  out.push('  The maximum-likelihood levels of the flood section and these come from different estimators.');
  if (ema && ema.applicable) {
    out.push('  Cautions:');
    for (const c of ema.cautions) out.push(`    - ${c}`);
  }
  out.push('');
  return out;
}

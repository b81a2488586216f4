/**
 * The trade-workflow sections of the text report (life data, flood frequency, capability, trend,
 * model sensitivity), each with its cautions. Only sections present in the report are printed.
 */
import { formatNumber, type DatasetCandidate, type DatasetReport, type SensitivityRow } from '../core/index.js';
import { capabilityAnswerLine, capabilityExtensionLines } from './capability-text.js';
import { floodEstimatorLines } from './flood-estimators-text.js';
import { wrap } from './text-report.js';

function pct(x: number): string {
  return `${formatNumber(100 * x, 4)} %`;
}

function bound(x: number | null | undefined): string {
  if (x === null) return 'unbounded';
  if (x === undefined) return '';
  return formatNumber(x);
}

/** A small left-aligned table with right-aligned numeric columns. */
function table(head: readonly string[], rows: readonly (readonly string[])[], right: ReadonlySet<number>): string[] {
  const widths = head.map((h, j) => Math.max(h.length, ...rows.map((r) => (r[j] ?? '').length)));
  const line = (cells: readonly string[]): string =>
    '  ' +
    cells
      .map((s, j) => {
        const w = widths[j] as number;
        return right.has(j) ? s.padStart(w) : s.padEnd(w);
      })
      .join('  ')
      .trimEnd();
  return [line(head), line(widths.map((w) => '-'.repeat(w))), ...rows.map(line)];
}

function bullets(title: string, items: readonly string[]): string[] {
  if (items.length === 0) return [];
  return [`  ${title}`, ...items.map((w) => wrap(w, '    - ', '      '))];
}

function lifeLines(r: DatasetReport): string[] {
  const life = r.life;
  if (!life) return [];
  const out: string[] = ['Life data'];
  out.push(
    wrap(
      `${life.units} units: ${life.failures} failed, ${life.suspensions} suspended (still running or removed unfailed). Bounds: two-sided ${pct(life.confidence)}, ${life.boundMethod === 'likelihood-ratio' ? 'likelihood ratio' : 'Fisher matrix'}.`,
      '  ',
      '  ',
    ),
  );
  out.push(wrap(`Plot positions: ${life.plot.description.replace(/\.?$/, '.')}`, '  ', '  '));
  out.push(wrap(life.chiSquare.reason, '  ', '  '));
  const head = ['model', ...life.bLifePercents.map((p) => `B${formatNumber(p)} (lower … upper)`), ...life.reliabilityTimes.map((t) => `R(${formatNumber(t)}) (lower … upper)`), 'mean life'];
  const rows = r.candidates.map((c: DatasetCandidate) => [
    c.label,
    ...(c.bLives ?? []).map((b) => `${formatNumber(b.estimate)} (${formatNumber(b.lower)} … ${formatNumber(b.upper)})${b.boundsFound ? '' : ' *'}`),
    ...(c.reliability ?? []).map((x) => `${formatNumber(x.estimate, 4)} (${formatNumber(x.lower, 4)} … ${formatNumber(x.upper, 4)})${x.boundsFound ? '' : ' *'}`),
    c.meanLife !== undefined ? formatNumber(c.meanLife) : '',
  ]);
  out.push(...table(head, rows, new Set()));
  if (r.candidates.some((c) => [...(c.bLives ?? []), ...(c.reliability ?? [])].some((b) => !b.boundsFound))) {
    out.push('  * a bound could not be closed; the end shown is the search limit.');
  }
  out.push(...bullets('Cautions', life.cautions));
  out.push('');
  return out;
}

function floodLines(r: DatasetReport): string[] {
  const f = r.flood;
  if (!f) return [];
  const out: string[] = ['Flood frequency'];
  out.push(
    wrap(
      `Record of ${f.recordLength} years; return levels with two-sided ${pct(f.confidence)} intervals (profile likelihood for Gumbel and GEV, delta method for the others). Plotting positions: ${f.plottingPositions.description}.`,
      '  ',
      '  ',
    ),
  );
  const head = ['model', ...f.periods.map((T) => `T = ${formatNumber(T)} (lower … upper)`)];
  const rows = r.candidates.map((c) => [c.label, ...(c.returnLevels ?? []).map((l) => `${formatNumber(l.estimate)} (${bound(l.lower)} … ${bound(l.upper)})${l.beyondRecord ? ' †' : ''}`)]);
  out.push(...table(head, rows, new Set()));
  if (f.beyondRecord.length > 0) out.push(`  † beyond twice the ${f.recordLength}-year record: an extrapolation resting on the model's tail.`);
  if (f.designLife) {
    out.push(
      wrap(
        `Chance of at least one exceedance in a design life of ${formatNumber(f.designLife.years)} years: ${f.designLife.exceedance.map((e) => `${formatNumber(e.period)}-year level ${pct(e.probability)}`).join('; ')}.`,
        '  ',
        '  ',
      ),
    );
  }
  if (f.gumbelVersusGev) out.push(wrap(f.gumbelVersusGev.decision, '  Gumbel or GEV: ', '  '));
  if (f.gevSignNote) out.push(wrap(f.gevSignNote, '  Note: ', '  '));
  out.push(...bullets('Cautions', f.cautions));
  out.push('');
  return out;
}

function capabilityLines(r: DatasetReport): string[] {
  const c = r.capability;
  if (!c) return [];
  const out: string[] = ['Process capability'];
  const limits = [c.lsl !== null ? `LSL ${formatNumber(c.lsl)}` : null, c.usl !== null ? `USL ${formatNumber(c.usl)}` : null, c.target !== null ? `target ${formatNumber(c.target)}` : null].filter((x) => x !== null);
  out.push(wrap(`${limits.join(', ')}; n = ${c.n}, mean ${formatNumber(c.mean)}, overall sd ${formatNumber(c.sdOverall)} (n - 1); intervals two-sided ${pct(c.confidence)}.`, '  ', '  '));
  out.push(capabilityAnswerLine(c));
  const idx = [...c.overall, ...(c.within?.indices ?? [])];
  out.push(...table(['index', 'estimate', 'lower', 'upper', 'interval'], idx.map((i) => [i.name, formatNumber(i.estimate, 4), formatNumber(i.lower, 4), formatNumber(i.upper, 4), i.intervalMethod]), new Set([1, 2, 3])));
  if (c.within) out.push(wrap(`Within-subgroup sigma ${formatNumber(c.within.sigma)}: ${c.within.description} (${c.within.subgroups} subgroups).`, '  ', '  '));
  if (c.normality) out.push(wrap(c.normality.statement, '  Normality gate: ', '  '));
  if (c.percentile) {
    out.push(
      wrap(
        `${c.percentile.family}: ${c.percentile.indices.map((i) => `${i.name} ${formatNumber(i.estimate, 4)}`).join(', ')} (${c.percentile.method}; X0.135 % ${formatNumber(c.percentile.lowerQuantile)}, median ${formatNumber(c.percentile.median)}, X99.865 % ${formatNumber(c.percentile.upperQuantile)}).`,
        '  Percentile method, ',
        '  ',
      ),
    );
  }
  out.push(...capabilityExtensionLines(c));
  out.push(...bullets('Cautions', c.cautions));
  out.push('');
  return out;
}

function trendLines(r: DatasetReport): string[] {
  const t = r.trend;
  if (!t) return [];
  const out: string[] = ['Trend check'];
  // The core's decision states S and the p-value (core/format); the line adds only how p was found.
  out.push(wrap(`Order from ${t.orderFrom === 'column' ? 'the order column' : 'the row order'}; Z = ${formatNumber(t.z, 4)}, p by the ${t.pMethod === 'exact' ? 'exact distribution of S' : 'normal approximation'}. ${t.decision}`, '  ', '  '));
  if (t.warning) out.push(wrap(t.warning, '  Warning: ', '  '));
  out.push(...bullets('Cautions', t.cautions));
  out.push('');
  return out;
}

export function sensitivityLines(rows: readonly SensitivityRow[] | undefined): string[] {
  if (!rows || rows.length === 0) return [];
  const out: string[] = ['Model sensitivity (each decision number under each model)'];
  const basis = rows[0]?.basis === 'passing' ? 'models that no test rejects' : 'every model (none passes the tests; all flagged)';
  out.push(wrap(`Listed: ${basis}.`, '  ', '  '));
  for (const row of rows) {
    const vals = row.values.map((v) => {
      const iv = v.lower !== undefined || v.upper !== undefined ? ` (${bound(v.lower)} … ${bound(v.upper)})` : '';
      return `${v.label} ${formatNumber(v.estimate)}${iv}${v.passes ? '' : ' [rejected]'}`;
    });
    // A range is read only across models no test rejects: across rejected ones it says nothing.
    const range = row.basis === 'passing' ? ` Range ${formatNumber(row.min)} to ${formatNumber(row.max)}.` : ' No range: every model is rejected.';
    out.push(wrap(`${vals.join('; ')}.${range}`, `  ${row.quantity}: `, '    '));
  }
  out.push('');
  return out;
}

/** All workflow sections of a complete or censored report, in a fixed order. */
export function workflowSections(r: DatasetReport): string[] {
  return [...lifeLines(r), ...floodLines(r), ...floodEstimatorLines(r), ...capabilityLines(r), ...trendLines(r), ...sensitivityLines(r.sensitivity)];
}

/**
 * The plain-text report for grouped counts (`--grouped`): the classes, the ranked grouped fits
 * with the chi-square test on the (merged) classes, and why there is no Anderson–Darling test.
 *
 * With the parameters estimated by maximum likelihood from the same cell counts, Pearson's X² is
 * asymptotically chi-square with k - 1 - m degrees of freedom (Fisher 1924; Cramér 1946, §30.3;
 * from memory): the degrees of freedom are the right ones, but the p-value is a large-sample one.
 */
import { formatNumber, formatPValue, type GroupedCandidateReport, type GroupedDatasetReport } from '../core/index.js';
import type { CliInput } from './input-summary.js';
import { describeSkipped } from './input-summary.js';
import { wrap } from './text-report.js';
import { sensitivityLines } from './workflow-text.js';

function limit(x: number | null): string {
  return x === null ? '' : formatNumber(x);
}

function candidateLines(c: GroupedCandidateReport): string[] {
  const label = (s: string): string => `    ${s.padEnd(13)}`;
  const cont = ' '.repeat(17);
  const params = Object.entries(c.parameters)
    .map(([k, v]) => `${k} = ${formatNumber(v as number)}`)
    .join(', ');
  const out = [`  ${c.rank}. ${c.label}: ${params}`];
  out.push(wrap(`${c.fit.method} (${c.fit.iterations} iterations, ${c.fit.converged ? 'converged' : 'NOT converged'})`, label('fit'), cont));
  out.push(wrap(`grouped log-likelihood ${formatNumber(c.logLikelihood, 8)}; m = ${c.estimatedParameters}; AIC ${formatNumber(c.aic, 8)}, AICc ${formatNumber(c.aicc, 8)}, BIC ${formatNumber(c.bic, 8)}; ΔAICc ${formatNumber(c.deltaAicc, 4)}`, label('criteria'), cont));
  const cs = c.chiSquare;
  if (cs.computable) {
    out.push(
      wrap(
        `X² = ${formatNumber(cs.statistic)} on ${cs.dof} dof (k - 1 - m: the parameters are fitted to these cells by maximum likelihood, so the χ² reference distribution holds asymptotically, as n grows), ${formatPValue(cs.pValue)}; ${cs.k} cells from ${cs.classesGiven} classes${cs.refitted ? ' (merged to ≥ 5 expected, refitted on the merged cells)' : ''}. ` +
          `Counts observed/expected: ${cs.bins.map((b) => `${formatNumber(b.observed)}/${formatNumber(b.expected, 4)}`).join(' ')}.`,
        label('chi-square'),
        cont,
      ),
    );
  } else out.push(wrap(`not computed: ${cs.reason}`, label('chi-square'), cont));
  if (c.ppmOutOfSpec) out.push(wrap(`${formatNumber(c.ppmOutOfSpec.total, 4)} ppm out of spec (${formatNumber(c.ppmOutOfSpec.belowLsl, 4)} below, ${formatNumber(c.ppmOutOfSpec.aboveUsl, 4)} above)`, label('spec'), cont));
  out.push(wrap(c.verdict, label('verdict'), cont));
  return out;
}

export function groupedTextReport(r: GroupedDatasetReport, input: CliInput): string {
  const lines: string[] = [];
  lines.push(`Plumbline ${r.software.version}: model fit report (grouped counts)`);
  lines.push('');
  lines.push(wrap(`${input.file}, counts in column ${JSON.stringify(input.column)} (column ${input.columnIndex})`, '  input     ', ' '.repeat(12)));
  for (const o of input.otherColumns ?? []) lines.push(`${('  ' + o.role).padEnd(11)} column ${JSON.stringify(o.column)}`);
  lines.push(wrap(`${input.rowsRead} class row${input.rowsRead === 1 ? '' : 's'} read, total count ${formatNumber(r.n)}; ${describeSkipped(input)}`, '  rows      ', ' '.repeat(12)));
  lines.push(wrap(`models ${r.options.families.join(', ')}; α = ${formatNumber(r.options.alpha)}`, '  settings  ', ' '.repeat(12)));
  lines.push('');
  lines.push('Classes (lower, upper, count)');
  for (const c of r.grouped.classes) lines.push(`  ${limit(Number.isFinite(c.lower) ? c.lower : null) || '-∞'} to ${limit(Number.isFinite(c.upper) ? c.upper : null) || '∞'}: ${formatNumber(c.count)}`);
  lines.push('');
  if (r.candidates.length > 0) {
    lines.push('Candidates (best first by AICc)');
    for (const c of r.candidates) {
      lines.push(...candidateLines(c));
      lines.push('');
    }
  } else {
    lines.push('No candidate model could be fitted.');
    lines.push('');
  }
  lines.push(wrap(r.grouped.andersonDarling.reason, '  Anderson–Darling: ', '  '));
  lines.push('');
  lines.push(...sensitivityLines(r.sensitivity));
  if (r.notApplicable.length > 0) {
    lines.push('Not applicable');
    for (const na of r.notApplicable) lines.push(wrap(na.reason, `  ${na.family}: `, '    '));
    lines.push('');
  }
  const warnings = [...input.warnings, ...r.warnings];
  if (warnings.length > 0) {
    lines.push('Warnings');
    for (const w of warnings) lines.push(wrap(w, '  - ', '    '));
    lines.push('');
  }
  lines.push('Methods and sources');
  for (const m of r.methods) lines.push(wrap(`${m.description} Source: ${m.source}`, `  - ${m.topic}: `, '    '));
  lines.push('');
  lines.push('Caution');
  lines.push(
    wrap(
      'A fitted model describes these counts only. Where a result feeds a safety decision (the life of a part, a design flood, a safety-critical dimension), it needs review by a qualified person under the governing codes, standards and local regulations.',
      '  ',
      '  ',
    ),
  );
  return lines.join('\n') + '\n';
}

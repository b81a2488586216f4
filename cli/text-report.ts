/**
 * The plain-text report of `plumbline analyze` (without --json). Layout of our own: a header
 * block on the input, a ranking table, one block per candidate, then the families that could not
 * be fitted, warnings, the ranking rule, the methods with their sources, and the caution.
 */
import { formatNumber, formatPValue, pValueText, testNames, type AnalysisReport, type CandidateReport, type ChiSquareReport, type DatasetReport } from '../core/index.js';
import type { CliInput } from './input-summary.js';
import { describeSkipped } from './input-summary.js';
import { workflowSections } from './workflow-text.js';

const WIDTH = 100;

/** Wrap `text` to WIDTH columns, the first line after `first`, the rest indented by `indent`. */
export function wrap(text: string, first: string, indent: string): string {
  const words = text.split(/\s+/).filter((w) => w !== '');
  const lines: string[] = [];
  let current = first;
  let empty = true;
  for (const w of words) {
    if (!empty && current.length + 1 + w.length > WIDTH) {
      lines.push(current);
      current = indent + w;
    } else {
      current += (empty ? '' : ' ') + w;
    }
    empty = false;
  }
  lines.push(current);
  return lines.join('\n');
}

function pad(s: string, w: number): string {
  return s.length >= w ? s : s + ' '.repeat(w - s.length);
}

function padLeft(s: string, w: number): string {
  return s.length >= w ? s : ' '.repeat(w - s.length) + s;
}

function parametersText(c: CandidateReport): string {
  return Object.entries(c.parameters)
    .map(([k, v]) => `${k} = ${formatNumber(v as number)}`)
    .join(', ');
}

function chiShort(cs: ChiSquareReport): string {
  if (!cs.computable) return 'not computed';
  return `${pValueText(cs.pValue)}–${pValueText(cs.pValueUpper)}`;
}

function rankingTable(r: AnalysisReport): string[] {
  const head = ['#', 'model', 'ΔAICc', 'AICc', 'log-lik.', 'chi-sq. p (k-1-m … k-1)', 'AD p', `at α = ${formatNumber(r.options.alpha)}`];
  const rows = r.candidates.map((c) => [
    String(c.rank),
    c.label,
    formatNumber(c.deltaAicc, 4),
    formatNumber(c.aicc, 7),
    formatNumber(c.logLikelihood, 7),
    chiShort(c.chiSquare),
    pValueText(c.andersonDarling.pValue, c.andersonDarling.pValueIs),
    c.rejectedBy.length === 0 ? 'not rejected' : `rejected by ${testNames(c.rejectedBy)}`,
  ]);
  const widths = head.map((h, j) => Math.max(h.length, ...rows.map((row) => (row[j] as string).length)));
  const right = new Set([2, 3, 4]);
  const line = (cells: string[]): string =>
    '  ' + cells.map((s, j) => (right.has(j) ? padLeft(s, widths[j] as number) : pad(s, widths[j] as number))).join('  ').trimEnd();
  return [line(head), line(widths.map((w) => '-'.repeat(w))), ...rows.map(line)];
}

function candidateBlock(c: CandidateReport, n: number, censored = false): string[] {
  const out: string[] = [];
  const label = (s: string): string => `    ${pad(s, 13)}`;
  const cont = ' '.repeat(17);
  out.push(`  ${c.rank}. ${c.label}: ${parametersText(c)}`);
  out.push(
    wrap(
      `${c.fit.method} (${c.fit.iterations} iteration${c.fit.iterations === 1 ? '' : 's'}, ${c.fit.converged ? 'converged' : 'NOT converged'})`,
      label('fit'),
      cont,
    ),
  );
  out.push(
    wrap(
      `log-likelihood ${formatNumber(c.logLikelihood, 8)}; m = ${c.estimatedParameters} estimated parameter${c.estimatedParameters === 1 ? '' : 's'}, n = ${n}; ` +
        `AIC ${formatNumber(c.aic, 8)}, AICc ${formatNumber(c.aicc, 8)}, BIC ${formatNumber(c.bic, 8)}; ΔAICc ${formatNumber(c.deltaAicc, 4)}`,
      label('criteria'),
      cont,
    ),
  );
  const cs = c.chiSquare;
  if (cs.computable) {
    out.push(
      wrap(
        `X² = ${formatNumber(cs.statistic)} on ${cs.dof} dof (k - 1 - m), ${formatPValue(cs.pValue)}; on ${cs.dofUpper} dof (k - 1), ${formatPValue(cs.pValueUpper)}; ` +
          `the true p lies between (Chernoff & Lehmann 1954). Critical value at α = ${formatNumber(cs.alpha)}: ${formatNumber(cs.criticalValue)}. ` +
          `${cs.kRule} Counts observed/expected: ${cs.bins.map((b) => `${b.observed}/${formatNumber(b.expected, 4)}`).join(' ')}.`,
        label('chi-square'),
        cont,
      ),
    );
  } else if (censored) {
    out.push(wrap('not computed for a censored sample (the reason is under Life data)', label('chi-square'), cont));
  } else {
    out.push(wrap(`not computed: ${cs.reason}`, label('chi-square'), cont));
  }
  const ad = c.andersonDarling;
  const modified = ad.modifiedStatistic !== undefined ? ` (modified ${formatNumber(ad.modifiedStatistic)})` : '';
  const mc =
    ad.method === 'bootstrap' && ad.replicates !== undefined
      ? `; ${ad.replicates} replicates, seed ${String(ad.seed)}, Monte Carlo s.e. ${formatNumber(ad.monteCarloStandardError ?? Number.NaN, 3)}`
      : '';
  out.push(
    wrap(
      `A² = ${formatNumber(ad.statistic)}${modified}, ${formatPValue(ad)}` +
        `${ad.pValueIs === 'estimate' ? '' : ' (a bound: the statistic lies outside the table)'}, ` +
        `by ${ad.method === 'table' ? 'published table' : 'parametric bootstrap'}${mc} (details under Methods).`,
      label('A-D'),
      cont,
    ),
  );
  out.push(wrap(c.verdict, label('verdict'), cont));
  return out;
}

export function textReport(report: AnalysisReport | DatasetReport, input: CliInput): string {
  const r = report;
  const lines: string[] = [];
  lines.push(`Plumbline ${r.software.version}: model fit report`);
  lines.push('');
  lines.push(wrap(`${input.file}, column ${JSON.stringify(input.column)} (column ${input.columnIndex})`, '  input     ', ' '.repeat(12)));
  for (const o of input.otherColumns ?? []) lines.push(`${('  ' + o.role).padEnd(11)} column ${JSON.stringify(o.column)}`);
  lines.push(
    wrap(
      `${input.rowsRead} data row${input.rowsRead === 1 ? '' : 's'} read, ${r.n} value${r.n === 1 ? '' : 's'} used; ${describeSkipped(input)}`,
      '  rows      ',
      ' '.repeat(12),
    ),
  );
  lines.push(
    `  values    min ${formatNumber(r.summary.min)}, max ${formatNumber(r.summary.max)}, mean ${formatNumber(r.summary.mean)}, ` +
      `sd ${formatNumber(r.summary.sd)} (n - 1), ${r.summary.distinct} distinct`,
  );
  lines.push(
    wrap(
      `models ${r.options.families.join(', ')}; α = ${formatNumber(r.options.alpha)}; bins ${r.options.bins === null ? 'by rule' : String(r.options.bins)}; ` +
        `Anderson–Darling p-values by ${r.options.pMethod === 'table' ? 'tables (published, or simulated by this project where none is published; bootstrap where no table applies)' : 'parametric bootstrap'}` +
        (r.options.pMethod === 'bootstrap' || r.candidates.some((c) => c.andersonDarling.method === 'bootstrap')
          ? `, ${r.options.bootstrapReplicates} replicates, seed ${r.options.seed}`
          : ''),
      '  settings  ',
      ' '.repeat(12),
    ),
  );
  lines.push('');
  if (r.candidates.length > 0) {
    lines.push('Ranking (best first)');
    lines.push(...rankingTable(r));
    lines.push('');
    lines.push('Candidates');
    for (const c of r.candidates) {
      lines.push(...candidateBlock(c, r.n, 'dataKind' in r && r.dataKind === 'censored'));
      lines.push('');
    }
  } else {
    lines.push('No candidate model could be fitted.');
    lines.push('');
  }
  if (r.notApplicable.length > 0) {
    lines.push('Not applicable');
    for (const na of r.notApplicable) lines.push(wrap(na.reason, `  ${na.family}: `, '    '));
    lines.push('');
  }
  if ('dataKind' in r) lines.push(...workflowSections(r));
  const warnings = [...input.warnings, ...r.warnings];
  if (warnings.length > 0) {
    lines.push('Warnings');
    for (const w of warnings) lines.push(wrap(w, '  - ', '    '));
    lines.push('');
  }
  lines.push('Ranking rule');
  lines.push(wrap(r.rankingRule, '  ', '  '));
  lines.push('');
  if (r.methods.length > 0) {
    lines.push('Methods and sources');
    for (const m of r.methods) {
      if (m.description === r.rankingRule) continue; // shown above
      lines.push(wrap(`${m.description} Source: ${m.source}`, `  - ${m.topic}: `, '    '));
    }
    lines.push('');
  }
  lines.push('Caution');
  lines.push(
    wrap(
      'A fitted model describes these data only. Where a result feeds a safety decision (the life of a part, a design flood, ' +
        'a safety-critical dimension), it needs review by a qualified person under the governing codes, standards and local regulations.',
      '  ',
      '  ',
    ),
  );
  return lines.join('\n') + '\n';
}

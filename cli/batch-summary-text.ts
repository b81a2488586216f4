/**
 * The batch summary as a text table: one line per series with n, the best model, the two tests'
 * verdicts on it and the decision number with its interval; errors say what and where.
 */
import { formatNumber, type SeriesSummary } from '../core/index.js';

function decision(s: SeriesSummary): string {
  if (s.estimate === null || s.quantity === null) return '';
  const ends = s.lower !== null || s.upper !== null ? ` (${s.lower === null ? '…' : formatNumber(s.lower)} to ${s.upper === null ? '…' : formatNumber(s.upper)})` : '';
  return `${s.quantity} ${formatNumber(s.estimate)}${ends}`;
}

function pad(s: string, w: number): string {
  return s.length >= w ? s : s + ' '.repeat(w - s.length);
}

export function summaryTable(rows: readonly SeriesSummary[], heading: string): string {
  const head = ['series', 'n', 'best model', 'chi-square', 'Anderson–Darling', 'decision number', 'warnings'];
  const body = rows.map((s) =>
    s.status === 'error'
      ? [s.series, '', 'NOT ANALYSED', '', '', s.message ?? '', '']
      : [s.series, String(s.n ?? ''), s.best ?? 'none ranked', s.chiSquare ?? '', s.andersonDarling ?? '', decision(s), s.warnings > 0 ? String(s.warnings) : ''],
  );
  const widths = head.map((h, j) => Math.min(40, Math.max(h.length, ...body.map((r) => (r[j] as string).length))));
  const line = (cells: readonly string[]): string =>
    cells
      .map((c, j) => (j === cells.length - 1 ? c : pad(c, widths[j] as number)))
      .join('  ')
      .trimEnd();
  const errors = rows.filter((r) => r.status === 'error').length;
  const rejected = rows.filter((r) => r.chiSquare === 'rejected' || r.andersonDarling === 'rejected').length;
  return [
    heading,
    `${rows.length} series: ${rows.length - errors} analysed, ${errors} not analysed; the best model is rejected by a test in ${rejected}.`,
    '',
    line(head),
    ...body.map(line),
    '',
  ].join('\n');
}

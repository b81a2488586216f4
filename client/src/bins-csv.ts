/**
 * The bins table of the selected candidate as CSV (full precision; formula-like text
 * neutralised by csv-export.ts). An open outer edge (the first or last equal-probability bin runs
 * to the end of the model's support) is an empty cell, the same way on both sides, and the row's
 * `open_edge` column says which end is open. A censored sample has no bins: the file says
 * "not applicable: censored" and why, in one row.
 */
import { csvDocument, type CsvCell } from './csv-export.js';
import type { CandidateEvidence } from './types.js';

export const OPEN_EDGE_NOTE = 'an empty lower or upper cell is an open edge: the bin runs to the end of the model\'s support';

export function binsCsv(ce: CandidateEvidence, source: string, column: string, units: string): string {
  const na = ce.bins.notApplicable;
  if (na) {
    return csvDocument([
      ['model', 'source', 'column', 'units', 'bins', 'reason'],
      [ce.label, source, column, units, 'not applicable: censored', na.reason],
    ]);
  }
  const rows: CsvCell[][] = [['model', 'source', 'column', 'units', 'bin', 'lower', 'upper', 'open_edge', 'observed', 'expected', 'pearson_residual', 'chi_square_contribution']];
  for (const r of ce.bins.rows) {
    const open = r.lower === null && r.upper === null ? 'both' : r.lower === null ? 'lower' : r.upper === null ? 'upper' : '';
    rows.push([ce.label, source, column, units, r.index + 1, r.lower, r.upper, open ? `${open} (${OPEN_EDGE_NOTE})` : '', r.observed, r.expected, r.pearsonResidual, r.contribution]);
  }
  return csvDocument(rows);
}

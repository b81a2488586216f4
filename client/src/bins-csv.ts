/**
 * The bins table of the selected candidate as CSV (full precision; formula-like text
 * neutralised by csv-export.ts).
 */
import { csvDocument, type CsvCell } from './csv-export.js';
import type { CandidateEvidence } from './types.js';

export function binsCsv(ce: CandidateEvidence, source: string, column: string, units: string): string {
  const rows: CsvCell[][] = [['model', 'source', 'column', 'units', 'bin', 'lower', 'upper', 'observed', 'expected', 'pearson_residual', 'chi_square_contribution']];
  for (const r of ce.bins.rows) {
    rows.push([
      ce.label,
      source,
      column,
      units,
      r.index + 1,
      r.lower === null ? '-Infinity' : r.lower,
      r.upper === null ? 'Infinity' : r.upper,
      r.observed,
      r.expected,
      r.pearsonResidual,
      r.contribution,
    ]);
  }
  return csvDocument(rows);
}

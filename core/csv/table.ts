/**
 * Reading the requested columns of a whole CSV text (scanTable), and the warnings that sum up a
 * read. The scanner itself is scan-piece.ts (the whole text is its one piece); the record-level
 * helpers are record.ts.
 */
import { REASON_WORDS } from './classify.js';
import { showValue } from './record.js';
import { scanTablePiece, type RequestPlan, type ScanStorage } from './scan-piece.js';
import type { CsvOptions, SkipCount, TableResult } from './types.js';

export { showValue } from './record.js';
export { REASON_ORDER, scanTablePiece } from './scan-piece.js';
export type { Continuation, RequestPlan, ScanStorage, TablePiece } from './scan-piece.js';

/**
 * The warnings that sum up a whole read (blank lines, dropped rows by reason, no data rows), added
 * once to a whole file's result: by scanTable, or by a reader of pieces from the merged totals.
 */
export function summaryWarnings(blankLines: number, skipped: readonly SkipCount[], rowsRead: number): string[] {
  const warnings: string[] = [];
  if (blankLines > 0) warnings.push(`${blankLines} blank line${blankLines === 1 ? '' : 's'} passed over`);
  if (skipped.length > 0) {
    const total = skipped.reduce((a, s) => a + s.count, 0);
    warnings.push(
      `${total} row${total === 1 ? '' : 's'} dropped: ` +
        skipped.map((s) => `${s.count} ${REASON_WORDS[s.reason]} (first at row ${s.firstRow}${s.firstValue ? `, ${showValue(s.firstValue)}` : ''})`).join('; '),
    );
  }
  if (rowsRead === 0) warnings.push('the file has no data rows');
  return warnings;
}

/**
 * Read the requested columns of a CSV text in one pass. Rows are kept only when every requested
 * cell is valid, so all returned columns stay aligned with `rowNumbers`.
 */
export function scanTable(text: string, plan: RequestPlan, options: CsvOptions = {}, storage: ScanStorage = {}): TableResult {
  const { table } = scanTablePiece(text, plan, options, null, storage);
  return { ...table, warnings: [...table.warnings, ...summaryWarnings(table.blankLines, table.skipped, table.rowsRead)] };
}

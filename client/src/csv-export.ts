/**
 * CSV export of the bins table. A cell whose text begins with = + - @ (or a tab / carriage
 * return, which some spreadsheets strip before looking) would be run as a formula when the
 * file is opened in a spreadsheet; such cells are prefixed with an apostrophe and quoted.
 * OWASP "CSV Injection" guidance. Numbers are written as plain numbers; a negative number is
 * data, not a formula, so it is left alone (it is written by us, not taken from user text).
 */

export type CsvCell = string | number | null;

/** Quote and neutralise one cell (RFC 4180 quoting: fields with , " CR LF are quoted, " doubled). */
export function csvCell(value: CsvCell): string {
  if (value === null) return '';
  if (typeof value === 'number') {
    if (Number.isNaN(value)) return 'NaN';
    if (value === Infinity) return 'Inf';
    if (value === -Infinity) return '-Inf';
    return String(value);
  }
  let text = value;
  const formulaLike = /^[=+\-@\t\r]/.test(text);
  if (formulaLike) text = `'${text}`;
  if (formulaLike || /[",\r\n]/.test(text)) return `"${text.replace(/"/g, '""')}"`;
  return text;
}

export function csvRow(cells: readonly CsvCell[]): string {
  return cells.map(csvCell).join(',');
}

export function csvDocument(rows: readonly (readonly CsvCell[])[]): string {
  return rows.map(csvRow).join('\r\n') + '\r\n';
}

/**
 * The column list of a loaded CSV, read with the core's CSV reader (the same code the server
 * and the CLI use), so the page offers exactly the columns the analysis will see. Only the
 * header and the first rows are read here; the values themselves are read by the server.
 */
import { parseStrictNumber, readColumns } from '../../core/index.js';

export interface ColumnChoice {
  /** 1-based index, sent to the server (unambiguous even when names repeat). */
  readonly index: number;
  /** The name shown (header name, or #i). */
  readonly label: string;
}

/** The first `lines` lines of the text (enough to see the header and judge the columns). */
function head(text: string, lines: number): string {
  let at = 0;
  for (let i = 0; i < lines; i++) {
    const next = text.indexOf('\n', at);
    if (next < 0) return text;
    at = next + 1;
  }
  return text.slice(0, at);
}

/** Does the first non-blank line start with a number (so the text has no header line)? */
export function firstLineIsNumber(text: string, decimal: '.' | ','): boolean {
  // Only the start is looked at: splitting a 10^6-row text would hold the page for a long moment.
  const line = head(text, 64).replace(/^\uFEFF/, '').split(/\r\n|\r|\n/).find((l) => l.trim() !== '');
  if (line === undefined) return false;
  // With decimal commas the comma is part of a number, so only ; and tab separate fields.
  const first = line.split(decimal === ',' ? /[;\t]/ : /[,;\t]/)[0] ?? line;
  return Number.isFinite(parseStrictNumber(first.trim().replace(/^"(.*)"$/, '$1'), decimal));
}

export interface ColumnScan {
  readonly columns: readonly ColumnChoice[];
  /** The suggested value column: the first mostly-numeric column that is not an identifier. */
  readonly suggested: number;
}

const ID_LIKE = /^(id|index|row|no\.?|nr|#|serial|sample|unit|item|date|time|year)$/i;

export function scanColumns(text: string, options: { header: boolean; decimal: '.' | ',' }): ColumnScan {
  const sample = head(text, 200);
  const probe = readColumns(sample, [{ select: 1, kind: 'text' }], { header: true, decimal: options.decimal, skipInvalid: true });
  const fieldCount = Math.max(1, probe.header.length);
  const columns: ColumnChoice[] = [];
  for (let j = 0; j < fieldCount; j++) {
    const name = options.header ? (probe.header[j] ?? '') : '';
    columns.push({ index: j + 1, label: name !== '' ? name : `#${j + 1}` });
  }
  let suggested = 1;
  let found = false;
  for (const c of columns) {
    try {
      const t = readColumns(sample, [{ select: c.index, kind: 'number' }], { header: options.header, decimal: options.decimal, skipInvalid: true });
      const kept = t.columns[0]?.kind === 'number' ? t.columns[0].values.length : 0;
      if (kept >= Math.max(1, t.rowsRead / 2) && !ID_LIKE.test(c.label.trim())) {
        suggested = c.index;
        found = true;
        break;
      }
    } catch {
      // not a usable column; keep looking
    }
  }
  if (!found && columns.length > 0) suggested = columns[0]!.index;
  return { columns, suggested };
}

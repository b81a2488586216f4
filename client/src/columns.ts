/**
 * The column list of a loaded CSV, read with the core's CSV reader (the same code the server
 * and the CLI use), so the page offers exactly the columns the analysis will see. Only the
 * header and the first rows are read here; the values themselves are read by the server.
 */
import { PEAK_COLUMN, looksLikePeakFile, parseStrictNumber, readColumns } from '../../core/index.js';

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
  /** The suggested value column: the first mostly-numeric column that is neither an identifier nor a row number. */
  readonly suggested: number;
}

/** Header names of identifier and row-number columns (common practice, no source). */
const ID_LIKE = /^(id|index|row|rows|no\.?|nr\.?|n°|#|lfd\.?\s*nr\.?|serial|sample|unit|item|date|time|year|pos|position)$/i;

/** Is `values` the row numbers 1, 2, ..., n (or 0, 1, ..., n − 1) in order? Such a column counts rows; it is not a measurement. */
export function isRowNumbers(values: ArrayLike<number>): boolean {
  if (values.length < 3) return false;
  const start = values[0];
  if (start !== 0 && start !== 1) return false;
  for (let i = 1; i < values.length; i++) if (values[i] !== start + i) return false;
  return true;
}

export function scanColumns(text: string, options: { header: boolean; decimal: '.' | ',' }): ColumnScan {
  // A peak file (tab-separated, '#' comments): its columns are named by the header after the comments, the peaks are peak_va.
  if (looksLikePeakFile(text)) {
    const line = head(text, 200).split(/\r?\n/).find((l) => !l.startsWith('#') && l.trim() !== '') ?? '';
    const columns = line.split('\t').map((name, j) => ({ index: j + 1, label: name.trim() !== '' ? name.trim() : `#${j + 1}` }));
    return { columns, suggested: columns.find((c) => c.label === PEAK_COLUMN)?.index ?? 1 };
  }
  const sample = head(text, 200);
  const probe = readColumns(sample, [{ select: 1, kind: 'text' }], { header: true, decimal: options.decimal, skipInvalid: true });
  const fieldCount = Math.max(1, probe.header.length);
  const columns: ColumnChoice[] = [];
  for (let j = 0; j < fieldCount; j++) {
    const name = options.header ? (probe.header[j] ?? '') : '';
    columns.push({ index: j + 1, label: name !== '' ? name : `#${j + 1}` });
  }
  let suggested = 0;
  let firstNumeric = 0;
  for (const c of columns) {
    try {
      const t = readColumns(sample, [{ select: c.index, kind: 'number' }], { header: options.header, decimal: options.decimal, skipInvalid: true });
      const col = t.columns[0];
      const values = col?.kind === 'number' ? col.values : new Float64Array(0);
      if (values.length < Math.max(1, t.rowsRead / 2)) continue;
      if (firstNumeric === 0) firstNumeric = c.index;
      if (!ID_LIKE.test(c.label.trim()) && !isRowNumbers(values)) {
        suggested = c.index;
        break;
      }
    } catch {
      // not a usable column; keep looking
    }
  }
  // No measurement-like column: rather a named column (whose problem the reader will state) than the row numbers.
  if (suggested === 0) suggested = columns.find((c) => c.index !== firstNumeric && !ID_LIKE.test(c.label.trim()))?.index ?? columns[0]?.index ?? 1;
  return { columns, suggested };
}

/** What the first lines say about the decimal mark. */
export interface DecimalGuess {
  /** The mark to read with. */
  readonly mark: '.' | ',';
  /** True when the cells point to a decimal comma but could also be thousands separators (e.g. 1,250). */
  readonly ambiguous: boolean;
  /** A cell that shows it (for the note on screen), or ''. */
  readonly example: string;
}

const COMMA_DECIMAL = /^[+-]?\d*,\d+([eE][+-]?\d+)?$/;
const COMMA_THOUSANDS = /^[+-]?\d{1,3},\d{3}$/;
const POINT_DECIMAL = /^[+-]?\d*\.\d+([eE][+-]?\d+)?$/;

/**
 * Guess the decimal mark from the first 64 lines: cells like 12,5 in a file whose fields are split
 * by semicolons or tabs, and no cell like 12.5, mean a decimal comma (the spreadsheet export of
 * locales that write 12,5). A comma-separated file cannot hold unquoted decimal commas, so it reads
 * with a point. Cells that could also be thousands separators (1,250) make the guess ambiguous:
 * the page offers the comma and keeps the point. The CLI never guesses; it hints per cell
 * (core/csv numberHint: "it looks like a decimal comma"). Common practice, no source.
 */
export function guessDecimal(text: string): DecimalGuess {
  const lines = head(text, 64).replace(/^\uFEFF/, '').split(/\r\n|\r|\n/).filter((l) => l.trim() !== '');
  const splitter = lines.some((l) => l.includes(';')) ? ';' : lines.some((l) => l.includes('\t')) ? '\t' : null;
  // Without semicolons or tabs, commas separate fields unless every line is one number (a pasted column).
  if (splitter === null && lines.some((l) => l.includes(',') && !COMMA_DECIMAL.test(l.trim().replace(/^"(.*)"$/, '$1').trim()))) {
    return { mark: '.', ambiguous: false, example: '' };
  }
  let comma = 0;
  let thousands = 0;
  let point = 0;
  let example = '';
  for (const line of lines) {
    const cells = splitter ? line.split(splitter) : [line];
    for (const raw of cells) {
      const cell = raw.trim().replace(/^"(.*)"$/, '$1').trim();
      if (COMMA_DECIMAL.test(cell)) {
        comma++;
        if (COMMA_THOUSANDS.test(cell)) thousands++;
        if (example === '') example = cell;
      } else if (POINT_DECIMAL.test(cell)) point++;
    }
  }
  // One column pasted with decimal commas and no separator at all: the same evidence.
  if (comma > 0 && point === 0) return { mark: thousands === comma ? '.' : ',', ambiguous: thousands === comma, example };
  return { mark: '.', ambiguous: false, example: '' };
}

/** A column that looks like the key of several series pooled in one file (a gauge, a part number, a site). */
export interface SeriesKey {
  readonly index: number;
  readonly label: string;
  /** The different labels seen in the first rows, in order of appearance. */
  readonly labels: readonly string[];
}

/**
 * A column of text labels that splits the rows into runs (G01 G01 … G02 G02 …): the long-table
 * layout of several series in one file, which fitted as one sample pools different populations.
 * Looked at on the first 200 rows: every cell filled, not numbers, at least two labels, each label
 * on one unbroken run of rows, and at least three rows per label on average. A subgroup column is
 * passed over (subgroups belong to one process by design), as are the columns in `skip` (the value
 * column and the roles). Common practice, no source.
 */
export function seriesKeyColumn(text: string, options: { header: boolean; decimal: '.' | ',' }, columns: readonly ColumnChoice[], skip: readonly number[]): SeriesKey | null {
  const sample = head(text, 200);
  for (const c of columns) {
    if (skip.includes(c.index) || /sub\s*-?group/i.test(c.label)) continue;
    let texts: readonly string[];
    try {
      const t = readColumns(sample, [{ select: c.index, kind: 'text' }], { header: options.header, decimal: options.decimal, skipInvalid: true });
      const col = t.columns[0];
      texts = col?.kind === 'text' ? col.texts.map((s) => s.trim()) : [];
    } catch {
      continue;
    }
    if (texts.length < 6 || texts.some((s) => s === '' || Number.isFinite(parseStrictNumber(s, options.decimal)))) continue;
    const labels: string[] = [];
    let runs = 0;
    for (let i = 0; i < texts.length; i++) {
      if (i > 0 && texts[i] === texts[i - 1]) continue;
      runs++;
      if (!labels.includes(texts[i]!)) labels.push(texts[i]!);
    }
    if (labels.length >= 2 && runs === labels.length && texts.length >= 3 * labels.length) return { index: c.index, label: c.label, labels };
  }
  return null;
}

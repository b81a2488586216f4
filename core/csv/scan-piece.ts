/**
 * The CSV scanner: one pass over the char codes of a text (a whole file, or one piece of a file read
 * in pieces), no row objects, no split() arrays. Quoting follows RFC 4180 (a field that starts with a
 * double quote runs to the matching quote; a doubled quote inside is one quote; delimiters and line
 * breaks inside quotes are data). Line ends: CRLF, LF and a lone CR. A leading byte-order mark is
 * ignored. Row numbers are 1-based physical lines of the file (the header is line 1 when the file
 * starts with it); a record spanning lines is numbered by its first line.
 */
import { InputError } from '../errors.js';
import { classifyCell, numberHint, REASON_WORDS } from './classify.js';
import { columnLabel, headerWarnings, resolveColumn } from './columns.js';
import { detectDelimiter } from './delimiter.js';
import { parseNumberRange, type NumberFailure } from './number.js';
import { AT, KEPT, LINE, NEXT_D, NEXT_LF, ROWS_READ, scanPlainRows, type PlainRowState } from './plain-rows.js';
import { CR, LF, QUOTE, SPACE, TAB, afterQuote, checkText, isBlankRange, isBlankRecord, readRecordStrings, showValue, unquote, unterminated, type Cursor } from './record.js';
import type { ColumnData, ColumnRequest, CsvOptions, SkipCount, SkipReason, TableResult } from './types.js';

/**
 * How a caller wants the scanner's arrays (all optional; the values are the same either way):
 * `rowNumbers: false` leaves TableResult.rowNumbers empty (a caller that never looks at them saves
 * filling and growing them); `shared` puts the number columns on SharedArrayBuffers (read by another
 * thread without a copy); `handOff`: the caller takes each number column as it is, a view of the
 * grown array (the first 1.02 × its estimated length), instead of an exact copy.
 */
export interface ScanStorage {
  readonly rowNumbers?: boolean;
  readonly shared?: boolean;
  readonly handOff?: boolean;
  /**
   * One number column and no row numbers only: write its values straight into this array (e.g. the
   * column being filled, from its first free place) while they fit; past its end the scanner goes on
   * in an array of its own (with what it had written). The column is then a view of `into` when all fit.
   */
  readonly into?: Float64Array;
}

/** Rows read before the whole text's row count is estimated from them (common practice, no source). */
const ESTIMATE_AFTER_ROWS = 16384;

/** Requests, fixed up front or chosen once the header is known. */
export type RequestPlan =
  | readonly ColumnRequest[]
  | ((header: readonly string[], fieldCount: number) => readonly ColumnRequest[]);

export const REASON_ORDER: readonly SkipReason[] = [
  'blank',
  'missing-marker',
  'nan',
  'infinite',
  'out-of-range',
  'non-numeric',
  'missing-cell',
  'extra-fields',
];

interface SkipTally {
  count: number;
  firstRow: number;
  firstColumn: string;
  firstValue: string;
}

/**
 * What the first piece of a file read in pieces learned, for reading a later piece: the header, the
 * record width, the delimiter, and the file line the later piece starts on (so every row number,
 * in errors, skip counts and `rowNumbers`, is the file's own line).
 */
export interface Continuation {
  readonly header: readonly string[];
  readonly fieldCount: number;
  readonly delimiter: string;
  readonly delimiterDetected: boolean;
  readonly firstLine: number;
}

/** One piece's table with what a next piece needs; its summary warnings are left to the caller. */
export interface TablePiece {
  readonly table: TableResult;
  /** The context a following piece continues from (its `firstLine` is the line after this piece). */
  readonly next: Continuation;
}

/**
 * Read one piece of a CSV text: the whole file or its first piece (`continuation` null: byte-order
 * mark, blank lines, delimiter and header handled here), or a later piece holding whole records
 * only, read with the first piece's context. The result leaves out the summary warnings.
 */
export function scanTablePiece(text: string, plan: RequestPlan, options: CsvOptions, continuation: Continuation | null, storage: ScanStorage = {}): TablePiece {
  const decimal = options.decimal ?? '.';
  if (decimal !== '.' && decimal !== ',') {
    throw new InputError(`decimal separator must be "." or ",", got ${showValue(String(decimal))}`, {}, 'bad-option');
  }
  const decimalCode = decimal === ',' ? 44 : 46;
  const skipInvalid = options.skipInvalid === true;
  const hasHeader = options.header !== false;
  const n = text.length;
  const warnings: string[] = [];

  let i = continuation === null && n > 0 && text.charCodeAt(0) === 0xfeff ? 1 : 0;
  checkText(text, i);
  let line = continuation?.firstLine ?? 1;
  let blankLines = 0;

  // Blank lines before the header.
  for (; continuation === null; ) {
    let k = i;
    while (k < n && ((text.charCodeAt(k) === SPACE) || text.charCodeAt(k) === TAB)) k++;
    if (k >= n) {
      if (k > i) blankLines++;
      i = n;
      break;
    }
    const c = text.charCodeAt(k);
    if (c !== LF && c !== CR) break;
    blankLines++;
    line++;
    i = k + 1;
    if (c === CR && i < n && text.charCodeAt(i) === LF) i++;
  }
  if (i >= n && continuation === null) {
    throw new InputError(
      blankLines > 0 ? 'the file has only blank lines: no header and no data' : 'the file is empty: no header and no data',
      {},
      'bad-input',
    );
  }

  // Delimiter.
  let delimiter: string;
  let delimiterDetected: boolean;
  if (continuation !== null) {
    delimiter = continuation.delimiter;
    delimiterDetected = continuation.delimiterDetected;
  } else if (options.delimiter !== undefined) {
    delimiter = options.delimiter;
    delimiterDetected = false;
    if (delimiter.length !== 1 || delimiter === '"' || delimiter === '\r' || delimiter === '\n') {
      throw new InputError(
        `the delimiter must be one character other than a quote or a line break, got ${showValue(delimiter)}`,
        {},
        'bad-option',
      );
    }
  } else {
    const guess = detectDelimiter(text, i, decimal);
    delimiter = guess.delimiter ?? '';
    delimiterDetected = true;
    warnings.push(...guess.warnings);
  }
  const delim = delimiter === '' ? -1 : delimiter.charCodeAt(0);
  if (decimal === ',' && delimiter === ',' && continuation === null) {
    warnings.push('the delimiter and the decimal separator are both commas: decimal values must be quoted');
  }

  // Header (or the first record's width when there is none).
  const firstLine = line;
  const cur: Cursor = { i, line };
  const first = continuation === null ? readRecordStrings(text, cur, delim, []) : [];
  const fieldCount = continuation?.fieldCount ?? first.length;
  let header: string[];
  if (continuation !== null) {
    header = [...continuation.header];
  } else if (hasHeader) {
    header = first;
    i = cur.i;
    line = cur.line;
    warnings.push(...headerWarnings(header));
    const failure: NumberFailure = { kind: 'syntax' };
    if (header.every((h) => h !== '' && !Number.isNaN(parseNumberRange(h, 0, h.length, decimalCode, failure)))) {
      warnings.push(
        `line ${firstLine} looks like data (every cell is a number) but was read as the header, so it is not among the values; if the file has no header, read it without one`,
      );
    }
  } else {
    header = [];
  }

  // Requests.
  const requests = typeof plan === 'function' ? plan(header, fieldCount) : plan;
  const nSlots = requests.length;
  if (nSlots === 0) throw new InputError('no column requested', {}, 'bad-option');
  const slotField = new Int32Array(nSlots);
  const labels: string[] = [];
  const isNumber = new Uint8Array(nSlots);
  const keepBlank = new Uint8Array(nSlots);
  let maxField = fieldCount - 1;
  for (let s = 0; s < nSlots; s++) {
    const req = requests[s] as ColumnRequest;
    const r = resolveColumn(req.select, header, fieldCount);
    for (let t = 0; t < s; t++) {
      if (slotField[t] === r.field) {
        throw new InputError(`column ${JSON.stringify(r.label)} is requested twice`, { column: r.label }, 'bad-option');
      }
    }
    slotField[s] = r.field;
    labels.push(r.label);
    isNumber[s] = req.kind === 'number' ? 1 : 0;
    keepBlank[s] = req.kind === 'text' && req.keepBlank === true ? 1 : 0;
    if (r.field > maxField) maxField = r.field;
  }
  const slotOf = new Int32Array(maxField + 1).fill(-1);
  for (let s = 0; s < nSlots; s++) slotOf[slotField[s] as number] = s;
  const slotOfLength = slotOf.length;
  const expectedFields = fieldCount;

  // Outputs.
  const keepRows = storage.rowNumbers !== false;
  const allocate = (length: number): Float64Array =>
    storage.shared === true ? new Float64Array(new SharedArrayBuffer(length * Float64Array.BYTES_PER_ELEMENT)) : new Float64Array(length);
  const into = storage.into !== undefined && !keepRows && nSlots === 1 && isNumber[0] === 1 && storage.into.length > 0 ? storage.into : null;
  let cap = into !== null ? into.length : 1024;
  const numbers: (Float64Array | null)[] = [];
  const texts: (string[] | null)[] = [];
  for (let s = 0; s < nSlots; s++) {
    numbers.push(isNumber[s] ? (into ?? allocate(cap)) : null);
    texts.push(isNumber[s] ? null : []);
  }
  let rowNumbers = new Int32Array(keepRows ? cap : 0);
  let kept = 0;
  let rowsRead = 0;
  const dataStart = i;
  let estimated = false;
  /** Room for more rows (kept === cap), `at` = where the scan is: doubling, or once the whole text's estimate. */
  const grow = (at: number): void => {
    let next = Math.max(cap * 2, 1024);
    if (!estimated && kept >= ESTIMATE_AFTER_ROWS) {
      // The rows so far per character, over the whole text (+2 %): one more allocation instead of
      // a doubling every time (common practice, no source).
      estimated = true;
      const estimate = Math.ceil(((kept * (n - dataStart)) / Math.max(1, at - dataStart)) * 1.02);
      if (estimate > next) next = estimate;
    }
    cap = next;
    for (let s = 0; s < nSlots; s++) {
      const arr = numbers[s];
      if (arr) {
        const grown = allocate(cap);
        grown.set(arr);
        numbers[s] = grown;
      }
    }
    if (keepRows) {
      const rows = new Int32Array(cap);
      rows.set(rowNumbers);
      rowNumbers = rows;
    }
  };

  // Per-row cell ranges; state 0 = absent, 1 = plain, 2 = quoted, 3 = quoted with doubled quotes.
  const cellStart = new Int32Array(nSlots);
  const cellEnd = new Int32Array(nSlots);
  const cellState = new Uint8Array(nSlots);
  const rowValues = new Float64Array(nSlots);
  const rowTexts: string[] = new Array<string>(nSlots).fill('');
  const failure: NumberFailure = { kind: 'syntax' };
  const tallies = new Map<SkipReason, SkipTally>();
  const single = nSlots === 1 && isNumber[0] === 1;

  const delimChar = delim >= 0 ? delimiter : '';
  // Positions of the next LF, CR, quote and delimiter at or after i (n = none); -1 = not searched.
  let nextLF = -1;
  let nextCR = -1;
  let nextQ = -1;
  let nextD = -1;
  const plain: PlainRowState = new Int32Array(6);
  /** Where the plain-row loop last stopped (the row there is read below). */
  let plainStop = -1;

  while (i < n) {
    if (nextLF < i) {
      nextLF = text.indexOf('\n', i);
      if (nextLF < 0) nextLF = n;
    }
    if (nextCR < i) {
      nextCR = text.indexOf('\r', i);
      if (nextCR < 0) nextCR = n;
    }
    if (nextQ < i) {
      nextQ = text.indexOf('"', i);
      if (nextQ < 0) nextQ = n;
    }
    // The common rows in a loop of their own (core/csv/plain-rows.ts); back here at the first other row.
    if (single && i !== plainStop) {
      plain[AT] = i;
      plain[KEPT] = kept;
      plain[LINE] = line;
      plain[ROWS_READ] = rowsRead;
      plain[NEXT_LF] = nextLF;
      plain[NEXT_D] = nextD;
      scanPlainRows(text, plain, nextCR < nextQ ? nextCR : nextQ, delimChar, slotField[0] as number, expectedFields, decimalCode, numbers[0] as Float64Array, cap, keepRows ? rowNumbers : null, failure);
      const moved = (plain[AT] as number) !== i;
      i = plain[AT] as number;
      kept = plain[KEPT] as number;
      line = plain[LINE] as number;
      rowsRead = plain[ROWS_READ] as number;
      nextLF = plain[NEXT_LF] as number;
      nextD = plain[NEXT_D] as number;
      plainStop = i;
      if (moved) continue;
    }
    const lineEnd = nextLF < nextCR ? nextLF : nextCR;
    if (lineEnd === i) {
      // An empty line.
      blankLines++;
      line++;
      i++;
      if (lineEnd === nextCR && i < n && text.charCodeAt(i) === LF) i++;
      continue;
    }
    const recordLine = line;
    const recordStart = i;
    let recordEnd = i;
    let field = 0;
    /** 0 = not yet known (checked only if the row turns out invalid), 1 = has content, 2 = blank. */
    let content = 0;
    let extraAt = -1;
    let extraStart = 0;
    let extraEnd = 0;
    for (let s = 0; s < nSlots; s++) cellState[s] = 0;

    if (nextQ >= lineEnd) {
      // No quote on this line: find the fields with indexOf.
      let fs = i;
      for (;;) {
        let fe: number;
        if (delim >= 0) {
          if (nextD < fs) {
            nextD = text.indexOf(delimChar, fs);
            if (nextD < 0) nextD = n;
          }
          fe = nextD < lineEnd ? nextD : lineEnd;
        } else {
          fe = lineEnd;
        }
        const slot = field < slotOfLength ? (slotOf[field] as number) : -1;
        if (slot >= 0) {
          cellStart[slot] = fs;
          cellEnd[slot] = fe;
          cellState[slot] = 1;
        } else if (field >= expectedFields && extraAt < 0 && !isBlankRange(text, fs, fe)) {
          extraAt = field;
          extraStart = fs;
          extraEnd = fe;
        }
        if (fe >= lineEnd) break;
        fs = fe + 1;
        field++;
      }
      recordEnd = lineEnd;
      i = lineEnd;
      if (i < n) {
        const c = text.charCodeAt(i);
        i++;
        if (c === CR && i < n && text.charCodeAt(i) === LF) i++;
      }
      line++;
    } else {
      // A quote on this line: scan char by char (quoted fields may span lines).
      let c = 0;
      let hasContent = false;
      for (;;) {
        const slot = field < slotOfLength ? (slotOf[field] as number) : -1;
        let fs: number;
        let fe: number;
        let state = 1;
        if (i < n && text.charCodeAt(i) === QUOTE) {
          i++;
          fs = i;
          state = 2;
          for (;;) {
            if (i >= n) throw unterminated(recordLine, columnLabel(header, field));
            c = text.charCodeAt(i);
            if (c === QUOTE) {
              if (i + 1 < n && text.charCodeAt(i + 1) === QUOTE) {
                state = 3;
                i += 2;
                continue;
              }
              break;
            }
            if (c === LF) line++;
            else if (c === CR) {
              line++;
              if (i + 1 < n && text.charCodeAt(i + 1) === LF) i++;
            }
            i++;
          }
          fe = i;
          i++;
          while (i < n && ((c = text.charCodeAt(i)) === SPACE || c === TAB) && c !== delim) i++;
          if (i < n && (c = text.charCodeAt(i)) !== delim && c !== LF && c !== CR) {
            throw afterQuote(recordLine, columnLabel(header, field), text, i);
          }
          hasContent = true;
        } else {
          fs = i;
          if (delim >= 0) {
            while (i < n) {
              c = text.charCodeAt(i);
              if (c === delim || c === LF || c === CR) break;
              i++;
            }
          } else {
            while (i < n) {
              c = text.charCodeAt(i);
              if (c === LF || c === CR) break;
              i++;
            }
          }
          fe = i;
          if (!hasContent && fe > fs && !isBlankRange(text, fs, fe)) hasContent = true;
        }
        if (slot >= 0) {
          cellStart[slot] = fs;
          cellEnd[slot] = fe;
          cellState[slot] = state;
        } else if (field >= expectedFields && extraAt < 0 && (state !== 1 || !isBlankRange(text, fs, fe))) {
          extraAt = field;
          extraStart = fs;
          extraEnd = fe;
        }
        if (i >= n) break;
        c = text.charCodeAt(i);
        i++;
        if (c === delim) {
          field++;
          continue;
        }
        if (c === CR && i < n && text.charCodeAt(i) === LF) i++;
        line++;
        break;
      }

      content = hasContent ? 1 : 2;
    }

    if (content === 2) {
      blankLines++;
      continue;
    }
    rowsRead++;

    // Fast path: one numeric column, plain cell, valid number.
    if (single && extraAt < 0 && cellState[0] === 1) {
      const v = parseNumberRange(text, cellStart[0] as number, cellEnd[0] as number, decimalCode, failure);
      if (v === v) {
        if (kept === cap) grow(i);
        (numbers[0] as Float64Array)[kept] = v;
        if (keepRows) rowNumbers[kept] = recordLine;
        kept++;
        continue;
      }
    }

    // General path.
    let badReason: SkipReason | null = null;
    let badColumn = '';
    let badValue = '';
    let badDetail = '';
    if (extraAt >= 0) {
      badReason = 'extra-fields';
      badColumn = columnLabel(header, extraAt);
      badValue = text.slice(extraStart, extraEnd).trim();
      badDetail = `the row has more fields than the ${hasHeader ? 'header' : 'first row'} (${expectedFields}); is there an unquoted delimiter inside a value?`;
    } else {
      for (let s = 0; s < nSlots; s++) {
        const state = cellState[s] as number;
        if (state === 0) {
          badReason = 'missing-cell';
          badColumn = labels[s] as string;
          badDetail = `the row ends before this column (it has ${field + 1} field${field === 0 ? '' : 's'})`;
          break;
        }
        const a = cellStart[s] as number;
        const b = cellEnd[s] as number;
        if (isNumber[s]) {
          const v =
            state === 3
              ? Number.NaN
              : parseNumberRange(text, a, b, decimalCode, failure);
          if (v !== v) {
            if (state === 3) failure.kind = 'syntax';
            const trimmed = unquote(text, a, b, state === 3).trim();
            badReason = classifyCell(trimmed, failure);
            badColumn = labels[s] as string;
            badValue = trimmed;
            break;
          }
          rowValues[s] = v;
        } else {
          const t = unquote(text, a, b, state === 3).trim();
          if (t === '' && !keepBlank[s]) {
            badReason = 'blank';
            badColumn = labels[s] as string;
            break;
          }
          rowTexts[s] = t;
        }
      }
    }

    if (badReason !== null && content === 0 && isBlankRecord(text, recordStart, recordEnd, delim)) {
      rowsRead--;
      blankLines++;
      continue;
    }
    if (badReason !== null) {
      if (!skipInvalid) {
        let message: string;
        if (badReason === 'extra-fields') {
          message = `row ${recordLine}, column ${JSON.stringify(badColumn)}: ${badDetail}`;
        } else if (badReason === 'missing-cell') {
          message = `row ${recordLine}, column ${JSON.stringify(badColumn)}: ${badDetail}`;
        } else if (badReason === 'blank') {
          message = `row ${recordLine}, column ${JSON.stringify(badColumn)}: the cell is blank`;
        } else {
          const words = badReason === 'non-numeric' ? 'is not a number' : `is not a usable number (${REASON_WORDS[badReason]})`;
          const hint = badReason === 'non-numeric' ? numberHint(badValue, decimal) : '';
          message = `row ${recordLine}, column ${JSON.stringify(badColumn)}: ${showValue(badValue)} ${words}${hint ? `; ${hint}` : ''}`;
        }
        throw new InputError(
          message,
          { row: recordLine, column: badColumn, value: badValue },
          badReason === 'extra-fields' ? 'csv-parse' : 'not-a-number',
        );
      }
      const t = tallies.get(badReason);
      if (t) t.count++;
      else tallies.set(badReason, { count: 1, firstRow: recordLine, firstColumn: badColumn, firstValue: badValue });
      continue;
    }

    if (kept === cap) grow(i);
    for (let s = 0; s < nSlots; s++) {
      const arr = numbers[s];
      if (arr) arr[kept] = rowValues[s] as number;
      else (texts[s] as string[]).push(rowTexts[s] as string);
    }
    if (keepRows) rowNumbers[kept] = recordLine;
    kept++;
  }

  const skipped: SkipCount[] = [];
  for (const reason of REASON_ORDER) {
    const t = tallies.get(reason);
    if (t) skipped.push({ reason, count: t.count, firstRow: t.firstRow, firstColumn: t.firstColumn, firstValue: t.firstValue });
  }

  const columns: ColumnData[] = [];
  for (let s = 0; s < nSlots; s++) {
    const arr = numbers[s];
    const column = labels[s] as string;
    const index = (slotField[s] as number) + 1;
    if (arr) {
      let values: Float64Array;
      if (storage.handOff === true || arr === into) values = arr.subarray(0, kept);
      else if (storage.shared === true) {
        values = allocate(kept); // slice() would give an ordinary ArrayBuffer
        values.set(arr.subarray(0, kept));
      } else values = arr.slice(0, kept);
      columns.push({ kind: 'number', column, index, values });
    }
    else columns.push({ kind: 'text', column, index, texts: texts[s] as string[] });
  }
  return {
    table: {
      columns,
      rowNumbers: keepRows ? rowNumbers.slice(0, kept) : rowNumbers,
      rowsRead,
      skipped,
      blankLines,
      delimiter,
      delimiterDetected,
      header,
      warnings,
    },
    next: { header, fieldCount, delimiter, delimiterDetected, firstLine: line },
  };
}

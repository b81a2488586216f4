/**
 * Reading one numeric column of a file too large to hold as one string: the caller decodes the
 * file's bytes in chunks and hands the text over piece by piece; each piece is cut after the last
 * record that ends in it (a line break outside quotes, RFC 4180), read by the same scanner with the
 * first piece's header and delimiter, and the counts are merged. The result equals readColumn on the
 * whole text: the same values, row numbers, counts, warnings and errors.
 */
import { columnPlan, columnResult } from './column.js';
import { REASON_ORDER, scanTablePiece, summaryWarnings, type Continuation } from './table.js';
import type { ColumnOptions, ColumnResult, NumberColumn, SkipCount } from './types.js';

const LF = 10;
const CR = 13;
const QUOTE = 34;

/**
 * Index just past the last complete record of `text` (0 when none ends in it): after the last line
 * break outside quotes. A CR at the very end is not taken unless `atEnd` (its LF may come next).
 */
export function lastRecordEnd(text: string, atEnd: boolean): number {
  let inQuote = false;
  let end = 0;
  const n = text.length;
  let i = 0;
  while (i < n) {
    if (inQuote) {
      const q = text.indexOf('"', i);
      if (q < 0) break;
      // A doubled quote stays inside; a single one closes (RFC 4180 §2.7).
      if (q + 1 < n && text.charCodeAt(q + 1) === QUOTE) i = q + 2;
      else {
        inQuote = false;
        i = q + 1;
      }
      continue;
    }
    const q = text.indexOf('"', i);
    const stop = q < 0 ? n : q;
    // The last line break before the next quote.
    let k = stop - 1;
    while (k >= i) {
      const c = text.charCodeAt(k);
      if (c === LF || c === CR) break;
      k--;
    }
    if (k >= i) {
      const c = text.charCodeAt(k);
      if (c === CR && k === n - 1 && !atEnd) {
        // Maybe the first half of CRLF: end before it, at an earlier break if any.
        let j = k - 1;
        while (j >= i && text.charCodeAt(j) !== LF && text.charCodeAt(j) !== CR) j--;
        if (j >= i) end = j + 1;
      } else end = k + 1;
    }
    if (q < 0) break;
    inQuote = true;
    i = q + 1;
  }
  return end;
}

function mergeSkipped(into: Map<string, SkipCount>, more: readonly SkipCount[]): void {
  for (const s of more) {
    const had = into.get(s.reason);
    if (!had) into.set(s.reason, s);
    else into.set(s.reason, { ...had, count: had.count + s.count });
  }
}

/** Values past which the array grows by a quarter and is handed out without a copy. */
const BIG = 1 << 22;

/** Accumulates one column over pieces of a file's text (in order); `finish` gives the ColumnResult. */
export class ColumnPieces {
  private values: Float64Array;
  private kept = 0;
  private rowsRead = 0;
  private blankLines = 0;
  private readonly skipped = new Map<string, SkipCount>();
  private next: Continuation | null = null;
  private first: ColumnResult | null = null;
  private columnIndex = 0;

  /**
   * `shared`: keep the values on a SharedArrayBuffer, so that a second thread can read them
   * without a copy (the CLI's large single series, cli/second-thread.ts).
   */
  constructor(
    private readonly options: ColumnOptions,
    private readonly storage: { readonly shared?: boolean } = {},
  ) {
    this.values = this.allocate(1 << 16);
  }

  private allocate(length: number): Float64Array {
    return this.storage.shared === true ? new Float64Array(new SharedArrayBuffer(length * Float64Array.BYTES_PER_ELEMENT)) : new Float64Array(length);
  }

  /** Read one piece: whole records only (cut with lastRecordEnd), the file's first piece first. */
  add(text: string): void {
    if (text.length === 0) return;
    const plan = this.next === null ? columnPlan(this.options) : [{ select: this.columnIndex, kind: 'number' as const }];
    // Row numbers are not kept.
    // The values are written straight into the column's free room (no array per piece, no copy);
    // those past its end, if any, are appended.
    const room = this.kept < this.values.length ? this.values.subarray(this.kept) : undefined;
    const piece = scanTablePiece(text, plan, this.options, this.next, { rowNumbers: false, handOff: true, ...(room ? { into: room } : {}) });
    const col = piece.table.columns[0] as NumberColumn;
    if (this.first === null) {
      this.first = columnResult(piece.table);
      this.columnIndex = col.index;
    }
    if (room !== undefined && col.values.buffer === room.buffer && col.values.byteOffset === room.byteOffset) this.kept += col.values.length;
    else this.append(col.values);
    this.rowsRead += piece.table.rowsRead;
    this.blankLines += piece.table.blankLines;
    mergeSkipped(this.skipped, piece.table.skipped);
    this.next = piece.next;
  }

  /** Values read so far. */
  get count(): number {
    return this.kept;
  }

  /**
   * Make room for about `rows` values in all, once the first piece shows how many bytes a row takes,
   * so that a large file is not copied at every doubling of the array.
   */
  reserve(rows: number): void {
    if (!(rows > this.values.length)) return;
    const grown = this.allocate(Math.ceil(rows));
    grown.set(this.values.subarray(0, this.kept));
    this.values = grown;
  }

  private append(v: Float64Array): void {
    if (this.kept + v.length > this.values.length) {
      // Doubling while small; past 2^22 values by a quarter, so that a reserve that fell a little
      // short does not leave 10^8 values in an array of twice their size.
      let cap = this.values.length;
      while (cap < this.kept + v.length) cap = cap < BIG ? cap * 2 : Math.ceil(cap * 1.25);
      const grown = this.allocate(cap);
      grown.set(this.values.subarray(0, this.kept));
      this.values = grown;
    }
    this.values.set(v, this.kept);
    this.kept += v.length;
  }

  finish(): ColumnResult {
    if (this.first === null) {
      // Nothing was read: let the scanner say so as it would for the whole (empty) text.
      return columnResult(scanTablePiece('', columnPlan(this.options), this.options, null).table);
    }
    const skipped = REASON_ORDER.map((r) => this.skipped.get(r)).filter((s): s is SkipCount => s !== undefined);
    const firstWarnings = this.first.warnings;
    // The array itself when it is (nearly) full or large, not a copy: a copy of 10^7 values is 80 MB more.
    const values = this.kept >= 0.9 * this.values.length || this.kept >= BIG ? this.values.subarray(0, this.kept) : this.values.slice(0, this.kept);
    return {
      ...this.first,
      values,
      rowsRead: this.rowsRead,
      blankLines: this.blankLines,
      skipped,
      warnings: [...firstWarnings, ...summaryWarnings(this.blankLines, skipped, this.rowsRead)],
    };
  }
}

import { describe, expect, it } from 'vitest';
import { splitLong, splitWide, summaryCsv, type SeriesValues } from '../../core/batch/index.js';

const col = (column: string, texts: string[], rows?: number[]) => ({ column, texts, rows: rows ?? texts.map((_, i) => i + 2) });

describe('splitLong: a key column names the series of each row', () => {
  it('keeps series in order of first appearance with their file rows', () => {
    const out = splitLong(col('gauge', ['B', 'A', 'B', 'A']), col('flow', ['1', '2', '3.5', '4']), null);
    expect(out.map((s) => s.key)).toEqual(['B', 'A']);
    const b = out[0] as SeriesValues;
    expect([...b.values]).toEqual([1, 3.5]);
    expect([...b.rows]).toEqual([2, 4]);
  });

  it("one series' bad cell gives that series an error naming row, column and value; the others are kept", () => {
    const out = splitLong(col('gauge', ['A', 'B', 'A', 'B']), col('flow', ['1', 'x7', '3', '4']), null);
    expect(out[0]?.kind).toBe('values');
    expect(out[1]).toMatchObject({ kind: 'error', key: 'B', row: 3, column: 'flow', value: 'x7' });
    expect((out[1] as { message: string }).message).toMatch(/row 3, column "flow": "x7"/);
  });

  it('a blank value cell (left out by the reader) is a fault of its series', () => {
    // keys read at rows 2..4; the value column has no cell at row 3.
    const out = splitLong(col('k', ['A', 'B', 'A'], [2, 3, 4]), col('v', ['1', '2'], [2, 4]), null);
    expect(out[1]).toMatchObject({ kind: 'error', key: 'B', row: 3, value: '' });
    expect([...(out[0] as SeriesValues).values]).toEqual([1, 2]);
  });

  it('with skipInvalid drops and counts the cell instead', () => {
    const out = splitLong(col('k', ['A', 'A', 'A']), col('v', ['1', 'NA', '2']), null, { skipInvalid: true });
    const a = out[0] as SeriesValues;
    expect([...a.values]).toEqual([1, 2]);
    expect(a.dropped).toEqual([{ reason: 'missing-marker', count: 1, firstRow: 3 }]);
  });

  it('reads a status column aligned with the values', () => {
    const out = splitLong(col('k', ['A', 'A']), col('t', ['10', '20']), col('s', ['1', '0']));
    expect([...((out[0] as SeriesValues).status ?? [])]).toEqual([1, 0]);
    const bad = splitLong(col('k', ['A']), col('t', ['10']), col('s', ['2']));
    expect(bad[0]).toMatchObject({ kind: 'error', column: 's', value: '2' });
  });

  it('decimal commas when asked', () => {
    const out = splitLong(col('k', ['A']), col('v', ['2,5']), null, { decimal: ',' });
    expect([...(out[0] as SeriesValues).values]).toEqual([2.5]);
  });
});

describe('splitWide: one column per series', () => {
  it('blank cells are no value (ragged columns), other invalid cells fault the series', () => {
    const out = splitWide([col('d1', ['1', '', '3']), col('d2', ['5', 'oops'])]);
    expect([...(out[0] as SeriesValues).values]).toEqual([1, 3]);
    expect((out[0] as SeriesValues).dropped).toEqual([{ reason: 'blank', count: 1, firstRow: 3 }]);
    expect(out[1]).toMatchObject({ kind: 'error', key: 'd2', row: 3, value: 'oops' });
  });

  it('two columns with one name are refused by name', () => {
    const out = splitWide([col('x', ['1']), col('x', ['2'])]);
    expect(out[1]).toMatchObject({ kind: 'error', key: 'x' });
  });
});

describe('summaryCsv', () => {
  it('quotes cells per RFC 4180 and leaves nulls empty', () => {
    const csv = summaryCsv([
      { series: 'a,"b"', status: 'error', n: null, dataKind: null, best: null, bestFamily: null, chiSquare: null, andersonDarling: null, quantity: null, estimate: null, lower: null, upper: null, warnings: 0, message: 'bad' },
    ]);
    // RFC 4180 §2: fields with commas or quotes are quoted, inner quotes doubled; CRLF line ends.
    expect(csv.split('\r\n')[1]).toBe('"a,""b""",error,,,,,,,,,,0,bad');
  });
});

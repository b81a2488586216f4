/**
 * How the scanner hands out its arrays (core/csv/scan-piece.ts ScanStorage) changes nothing in what
 * is read: values on shared memory, the values as a view of the grown array, row numbers not kept,
 * and the one-time estimate of the row count (after ESTIMATE_AFTER_ROWS rows) whether it falls short
 * (rows grow longer later) or overshoots (rows grow shorter). Reference: the same scanner's default
 * path, and the numbers the file was written from (Number() of each printed value).
 */
import { describe, expect, it } from 'vitest';
import { readColumn, readColumns } from '../../core/index.js';
import { scanTable } from '../../core/csv/table.js';
import { columnPlan } from '../../core/csv/column.js';

/** Value of data row i (printed with String(), which Number() reads back exactly). */
const value = (i: number): number => ((i * 7919) % 100003) / 100 + 0.5;

/** `rows` data rows; row i has a label padded to `pad(i)` characters (so bytes per row can change midway). */
function csv(rows: number, pad: (i: number) => number): string {
  const out = ['id,load'];
  for (let i = 0; i < rows; i++) out.push(`${'r'.repeat(pad(i))}${i},${value(i)}`);
  return `${out.join('\n')}\n`;
}

const texts: [string, string][] = [
  ['even rows', csv(40_000, () => 3)],
  ['rows longer after the estimate (it falls short)', csv(60_000, (i) => (i < 20_000 ? 1 : 40))],
  ['rows shorter after the estimate (it overshoots)', csv(60_000, (i) => (i < 20_000 ? 40 : 1))],
  ['fewer rows than the estimate waits for', csv(900, () => 2)],
];

describe('the scanner\'s storage options read the same values', () => {
  for (const [name, text] of texts) {
    it(name, () => {
      const plain = readColumn(text, { column: 'load' });
      const rows = text.split('\n').length - 2;
      expect(Array.from(plain.values)).toEqual(Array.from({ length: rows }, (_, i) => value(i)));
      for (const storage of [{ shared: true }, { handOff: true }, { shared: true, handOff: true }]) {
        const r = readColumn(text, { column: 'load' }, storage);
        expect(r.values.length).toBe(plain.values.length);
        expect(Array.from(r.values)).toEqual(Array.from(plain.values));
        expect(Object.prototype.toString.call(r.values.buffer)).toBe(storage.shared === true ? '[object SharedArrayBuffer]' : '[object ArrayBuffer]');
        const { values: _a, ...rest } = r;
        const { values: _b, ...plainRest } = plain;
        expect(rest).toEqual(plainRest);
      }
      // Row numbers: kept by default (and equal to the line numbers), left empty when not wanted.
      const withRows = scanTable(text, columnPlan({ column: 'load' }));
      expect(withRows.rowNumbers.length).toBe(plain.values.length);
      expect(withRows.rowNumbers[0]).toBe(2);
      expect(withRows.rowNumbers[withRows.rowNumbers.length - 1]).toBe(plain.values.length + 1);
      expect(scanTable(text, columnPlan({ column: 'load' }), {}, { rowNumbers: false }).rowNumbers.length).toBe(0);
    });
  }

  it('several columns, rows skipped on the general path: the same table with the estimate', () => {
    const lines = ['load,status'];
    for (let i = 0; i < 50_000; i++) lines.push(i % 997 === 0 ? `NA,1` : `${i / 10},${i % 2}`);
    const text = `${lines.join('\n')}\n`;
    const t = readColumns(text, [{ select: 'load', kind: 'number' }, { select: 'status', kind: 'number' }], { skipInvalid: true });
    const kept = Array.from({ length: 50_000 }, (_, i) => i).filter((i) => i % 997 !== 0);
    const [load, status] = t.columns;
    expect(load?.kind === 'number' && Array.from(load.values)).toEqual(kept.map((i) => i / 10));
    expect(status?.kind === 'number' && Array.from(status.values)).toEqual(kept.map((i) => i % 2));
    expect(t.rowNumbers.length).toBe(50_000 - 51);
    // Every kept row's line number is its data index + 2, skipping the NA rows.
    let j = 0;
    for (let i = 0; i < 50_000; i++) {
      if (i % 997 === 0) continue;
      if (t.rowNumbers[j] !== i + 2) throw new Error(`row number at ${j}`);
      j++;
    }
  });

  it('into: the values written straight into a given array while they fit, else in one of the scanner\'s own', () => {
    const text = csv(30_000, () => 2);
    const expected = Array.from({ length: 30_000 }, (_, i) => value(i));
    const plan = columnPlan({ column: 'load' });
    for (const room of [40_000, 30_000, 29_999, 5, 1]) {
      const into = new Float64Array(room + 3).fill(-1).subarray(3);
      const t = scanTable(text, plan, {}, { rowNumbers: false, into });
      const col = t.columns[0];
      if (col?.kind !== 'number') throw new Error('not a number column');
      expect(Array.from(col.values), `room ${room}`).toEqual(expected);
      const inPlace = col.values.buffer === into.buffer && col.values.byteOffset === into.byteOffset;
      expect(inPlace, `room ${room}`).toBe(room >= 30_000);
      if (inPlace) expect(into[30_000 - 1]).toBe(value(29_999));
    }
    // With row numbers kept, or several columns, `into` is not used.
    const withRows = scanTable(text, plan, {}, { into: new Float64Array(40_000) }).columns[0];
    expect(withRows?.kind === 'number' && withRows.values.length).toBe(30_000);
  });
});

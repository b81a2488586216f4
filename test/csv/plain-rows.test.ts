import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readColumn, readColumns, type TableResult } from '../../core/index.js';

/**
 * One number column is read by the plain-row loop (core/csv/plain-rows.ts) until a row that is not
 * plain, then by the general scanner, then by the loop again. Asking for a text column beside it
 * sends every row through the general scanner only (core/csv/scan-piece.ts, checked against a
 * straightforward RFC 4180 parser in reference.test.ts): both must keep the same values, rows,
 * skips and blank lines, and stop with the same error, on files that mix plain rows with every
 * kind of other row. Source of the rules: RFC 4180 §2; the scanner's own skip reasons.
 */
const row = fc.oneof(
  { weight: 6, arbitrary: fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e9, max: 1e9 }).map((v) => ({ kind: 'plain', v })) },
  fc.constantFrom(
    { kind: 'blank', v: 0 },
    { kind: 'spaces', v: 0 },
    { kind: 'quoted', v: 0 },
    { kind: 'crlf', v: 0 },
    { kind: 'cr', v: 0 },
    { kind: 'na', v: 0 },
    { kind: 'empty-cell', v: 0 },
    { kind: 'missing', v: 0 },
    { kind: 'extra', v: 0 },
    { kind: 'extra-blank', v: 0 },
    { kind: 'padded', v: 0 },
  ),
);

function line(kind: string, v: number, k: number): string {
  const id = `P${k}`;
  switch (kind) {
    case 'plain':
      return `${id},${String(v)},x\n`;
    case 'blank':
      return '\n';
    case 'spaces':
      return '   \n';
    case 'quoted':
      return `${id},"${k}.5",x\n`;
    case 'crlf':
      return `${id},${k}.25,x\r\n`;
    case 'cr':
      return `${id},${k}.75,x\r`;
    case 'na':
      return `${id},NA,x\n`;
    case 'empty-cell':
      return `${id},,x\n`;
    case 'missing':
      return `${id}\n`;
    case 'extra':
      return `${id},${k},x,surplus\n`;
    case 'extra-blank':
      return `${id},${k},x, \n`;
    default:
      return `${id},  ${k}.125 ,x\n`;
  }
}

function outcome(read: () => TableResult): unknown {
  try {
    const t = read();
    const col = t.columns[0];
    return {
      values: col?.kind === 'number' ? [...col.values] : null,
      rows: [...t.rowNumbers],
      rowsRead: t.rowsRead,
      skipped: t.skipped,
      blankLines: t.blankLines,
    };
  } catch (e) {
    return { error: (e as Error).message };
  }
}

describe('the plain-row loop against the general scanner', () => {
  it('same values, rows, skips, blank lines and errors on files mixing plain rows with every other kind of row', () => {
    fc.assert(
      fc.property(fc.array(row, { minLength: 1, maxLength: 60 }), fc.boolean(), fc.boolean(), (rows, skipInvalid, lastEol) => {
        let text = 'part,load,note\n' + rows.map((r, k) => line(r.kind, r.v, k)).join('');
        if (!lastEol) text = text.replace(/[\r\n]+$/, '');
        const options = { skipInvalid, delimiter: ',' };
        const single = outcome(() => readColumns(text, [{ select: 'load', kind: 'number' }], options));
        const general = outcome(() => readColumns(text, [{ select: 'load', kind: 'number' }, { select: 'part', kind: 'text', keepBlank: true }], options));
        expect(single).toEqual(general);
        // readColumn (no row numbers kept) reads the same values.
        if (!('error' in (single as object))) {
          expect([...readColumn(text, { column: 'load', skipInvalid, delimiter: ',' }).values]).toEqual((single as { values: number[] }).values);
        }
      }),
      { seed: 20261205, numRuns: 400 },
    );
  });
});

import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readColumns } from '../../core/index.js';

/**
 * A deliberately simple RFC 4180 record parser (char by char, building arrays), used as the
 * straightforward reference for the one-pass scanner. Line ends: CRLF, LF or CR.
 */
function referenceRecords(text: string, delim: string): string[][] {
  const records: string[][] = [];
  let record: string[] = [];
  let field = '';
  let quoted = false;
  let i = 0;
  while (i < text.length) {
    const c = text[i] as string;
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') {
        field += '"';
        i += 2;
        continue;
      }
      if (c === '"') quoted = false;
      else field += c;
      i++;
      continue;
    }
    if (c === '"' && field === '') quoted = true;
    else if (c === delim) {
      record.push(field);
      field = '';
    } else if (c === '\n' || c === '\r') {
      record.push(field);
      records.push(record);
      record = [];
      field = '';
      if (c === '\r' && text[i + 1] === '\n') i++;
    } else field += c;
    i++;
  }
  if (field !== '' || record.length > 0) {
    record.push(field);
    records.push(record);
  }
  return records;
}

const cellText = fc.oneof(
  fc.constant('plain'),
  fc.constant('"with, comma"'),
  fc.constant('"with ""quote"""'),
  fc.constant('"two\nlines"'),
  fc.constant('"cr\r\nlf"'),
);

describe('scanner against a straightforward RFC 4180 parser', () => {
  it('gives the same numbers and texts on random tables', () => {
    // Source: RFC 4180 §2 (the reference parser above implements its rules directly).
    const table = fc.record({
      delim: fc.constantFrom(',', ';', '\t'),
      eol: fc.constantFrom('\n', '\r\n', '\r'),
      rows: fc.array(
        fc.tuple(
          fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e12, max: 1e12 }),
          cellText,
          fc.boolean(),
        ),
        { minLength: 1, maxLength: 40 },
      ),
    });
    fc.assert(
      fc.property(table, ({ delim, eol, rows }) => {
        const lines = [`note${delim}value`];
        for (const [v, t, quoteNumber] of rows) lines.push(`${t}${delim}${quoteNumber ? `"${String(v)}"` : String(v)}`);
        const text = lines.join(eol) + eol;
        const got = readColumns(text, [
          { select: 'value', kind: 'number' },
          { select: 'note', kind: 'text' },
        ]);
        const ref = referenceRecords(text, delim).slice(1);
        const v = got.columns[0];
        const n = got.columns[1];
        if (v?.kind !== 'number' || n?.kind !== 'text') return false;
        expect([...v.values]).toEqual(ref.map((r) => Number(r[1])));
        expect(n.texts).toEqual(ref.map((r) => (r[0] as string).trim()));
        return got.delimiter === delim;
      }),
      { seed: 4180, numRuns: 300 },
    );
  });
});

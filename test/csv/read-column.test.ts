import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { InputError, readColumn, readColumns, type PlumblineError } from '../../core/index.js';

/** The error thrown by `f`, which must throw an InputError. */
function errorOf(f: () => unknown): PlumblineError {
  try {
    f();
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return e as PlumblineError;
  }
  throw new Error('expected an InputError, nothing was thrown');
}

const values = (text: string, options = {}): number[] => [...readColumn(text, options).values];

describe('delimiters', () => {
  it('detects comma, semicolon and tab from the header and first lines', () => {
    // Source: common practice, no source (spreadsheet CSV exports use these three).
    expect(values('a,b\n1,2\n3,4\n', { column: 'b' })).toEqual([2, 4]);
    expect(values('a;b\n1;2\n3;4\n', { column: 'b' })).toEqual([2, 4]);
    expect(values('a\tb\n1\t2\n3\t4\n', { column: 'b' })).toEqual([2, 4]);
    expect(readColumn('a;b\n1;2\n', { column: 1 }).delimiter).toBe(';');
  });

  it('is not fooled by delimiters inside quoted fields', () => {
    // Source: RFC 4180 §2 rule 6 (fields containing the delimiter are enclosed in double quotes).
    const text = 'name;value\n"Smith, J.";1\n"a,b,c";2\n"x,y";3\n';
    const r = readColumn(text, { column: 'value' });
    expect(r.delimiter).toBe(';');
    expect([...r.values]).toEqual([1, 2, 3]);
  });

  it('prefers semicolon to comma with decimal commas, and takes a given delimiter as is', () => {
    // Source: common practice, no source (decimal-comma locales export with semicolons).
    expect(values('x;y\n1,5;2,5\n3,5;4,5\n', { column: 'y', decimal: ',' })).toEqual([2.5, 4.5]);
    expect(values('x|y\n1|2\n', { column: 'y', delimiter: '|' })).toEqual([2]);
    expect(errorOf(() => readColumn('x\n1\n', { delimiter: '"' })).code).toBe('bad-option');
  });

  it('warns when several delimiters fit, or none fits every line', () => {
    // Source: common practice, no source (a guess that could be wrong is reported, never silent).
    const both = readColumn('a;b,c\n1;2,3\n', { column: 2 });
    expect(both.delimiter).toBe(',');
    expect([...both.values]).toEqual([3]);
    expect(both.warnings.join(' ')).toContain('several delimiters');
    const ragged = readColumn('a,b\n1,2\n3,4,\n5,6\n', { column: 'b' });
    expect(ragged.delimiter).toBe(',');
    expect(ragged.warnings.join(' ')).toContain('do not all have');
    expect([...ragged.values]).toEqual([2, 4, 6]);
  });

  it('treats a header without any candidate delimiter as a single column', () => {
    // Source: common practice, no source.
    const r = readColumn('load_kN\n1.5\n2.5\n');
    expect(r.delimiter).toBe('');
    expect([...r.values]).toEqual([1.5, 2.5]);
    expect(r.column).toBe('load_kN');
  });
});

describe('quoting (RFC 4180)', () => {
  it('reads quoted numbers, doubled quotes and newlines inside quotes, numbering rows by file line', () => {
    // Source: RFC 4180 §2 rules 5-7 (quoted fields, CRLF inside quotes, "" for a quote).
    const text = 'note,v\n"say ""hi""",1\n"two\nlines",2\n"3",3\nplain,"4"\n';
    const r = readColumns(text, [
      { select: 'v', kind: 'number' },
      { select: 'note', kind: 'text' },
    ]);
    const v = r.columns[0];
    const note = r.columns[1];
    expect(v?.kind === 'number' ? [...v.values] : null).toEqual([1, 2, 3, 4]);
    expect(note?.kind === 'text' ? note.texts : null).toEqual(['say "hi"', 'two\nlines', '3', 'plain']);
    // The record that spans lines 3-4 is numbered 3; the next starts on line 5.
    expect([...r.rowNumbers]).toEqual([2, 3, 5, 6]);
  });

  it('gives row numbers after a multi-line quoted field in errors', () => {
    // Source: RFC 4180 §2 rule 6 (line breaks inside quotes are data, not record ends).
    const e = errorOf(() => readColumn('note,v\n"a\nb\nc",1\nx,oops\n', { column: 'v' }));
    expect(e.place).toEqual({ row: 5, column: 'v', value: 'oops' });
  });

  it('refuses an unterminated quote and text after a closing quote, naming the row', () => {
    // Source: RFC 4180 §2 rule 5 (a quoted field ends with a quote followed by a delimiter or line break).
    const open = errorOf(() => readColumn('x\n1\n"2\n3\n'));
    expect(open.code).toBe('csv-parse');
    expect(open.place.row).toBe(3);
    const after = errorOf(() => readColumn('x,y\n"1"2,3\n', { column: 'x' }));
    expect(after.code).toBe('csv-parse');
    expect(after.place.row).toBe(2);
  });
});

describe('line ends, BOM, blank lines', () => {
  it('reads CRLF, LF and lone CR alike and skips a byte-order mark', () => {
    // Source: RFC 4180 §2 rule 1 (CRLF); LF and lone CR are common practice, no source; BOM U+FEFF (Unicode §23.8).
    for (const eol of ['\r\n', '\n', '\r']) {
      const r = readColumn(`\uFEFFdepth${eol}1${eol}2${eol}3${eol}`);
      expect(r.column).toBe('depth');
      expect([...r.values]).toEqual([1, 2, 3]);
      expect(r.blankLines).toBe(0);
    }
  });

  it('passes over blank lines, counts them and keeps file line numbers', () => {
    // Source: common practice, no source (spreadsheets leave empty rows; row numbers are file lines).
    const text = '\nx,y\n1,2\n\n   \n,\n3,4\r\n\r\n5,bad\n';
    const e = errorOf(() => readColumn(text, { column: 'y' }));
    expect(e.place.row).toBe(9); // lines: 1 blank, 2 header, 3 data, 4-6 blank, 7 data, 8 blank, 9 bad
    const r = readColumn(text, { column: 'y', skipInvalid: true });
    expect([...r.values]).toEqual([2, 4]);
    expect(r.blankLines).toBe(5);
    expect(r.rowsRead).toBe(3);
    expect(r.warnings.some((w) => w.includes('5 blank lines'))).toBe(true);
  });
});

describe('invalid cells', () => {
  const text = 'id,wear\n1,10\n2,NA\n3,n/a\n4,-\n5,NaN\n6,inf\n7,\n8,abc\n9,12.5\n10,1e999\n';

  it('stops at the first bad cell with its row, column and value', () => {
    // Source: common practice, no source (NA, n/a, - are the usual missing-value markers).
    const e = errorOf(() => readColumn(text, { column: 'wear' }));
    expect(e.code).toBe('not-a-number');
    expect(e.place).toEqual({ row: 3, column: 'wear', value: 'NA' });
    expect(e.message).toContain('row 3');
    expect(e.message).toContain('"wear"');
    expect(e.message).toContain('"NA"');
  });

  it('with skipInvalid drops such rows and counts every one by reason', () => {
    // Source: common practice, no source; invariant rowsRead = kept + Σ skipped (nothing dropped silently).
    const r = readColumn(text, { column: 'wear', skipInvalid: true });
    expect([...r.values]).toEqual([10, 12.5]);
    expect(r.rowsRead).toBe(10);
    const byReason = Object.fromEntries(r.skipped.map((s) => [s.reason, [s.count, s.firstRow, s.firstValue]]));
    expect(byReason).toEqual({
      blank: [1, 8, ''],
      'missing-marker': [3, 3, 'NA'],
      nan: [1, 6, 'NaN'],
      infinite: [1, 7, 'inf'],
      'out-of-range': [1, 11, '1e999'],
      'non-numeric': [1, 9, 'abc'],
    });
    expect(r.values.length + r.skipped.reduce((a, s) => a + s.count, 0)).toBe(r.rowsRead);
  });

  it('refuses thousands separators and decimal commas unless asked, with a hint', () => {
    // Source: ISO 80000-1 (comma or point as decimal sign, digit groups by thin spaces); never guessed.
    const comma = errorOf(() => readColumn('x;y\n1;2,5\n', { column: 'y' }));
    expect(comma.place.value).toBe('2,5');
    expect(comma.message).toContain('decimal comma');
    const thousands = errorOf(() => readColumn('x\n"1,234.5"\n'));
    expect(thousands.message).toContain('thousands');
    expect(values('x\n"1,5"\n2,25\n', { decimal: ',' })).toEqual([1.5, 2.25]);
  });

  it('refuses rows with more fields than the header, and names a missing cell', () => {
    // Source: RFC 4180 §2 rule 4 (each line should contain the same number of fields).
    const extra = errorOf(() => readColumn('a,b\n1,2\n3,4,5\n', { column: 'b' }));
    expect(extra.code).toBe('csv-parse');
    expect(extra.place.row).toBe(3);
    // Trailing empty fields are tolerated.
    expect(values('a,b\n1,2,,\n', { column: 'b' })).toEqual([2]);
    const short = errorOf(() => readColumn('a,b\n1,2\n3\n', { column: 'b' }));
    expect(short.place).toMatchObject({ row: 3, column: 'b' });
    const r = readColumn('a,b\n1,2\n3\n', { column: 'b', skipInvalid: true });
    expect(r.skipped).toMatchObject([{ reason: 'missing-cell', count: 1, firstRow: 3 }]);
  });

  it('refuses binary input', () => {
    // Source: common practice, no source (a NUL character never occurs in a text CSV).
    const e = errorOf(() => readColumn('x\n1\u00002\n'));
    expect(e.code).toBe('csv-parse');
  });
});

describe('header and column choice', () => {
  it('chooses a column by exact name, then ignoring case, then by 1-based index', () => {
    // Source: common practice, no source.
    const text = 'Load kN,load kn,depth\n1,2,3\n';
    expect(values(text, { column: 'load kn' })).toEqual([2]);
    expect(values(text, { column: 'DEPTH' })).toEqual([3]);
    expect(values(text, { column: 1 })).toEqual([1]);
    expect(values(text, { column: '3' })).toEqual([3]);
    expect(errorOf(() => readColumn(text, { column: 'LOAD KN' })).code).toBe('no-column');
    expect(errorOf(() => readColumn(text, { column: 4 })).message).toContain('3 columns');
    expect(errorOf(() => readColumn(text, { column: 'width' })).message).toContain('"depth"');
  });

  it('refuses an unnamed choice in a file of several columns', () => {
    // Source: common practice, no source.
    expect(errorOf(() => readColumn('a,b\n1,2\n')).code).toBe('no-column');
  });

  it('warns about duplicate and empty names, and such columns can be chosen by index', () => {
    // Source: common practice, no source.
    const text = 'x,x,\n1,2,3\n';
    const r = readColumn(text, { column: 3 });
    expect(r.column).toBe('#3');
    expect([...r.values]).toEqual([3]);
    expect(r.warnings.join(' ')).toContain('appears 2 times');
    expect(r.warnings.join(' ')).toContain('no name');
    expect(errorOf(() => readColumn(text, { column: 'x' })).message).toContain('matches 2 columns');
  });

  it('handles header only, empty and all-blank files', () => {
    // Source: common practice, no source.
    const headerOnly = readColumn('x\n');
    expect(headerOnly.values.length).toBe(0);
    expect(headerOnly.rowsRead).toBe(0);
    expect(errorOf(() => readColumn('')).code).toBe('bad-input');
    expect(errorOf(() => readColumn('\uFEFF')).code).toBe('bad-input');
    expect(errorOf(() => readColumn('\n\n  \n')).message).toContain('blank');
  });

  it('reads files without a header, and warns when a header looks like data', () => {
    // Source: common practice, no source.
    const r = readColumn('1.5,2\n2.5,3\n', { header: false, column: 1 });
    expect([...r.values]).toEqual([1.5, 2.5]);
    expect(r.column).toBe('#1');
    const w = readColumn('1.5\n2.5\n');
    expect([...w.values]).toEqual([2.5]);
    expect(w.warnings.join(' ')).toContain('looks like data');
  });
});

describe('several columns at once', () => {
  it('reads a value, a status and a subgroup column aligned, dropping rows as a whole', () => {
    // Source: common practice, no source (life data with a censoring flag; subgrouped gauge data).
    const text = 'hours,status,rig\n120,1,A\n340,0,B\n,1,A\n510,NA,C\n610,1,\n700,1,B\n';
    const r = readColumns(
      text,
      [
        { select: 'hours', kind: 'number' },
        { select: 'status', kind: 'number' },
        { select: 'rig', kind: 'text' },
      ],
      { skipInvalid: true },
    );
    const [h, s, g] = r.columns;
    expect(h?.kind === 'number' ? [...h.values] : null).toEqual([120, 340, 700]);
    expect(s?.kind === 'number' ? [...s.values] : null).toEqual([1, 0, 1]);
    expect(g?.kind === 'text' ? g.texts : null).toEqual(['A', 'B', 'B']);
    expect([...r.rowNumbers]).toEqual([2, 3, 7]);
    expect(r.rowsRead).toBe(6);
    expect(r.skipped.reduce((a, x) => a + x.count, 0)).toBe(3);
  });

  it('refuses the same column twice', () => {
    // Source: common practice, no source.
    expect(
      errorOf(() =>
        readColumns('a,b\n1,2\n', [
          { select: 'a', kind: 'number' },
          { select: 1, kind: 'number' },
        ]),
      ).code,
    ).toBe('bad-option');
  });
});

describe('committed fixture files', () => {
  const dir = new URL('../fixtures/csv/', import.meta.url);

  it('reads a semicolon, decimal-comma, CRLF, BOM export', () => {
    // Source: test/fixtures/csv/README.md (hand-written; expected values typed in the README).
    const text = readFileSync(new URL('semicolon-decimal-comma.csv', dir), 'utf8');
    const r = readColumn(text, { column: 'Wanddicke mm', decimal: ',' });
    expect([...r.values]).toEqual([4.82, 4.79, 4.91, 4.85]);
    expect(r.delimiter).toBe(';');
  });

  it('reads a tab-separated file with quoted names and NA markers', () => {
    // Source: test/fixtures/csv/README.md (hand-written; expected values typed in the README).
    const text = readFileSync(new URL('tab-quoted-na.tsv', dir), 'utf8');
    const r = readColumn(text, { column: 'strength MPa', skipInvalid: true });
    expect([...r.values]).toEqual([412, 398.5, 405]);
    expect(r.skipped).toMatchObject([{ reason: 'missing-marker', count: 1, firstRow: 4 }]);
  });
});

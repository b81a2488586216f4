/**
 * The reader of large files in pieces gives exactly what the whole-string reader gives: the same
 * values, counts, warnings and errors, whatever the chunk size, on every quoting and line-end case
 * (RFC 4180 quoting; CRLF, LF and lone CR line ends; byte-order marks; UTF-16; Latin-1; multi-byte
 * UTF-8 characters cut by a chunk boundary). Reference: readColumn on the whole text.
 */
import { describe, expect, it } from 'vitest';
import { readColumnInPieces } from '../../cli/read-pieces.js';
import { readInputText } from '../../cli/read-input.js';
import { lastRecordEnd, readColumn, type ColumnOptions } from '../../core/index.js';
import { scratchCsv } from '../helpers/cli.js';

const temp = scratchCsv('plumbline-pieces-');

function outcome(f: () => unknown): unknown {
  try {
    const r = f() as { values: Float64Array };
    return { ...r, values: [...r.values] };
  } catch (e) {
    return { error: (e as Error).message, place: (e as { place?: unknown }).place };
  }
}

const cases: { name: string; bytes: Buffer; options: ColumnOptions }[] = [
  { name: 'LF, plain', bytes: Buffer.from('id,load\nA,1.5\nB,2\nC,3.25\n'), options: { column: 'load' } },
  { name: 'CRLF without a last line end', bytes: Buffer.from('id,load\r\nA,1.5\r\nB,2\r\nC,3'), options: { column: 'load' } },
  { name: 'lone CR line ends', bytes: Buffer.from('id,load\rA,1\rB,2\r\rC,3\r'), options: { column: 'load' } },
  {
    name: 'quoted fields with delimiters, doubled quotes and line breaks inside',
    bytes: Buffer.from('note,load\n"a, ""quoted""\nnote",10\n"x\r\ny",20\nplain,"30"\n"",40\n'),
    options: { column: 'load' },
  },
  { name: 'BOM, blank lines, whitespace lines', bytes: Buffer.from('\uFEFF\n\nid;load\n\n1;2\n  \n3;4\n;\n5;6\n\n'), options: { column: 'load' } },
  { name: 'skip-invalid counts by reason', bytes: Buffer.from('x\n1\nNA\n2\n\n-\nabc\ninf\n3\nNaN\n4\n'), options: { skipInvalid: true } },
  { name: 'a bad cell far into the file (error row)', bytes: Buffer.from(`v\n${Array.from({ length: 200 }, (_, i) => i + 1).join('\n')}\n12;5\n7\n`), options: {} },
  { name: 'decimal commas with semicolons', bytes: Buffer.from('a;b\n1;2,5\n3;4,75\n'), options: { column: 'b', decimal: ',' } },
  { name: 'multi-byte UTF-8 names and text cut by chunks', bytes: Buffer.from('Prüfstück,Länge ✓\n"€ü",1\n"😀",2\nß,3\n'), options: { column: 2 } },
  { name: 'UTF-16LE with its BOM', bytes: Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from('h\r\n1\r\n2\r\n', 'utf16le')]), options: {} },
  { name: 'Latin-1 bytes (not UTF-8)', bytes: Buffer.from([...Buffer.from('Gr'), 0xf6, ...Buffer.from('\xdfe\n1\n2\n'.replace(/[^\n0-9e]/g, '')), ...Buffer.from('3\n')]), options: {} },
  { name: 'more fields than the header (extra-fields counted)', bytes: Buffer.from('a,b\n1,2\n3,4,5\n6,7\n'), options: { column: 'b', skipInvalid: true, delimiter: ',' } },
  { name: 'header only', bytes: Buffer.from('a,b\n'), options: { column: 'b' } },
  { name: 'empty file', bytes: Buffer.from(''), options: {} },
];

describe('reading one column in pieces equals reading the whole text', () => {
  for (const c of cases) {
    it(c.name, () => {
      const file = temp(`${c.name.replace(/[^a-z0-9]+/gi, '-')}.csv`, c.bytes as unknown as string);
      const whole = outcome(() => readColumn(readInputText(file).text, c.options));
      for (const chunk of [1, 2, 3, 5, 7, 16, 64, 4096]) {
        // A first piece of at least 1 character cuts at every record; the default holds the head.
        for (const firstPiece of [1, 12, undefined]) {
          const pieces = outcome(() => readColumnInPieces(file, c.options, chunk, firstPiece).read);
          expect(pieces, `chunk ${chunk} bytes, first piece ${firstPiece ?? 'default'}`).toEqual(whole);
        }
      }
    });
  }
});

describe('lastRecordEnd', () => {
  it('ends after the last line break outside quotes (RFC 4180 §2.6)', () => {
    expect(lastRecordEnd('a\nb', false)).toBe(2);
    expect(lastRecordEnd('a\n"b\nc', false)).toBe(2); // the second break is inside an open quote
    expect(lastRecordEnd('a\n"b""\nc"\nd', false)).toBe(10); // doubled quote stays inside
    expect(lastRecordEnd('abc', false)).toBe(0);
  });

  it('does not cut between CR and LF unless at the end of the file', () => {
    expect(lastRecordEnd('a\r\nb\r', false)).toBe(3);
    expect(lastRecordEnd('a\r\nb\r', true)).toBe(5);
  });
});

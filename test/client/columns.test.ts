/**
 * Spreadsheet files on the page (client/src/columns.ts, state.ts): the decimal mark is read from the
 * text and offered, a byte-order mark and semicolons are handled, and a row-number column is not
 * chosen as the value column. The CLI's own hint for the same cell is core/csv numberHint
 * ("it looks like a decimal comma").
 */
import { describe, expect, it } from 'vitest';
import { guessDecimal, isRowNumbers, scanColumns, seriesKeyColumn } from '../../client/src/columns.js';
import { buildRequest } from '../../client/src/request.js';
import { INITIAL_STATE, update } from '../../client/src/state.js';

/** The file of the report: BOM, semicolons, decimal commas, a row-number column "Nr". */
const SPREADSHEET = '\uFEFFNr;Zeit_h;Last\r\n' + Array.from({ length: 50 }, (_, i) => `${i + 1};${(800 + 13.7 * i).toFixed(1).replace('.', ',')};${(40 + (i % 7) / 10).toFixed(1).replace('.', ',')}`).join('\r\n') + '\r\n';

describe('decimal mark', () => {
  it('semicolon-separated cells like 812,5 mean a decimal comma', () => {
    expect(guessDecimal(SPREADSHEET)).toEqual({ mark: ',', ambiguous: false, example: '800,0' });
  });

  it('a comma-separated file reads with a point', () => {
    expect(guessDecimal('a,b\n1.5,2\n3,4\n').mark).toBe('.');
  });

  it('cells that could be thousands (1,250) are ambiguous: offered, not chosen', () => {
    expect(guessDecimal('x;y\n1,250;2\n3,125;4\n')).toMatchObject({ mark: '.', ambiguous: true });
  });

  it('a pasted single column of decimal commas is a decimal comma', () => {
    expect(guessDecimal('12,5\n13,1\n11,9\n').mark).toBe(',');
  });

  it('a mix of 12.5 and 12,5 stays with the point (the reader then names the odd cells)', () => {
    expect(guessDecimal('x;y\n1,5;2.5\n').mark).toBe('.');
  });
});

describe('row-number columns', () => {
  it('1..n and 0..n−1 in order are row numbers; measurements are not', () => {
    expect(isRowNumbers([1, 2, 3, 4])).toBe(true);
    expect(isRowNumbers([0, 1, 2])).toBe(true);
    expect(isRowNumbers([1, 2, 4])).toBe(false);
    expect(isRowNumbers([2, 3, 4])).toBe(false);
    expect(isRowNumbers([1, 2])).toBe(false);
  });

  it('an unnamed 1..n column is passed over for the measurement', () => {
    expect(scanColumns('a,b\n1,9.5\n2,7.25\n3,8.125\n4,6.5\n', { header: true, decimal: '.' }).suggested).toBe(2);
  });

  it('the BOM, semicolon, decimal-comma file of the report: Zeit_h chosen, not Nr, read with a comma', () => {
    const s = update(INITIAL_STATE, { type: 'source-loaded', source: { kind: 'file', name: 'messung.csv', csv: SPREADSHEET } });
    expect(s.reading.decimal).toBe(',');
    expect(s.reading.columns.map((c) => c.label)).toEqual(['Nr', 'Zeit_h', 'Last']);
    expect(s.reading.column).toBe(2);
    const out = buildRequest(s);
    expect(out.ok && out.built.kind === 'values' && out.built.request.csvOptions?.decimal).toBe(',');
  });

  it('read with a point instead, no column is numeric: still not the row numbers', () => {
    expect(scanColumns(SPREADSHEET, { header: true, decimal: '.' }).suggested).toBe(2);
  });
});

// Several series pooled in one long table (the many-series layout, client/src/batch): a text key
// in unbroken runs. Invented rows in the layout of datasets/gauge-peaks.csv and seal-failure-modes.csv.
describe('seriesKeyColumn: a text column that splits the rows into runs', () => {
  const opts = { header: true, decimal: '.' as const };
  const cols = (text: string) => scanColumns(text, opts).columns;
  const rows = (f: (i: number) => string, n: number) => Array.from({ length: n }, (_, i) => f(i)).join('\n');

  it('a gauge column (G01 × 10, G02 × 10, G03 × 10) beside year and peak: found, labels in order', () => {
    const text = `gauge,year,peak\n${rows((i) => `G0${1 + Math.floor(i / 10)},${1990 + (i % 10)},${100 + i}`, 30)}\n`;
    expect(seriesKeyColumn(text, opts, cols(text), [3])).toEqual({ index: 1, label: 'gauge', labels: ['G01', 'G02', 'G03'] });
  });

  it('unit identifiers (each once), a failure-mode column with blanks, labels that alternate, numeric subgroups: none', () => {
    const units = `seal,hours,status,mode\n${rows((i) => `S${i},${100 + i},${i % 2},${i % 2 ? 'crack' : ''}`, 30)}\n`;
    expect(seriesKeyColumn(units, opts, cols(units), [2])).toBeNull();
    const alternating = `line,x\n${rows((i) => `${i % 2 ? 'A' : 'B'},${i}`, 30)}\n`;
    expect(seriesKeyColumn(alternating, opts, cols(alternating), [2])).toBeNull();
    const subgroups = `subgroup,d\n${rows((i) => `${1 + Math.floor(i / 5)},${25 + i / 1000}`, 30)}\n`;
    expect(seriesKeyColumn(subgroups, opts, cols(subgroups), [2])).toBeNull();
    const textSubgroups = `Sub-group,d\n${rows((i) => `S${1 + Math.floor(i / 5)},${25 + i / 1000}`, 30)}\n`;
    expect(seriesKeyColumn(textSubgroups, opts, cols(textSubgroups), [2])).toBeNull();
  });

  it('the value column and the role columns are never the key', () => {
    const text = `gauge,year,peak\n${rows((i) => `G0${1 + Math.floor(i / 10)},${1990 + (i % 10)},${100 + i}`, 30)}\n`;
    expect(seriesKeyColumn(text, opts, cols(text), [1, 3])).toBeNull();
  });
});

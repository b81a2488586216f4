/**
 * Issue 6's hostile inputs, one table shared by the core, CLI and API suites. Each case is a file's
 * bytes, the reading options, and what must happen: either correct handling (what the values and
 * the accounting must be) or one clear error naming what and where (row, column, value).
 * Expectations are the reader's documented contract (core/csv/types.ts, core/errors.ts) and
 * issue 6's list; the numbers are worked by hand from each tiny file (rationale beside each).
 */
import type { FamilyName, SkipReason } from '../../core/index.js';

export interface ReadOpts {
  readonly column?: string | number;
  readonly decimalComma?: boolean;
  readonly skipInvalid?: boolean;
  readonly noHeader?: boolean;
  readonly families?: readonly FamilyName[];
}

export interface ExpectOk {
  readonly ok: true;
  /** Values analysed. */
  readonly n: number;
  /** Exact values expected (ascending order is not assumed: file order). */
  readonly values?: readonly number[];
  readonly rowsRead?: number;
  readonly skipped?: Partial<Record<SkipReason, number>>;
  readonly blankLines?: number;
  /** A warning about the input (the reader's warnings) must match. */
  readonly inputWarning?: RegExp;
  /** A warning in the report must match. */
  readonly reportWarning?: RegExp;
  /** Families that must be listed as not applicable, with their offending count (null: any count). */
  readonly notApplicable?: Partial<Record<FamilyName, number | null>>;
  /** Families that must be fitted. */
  readonly fitted?: readonly FamilyName[];
}

export interface ExpectError {
  readonly ok: false;
  /** The one-line message must match. */
  readonly message: RegExp;
  /** Where: each given part must appear in the error's place (API, core) and in the CLI's line. */
  readonly place?: { readonly row?: number; readonly column?: string; readonly value?: string };
}

export interface HostileCase {
  readonly name: string;
  readonly bytes: string | Uint8Array;
  readonly opts?: ReadOpts;
  readonly expect: ExpectOk | ExpectError;
}

const lines = (xs: readonly (string | number)[], eol = '\n') => xs.join(eol) + eol;
/** 30 values with plenty of spread (for cases that must be analysed fully). */
const thirty = Array.from({ length: 30 }, (_, i) => (10 + ((i * 37) % 29) * 0.7 + (i % 3) * 0.11).toFixed(2));

export const CASES: readonly HostileCase[] = [
  { name: 'empty file', bytes: '', expect: { ok: false, message: /empty/i } },
  { name: 'only blank lines', bytes: '\n\n  \n', expect: { ok: false, message: /blank|empty/i } },
  // No data under the header: an error that says so (no values to analyse).
  { name: 'header only', bytes: 'load_kN\n', expect: { ok: false, message: /no (data|values)|empty/i } },
  {
    name: 'no header, read without one',
    bytes: lines([1.5, 2, 3.25, 4, 5.5]),
    opts: { noHeader: true },
    expect: { ok: true, n: 5, values: [1.5, 2, 3.25, 4, 5.5], rowsRead: 5 },
  },
  {
    // Read with the default header setting, line 1 is the header: it is not silently lost, a warning says so.
    name: 'no header, header assumed',
    bytes: lines([1.5, 2, 3.25, 4, 5.5]),
    expect: { ok: true, n: 4, values: [2, 3.25, 4, 5.5], rowsRead: 4, inputWarning: /line 1 looks like data/ },
  },
  { name: 'byte-order mark', bytes: `\uFEFF${lines(['x', 1, 2, 3, 4])}`, opts: { column: 'x' }, expect: { ok: true, n: 4, values: [1, 2, 3, 4] } },
  { name: 'CRLF line ends', bytes: lines(['x', 1, 2, 3, 4], '\r\n'), opts: { column: 'x' }, expect: { ok: true, n: 4, values: [1, 2, 3, 4] } },
  { name: 'lone CR line ends', bytes: lines(['x', 1, 2, 3, 4], '\r'), opts: { column: 'x' }, expect: { ok: true, n: 4, values: [1, 2, 3, 4] } },
  {
    name: 'quoted fields with commas and newlines',
    bytes: 'part,"x"\n"A, left",1\n"B\nsecond line",2\n"C ""quoted""",3\nD,"4"\n',
    opts: { column: 'x' },
    expect: { ok: true, n: 4, values: [1, 2, 3, 4], rowsRead: 4 },
  },
  {
    // The record starting on line 3 spans lines 3-4, so the bad cell's record is on line 5.
    name: 'bad cell after a quoted newline',
    bytes: 'part,x\nA,1\n"B\nsecond",2\nC,oops\n',
    opts: { column: 'x' },
    expect: { ok: false, message: /not a number/, place: { row: 5, column: 'x', value: 'oops' } },
  },
  { name: 'semicolon separator', bytes: lines(['id;x', 'a;1', 'b;2', 'c;3', 'd;4']), opts: { column: 'x' }, expect: { ok: true, n: 4, values: [1, 2, 3, 4] } },
  { name: 'tab separator', bytes: lines(['id\tx', 'a\t1', 'b\t2', 'c\t3', 'd\t4']), opts: { column: 'x' }, expect: { ok: true, n: 4, values: [1, 2, 3, 4] } },
  {
    name: 'decimal commas with the setting',
    bytes: lines(['id;x', 'a;1,5', 'b;2,25', 'c;3,5', 'd;4']),
    opts: { column: 'x', decimalComma: true },
    expect: { ok: true, n: 4, values: [1.5, 2.25, 3.5, 4] },
  },
  {
    // Never guessed: without the setting a decimal comma is an error that names the setting.
    name: 'decimal commas without the setting',
    bytes: lines(['id;x', 'a;1,5', 'b;2,25']),
    opts: { column: 'x' },
    expect: { ok: false, message: /decimal/, place: { row: 2, column: 'x', value: '1,5' } },
  },
  {
    name: 'thousands separators (comma)',
    bytes: lines(['x', '"1,250"', '"2,500"', '3000', '4000']),
    opts: { column: 'x' },
    expect: { ok: false, message: /thousands separator/, place: { row: 2, column: 'x', value: '1,250' } },
  },
  {
    name: 'thousands separators (space) with decimal commas',
    bytes: lines(['x', '1 250,5', '2 500']),
    opts: { column: 'x', decimalComma: true },
    expect: { ok: false, message: /thousands separator/, place: { row: 2, column: 'x', value: '1 250,5' } },
  },
  {
    name: 'blank cell',
    bytes: lines(['id,x', 'a,1', 'b,', 'c,3', 'd,4']),
    opts: { column: 'x' },
    expect: { ok: false, message: /blank/, place: { row: 3, column: 'x', value: '' } },
  },
  {
    name: 'blank cell, skipped and counted',
    bytes: lines(['id,x', 'a,1', 'b,', 'c,3', 'd,4', 'e,5']),
    opts: { column: 'x', skipInvalid: true },
    expect: { ok: true, n: 4, values: [1, 3, 4, 5], rowsRead: 5, skipped: { blank: 1 }, inputWarning: /1 row dropped/ },
  },
  {
    name: 'blank lines',
    bytes: 'x\n\n1\n2\n\n\n3\n4\n\n',
    opts: { column: 'x' },
    expect: { ok: true, n: 4, values: [1, 2, 3, 4], blankLines: 4, inputWarning: /4 blank lines/ }, // lines 2, 5, 6 and 9
  },
  ...(['NA', '-', 'n/a', 'inf', 'NaN'] as const).map(
    (tok): HostileCase => ({
      name: `marker ${tok}`,
      bytes: lines(['id,x', 'a,1', `b,${tok}`, 'c,3']),
      opts: { column: 'x' },
      expect: { ok: false, message: /not a usable number/, place: { row: 3, column: 'x', value: tok } },
    }),
  ),
  {
    name: 'NA, -, n/a, inf, NaN skipped and counted by reason',
    bytes: lines(['id,x', ...thirty.map((v, i) => `r${i},${v}`), 'm1,NA', 'm2,-', 'm3,n/a', 'm4,inf', 'm5,NaN', 'm6,-inf']),
    opts: { column: 'x', skipInvalid: true },
    expect: { ok: true, n: 30, rowsRead: 36, skipped: { 'missing-marker': 3, infinite: 2, nan: 1 }, fitted: ['normal', 'lognormal', 'gamma', 'weibull', 'exponential'] },
  },
  {
    name: 'duplicate column names, chosen by name',
    bytes: lines(['x,x', '1,2', '3,4']),
    opts: { column: 'x' },
    expect: { ok: false, message: /matches 2 columns/, place: { column: 'x' } },
  },
  {
    name: 'duplicate column names, chosen by index',
    bytes: lines(['x,x', ...thirty.map((v) => `0,${v}`)]),
    opts: { column: 2 },
    expect: { ok: true, n: 30 },
  },
  {
    name: 'empty column name, chosen by index',
    bytes: lines(['id,', ...thirty.map((v, i) => `${i},${v}`)]),
    opts: { column: 2 },
    expect: { ok: true, n: 30, inputWarning: /no name/ },
  },
  { name: 'single column, no --column', bytes: lines(['x', ...thirty]), expect: { ok: true, n: 30 } },
  {
    name: 'several columns, no --column',
    bytes: lines(['a,b', '1,2', '3,4']),
    expect: { ok: false, message: /2 columns; choose one/ },
  },
  {
    name: 'binary garbage',
    bytes: Uint8Array.from([0x50, 0x4b, 0x03, 0x04, 0x00, 0x00, 0xff, 0xfe, 0x9c, 0x00, 0x0a, 0x01, 0x02, 0x80, 0xc3, 0x28, 0x0d, 0x00]),
    expect: { ok: false, message: /does not look like text/ },
  },
  {
    name: 'formula-like cell',
    bytes: lines(['x', '1', '=SUM(A1:A2)', '3']),
    expect: { ok: false, message: /not a number/, place: { row: 3, column: 'x', value: '=SUM(A1:A2)' } },
  },
  {
    name: 'number out of double range',
    bytes: lines(['x', '1', '2', '1e400']),
    expect: { ok: false, message: /range/, place: { row: 4, column: 'x', value: '1e400' } },
  },
  {
    // Squared deviations underflow (1e-600) in double precision; the fit must still be made (or, if a
    // family cannot, be listed as not applicable with the reason: see the invariants suite).
    name: 'values near 1e-300',
    bytes: lines(['x', ...thirty.map((v) => `${v}e-301`)]),
    expect: { ok: true, n: 30, fitted: ['normal', 'lognormal', 'gamma', 'weibull', 'exponential'] },
  },
  {
    name: 'values near 1e300',
    bytes: lines(['x', ...thirty.map((v) => `${v}e299`)]),
    expect: { ok: true, n: 30, fitted: ['normal', 'lognormal', 'gamma', 'weibull', 'exponential'] },
  },
  {
    // Sums overflow near the top of the double range: whatever cannot be computed is listed as not
    // applicable with a reason that says so; no internal error.
    name: 'values near 1.7e308',
    bytes: lines(['x', ...thirty.map((v) => `${(Number(v) / 30).toFixed(4)}e308`)]),
    expect: { ok: true, n: 30, fitted: ['lognormal', 'weibull'] },
  },
  {
    name: 'negatives and zeros',
    bytes: lines(['x', '-2.5', '0', '0', ...thirty.slice(0, 27)]),
    expect: {
      ok: true,
      n: 30,
      fitted: ['normal'],
      // 3 values ≤ 0 (one negative, two zeros) are outside (0, ∞).
      notApplicable: { lognormal: 3, gamma: 3, weibull: 3, exponential: 3 },
      reportWarning: /not applicable/,
    },
  },
  { name: 'all values identical', bytes: lines(['x', ...Array(20).fill('7.25')]), expect: { ok: false, message: /All 20 values are equal/ } },
  {
    // Two distinct values among 40: allowed, but the ties are warned about (the tests assume continuity).
    name: 'two distinct values',
    bytes: lines(['x', ...Array(15).fill('1'), ...Array(25).fill('2')]),
    expect: { ok: true, n: 40, reportWarning: /tied values: only 2 distinct among 40/ },
  },
  { name: 'n = 2', bytes: lines(['x', 1, 2]), expect: { ok: false, message: /Too few values \(2\)/ } },
  // With the default families (two parameters) n = 3 is too few for AICc (n > m + 1 + 1 needed, Hurvich & Tsai 1989).
  { name: 'n = 3', bytes: lines(['x', 1, 2, 4]), expect: { ok: false, message: /Too few values \(3\)/ } },
  { name: 'n = 3, one-parameter family', bytes: lines(['x', 1, 2, 4]), opts: { families: ['exponential'] }, expect: { ok: true, n: 3, fitted: ['exponential'], reportWarning: /Small sample/ } },
  {
    name: 'heavy ties from rounding',
    bytes: lines(['x', ...Array.from({ length: 60 }, (_, i) => (10 + Math.round(((i * 7) % 11) - 5) * 0.5).toFixed(1))]),
    expect: { ok: true, n: 60, reportWarning: /Many tied values/ },
  },
  {
    name: 'short row',
    bytes: lines(['id,x', 'a,1', 'b', 'c,3']),
    opts: { column: 'x' },
    expect: { ok: false, message: /row 3/, place: { row: 3, column: 'x' } },
  },
];

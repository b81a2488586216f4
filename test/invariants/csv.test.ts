/**
 * The CSV reader's accounting invariant (issue 6: "nothing is dropped without being counted and
 * reported"), as a seeded fast-check property: for any table of numbers and unusable cells, with
 * any line ends, an optional byte-order mark, optional quoting and blank lines,
 *  - with skipInvalid, the kept values are exactly the numeric cells in file order, and
 *    rowsRead = kept + Σ skipped (per reason, with the first row/value of each reason right);
 *  - without it, the first unusable cell is an InputError naming its row, column and value.
 * Line numbering: 1-based file lines, the header being line 1 (core/errors.ts ErrorPlace).
 * The reasons' tokens are the reader's documented lists (core/csv/classify.ts; common practice,
 * no source).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InputError, readColumn, type SkipReason } from '../../core/index.js';

type Cell = { readonly kind: 'number'; readonly value: number; readonly text: string } | { readonly kind: 'bad'; readonly reason: SkipReason; readonly text: string };

const numberCell: fc.Arbitrary<Cell> = fc
  .oneof(fc.double({ min: -1e6, max: 1e6, noNaN: true }), fc.double({ noNaN: true, noDefaultInfinity: true }), fc.integer({ min: -1000, max: 100000 }))
  .chain((v) =>
    fc.constantFrom(
      String(v),
      v.toExponential(), // round-trips (shortest digits)
      ` ${String(v)} `, // spaces around a number are trimmed (String(-0) is "0", hence +0 below)
    ).map((text) => ({ kind: 'number' as const, value: v === 0 ? 0 : v, text })),
  );

const badCell: fc.Arbitrary<Cell> = fc.constantFrom<Cell>(
  { kind: 'bad', reason: 'blank', text: '' },
  { kind: 'bad', reason: 'blank', text: '   ' },
  { kind: 'bad', reason: 'missing-marker', text: 'NA' },
  { kind: 'bad', reason: 'missing-marker', text: '-' },
  { kind: 'bad', reason: 'missing-marker', text: 'n/a' },
  { kind: 'bad', reason: 'nan', text: 'NaN' },
  { kind: 'bad', reason: 'infinite', text: 'inf' },
  { kind: 'bad', reason: 'infinite', text: '-Infinity' },
  { kind: 'bad', reason: 'out-of-range', text: '1e400' },
  { kind: 'bad', reason: 'non-numeric', text: 'abc' },
  { kind: 'bad', reason: 'non-numeric', text: '1.2.3' },
  { kind: 'bad', reason: 'non-numeric', text: '0x1F' },
);

interface Table {
  readonly cells: readonly Cell[];
  readonly eol: string;
  readonly bom: boolean;
  readonly quote: boolean;
  readonly blankAfter: readonly number[];
  readonly finalEol: boolean;
}

const table: fc.Arbitrary<Table> = fc.record({
  cells: fc.array(fc.oneof({ weight: 4, arbitrary: numberCell }, { weight: 1, arbitrary: badCell }), { minLength: 1, maxLength: 40 }),
  eol: fc.constantFrom('\n', '\r\n', '\r'),
  bom: fc.boolean(),
  quote: fc.boolean(),
  blankAfter: fc.array(fc.nat(), { maxLength: 3 }),
  finalEol: fc.boolean(),
});

function build(t: Table): { text: string; lines: number[] } {
  const out: string[] = ['id,"value"'];
  const lines: number[] = [];
  const blanks = new Set(t.blankAfter.map((b) => b % t.cells.length));
  t.cells.forEach((c, i) => {
    const cell = t.quote && c.text.trim() !== '' ? `"${c.text}"` : c.text;
    out.push(`r${i},${cell}`);
    lines.push(out.length); // this row's 1-based line
    if (blanks.has(i)) out.push('');
  });
  return { text: (t.bom ? '\uFEFF' : '') + out.join(t.eol) + (t.finalEol ? t.eol : ''), lines };
}

describe('invariant: the CSV reader counts everything it drops', () => {
  it('skipInvalid: kept values exact and in order; rowsRead = kept + Σ skipped; first row/value per reason', () => {
    fc.assert(
      fc.property(table, (t) => {
        const { text, lines } = build(t);
        const r = readColumn(text, { column: 'value', skipInvalid: true });
        const want = t.cells.filter((c) => c.kind === 'number').map((c) => (c as { value: number }).value);
        expect(Array.from(r.values)).toEqual(want);
        const skipped = r.skipped.reduce((s, x) => s + x.count, 0);
        expect(r.rowsRead).toBe(t.cells.length);
        expect(r.values.length + skipped).toBe(r.rowsRead);
        for (const reason of new Set(t.cells.filter((c) => c.kind === 'bad').map((c) => (c as { reason: SkipReason }).reason))) {
          const idx = t.cells.findIndex((c) => c.kind === 'bad' && c.reason === reason);
          const s = r.skipped.find((x) => x.reason === reason);
          expect(s, reason).toBeDefined();
          expect(s?.count).toBe(t.cells.filter((c) => c.kind === 'bad' && c.reason === reason).length);
          expect(s?.firstRow).toBe(lines[idx]);
          expect(s?.firstColumn).toBe('value');
          expect(s?.firstValue).toBe((t.cells[idx] as Cell).text.trim());
        }
        if (skipped > 0) expect(r.warnings.join(' ')).toMatch(/dropped/);
      }),
      { seed: 6060, numRuns: 1000 },
    );
  });

  it('without skipInvalid: the first unusable cell is an InputError with its row, column and value', () => {
    fc.assert(
      fc.property(table, (t) => {
        const { text, lines } = build(t);
        const first = t.cells.findIndex((c) => c.kind === 'bad');
        let err: unknown = null;
        try {
          const r = readColumn(text, { column: 'value' });
          expect(first).toBe(-1);
          expect(r.values.length).toBe(t.cells.length);
          return;
        } catch (e) {
          err = e;
        }
        expect(first).toBeGreaterThanOrEqual(0);
        expect(err).toBeInstanceOf(InputError);
        const e = err as InputError;
        expect(e.place.row).toBe(lines[first]);
        expect(e.place.column).toBe('value');
        expect(e.place.value).toBe((t.cells[first] as Cell).text.trim());
        expect(e.message).toContain(`row ${lines[first]}`);
      }),
      { seed: 6061, numRuns: 1000 },
    );
  });
});

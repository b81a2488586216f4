import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parseStrictNumber } from '../../core/index.js';

describe('strict numbers', () => {
  it('reads plain decimals, signs and exponents as Number() does', () => {
    // Source: ECMA-262 StringToNumber (Number()) for the values of valid decimal literals.
    const valid = ['0', '-0', '+7', '12.5', '.5', '5.', '-3.25e-2', '1E3', '6.02214076e23', '1e-300', '1e300', '  42  ', '\t-1.5\t', '0001.2500'];
    for (const s of valid) expect(Object.is(parseStrictNumber(s), Number(s)), s).toBe(true);
  });

  it('rejects what Number() accepts but a measurement cell should not contain', () => {
    // Source: ECMA-262 StringToNumber accepts '', hex/octal/binary prefixes and Infinity; we refuse them
    // (common practice, no source: a data cell is a decimal number).
    for (const s of ['', '   ', '0x1F', '0o17', '0b101', 'Infinity', '-Infinity', 'NaN', '1_000', '1e', 'e5', '.', '+', '-', '--1', '1.2.3', '1e5.5', '1 2', '12abc', '1,5']) {
      expect(parseStrictNumber(s), JSON.stringify(s)).toBeNaN();
    }
  });

  it('reports overflow and underflow as not a number instead of ±Infinity or 0', () => {
    // Source: IEEE 754 binary64 range (max ≈ 1.797e308, smallest subnormal ≈ 4.94e-324).
    expect(parseStrictNumber('1e400')).toBeNaN();
    expect(parseStrictNumber('-1e400')).toBeNaN();
    expect(parseStrictNumber('1e-400')).toBeNaN();
    expect(parseStrictNumber('5e-324')).toBe(5e-324);
    expect(parseStrictNumber('0e999')).toBe(0);
  });

  it('reads decimal commas only when asked, and then refuses decimal points', () => {
    // Source: ISO 80000-1 allows the comma as decimal sign; never guessed (common practice, no source).
    expect(parseStrictNumber('3,75', ',')).toBe(3.75);
    expect(parseStrictNumber('-1,5e3', ',')).toBe(-1500);
    expect(parseStrictNumber('3,75')).toBeNaN();
    expect(parseStrictNumber('3.75', ',')).toBeNaN();
  });

  it('fast path agrees bit for bit with Number() on random decimal literals', () => {
    // Source: Clinger (1990) PLDI — one exact operation is correctly rounded; Number() rounds correctly (ECMA-262).
    const literal = fc
      .tuple(
        fc.constantFrom('', '-', '+'),
        fc.stringMatching(/^[0-9]{1,20}$/),
        fc.option(fc.stringMatching(/^[0-9]{0,20}$/)),
        fc.option(fc.integer({ min: -330, max: 330 })),
      )
      .map(([sign, int, frac, exp]) => `${sign}${int}${frac === null ? '' : `.${frac}`}${exp === null ? '' : `e${exp}`}`);
    fc.assert(
      fc.property(literal, (s) => {
        const expected = Number(s);
        const got = parseStrictNumber(s);
        const inRange = Number.isFinite(expected) && (expected !== 0 || !/[1-9]/.test(s.split('e')[0] as string));
        return inRange ? Object.is(got, expected) : Number.isNaN(got);
      }),
      { seed: 4180, numRuns: 5000 },
    );
  });
});

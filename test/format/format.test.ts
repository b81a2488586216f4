import { describe, expect, it } from 'vitest';
import { formatNumber, formatPValue, pValueText } from '../../core/index.js';

// Significant digits as C's printf %g rounds them (ISO C 7.21.6.1); reference strings from Python 3
// ('%.4g' % x, '%.3g' % x, '%.2g' % x, run for this test). Python writes the exponent with two digits
// (e-09); ours drops the leading zero (e-9), same digits.
describe('formatNumber', () => {
  it.each([
    [0.012345, 4, '0.01235'], // '%.4g' -> 0.01235
    [0.000123456, 4, '0.0001235'], // '%.4g' -> 0.0001235
    [-0.00098765, 4, '-0.0009877'], // '%.4g' -> -0.0009877
    [1234.5678, 4, '1235'], // '%.4g' -> 1235
    [0.99951, 4, '0.9995'], // '%.4g' -> 0.9995
    [12345678, 4, '1.235e+7'], // '%.4g' -> 1.235e+07
    [3.21e-9, 2, '3.2e-9'], // '%.2g' -> 3.2e-09
    [5.8e-7, 4, '5.8e-7'], // '%.4g' -> 5.8e-07 (trailing zeros dropped, as %g does)
  ] as const)('%d to %d digits is %s', (x, digits, text) => {
    expect(formatNumber(x, digits)).toBe(text);
  });

  it('a value that rounds up to 1e7 is written in e-notation like every value from 1e7 up', () => {
    // '%.4g' % 9999999.6 -> 1e+07
    expect(formatNumber(9999999.6, 4)).toBe('1e+7');
    expect(formatNumber(9999999.4, 8)).toBe('9999999.4');
  });

  it('zero, not-a-number and the infinities', () => {
    expect(formatNumber(0)).toBe('0');
    expect(formatNumber(Number.NaN)).toBe('NaN');
    expect(formatNumber(Infinity)).toBe('∞');
    expect(formatNumber(-Infinity)).toBe('-∞');
    expect(() => formatNumber(1, 0)).toThrow(RangeError);
  });
});

// Common practice, no source: a p-value read for its size, 3 significant digits from 1e-4 up, 2 below;
// a bound is printed as a bound.
describe('formatPValue', () => {
  it('an estimate', () => {
    expect(formatPValue(0.012345)).toBe('p = 0.0123'); // '%.3g' -> 0.0123
    expect(formatPValue(3.21e-9)).toBe('p = 3.2e-9'); // '%.2g' -> 3.2e-09
    expect(formatPValue(0.99951)).toBe('p = 1'); // '%.3g' -> 1
  });

  it('a bound is printed as a bound, from the number and its kind or from a result that says so', () => {
    expect(formatPValue(5.8e-7, 'upper-bound')).toBe('p < 5.8e-7');
    expect(formatPValue(0.25, 'lower-bound')).toBe('p > 0.25');
    expect(formatPValue({ pValue: 5.8e-7, pValueIs: 'upper-bound' })).toBe('p < 5.8e-7');
    expect(formatPValue({ pValue: 0.25, pValueIs: 'lower-bound' })).toBe('p > 0.25');
    expect(pValueText({ pValue: 0.25, pValueIs: 'lower-bound' })).toBe('> 0.25');
    expect(pValueText({ pValue: 0.0123 })).toBe('0.0123');
  });

  it('an underflowed p-value is a bound, and a missing one says so', () => {
    expect(formatPValue(0)).toBe('p < 1e-300');
    expect(formatPValue(Number.NaN)).toBe('p not computable');
    expect(pValueText(Infinity)).toBe('not computable');
  });
});

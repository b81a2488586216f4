/**
 * The one number formatter of the reports: the CLI text, the page and the report strings the core
 * writes all print a number with it, so each shows the same digits. Display only; JSON keeps full
 * precision.
 */

/** Plain notation between these magnitudes, e-notation outside. */
const PLAIN_FROM = 1e-4;
const PLAIN_BELOW = 1e7;

/**
 * `x` to `digits` significant digits: plain for 1e-4 <= |x| < 1e7 ("0.01234", "1234"), otherwise
 * e-notation with trailing zeros dropped ("5.8e-7", "1.2e+9"). 0 is "0"; NaN is "NaN"; infinities
 * are "∞" and "-∞".
 */
export function formatNumber(x: number, digits = 4): string {
  if (!Number.isInteger(digits) || digits < 1 || digits > 17) throw new RangeError(`digits must be a whole number from 1 to 17; got ${String(digits)}`);
  if (Number.isNaN(x)) return 'NaN';
  if (x === Infinity) return '∞';
  if (x === -Infinity) return '-∞';
  if (x === 0) return '0';
  const ax = Math.abs(x);
  if (ax >= PLAIN_FROM && ax < PLAIN_BELOW) {
    const rounded = Number(x.toPrecision(digits));
    // Rounding up may reach 1e7 (9999999.6 to 4 digits is 1e7): that one is written in e-notation.
    if (Math.abs(rounded) < PLAIN_BELOW) return String(rounded);
  }
  return x
    .toExponential(digits - 1)
    .replace(/\.?0+e/, 'e');
}

/**
 * Number formatting for the page and the report. Display only: the report's numbers are
 * never changed, only rounded for reading; the JSON export keeps full precision.
 */

/** A number to `digits` significant figures, plain notation for 1e-4 ≤ |x| < 1e7. */
export function sig(x: number | null | undefined, digits = 4): string {
  if (x === null || x === undefined) return '—';
  if (Number.isNaN(x)) return 'not a number';
  if (x === Infinity) return '∞';
  if (x === -Infinity) return '−∞';
  if (x === 0) return '0';
  const a = Math.abs(x);
  let s: string;
  if (a >= 1e-4 && a < 1e7) {
    s = Number(x.toPrecision(digits)).toString();
    if (s.includes('e')) s = x.toPrecision(digits);
  } else {
    s = x.toExponential(digits - 1).replace(/\.?0+e/, 'e');
  }
  return s.replace(/^-/, '−');
}

/** Fixed decimals, with a true minus sign. */
export function fixed(x: number | null | undefined, decimals = 2): string {
  if (x === null || x === undefined) return '—';
  if (!Number.isFinite(x)) return sig(x);
  return x.toFixed(decimals).replace(/^-/, '−');
}

/** A p-value as read by a person: 3 significant figures, tiny ones in e-notation. */
export function pValue(p: number, is: 'estimate' | 'upper-bound' | 'lower-bound' = 'estimate'): string {
  if (!Number.isFinite(p)) return 'not computable';
  if (is === 'upper-bound') return `< ${sig(p, 3)}`;
  if (is === 'lower-bound') return `> ${sig(p, 3)}`;
  if (p === 0) return '< 1e-300';
  if (p < 1e-4) return sig(p, 2);
  return sig(p, 3);
}

/** A value with its units, e.g. "12.5 mm"; no units → the number alone. */
export function withUnits(text: string, units: string): string {
  return units.trim() ? `${text} ${units.trim()}` : text;
}

/** An axis label with its units in brackets, e.g. "Life [h]". */
export function axisLabel(name: string, units: string): string {
  return units.trim() ? `${name} [${units.trim()}]` : name;
}

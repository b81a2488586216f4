/**
 * Number formatting for the page and the report. Display only: the report's numbers are
 * never changed, only rounded for reading; the JSON export keeps full precision.
 */
import { formatNumber, pValueText, type PValueKind } from '../../core/format/index.js';

/**
 * A number to `digits` significant figures: the core's formatNumber (the CLI prints the same digits),
 * with a true minus sign for the page and '—' for a missing value.
 */
export function sig(x: number | null | undefined, digits = 4): string {
  if (x === null || x === undefined) return '—';
  if (Number.isNaN(x)) return 'not a number';
  return formatNumber(x, digits).replace(/^-/, '−');
}

/** Fixed decimals, with a true minus sign. */
export function fixed(x: number | null | undefined, decimals = 2): string {
  if (x === null || x === undefined) return '—';
  if (!Number.isFinite(x)) return sig(x);
  return x.toFixed(decimals).replace(/^-/, '−');
}

/** A p-value as read by a person: the core's pValueText ("0.0123", "< 5.8e-7", "> 0.25"), as the CLI prints it. */
export function pValue(p: number, is: PValueKind = 'estimate'): string {
  return pValueText(p, is);
}

/** A value with its units, e.g. "12.5 mm"; no units → the number alone. */
export function withUnits(text: string, units: string): string {
  return units.trim() ? `${text} ${units.trim()}` : text;
}

/** An axis label with its units in brackets, e.g. "Life [h]". */
export function axisLabel(name: string, units: string): string {
  return units.trim() ? `${name} [${units.trim()}]` : name;
}

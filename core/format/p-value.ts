/**
 * The one p-value formatter: an estimate as "p = 0.0123", a bound as a bound ("p < 5.8e-7",
 * "p > 0.25"), never a bound printed as if it were an estimate. Three significant digits from 1e-4
 * up, two below (a smaller p-value is read for its order of magnitude); a p-value that underflowed
 * to 0 is shown as the bound it is.
 */
import { formatNumber } from './number.js';

/** What a p-value is: an estimate, or a bound (the true value lies below / above it). */
export type PValueKind = 'estimate' | 'upper-bound' | 'lower-bound';

/** A result that carries a p-value and says whether it is a bound (e.g. an Anderson–Darling report). */
export interface PValueResult {
  readonly pValue: number;
  readonly pValueIs?: PValueKind;
}

/** Below the smallest normal double (2.2e-308) a p-value has underflowed: we only know it is below this. */
const UNDERFLOW_BOUND = 1e-300;

function digitsFor(p: number): number {
  return p >= 1e-4 ? 3 : 2;
}

/** The p-value without the "p": "0.0123", "< 5.8e-7", "> 0.25"; "not computable" when not finite. */
export function pValueText(p: number | PValueResult, is: PValueKind = 'estimate'): string {
  const value = typeof p === 'number' ? p : p.pValue;
  const kind = typeof p === 'number' ? is : (p.pValueIs ?? 'estimate');
  if (!Number.isFinite(value)) return 'not computable';
  if (kind === 'upper-bound') return `< ${formatNumber(value, digitsFor(value))}`;
  if (kind === 'lower-bound') return `> ${formatNumber(value, digitsFor(value))}`;
  if (value < UNDERFLOW_BOUND) return `< ${formatNumber(UNDERFLOW_BOUND, 1)}`;
  return formatNumber(value, digitsFor(value));
}

/** The p-value as written in a sentence: "p = 0.0123", "p < 5.8e-7", "p > 0.25". */
export function formatPValue(p: number | PValueResult, is: PValueKind = 'estimate'): string {
  const text = pValueText(p, is);
  if (text === 'not computable') return 'p not computable';
  return text.startsWith('<') || text.startsWith('>') ? `p ${text}` : `p = ${text}`;
}

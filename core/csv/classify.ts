/**
 * Why a cell is not a usable number: the reasons rows are skipped for (and counted by), and the
 * words an error uses. Missing-value markers are the tokens spreadsheets and statistics tools
 * commonly write for "no value" (common practice, no source).
 */
import type { SkipReason } from './types.js';
import type { NumberFailure } from './number.js';

const MISSING_MARKERS = new Set(['na', 'n/a', 'n.a.', '#n/a', 'null', 'none', '-', '--', '?', '.', 'missing']);
const NAN_TOKENS = new Set(['nan', '-nan', '+nan']);
const INFINITE_TOKENS = new Set(['inf', '+inf', '-inf', 'infinity', '+infinity', '-infinity', '∞', '+∞', '-∞']);

/** Classify the trimmed text of a cell that failed the strict number grammar. */
export function classifyCell(trimmed: string, failure: NumberFailure): SkipReason {
  if (trimmed === '') return 'blank';
  if (failure.kind === 'range') return 'out-of-range';
  const lower = trimmed.toLowerCase();
  if (MISSING_MARKERS.has(lower)) return 'missing-marker';
  if (NAN_TOKENS.has(lower)) return 'nan';
  if (INFINITE_TOKENS.has(lower)) return 'infinite';
  return 'non-numeric';
}

/** Plain words for each reason, used in errors and summaries. */
export const REASON_WORDS: Readonly<Record<SkipReason, string>> = {
  blank: 'blank cell',
  'missing-marker': 'missing-value marker',
  nan: 'NaN (not a number)',
  infinite: 'infinite value',
  'out-of-range': 'number out of the double-precision range',
  'non-numeric': 'not a number',
  'missing-cell': 'row too short (no cell for this column)',
  'extra-fields': 'row with more fields than the header',
};

const THOUSANDS_DOT = /^[+-]?\d{1,3}(,\d{3})+(\.\d+)?$/;
const THOUSANDS_COMMA = /^[+-]?\d{1,3}(\.\d{3})+(,\d+)?$/;
const THOUSANDS_OTHER = /^[+-]?\d{1,3}([ '\u00a0\u202f_]\d{3})+([.,]\d+)?$/;
const DECIMAL_COMMA = /^[+-]?\d*,\d+([eE][+-]?\d+)?$/;
const DECIMAL_DOT = /^[+-]?\d*\.\d+([eE][+-]?\d+)?$/;

/** A short hint for a non-numeric cell that is probably a number in another convention, or ''. */
export function numberHint(trimmed: string, decimal: '.' | ','): string {
  const thousands = 'it looks like a number with thousands separators, which are not accepted (ambiguous); remove them';
  if (decimal === '.') {
    const asDecimal = DECIMAL_COMMA.test(trimmed);
    const asThousands = THOUSANDS_DOT.test(trimmed);
    if (asDecimal && asThousands) {
      return 'the comma could be a decimal comma or a thousands separator; for decimal commas use the decimal-comma setting, otherwise remove the separators';
    }
    if (asDecimal) return 'it looks like a decimal comma; if the file uses decimal commas, use the decimal-comma setting';
    if (asThousands || THOUSANDS_OTHER.test(trimmed)) return thousands;
  } else {
    const asDecimal = DECIMAL_DOT.test(trimmed);
    const asThousands = THOUSANDS_COMMA.test(trimmed);
    if (asDecimal && asThousands) {
      return 'the point could be a decimal point or a thousands separator; the decimal-comma setting is on, so neither is accepted';
    }
    if (asDecimal) return 'the decimal-comma setting is on, so a decimal point is not accepted';
    if (asThousands || THOUSANDS_OTHER.test(trimmed)) return thousands;
  }
  return '';
}

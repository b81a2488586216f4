/**
 * How skipped rows are described on the page and in the report. The reason words come from the
 * server's summary codes; these are the page's phrasing of them.
 */
import type { SkipCount } from './types.js';

const WORDS: Readonly<Record<string, string>> = {
  blank: 'blank cell',
  'missing-marker': 'missing-value marker',
  nan: 'NaN',
  infinite: 'infinite value',
  'out-of-range': 'number too large or too small to represent',
  'non-numeric': 'not a number',
  'missing-cell': 'row too short for this column',
  'extra-fields': 'more fields than the header',
};

export function skipLine(s: SkipCount): string {
  const what = WORDS[s.reason] ?? s.reason;
  const first = s.firstValue ? `, first at line ${s.firstRow}: ${JSON.stringify(s.firstValue)}` : `, first at line ${s.firstRow}`;
  return `${s.count} × ${what}${first}`;
}

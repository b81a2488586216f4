/**
 * Delimiter detection among comma, semicolon and tab, from the first records of the text.
 * Delimiters inside double quotes are not counted (RFC 4180 quoting: a quote toggles the quoted
 * state, a doubled quote toggles it twice). The delimiter whose count is the same non-zero number
 * on the header and every sampled record wins (common practice, no source). With the
 * decimal-comma setting, semicolon and tab are preferred over comma when several are consistent.
 */
import type { Delimiter } from './types.js';

export interface DelimiterGuess {
  /** The delimiter, or null when the header contains none of the candidates (one column). */
  readonly delimiter: Delimiter | null;
  /** Warnings about the choice (ambiguity, inconsistent field counts). */
  readonly warnings: readonly string[];
}

const CANDIDATES: readonly Delimiter[] = [',', ';', '\t'];
const NAMES: Readonly<Record<Delimiter, string>> = { ',': 'comma', ';': 'semicolon', '\t': 'tab' };
const MAX_RECORDS = 50;
const MAX_CHARS = 1 << 16;

export function delimiterName(d: string): string {
  return d in NAMES ? NAMES[d as Delimiter] : JSON.stringify(d);
}

/** Guess the delimiter from the records starting at `start` (the header line). */
export function detectDelimiter(text: string, start: number, decimal: '.' | ','): DelimiterGuess {
  const counts: number[][] = [[], [], []];
  let c0 = 0;
  let c1 = 0;
  let c2 = 0;
  let inQuotes = false;
  let nonBlank = false;
  const n = text.length;
  let i = start;
  const flush = (): void => {
    if (nonBlank) {
      (counts[0] as number[]).push(c0);
      (counts[1] as number[]).push(c1);
      (counts[2] as number[]).push(c2);
    }
    c0 = c1 = c2 = 0;
    nonBlank = false;
  };
  while (i < n) {
    const c = text.charCodeAt(i);
    if (c === 34) {
      inQuotes = !inQuotes;
      nonBlank = true;
    } else if (!inQuotes) {
      if (c === 10 || c === 13) {
        flush();
        if (c === 13 && i + 1 < n && text.charCodeAt(i + 1) === 10) i++;
        if ((counts[0] as number[]).length >= MAX_RECORDS || i - start > MAX_CHARS) break;
      } else if (c === 44) c0++;
      else if (c === 59) c1++;
      else if (c === 9) c2++;
      else if (c !== 32) nonBlank = true;
    }
    i++;
  }
  if (i >= n) flush();

  const headerCounts = counts.map((cs) => cs[0] ?? 0);
  const consistent: Delimiter[] = [];
  for (let k = 0; k < 3; k++) {
    const h = headerCounts[k] as number;
    if (h > 0 && (counts[k] as number[]).every((x) => x === h)) consistent.push(CANDIDATES[k] as Delimiter);
  }
  const warnings: string[] = [];
  if (consistent.length === 1) return { delimiter: consistent[0] as Delimiter, warnings };
  if (consistent.length > 1) {
    let pick: Delimiter;
    const nonComma = consistent.filter((d) => d !== ',');
    if (decimal === ',' && nonComma.length > 0) pick = nonComma[0] as Delimiter;
    else {
      // The one giving the most fields; ties in the order comma, semicolon, tab.
      pick = consistent.reduce((best, d) =>
        (headerCounts[CANDIDATES.indexOf(d)] as number) > (headerCounts[CANDIDATES.indexOf(best)] as number) ? d : best,
      );
    }
    warnings.push(
      `several delimiters fit the first lines (${consistent.map(delimiterName).join(', ')}); ` +
        `used ${delimiterName(pick)} (set the delimiter to choose another)`,
    );
    return { delimiter: pick, warnings };
  }
  // None consistent: take the one matching the header's count on the most records.
  let best = -1;
  let bestScore = -1;
  for (let k = 0; k < 3; k++) {
    const h = headerCounts[k] as number;
    if (h === 0) continue;
    const score = (counts[k] as number[]).filter((x) => x === h).length;
    if (score > bestScore || (score === bestScore && h > (headerCounts[best] as number))) {
      best = k;
      bestScore = score;
    }
  }
  if (best < 0) return { delimiter: null, warnings };
  const d = CANDIDATES[best] as Delimiter;
  warnings.push(
    `the first lines do not all have the same number of ${delimiterName(d)}-separated fields as the header; ` +
      `used ${delimiterName(d)} (set the delimiter if this is wrong)`,
  );
  return { delimiter: d, warnings };
}

/**
 * What the page says it read from a peak file, before any analysis: the core's own reader and
 * make-up (core/workflow/flood-record.ts), the same words the report's flood record starts with.
 * null when the text is not a peak file; the reader's error in words when it cannot be read.
 */
import { looksLikePeakFile, readFloodRecord } from '../../core/index.js';

export function peakFileNote(text: string): string | null {
  if (!looksLikePeakFile(text)) return null;
  try {
    return `Read as a ${readFloodRecord(text).makeUp.text}. Its columns are read by name; the value column and column roles do not apply.`;
  } catch (e) {
    return `A peak file that cannot be read: ${e instanceof Error ? e.message : String(e)}.`;
  }
}

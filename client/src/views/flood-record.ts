/**
 * The flood record of a peak file (report `floodRecord`; core/workflow/flood-record-report.ts): what
 * the file holds (systematic years, the historical period and its perception threshold, peaks known
 * only below or above a value), every qualification code found with its effect, then the
 * log-Pearson III / EMA block drawn by the flood section's own renderer (flood-estimators.ts
 * emaLines: weighted skew, low outliers by the multiple Grubbs–Beck test, return levels with their
 * intervals and method), the record's warnings and the Bulletin's cautions with the deference to
 * the governing agency. Pure.
 */
import { sig } from '../format.js';
import type { BlockLine, BlockTable, SectionView } from './block.js';
import { emaLines } from './flood-estimators.js';
import { withU } from './numbers.js';

export const floodRecordSection: SectionView = ({ report: r, units: u }) => {
  const f = r.floodRecord;
  if (!f) return null;
  const m = f.makeUp;
  const lines: BlockLine[] = [];
  const tables: BlockTable[] = [];
  lines.push({ kind: 'fact', text: `Read as a ${m.text}.` });
  lines.push({
    kind: 'fact',
    text: m.systematic
      ? `Systematic record ${m.systematic.firstYear}-${m.systematic.lastYear}: ${m.systematic.peaks} peaks, of which ${m.knownBelow} ${m.knownBelow === 1 ? 'is' : 'are'} known only to lie below and ${m.knownAbove} only above the value given (treated as intervals in the expected moments).`
      : 'No systematic record: every peak is a historic peak.',
  });
  const h = f.historicalPeriod;
  if (h) {
    lines.push({
      kind: h.assumed ? 'warning' : 'fact',
      text: `Historical period from ${h.firstYear}: ${m.historicPeaks} historic peak${m.historicPeaks === 1 ? '' : 's'} above the perception threshold ${withU(sig(h.threshold), u)}, and ${h.yearsBelow} years without a recorded peak taken as below it${h.assumed ? ' (assumed: the smallest historic peak and the first historic year; give the perception threshold and the start of the historical period the historical information supports)' : ''}.`,
    });
  }
  tables.push({
    caption: 'Qualification codes found in the file, with what was done with each.',
    head: ['Code', 'Peaks', 'Meaning', 'Effect on the analysis'],
    rows: m.codes.map((c) => [c.code, String(c.count), c.meaning, c.effect]),
  });
  const ema = emaLines(f.ema, u);
  lines.push(...ema.lines);
  tables.push(...ema.tables);
  for (const w of f.warnings) lines.push({ kind: 'warning', text: w });
  for (const k of f.ema.cautions) lines.push({ kind: 'caution', text: k });
  return {
    id: 'flood-record',
    title: 'Flood record: log-Pearson III by expected moments',
    ...(ema.answer ? { answer: ema.answer } : {}),
    lead: 'A peak file read as one flood record: the systematic peaks, the historic peaks with their perception threshold, the peaks known only within bounds and the low outliers all enter the expected moments algorithm; the station skew is weighted with the regional skew when one is given.',
    lines,
    tables,
    charts: [],
    terms: ['return'],
  };
};

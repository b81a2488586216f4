/** The flood section (annual maxima): return levels with intervals, design-life exceedance. Pure. */
import { sig } from '../format.js';
import type { BlockLine, BlockTable, SectionView } from './block.js';
import { end, pct, withU } from './numbers.js';

export const floodSection: SectionView = ({ report: r, selected: c, units: u }) => {
  const f = r.flood;
  if (!f) return null;
  const lines: BlockLine[] = [{ kind: 'fact', text: `Record: ${f.recordLength} annual maxima. Return periods asked for: ${f.periods.join(', ')} years.` }];
  const tables: BlockTable[] = [];
  const top = c?.returnLevels?.[c.returnLevels.length - 1];
  const answer = c && top
    ? `${sig(top.period)}-year level under ${c.label}: ${withU(sig(top.estimate), u)}, ${pct(f.confidence)} interval ${end(top.lower, 'not closed')} to ${end(top.upper, 'unbounded')}${top.beyondRecord ? `; far beyond the ${f.recordLength}-year record, so the model's tail, not the data, sets it` : ''}.`
    : undefined;
  if (c?.returnLevels) {
    tables.push({
      caption: `Return levels under ${c.label}, two-sided ${pct(f.confidence)} intervals (${c.returnLevelMethod ?? ''}).`,
      head: ['Return period T [years]', 'Chance per year', `Level${u ? ` [${u}]` : ''}`, 'Lower', 'Upper', 'Record'],
      rows: c.returnLevels.map((x) => [sig(x.period), sig(x.exceedanceProbability, 3), sig(x.estimate), end(x.lower, 'not closed'), end(x.upper, 'unbounded'), x.beyondRecord ? 'far beyond (> 2 × record)' : 'within reach']),
    });
  }
  if (f.designLife) {
    tables.push({
      caption: `Chance of at least one exceedance within a design life of ${f.designLife.years} years, 1 − (1 − 1/T)^L (independent years).`,
      head: ['Return period T [years]', `Chance in ${f.designLife.years} years`],
      rows: f.designLife.exceedance.map((x) => [sig(x.period), x.probability > 0.999 ? '> 99.9 %' : pct(x.probability)]),
      folded: true,
    });
  }
  lines.push({ kind: 'note', text: `Plotting positions: ${f.plottingPositions.description}.` });
  if (f.gevSignNote) lines.push({ kind: 'note', text: f.gevSignNote });
  for (const w of f.warnings) lines.push({ kind: 'warning', text: w });
  if (c) for (const w of c.warnings ?? []) lines.push({ kind: 'warning', text: `${c.label}: ${w}` });
  for (const k of f.cautions) lines.push({ kind: 'caution', text: k });
  return {
    id: 'flood',
    title: 'Flood levels by return period',
    ...(answer ? { answer } : {}),
    lead: 'The level exceeded on average once in T years, with its interval, and the chance of seeing it during the life of the works.',
    lines,
    tables,
    charts: ['return-period'],
    terms: ['return', 'xi', 'plotpos'],
  };
};

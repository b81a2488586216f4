/**
 * What would change the answer: each decision number across the models no test rejects, said as
 * a range with the model at each end; the side-by-side numbers on demand. Pure.
 */
import { capital } from '../families.js';
import { sig } from '../format.js';
import type { BlockLine, SectionView } from './block.js';
import { end } from './numbers.js';

export const sensitivitySection: SectionView = ({ report: r }) => {
  const rows = r.sensitivity;
  if (!rows || rows.length === 0) return null;
  const families: string[] = [];
  const labels = new Map<string, string>();
  for (const row of rows) for (const v of row.values) if (!labels.has(v.family)) { labels.set(v.family, capital(v.label)); families.push(v.family); }
  const none = rows.some((x) => x.basis !== 'passing');
  const lines: BlockLine[] = [
    {
      kind: none ? 'warning' : 'note',
      text: none
        ? 'No model passes every test, so no spread is drawn: a range across rejected models (one of them can be absurd) says nothing about the choice of model. The numbers under each are in the table, for comparison only.'
        : 'Only models that no test rejects are compared. A wide spread means the choice of model, not the data, decides the number.',
    },
  ];
  for (const row of rows) {
    if (row.basis !== 'passing') continue; // rejected models never enter a spread (said above)
    if (row.values.length < 2) {
      lines.push({ kind: 'fact', text: `${row.quantity}: only ${capital(row.values[0]?.label ?? '')} gives it; there is no other acceptable model to compare with.` });
      continue;
    }
    const lo = row.values.reduce((a, b) => (b.estimate < a.estimate ? b : a));
    const hi = row.values.reduce((a, b) => (b.estimate > a.estimate ? b : a));
    const spread = row.min > 0 ? `, a factor of ${sig(row.max / row.min, 3)}` : '';
    lines.push({ kind: 'fact', text: `${row.quantity}: from ${sig(lo.estimate)} (${capital(lo.label)}) to ${sig(hi.estimate)} (${capital(hi.label)}) across ${row.values.length} models${spread}.` });
  }
  return {
    id: 'sensitivity',
    title: 'What would change the answer',
    lead: 'The same decision numbers under each acceptable model: how much the choice of model moves them.',
    lines,
    tables: [{
      caption: 'Each decision number under every listed model (estimate, interval where one exists), with the spread.',
      head: ['Decision number', ...families.map((f) => labels.get(f) ?? f), 'Spread (max/min)'],
      rows: rows.map((row) => [
        row.quantity,
        ...families.map((f) => {
          const v = row.values.find((x) => x.family === f);
          if (!v) return '—';
          const iv = v.lower !== undefined || v.upper !== undefined ? ` (${end(v.lower, '…')} to ${end(v.upper, '…')})` : '';
          return `${sig(v.estimate)}${iv}${v.passes ? '' : ' ✗'}`;
        }),
        row.basis !== 'passing' ? '— (every model rejected)' : row.min > 0 ? `${sig(row.max / row.min, 3)}×` : `${sig(row.min)} to ${sig(row.max)}`,
      ]),
      folded: true,
    }],
    charts: [],
    terms: ['sensitivity'],
  };
};

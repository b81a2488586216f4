/** The trend section: Mann–Kendall test and Sen's slope over the time order. Pure. */
import { pValue, sig } from '../format.js';
import type { BlockLine, SectionView } from './block.js';
import { pct } from './numbers.js';

export const trendSection: SectionView = ({ report: r }) => {
  const t = r.trend;
  if (!t) return null;
  const lines: BlockLine[] = [{ kind: 'note', text: `Order from ${t.orderFrom === 'column' ? 'the order/year column' : 'the row order'}. ${t.method}` }];
  if (t.warning) lines.push({ kind: 'warning', text: t.warning });
  for (const k of t.cautions) lines.push({ kind: 'caution', text: k });
  return {
    id: 'trend',
    title: 'Drift over time',
    answer: t.decision,
    lead: 'Do the values creep up or down with time? A trend breaks the assumption that every value comes from one distribution.',
    lines,
    tables: [{
      caption: "Mann–Kendall trend test and Sen's slope.",
      head: ['n', 'S', 'Z', 'p (two-sided)', 'Kendall τ-b', 'Sen slope per unit of order', 'Interval'],
      rows: [[String(t.n), String(t.s), sig(t.z, 3), `${pValue(t.pValue)} (${t.pMethod})`, sig(t.tauB, 3), t.senSlope ? sig(t.senSlope.estimate, 4) : '—', t.senSlope ? `${sig(t.senSlope.lower, 4)} to ${sig(t.senSlope.upper, 4)} (${pct(t.senSlope.confidence)})` : '—']],
      folded: true,
    }],
    charts: [],
    terms: ['mk'],
  };
};

/** Trend options: the Mann–Kendall test and Sen's slope on an order column or the row order. */
import type { OptionSpec } from './spec.js';

export const TREND_OPTIONS: readonly OptionSpec[] = [
  {
    name: 'orderColumn',
    cli: '--order-column',
    kind: 'column',
    jsonData: 'order',
    default: null,
    appliesTo: ['trend', 'complete'],
    help: 'time or year of each value (all distinct): Mann–Kendall test and Sen\'s slope in that order',
    group: 'trend',
  },
  {
    name: 'trend',
    cli: '--trend',
    kind: 'boolean',
    default: false,
    appliesTo: ['trend', 'complete'],
    help: 'the same trend check on the values in their file order',
    group: 'trend',
  },
];

/**
 * The many-series page's state, pure: the summary rows of a batch (one per series, as the core's
 * summarizeSeries gives them), how they are sorted and filtered, and which rows a scrolled window
 * shows. No DOM; unit-tested in test/client/batch-state.test.ts.
 */
import type { SeriesSummary } from '../../../core/index.js';

export type SortKey = 'series' | 'n' | 'best' | 'estimate' | 'warnings' | 'verdict';
export type VerdictFilter = 'all' | 'rejected' | 'not-rejected' | 'errors';

export interface Filters {
  readonly verdict: VerdictFilter;
  /** A model label, or '' for any. */
  readonly model: string;
  /** Only series with at least one warning. */
  readonly warningsOnly: boolean;
  /** Case-insensitive substring of the series key. */
  readonly text: string;
}

export interface View {
  readonly sort: SortKey;
  readonly descending: boolean;
  readonly filters: Filters;
}

export const DEFAULT_VIEW: View = { sort: 'series', descending: false, filters: { verdict: 'all', model: '', warningsOnly: false, text: '' } };

/** A row's verdict in one word: 'error', 'rejected' (by either test) or 'ok'. */
export function verdictOf(r: SeriesSummary): 'error' | 'rejected' | 'ok' {
  if (r.status === 'error') return 'error';
  return r.chiSquare === 'rejected' || r.andersonDarling === 'rejected' ? 'rejected' : 'ok';
}

function passes(r: SeriesSummary, f: Filters): boolean {
  const v = verdictOf(r);
  if (f.verdict === 'errors' && v !== 'error') return false;
  if (f.verdict === 'rejected' && v !== 'rejected') return false;
  if (f.verdict === 'not-rejected' && v !== 'ok') return false;
  if (f.model !== '' && r.best !== f.model) return false;
  if (f.warningsOnly && r.warnings === 0) return false;
  if (f.text !== '' && !r.series.toLowerCase().includes(f.text.toLowerCase())) return false;
  return true;
}

const collator = new Intl.Collator('en', { numeric: true });

function compare(a: SeriesSummary, b: SeriesSummary, key: SortKey): number {
  switch (key) {
    case 'series':
      return collator.compare(a.series, b.series);
    case 'best':
      return collator.compare(a.best ?? '~', b.best ?? '~');
    case 'verdict':
      return collator.compare(verdictOf(a), verdictOf(b));
    case 'n':
    case 'estimate':
    case 'warnings': {
      const x = a[key];
      const y = b[key];
      // Missing numbers sort last whatever the direction.
      if (x === null && y === null) return 0;
      if (x === null) return Number.POSITIVE_INFINITY;
      if (y === null) return Number.NEGATIVE_INFINITY;
      return x - y;
    }
  }
}

/** Indices of the rows that pass the filters, in the view's order (stable). */
export function visibleRows(rows: readonly SeriesSummary[], view: View): number[] {
  const idx: number[] = [];
  for (let i = 0; i < rows.length; i++) if (passes(rows[i] as SeriesSummary, view.filters)) idx.push(i);
  const sign = view.descending ? -1 : 1;
  idx.sort((i, j) => {
    const c = compare(rows[i] as SeriesSummary, rows[j] as SeriesSummary, view.sort);
    if (!Number.isFinite(c)) return c > 0 ? 1 : -1; // missing last in both directions
    return sign * c || i - j;
  });
  return idx;
}

/** Clicking a column header: the same column flips the direction, another sorts ascending by it. */
export function sortBy(view: View, key: SortKey): View {
  return { ...view, sort: key, descending: view.sort === key ? !view.descending : false };
}

/** The rows a window of `height` px scrolled to `top` shows, with `overscan` rows either side. */
export function windowOf(count: number, rowHeight: number, top: number, height: number, overscan = 8): { first: number; last: number } {
  const first = Math.max(0, Math.floor(top / rowHeight) - overscan);
  const last = Math.min(count, Math.ceil((top + height) / rowHeight) + overscan);
  return { first, last };
}

/** The distinct best-model labels, for the model filter. */
export function modelsOf(rows: readonly SeriesSummary[]): string[] {
  return [...new Set(rows.map((r) => r.best).filter((b): b is string => b !== null))].sort((a, b) => collator.compare(a, b));
}

/** Counts for the headline: series, analysed, with the best model rejected, not analysed. */
export function tally(rows: readonly SeriesSummary[]): { total: number; ok: number; rejected: number; errors: number; warned: number } {
  let ok = 0;
  let rejected = 0;
  let errors = 0;
  let warned = 0;
  for (const r of rows) {
    const v = verdictOf(r);
    if (v === 'error') errors++;
    else if (v === 'rejected') rejected++;
    else ok++;
    if (r.warnings > 0) warned++;
  }
  return { total: rows.length, ok, rejected, errors, warned };
}

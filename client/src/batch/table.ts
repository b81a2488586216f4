/**
 * The summary table of a batch, virtualised: only the rows a scrolled window shows (plus a few) are
 * in the document, between two spacer rows that keep the scroll height of all of them, so 10,000
 * series scroll smoothly. Pure apart from the DOM it builds; a row's button opens that series.
 */
import { formatNumber, type SeriesSummary } from '../../../core/index.js';
import { el, clear } from '../dom.js';
import { verdictOf, windowOf, type SortKey, type View } from './state.js';

export const ROW_HEIGHT = 30;

const COLUMNS: readonly { key: SortKey | null; label: string; title: string }[] = [
  { key: 'series', label: 'Series', title: 'The series key (its name in the file)' },
  { key: 'n', label: 'n', title: 'Values analysed' },
  { key: 'best', label: 'Best model', title: 'Smallest AICc among the models that reached a maximum' },
  { key: 'verdict', label: 'Tests on it', title: 'Chi-square and Anderson–Darling verdicts on the best model at α' },
  { key: 'estimate', label: 'Decision number', title: 'The number asked for under the best model, with its interval' },
  { key: 'warnings', label: 'Warnings', title: 'Warnings in the series’ report' },
  { key: null, label: '', title: '' },
];

function verdictText(r: SeriesSummary): string {
  const v = verdictOf(r);
  if (v === 'error') return 'not analysed';
  if (v === 'ok') return 'neither rejects';
  const by = [r.chiSquare === 'rejected' ? 'chi-square' : '', r.andersonDarling === 'rejected' ? 'A–D' : ''].filter(Boolean).join(' and ');
  return `rejected by ${by}`;
}

function numberText(r: SeriesSummary): string {
  if (r.status === 'error') return r.message ?? '';
  if (r.estimate === null) return '—';
  const ends = r.lower !== null || r.upper !== null ? ` (${r.lower === null ? '…' : formatNumber(r.lower)} to ${r.upper === null ? '…' : formatNumber(r.upper)})` : '';
  return `${formatNumber(r.estimate)}${ends}`;
}

export interface TableHandles {
  readonly scroller: HTMLElement;
  readonly body: HTMLTableSectionElement;
  readonly head: HTMLTableSectionElement;
}

/** The table's frame (once): a scroll box with a sticky header. */
export function tableFrame(): TableHandles & { readonly root: HTMLElement } {
  const head = el('thead');
  const body = el('tbody');
  const scroller = el('div', { className: 'series-scroll', tabindex: 0, 'aria-label': 'Series summary (scrolls)' }, el('table', { className: 'series-table' }, head, body));
  return { root: scroller, scroller, head, body };
}

/** Header cells with the sort state; `onSort` gets the column clicked. */
export function renderHead(h: TableHandles, view: View, onSort: (key: SortKey) => void): void {
  clear(h.head);
  const tr = el('tr');
  for (const c of COLUMNS) {
    if (c.key === null) {
      tr.append(el('th', { scope: 'col' }, el('span', { className: 'visually-hidden' }, 'Open')));
      continue;
    }
    const sorted = view.sort === c.key;
    const b = el('button', { type: 'button', className: 'sort', title: c.title }, c.label, sorted ? (view.descending ? ' ▾' : ' ▴') : '');
    const key = c.key;
    b.addEventListener('click', () => onSort(key));
    tr.append(el('th', { scope: 'col', 'aria-sort': sorted ? (view.descending ? 'descending' : 'ascending') : 'none' }, b));
  }
  h.head.append(tr);
}

/** The rows in the scrolled window; returns how many row elements are in the document. */
export function renderRows(h: TableHandles, rows: readonly SeriesSummary[], order: readonly number[], onOpen: (index: number) => void): number {
  const { first, last } = windowOf(order.length, ROW_HEIGHT, h.scroller.scrollTop, h.scroller.clientHeight || 600);
  clear(h.body);
  // Heights through the CSSOM (the page's CSP allows no style attributes).
  const spacer = (px: number): HTMLTableRowElement => {
    const tr = el('tr', { className: 'spacer', 'aria-hidden': 'true' });
    tr.style.height = `${px}px`;
    return tr;
  };
  if (first > 0) h.body.append(spacer(first * ROW_HEIGHT));
  for (let k = first; k < last; k++) {
    const i = order[k] as number;
    const r = rows[i] as SeriesSummary;
    const v = verdictOf(r);
    const open = el('button', { type: 'button', className: 'open', disabled: r.status === 'error' }, 'Open');
    open.addEventListener('click', () => onOpen(i));
    const tr = el(
        'tr',
        { className: `row-${v}` },
        el('th', { scope: 'row' }, r.series),
        el('td', { className: 'num' }, r.n === null ? '' : String(r.n)),
        el('td', {}, r.best ?? (r.status === 'error' ? '' : 'none ranked')),
        el('td', {}, verdictText(r)),
        el('td', { className: r.status === 'error' ? 'err' : 'num' }, numberText(r)),
        el('td', { className: 'num' }, r.warnings > 0 ? String(r.warnings) : ''),
        el('td', {}, open),
      );
    tr.style.height = `${ROW_HEIGHT}px`;
    h.body.append(tr);
  }
  if (last < order.length) h.body.append(spacer((order.length - last) * ROW_HEIGHT));
  return last - first;
}

/**
 * One trade section of the decision area as plain data (an answer sentence, lines, tables, chart
 * slots), and its two renderings: DOM nodes for the page (text through textContent only) and
 * escaped HTML for the exported report, so both say the same thing. Section views
 * (views/sections.ts) build blocks; nothing here computes a number.
 */
import type { DatasetCandidate, DatasetReport } from '../../../core/index.js';
import { escapeHtml as e } from '../escape.js';
import { el } from '../dom.js';
import { GLOSSARY } from './glossary.js';

export type ChartSlot = 'life-probability' | 'hazard' | 'return-period' | 'capability-histogram' | 'control-chart' | 'range-chart' | 'turnbull' | 'lmoment-diagram' | 'ema-return-period' | 'threshold-mean-excess' | 'threshold-stability' | 'modes-reliability';

export interface BlockTable {
  readonly caption: string;
  readonly head: readonly string[];
  readonly rows: readonly (readonly string[])[];
  /** Shown on demand (inside a disclosure) on the page; always printed in the report. */
  readonly folded?: boolean;
}

export interface BlockLine {
  readonly kind: 'fact' | 'note' | 'warning' | 'caution';
  readonly text: string;
}

export interface SectionBlock {
  /** The report section key (life, flood, capability, trend, sensitivity, ...). */
  readonly id: string;
  readonly title: string;
  /** The section's answer in one sentence, first on screen. */
  readonly answer?: string;
  readonly lead: string;
  readonly lines: readonly BlockLine[];
  readonly tables: readonly BlockTable[];
  readonly charts: readonly ChartSlot[];
  /** Glossary keys (views/glossary.ts) of the symbols the block uses; linked under it on the page. */
  readonly terms?: readonly string[];
}

/** What a section view is given: the report, the selected candidate (label capitalised), the units. */
export interface SectionInput {
  readonly report: DatasetReport;
  readonly selected: DatasetCandidate | undefined;
  readonly units: string;
}

/** A pure section view: the block to show, or null when the report has no such section. */
export type SectionView = (input: SectionInput) => SectionBlock | null;

const LINE_LABEL: Record<BlockLine['kind'], string> = { fact: '', note: 'Note: ', warning: 'Warning: ', caution: 'Caution: ' };

function tableNode(t: BlockTable): HTMLElement {
  const table = el('table', { className: 'decision-table' }, el('caption', {}, t.caption), el('thead', {}, el('tr', {}, ...t.head.map((h) => el('th', { scope: 'col' }, h)))));
  table.append(el('tbody', {}, ...t.rows.map((r) => el('tr', {}, ...r.map((v, i) => el(i === 0 ? 'th' : 'td', i === 0 ? { scope: 'row' } : {}, v))))));
  const box = el('div', { className: 'table-scroll' }, table);
  return t.folded ? el('details', { className: 'block-more' }, el('summary', {}, t.caption.split(/[.:;]/)[0] ?? 'The numbers'), box) : box;
}

/** DOM for one block; `chart` makes the element a chart slot is drawn into. */
export function blockNode(b: SectionBlock, chart: (slot: ChartSlot) => HTMLElement): HTMLElement {
  const sec = el('section', { className: `decision-block decision-${b.id}`, 'data-block': b.id, 'aria-labelledby': `decision-${b.id}-h` });
  sec.append(el('h3', { id: `decision-${b.id}-h` }, b.title));
  if (b.answer) sec.append(el('p', { className: 'block-answer' }, b.answer));
  sec.append(el('p', { className: 'hint tight' }, b.lead));
  const facts = el('ul', { className: 'decision-lines' });
  for (const l of b.lines) facts.append(el('li', { className: `line-${l.kind}` }, l.kind === 'fact' ? null : el('strong', {}, LINE_LABEL[l.kind]), l.text));
  for (const t of b.tables.filter((x) => !x.folded)) sec.append(tableNode(t));
  if (b.charts.length > 0) sec.append(el('div', { className: 'decision-charts' }, ...b.charts.map((s) => chart(s))));
  sec.append(facts);
  for (const t of b.tables.filter((x) => x.folded)) sec.append(tableNode(t));
  const terms = (b.terms ?? []).map((k) => GLOSSARY.find((g) => g.key === k)).filter((g) => g !== undefined);
  if (terms.length > 0) {
    const p = el('p', { className: 'block-terms small' }, 'Explained under “Words and symbols”: ');
    terms.forEach((g, i) => p.append(i > 0 ? ', ' : '', el('a', { className: 'term', href: `#g-${g.key}` }, g.term)));
    sec.append(p);
  }
  return sec;
}

/** Escaped HTML for one block (the exported report); `chartSvg` gives each slot's SVG markup. */
export function blockHtml(b: SectionBlock, chartSvg: (slot: ChartSlot) => string): string {
  const lines = b.lines.map((l) => `<li class="line-${l.kind}">${l.kind === 'fact' ? '' : `<strong>${e(LINE_LABEL[l.kind])}</strong>`}${e(l.text)}</li>`).join('');
  const tables = b.tables
    .map((t) => `<table><caption class="small">${e(t.caption)}</caption><thead><tr>${t.head.map((h) => `<th>${e(h)}</th>`).join('')}</tr></thead><tbody>${t.rows.map((r) => `<tr>${r.map((v, i) => (i === 0 ? `<th>${e(v)}</th>` : `<td class="num">${e(v)}</td>`)).join('')}</tr>`).join('')}</tbody></table>`)
    .join('');
  const charts = b.charts.map((s) => `<figure>${chartSvg(s)}</figure>`).join('');
  const answer = b.answer ? `<p><strong>${e(b.answer)}</strong></p>` : '';
  return `<section class="decision" data-block="${e(b.id)}"><h3>${e(b.title)}</h3>${answer}<p class="small">${e(b.lead)}</p>${tables}${charts}<ul>${lines}</ul></section>`;
}

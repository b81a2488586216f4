/**
 * The page's exports of the shown result: the printable HTML report (report-html.ts), the report
 * data as JSON, and the bins table as CSV. Each takes the state whose result it records.
 */
import { PAGE_FIELDS } from './page-options.js';
import type { AnalyzeResponse } from './api.js';
import { blockHtml, decisionBlocks } from './decision.js';
import { drawSlot } from './decision-charts.js';
import { download, el, slug } from './dom.js';
import { binsTableRows, drawEvidence, evidenceFor } from './evidence-render.js';
import { buildReportHtml, dataRecord, type DataRecord } from './report-html.js';
import { binsCsv } from './bins-csv.js';
import { isGrouped } from './grouped-view.js';
import type { PageState, Result } from './state.js';
import { $, edgeText, groupedChart, lifeScale, quantity, showError, units } from './render.js';


export function exportName(st: PageState, ext: string): string {
  const stamp = new Date().toISOString().slice(0, 19).replace(/[:T]/g, '-');
  return `plumbline-${slug(st.result?.source ?? '')}-${slug(st.result?.column ?? '')}-${stamp}.${ext}`;
}

export function needResult(st: PageState): AnalyzeResponse | null {
  if (!st.result) {
    showError('There is no result to export yet: load data and run the analysis first.');
    return null;
  }
  return st.result.report;
}

export function decisionReportHtml(st: PageState, resp: AnalyzeResponse): string {
  if (isGrouped(resp)) return '';
  const ctx = { report: resp, selected: st.selected ?? '', lifeScale: lifeScale() };
  return decisionBlocks(resp, st.selected, units(st))
    .map((b) => blockHtml(b, (slot) => drawSlot(slot, el('div'), ctx, { width: 760, height: 440, units: units(st), quantity: quantity(st) || (slot === 'return-period' ? 'Annual maximum' : 'Value') })?.outerHTML ?? ''))
    .join('');
}

/** The page's record for the report: the data the analysis read (or their SHA-256) and the page-only reading settings. */
export async function pageRecord(res: Result): Promise<{ data: DataRecord; settings: [string, string][] }> {
  return {
    data: await dataRecord(res.data.csv),
    settings: [
      ['Decimal mark', res.data.decimal === ',' ? 'comma (,)' : 'point (.)'],
      ['Header line', res.data.header ? 'first line is a header' : 'none: every line is data'],
      ...sentSettings(res.sent),
    ],
  };
}

/** Settings the report's own sections do not restate (the report lists models, tests, confidence, B-lives, periods, limits). */
const RESTATED = new Set(['families', 'alpha', 'bins', 'pMethod', 'replicates', 'seed', 'confidence', 'bLifePercents', 'reliabilityTimes', 'boundMethod', 'returnPeriods', 'designLife', 'plottingPosition', 'lsl', 'usl', 'target', 'trend']);

/** Every other form setting the request carried, by its page label (a transform, an assumed shape, a test plan...). */
export function sentSettings(sent: Readonly<Record<string, unknown>> | undefined): [string, string][] {
  if (!sent) return [];
  const out: [string, string][] = [];
  for (const f of PAGE_FIELDS) {
    if (RESTATED.has(f.name) || f.control === 'role' || !(f.name in sent)) continue;
    const v = sent[f.name];
    const text = Array.isArray(v) ? v.join(', ') : typeof v === 'string' ? (f.choiceWords[v] ?? v) : String(v);
    out.push([f.label, text]);
  }
  return out;
}

export async function exportHtml(st: PageState): Promise<void> {
  const resp = needResult(st);
  const res = st.result;
  // A report without whole-series models (peaks over a threshold) is written too, with its sections and no evidence charts.
  const fam = st.selected ?? '';
  if (!resp || !res) return;
  const base = { response: resp, selected: fam, sourceName: res.source, column: res.column, units: units(st), quantity: quantity(st), generatedAt: new Date(), ...(await pageRecord(res)) };
  if (isGrouped(resp)) {
    const svg = groupedChart(st, resp, fam, el('div'), { width: 760, height: 440 });
    download(exportName(st, 'html'), buildReportHtml({ ...base, charts: svg ? [{ svg: svg.outerHTML, caption: $('cap-grouped').textContent ?? '' }] : [], binsTable: [], requestedBins: null }), 'text/html;charset=utf-8');
    return;
  }
  if (!resp.evidence || fam === '') {
    // Interval rows: no plot data; the report carries the sections (with the Turnbull chart) and the record.
    download(exportName(st, 'html'), buildReportHtml({ ...base, charts: [], binsTable: [], requestedBins: res.requestedBins, decisionHtml: decisionReportHtml(st, resp) }), 'text/html;charset=utf-8');
    return;
  }
  const targets = { histogram: el('div'), probability: el('div'), bins: el('div'), cdf: el('div') };
  const svgs = drawEvidence(targets, resp.evidence, fam, { units: units(st), quantity: quantity(st), sizeOf: () => ({ width: 760, height: 440 }) });
  const captions = ['cap-histogram', 'cap-probability', 'cap-bins', 'cap-cdf'].map((id) => $(id).textContent ?? '');
  const ce = evidenceFor(resp.evidence, fam);
  const html = buildReportHtml({
    ...base,
    charts: svgs.map((s, i) => ({ svg: s.outerHTML, caption: captions[i] ?? '' })),
    binsTable: ce ? binsTableRows(ce, edgeText) : [],
    requestedBins: res.requestedBins,
    decisionHtml: decisionReportHtml(st, resp),
  });
  download(exportName(st, 'html'), html, 'text/html;charset=utf-8');
}

export function exportJson(st: PageState): void {
  const resp = needResult(st);
  if (!resp || !st.result) return;
  const { evidence: _drop, ...report } = resp;
  void _drop;
  const record = { ...report, page: { source: st.result.source, column: st.result.column, units: units(st), quantity: quantity(st), selected: st.selected, exportedAt: new Date().toISOString() } };
  download(exportName(st, 'json'), `${JSON.stringify(record, null, 2)}\n`, 'application/json');
}

export function exportCsv(st: PageState): void {
  const resp = needResult(st);
  if (resp && isGrouped(resp)) {
    showError('Class counts have no equal-probability bins table; the HTML report and the JSON hold the merged classes.');
    return;
  }
  if (resp && !resp.evidence) {
    showError('Life data found at inspections have no equal-probability bins; the HTML report and the JSON hold their numbers.');
    return;
  }
  if (!resp || !resp.evidence || !st.selected || !st.result) return;
  const ce = evidenceFor(resp.evidence, st.selected);
  if (ce) download(exportName(st, 'csv'), binsCsv(ce, st.result.source, st.result.column, units(st)), 'text/csv;charset=utf-8');
}

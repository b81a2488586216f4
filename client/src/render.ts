/**
 * Drawing the page's state into the page's skeleton (index.html): the source panel, the model
 * choices, the answer, the trade sections and the evidence. Each function takes the state it
 * draws; the pure views (views/*.ts, decision.ts, evidence-render.ts) make the nodes. Nothing here
 * changes the state or talks to the server.
 */
import type { AnalyzeResponse, DemoEntry } from './api.js';
import { blockNode, decisionBlocks } from './decision.js';
import { drawSlot } from './decision-charts.js';
import type { LifeScale } from '../charts/life-probability.js';
import { byId, clear, el } from './dom.js';
import { ROLE_FIELDS, roleApplies } from './page-options.js';
import { peakFileNote } from './peak-file-note.js';
import { noteCensoring, noteSeries, unusedModeColumn, unusedStatusColumn } from './source-notes.js';
import { binsTableRows, drawEvidence, evidenceFor } from './evidence-render.js';
import { capital, modelLabel } from './families.js';
import { sig } from './format.js';
import { skipLine } from './skip-words.js';
import { guessFromColumn } from './units-guess.js';
import { binCountsChart } from '../charts/bin-counts.js';
import { cellRows, chartCells, classRows, groupedText, guessGroupedColumns, isGrouped, type GroupedResponse } from './grouped-view.js';
import { namesIntervalColumns } from './interval-view.js';
import { shownLabels, type EvidenceView, type PageState } from './state.js';
import type { RunProgress } from './runner.js';
import { showSettings } from './form.js';
import { answerFor } from './views/answer.js';
import { modelChoices } from './views/models.js';
import { rankingRows, tableHeads } from './views/ranking-table.js';

export const $ = (id: string): HTMLElement => byId(id);
export const input = (id: string): HTMLInputElement => byId<HTMLInputElement>(id);
export const select = (id: string): HTMLSelectElement => byId<HTMLSelectElement>(id);

export const labels = (st: PageState) => shownLabels(st, guessFromColumn);
export const units = (st: PageState): string => labels(st).units.trim();
export const quantity = (st: PageState): string => labels(st).quantity.trim();


export function setStatus(text: string): void {
  $('status').textContent = text;
}

export function setProgress(p: RunProgress | null): void {
  const wrap = $('progress-wrap');
  wrap.hidden = p === null;
  wrap.dataset['stage'] = p?.label ?? '';
  if (!p) return;
  const bar = byId<HTMLProgressElement>('progress');
  if (p.fraction === null) bar.removeAttribute('value');
  else bar.value = p.fraction;
  $('progress-text').textContent = p.text;
  $('progress-label').textContent = p.label;
}

export function showError(message: string | null): void {
  $('error').hidden = message === null;
  $('error').textContent = message ?? '';
}

/** The source panel: name, settings note, reading (header, decimal mark), columns and roles. */
export function renderSource(st: PageState): void {
  const { source, reading } = st;
  $('loaded').hidden = source === null;
  $('source-name').textContent = source ? `${source.name}${source.kind === 'demo' ? ' (demo dataset)' : ''}` : '';
  const note = $('demo-settings');
  note.hidden = !source || st.settingsNote.text === '';
  note.textContent = st.settingsNote.text;
  for (const b of document.querySelectorAll<HTMLElement>('#demo-list button')) b.setAttribute('aria-pressed', String(source?.kind === 'demo' && b.dataset['name'] === source.name));
  if (!source) return;
  input('header-check').checked = reading.header;
  select('decimal-select').value = reading.decimal;
  const dn = $('decimal-note');
  const g = reading.decimalGuess;
  clear(dn);
  // A peak file's numbers are read with a point; its comma separates qualification codes ("2,6"), not decimals.
  dn.hidden = peakFileNote(source.csv) !== null || !(g.example !== '' && (g.mark === ',' || g.ambiguous));
  if (!dn.hidden) {
    const other = reading.decimal === ',' ? '.' : ',';
    dn.append(
      g.ambiguous
        ? `Cells like “${g.example}” could be decimal commas or thousands separators; read with a ${reading.decimal === ',' ? 'comma' : 'point'}. `
        : `Cells like “${g.example}” use a decimal comma, so the numbers are read with a comma${reading.decimal === ',' ? '' : ' (you chose a point)'}. `,
      el('button', { type: 'button', className: 'btn small', id: 'decimal-switch', 'data-mark': other }, other === ',' ? 'Read with a decimal comma' : 'Read with a decimal point'),
    );
  }
  const cs = select('column-select');
  clear(cs);
  for (const c of reading.columns) cs.append(el('option', { value: String(c.index), selected: c.index === reading.column }, reading.columns.length > 1 ? `${c.index}. ${c.label}` : c.label));
  cs.disabled = reading.columns.length <= 1;
  select('shape-select').value = reading.shape;
  $('grouped-cols').hidden = reading.shape !== 'grouped';
  $('interval-cols').hidden = reading.shape !== 'interval';
  $('value-cols').hidden = reading.shape !== 'values';
  // The column roles that apply to this shape of data (page-options.ts roleApplies): all for one value per row,
  // the failure-mode column for interval rows, none for class counts.
  for (const f of ROLE_FIELDS) {
    const box = document.querySelector<HTMLElement>(`[data-role-field="${f.name}"]`);
    if (box) box.hidden = !roleApplies(f, reading.shape);
  }
  // A peak file's columns are read by name (peak_dt, peak_va, peak_cd): no column role applies; the page says what it holds.
  const peak = peakFileNote(source.csv);
  $('roles').hidden = peak !== null || !ROLE_FIELDS.some((f) => roleApplies(f, reading.shape));
  const pn = document.getElementById('peak-file-note');
  if (pn) {
    pn.hidden = peak === null;
    pn.textContent = peak ?? '';
  }
  $('roles-hint').hidden = reading.shape !== 'values';
  $('roles-interval-hint').hidden = reading.shape !== 'interval';
  const fill = (id: string, chosen: number): void => {
    const sel = select(id);
    clear(sel);
    for (const c of reading.columns) sel.append(el('option', { value: String(c.index), selected: c.index === chosen }, `${c.index}. ${c.label}`));
  };
  fill('lower-select', reading.grouped.lower);
  fill('upper-select', reading.grouped.upper);
  fill('count-select', reading.grouped.count);
  fill('interval-start-select', reading.interval.start);
  fill('interval-end-select', reading.interval.end);
  fill('interval-count-select', reading.interval.count);
  select('interval-count-select').prepend(el('option', { value: '0', selected: reading.interval.count === 0 }, 'none (each row is one unit)'));
  select('interval-count-select').value = String(reading.interval.count);
  showSettings(st.settings, reading.columns, reading.column);
  renderLabels(st);
  noteCensoring(st);
  noteSeries(st);
  // Chi-square bins (the option table: bins apply to a complete sample) mean nothing for interval rows: the field and its hint are hidden.
  const bins = document.getElementById('bins-input');
  const binsBox = bins?.closest<HTMLElement>('.field') ?? bins?.closest<HTMLElement>('.field-row');
  if (binsBox) binsBox.hidden = reading.shape === 'interval';
}

export function renderLabels(st: PageState): void {
  const l = labels(st);
  if (!st.labels.typed) {
    input('quantity-input').value = l.quantity;
    input('units-input').value = l.units;
  }
  $('units-hint').textContent = l.suggested && (l.quantity || l.units) ? 'Suggested from the column name; correct them if wrong. Used on every chart axis and in the exported report.' : 'Used on every chart axis and in the exported report.';
}

/** Everything drawn from the result: counts, model choices, numbers, answer, sections, evidence. */
export function renderResult(st: PageState): void {
  const res = st.result;
  const resp = res?.report ?? null;
  $('stale-note').hidden = !res || res.current;
  $('stale-note').textContent = res && !res.current ? `These results are from the previous analysis of ${res.source} (column ${res.column}); the latest run did not finish.` : '';
  renderCounts(st, resp);
  const choices = $('model-choices');
  clear(choices);
  if (resp) choices.append(modelChoices(resp, st.selected));
  const table = byId<HTMLTableElement>('ranking-table');
  for (const g of table.querySelectorAll('tbody')) g.remove();
  if (resp) table.append(...rankingRows(resp, st.selected));
  const heads = tableHeads(isGrouped(resp));
  for (const [id, text] of [['th-chi', heads.chi], ['th-dof', heads.dof], ['th-chip', heads.chiP]] as const) {
    const a = $(id).querySelector('a');
    if (a) a.textContent = text;
  }
  $('ranking-rule').textContent = resp?.rankingRule ?? '';
  const warnings = $('warnings');
  clear(warnings);
  if (resp) {
    const repeats = (w: string) => resp.notApplicable.some((n) => n.reason !== '' && w.includes(n.reason));
    for (const w of [...resp.warnings, ...(resp.input?.warnings ?? [])]) if (!repeats(w)) warnings.append(el('li', {}, w));
  }
  renderAnswer(st);
  renderDecision(st);
  renderEvidence(st);
  if (resp) $('foot').textContent = `${resp.software.name} ${resp.software.version} · analysed on this computer by the local server; nothing is sent elsewhere.`;
}

export function renderCounts(st: PageState, resp: AnalyzeResponse | null): void {
  const counts = $('counts');
  const skips = $('skips');
  clear(skips);
  counts.textContent = '';
  if (!resp) return;
  if (isGrouped(resp)) {
    counts.textContent = `n = ${resp.n} counted in ${resp.grouped.classes.length} classes · no individual values`;
    $('bins-hint').textContent = 'For class counts the chi-square runs on the classes given (merged to at least 5 expected); the bins setting is not used.';
    return;
  }
  const inp = resp.input;
  const skipped = inp?.skipped ?? [];
  const total = skipped.reduce((s, k) => s + k.count, 0);
  const parts = [`n = ${resp.n} values used`];
  if (inp?.rowsRead !== undefined) parts.push(`${inp.rowsRead} data rows read`);
  parts.push(total === 0 ? 'no rows skipped' : `${total} row${total === 1 ? '' : 's'} skipped:`);
  counts.textContent = parts.join(' · ');
  for (const s of skipped) skips.append(el('li', {}, skipLine(s)));
  if (inp?.blankLines) skips.append(el('li', {}, `${inp.blankLines} blank line${inp.blankLines === 1 ? '' : 's'} passed over`));
  const most = Math.floor(resp.n / 5);
  const sel = resp.candidates.find((c) => c.family === st.selected) ?? resp.candidates[0];
  const used = sel && sel.chiSquare.computable && 'kRule' in sel.chiSquare ? ` For ${capital(sel.label)}: ${sel.chiSquare.kRule}` : '';
  $('bins-hint').textContent = `Bins have equal probability under each model, so each expects n/k values. The chi-square approximation needs at least 5 expected per bin: with n = ${resp.n}, k can be at most ${most}.${used}`;
}

export function renderAnswer(st: PageState): void {
  const resp = st.result?.report;
  const head = $('headline');
  const cautions = $('answer-cautions');
  clear(head);
  clear(cautions);
  const a = resp && !isGrouped(resp) ? answerFor(resp, st.selected, units(st)) : null;
  head.hidden = a === null;
  $('answer-empty').hidden = a !== null;
  // The hint says what to ask for; for class counts, why no decision number can be asked (and back to the hint for the next data).
  const empty = $('answer-empty');
  empty.dataset['hint'] ??= empty.textContent ?? '';
  empty.textContent =
    resp && isGrouped(resp)
      ? 'Class counts: this page shows the fits and the chi-square on the classes; B-lives, return levels and capability need individual values.'
      : resp?.pot
        ? 'Peaks over a threshold: the return levels, with their intervals and cautions, are in the section “Peaks over a threshold” below, from the generalized Pareto fit of the event excesses; the models of the whole series are not fitted.'
        : resp?.floodRecord
          ? 'Peak file: the flood levels by return period, with their intervals and cautions, are in the section “Flood record” below; column roles do not apply to a peak file.'
          : empty.dataset['hint'];
  $('answer').classList.toggle('is-undermined', a?.undermined === true);
  // A failed / still-running column left unused undermines every fit on screen: said where the answer is read, not only beside the column.
  const flag = st.result ? unusedStatusColumn(st) : undefined;
  if (flag) {
    cautions.append(
      el(
        'li',
        {},
        `Column “${flag.label}” may mark units still running or removed unfailed, but every value of ${st.result?.column ?? 'the column'} is fitted here as a failure: the fits and every life taken from them are biased low. `,
        el('button', { type: 'button', className: 'btn small use-status', 'data-column': String(flag.index) }, `Use “${flag.label}” as the status column`),
      ),
    );
  }
  const mode = st.result ? unusedModeColumn(st) : undefined;
  if (mode) {
    cautions.append(
      el(
        'li',
        {},
        `Column “${mode.label}” may name the failure mode of each failed unit, but every failure is fitted here as one mode: a life set by one mechanism is mixed with the others'. `,
        el('button', { type: 'button', className: 'btn small use-mode', 'data-column': String(mode.index) }, `Use “${mode.label}” as the failure-mode column`),
      ),
    );
  }
  if (!a) return;
  head.append(el('strong', {}, a.undermined ? 'Not a number to design on as it stands: ' : 'Decision number: '), a.sentence);
  for (const c of a.cautions) cautions.append(el('li', {}, c));
  if (a.change) cautions.append(el('li', { className: 'answer-change' }, el('strong', {}, 'What would change it: '), a.change, ' ', el('a', { href: '#decision' }, 'All numbers and cautions')));
}

export function lifeScale(): LifeScale {
  return select('life-scale-select').value === 'lognormal' ? 'lognormal' : 'weibull';
}

export function chartSize(node: Element): { width: number; height: number } {
  const host = (node as HTMLElement).clientWidth || $('evidence').clientWidth - 40 || 560;
  const w = Math.round(Math.min(1100, Math.max(300, host)));
  return { width: w, height: Math.round(Math.min(430, Math.max(280, w * 0.62))) };
}

export function renderDecision(st: PageState): void {
  const resp = st.result?.report;
  const body = $('decision-body');
  clear(body);
  $('life-scale-row').hidden = !resp || isGrouped(resp) || !resp.life;
  if (!resp || isGrouped(resp)) {
    $('decision-empty').hidden = !resp;
    // No report (a failed load clears it): no model name left from the previous data in the heading.
    if (!resp) $('decision-name').textContent = 'the selected model';
    return;
  }
  $('decision-name').textContent = capital(resp.candidates.find((c) => c.family === st.selected)?.label ?? 'the selected model');
  const blocks = decisionBlocks(resp, st.selected, units(st));
  $('decision-empty').hidden = blocks.length > 0;
  const ctx = { report: resp, selected: st.selected ?? '', lifeScale: lifeScale() };
  const slots: [Parameters<typeof drawSlot>[0], HTMLElement][] = [];
  for (const b of blocks) {
    body.append(
      blockNode(b, (slot) => {
        const box = el('div', { className: 'chart-box', 'data-slot': slot });
        slots.push([slot, box]);
        return el('figure', { className: 'chart' }, box);
      }),
    );
  }
  for (const [slot, box] of slots) drawSlot(slot, box, ctx, { ...chartSize(box), units: units(st), quantity: quantity(st) || (slot === 'return-period' ? 'Annual maximum' : 'Value') });
}

const CHART_IDS = { histogram: 'chart-histogram', probability: 'chart-probability', bins: 'chart-bins', cdf: 'chart-cdf' } as const;

export function renderEvidence(st: PageState): void {
  const resp = st.result?.report ?? null;
  const fam = st.selected;
  const grouped = isGrouped(resp);
  $('grouped-evidence').hidden = !grouped;
  $('value-charts').hidden = grouped;
  if (!resp || !fam) {
    // Nothing selected (no result, or a report without whole-series models, as peaks over a threshold): no stale name or note.
    for (const id of Object.values(CHART_IDS)) clear($(id));
    for (const v of document.querySelectorAll<HTMLElement>('.view-pick, .evidence-view')) v.hidden = !resp ? v.hidden : true;
    $('evidence-name').textContent = 'the selected model';
    const pot = resp && !isGrouped(resp) ? resp.pot : undefined;
    $('evidence-note').hidden = !pot;
    $('evidence-note').textContent = pot ? 'Peaks over a threshold: the evidence is the section’s own — the event peaks against the generalized Pareto fit and the threshold diagnostics, above.' : '';
    return;
  }
  if (isGrouped(resp)) {
    renderGroupedEvidence(st, resp, fam);
    return;
  }
  const views = document.querySelectorAll<HTMLElement>('.view-pick, .evidence-view');
  if (!resp.evidence) {
    // Interval rows (life data found at inspections) have no failure points: the Turnbull boxes of the life section are the evidence.
    for (const v of views) v.hidden = true;
    for (const id of Object.values(CHART_IDS)) clear($(id));
    $('evidence-name').textContent = modelLabel(fam);
    $('evidence-note').hidden = false;
    $('evidence-note').textContent = intervalRows(resp)
      ? 'Life data found at inspections: each failure time is known only to lie within its interval, so there are no failure points to plot against a model. Judge the fit on the Turnbull boxes (where the failures are known to lie) in the section above, and on the inspection-scheme Anderson–Darling test of each model.'
      : 'No plot data came with this report.';
    return;
  }
  for (const v of views) v.hidden = false;
  const ce = evidenceFor(resp.evidence, fam);
  // Censored samples have no bins: the views that need them are not offered (the reason is in the section notes).
  const offered: Record<EvidenceView, boolean> = { probability: true, cdf: true, histogram: ce?.histogram.source !== 'not-applicable', bins: ce?.bins.source !== 'not-applicable' };
  const evidenceView: EvidenceView = offered[st.evidenceView] ? st.evidenceView : 'probability';
  for (const b of document.querySelectorAll<HTMLElement>('.view-pick')) {
    b.hidden = !offered[b.dataset['view'] as EvidenceView];
    b.setAttribute('aria-pressed', String(b.dataset['view'] === evidenceView));
  }
  for (const f of document.querySelectorAll<HTMLElement>('.evidence-view')) f.hidden = f.dataset['view'] !== evidenceView;
  const na = ce?.bins.notApplicable ?? ce?.histogram.notApplicable;
  $('evidence-note').hidden = !na;
  $('evidence-note').textContent = na ? `No histogram or chi-square bins for this sample: ${na.reason}` : '';
  $('evidence-name').textContent = ce ? capital(ce.label) : modelLabel(fam);
  const visible = document.querySelector<HTMLElement>(`.evidence-view[data-view="${evidenceView}"] .chart-box`);
  const size = chartSize(visible ?? $('chart-probability'));
  const targets = { histogram: $(CHART_IDS.histogram), probability: $(CHART_IDS.probability), bins: $(CHART_IDS.bins), cdf: $(CHART_IDS.cdf) };
  drawEvidence(targets, resp.evidence, fam, { units: units(st), quantity: quantity(st), sizeOf: () => size });
  if (ce) {
    $('cap-histogram').textContent = `Bars should follow the heavy ${ce.label} curve; look for runs of bars above or below it. ${ce.histogram.displayEdgeRule ?? ''}`;
    const pp = ce.probabilityPlot;
    const cap = $('cap-probability');
    clear(cap);
    cap.append(
      'Points should lie along the line and mostly inside the ',
      el('a', { className: 'term', href: '#g-band' }, 'pointwise band'),
      `, above all in the tail your decision depends on. Plotting positions: ${pp.plottingPosition.name}, ${pp.plottingPosition.formula}. The band is pointwise, not a simultaneous test.` +
        (pp.thinned ? ` Drawn with ${pp.points.x.length} of ${pp.total} points (extremes kept).` : ''),
    );
    renderBinsTable(st, ce);
  }
}

export function edgeText(x: number | null, isLower: boolean): string {
  if (x === null) return isLower ? '−∞' : '∞';
  return sig(x, 5);
}

export function renderBinsTable(st: PageState, ce: NonNullable<ReturnType<typeof evidenceFor>>): void {
  const t = byId<HTMLTableElement>('bins-table');
  clear(t);
  const [head, ...rows] = binsTableRows(ce, edgeText);
  const u = units(st);
  if (head) t.append(el('caption', { className: 'muted small' }, `${ce.label}: equal-probability bins${u ? `, edges in ${u}` : ''}`), el('thead', {}, el('tr', {}, ...head.map((h) => el('th', { scope: 'col' }, h)))));
  t.append(el('tbody', {}, ...rows.map((r) => el('tr', {}, ...r.map((v) => el('td', {}, v))))));
}

export function groupedChart(st: PageState, resp: GroupedResponse, fam: string, box: Element, size: { width: number; height: number }): SVGSVGElement | null {
  const c = resp.candidates.find((x) => x.family === fam);
  if (!c) return null;
  return binCountsChart(box, { bins: { rows: chartCells(c) }, family: c.family, label: c.label, cell: 'class' }, { ...size, units: units(st), quantity: quantity(st) || 'Value' });
}

export function renderGroupedEvidence(st: PageState, resp: GroupedResponse, fam: string): void {
  const c = resp.candidates.find((x) => x.family === fam);
  $('evidence-name').textContent = c ? capital(c.label) : modelLabel(fam);
  const t = groupedText(resp, c);
  $('grouped-novalues').textContent = `${t.summary} ${t.noValues}`;
  $('grouped-test').textContent = t.test;
  $('grouped-rule').textContent = `Degrees of freedom: ${t.rule}`;
  $('grouped-ad').textContent = t.adNote;
  clear($('chart-grouped'));
  groupedChart(st, resp, fam, $('chart-grouped'), chartSize($('chart-grouped')));
  $('cap-grouped').textContent = 'Grey bars: counts in each class after merging; coloured marks: counts the model expects; dashed line: 5 expected, the usual minimum for the chi-square approximation.';
  const u = units(st);
  const table = (node: HTMLTableElement, rows: string[][], caption: string): void => {
    clear(node);
    const [head, ...body] = rows;
    if (!head) return;
    node.append(
      el('caption', { className: 'muted small' }, caption),
      el('thead', {}, el('tr', {}, ...head.map((h) => el('th', { scope: 'col' }, h)))),
      el('tbody', {}, ...body.map((r) => el('tr', {}, ...r.map((v) => el('td', {}, v))))),
    );
  };
  table(byId<HTMLTableElement>('grouped-cells'), c ? cellRows(c) : [], `${c?.label ?? ''}: classes merged to at least 5 expected${u ? `, limits in ${u}` : ''}`);
  table(byId<HTMLTableElement>('grouped-classes'), classRows(resp), `Classes as read${u ? `, limits in ${u}` : ''}`);
}


/** Whether a report was made from interval rows (life data found at inspections): its input names an interval-end column. */
function intervalRows(resp: AnalyzeResponse): boolean {
  return resp.input?.otherColumns?.some((o) => o.role === 'interval end') === true;
}

export function doneLine(st: PageState): string {
  const res = st.result;
  if (!res) return '';
  const resp = res.report;
  const n = resp.candidates.length;
  // Peaks over a threshold: the models are the section's own (generalized Pareto on the event excesses).
  const pot = isGrouped(resp) ? undefined : resp.pot;
  if (pot) return `Done: peaks over a threshold of ${sig(pot.threshold)}: ${pot.clusters} events in ${sig(pot.years, 3)} years of ${res.column} from ${res.source}.`;
  const record = isGrouped(resp) ? undefined : resp.floodRecord;
  if (record) return `Done: log-Pearson III by expected moments on the ${record.makeUp.text}, from ${res.source}.`;
  const weibayes = isGrouped(resp) ? null : resp.life?.recorded?.report?.weibayes;
  if (n === 0 && weibayes) return `Done: no model could be fitted (${weibayes.failures} failure${weibayes.failures === 1 ? '' : 's'} in ${weibayes.units} units); Weibayes bounds with the shape assumed, from ${res.source}.`;
  if (n === 0) return 'No model could be fitted to these values.';
  const what = isGrouped(resp)
    ? `${resp.n} counted in ${resp.grouped.classes.length} classes`
    : intervalRows(resp)
      ? `${resp.n} units found at inspections (columns ${res.column})`
      : `${resp.n} values of ${res.column}`;
  return `Done: ${n} model${n === 1 ? '' : 's'} fitted to ${what} from ${res.source}.`;
}

export function renderDemoList(list: readonly DemoEntry[]): void {
  const ul = $('demo-list');
  clear(ul);
  for (const d of list) {
    const title = d.name.replace(/[-_]+/g, ' ').replace(/^./, (c) => c.toUpperCase());
    // Said as the page will read it: class counts and inspection intervals have no one value column.
    const cols = d.columns.map((label, i) => ({ index: i + 1, label }));
    const how = guessGroupedColumns(cols) ? 'class counts' : namesIntervalColumns(cols) ? 'found at inspections' : `column ${d.settings?.column ?? d.defaultColumn}`;
    ul.append(el('li', {}, el('button', { type: 'button', 'data-name': d.name, 'aria-pressed': 'false' }, title, el('span', { className: 'demo-cols' }, `${d.file} · ${how}`))));
  }
}

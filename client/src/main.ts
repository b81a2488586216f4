/**
 * The page's wiring: events become actions on the explicit state (state.ts), the state is drawn
 * by the views (views/*.ts, decision.ts, evidence-render.ts), requests are built by request.ts and
 * sent by runner.ts. Nothing here computes a statistic or decides what a setting means. Nothing
 * runs at import: `start()` is called once the page has loaded.
 */
import { api, ApiError, type AnalyzeResponse, type DemoEntry } from './api.js';
import { readFileText } from './read-file.js';
import { blockHtml, blockNode, decisionBlocks } from './decision.js';
import { drawSlot } from './decision-charts.js';
import type { LifeScale } from '../charts/life-probability.js';
import { firstLineIsNumber } from './columns.js';
import { byId, clear, download, el, slug } from './dom.js';
import { binsTableRows, drawEvidence, evidenceFor } from './evidence-render.js';
import { capital, FLOOD_FAMILIES, modelLabel } from './families.js';
import { sig } from './format.js';
import { buildReportHtml } from './report-html.js';
import { binsCsv } from './bins-csv.js';
import { skipLine } from './skip-words.js';
import { guessFromColumn } from './units-guess.js';
import { binCountsChart } from '../charts/bin-counts.js';
import { cellRows, chartCells, classRows, groupedText, isGrouped, type GroupedResponse } from './grouped-view.js';
import { INITIAL_STATE, columnLabel, settingsFromReport, shownLabels, update, type Action, type PageState } from './state.js';
import { buildRequest } from './request.js';
import { LARGE_BYTES, megabytes, Runner, type RunProgress } from './runner.js';
import { applyOptionTable, buildFamilyBoxes, readForm, settingControls, settingKeyOf, showProblems, showSettings } from './form.js';
import type { Settings } from './settings.js';
import { answerFor } from './views/answer.js';
import { modelChoices } from './views/models.js';
import { rankingRows, tableHeads } from './views/ranking-table.js';
import { glossaryNode } from './views/glossary.js';

type EvidenceView = 'probability' | 'histogram' | 'cdf' | 'bins';

let state: PageState = INITIAL_STATE;
let evidenceView: EvidenceView = 'probability';
let demos: readonly DemoEntry[] = [];
let runner: Runner;
let timer: ReturnType<typeof setTimeout> | undefined;
/** Bumped by every new file and by Stop, so a slower earlier read is dropped. */
let loadTicket = 0;
/** True while a file is being read: settings edited meanwhile belong to the file on its way. */
let fileOnItsWay = false;
/** Settings the user changed while a file was on its way, applied once it has loaded. */
let editsForNext: Partial<Record<keyof Settings, unknown>> = {};

const $ = (id: string): HTMLElement => byId(id);
const input = (id: string): HTMLInputElement => byId<HTMLInputElement>(id);
const select = (id: string): HTMLSelectElement => byId<HTMLSelectElement>(id);

function dispatch(action: Action): void {
  state = update(state, action);
}

const labels = () => shownLabels(state, guessFromColumn);
const units = (): string => labels().units.trim();
const quantity = (): string => labels().quantity.trim();

// ---------------------------------------------------------------------------------------------
// Drawing the state

function setStatus(text: string): void {
  $('status').textContent = text;
}

function setProgress(p: RunProgress | null): void {
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

function showError(message: string | null): void {
  $('error').hidden = message === null;
  $('error').textContent = message ?? '';
}

/** The source panel: name, settings note, reading (header, decimal mark), columns and roles. */
function renderSource(): void {
  const { source, reading } = state;
  $('loaded').hidden = source === null;
  $('source-name').textContent = source ? `${source.name}${source.kind === 'demo' ? ' (demo dataset)' : ''}` : '';
  const note = $('demo-settings');
  note.hidden = !source || state.settingsNote.text === '';
  note.textContent = state.settingsNote.text;
  for (const b of document.querySelectorAll<HTMLElement>('#demo-list button')) b.setAttribute('aria-pressed', String(source?.kind === 'demo' && b.dataset['name'] === source.name));
  if (!source) return;
  input('header-check').checked = reading.header;
  select('decimal-select').value = reading.decimal;
  const dn = $('decimal-note');
  const g = reading.decimalGuess;
  clear(dn);
  dn.hidden = !(g.example !== '' && (g.mark === ',' || g.ambiguous));
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
  $('value-cols').hidden = reading.shape === 'grouped';
  const fill = (id: string, chosen: number): void => {
    const sel = select(id);
    clear(sel);
    for (const c of reading.columns) sel.append(el('option', { value: String(c.index), selected: c.index === chosen }, `${c.index}. ${c.label}`));
  };
  fill('lower-select', reading.grouped.lower);
  fill('upper-select', reading.grouped.upper);
  fill('count-select', reading.grouped.count);
  showSettings(state.settings, reading.columns, reading.column);
  renderLabels();
  noteCensoring();
}

function renderLabels(): void {
  const l = labels();
  if (!state.labels.typed) {
    input('quantity-input').value = l.quantity;
    input('units-input').value = l.units;
  }
  $('units-hint').textContent = l.suggested && (l.quantity || l.units) ? 'Suggested from the column name; correct them if wrong. Used on every chart axis and in the exported report.' : 'Used on every chart axis and in the exported report.';
}

const STATUS_NAME = /^(status|state|censor(ed|ing)?|cens|event|failed|failure|suspended|suspension|runout|run_out)$/i;

/**
 * A file with a status-like column probably marks some values as censored. Fitting every value as
 * observed biases a life estimate low, so say so and offer the column.
 */
function noteCensoring(): void {
  const note = $('column-note');
  const r = state.reading;
  const flag = r.shape === 'values' ? r.columns.find((c) => c.index !== r.column && STATUS_NAME.test(c.label.trim())) : undefined;
  clear(note);
  note.hidden = !flag || state.settings.statusColumn === flag.index;
  if (note.hidden || !flag) return;
  note.append(
    `This file has a column “${flag.label}”, which may mark censored values (units still running, specimens that did not fail). ` +
      `Here every value of the chosen column is fitted as an observed value; if some are censored, the fitted life is biased low. ` +
      `Do not base a maintenance interval on this fit without a censored-data analysis. `,
    el('button', { type: 'button', className: 'btn small', id: 'use-status', 'data-column': String(flag.index) }, `Use “${flag.label}” as failed (1) / still running (0)`),
  );
}

/** Everything drawn from the result: counts, model choices, numbers, answer, sections, evidence. */
function renderResult(): void {
  const res = state.result;
  const resp = res?.report ?? null;
  $('stale-note').hidden = !res || res.current;
  $('stale-note').textContent = res && !res.current ? `These results are from the previous analysis of ${res.source} (column ${res.column}); the latest run did not finish.` : '';
  renderCounts(resp);
  const choices = $('model-choices');
  clear(choices);
  if (resp) choices.append(modelChoices(resp, state.selected));
  const table = byId<HTMLTableElement>('ranking-table');
  for (const g of table.querySelectorAll('tbody')) g.remove();
  if (resp) table.append(...rankingRows(resp, state.selected));
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
  renderAnswer();
  renderDecision();
  renderEvidence();
  if (resp) $('foot').textContent = `${resp.software.name} ${resp.software.version} · analysed on this computer by the local server; nothing is sent elsewhere.`;
}

function renderCounts(resp: AnalyzeResponse | null): void {
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
  const sel = resp.candidates.find((c) => c.family === state.selected) ?? resp.candidates[0];
  const used = sel && sel.chiSquare.computable && 'kRule' in sel.chiSquare ? ` For ${capital(sel.label)}: ${sel.chiSquare.kRule}` : '';
  $('bins-hint').textContent = `Bins have equal probability under each model, so each expects n/k values. The chi-square approximation needs at least 5 expected per bin: with n = ${resp.n}, k can be at most ${most}.${used}`;
}

function renderAnswer(): void {
  const resp = state.result?.report;
  const head = $('headline');
  const cautions = $('answer-cautions');
  clear(head);
  clear(cautions);
  const a = resp && !isGrouped(resp) ? answerFor(resp, state.selected, units()) : null;
  head.hidden = a === null;
  $('answer-empty').hidden = a !== null;
  if (resp && isGrouped(resp)) $('answer-empty').textContent = 'Class counts: this page shows the fits and the chi-square on the classes; B-lives, return levels and capability need individual values.';
  $('answer').classList.toggle('is-undermined', a?.undermined === true);
  if (!a) return;
  head.append(el('strong', {}, a.undermined ? 'Not a number to design on as it stands: ' : 'Decision number: '), a.sentence);
  for (const c of a.cautions) cautions.append(el('li', {}, c));
  if (a.change) cautions.append(el('li', { className: 'answer-change' }, el('strong', {}, 'What would change it: '), a.change, ' ', el('a', { href: '#decision' }, 'All numbers and cautions')));
}

function lifeScale(): LifeScale {
  return select('life-scale-select').value === 'lognormal' ? 'lognormal' : 'weibull';
}

function chartSize(node: Element): { width: number; height: number } {
  const host = (node as HTMLElement).clientWidth || $('evidence').clientWidth - 40 || 560;
  const w = Math.round(Math.min(1100, Math.max(300, host)));
  return { width: w, height: Math.round(Math.min(430, Math.max(280, w * 0.62))) };
}

function renderDecision(): void {
  const resp = state.result?.report;
  const body = $('decision-body');
  clear(body);
  $('life-scale-row').hidden = !resp || isGrouped(resp) || !resp.life;
  if (!resp || isGrouped(resp)) {
    $('decision-empty').hidden = !resp;
    return;
  }
  $('decision-name').textContent = capital(resp.candidates.find((c) => c.family === state.selected)?.label ?? 'the selected model');
  const blocks = decisionBlocks(resp, state.selected, units());
  $('decision-empty').hidden = blocks.length > 0;
  const ctx = { report: resp, selected: state.selected ?? '', lifeScale: lifeScale() };
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
  for (const [slot, box] of slots) drawSlot(slot, box, ctx, { ...chartSize(box), units: units(), quantity: quantity() || (slot === 'return-period' ? 'Annual maximum' : 'Value') });
}

const CHART_IDS = { histogram: 'chart-histogram', probability: 'chart-probability', bins: 'chart-bins', cdf: 'chart-cdf' } as const;

function renderEvidence(): void {
  const resp = state.result?.report ?? null;
  const fam = state.selected;
  const grouped = isGrouped(resp);
  $('grouped-evidence').hidden = !grouped;
  $('value-charts').hidden = grouped;
  for (const b of document.querySelectorAll<HTMLElement>('.view-pick')) b.setAttribute('aria-pressed', String(b.dataset['view'] === evidenceView));
  for (const f of document.querySelectorAll<HTMLElement>('.evidence-view')) f.hidden = f.dataset['view'] !== evidenceView;
  if (!resp || !fam) {
    for (const id of Object.values(CHART_IDS)) clear($(id));
    return;
  }
  if (isGrouped(resp)) {
    renderGroupedEvidence(resp, fam);
    return;
  }
  if (!resp.evidence) return;
  const ce = evidenceFor(resp.evidence, fam);
  // Censored samples have no bins: the views that need them are not offered (the reason is in the section notes).
  const offered: Record<EvidenceView, boolean> = { probability: true, cdf: true, histogram: ce?.histogram.source !== 'not-applicable', bins: ce?.bins.source !== 'not-applicable' };
  if (!offered[evidenceView]) evidenceView = 'probability';
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
  drawEvidence(targets, resp.evidence, fam, { units: units(), quantity: quantity(), sizeOf: () => size });
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
    renderBinsTable(ce);
  }
}

function edgeText(x: number | null, isLower: boolean): string {
  if (x === null) return isLower ? '−∞' : '∞';
  return sig(x, 5);
}

function renderBinsTable(ce: NonNullable<ReturnType<typeof evidenceFor>>): void {
  const t = byId<HTMLTableElement>('bins-table');
  clear(t);
  const [head, ...rows] = binsTableRows(ce, edgeText);
  const u = units();
  if (head) t.append(el('caption', { className: 'muted small' }, `${ce.label}: equal-probability bins${u ? `, edges in ${u}` : ''}`), el('thead', {}, el('tr', {}, ...head.map((h) => el('th', { scope: 'col' }, h)))));
  t.append(el('tbody', {}, ...rows.map((r) => el('tr', {}, ...r.map((v) => el('td', {}, v))))));
}

function groupedChart(resp: GroupedResponse, fam: string, box: Element, size: { width: number; height: number }): SVGSVGElement | null {
  const c = resp.candidates.find((x) => x.family === fam);
  if (!c) return null;
  return binCountsChart(box, { bins: { rows: chartCells(c) }, family: c.family, label: c.label, cell: 'class' }, { ...size, units: units(), quantity: quantity() || 'Value' });
}

function renderGroupedEvidence(resp: GroupedResponse, fam: string): void {
  const c = resp.candidates.find((x) => x.family === fam);
  $('evidence-name').textContent = c ? capital(c.label) : modelLabel(fam);
  const t = groupedText(resp, c);
  $('grouped-novalues').textContent = `${t.summary} ${t.noValues}`;
  $('grouped-test').textContent = t.test;
  $('grouped-rule').textContent = `Degrees of freedom: ${t.rule}`;
  $('grouped-ad').textContent = t.adNote;
  clear($('chart-grouped'));
  groupedChart(resp, fam, $('chart-grouped'), chartSize($('chart-grouped')));
  $('cap-grouped').textContent = 'Grey bars: counts in each class after merging; coloured marks: counts the model expects; dashed line: 5 expected, the usual minimum for the chi-square approximation.';
  const u = units();
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

// ---------------------------------------------------------------------------------------------
// Running

function scheduleRun(delay = 350): void {
  if (timer !== undefined) clearTimeout(timer);
  timer = setTimeout(() => {
    timer = undefined;
    void run();
  }, delay);
}

/** Take what the form holds into the state, then run. `changed` is the control the user changed. */
function settingsChanged(delay?: number, changed?: Element): void {
  if (fileOnItsWay) {
    // The user is setting up the analysis of the file being read: keep the edit for it.
    const key = changed ? settingKeyOf(changed) : null;
    if (key) editsForNext = { ...editsForNext, [key]: readForm()[key] };
    return;
  }
  // Return periods given for the first time: also try the extreme-value families.
  if (state.settings.returnPeriods.trim() === '' && input('periods-input').value.trim() !== '') {
    for (const b of document.querySelectorAll<HTMLInputElement>('#family-boxes input[name="family"]')) if ((FLOOD_FAMILIES as readonly string[]).includes(b.value)) b.checked = true;
  }
  dispatch({ type: 'settings-edited', patch: readForm() });
  input('replicates-input').disabled = state.settings.pMethod !== 'bootstrap';
  noteCensoring();
  scheduleRun(delay);
}

async function run(): Promise<void> {
  const source = state.source;
  if (!source) return;
  const out = buildRequest(state);
  showProblems(out.ok ? [] : out.problems);
  if (!out.ok) {
    const classes = out.problems.find((p) => p.field === 'classes');
    if (classes) showError(`${source.name}, classes ${columnLabel(state.reading)}: ${classes.message}`);
    setStatus('Fix the highlighted setting to run the analysis.');
    return;
  }
  dispatch({ type: 'run-started' });
  const generation = state.run.generation;
  showError(null);
  const built = out.built;
  const r = state.reading;
  const dataRows = source.rows !== undefined ? source.rows - (r.header ? 1 : 0) : undefined;
  const rowsNote = `${dataRows !== undefined ? `about ${dataRows.toLocaleString('en-US')} rows` : 'the values'} of ${built.column}`;
  const large = source.csv.length > LARGE_BYTES;
  if (built.kind === 'grouped') setStatus(`Fitting the class counts of ${source.name}…`);
  else if (built.request.pMethod === 'bootstrap') setStatus(`Fitting ${built.column} with bootstrap p-values (B = ${built.request.replicates ?? 999})… the page stays usable; changing a setting starts again.`);
  else setStatus(large ? `Fitting ${built.column} (${rowsNote})… the page stays usable; changing a setting starts again.` : `Fitting ${built.column}…`);
  try {
    const resp = await runner.run(built, (p) => generation === state.run.generation && setProgress(p), rowsNote);
    if (generation !== state.run.generation) return;
    setProgress(null);
    if (!resp) {
      dispatch({ type: 'run-stopped' });
      setStatus('Bootstrap stopped. The results shown (if any) are from the previous analysis.');
      renderResult();
      return;
    }
    dispatch({ type: 'run-finished', generation, report: resp, column: built.column, requestedBins: built.requestedBins });
    renderResult();
    setStatus(doneLine());
  } catch (err) {
    if (generation !== state.run.generation) return;
    setProgress(null);
    const message = err instanceof Error ? err.message : String(err);
    const what = built.kind === 'grouped' ? `classes ${built.column}` : `column ${built.column}`;
    dispatch({ type: 'run-failed', generation, message: `${source.name}, ${what}: ${message}` });
    showError(state.error);
    renderResult();
    setStatus(state.result ? 'The results below are from the previous analysis.' : '');
  }
}

function doneLine(): string {
  const res = state.result;
  if (!res) return '';
  const resp = res.report;
  const n = resp.candidates.length;
  if (n === 0) return 'No model could be fitted to these values.';
  return `Done: ${n} model${n === 1 ? '' : 's'} fitted to ${isGrouped(resp) ? `${resp.n} counted in ${resp.grouped.classes.length} classes` : `${resp.n} values of ${res.column}`} from ${res.source}.`;
}

// ---------------------------------------------------------------------------------------------
// Loading data

/** A new source: the state replaces settings and result; the form and panels are redrawn; a run starts. */
function sourceLoaded(action: Extract<Action, { type: 'source-loaded' }>): void {
  runner.stop();
  setProgress(null);
  dispatch(action);
  if (Object.keys(editsForNext).length > 0) dispatch({ type: 'settings-edited', patch: editsForNext as Partial<Settings> });
  editsForNext = {};
  fileOnItsWay = false;
  showError(null);
  showProblems([]);
  renderSource();
  renderResult();
  scheduleRun(0);
}

function loadFailed(name: string, message: string): void {
  fileOnItsWay = false;
  editsForNext = {};
  runner.stop();
  setProgress(null);
  dispatch({ type: 'load-failed', name, message });
  renderSource();
  renderResult();
  showError(state.error);
  setStatus('Nothing is shown: the file could not be read. Load another file, paste values or pick a demo.');
}

async function loadDemo(name: string): Promise<void> {
  loadTicket++;
  try {
    setStatus(`Loading ${name}…`);
    const d = await api.demo(name);
    const index = d.columns.indexOf(d.settings?.column ?? d.defaultColumn) + 1;
    sourceLoaded({
      type: 'source-loaded',
      source: { kind: 'demo', name: d.name, csv: d.csv },
      header: true,
      ...(index > 0 ? { column: index } : {}),
      ...(d.settings ? { demo: d.settings } : {}),
    });
  } catch (err) {
    loadFailed(name, err instanceof Error ? err.message : String(err));
  }
}

async function loadFile(file: File): Promise<void> {
  const ticket = ++loadTicket;
  runner.stop();
  if (timer !== undefined) clearTimeout(timer);
  const large = file.size > LARGE_BYTES;
  fileOnItsWay = true;
  editsForNext = {};
  try {
    if (large) {
      setStatus(`Reading ${file.name} (${megabytes(file.size)})…`);
      setProgress({ label: 'Reading the file', fraction: 0, text: `0 MB of ${megabytes(file.size)}` });
    }
    const read = await readFileText(
      file,
      (loaded, total) => {
        if (large && ticket === loadTicket) setProgress({ label: 'Reading the file', fraction: total > 0 ? loaded / total : null, text: `${megabytes(loaded)} of ${megabytes(total)}` });
      },
      () => ticket !== loadTicket,
    );
    if (!read || ticket !== loadTicket) {
      if (ticket === loadTicket) fileOnItsWay = false;
      return;
    }
    if (large) setProgress(null);
    if (!/\S/.test(read.text)) {
      loadFailed(file.name, 'the file is empty: there are no values to analyse.');
      return;
    }
    sourceLoaded({ type: 'source-loaded', source: { kind: 'file', name: file.name, csv: read.text, rows: read.lines }, header: !firstLineIsNumber(read.text, '.') && !firstLineIsNumber(read.text, ',') });
  } catch (err) {
    if (ticket !== loadTicket) return;
    loadFailed(file.name, `could not be read: ${err instanceof Error ? err.message : String(err)}`);
  }
}

function renderDemoList(list: readonly DemoEntry[]): void {
  const ul = $('demo-list');
  clear(ul);
  for (const d of list) {
    const title = d.name.replace(/[-_]+/g, ' ').replace(/^./, (c) => c.toUpperCase());
    ul.append(el('li', {}, el('button', { type: 'button', 'data-name': d.name, 'aria-pressed': 'false' }, title, el('span', { className: 'demo-cols' }, `${d.file} · column ${d.defaultColumn}`))));
  }
}

// ---------------------------------------------------------------------------------------------
// Export

function exportName(ext: string): string {
  const stamp = new Date().toISOString().slice(0, 19).replace(/[:T]/g, '-');
  return `plumbline-${slug(state.result?.source ?? '')}-${slug(state.result?.column ?? '')}-${stamp}.${ext}`;
}

function needResult(): AnalyzeResponse | null {
  if (!state.result) {
    showError('There is no result to export yet: load data and run the analysis first.');
    return null;
  }
  return state.result.report;
}

function decisionReportHtml(resp: AnalyzeResponse): string {
  if (isGrouped(resp)) return '';
  const ctx = { report: resp, selected: state.selected ?? '', lifeScale: lifeScale() };
  return decisionBlocks(resp, state.selected, units())
    .map((b) => blockHtml(b, (slot) => drawSlot(slot, el('div'), ctx, { width: 760, height: 440, units: units(), quantity: quantity() || (slot === 'return-period' ? 'Annual maximum' : 'Value') })?.outerHTML ?? ''))
    .join('');
}

function exportHtml(): void {
  const resp = needResult();
  const res = state.result;
  const fam = state.selected;
  if (!resp || !res || !fam) return;
  const base = { response: resp, selected: fam, sourceName: res.source, column: res.column, units: units(), quantity: quantity(), generatedAt: new Date() };
  if (isGrouped(resp)) {
    const svg = groupedChart(resp, fam, el('div'), { width: 760, height: 440 });
    download(exportName('html'), buildReportHtml({ ...base, charts: svg ? [{ svg: svg.outerHTML, caption: $('cap-grouped').textContent ?? '' }] : [], binsTable: [], requestedBins: null }), 'text/html;charset=utf-8');
    return;
  }
  if (!resp.evidence) return;
  const targets = { histogram: el('div'), probability: el('div'), bins: el('div'), cdf: el('div') };
  const svgs = drawEvidence(targets, resp.evidence, fam, { units: units(), quantity: quantity(), sizeOf: () => ({ width: 760, height: 440 }) });
  const captions = ['cap-histogram', 'cap-probability', 'cap-bins', 'cap-cdf'].map((id) => $(id).textContent ?? '');
  const ce = evidenceFor(resp.evidence, fam);
  const html = buildReportHtml({
    ...base,
    charts: svgs.map((s, i) => ({ svg: s.outerHTML, caption: captions[i] ?? '' })),
    binsTable: ce ? binsTableRows(ce, edgeText) : [],
    requestedBins: res.requestedBins,
    decisionHtml: decisionReportHtml(resp),
  });
  download(exportName('html'), html, 'text/html;charset=utf-8');
}

function exportJson(): void {
  const resp = needResult();
  if (!resp || !state.result) return;
  const { evidence: _drop, ...report } = resp;
  void _drop;
  const record = { ...report, page: { source: state.result.source, column: state.result.column, units: units(), quantity: quantity(), selected: state.selected, exportedAt: new Date().toISOString() } };
  download(exportName('json'), `${JSON.stringify(record, null, 2)}\n`, 'application/json');
}

function exportCsv(): void {
  const resp = needResult();
  if (resp && isGrouped(resp)) {
    showError('Class counts have no equal-probability bins table; the HTML report and the JSON hold the merged classes.');
    return;
  }
  if (!resp || !resp.evidence || !state.selected || !state.result) return;
  const ce = evidenceFor(resp.evidence, state.selected);
  if (ce) download(exportName('csv'), binsCsv(ce, state.result.source, state.result.column, units()), 'text/csv;charset=utf-8');
}

// ---------------------------------------------------------------------------------------------
// Wiring

function select_(family: string): void {
  const hadFocus = document.activeElement?.matches('button.model-pick') === true;
  dispatch({ type: 'select', family });
  renderResult();
  // The choices are drawn anew: keep the keyboard where it was.
  if (hadFocus) document.querySelector<HTMLElement>(`#model-choices button[data-family="${CSS.escape(family)}"]`)?.focus();
}

function wire(): void {
  applyOptionTable();
  buildFamilyBoxes($('family-boxes'));
  $('glossary-body').append(glossaryNode());
  const fileInput = input('file-input');
  fileInput.addEventListener('change', () => {
    const f = fileInput.files?.[0];
    if (f) void loadFile(f);
    fileInput.value = '';
  });
  const drop = $('drop-zone');
  for (const t of ['dragenter', 'dragover']) drop.addEventListener(t, (ev) => {
    ev.preventDefault();
    drop.classList.add('over');
  });
  for (const t of ['dragleave', 'drop']) drop.addEventListener(t, () => drop.classList.remove('over'));
  drop.addEventListener('drop', (ev) => {
    ev.preventDefault();
    const f = (ev as DragEvent).dataTransfer?.files?.[0];
    if (f) void loadFile(f);
  });
  // A file dropped elsewhere on the page must not navigate away from it.
  window.addEventListener('dragover', (ev) => ev.preventDefault());
  window.addEventListener('drop', (ev) => ev.preventDefault());

  $('demo-list').addEventListener('click', (ev) => {
    const b = (ev.target as Element).closest<HTMLElement>('button[data-name]');
    if (b?.dataset['name']) void loadDemo(b.dataset['name']);
  });
  $('paste-use').addEventListener('click', () => {
    const text = byId<HTMLTextAreaElement>('paste-text').value;
    if (text.trim() === '') {
      showError('The paste box is empty: paste a column of numbers first.');
      return;
    }
    loadTicket++;
    sourceLoaded({ type: 'source-loaded', source: { kind: 'paste', name: 'Pasted values', csv: text }, header: !firstLineIsNumber(text, '.') && !firstLineIsNumber(text, ',') });
  });

  const reading = (a: Omit<Extract<Action, { type: 'reading-changed' }>, 'type'>): void => {
    dispatch({ type: 'reading-changed', ...a });
    renderSource();
    scheduleRun(0);
  };
  select('column-select').addEventListener('change', () => reading({ column: Number(select('column-select').value) }));
  select('shape-select').addEventListener('change', () => reading({ shape: select('shape-select').value === 'grouped' ? 'grouped' : 'values' }));
  select('lower-select').addEventListener('change', () => reading({ grouped: { lower: Number(select('lower-select').value) } }));
  select('upper-select').addEventListener('change', () => reading({ grouped: { upper: Number(select('upper-select').value) } }));
  select('count-select').addEventListener('change', () => reading({ grouped: { count: Number(select('count-select').value) } }));
  input('header-check').addEventListener('change', () => reading({ header: input('header-check').checked }));
  select('decimal-select').addEventListener('change', () => reading({ decimal: select('decimal-select').value === ',' ? ',' : '.' }));
  $('decimal-note').addEventListener('click', (ev) => {
    const b = (ev.target as Element).closest<HTMLElement>('#decimal-switch');
    if (b) reading({ decimal: b.dataset['mark'] === ',' ? ',' : '.' });
  });
  $('column-note').addEventListener('click', (ev) => {
    const b = (ev.target as Element).closest<HTMLElement>('#use-status');
    if (!b) return;
    select('status-select').value = b.dataset['column'] ?? '0';
    settingsChanged(0);
  });

  // A role column changes what is analysed: run at once; typed values wait a moment for the next keystroke.
  for (const c of settingControls()) c.addEventListener('change', () => settingsChanged(/^(status|subgroup|order)-select$/.test(c.id) ? 0 : undefined, c));
  $('family-boxes').addEventListener('change', (ev) => settingsChanged(undefined, ev.target as Element));
  for (const r of document.querySelectorAll<HTMLInputElement>('input[name="pmethod"]')) r.addEventListener('change', () => settingsChanged(undefined, r));
  $('run-button').addEventListener('click', () => settingsChanged(0));
  $('cancel-button').addEventListener('click', () => {
    const stage = $('progress-wrap').dataset['stage'] ?? '';
    loadTicket++;
    fileOnItsWay = false;
    editsForNext = {};
    runner.stop();
    dispatch({ type: 'run-stopped' });
    setProgress(null);
    renderResult();
    setStatus(`${stage === 'Bootstrap running' ? 'Bootstrap stopped' : 'Stopped'}. The results shown (if any) are from the previous analysis.`);
  });

  $('model-choices').addEventListener('click', (ev) => {
    const b = (ev.target as Element).closest<HTMLElement>('button.model-pick');
    if (b?.dataset['family']) select_(b.dataset['family']);
  });
  for (const b of document.querySelectorAll<HTMLElement>('.view-pick')) {
    b.addEventListener('click', () => {
      evidenceView = (b.dataset['view'] as EvidenceView) ?? 'probability';
      renderEvidence();
    });
  }
  select('life-scale-select').addEventListener('change', renderDecision);
  for (const id of ['quantity-input', 'units-input']) {
    input(id).addEventListener('input', () => {
      dispatch({ type: 'labels-edited', quantity: input('quantity-input').value, units: input('units-input').value });
      renderLabels();
      renderDecision();
      renderEvidence();
      renderAnswer();
    });
  }
  $('export-html').addEventListener('click', exportHtml);
  $('export-json').addEventListener('click', exportJson);
  $('export-csv').addEventListener('click', exportCsv);

  let resizeTimer: ReturnType<typeof setTimeout> | undefined;
  new ResizeObserver(() => {
    if (resizeTimer !== undefined) clearTimeout(resizeTimer);
    resizeTimer = setTimeout(() => {
      renderEvidence();
      renderDecision();
    }, 120);
  }).observe($('evidence'));
}

/** Open the page: the demo list, then the worked scenario already analysed by the server. */
export async function start(): Promise<void> {
  const id = Array.from(crypto.getRandomValues(new Uint8Array(6)), (b) => b.toString(16).padStart(2, '0')).join('');
  runner = new Runner(`page-${id}`);
  wire();
  try {
    const list = await api.demoList();
    demos = list.datasets;
    renderDemoList(demos);
  } catch (err) {
    $('demo-list').append(el('li', { className: 'muted small' }, `Demo list unavailable: ${err instanceof Error ? err.message : String(err)}`));
  }
  try {
    setStatus('Loading the worked scenario…');
    const demo = await api.demoAnalysis();
    const entry = demos.find((d) => d.name === demo.name);
    const col = demo.result.input?.columnIndex ?? (entry ? entry.columns.indexOf(demo.column) + 1 : 0);
    dispatch({ type: 'source-loaded', source: { kind: 'demo', name: demo.name, csv: demo.csv }, header: true, ...(col > 0 ? { column: col } : {}), ...(demo.settings ? { demo: demo.settings } : {}) });
    dispatch({ type: 'settings-edited', patch: settingsFromReport(demo.result, state.settings) });
    dispatch({ type: 'run-started' });
    dispatch({ type: 'run-finished', generation: state.run.generation, report: demo.result, column: columnLabel(state.reading), requestedBins: demo.result.options.bins });
    renderSource();
    renderResult();
    setStatus(doneLine());
  } catch (err) {
    setStatus('Load a CSV file, paste a column of numbers, or pick a worked scenario to begin.');
    if (!(err instanceof ApiError && err.status === 404)) showError(err instanceof Error ? err.message : String(err));
  }
}

/**
 * The page: load measurements, choose how to judge, run the analysis on the local server, show
 * the ranked candidates and the evidence for the selected one, export the record.
 * All statistics come from the server's report; this file only wires inputs to requests and
 * results to views.
 */
import { api, ApiError, type AnalyzeRequest, type AnalyzeResponse, type DemoEntry, type DemoSettings, type SendStage } from './api.js';
import { readFileText } from './read-file.js';
import { blockHtml, blockNode, decisionBlocks, headline } from './decision.js';
import { drawSlot } from './decision-charts.js';
import type { LifeScale } from '../charts/life-probability.js';
import { candidateCells } from './candidate-cells.js';
import { firstLineIsNumber, scanColumns, type ColumnChoice } from './columns.js';
import { byId, clear, download, el, slug } from './dom.js';
import { binsTableRows, drawEvidence, evidenceFor } from './evidence-render.js';
import { FAMILY_CHOICES, FLOOD_FAMILIES } from './families.js';
import { sig } from './format.js';
import { buildReportHtml } from './report-html.js';
import { binsCsv } from './bins-csv.js';
import { skipLine } from './skip-words.js';
import { styleFor } from '../charts/palette.js';
import { guessFromColumn } from './units-guess.js';
import { binCountsChart } from '../charts/bin-counts.js';
import { cellRows, chartCells, classRows, defaultGroupedColumns, groupedText, guessGroupedColumns, isGrouped, readGroupedClasses, type GroupedColumns } from './grouped-view.js';

// ---------------------------------------------------------------------------------------------
// State

interface Source {
  readonly kind: 'demo' | 'file' | 'paste';
  /** What the user knows it by: the demo's name or the file's name. */
  readonly name: string;
  readonly csv: string;
  /** About how many rows (line breaks counted while reading a file), for the progress line. */
  readonly rows?: number;
}

const state = {
  source: null as Source | null,
  columns: [] as ColumnChoice[],
  column: 1,
  response: null as AnalyzeResponse | null,
  /** The column label and source the shown response belongs to. */
  shownFor: { source: '', column: '' },
  selected: null as string | null,
  generation: 0,
  /** Bumped by every new file and by Stop, so a slower earlier read is dropped. */
  loadGeneration: 0,
  abort: null as AbortController | null,
  jobId: null as string | null,
  requestedBins: null as number | null,
  demos: [] as DemoEntry[],
  /** Column roles (1-based column index, or 0 for none). */
  roles: { status: 0, subgroup: 0, order: 0 },
  /** One value per row, or class limits with counts (lower, upper, count columns). */
  shape: 'values' as 'values' | 'grouped',
  groupedCols: { lower: 1, upper: 2, count: 3 } as GroupedColumns,
};

type Workflow = Pick<AnalyzeRequest, 'statusColumn' | 'subgroupColumn' | 'orderColumn' | 'confidence' | 'bLifePercents' | 'boundMethod' | 'reliabilityTimes' | 'returnPeriods' | 'designLife' | 'plottingPosition' | 'lsl' | 'usl' | 'target'>;

/** Identifies this page to the job API, so a new job replaces this page's previous one. */
const CLIENT_ID = `page-${Array.from(crypto.getRandomValues(new Uint8Array(6)), (b) => b.toString(16).padStart(2, '0')).join('')}`;

// ---------------------------------------------------------------------------------------------
// Elements

const $ = {
  demoList: byId<HTMLUListElement>('demo-list'),
  fileInput: byId<HTMLInputElement>('file-input'),
  drop: byId<HTMLLabelElement>('drop-zone'),
  pasteBox: byId<HTMLDetailsElement>('paste-box'),
  pasteText: byId<HTMLTextAreaElement>('paste-text'),
  pasteUse: byId<HTMLButtonElement>('paste-use'),
  loaded: byId('loaded'),
  sourceName: byId('source-name'),
  columnSelect: byId<HTMLSelectElement>('column-select'),
  headerCheck: byId<HTMLInputElement>('header-check'),
  decimalSelect: byId<HTMLSelectElement>('decimal-select'),
  counts: byId('counts'),
  skips: byId<HTMLUListElement>('skips'),
  columnNote: byId('column-note'),
  quantity: byId<HTMLInputElement>('quantity-input'),
  units: byId<HTMLInputElement>('units-input'),
  unitsHint: byId('units-hint'),
  familyBoxes: byId('family-boxes'),
  alpha: byId<HTMLInputElement>('alpha-input'),
  bins: byId<HTMLInputElement>('bins-input'),
  binsHint: byId('bins-hint'),
  replicates: byId<HTMLInputElement>('replicates-input'),
  seed: byId<HTMLInputElement>('seed-input'),
  run: byId<HTMLButtonElement>('run-button'),
  status: byId('status'),
  progressWrap: byId('progress-wrap'),
  progress: byId<HTMLProgressElement>('progress'),
  progressText: byId('progress-text'),
  progressLabel: byId('progress-label'),
  cancel: byId<HTMLButtonElement>('cancel-button'),
  error: byId('error'),
  rankingRule: byId('ranking-rule'),
  summaryLine: byId('summary-line'),
  rankingTable: byId<HTMLTableElement>('ranking-table'),
  notApplicable: byId('not-applicable'),
  warnings: byId<HTMLUListElement>('warnings'),
  evidenceName: byId('evidence-name'),
  charts: {
    histogram: byId('chart-histogram'),
    probability: byId('chart-probability'),
    bins: byId('chart-bins'),
    cdf: byId('chart-cdf'),
  },
  captions: {
    histogram: byId('cap-histogram'),
    probability: byId('cap-probability'),
    bins: byId('cap-bins'),
    cdf: byId('cap-cdf'),
  },
  binsTable: byId<HTMLTableElement>('bins-table'),
  exportHtml: byId<HTMLButtonElement>('export-html'),
  exportJson: byId<HTMLButtonElement>('export-json'),
  exportCsv: byId<HTMLButtonElement>('export-csv'),
  foot: byId('foot'),
  statusSelect: byId<HTMLSelectElement>('status-select'),
  subgroupSelect: byId<HTMLSelectElement>('subgroup-select'),
  orderSelect: byId<HTMLSelectElement>('order-select'),
  demoSettings: byId('demo-settings'),
  confidence: byId<HTMLInputElement>('confidence-input'),
  blife: byId<HTMLInputElement>('blife-input'),
  relTime: byId<HTMLInputElement>('reltime-input'),
  bounds: byId<HTMLSelectElement>('bounds-select'),
  periods: byId<HTMLInputElement>('periods-input'),
  designLife: byId<HTMLInputElement>('designlife-input'),
  plotPos: byId<HTMLSelectElement>('plotpos-select'),
  lsl: byId<HTMLInputElement>('lsl-input'),
  usl: byId<HTMLInputElement>('usl-input'),
  target: byId<HTMLInputElement>('target-input'),
  decisionName: byId('decision-name'),
  headline: byId('headline'),
  decisionBody: byId('decision-body'),
  decisionEmpty: byId('decision-empty'),
  lifeScaleRow: byId('life-scale-row'),
  lifeScale: byId<HTMLSelectElement>('life-scale-select'),
  shapeSelect: byId<HTMLSelectElement>('shape-select'),
  groupedColsBox: byId('grouped-cols'),
  valueCols: byId('value-cols'),
  lowerSelect: byId<HTMLSelectElement>('lower-select'),
  upperSelect: byId<HTMLSelectElement>('upper-select'),
  countSelect: byId<HTMLSelectElement>('count-select'),
  groupedEvidence: byId('grouped-evidence'),
  groupedNoValues: byId('grouped-novalues'),
  groupedTest: byId('grouped-test'),
  chartGrouped: byId('chart-grouped'),
  capGrouped: byId('cap-grouped'),
  groupedCells: byId<HTMLTableElement>('grouped-cells'),
  groupedRule: byId('grouped-rule'),
  groupedAd: byId('grouped-ad'),
  groupedClasses: byId<HTMLTableElement>('grouped-classes'),
  valueCharts: byId('value-charts'),
  binsDetail: byId('bins-detail'),
  rankingHelp: byId('ranking-help'),
  thChi: byId('th-chi'),
  thDof: byId('th-dof'),
  thChiP: byId('th-chip'),
};

/** The page's words that change for grouped counts, as first written in index.html. */
const ORIGINAL = { rankingHelp: $.rankingHelp.innerHTML, decisionEmpty: $.decisionEmpty.innerHTML, thChi: $.thChi.textContent ?? '', thChiTitle: $.thChi.title, thDof: $.thDof.textContent ?? '', thDofTitle: $.thDof.title, thChiP: $.thChiP.textContent ?? '', thChiPTitle: $.thChiP.title };

/** A comma- or space-separated list of numbers; null (with the problem shown) when unusable. */
function numberList(input: HTMLInputElement, ok: (x: number) => boolean, rule: string): number[] | null | undefined {
  const text = input.value.trim();
  if (text === '') {
    fieldProblem(input, null);
    return undefined;
  }
  const parts = text.split(/[\s,;]+/).filter((t) => t !== '');
  const xs = parts.map(Number);
  if (xs.some((x) => !Number.isFinite(x) || !ok(x)) || new Set(xs).size !== xs.length) {
    fieldProblem(input, `${rule}, separated by commas, each once.`);
    return null;
  }
  fieldProblem(input, null);
  return xs;
}

function optionalNumber(input: HTMLInputElement, ok: (x: number) => boolean, rule: string): number | null | undefined {
  const text = input.value.trim();
  if (text === '') {
    fieldProblem(input, null);
    return undefined;
  }
  const x = Number(text);
  if (!Number.isFinite(x) || !ok(x)) {
    fieldProblem(input, rule);
    return null;
  }
  fieldProblem(input, null);
  return x;
}

/** The decision settings as request fields (only those that apply); null when one is unusable. */
function readWorkflow(): Workflow | null {
  let ok = true;
  const out: { -readonly [K in keyof Workflow]: Workflow[K] } = {};
  const conf = optionalNumber($.confidence, (x) => x > 0 && x < 1, 'The confidence must be between 0 and 1, e.g. 0.90.');
  if (conf === null) ok = false;
  const life = state.roles.status > 0;
  const bl = numberList($.blife, (x) => x > 0 && x < 100, 'Give percents between 0 and 100');
  const rt = optionalNumber($.relTime, (x) => x > 0, 'The time must be a number above 0.');
  const rp = numberList($.periods, (x) => x > 1, 'Give return periods in years, each above 1');
  const dl = optionalNumber($.designLife, (x) => x > 0, 'The design life must be a number of years above 0.');
  const lsl = optionalNumber($.lsl, () => true, 'The lower limit must be a number.');
  const usl = optionalNumber($.usl, () => true, 'The upper limit must be a number.');
  const target = optionalNumber($.target, () => true, 'The target must be a number.');
  if ([bl, rt, rp, dl, lsl, usl, target].some((v) => v === null)) ok = false;
  if (typeof lsl === 'number' && typeof usl === 'number' && !(lsl < usl)) {
    fieldProblem($.usl, 'The upper limit must be above the lower one.');
    ok = false;
  }
  if (!ok) return null;
  const capability = typeof lsl === 'number' || typeof usl === 'number';
  if (life) {
    out.statusColumn = state.roles.status;
    if (bl) out.bLifePercents = bl;
    if (typeof rt === 'number') out.reliabilityTimes = [rt];
    out.boundMethod = $.bounds.value === 'fisher-matrix' ? 'fisher-matrix' : 'likelihood-ratio';
  }
  if (!life && rp) {
    out.returnPeriods = rp;
    if (typeof dl === 'number') out.designLife = dl;
    out.plottingPosition = $.plotPos.value as 'weibull' | 'gringorten' | 'cunnane';
  }
  if (!life && capability) {
    if (typeof lsl === 'number') out.lsl = lsl;
    if (typeof usl === 'number') out.usl = usl;
    if (typeof target === 'number') out.target = target;
    if (state.roles.subgroup > 0) out.subgroupColumn = state.roles.subgroup;
  }
  if (!life && state.roles.order > 0) out.orderColumn = state.roles.order;
  if (Object.keys(out).length > 0 && typeof conf === 'number') out.confidence = conf;
  return out;
}

/** Fill the three role selects from the file's columns (never the value column itself). */
function showRoles(): void {
  const fill = (sel: HTMLSelectElement, chosen: number, none: string): number => {
    clear(sel);
    sel.append(el('option', { value: '0' }, none));
    let kept = 0;
    for (const c of state.columns) {
      if (c.index === state.column) continue;
      sel.append(el('option', { value: String(c.index), selected: c.index === chosen }, `${c.index}. ${c.label}`));
      if (c.index === chosen) kept = chosen;
    }
    sel.disabled = state.columns.length <= 1;
    return kept;
  };
  state.roles.status = fill($.statusSelect, state.roles.status, 'none (every value is an observed value)');
  state.roles.subgroup = fill($.subgroupSelect, state.roles.subgroup, 'none');
  state.roles.order = fill($.orderSelect, state.roles.order, 'none');
}

function columnIndexOf(name: string): number {
  return state.columns.find((c) => c.label === name)?.index ?? 0;
}

/** Put a demo's decision settings into the controls and say on screen that they are demo settings. */
function applyDemoSettings(settings: DemoSettings | undefined): void {
  const f = (settings?.fields ?? {}) as Record<string, unknown>;
  const list = (v: unknown): string => (Array.isArray(v) ? v.join(', ') : '');
  state.roles = {
    status: typeof f['statusColumn'] === 'string' ? columnIndexOf(f['statusColumn']) : 0,
    subgroup: typeof f['subgroupColumn'] === 'string' ? columnIndexOf(f['subgroupColumn']) : 0,
    order: typeof f['orderColumn'] === 'string' ? columnIndexOf(f['orderColumn']) : 0,
  };
  showRoles();
  noteCensoring();
  $.blife.value = list(f['bLifePercents']) || '10';
  $.relTime.value = list(f['reliabilityTimes']);
  $.periods.value = list(f['returnPeriods']);
  $.designLife.value = typeof f['designLife'] === 'number' ? String(f['designLife']) : '';
  $.plotPos.value = typeof f['plottingPosition'] === 'string' ? f['plottingPosition'] : 'weibull';
  $.bounds.value = f['boundMethod'] === 'fisher-matrix' ? 'fisher-matrix' : 'likelihood-ratio';
  $.lsl.value = typeof f['lsl'] === 'number' ? String(f['lsl']) : '';
  $.usl.value = typeof f['usl'] === 'number' ? String(f['usl']) : '';
  $.target.value = typeof f['target'] === 'number' ? String(f['target']) : '';
  if (typeof f['confidence'] === 'number') $.confidence.value = String(f['confidence']);
  const fams = Array.isArray(f['families']) ? (f['families'] as string[]) : FAMILY_CHOICES.filter((c) => c.byDefault).map((c) => c.name as string);
  for (const b of $.familyBoxes.querySelectorAll<HTMLInputElement>('input[name="family"]')) b.checked = fams.includes(b.value);
  $.demoSettings.hidden = !settings;
  $.demoSettings.textContent = settings ? `Demo settings: ${settings.description}. Change any of them; the analysis reruns.` : '';
}

function pMethod(): 'table' | 'bootstrap' {
  const checked = document.querySelector<HTMLInputElement>('input[name="pmethod"]:checked');
  return checked?.value === 'bootstrap' ? 'bootstrap' : 'table';
}

function setStatus(text: string): void {
  $.status.textContent = text;
}

function showError(message: string | null): void {
  if (message === null) {
    $.error.hidden = true;
    $.error.textContent = '';
    return;
  }
  $.error.hidden = false;
  $.error.textContent = message;
}

// ---------------------------------------------------------------------------------------------
// Options

function buildFamilyBoxes(): void {
  for (const f of FAMILY_CHOICES) {
    const style = styleFor(f.name);
    const swatch = el('span', { className: 'swatch', 'aria-hidden': 'true' });
    swatch.style.borderTopColor = style.colour;
    swatch.style.borderTopStyle = style.dash ? 'dashed' : 'solid';
    const box = el('input', { type: 'checkbox', value: f.name, name: 'family', checked: f.byDefault });
    $.familyBoxes.append(el('label', {}, box, swatch, f.label));
  }
}

function chosenFamilies(): string[] {
  return [...$.familyBoxes.querySelectorAll<HTMLInputElement>('input[name="family"]:checked')].map((b) => b.value);
}

function fieldProblem(input: HTMLInputElement, message: string | null): void {
  const id = `${input.id}-problem`;
  document.getElementById(id)?.remove();
  if (message === null) {
    input.removeAttribute('aria-invalid');
    input.removeAttribute('aria-describedby');
    return;
  }
  input.setAttribute('aria-invalid', 'true');
  input.setAttribute('aria-describedby', id);
  const row = input.closest('.field-row') ?? input;
  row.after(el('p', { className: 'field-error', id }, message));
}

/** Read the settings; null (with the problems shown beside the fields) when one is unusable. */
function readSettings(): Omit<AnalyzeRequest, 'csv' | 'column' | 'csvOptions' | 'evidence'> | null {
  let ok = true;
  const alpha = Number($.alpha.value);
  if (!(alpha > 0 && alpha < 1)) {
    fieldProblem($.alpha, 'α must be a number between 0 and 1, e.g. 0.05.');
    ok = false;
  } else fieldProblem($.alpha, null);

  let bins: number | null = null;
  if ($.bins.value.trim() !== '') {
    const k = Number($.bins.value);
    if (!Number.isInteger(k) || k < 3) {
      fieldProblem($.bins, 'Bins must be a whole number of at least 3, or empty for automatic.');
      ok = false;
    } else {
      bins = k;
      fieldProblem($.bins, null);
    }
  } else fieldProblem($.bins, null);

  let seed: number | undefined;
  if ($.seed.value.trim() !== '') {
    const s = Number($.seed.value);
    if (!Number.isSafeInteger(s) || s < 0) {
      fieldProblem($.seed, 'The seed must be a whole number ≥ 0.');
      ok = false;
    } else {
      seed = s;
      fieldProblem($.seed, null);
    }
  } else fieldProblem($.seed, null);

  const method = pMethod();
  let replicates: number | undefined;
  if (method === 'bootstrap') {
    const b = Number($.replicates.value);
    if (!Number.isInteger(b) || b < 19 || b > 100000) {
      fieldProblem($.replicates, 'B must be a whole number from 19 to 100000.');
      ok = false;
    } else {
      replicates = b;
      fieldProblem($.replicates, null);
    }
  } else fieldProblem($.replicates, null);
  $.replicates.disabled = method !== 'bootstrap';

  const families = chosenFamilies();
  const famProblem = document.getElementById('families-problem');
  famProblem?.remove();
  if (families.length === 0) {
    $.familyBoxes.after(el('p', { className: 'field-error', id: 'families-problem' }, 'Tick at least one model to try.'));
    ok = false;
  }
  const wf = readWorkflow();
  if (!ok || wf === null) return null;
  const out: Omit<AnalyzeRequest, 'csv' | 'column' | 'csvOptions' | 'evidence'> = { families, alpha, bins, pMethod: method, ...wf };
  return { ...out, ...(seed !== undefined ? { seed } : {}), ...(replicates !== undefined ? { replicates } : {}) };
}

// ---------------------------------------------------------------------------------------------
// Loading data

function decimal(): '.' | ',' {
  return $.decimalSelect.value === ',' ? ',' : '.';
}

function showColumns(columns: readonly ColumnChoice[], chosen: number): void {
  clear($.columnSelect);
  for (const c of columns) {
    $.columnSelect.append(el('option', { value: String(c.index), selected: c.index === chosen }, columns.length > 1 ? `${c.index}. ${c.label}` : c.label));
  }
  $.columnSelect.disabled = columns.length <= 1;
}

function loadSource(source: Source, opts: { header?: boolean; column?: number } = {}): void {
  state.source = source;
  state.selected = null;
  $.quantity.dataset['typed'] = '';
  $.units.dataset['typed'] = '';
  $.loaded.hidden = false;
  $.sourceName.textContent = `${source.name}${source.kind === 'demo' ? ' (demo dataset)' : ''}`;
  const header = opts.header ?? !firstLineIsNumber(source.csv, decimal());
  $.headerCheck.checked = header;
  rescanColumns(opts.column);
  guessShape();
  for (const b of $.demoList.querySelectorAll('button')) b.setAttribute('aria-pressed', String(source.kind === 'demo' && b.dataset['name'] === source.name));
  scheduleRun(0);
}

function rescanColumns(prefer?: number): void {
  if (!state.source) return;
  try {
    const scan = scanColumns(state.source.csv, { header: $.headerCheck.checked, decimal: decimal() });
    state.columns = [...scan.columns];
    state.column = prefer !== undefined && scan.columns.some((c) => c.index === prefer) ? prefer : scan.suggested;
  } catch (err) {
    // The reader could not even read the header: the analysis request will say exactly why.
    state.columns = [{ index: 1, label: '#1' }];
    state.column = 1;
    void err;
  }
  showColumns(state.columns, state.column);
  showRoles();
  showGroupedColumns();
  suggestQuantity();
  noteCensoring();
}

/** Fill the lower / upper / count selects (keeping a choice that still exists) and show the chosen data shape. */
function showGroupedColumns(): void {
  const has = (i: number) => state.columns.some((c) => c.index === i);
  const g = state.groupedCols;
  if (!(has(g.lower) && has(g.upper) && has(g.count))) state.groupedCols = defaultGroupedColumns(state.columns);
  const fill = (sel: HTMLSelectElement, chosen: number): void => {
    clear(sel);
    for (const c of state.columns) sel.append(el('option', { value: String(c.index), selected: c.index === chosen }, `${c.index}. ${c.label}`));
  };
  fill($.lowerSelect, state.groupedCols.lower);
  fill($.upperSelect, state.groupedCols.upper);
  fill($.countSelect, state.groupedCols.count);
  $.shapeSelect.value = state.shape;
  $.groupedColsBox.hidden = state.shape !== 'grouped';
  $.valueCols.hidden = state.shape === 'grouped';
}

/** A new file: read it as class limits with counts when its header names lower, upper and count columns. */
function guessShape(): void {
  const g = guessGroupedColumns(state.columns);
  state.shape = g ? 'grouped' : 'values';
  if (g) state.groupedCols = g;
  showGroupedColumns();
  suggestQuantity();
}

const STATUS_NAME = /^(status|state|censor(ed|ing)?|cens|event|failed|failure|suspended|suspension|runout|run_out)$/i;

/**
 * A file with a status-like column probably marks some values as censored (a unit still running,
 * a specimen that did not fail). This page fits every value of the chosen column as observed,
 * so say so: treating censored times as failures biases a life estimate low.
 */
function noteCensoring(): void {
  const flag = state.columns.find((c) => c.index !== state.column && STATUS_NAME.test(c.label.trim()));
  if (!flag || state.roles.status === flag.index) {
    $.columnNote.hidden = true;
    $.columnNote.textContent = '';
    return;
  }
  $.columnNote.hidden = false;
  $.columnNote.textContent =
    `This file has a column “${flag.label}”, which may mark censored values (units still running, specimens that did not fail). ` +
    `Here every value of the chosen column is fitted as an observed value; if some are censored, the fitted life is biased low. ` +
    `Do not base a maintenance interval on this fit without a censored-data analysis.`;
  const use = el('button', { type: 'button', className: 'btn small', id: 'use-status' }, `Use “${flag.label}” as failed (1) / still running (0)`);
  use.addEventListener('click', () => {
    state.roles.status = flag.index;
    showRoles();
    noteCensoring();
    scheduleRun(0);
  });
  $.columnNote.append(' ', use);
}

function columnLabel(): string {
  return state.columns.find((c) => c.index === state.column)?.label ?? `#${state.column}`;
}

/** Pre-fill "what was measured" and the units from the column name while the user has not typed them. */
function suggestQuantity(): void {
  // Class counts: the measured quantity is named by the class limits, not by the count column.
  const lowerLabel = state.columns.find((c) => c.index === state.groupedCols.lower)?.label ?? '';
  const raw = guessFromColumn(state.shape === 'grouped' ? lowerLabel : columnLabel());
  const bare = raw.quantity.replace(/\b(lower|low|lo|from|min|limit|bound|edge|class)\b/gi, ' ').replace(/\s+/g, ' ').trim();
  const guess = state.shape === 'grouped' ? { quantity: bare ? bare[0]!.toUpperCase() + bare.slice(1) : '', units: raw.units } : raw;
  if ($.quantity.dataset['typed'] !== 'yes') $.quantity.value = guess.quantity;
  if ($.units.dataset['typed'] !== 'yes') $.units.value = guess.units;
  const fromName = $.quantity.dataset['typed'] !== 'yes' || $.units.dataset['typed'] !== 'yes';
  $.unitsHint.textContent = fromName && (guess.quantity || guess.units)
    ? `Suggested from the column name; correct them if wrong. Used on every chart axis and in the exported report.`
    : 'Used on every chart axis and in the exported report.';
}

async function loadDemo(name: string): Promise<void> {
  try {
    setStatus(`Loading ${name}…`);
    const d = await api.demo(name);
    const index = d.columns.indexOf(d.settings?.column ?? d.defaultColumn) + 1;
    state.roles = { status: 0, subgroup: 0, order: 0 };
    // A demo starts from the published-formula p-values (a censored sample's A² is bootstrapped anyway).
    const formula = document.querySelector<HTMLInputElement>('input[name="pmethod"][value="table"]');
    if (formula) formula.checked = true;
    loadSource({ kind: 'demo', name: d.name, csv: d.csv }, { header: true, column: index > 0 ? index : undefined });
    applyDemoSettings(d.settings);
  } catch (err) {
    showError(err instanceof Error ? err.message : String(err));
  }
}

/** Files above this size show the reading / sending / analysing stages (common practice, no source). */
const LARGE_BYTES = 1 << 20;

function megabytes(bytes: number): string {
  return `${(bytes / 1e6).toFixed(bytes < 1e7 ? 1 : 0)} MB`;
}

async function loadFile(file: File): Promise<void> {
  const gen = ++state.loadGeneration;
  // A new file replaces whatever was being analysed.
  state.generation++;
  stopCurrent();
  if (timer !== undefined) clearTimeout(timer);
  const large = file.size > LARGE_BYTES;
  try {
    if (large) {
      setStatus(`Reading ${file.name} (${megabytes(file.size)})…`);
      setProgress(true, 0, `0 MB of ${megabytes(file.size)}`, 'Reading the file');
    }
    const read = await readFileText(
      file,
      (loaded, total) => {
        if (large && gen === state.loadGeneration) setProgress(true, total > 0 ? loaded / total : null, `${megabytes(loaded)} of ${megabytes(total)}`, 'Reading the file');
      },
      () => gen !== state.loadGeneration,
    );
    if (!read || gen !== state.loadGeneration) return;
    const text = read.text;
    if (large) setProgress(false);
    if (!/\S/.test(text)) {
      showError(`${file.name} is empty: there are no values to analyse.`);
      return;
    }
    $.quantity.dataset['typed'] = '';
    state.roles = { status: 0, subgroup: 0, order: 0 };
    $.demoSettings.hidden = true;
    loadSource({ kind: 'file', name: file.name, csv: text, rows: read.lines });
  } catch (err) {
    if (gen !== state.loadGeneration) return;
    setProgress(false);
    showError(`Could not read ${file.name}: ${err instanceof Error ? err.message : String(err)}`);
  }
}

function renderDemoList(list: readonly DemoEntry[]): void {
  clear($.demoList);
  for (const d of list) {
    const title = d.name.replace(/[-_]+/g, ' ').replace(/^./, (c) => c.toUpperCase());
    const button = el(
      'button',
      { type: 'button', 'data-name': d.name, 'aria-pressed': 'false' },
      title,
      el('span', { className: 'demo-cols' }, `${d.file} · column ${d.defaultColumn}`),
    );
    button.addEventListener('click', () => {
      $.quantity.dataset['typed'] = '';
      void loadDemo(d.name);
    });
    $.demoList.append(el('li', {}, button));
  }
}

// ---------------------------------------------------------------------------------------------
// Running

let timer: ReturnType<typeof setTimeout> | undefined;
function scheduleRun(delay = 350): void {
  if (timer !== undefined) clearTimeout(timer);
  timer = setTimeout(() => {
    timer = undefined;
    void run();
  }, delay);
}

function stopCurrent(): void {
  state.abort?.abort();
  state.abort = null;
  if (state.jobId) {
    const id = state.jobId;
    state.jobId = null;
    api.cancelJob(id).catch(() => undefined);
  }
}

/** Show or hide the progress line; `fraction` null is an indeterminate bar (work of unknown length). */
function setProgress(visible: boolean, fraction: number | null = 0, text = '', label = 'Bootstrap running'): void {
  $.progressWrap.hidden = !visible;
  if (fraction === null) $.progress.removeAttribute('value');
  else $.progress.value = fraction;
  $.progressText.textContent = text;
  $.progressLabel.textContent = label;
  $.progressWrap.dataset['stage'] = visible ? label : '';
}

const sleep = (ms: number) => new Promise<void>((r) => setTimeout(r, ms));

async function run(): Promise<void> {
  const source = state.source;
  if (!source) return;
  const settings = readSettings();
  if (!settings) {
    setStatus('Fix the highlighted setting to run the analysis.');
    return;
  }
  const gen = ++state.generation;
  stopCurrent();
  showError(null);
  if (state.shape === 'grouped') {
    await runGrouped(source, settings, gen);
    return;
  }
  const req: AnalyzeRequest = {
    ...settings,
    csv: source.csv,
    column: state.column,
    csvOptions: { decimal: decimal(), header: $.headerCheck.checked, skipInvalid: true },
    evidence: true,
  };
  const column = columnLabel();
  state.requestedBins = settings.bins;
  // A large body: say how much has gone up, then that the server is at work (it parses the CSV in a worker).
  const large = source.csv.length > LARGE_BYTES;
  const dataRows = source.rows !== undefined ? source.rows - ($.headerCheck.checked ? 1 : 0) : undefined;
  const rowsNote = dataRows !== undefined ? `about ${dataRows.toLocaleString('en-US')} rows` : 'the values';
  const onStage = (s: SendStage): void => {
    if (gen !== state.generation) return;
    if (s.stage === 'packing') setProgress(true, s.done / s.total, `packing ${megabytes(s.done)} of ${megabytes(s.total)}`, 'Sending to the local server');
    else if (s.stage === 'sending') setProgress(true, s.total > 0 ? s.loaded / s.total : null, s.total > 0 ? `${megabytes(s.loaded)} of ${megabytes(s.total)}` : 'starting', 'Sending to the local server');
    else if (req.pMethod === 'bootstrap') setProgress(true, 0, '0%');
    else setProgress(true, null, `reading and fitting ${rowsNote} of ${column}`, 'Analysing');
  };
  try {
    let resp: AnalyzeResponse | undefined;
    if (req.pMethod === 'bootstrap') {
      setStatus(`Fitting ${column} with bootstrap p-values (B = ${req.replicates ?? 999})… the page stays usable; changing a setting starts again.`);
      setProgress(true, 0, '0%');
      const ac = new AbortController();
      state.abort = ac;
      const job = large ? await api.startJobWithProgress({ ...req, client: CLIENT_ID }, onStage, ac.signal) : await api.startJob({ ...req, client: CLIENT_ID });
      if (state.abort === ac) state.abort = null;
      if (gen !== state.generation) {
        api.cancelJob(job.id).catch(() => undefined);
        return;
      }
      state.jobId = job.id;
      for (;;) {
        await sleep(250);
        if (gen !== state.generation) return;
        const st = await api.job(job.id);
        if (gen !== state.generation) return;
        setProgress(true, st.progress, `${Math.round(st.progress * 100)}%`);
        if (st.state === 'done') {
          resp = st.result;
          break;
        }
        if (st.state === 'failed') throw new ApiError(400, st.error?.message ?? 'The analysis failed.', st.error?.code);
        if (st.state === 'cancelled') {
          setStatus('Bootstrap stopped. The results shown (if any) are from the previous analysis.');
          setProgress(false);
          return;
        }
      }
      state.jobId = null;
    } else {
      setStatus(large ? `Fitting ${column} (${rowsNote})… the page stays usable; changing a setting starts again.` : `Fitting ${column}…`);
      const ac = new AbortController();
      state.abort = ac;
      if (large) onStage({ stage: 'sending', loaded: 0, total: 0 });
      resp = large ? await api.analyzeWithProgress(req, onStage, ac.signal) : await api.analyze(req, ac.signal);
      state.abort = null;
    }
    if (gen !== state.generation || !resp) return;
    setProgress(false);
    state.shownFor = { source: source.name, column };
    applyResponse(resp);
  } catch (err) {
    if (gen !== state.generation) return;
    if (err instanceof DOMException && err.name === 'AbortError') return;
    setProgress(false);
    state.jobId = null;
    const message = err instanceof Error ? err.message : String(err);
    showError(`${source.name}, column ${column}: ${message}`);
    setStatus(state.response ? 'The results below are from the previous analysis.' : '');
  }
}

/** Class limits with counts: read the three columns here (the core's CSV reader) and send the classes (server/API.md `grouped`). */
async function runGrouped(source: Source, settings: NonNullable<ReturnType<typeof readSettings>>, gen: number): Promise<void> {
  const label = (i: number) => state.columns.find((c) => c.index === i)?.label ?? `#${i}`;
  const g = state.groupedCols;
  const column = `${label(g.lower)}–${label(g.upper)}, ${label(g.count)}`;
  state.requestedBins = null;
  try {
    if (new Set([g.lower, g.upper, g.count]).size !== 3) throw new Error('Choose three different columns for the lower limit, the upper limit and the count.');
    const grouped = readGroupedClasses(source.csv, g, { header: $.headerCheck.checked, decimal: decimal() });
    setStatus(`Fitting the class counts of ${source.name}…`);
    const ac = new AbortController();
    state.abort = ac;
    const resp = await api.analyzeGrouped({ grouped, families: settings.families, alpha: settings.alpha, ...(settings.seed !== undefined ? { seed: settings.seed } : {}) }, ac.signal);
    state.abort = null;
    if (gen !== state.generation) return;
    setProgress(false);
    state.shownFor = { source: source.name, column };
    applyResponse(resp);
  } catch (err) {
    if (gen !== state.generation) return;
    if (err instanceof DOMException && err.name === 'AbortError') return;
    const message = err instanceof Error ? err.message : String(err);
    showError(`${source.name}, classes ${column}: ${message}`);
    setStatus(state.response ? 'The results below are from the previous analysis.' : '');
  }
}

// ---------------------------------------------------------------------------------------------
// Showing results

function applyResponse(resp: AnalyzeResponse): void {
  state.response = resp;
  if (!state.selected || !resp.candidates.some((c) => c.family === state.selected)) state.selected = resp.candidates[0]?.family ?? null;
  renderCounts(resp);
  renderRanking(resp);
  renderEvidence();
  renderDecision();
  const best = resp.candidates[0];
  setStatus(
    best
      ? `Done: ${resp.candidates.length} model${resp.candidates.length === 1 ? '' : 's'} fitted to ${isGrouped(resp) ? `${resp.n} counted in ${resp.grouped.classes.length} classes` : `${resp.n} values of ${state.shownFor.column}`} from ${state.shownFor.source}.`
      : 'No model could be fitted to these values.',
  );
  $.foot.textContent = `${resp.software.name} ${resp.software.version} · analysed on this computer by the local server; nothing is sent elsewhere.`;
}

function renderCounts(resp: AnalyzeResponse): void {
  if (isGrouped(resp)) {
    $.counts.textContent = `n = ${resp.n} counted in ${resp.grouped.classes.length} classes · no individual values`;
    clear($.skips);
    $.binsHint.textContent = 'For class counts the chi-square runs on the classes given (merged to at least 5 expected); the bins setting is not used.';
    return;
  }
  const input = resp.input;
  const skipped = input?.skipped ?? [];
  const totalSkipped = skipped.reduce((s, k) => s + k.count, 0);
  const parts = [`n = ${resp.n} values used`];
  if (input?.rowsRead !== undefined) parts.push(`${input.rowsRead} data rows read`);
  parts.push(totalSkipped === 0 ? 'no rows skipped' : `${totalSkipped} row${totalSkipped === 1 ? '' : 's'} skipped:`);
  $.counts.textContent = parts.join(' · ');
  clear($.skips);
  for (const s of skipped) $.skips.append(el('li', {}, skipLine(s)));
  if (input?.blankLines) $.skips.append(el('li', {}, `${input.blankLines} blank line${input.blankLines === 1 ? '' : 's'} passed over`));
  const most = Math.floor(resp.n / 5);
  $.bins.max = String(Math.max(3, most));
  const sel = resp.candidates.find((c) => c.family === state.selected) ?? resp.candidates[0];
  const used = sel && sel.chiSquare.computable && 'kRule' in sel.chiSquare ? ` For ${displayLabel(sel.label)}: ${sel.chiSquare.kRule}` : '';
  $.binsHint.textContent =
    `Bins have equal probability under each model, so each expects n/k values. The chi-square approximation needs at least 5 expected per bin: ` +
    `with n = ${resp.n}, k can be at most ${most}.${used}`;
}

function renderRanking(resp: AnalyzeResponse): void {
  $.rankingRule.textContent = resp.rankingRule;
  const grouped = isGrouped(resp);
  $.thChi.textContent = grouped ? 'χ² (classes)' : ORIGINAL.thChi;
  $.thChi.title = grouped ? 'Pearson chi-square on the given classes, merged to at least 5 expected' : ORIGINAL.thChiTitle;
  $.thDof.textContent = grouped ? 'dof k−1−m' : ORIGINAL.thDof;
  $.thDof.title = grouped ? 'Degrees of freedom k−1−m, exact for grouped counts (k merged classes, m estimated parameters)' : ORIGINAL.thDofTitle;
  $.thChiP.textContent = grouped ? 'p (χ²)' : ORIGINAL.thChiP;
  $.thChiP.title = grouped ? 'p with k−1−m dof' : ORIGINAL.thChiPTitle;
  if (grouped) {
    $.rankingHelp.textContent =
      'Select a model (click its row, or Tab to it and press Enter) to draw its class counts below. For class counts χ² runs on the classes ' +
      'given, merged to at least 5 expected, with k−1−m degrees of freedom, exact here; Anderson–Darling is not offered (see the note below the chart).';
  } else $.rankingHelp.innerHTML = ORIGINAL.rankingHelp;
  const best = resp.candidates[0];
  const a = resp.options.alpha;
  if (!best) $.summaryLine.textContent = 'No candidate could be fitted.';
  else if (resp.candidates.every((c) => c.rejectedBy.length > 0)) {
    $.summaryLine.textContent = `Every model tried is rejected at α = ${a}. None of them describes these data well enough to base a decision on.`;
  } else if (best.rejectedBy.length === 0) {
    $.summaryLine.textContent = grouped
      ? `Best by AICc: ${displayLabel(best.label)}. The chi-square on the classes does not reject it at α = ${a} (the only test for class counts); check the class counts below.`
      : `Best by AICc: ${displayLabel(best.label)}. Neither test rejects it at α = ${a}; check the evidence below, above all in the tail your decision depends on.`;
  } else {
    const firstOk = resp.candidates.find((c) => c.rejectedBy.length === 0);
    $.summaryLine.textContent = `Best by AICc: ${displayLabel(best.label)}, but it is rejected at α = ${a}.${firstOk ? ` The best model not rejected is ${displayLabel(firstOk.label)} (rank ${firstOk.rank}).` : ''}`;
  }
  for (const g of $.rankingTable.querySelectorAll('tbody')) g.remove();
  for (const c of resp.candidates) {
    const k = candidateCells(c);
    const group = el('tbody', { className: 'cand', 'data-family': c.family });
    const row = el('tr', { tabindex: 0, className: 'cand-main', 'data-family': c.family, 'aria-selected': String(c.family === state.selected) });
    const swatch = el('span', { className: 'swatch', 'aria-hidden': 'true' });
    const style = styleFor(c.family);
    swatch.style.borderTopColor = style.colour;
    swatch.style.borderTopStyle = style.dash ? 'dashed' : 'solid';
    row.append(
      el('td', { className: 'num' }, k.rank),
      el('td', { className: 'model' }, swatch, ' ', displayLabel(k.model)),
      el('td', { className: 'params' }, ...k.parameters.split(' · ').map((p) => el('span', { className: 'p-line' }, p))),
      el('td', { className: 'num' }, k.logLikelihood),
      el('td', { className: 'num' }, k.aicc, el('span', { className: 'sub' }, k.deltaAicc)),
    );
    if (k.chiComputable) {
      row.append(
        el('td', { className: 'num' }, k.chiSquare, el('span', { className: 'sub' }, k.chiSquareNote)),
        el('td', { className: 'num' }, k.dofMain, el('span', { className: 'sub' }, k.dofBracket)),
        el('td', { className: 'num' }, k.chiPMain, el('span', { className: 'sub' }, k.chiPBracket)),
      );
    } else {
      row.append(el('td', { colspan: 3, className: 'na-cell', title: k.chiSquareNote }, 'not computed', el('span', { className: 'sub wrap' }, `${k.chiSquareShort} (see the notes below the table)`)));
    }
    if (k.adOffered) {
      row.append(
        el('td', { className: 'num' }, k.adStatistic),
        el('td', { className: 'num', title: k.adMethodDetail }, k.adP, el('span', { className: 'sub' }, k.adMethod)),
      );
    } else {
      row.append(el('td', { colspan: 2, className: 'na-cell ad-not-offered', title: k.adMethodDetail }, k.adStatistic, el('span', { className: 'sub wrap' }, 'needs individual values (see the note below the chart)')));
    }
    row.append(el('td', {}, el('span', { className: `verdict ${k.rejected ? 'no' : 'ok'}` }, k.badge)));
    row.setAttribute('aria-label', `Rank ${k.rank}, ${displayLabel(k.model)}: ${k.badge}. ${k.verdict}`);
    const words = el('tr', { className: 'cand-words', 'aria-hidden': 'true' }, el('td', {}), el('td', { colspan: 10 }, k.verdict));
    group.append(row, words);
    group.addEventListener('click', () => select(c.family));
    row.addEventListener('keydown', (ev) => {
      if (ev.key === 'Enter' || ev.key === ' ') {
        ev.preventDefault();
        select(c.family);
      } else if (ev.key === 'ArrowDown' || ev.key === 'ArrowUp') {
        ev.preventDefault();
        const sib = (ev.key === 'ArrowDown' ? group.nextElementSibling : group.previousElementSibling) as HTMLElement | null;
        sib?.querySelector<HTMLElement>('tr.cand-main')?.focus();
      }
    });
    $.rankingTable.append(group);
  }
  clear($.notApplicable);
  if (resp.notApplicable.length > 0) {
    $.notApplicable.append(
      el('p', { className: 'na-title' }, 'Not fitted'),
      el('ul', { className: 'na-list' }, ...resp.notApplicable.map((n) => el('li', {}, el('strong', {}, labelOf(n.family)), `: ${n.reason}`))),
    );
  }
  clear($.warnings);
  // Warnings that only repeat a "not fitted" reason are already listed above.
  const repeats = (w: string) => resp.notApplicable.some((n) => n.reason !== '' && w.includes(n.reason));
  for (const w of [...resp.warnings, ...(resp.input?.warnings ?? [])]) if (!repeats(w)) $.warnings.append(el('li', {}, w));
}

/** The core's label with a capital first letter (labels start a table cell or a sentence here). */
function displayLabel(label: string): string {
  return label ? label[0]!.toUpperCase() + label.slice(1) : label;
}

function labelOf(family: string): string {
  return FAMILY_CHOICES.find((f) => f.name === family)?.label ?? family;
}

function select(family: string): void {
  if (!state.response) return;
  state.selected = family;
  for (const row of $.rankingTable.querySelectorAll<HTMLTableRowElement>('tr.cand-main')) row.setAttribute('aria-selected', String(row.dataset['family'] === family));
  renderCounts(state.response);
  renderEvidence();
  renderDecision();
}

function lifeScale(): LifeScale {
  return $.lifeScale.value === 'lognormal' ? 'lognormal' : 'weibull';
}

/** The decision area for the selected model (blocks from decision.ts, charts drawn into their slots). */
function renderDecision(): void {
  const resp = state.response;
  clear($.decisionBody);
  if (!resp || isGrouped(resp)) {
    $.headline.hidden = true;
    $.lifeScaleRow.hidden = true;
    $.decisionEmpty.hidden = !resp;
    if (resp) $.decisionEmpty.textContent = 'Class counts: this page shows the fits and the chi-square on the classes; B-lives, return levels and capability need individual values.';
    return;
  }
  $.decisionEmpty.innerHTML = ORIGINAL.decisionEmpty;
  const blocks = decisionBlocks(resp, state.selected, units());
  $.decisionEmpty.hidden = blocks.length > 0;
  const head = headline(resp, state.selected, units());
  $.headline.hidden = head === null;
  clear($.headline);
  if (head !== null) $.headline.append(el('strong', {}, 'Decision number: '), head, ' ', el('a', { href: '#decision' }, 'All numbers and cautions (5)'));
  $.lifeScaleRow.hidden = !resp.life;
  $.decisionName.textContent = displayLabel(resp.candidates.find((c) => c.family === state.selected)?.label ?? 'the selected model');
  const ctx = { report: resp, selected: state.selected ?? '', lifeScale: lifeScale() };
  const slots: [string, HTMLElement][] = [];
  for (const b of blocks) {
    $.decisionBody.append(
      blockNode(b, (slot) => {
        const box = el('div', { className: 'chart-box', 'data-slot': slot });
        slots.push([slot, box]);
        return el('figure', { className: 'chart' }, box);
      }),
    );
  }
  for (const [slot, box] of slots) {
    drawSlot(slot as Parameters<typeof drawSlot>[0], box, ctx, { ...chartSize(box), units: units(), quantity: $.quantity.value.trim() || (slot === 'return-period' ? 'Annual maximum' : 'Value') });
  }
}

/** The decision blocks as report HTML, charts at report size. */
function decisionReportHtml(resp: AnalyzeResponse): string {
  if (isGrouped(resp)) return '';
  const ctx = { report: resp, selected: state.selected ?? '', lifeScale: lifeScale() };
  return decisionBlocks(resp, state.selected, units())
    .map((b) =>
      blockHtml(b, (slot) => {
        const box = el('div');
        const svg = drawSlot(slot, box, ctx, { width: 760, height: 440, units: units(), quantity: $.quantity.value.trim() || (slot === 'return-period' ? 'Annual maximum' : 'Value') });
        return svg ? svg.outerHTML : '';
      }),
    )
    .join('');
}

function chartSize(node: Element): { width: number; height: number } {
  const w = Math.round(Math.min(1100, Math.max(320, (node as HTMLElement).clientWidth || 560)));
  return { width: w, height: Math.round(Math.min(430, Math.max(300, w * 0.62))) };
}

function units(): string {
  return $.units.value.trim();
}

function renderEvidence(): void {
  const resp = state.response;
  const fam = state.selected;
  const grouped = isGrouped(resp);
  $.groupedEvidence.hidden = !grouped;
  $.valueCharts.hidden = grouped;
  $.binsDetail.hidden = grouped;
  if (grouped && fam) {
    renderGroupedEvidence(resp, fam);
    return;
  }
  if (!resp || !fam || !resp.evidence) return;
  const ce = evidenceFor(resp.evidence, fam);
  $.evidenceName.textContent = ce ? displayLabel(ce.label) : labelOf(fam);
  drawEvidence($.charts, resp.evidence, fam, { units: units(), quantity: $.quantity.value.trim(), sizeOf: chartSize });
  if (ce) {
    $.captions.histogram.textContent = `Bars should follow the heavy ${ce.label} curve; look for runs of bars above or below it. ${ce.histogram.displayEdgeRule}`;
    const pp = ce.probabilityPlot;
    $.captions.probability.textContent =
      `Points should lie along the line and mostly inside the band, above all in the tail your decision depends on. ` +
      `Plotting positions: ${pp.plottingPosition.name}, ${pp.plottingPosition.formula}. The band is pointwise, not a simultaneous test.` +
      (pp.thinned ? ` Drawn with ${pp.points.x.length} of ${pp.total} points (extremes kept).` : '');
    renderBinsTable(ce);
  }
}

/** The observed-vs-expected chart of the selected model's (merged) classes, with its cells and the notes. */
function groupedChart(resp: Extract<AnalyzeResponse, { dataKind: 'grouped' }>, fam: string, box: Element, size: { width: number; height: number }): SVGSVGElement | null {
  const c = resp.candidates.find((x) => x.family === fam);
  if (!c) return null;
  return binCountsChart(box, { bins: { rows: chartCells(c) }, family: c.family, label: c.label, cell: 'class' }, { ...size, units: units(), quantity: $.quantity.value.trim() || 'Value' });
}

function renderGroupedEvidence(resp: Extract<AnalyzeResponse, { dataKind: 'grouped' }>, fam: string): void {
  const c = resp.candidates.find((x) => x.family === fam);
  $.evidenceName.textContent = c ? displayLabel(c.label) : labelOf(fam);
  const t = groupedText(resp, c);
  $.groupedNoValues.textContent = `${t.summary} ${t.noValues}`;
  $.groupedTest.textContent = t.test;
  $.groupedRule.textContent = `Degrees of freedom: ${t.rule}`;
  $.groupedAd.textContent = t.adNote;
  clear($.chartGrouped);
  groupedChart(resp, fam, $.chartGrouped, chartSize($.chartGrouped));
  $.capGrouped.textContent = 'Grey bars: counts in each class after merging; coloured marks: counts the model expects; dashed line: 5 expected, the usual minimum for the chi-square approximation.';
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
  table($.groupedCells, c ? cellRows(c) : [], `${c?.label ?? ''}: classes merged to at least 5 expected${u ? `, limits in ${u}` : ''}`);
  table($.groupedClasses, classRows(resp), `Classes as read${u ? `, limits in ${u}` : ''}`);
}

function edgeText(x: number | null, isLower: boolean): string {
  if (x === null) return isLower ? '−∞' : '∞';
  return sig(x, 5);
}

function renderBinsTable(ce: NonNullable<ReturnType<typeof evidenceFor>>): void {
  clear($.binsTable);
  const [head, ...rows] = binsTableRows(ce, edgeText);
  const u = units();
  if (head) {
    $.binsTable.append(
      el('caption', { className: 'muted small' }, `${ce.label}: equal-probability bins${u ? `, edges in ${u}` : ''}`),
      el('thead', {}, el('tr', {}, ...head.map((h) => el('th', { scope: 'col' }, h)))),
    );
  }
  $.binsTable.append(el('tbody', {}, ...rows.map((r) => el('tr', {}, ...r.map((v) => el('td', {}, v))))));
}

// ---------------------------------------------------------------------------------------------
// Export

function exportName(ext: string): string {
  const stamp = new Date().toISOString().slice(0, 19).replace(/[:T]/g, '-');
  return `plumbline-${slug(state.shownFor.source)}-${slug(state.shownFor.column)}-${stamp}.${ext}`;
}

function needResult(): AnalyzeResponse | null {
  if (!state.response) {
    showError('There is no result to export yet: load data and run the analysis first.');
    return null;
  }
  return state.response;
}

function exportHtml(): void {
  const resp = needResult();
  if (resp && isGrouped(resp) && state.selected) {
    const svg = groupedChart(resp, state.selected, el('div'), { width: 760, height: 440 });
    const html = buildReportHtml({
      response: resp,
      selected: state.selected,
      sourceName: state.shownFor.source,
      column: state.shownFor.column,
      units: units(),
      quantity: $.quantity.value.trim(),
      generatedAt: new Date(),
      charts: svg ? [{ svg: svg.outerHTML, caption: $.capGrouped.textContent ?? '' }] : [],
      binsTable: [],
      requestedBins: null,
    });
    download(exportName('html'), html, 'text/html;charset=utf-8');
    return;
  }
  if (!resp || !resp.evidence || !state.selected) return;
  const holder = el('div');
  const targets = { histogram: el('div'), probability: el('div'), bins: el('div'), cdf: el('div') };
  holder.append(targets.histogram, targets.probability, targets.bins, targets.cdf);
  const svgs = drawEvidence(targets, resp.evidence, state.selected, {
    units: units(),
    quantity: $.quantity.value.trim(),
    sizeOf: () => ({ width: 760, height: 440 }),
  });
  const captions = [$.captions.histogram, $.captions.probability, $.captions.bins, $.captions.cdf].map((c) => c.textContent ?? '');
  const ce = evidenceFor(resp.evidence, state.selected);
  const html = buildReportHtml({
    response: resp,
    selected: state.selected,
    sourceName: state.shownFor.source,
    column: state.shownFor.column,
    units: units(),
    quantity: $.quantity.value.trim(),
    generatedAt: new Date(),
    charts: svgs.map((s, i) => ({ svg: s.outerHTML, caption: captions[i] ?? '' })),
    binsTable: ce ? binsTableRows(ce, edgeText) : [],
    requestedBins: state.requestedBins,
    decisionHtml: decisionReportHtml(resp),
  });
  download(exportName('html'), html, 'text/html;charset=utf-8');
}

function exportJson(): void {
  const resp = needResult();
  if (!resp) return;
  const { evidence: _drop, ...report } = resp;
  void _drop;
  const record = { ...report, page: { source: state.shownFor.source, column: state.shownFor.column, units: units(), quantity: $.quantity.value.trim(), selected: state.selected, exportedAt: new Date().toISOString() } };
  download(exportName('json'), `${JSON.stringify(record, null, 2)}\n`, 'application/json');
}

function exportCsv(): void {
  const resp = needResult();
  if (resp && isGrouped(resp)) {
    showError('Class counts have no equal-probability bins table; the HTML report and the JSON hold the merged classes.');
    return;
  }
  if (!resp || !resp.evidence || !state.selected) return;
  const ce = evidenceFor(resp.evidence, state.selected);
  if (!ce) return;
  download(exportName('csv'), binsCsv(ce, state.shownFor.source, state.shownFor.column, units()), 'text/csv;charset=utf-8');
}

// ---------------------------------------------------------------------------------------------
// Wiring

function wire(): void {
  buildFamilyBoxes();
  $.fileInput.addEventListener('change', () => {
    const f = $.fileInput.files?.[0];
    if (f) void loadFile(f);
    $.fileInput.value = '';
  });
  for (const t of ['dragenter', 'dragover']) {
    $.drop.addEventListener(t, (ev) => {
      ev.preventDefault();
      $.drop.classList.add('over');
    });
  }
  for (const t of ['dragleave', 'drop']) $.drop.addEventListener(t, () => $.drop.classList.remove('over'));
  $.drop.addEventListener('drop', (ev) => {
    ev.preventDefault();
    const f = (ev as DragEvent).dataTransfer?.files?.[0];
    if (f) void loadFile(f);
  });
  // A file dropped elsewhere on the page must not navigate away from it.
  window.addEventListener('dragover', (ev) => ev.preventDefault());
  window.addEventListener('drop', (ev) => ev.preventDefault());

  $.pasteUse.addEventListener('click', () => {
    const text = $.pasteText.value;
    if (text.trim() === '') {
      showError('The paste box is empty: paste a column of numbers first.');
      return;
    }
    $.quantity.dataset['typed'] = '';
    state.roles = { status: 0, subgroup: 0, order: 0 };
    $.demoSettings.hidden = true;
    loadSource({ kind: 'paste', name: 'Pasted values', csv: text });
  });

  $.columnSelect.addEventListener('change', () => {
    state.column = Number($.columnSelect.value);
    showRoles();
    suggestQuantity();
    noteCensoring();
    scheduleRun(0);
  });
  $.shapeSelect.addEventListener('change', () => {
    state.shape = $.shapeSelect.value === 'grouped' ? 'grouped' : 'values';
    showGroupedColumns();
    suggestQuantity();
    scheduleRun(0);
  });
  const classCol = (sel: HTMLSelectElement, key: keyof GroupedColumns): void => {
    sel.addEventListener('change', () => {
      state.groupedCols = { ...state.groupedCols, [key]: Number(sel.value) };
      scheduleRun(0);
    });
  };
  classCol($.lowerSelect, 'lower');
  classCol($.upperSelect, 'upper');
  classCol($.countSelect, 'count');
  $.headerCheck.addEventListener('change', () => {
    rescanColumns(state.column);
    scheduleRun(0);
  });
  $.decimalSelect.addEventListener('change', () => {
    rescanColumns(state.column);
    scheduleRun(0);
  });

  for (const input of [$.alpha, $.bins, $.replicates, $.seed]) input.addEventListener('change', () => scheduleRun());
  for (const input of [$.confidence, $.blife, $.relTime, $.bounds, $.periods, $.designLife, $.plotPos, $.lsl, $.usl, $.target]) input.addEventListener('change', () => scheduleRun());
  const role = (sel: HTMLSelectElement, key: 'status' | 'subgroup' | 'order'): void => {
    sel.addEventListener('change', () => {
      state.roles[key] = Number(sel.value) || 0;
      noteCensoring();
      scheduleRun(0);
    });
  };
  role($.statusSelect, 'status');
  role($.subgroupSelect, 'subgroup');
  role($.orderSelect, 'order');
  $.lifeScale.addEventListener('change', renderDecision);
  // Return periods given for the first time: also try the extreme-value families.
  let hadPeriods = $.periods.value.trim() !== '';
  $.periods.addEventListener('change', () => {
    const has = $.periods.value.trim() !== '';
    if (has && !hadPeriods) for (const b of $.familyBoxes.querySelectorAll<HTMLInputElement>('input[name="family"]')) if ((FLOOD_FAMILIES as readonly string[]).includes(b.value)) b.checked = true;
    hadPeriods = has;
  });
  $.familyBoxes.addEventListener('change', () => scheduleRun());
  for (const r of document.querySelectorAll<HTMLInputElement>('input[name="pmethod"]')) r.addEventListener('change', () => scheduleRun());
  $.run.addEventListener('click', () => scheduleRun(0));
  $.cancel.addEventListener('click', () => {
    const stage = $.progressWrap.dataset['stage'] ?? '';
    state.generation++;
    state.loadGeneration++;
    stopCurrent();
    setProgress(false);
    setStatus(`${stage === 'Bootstrap running' ? 'Bootstrap stopped' : 'Stopped'}. The results shown (if any) are from the previous analysis.`);
  });

  $.quantity.addEventListener('input', () => {
    $.quantity.dataset['typed'] = 'yes';
    renderEvidence();
    renderDecision();
  });
  $.units.addEventListener('input', () => {
    $.units.dataset['typed'] = 'yes';
    renderEvidence();
    renderDecision();
  });

  $.exportHtml.addEventListener('click', exportHtml);
  $.exportJson.addEventListener('click', exportJson);
  $.exportCsv.addEventListener('click', exportCsv);

  let resizeTimer: ReturnType<typeof setTimeout> | undefined;
  new ResizeObserver(() => {
    if (resizeTimer !== undefined) clearTimeout(resizeTimer);
    resizeTimer = setTimeout(() => {
      renderEvidence();
      renderDecision();
    }, 120);
  }).observe($.charts.histogram);
}

async function start(): Promise<void> {
  wire();
  readSettings();
  try {
    const list = await api.demoList();
    state.demos = list.datasets;
    renderDemoList(list.datasets);
  } catch (err) {
    $.demoList.append(el('li', { className: 'muted small' }, `Demo list unavailable: ${err instanceof Error ? err.message : String(err)}`));
  }
  try {
    setStatus('Loading the worked scenario…');
    const demo = await api.demoAnalysis();
    state.source = { kind: 'demo', name: demo.name, csv: demo.csv };
    $.loaded.hidden = false;
    $.sourceName.textContent = `${demo.name} (demo dataset)`;
    $.headerCheck.checked = true;
    const entry = state.demos.find((d) => d.name === demo.name);
    const col = entry ? entry.columns.indexOf(demo.column) + 1 : 0;
    rescanColumns(col > 0 ? col : undefined);
    state.column = demo.result.input?.columnIndex ?? state.column;
    showColumns(state.columns, state.column);
    applyDemoSettings(demo.settings);
    suggestQuantity();
    for (const b of $.demoList.querySelectorAll('button')) b.setAttribute('aria-pressed', String(b.dataset['name'] === demo.name));
    state.shownFor = { source: demo.name, column: columnLabel() };
    applyResponse(demo.result);
    syncSettingsFrom(demo.result);
  } catch (err) {
    setStatus('Load a CSV file, paste a column of numbers, or pick a worked scenario to begin.');
    if (!(err instanceof ApiError && err.status === 404)) showError(err instanceof Error ? err.message : String(err));
  }
}

/** Show in the settings the options the server used for the opening demo. */
function syncSettingsFrom(resp: AnalyzeResponse): void {
  const o = resp.options;
  $.alpha.value = String(o.alpha);
  $.bins.value = o.bins === null ? '' : String(o.bins);
  for (const b of $.familyBoxes.querySelectorAll<HTMLInputElement>('input[name="family"]')) b.checked = o.families.includes(b.value as never);
  // A censored sample's A² is always bootstrapped; the setting stays on the published formula so that
  // the next file the user loads does not start a bootstrap it did not ask for.
  const method = (resp as { dataKind?: string }).dataKind === 'censored' ? 'table' : o.pMethod;
  const radio = document.querySelector<HTMLInputElement>(`input[name="pmethod"][value="${method}"]`);
  if (radio) radio.checked = true;
  $.replicates.value = String(o.bootstrapReplicates);
  $.seed.value = String(o.seed);
  readSettings();
}

void start();

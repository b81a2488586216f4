/**
 * The page's wiring: events become actions on the explicit state (state.ts), the state is drawn
 * by render.ts from the pure views (views/*.ts, decision.ts, evidence-render.ts), requests are
 * built by request.ts and sent by runner.ts, exports written by page-export.ts. Nothing here computes a statistic or decides what a setting means. Nothing
 * runs at import: `start()` is called once the page has loaded.
 */
import { takeOpenedSeries } from './opened-series.js';
import { api, ApiError, type DemoEntry } from './api.js';
import { readFileText } from './read-file.js';
import { firstLineIsNumber } from './columns.js';
import { FLOOD_FAMILIES } from './families.js';
import { INITIAL_STATE, columnLabel, settingsFromReport, update, type Action, type EvidenceView, type PageState } from './state.js';
import { buildRequest } from './request.js';
import { LARGE_BYTES, megabytes, Runner } from './runner.js';
import { buildSettingsForm, controlFor, isRoleControl, readForm, settingControls, settingKeyOf, showProblems, syncForm } from './form.js';
import type { Settings } from './settings.js';
import { glossaryNode } from './views/glossary.js';
import { $, doneLine, input, renderAnswer, renderDecision, renderDemoList, renderEvidence, renderLabels, renderResult, renderSource, select, setProgress, setStatus, showError } from './render.js';
import { exportCsv, exportHtml, exportJson } from './page-export.js';
import { noteCensoring, noteSeries } from './source-notes.js';
import { byId, el } from './dom.js';
import { planCalculatorNode } from './views/life-plan.js';

let state: PageState = INITIAL_STATE;
let demos: readonly DemoEntry[] = [];
let runner: Runner;
let timer: ReturnType<typeof setTimeout> | undefined;
/** Bumped by every new file and by Stop, so a slower earlier read is dropped. */
let loadTicket = 0;
/** True while a file is being read: settings edited meanwhile belong to the file on its way. */
let fileOnItsWay = false;
/** Settings the user changed while a file was on its way, applied once it has loaded. */
let editsForNext: Partial<Record<keyof Settings, unknown>> = {};


function dispatch(action: Action): void {
  state = update(state, action);
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
  if (state.settings.returnPeriods.trim() === '' && (controlFor('returnPeriods')?.value.trim() ?? '') !== '') {
    for (const b of document.querySelectorAll<HTMLInputElement>('#family-boxes input[name="family"]')) if ((FLOOD_FAMILIES as readonly string[]).includes(b.value)) b.checked = true;
  }
  dispatch({ type: 'settings-edited', patch: readForm() });
  syncForm(state.settings);
  noteCensoring(state);
  noteSeries(state);
  scheduleRun(delay);
}

async function run(): Promise<void> {
  const source = state.source;
  if (!source) return;
  const out = buildRequest(state);
  showProblems(out.ok ? [] : out.problems);
  if (!out.ok) {
    const classes = out.problems.find((p) => p.field === 'classes' || p.field === 'intervals');
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
      renderResult(state);
      return;
    }
    const { csv: _data, ...sent } = built.request as Record<string, unknown>;
    void _data;
    dispatch({ type: 'run-finished', generation, report: resp, column: built.column, requestedBins: built.requestedBins, sent });
    renderResult(state);
    setStatus(doneLine(state));
  } catch (err) {
    if (generation !== state.run.generation) return;
    setProgress(null);
    const message = err instanceof Error ? err.message : String(err);
    const what = built.kind === 'grouped' ? `classes ${built.column}` : `column ${built.column}`;
    dispatch({ type: 'run-failed', generation, message: `${source.name}, ${what}: ${message}` });
    showError(state.error);
    renderResult(state);
    setStatus(state.result ? 'The results below are from the previous analysis.' : '');
  }
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
  renderSource(state);
  renderResult(state);
  scheduleRun(0);
}

function loadFailed(name: string, message: string): void {
  fileOnItsWay = false;
  editsForNext = {};
  runner.stop();
  setProgress(null);
  dispatch({ type: 'load-failed', name, message });
  renderSource(state);
  renderResult(state);
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



// ---------------------------------------------------------------------------------------------
// Wiring

function select_(family: string): void {
  const hadFocus = document.activeElement?.matches('button.model-pick') === true;
  dispatch({ type: 'select', family });
  renderResult(state);
  // The choices are drawn anew: keep the keyboard where it was.
  if (hadFocus) document.querySelector<HTMLElement>(`#model-choices button[data-family="${CSS.escape(family)}"]`)?.focus();
}

function wire(): void {
  buildSettingsForm();
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
    renderSource(state);
    scheduleRun(0);
  };
  select('column-select').addEventListener('change', () => reading({ column: Number(select('column-select').value) }));
  select('shape-select').addEventListener('change', () => {
    const v = select('shape-select').value;
    reading({ shape: v === 'grouped' || v === 'interval' ? v : 'values' });
  });
  select('interval-start-select').addEventListener('change', () => reading({ interval: { start: Number(select('interval-start-select').value) } }));
  select('interval-end-select').addEventListener('change', () => reading({ interval: { end: Number(select('interval-end-select').value) } }));
  select('interval-count-select').addEventListener('change', () => reading({ interval: { count: Number(select('interval-count-select').value) } }));
  select('lower-select').addEventListener('change', () => reading({ grouped: { lower: Number(select('lower-select').value) } }));
  select('upper-select').addEventListener('change', () => reading({ grouped: { upper: Number(select('upper-select').value) } }));
  select('count-select').addEventListener('change', () => reading({ grouped: { count: Number(select('count-select').value) } }));
  input('header-check').addEventListener('change', () => reading({ header: input('header-check').checked }));
  select('decimal-select').addEventListener('change', () => reading({ decimal: select('decimal-select').value === ',' ? ',' : '.' }));
  $('decimal-note').addEventListener('click', (ev) => {
    const b = (ev.target as Element).closest<HTMLElement>('#decimal-switch');
    if (b) reading({ decimal: b.dataset['mark'] === ',' ? ',' : '.' });
  });
  document.addEventListener('click', (ev) => {
    const b = (ev.target as Element).closest<HTMLElement>('button.use-status');
    if (!b) return;
    const status = controlFor('statusColumn');
    if (status) status.value = b.dataset['column'] ?? '0';
    settingsChanged(0);
  });
  document.addEventListener('click', (ev) => {
    const b = (ev.target as Element).closest<HTMLElement>('button.use-mode');
    if (!b) return;
    const mode = controlFor('modeColumn');
    if (mode) mode.value = b.dataset['column'] ?? '0';
    settingsChanged(0);
  });

  // A role column changes what is analysed: run at once; typed values wait a moment for the next keystroke.
  for (const c of settingControls()) c.addEventListener('change', () => settingsChanged(isRoleControl(c) ? 0 : undefined, c));
  $('run-button').addEventListener('click', () => settingsChanged(0));
  $('cancel-button').addEventListener('click', () => {
    const stage = $('progress-wrap').dataset['stage'] ?? '';
    loadTicket++;
    fileOnItsWay = false;
    editsForNext = {};
    runner.stop();
    dispatch({ type: 'run-stopped' });
    setProgress(null);
    renderResult(state);
    setStatus(`${stage === 'Bootstrap running' ? 'Bootstrap stopped' : 'Stopped'}. The results shown (if any) are from the previous analysis.`);
  });

  $('model-choices').addEventListener('click', (ev) => {
    const b = (ev.target as Element).closest<HTMLElement>('button.model-pick');
    if (b?.dataset['family']) select_(b.dataset['family']);
  });
  for (const b of document.querySelectorAll<HTMLElement>('.view-pick')) {
    b.addEventListener('click', () => {
      dispatch({ type: 'view-chosen', view: (b.dataset['view'] as EvidenceView | undefined) ?? 'probability' });
      renderEvidence(state);
    });
  }
  select('life-scale-select').addEventListener('change', () => renderDecision(state));
  for (const id of ['quantity-input', 'units-input']) {
    input(id).addEventListener('input', () => {
      dispatch({ type: 'labels-edited', quantity: input('quantity-input').value, units: input('units-input').value });
      renderLabels(state);
      renderDecision(state);
      renderEvidence(state);
      renderAnswer(state);
    });
  }
  $('export-html').addEventListener('click', () => {
    exportHtml(state).catch((err: unknown) => showError(`The report could not be written: ${err instanceof Error ? err.message : String(err)}`));
  });
  $('export-json').addEventListener('click', () => exportJson(state));
  $('export-csv').addEventListener('click', () => exportCsv(state));

  let resizeTimer: ReturnType<typeof setTimeout> | undefined;
  new ResizeObserver(() => {
    if (resizeTimer !== undefined) clearTimeout(resizeTimer);
    resizeTimer = setTimeout(() => {
      renderEvidence(state);
      renderDecision(state);
    }, 120);
  }).observe($('evidence'));
}

/** Open the page: the demo list, then the worked scenario already analysed by the server. */
export async function start(): Promise<void> {
  const id = Array.from(crypto.getRandomValues(new Uint8Array(6)), (b) => b.toString(16).padStart(2, '0')).join('');
  runner = new Runner(`page-${id}`);
  wire();
  // The test-planning calculator (views/life-plan.ts): self-contained, needs no data.
  document.querySelector('.rail')?.append(planCalculatorNode());
  try {
    const list = await api.demoList();
    demos = list.datasets;
    renderDemoList(demos);
  } catch (err) {
    $('demo-list').append(el('li', { className: 'muted small' }, `Demo list unavailable: ${err instanceof Error ? err.message : String(err)}`));
  }
  // A series opened from the many-series page: its values are the source, with the defaults.
  const opened = takeOpenedSeries();
  if (opened) {
    sourceLoaded({ type: 'source-loaded', source: { kind: 'file', name: opened.name, csv: opened.csv }, header: true });
    return;
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
    renderSource(state);
    renderResult(state);
    setStatus(doneLine(state));
  } catch (err) {
    setStatus('Load a CSV file, paste a column of numbers, or pick a worked scenario to begin.');
    if (!(err instanceof ApiError && err.status === 404)) showError(err instanceof Error ? err.message : String(err));
  }
}

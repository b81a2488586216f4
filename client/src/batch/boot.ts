/**
 * The many-series page: read a file, choose its layout, run every series on Web Workers (core
 * analyzeSeries, the single run's analysis), then the summary: a headline, filters, the decision
 * numbers of all series, and a virtualised table whose rows open the series in the full view.
 * Wiring only: state is in state.ts, settings in settings.ts, rendering in table.ts and the chart.
 */
import { readBatch, readColumns, type SeriesRecord, type SeriesSummary, type SeriesValues } from '../../../core/index.js';
import { drawSeriesDecisions } from '../../charts/series-decisions.js';
import { byId, clear, el } from '../dom.js';
import { readFileText } from '../read-file.js';
import { runBatchOnPage, type BatchRun } from './run.js';
import { optionsFrom, seriesCsv, type Decision } from './settings.js';
import { DEFAULT_VIEW, modelsOf, sortBy, tally, visibleRows, type View } from './state.js';
import { renderHead, renderRows, tableFrame } from './table.js';

interface Page {
  text: string | null;
  name: string;
  records: readonly SeriesRecord[];
  rows: (SeriesSummary | undefined)[];
  view: View;
  run: BatchRun | null;
}

function start(): void {
  const page: Page = { text: null, name: '', records: [], rows: [], view: DEFAULT_VIEW, run: null };
  const fileInput = byId<HTMLInputElement>('b-file');
  const note = byId('b-file-note');
  const layout = byId('b-layout');
  const key = byId<HTMLSelectElement>('b-key');
  const value = byId<HTMLSelectElement>('b-value');
  const status = byId<HTMLSelectElement>('b-status');
  const runButton = byId<HTMLButtonElement>('b-run');
  const stopButton = byId<HTMLButtonElement>('b-stop');
  const progress = byId<HTMLProgressElement>('b-progress');
  const statusLine = byId('b-status-line');
  const settingError = byId('b-setting-error');
  const result = byId('b-result');
  const headline = byId('b-headline');
  const fVerdict = byId<HTMLSelectElement>('b-f-verdict');
  const fModel = byId<HTMLSelectElement>('b-f-model');
  const fWarn = byId<HTMLInputElement>('b-f-warn');
  const fText = byId<HTMLInputElement>('b-f-text');
  const shown = byId('b-shown');
  const chart = byId('b-chart');
  const table = tableFrame();
  byId('b-table').append(table.root);

  const shape = (): 'long' | 'wide' => ((document.querySelector('input[name="b-shape"]:checked') as HTMLInputElement | null)?.value === 'wide' ? 'wide' : 'long');
  const decision = (): Decision => ((document.querySelector('input[name="b-decision"]:checked') as HTMLInputElement | null)?.value ?? 'none') as Decision;

  const summaries = (): SeriesSummary[] => page.rows.filter((r): r is SeriesSummary => r !== undefined);
  let order: number[] = [];
  const renderTable = (): void => {
    renderRows(table, summaries(), order, openSeries);
  };
  const renderResult = (): void => {
    const rows = summaries();
    order = visibleRows(rows, page.view);
    renderHead(table, page.view, (k) => {
      page.view = sortBy(page.view, k);
      renderResult();
    });
    table.scroller.scrollTop = 0;
    renderTable();
    shown.textContent = `${order.length} of ${rows.length} series shown`;
    drawChart();
  };
  /** The chart of decision numbers, only when some series has one, drawn at the box's width. */
  const drawChart = (): void => {
    const rows = summaries();
    const picked = order.map((i) => rows[i] as SeriesSummary);
    const any = picked.some((r) => r.estimate !== null);
    chart.hidden = !any;
    clear(chart);
    if (!any) return;
    const width = Math.max(280, Math.min(1100, chart.clientWidth || 900));
    drawSeriesDecisions(chart, picked, { width, height: width < 500 ? 260 : 320 });
  };
  let resizing = 0;
  window.addEventListener('resize', () => {
    window.clearTimeout(resizing);
    resizing = window.setTimeout(() => {
      if (!result.hidden) drawChart();
    }, 150);
  });
  table.scroller.addEventListener('scroll', () => requestAnimationFrame(renderTable));

  const setFilters = (): void => {
    page.view = {
      ...page.view,
      filters: { verdict: fVerdict.value as View['filters']['verdict'], model: fModel.value, warningsOnly: fWarn.checked, text: fText.value },
    };
    renderResult();
  };
  for (const c of [fVerdict, fModel, fWarn]) c.addEventListener('change', setFilters);
  fText.addEventListener('input', setFilters);

  function openSeries(index: number): void {
    const rows = summaries();
    const r = rows[index];
    const rec = page.records.find((x): x is SeriesValues => x.kind === 'values' && x.key === r?.series);
    if (!r || !rec) return;
    sessionStorage.setItem('plumbline.openSeries', JSON.stringify({ name: `${page.name}: series ${rec.key}`, csv: seriesCsv(rec.values, rec.status) }));
    window.location.assign('./index.html#opened-series');
  }

  fileInput.addEventListener('change', async () => {
    const file = fileInput.files?.[0];
    if (!file) return;
    page.run?.stop();
    result.hidden = true;
    note.textContent = `Reading ${file.name} …`;
    const read = await readFileText(file, () => undefined, () => false);
    if (!read) return;
    page.text = read.text;
    page.name = file.name;
    let header: readonly string[];
    try {
      header = readColumns(read.text, [{ select: 1, kind: 'text' }], { skipInvalid: true }).header;
    } catch (e) {
      note.textContent = `${file.name} cannot be read: ${e instanceof Error ? e.message : String(e)}`;
      layout.hidden = true;
      return;
    }
    for (const s of [key, value]) clear(s);
    clear(status);
    status.append(el('option', { value: '' }, 'none'));
    header.forEach((h, j) => {
      const label = h === '' ? `column ${j + 1}` : h;
      key.append(el('option', { value: String(j + 1) }, label));
      value.append(el('option', { value: String(j + 1) }, label));
      status.append(el('option', { value: String(j + 1) }, label));
    });
    value.value = String(Math.min(2, header.length));
    note.textContent = `${file.name}: ${header.length} columns, about ${read.lines} rows. Say how the series are laid out, then analyse.`;
    layout.hidden = false;
  });

  runButton.addEventListener('click', () => {
    if (page.text === null) return;
    const withStatus = status.value !== '' && shape() === 'long';
    const checked = optionsFrom({
      decision: decision(),
      period: byId<HTMLInputElement>('b-period').value,
      percent: byId<HTMLInputElement>('b-percent').value,
      lsl: byId<HTMLInputElement>('b-lsl').value,
      usl: byId<HTMLInputElement>('b-usl').value,
      withStatus,
    });
    if (!checked.ok) {
      settingError.textContent = checked.message;
      settingError.hidden = false;
      return;
    }
    settingError.hidden = true;
    let records: readonly SeriesRecord[];
    try {
      records =
        shape() === 'long'
          ? readBatch(page.text, { by: key.value, column: value.value, ...(withStatus ? { censorColumn: status.value } : {}) }, { skipInvalid: false }).series
          : readBatch(page.text, { columns: 'all-numeric' }, {}).series;
    } catch (e) {
      settingError.textContent = e instanceof Error ? e.message : String(e);
      settingError.hidden = false;
      return;
    }
    page.records = records;
    page.rows = [];
    page.view = DEFAULT_VIEW;
    progress.hidden = false;
    progress.max = records.length;
    progress.value = 0;
    runButton.disabled = true;
    stopButton.disabled = false;
    const t0 = performance.now();
    statusLine.textContent = `Analysing ${records.length} series …`;
    const run = runBatchOnPage(records, checked.options, (done, total) => {
      progress.value = done;
      if (done % 50 === 0 || done === total) {
        const rate = done / Math.max(0.001, (performance.now() - t0) / 1000);
        statusLine.textContent = `${done} of ${total} series (${Math.round(rate)} a second${done < total ? `, about ${Math.ceil((total - done) / rate)} s left` : ''})`;
      }
    });
    page.run = run;
    void run.done.then(
      ({ summaries: s, stopped }) => {
        page.rows = s;
        page.run = null;
        runButton.disabled = false;
        stopButton.disabled = true;
        progress.hidden = true;
        const rows = summaries();
        const t = tally(rows);
        statusLine.textContent = stopped ? `Stopped: ${rows.length} of ${records.length} series were analysed; the summary shows those only.` : `Done: ${rows.length} series.`;
        headline.textContent =
          `${t.total} series${stopped ? ' (stopped early)' : ''}: the best model of ${t.ok} is rejected by neither test; ${t.rejected} need a closer look (their best model is rejected by a test); ` +
          `${t.errors} could not be analysed. Open a series to see its evidence and warnings before using its number.`;
        clear(fModel);
        fModel.append(el('option', { value: '' }, 'any'));
        for (const m of modelsOf(rows)) fModel.append(el('option', { value: m }, m));
        result.hidden = false;
        renderResult();
        // The answer comes first on the page: bring it into view.
        result.scrollIntoView({ block: 'start' });
      },
      (e: unknown) => {
        statusLine.textContent = `The analysis stopped: ${e instanceof Error ? e.message : String(e)}. It can be run again.`;
        runButton.disabled = false;
        stopButton.disabled = true;
      },
    );
  });
  stopButton.addEventListener('click', () => page.run?.stop());
}

if (document.readyState === 'loading') document.addEventListener('DOMContentLoaded', start, { once: true });
else start();

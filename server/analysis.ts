/**
 * One analysis request end to end (run inside a worker thread, see worker.ts), the same pipeline
 * for every kind of data: the values (or the CSV read by the core's reader, the same code as the
 * CLI) with their status, subgroup and order columns or the grouped counts → the core's
 * planDataset (fits, tests, workflow sections; bad input throws here) → [bootstrap ranges on the
 * worker pool, when any family needs them] → finishDataset → the report, plus evidence when
 * asked. The response is the report exactly as the CLI's `--json` prints it, with `input` (where
 * the values came from) and optionally `evidence`. The work a request may ask for is bounded
 * (server/limits.ts) before it starts.
 */
import {
  computeEvidence,
  finishDataset,
  parseStrictNumber,
  planDataset,
  prepareSample,
  readColumns,
  readFailureModes,
  readIntervalModes,
  type AnalyzeResponse,
  type InputSummary,
  type ColumnRequest,
  type DatasetInput,
  type DatasetPlan,
  type NumberColumn,
  type TextColumn,
  InputError,
  readColumn,
  readIntervalRows,
  dayNumbers,
  looksLikePeakFile,
  readFloodRecord,
  PEAK_COLUMN,
  columnSelector,
  SKIP_REASON_WORDS,
  type DatasetJobResult,
  type Sample,
} from '../core/index.js';
import { checkBootstrapWork, checkDatasetSize } from './limits.js';
import type { AnalyzeRequest } from './validate.js';

/** The response types are the shared contract (core/api-types.ts), used by the page as well. */
export type { AnalyzeResponse, InputSummary };

/** The values of a request and where they came from. Throws the core's InputError on bad CSV. */
export function requestValues(req: AnalyzeRequest): { values: ArrayLike<number>; input: InputSummary } {
  if (req.values !== undefined) return { values: req.values, input: { source: 'values', n: req.values.length } };
  const r = readColumn(req.csv ?? '', { ...req.csvOptions, ...(req.column !== undefined ? { column: req.column } : {}) });
  if (r.values.length === 0) {
    const dropped = r.skipped.reduce((a, k) => a + k.count, 0);
    throw new InputError(
      dropped > 0
        ? `Column ${JSON.stringify(r.column)} has no usable values: all ${dropped} data rows were dropped (${r.skipped
            .map((k) => `${k.count} ${SKIP_REASON_WORDS[k.reason]}, first at row ${k.firstRow}: ${JSON.stringify(k.firstValue)}`)
            .join('; ')}).`
        : `Column ${JSON.stringify(r.column)} has no data rows.`,
      { column: r.column },
      'too-few-values',
    );
  }
  return {
    values: r.values,
    input: {
      source: 'csv',
      n: r.values.length,
      column: r.column,
      columnIndex: r.columnIndex,
      rowsRead: r.rowsRead,
      skipped: r.skipped.map((s) => ({ ...s, description: SKIP_REASON_WORDS[s.reason] })),
      blankLines: r.blankLines,
      delimiter: r.delimiter,
      delimiterDetected: r.delimiterDetected,
      header: r.header,
      warnings: r.warnings,
    },
  };
}

/**
 * The dataset for analyzeDataset: the value column with the status, subgroup and order columns
 * read in one pass by the core's readColumns (rows stay aligned; a row is dropped, with
 * skipInvalid, only when one of its requested cells is unusable), or the arrays of a `values`
 * request. Status cells must read 1 or 0; the error names the file row, column and cell.
 */
export function requestDataset(req: AnalyzeRequest): { dataset: DatasetInput; input: InputSummary } {
  // A peak file is recognised before any CSV header is parsed (its first lines are '#' comments).
  if (req.values === undefined && req.csv !== undefined && looksLikePeakFile(req.csv)) return peakFileDataset(req, req.csv);
  if (req.intervalColumns) return intervalDataset(req, req.intervalColumns);
  if (req.dateColumn !== undefined) return datedDataset(req, req.dateColumn);
  const wf = req.workflow;
  if (wf?.grouped) return { dataset: { grouped: wf.grouped }, input: { source: 'values', n: wf.grouped.reduce((a, c) => a + c.count, 0) } };
  if (req.values !== undefined || !wf || (wf.statusColumn === undefined && wf.subgroupColumn === undefined && wf.orderColumn === undefined)) {
    const { values, input } = requestValues(req);
    return {
      dataset: {
        values,
        ...(wf?.status ? { status: wf.status } : {}),
        ...(wf?.subgroups ? { subgroups: wf.subgroups } : {}),
        ...(wf?.order ? { order: wf.order } : {}),
      },
      input,
    };
  }
  const requests: ColumnRequest[] = [{ select: req.column ?? 1, kind: 'number' }];
  const roles: ('status' | 'subgroups' | 'order' | 'failure mode')[] = [];
  if (wf.statusColumn !== undefined) {
    requests.push({ select: wf.statusColumn, kind: 'text' });
    roles.push('status');
  }
  if (wf.subgroupColumn !== undefined) {
    requests.push({ select: wf.subgroupColumn, kind: 'text' });
    roles.push('subgroups');
  }
  if (wf.orderColumn !== undefined) {
    requests.push({ select: wf.orderColumn, kind: 'number' });
    roles.push('order');
  }
  if (req.modeColumn !== undefined) {
    // Blank cells are kept: a unit that did not fail has no mode.
    requests.push({ select: req.modeColumn, kind: 'text', keepBlank: true });
    roles.push('failure mode');
  }
  const t = readColumns(req.csv ?? '', requests, req.csvOptions);
  const value = t.columns[0] as NumberColumn;
  if (value.values.length === 0) throw new InputError(`Column ${JSON.stringify(value.column)} has no usable rows.`, { column: value.column }, 'too-few-values');
  const dataset: { -readonly [K in keyof DatasetInput]: DatasetInput[K] } = { values: value.values };
  const otherColumns: { role: 'status' | 'subgroups' | 'order' | 'failure mode'; column: string }[] = [];
  let modeTexts: TextColumn | null = null;
  roles.forEach((role, j) => {
    const col = t.columns[j + 1] as NumberColumn | TextColumn;
    if (col.index === value.index) throw new InputError(`The ${role} column ${JSON.stringify(col.column)} is the value column itself.`, { column: col.column }, 'bad-option');
    otherColumns.push({ role, column: col.column });
    if (role === 'status') {
      const texts = (col as TextColumn).texts;
      const st = new Uint8Array(texts.length);
      texts.forEach((text, i) => {
        const v = parseStrictNumber(text);
        if (v !== 0 && v !== 1) {
          const row = t.rowNumbers[i] as number;
          throw new InputError(`Row ${row}, column ${JSON.stringify(col.column)}: status ${JSON.stringify(text)} is not 1 (failed) or 0 (still running or removed unfailed).`, { row, column: col.column, value: text }, 'bad-input');
        }
        st[i] = v;
      });
      dataset.status = st;
    } else if (role === 'failure mode') modeTexts = col as TextColumn;
    else if (role === 'subgroups') dataset.subgroups = (col as TextColumn).texts;
    else dataset.order = (col as NumberColumn).values;
  });
  const notes: string[] = [];
  if (modeTexts !== null && dataset.status) {
    const mc: TextColumn = modeTexts;
    const read = readFailureModes(mc.texts, dataset.status, { row: (i) => t.rowNumbers[i] as number, cell: (i) => `Row ${t.rowNumbers[i] as number}`, column: mc.column });
    dataset.modes = read.modes;
    notes.push(...read.notes);
  }
  const { columns: _c, rowNumbers: _r, ...summary } = t;
  return {
    dataset,
    input: {
      source: 'csv',
      n: value.values.length,
      column: value.column,
      columnIndex: value.index,
      rowsRead: summary.rowsRead,
      skipped: summary.skipped.map((k) => ({ ...k, description: SKIP_REASON_WORDS[k.reason] })),
      blankLines: summary.blankLines,
      delimiter: summary.delimiter,
      delimiterDetected: summary.delimiterDetected,
      header: summary.header,
      warnings: [...summary.warnings, ...notes],
      otherColumns,
    },
  };
}

/** Interval rows of life data (START, END and optional count columns of the CSV), read by the core's readIntervalRows as the CLI reads them. */
function intervalDataset(req: AnalyzeRequest, cols: readonly [string | number, string | number]): { dataset: DatasetInput; input: InputSummary } {
  const r = readIntervalRows(
    req.csv ?? '',
    { start: columnSelector(cols[0]), end: columnSelector(cols[1]), ...(req.countColumn !== undefined ? { count: columnSelector(req.countColumn) } : {}), ...(req.modeColumn !== undefined ? { mode: columnSelector(req.modeColumn) } : {}), ...(req.inspectionTimesColumn !== undefined ? { inspections: columnSelector(req.inspectionTimesColumn) } : {}) },
    req.csvOptions,
    'the CSV',
  );
  const rows = r.interval.start.length;
  if (rows === 0) throw new InputError('The interval columns have no usable rows.', {}, 'too-few-values');
  const [start, ...others] = r.columns;
  const modes = readIntervalModes(r, (line) => `Row ${line}`);
  return {
    dataset: { interval: r.interval, ...(modes ? { modes: modes.modes } : {}) },
    input: {
      source: 'csv',
      n: r.interval.counts ? Array.from(r.interval.counts).reduce((a, c) => a + c, 0) : rows,
      column: start!.column,
      columnIndex: start!.index,
      rowsRead: r.summary.rowsRead,
      skipped: r.summary.skipped.map((k) => ({ ...k, description: SKIP_REASON_WORDS[k.reason] })),
      blankLines: r.summary.blankLines,
      delimiter: r.summary.delimiter,
      delimiterDetected: r.summary.delimiterDetected,
      header: r.summary.header,
      warnings: [...r.summary.warnings, ...(modes?.notes ?? [])],
      // The interval start is `column`; the end, the count, the failure mode and the inspection times are the other columns.
      otherColumns: others.map((c) => ({ role: c.role as 'interval end' | 'count' | 'failure mode' | 'inspection times', column: c.column })),
    },
  };
}

/** A dated series (peaks over a threshold): the value column and the date column read in one pass (rows stay aligned). */
function datedDataset(req: AnalyzeRequest, dateColumn: string | number): { dataset: DatasetInput; input: InputSummary } {
  const t = readColumns(req.csv ?? '', [{ select: req.column ?? 1, kind: 'number' }, { select: dateColumn, kind: 'text' }], req.csvOptions);
  const value = t.columns[0] as NumberColumn;
  const date = t.columns[1] as TextColumn;
  if (value.values.length === 0) throw new InputError(`Column ${JSON.stringify(value.column)} has no usable rows.`, { column: value.column }, 'too-few-values');
  const { columns: _c, rowNumbers, ...summary } = t;
  return {
    dataset: { values: value.values, dates: dayNumbers(date.texts, rowNumbers, date.column) },
    input: {
      source: 'csv',
      n: value.values.length,
      column: value.column,
      columnIndex: value.index,
      rowsRead: summary.rowsRead,
      skipped: summary.skipped.map((k) => ({ ...k, description: SKIP_REASON_WORDS[k.reason] })),
      blankLines: summary.blankLines,
      delimiter: summary.delimiter,
      delimiterDetected: summary.delimiterDetected,
      header: summary.header,
      warnings: summary.warnings,
      otherColumns: [{ role: 'date', column: date.column }],
    },
  };
}

/**
 * A peak file (core/workflow/flood-record.ts): read by the core's peak-file reader as the CLI reads
 * it, with the historical-period options; its columns are taken by name, so no column role applies
 * (each one given is refused, naming it) and the value column, when sent, must be the peak column.
 */
function peakFileDataset(req: AnalyzeRequest, text: string): { dataset: DatasetInput; input: InputSummary } {
  const wf = req.workflow;
  const roles: [string, unknown][] = [
    ['statusColumn', wf?.statusColumn ?? wf?.status],
    ['subgroupColumn', wf?.subgroupColumn ?? wf?.subgroups],
    ['orderColumn', wf?.orderColumn ?? wf?.order],
    ['grouped', wf?.grouped],
    ['intervalColumns', req.intervalColumns],
    ['countColumn', req.countColumn],
    ['inspectionTimesColumn', req.inspectionTimesColumn],
    ['dateColumn', req.dateColumn],
    ['modeColumn', req.modeColumn],
  ];
  for (const [field, v] of roles) {
    if (v !== undefined && v !== null) {
      throw new InputError(`The file is a peak file (tab-separated, '#' comments, columns ${PEAK_COLUMN}, peak_dt, peak_cd read by name): ${field} does not apply to it.`, { column: field }, 'bad-option');
    }
  }
  const read = readFloodRecord(text, { perceptionThreshold: req.options.perceptionThreshold ?? null, historicalStart: req.options.historicalStart ?? null });
  const columns = read.file.columns;
  const peakIndex = columns.indexOf(PEAK_COLUMN) + 1;
  if (req.column !== undefined && req.column !== PEAK_COLUMN && req.column !== peakIndex) {
    throw new InputError(
      `The file is a peak file: its peaks are column ${PEAK_COLUMN} (${peakIndex}); column ${JSON.stringify(req.column)} cannot be analysed as the peaks.`,
      { column: String(req.column), value: String(req.column) },
      'bad-option',
    );
  }
  return {
    dataset: { floodRecord: read },
    input: {
      source: 'csv',
      n: read.makeUp.peaks,
      column: PEAK_COLUMN,
      columnIndex: peakIndex,
      rowsRead: read.makeUp.peaks,
      delimiter: '\t',
      delimiterDetected: true,
      header: columns,
      warnings: [read.makeUp.text],
    },
  };
}

/** A planned request: the core's plan with what the finish needs. */
export interface PlannedRequest {
  readonly request: AnalyzeRequest;
  readonly dataset: DatasetInput;
  readonly input: InputSummary;
  readonly plan: DatasetPlan;
}

/**
 * Read the data and plan the analysis (everything but the bootstrap), refusing a request whose
 * work exceeds server/limits.ts with a 413/422 naming the limit. `plan.kind === 'done'`: the
 * report is ready (respond at once); otherwise run `plan.jobs` and call finishRequest.
 */
export function planRequest(req: AnalyzeRequest): PlannedRequest {
  const { dataset, input } = requestDataset(req);
  const options = req.options;
  checkDatasetSize(dataset, options);
  const plan = planDataset(dataset, options);
  // the capability jobs are bounded in the core (POOL_CAPABILITY_WORK); this limit is the goodness-of-fit bootstrap's
  if (plan.kind === 'complete') checkBootstrapWork(plan.plan.plan.bootstrapJobs);
  return { request: req, dataset, input, plan };
}

/** The response of a planned request, from its bootstrap counts (one per job, in order; none when done). */
export function finishRequest(planned: PlannedRequest, counts: readonly DatasetJobResult[]): AnalyzeResponse {
  const { plan, request, input, dataset } = planned;
  const report = plan.kind === 'done' ? plan.report : finishDataset(plan, counts);
  // A dated series' report models the event peaks, not the values: no evidence is drawn from them.
  if (!request.evidence || report.dataKind === 'grouped' || !dataset.values || dataset.dates) return { ...report, input };
  const sample: Sample = plan.kind === 'complete' ? plan.plan.plan.sample : prepareSample(dataset.values);
  const censoring = dataset.status ? { times: Float64Array.from(dataset.values), failed: Uint8Array.from(dataset.status) } : undefined;
  return { ...report, input, evidence: computeEvidence(sample, report, request.evidenceOptions, censoring) };
}

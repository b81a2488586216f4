/**
 * The notes beside the data about what the chosen columns leave out: a failed / still-running column
 * that is not used (every value then fitted as a failure), a failure-mode column that is not used
 * (every failure then fitted as one mode), and a text column that splits the rows
 * into several series pooled into one sample.
 */
import { seriesKeyColumn } from './columns.js';
import { byId as $, clear, el } from './dom.js';
import { ROLE_FIELDS } from './page-options.js';
import type { PageState } from './state.js';

const STATUS_NAME = /^(status|st|censor(ed|ing)?|cens|event|failed|failure|suspended|suspension|runout|run_out)$/i;

/** A column named like a failed / still-running flag that is not used as the status column, or undefined. */
export function unusedStatusColumn(st: PageState): { index: number; label: string } | undefined {
  const r = st.reading;
  const flag = r.shape === 'values' ? r.columns.find((c) => c.index !== r.column && STATUS_NAME.test(c.label.trim())) : undefined;
  return flag && st.settings.statusColumn !== flag.index ? flag : undefined;
}

const MODE_NAME = /^(mode|failure[ _-]?mode|fail[ _-]?mode|mechanism|failure[ _-]?mechanism|cause|failure[ _-]?cause)$/i;

/**
 * With the status column in use, or with interval rows, a column named like a failure mode (mode,
 * failure mode, mechanism, cause) that is not used as the failure-mode column, or undefined. Names
 * only: common practice, no source.
 */
export function unusedModeColumn(st: PageState): { index: number; label: string } | undefined {
  const r = st.reading;
  const status = st.settings.statusColumn;
  const taken = r.shape === 'interval' ? [r.interval.start, r.interval.end, r.interval.count] : [r.column, status];
  if (r.shape === 'grouped' || (r.shape === 'values' && (typeof status !== 'number' || status <= 0))) return undefined;
  const flag = r.columns.find((c) => !taken.includes(c.index) && MODE_NAME.test(c.label.trim()));
  return flag && st.settings.modeColumn !== flag.index ? flag : undefined;
}

/**
 * A file with a status-like column probably marks some values as censored. Fitting every value as
 * observed biases a life estimate low, so say so and offer the column.
 */
export function noteCensoring(st: PageState): void {
  const note = $('column-note');
  const flag = unusedStatusColumn(st);
  const mode = flag ? undefined : unusedModeColumn(st);
  clear(note);
  note.hidden = !flag && !mode;
  if (mode) {
    note.append(
      `This file has a column “${mode.label}”, which may name the failure mode of each failed unit. Here every failure is fitted as one mode, which mixes mechanisms that wear out differently. `,
      el('button', { type: 'button', className: 'btn small use-mode', id: 'use-mode', 'data-column': String(mode.index) }, `Use “${mode.label}” as the failure-mode column`),
    );
  }
  if (!flag) return;
  note.append(
    `This file has a column “${flag.label}”, which may mark censored values (units still running, specimens that did not fail). ` +
      `Here every value of the chosen column is fitted as an observed value; if some are censored, the fitted life is biased low. ` +
      `Do not base a maintenance interval on this fit without a censored-data analysis. `,
    el('button', { type: 'button', className: 'btn small use-status', id: 'use-status', 'data-column': String(flag.index) }, `Use “${flag.label}” as failed (1) / still running (0)`),
  );
}

/**
 * A text column that splits the rows into runs (a gauge, a part, a site) means several series in
 * one file, which fitted as one sample pools different populations: say so, and point to the
 * many-series page.
 */
export function noteSeries(st: PageState): void {
  const note = $('series-note');
  const r = st.reading;
  clear(note);
  const roles = ROLE_FIELDS.map((f) => st.settings[f.name]).filter((i): i is number => typeof i === 'number' && i > 0);
  const key = st.source && r.shape === 'values' ? seriesKeyColumn(st.source.csv, { header: r.header, decimal: r.decimal }, r.columns, [r.column, ...roles]) : null;
  note.hidden = key === null;
  if (!key) return;
  const shown = key.labels.slice(0, 4).join(', ') + (key.labels.length > 4 ? ', …' : '');
  note.append(
    `Column “${key.label}” splits the rows into runs (${shown}): this looks like several series in one file, and here all their values are fitted as one sample. `,
    'Analyse each series on its own on the ',
    el('a', { href: './batch.html' }, 'many-series page'),
    ', or load one series at a time.',
  );
}


/**
 * Grouped counts (class limits with counts) on the page and in the exported report: which columns
 * look like lower / upper / count, the classes read from the file with the core's CSV reader, and
 * the grouped result as plain text (the chi-square on the given classes, merged to ≥ 5 expected,
 * with k − 1 − m degrees of freedom; why Anderson–Darling is not offered). Pure: no DOM.
 * Every number shown comes from the core's report (core/grouped, core/workflow).
 */
import { readColumns, type NumberColumn } from '../../core/index.js';
import type { AnalyzeResponse } from './api.js';
import type { ColumnChoice } from './columns.js';
import { pValue, sig } from './format.js';
import type { GroupedCandidateReport, GroupedDatasetReport } from './types.js';

export type GroupedResponse = Extract<AnalyzeResponse, { readonly dataKind: 'grouped' }>;

export function isGrouped(r: AnalyzeResponse | null | undefined): r is GroupedResponse {
  return r?.dataKind === 'grouped';
}

export interface GroupedColumns {
  readonly lower: number;
  readonly upper: number;
  readonly count: number;
}

const LOWER = /^(lower|low|lo|from|min|lower[ _-]?(limit|bound|edge|class[ _-]?limit)|class[ _-]?(lower|from|start))$/i;
const UPPER = /^(upper|high|hi|to|max|upper[ _-]?(limit|bound|edge|class[ _-]?limit)|class[ _-]?(upper|to|end))$/i;
const COUNT = /^(count|counts|n|number|freq|frequency|tally|observed|cases)$/i;

/** The lower, upper and count columns when the header names all three (common practice, no source), else null. */
export function guessGroupedColumns(columns: readonly ColumnChoice[]): GroupedColumns | null {
  const find = (re: RegExp): number => columns.find((c) => re.test(c.label.trim()))?.index ?? 0;
  const lower = find(LOWER);
  const upper = find(UPPER);
  const count = find(COUNT);
  return lower > 0 && upper > 0 && count > 0 && new Set([lower, upper, count]).size === 3 ? { lower, upper, count } : null;
}

/** A fallback choice for the three selects: the guess, or the first three columns. */
export function defaultGroupedColumns(columns: readonly ColumnChoice[]): GroupedColumns {
  const g = guessGroupedColumns(columns);
  if (g) return g;
  const at = (i: number): number => columns[Math.min(i, columns.length - 1)]?.index ?? 1;
  return { lower: at(0), upper: at(1), count: at(2) };
}

/** The classes as request fields (server/API.md `grouped`), read strictly: a bad cell is an error naming its row. */
export function readGroupedClasses(
  csv: string,
  cols: GroupedColumns,
  options: { readonly header: boolean; readonly decimal: '.' | ',' },
): { lower: number | null; upper: number | null; count: number }[] {
  const t = readColumns(
    csv,
    [
      { select: cols.lower, kind: 'number' },
      { select: cols.upper, kind: 'number' },
      { select: cols.count, kind: 'number' },
    ],
    { header: options.header, decimal: options.decimal, skipInvalid: false },
  );
  const [lo, up, ct] = t.columns as NumberColumn[];
  const out: { lower: number | null; upper: number | null; count: number }[] = [];
  for (let i = 0; i < ct!.values.length; i++) out.push({ lower: lo!.values[i]!, upper: up!.values[i]!, count: ct!.values[i]! });
  return out;
}

function limit(x: number | null, isLower: boolean): string {
  if (x === null || !Number.isFinite(x)) return isLower ? '−∞' : '∞';
  return sig(x, 5);
}

/** The classes as read (header row first), for the page and the report. */
export function classRows(r: GroupedDatasetReport): string[][] {
  return [['Class', 'From (above)', 'To (up to and including)', 'Count'], ...r.grouped.classes.map((c, j) => [String(j + 1), limit(c.lower, true), limit(c.upper, false), String(c.count)])];
}

/** The selected candidate's chi-square cells (merged classes) as text rows, header first; [] when not computed. */
export function cellRows(c: GroupedCandidateReport): string[][] {
  const chi = c.chiSquare;
  if (!chi.computable) return [];
  return [['Cell', 'From', 'To', 'Observed', 'Expected'], ...chi.bins.map((b, j) => [String(j + 1), limit(b.lower, true), limit(b.upper, false), String(b.observed), Number(b.expected.toPrecision(4)).toString()])];
}

/** The selected candidate's cells for the observed-vs-expected chart (client/charts/bin-counts.ts). */
export function chartCells(c: GroupedCandidateReport): { index: number; lower: number | null; upper: number | null; observed: number; expected: number }[] {
  const chi = c.chiSquare;
  if (!chi.computable) return [];
  return chi.bins.map((b, index) => ({ index, lower: b.lower, upper: b.upper, observed: b.observed, expected: b.expected }));
}

export interface GroupedText {
  /** One line: total count, classes given, cells after merging. */
  readonly summary: string;
  /** The selected candidate's chi-square in words (the core's decision), with dof and the rule. */
  readonly test: string;
  /** The degrees-of-freedom rule (the core's words). */
  readonly rule: string;
  /** Why Anderson–Darling is not offered (the core's words). */
  readonly adNote: string;
  /** Why the value charts are not drawn. */
  readonly noValues: string;
}

export function groupedText(r: GroupedDatasetReport, c: GroupedCandidateReport | undefined): GroupedText {
  const chi = c?.chiSquare;
  const m = c?.estimatedParameters;
  let test = 'No model was fitted.';
  if (c && chi && chi.computable) {
    test =
      `${chi.decision} The ${chi.classesGiven} classes given were merged left to right into k = ${chi.k} cells expecting at least 5 each` +
      `${chi.refitted ? ', and the model was refitted on the merged cells' : ''}; degrees of freedom k − 1 − m = ${chi.k} − 1 − ${m} = ${chi.dof}` +
      ` (the reference for estimates from the classes themselves, so no Chernoff–Lehmann bracket; the p-value is a large-sample approximation). Critical value ${sig(chi.criticalValue, 4)}, p = ${pValue(chi.pValue)}.`;
  } else if (c && chi && !chi.computable) test = `Chi-square not computed: ${chi.reason}`;
  return {
    summary: `${r.grouped.total} counted in ${r.grouped.classes.length} classes (class limits with counts: there are no individual values).`,
    test,
    rule: r.grouped.chiSquareRule,
    adNote: r.grouped.andersonDarling.reason,
    noValues:
      'The histogram, probability plot and distribution-function charts need the individual values, which class counts do not carry; ' +
      'they are not drawn. The chart below compares the counts in each (merged) class with those the model expects.',
  };
}

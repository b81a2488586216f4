/**
 * Settings + source → the API request (server/API.md), or the problems that stop it, each naming
 * the setting it belongs to. Pure: no DOM, no fetch; unit-tested in test/client/request.test.ts.
 *
 * Every setting is checked by its option in the core's table with the API's own JSON parser
 * (core/options parseJsonOption), so the page refuses exactly what the API refuses.
 */
import { OPTION_COMBINATIONS, checkCombinations, looksLikePeakFile, optionNamed, parseFormOption, parseJsonOption, parseStrictNumber, type OptionSpec, type OptionValue } from '../../core/index.js';
import type { AnalyzeRequest, GroupedRequest } from './api.js';
import { readGroupedClasses } from './grouped-view.js';
import { PAGE_FIELDS, ROLE_FIELDS, pageField, roleApplies, type DataShape, type PageField } from './page-options.js';
import { settingText, type Settings } from './settings.js';
import { columnLabel, type PageState } from './state.js';

export interface Problem {
  /** The settings key (the request field name) the problem belongs to. */
  readonly field: string;
  readonly message: string;
}

export type BuiltRequest =
  | { readonly kind: 'values'; readonly request: AnalyzeRequest; readonly column: string; readonly requestedBins: number | null }
  | { readonly kind: 'grouped'; readonly request: GroupedRequest; readonly column: string; readonly requestedBins: null };

export type RequestOutcome = { readonly ok: true; readonly built: BuiltRequest } | { readonly ok: false; readonly problems: readonly Problem[] };


/** A number typed on the page: a point or a comma as decimal mark (the core's strict grammar: no hex, no Infinity). */
function toNumber(text: string): number {
  const t = text.trim();
  const point = parseStrictNumber(t, '.');
  return Number.isNaN(point) ? parseStrictNumber(t, ',') : point;
}

/**
 * Check a value with the option's own rule, as the API does (parseJsonOption): the page refuses
 * exactly what the server refuses, with the same words. The core's message names the JSON field;
 * the page shows it beside that setting.
 */
function check(key: string, value: unknown, problems: Problem[]): boolean {
  const spec = optionNamed(key);
  if (!spec) return true;
  const out = parseJsonOption(spec, value);
  if (out.ok) return true;
  problems.push({ field: key, message: `${out.message} (${spec.help})` });
  return false;
}

/** One optional number: undefined when empty, null when refused (problem recorded). */
function one(settings: Settings, key: string, problems: Problem[]): number | undefined | null {
  const text = settingText(settings, key).trim();
  if (text === '') return undefined;
  const x = toNumber(text);
  if (Number.isNaN(x)) {
    problems.push({ field: key, message: `“${text}” is not a number.` });
    return null;
  }
  return check(key, x, problems) ? x : null;
}

/** A list of numbers separated by commas, semicolons or spaces (each checked, each once, by the option's rule). */
function many(settings: Settings, key: string, problems: Problem[]): number[] | undefined | null {
  const text = settingText(settings, key).trim();
  if (text === '') return undefined;
  const parts = text.split(/[\s,;]+/).filter((t) => t !== '');
  const xs = parts.map(toNumber);
  const bad = parts.find((_, i) => Number.isNaN(xs[i]));
  if (bad !== undefined) {
    problems.push({ field: key, message: `“${bad}” is not a number; separate the values with commas.` });
    return null;
  }
  return check(key, xs, problems) ? xs : null;
}

/** One form field's value by its option's kind: undefined when not given, null when refused (problem recorded). */
function fieldValue(s: Settings, f: PageField, problems: Problem[]): OptionValue | undefined {
  const kind = f.spec.kind;
  if (kind === 'number' || kind === 'integer') return one(s, f.name, problems);
  if (kind === 'numbers') return many(s, f.name, problems);
  const text = settingText(s, f.name);
  if (text.trim() === '') return undefined;
  const out = parseFormOption(f.spec, text);
  if (out.ok) return out.value;
  problems.push({ field: f.name, message: `${out.message} (${f.spec.help})` });
  return null;
}

/** The settings every kind of data reads, built by hand below; every other field is a trade field, sent where it applies. */
const FITTING_KEYS = new Set(['families', 'alpha', 'bins', 'pMethod', 'replicates', 'seed', 'confidence']);

/** Whether a trade option applies to these data: life options with a status column, the others without one. */
function appliesHere(spec: OptionSpec, life: boolean): boolean {
  const scopes: readonly string[] = spec.appliesTo;
  return life ? scopes.includes('life') || scopes.includes('censored') : scopes.some((x) => x === 'flood' || x === 'capability' || x === 'trend' || x === 'complete' || x === 'all');
}

const sameAsDefault = (spec: OptionSpec, v: OptionValue): boolean => JSON.stringify(v) === JSON.stringify(spec.default);

/**
 * The trade fields that apply, as the request sends them. A field at its table default is not sent
 * (the server applies the same default). A field whose option needs another
 * (core/options/combinations.ts) goes only with it: given without it, it is a problem naming what it
 * needs (a column role without it is quietly not sent, as the subgroups without a tolerance). The remaining rules between options
 * (conflicts, order) are checked as the API checks them.
 */
function tradeFields(s: Settings, life: boolean, problems: Problem[], shape: DataShape, reading: ReadonlyMap<string, OptionValue> = new Map()): Map<string, OptionValue> {
  // The reading's own fields (interval columns) count as given; the column roles that apply to this shape of data
  // (page-options.ts roleApplies: with interval rows only the failure-mode column).
  const given = new Map<string, OptionValue>(reading);
  for (const r of ROLE_FIELDS) {
    const i = s[r.name];
    if (roleApplies(r, shape) && typeof i === 'number' && i > 0 && appliesHere(r.spec, life)) given.set(r.name, i);
  }
  for (const f of PAGE_FIELDS) {
    if (FITTING_KEYS.has(f.name) || f.control === 'role') continue;
    // Every typed value is checked; only what applies to these data is sent.
    const v = fieldValue(s, f, problems);
    if (!appliesHere(f.spec, life) || v === undefined || v === null || (f.spec.kind === 'boolean' && v === false)) continue;
    if (!sameAsDefault(f.spec, v)) given.set(f.name, v);
  }
  const label = (n: string): string => pageField(n)?.label ?? n;
  for (let changed = true; changed; ) {
    changed = false;
    for (const rule of OPTION_COMBINATIONS) {
      if (rule.kind !== 'needs' || !given.has(rule.option) || rule.anyOf.some((n) => given.has(n))) continue;
      if (pageField(rule.option)?.control !== 'role') {
        const options = rule.anyOf.filter((n) => pageField(n)).map(label);
        if (options.length > 0) problems.push({ field: rule.option, message: `“${label(rule.option)}” needs ${options.map((o) => `“${o}”`).join(' or ')}${rule.why ? ` (${rule.why})` : ''}.` });
      }
      given.delete(rule.option);
      changed = true;
    }
  }
  return given;
}

type Mutable<T> = { -readonly [K in keyof T]: T[K] };

/** The request for the state's source and settings (only the fields that apply), or every problem found. */
export function buildRequest(state: PageState): RequestOutcome {
  const { source, reading, settings: s } = state;
  if (!source) return { ok: false, problems: [{ field: 'source', message: 'Load a file, paste values or pick a demo first.' }] };
  const problems: Problem[] = [];
  const alpha = one(s, 'alpha', problems);
  const bins = one(s, 'bins', problems);
  const seed = one(s, 'seed', problems);
  const replicates = s.pMethod === 'bootstrap' ? one(s, 'replicates', problems) : undefined;
  if (s.families.length === 0) problems.push({ field: 'families', message: 'Tick at least one model to try.' });
  else check('families', [...s.families], problems);
  const confidence = one(s, 'confidence', problems);
  const column = columnLabel(reading);

  // Trade sections: only the fields that apply to these data (life with a status column; flood,
  // capability and trend without one), and what the rules between options allow.
  const iv = reading.interval;
  const intervalFields = new Map<string, OptionValue>(
    reading.shape === 'interval' ? [['intervalColumns', [iv.start, iv.end]], ...(iv.count > 0 ? [['countColumn', iv.count] as [string, OptionValue]] : [])] : [],
  );
  const life = reading.shape === 'interval' || (typeof s.statusColumn === 'number' && s.statusColumn > 0);
  const wf = tradeFields(s, life, problems, reading.shape, intervalFields);
  const lsl = wf.get('lsl');
  const usl = wf.get('usl');
  if (typeof lsl === 'number' && typeof usl === 'number' && !(lsl < usl)) problems.push({ field: 'usl', message: 'The upper limit must be above the lower one.' });
  if (problems.length === 0) {
    const rules = checkCombinations(wf, 'api');
    if (!rules.ok) problems.push({ field: rules.field, message: rules.message });
  }

  if (reading.shape === 'grouped') {
    const g = reading.grouped;
    if (new Set([g.lower, g.upper, g.count]).size !== 3) problems.push({ field: 'classes', message: 'Choose three different columns for the lower limit, the upper limit and the count.' });
    if (problems.length > 0) return { ok: false, problems };
    let grouped: GroupedRequest['grouped'];
    try {
      grouped = readGroupedClasses(source.csv, g, { header: reading.header, decimal: reading.decimal });
    } catch (err) {
      return { ok: false, problems: [{ field: 'classes', message: err instanceof Error ? err.message : String(err) }] };
    }
    const request: GroupedRequest = { grouped, families: [...s.families], alpha: alpha ?? 0.05, ...(typeof seed === 'number' ? { seed } : {}) };
    return { ok: true, built: { kind: 'grouped', request, column, requestedBins: null } };
  }
  if (reading.shape === 'interval' && new Set([iv.start, iv.end, ...(iv.count > 0 ? [iv.count] : [])]).size !== (iv.count > 0 ? 3 : 2)) {
    problems.push({ field: 'intervals', message: 'Choose different columns for the start of the interval, its end and the count.' });
  }
  const mode = wf.get('modeColumn');
  if (reading.shape === 'interval' && typeof mode === 'number' && [iv.start, iv.end, iv.count].includes(mode)) {
    problems.push({ field: 'modeColumn', message: 'The failure-mode column must be another column than the interval start, end and count.' });
  }
  const seen = wf.get('inspectionTimesColumn');
  if (reading.shape === 'interval' && typeof seen === 'number' && [iv.start, iv.end, iv.count, mode].includes(seen)) {
    problems.push({ field: 'inspectionTimesColumn', message: 'The inspection-times column must be another column than the interval start, end, count and failure mode.' });
  }
  if (problems.length > 0) return { ok: false, problems };
  if (wf.size > 0 && typeof confidence === 'number') wf.set('confidence', confidence);
  if (looksLikePeakFile(source.csv)) {
    // A peak file is one flood record read by its column names: no value column, column roles or chi-square bins are sent
    // (the server refuses a role), and its evidence is the section's own.
    for (const k of [...wf.keys()]) if (optionNamed(k)?.kind === 'column') wf.delete(k);
    if (typeof confidence === 'number') wf.set('confidence', confidence);
    const request: AnalyzeRequest = {
      csv: source.csv,
      csvOptions: { decimal: '.', header: true, skipInvalid: false },
      families: [...s.families],
      alpha: alpha ?? 0.05,
      pMethod: s.pMethod,
      evidence: false,
      ...(typeof seed === 'number' ? { seed } : {}),
      ...(typeof replicates === 'number' ? { replicates } : {}),
      ...Object.fromEntries(wf),
    };
    return { ok: true, built: { kind: 'values', request, column, requestedBins: null } };
  }
  // Interval rows name their columns in intervalColumns (in wf); there is no value column and no bins.
  const values = reading.shape !== 'interval';
  const request: AnalyzeRequest = {
    csv: source.csv,
    ...(values ? { column: reading.column } : {}),
    csvOptions: { decimal: reading.decimal, header: reading.header, skipInvalid: values },
    families: [...s.families],
    alpha: alpha ?? 0.05,
    ...(values ? { bins: bins ?? null } : {}),
    pMethod: s.pMethod,
    // Interval rows have no failure points to plot (the life section draws their Turnbull boxes).
    evidence: values,
    ...(typeof seed === 'number' ? { seed } : {}),
    ...(typeof replicates === 'number' ? { replicates } : {}),
    ...Object.fromEntries(wf),
  };
  return { ok: true, built: { kind: 'values', request, column, requestedBins: bins ?? null } };
}

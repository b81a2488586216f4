/**
 * Settings + source → the API request (server/API.md), or the problems that stop it, each naming
 * the setting it belongs to. Pure: no DOM, no fetch; unit-tested in test/client/request.test.ts.
 *
 * Every setting is checked by its option in the core's table with the API's own JSON parser
 * (core/options parseJsonOption), so the page refuses exactly what the API refuses.
 */
import { optionNamed, parseJsonOption, parseStrictNumber } from '../../core/index.js';
import type { AnalyzeRequest, GroupedRequest } from './api.js';
import { readGroupedClasses } from './grouped-view.js';
import type { Settings } from './settings.js';
import { columnLabel, type PageState } from './state.js';

export interface Problem {
  /** The settings key (the request field name) the problem belongs to. */
  readonly field: keyof Settings | 'source' | 'classes';
  readonly message: string;
}

export type BuiltRequest =
  | { readonly kind: 'values'; readonly request: AnalyzeRequest; readonly column: string; readonly requestedBins: number | null }
  | { readonly kind: 'grouped'; readonly request: GroupedRequest; readonly column: string; readonly requestedBins: null };

export type RequestOutcome = { readonly ok: true; readonly built: BuiltRequest } | { readonly ok: false; readonly problems: readonly Problem[] };

/** The settings read as numbers, each checked by its option in the core's table (core/options). */
type NumberKey = 'alpha' | 'bins' | 'replicates' | 'seed' | 'confidence' | 'designLife' | 'lsl' | 'usl' | 'target';
type ListKey = 'bLifePercents' | 'reliabilityTimes' | 'returnPeriods';

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
function check(key: keyof Settings, value: unknown, problems: Problem[]): boolean {
  const spec = optionNamed(key);
  if (!spec) return true;
  const out = parseJsonOption(spec, value);
  if (out.ok) return true;
  problems.push({ field: key, message: `${out.message} (${spec.help})` });
  return false;
}

/** One optional number: undefined when empty, null when refused (problem recorded). */
function one(settings: Settings, key: NumberKey, problems: Problem[]): number | undefined | null {
  const text = String(settings[key]).trim();
  if (text === '') return undefined;
  const x = toNumber(text);
  if (Number.isNaN(x)) {
    problems.push({ field: key, message: `“${text}” is not a number.` });
    return null;
  }
  return check(key, x, problems) ? x : null;
}

/** A list of numbers separated by commas, semicolons or spaces (each checked, each once, by the option's rule). */
function many(settings: Settings, key: ListKey, problems: Problem[]): number[] | undefined | null {
  const text = settings[key].trim();
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
  const bl = many(s, 'bLifePercents', problems);
  const rt = many(s, 'reliabilityTimes', problems);
  const rp = many(s, 'returnPeriods', problems);
  const dl = one(s, 'designLife', problems);
  const lsl = one(s, 'lsl', problems);
  const usl = one(s, 'usl', problems);
  const target = one(s, 'target', problems);
  if (typeof lsl === 'number' && typeof usl === 'number' && !(lsl < usl)) problems.push({ field: 'usl', message: 'The upper limit must be above the lower one.' });
  const column = columnLabel(reading);

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
  if (problems.length > 0) return { ok: false, problems };

  // Trade sections: only the fields that apply to these data (life with a status column; flood,
  // capability and trend without one).
  const wf: Mutable<Partial<AnalyzeRequest>> = {};
  const life = s.statusColumn > 0;
  if (life) {
    wf.statusColumn = s.statusColumn;
    if (bl) wf.bLifePercents = bl;
    if (rt) wf.reliabilityTimes = rt;
    wf.boundMethod = s.boundMethod;
  } else {
    if (rp) {
      wf.returnPeriods = rp;
      if (typeof dl === 'number') wf.designLife = dl;
      wf.plottingPosition = s.plottingPosition;
    }
    if (typeof lsl === 'number' || typeof usl === 'number') {
      if (typeof lsl === 'number') wf.lsl = lsl;
      if (typeof usl === 'number') wf.usl = usl;
      if (typeof target === 'number') wf.target = target;
      if (s.subgroupColumn > 0) wf.subgroupColumn = s.subgroupColumn;
    }
    if (s.orderColumn > 0) wf.orderColumn = s.orderColumn;
  }
  if (Object.keys(wf).length > 0 && typeof confidence === 'number') wf.confidence = confidence;
  const request: AnalyzeRequest = {
    csv: source.csv,
    column: reading.column,
    csvOptions: { decimal: reading.decimal, header: reading.header, skipInvalid: true },
    families: [...s.families],
    alpha: alpha ?? 0.05,
    bins: bins ?? null,
    pMethod: s.pMethod,
    evidence: true,
    ...(typeof seed === 'number' ? { seed } : {}),
    ...(typeof replicates === 'number' ? { replicates } : {}),
    ...wf,
  };
  return { ok: true, built: { kind: 'values', request, column, requestedBins: bins ?? null } };
}

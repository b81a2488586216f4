/**
 * Settings + source → the API request (server/API.md), or the problems that stop it, each naming
 * the setting it belongs to. Pure: no DOM, no fetch; unit-tested in test/client/request.test.ts.
 *
 * Each setting is read by one rule in `RULES` (its kind and limits). When the core's option table
 * is ready, `RULES` is derived from it, so the page refuses exactly what the API refuses.
 */
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

/** One number rule: the range (inclusive unless said) and the words when it is broken. */
interface NumberRule {
  readonly integer?: boolean;
  readonly min?: number;
  readonly max?: number;
  readonly minExclusive?: boolean;
  readonly maxExclusive?: boolean;
  readonly message: string;
}

/**
 * Today's limits, as server/validate.ts checks them (bins ≥ 2 as the core and the CLI take it,
 * replicates 19–100000, α and confidence strictly between 0 and 1).
 */
export const RULES = {
  alpha: { min: 0, max: 1, minExclusive: true, maxExclusive: true, message: 'α must be a number between 0 and 1, e.g. 0.05.' },
  bins: { integer: true, min: 2, message: 'Bins must be a whole number of at least 2, or empty for automatic.' },
  replicates: { integer: true, min: 19, max: 100000, message: 'B must be a whole number from 19 to 100000.' },
  seed: { integer: true, min: 0, max: Number.MAX_SAFE_INTEGER, message: 'The seed must be a whole number ≥ 0.' },
  confidence: { min: 0, max: 1, minExclusive: true, maxExclusive: true, message: 'The confidence must be between 0 and 1, e.g. 0.90.' },
  bLifePercents: { min: 0, max: 100, minExclusive: true, maxExclusive: true, message: 'Give percents between 0 and 100, separated by commas, each once.' },
  reliabilityTimes: { min: 0, minExclusive: true, message: 'Give times above 0, separated by commas, each once.' },
  returnPeriods: { min: 1, minExclusive: true, message: 'Give return periods in years, each above 1, separated by commas, each once.' },
  designLife: { min: 0, minExclusive: true, message: 'The design life must be a number of years above 0.' },
  lsl: { message: 'The lower limit must be a number.' },
  usl: { message: 'The upper limit must be a number.' },
  target: { message: 'The target must be a number.' },
} as const satisfies Record<string, NumberRule>;

function passes(x: number, r: NumberRule): boolean {
  if (!Number.isFinite(x)) return false;
  if (r.integer && !Number.isSafeInteger(x)) return false;
  if (r.min !== undefined && (r.minExclusive ? !(x > r.min) : !(x >= r.min))) return false;
  if (r.max !== undefined && (r.maxExclusive ? !(x < r.max) : !(x <= r.max))) return false;
  return true;
}

/** A number typed on the page: a point or a comma as decimal mark, nothing else (no hex, no Infinity). */
function toNumber(text: string): number {
  const t = text.trim().replace(',', '.');
  return /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(t) ? Number(t) : NaN;
}

/** One optional number: undefined when empty, null when broken (problem recorded). */
function one(settings: Settings, key: keyof typeof RULES, problems: Problem[]): number | undefined | null {
  const text = String(settings[key]).trim();
  if (text === '') return undefined;
  const x = toNumber(text);
  if (!passes(x, RULES[key])) {
    problems.push({ field: key, message: RULES[key].message });
    return null;
  }
  return x;
}

/** A list of numbers separated by commas, semicolons or spaces, each once. */
function many(settings: Settings, key: 'bLifePercents' | 'reliabilityTimes' | 'returnPeriods', problems: Problem[]): number[] | undefined | null {
  const text = settings[key].trim();
  if (text === '') return undefined;
  const xs = text.split(/[\s,;]+/).filter((t) => t !== '').map(Number);
  if (xs.some((x) => !passes(x, RULES[key])) || new Set(xs).size !== xs.length) {
    problems.push({ field: key, message: RULES[key].message });
    return null;
  }
  return xs;
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

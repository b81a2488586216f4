/**
 * Strict validation of request bodies. Unknown fields are rejected with a message naming the
 * field; every field's type and range is checked here, before the core sees it, so that a bad
 * request never reaches the numerics. (The core checks its own preconditions again.)
 */
import { allFamilies, type CsvOptions, type AnalyzeOptions, type DatasetInput, type DatasetOptions, type EvidenceOptions, type FamilyName, type PMethod } from '../core/index.js';
import { badRequest } from './errors.js';

export interface AnalyzeRequest {
  readonly values?: readonly number[];
  readonly csv?: string;
  readonly column?: string | number;
  readonly csvOptions: CsvOptions;
  readonly families?: readonly FamilyName[];
  readonly alpha?: number;
  readonly bins?: number | null;
  readonly seed?: number;
  readonly pMethod?: PMethod;
  readonly replicates?: number;
  readonly evidence: boolean;
  readonly evidenceOptions: EvidenceOptions;
  /** Trade workflows (issue 4): extra data columns and the workflow options of `analyzeDataset`. */
  readonly workflow: WorkflowRequest | null;
}

/** The workflow part of a request: the extra columns (by CSV column or as arrays) and the options. */
export interface WorkflowRequest {
  readonly statusColumn?: string | number;
  readonly status?: readonly number[];
  readonly subgroupColumn?: string | number;
  readonly subgroups?: readonly (string | number)[];
  readonly orderColumn?: string | number;
  readonly order?: readonly number[];
  readonly grouped?: readonly GroupedClass[];
  readonly options: Omit<DatasetOptions, keyof AnalyzeOptions>;
}

type GroupedClass = NonNullable<DatasetInput['grouped']>[number];

export interface JobRequest extends AnalyzeRequest {
  readonly client?: string;
}

export const MIN_REPLICATES = 19;
export const MAX_REPLICATES = 100_000;

const ANALYZE_FIELDS = [
  'values',
  'csv',
  'column',
  'csvOptions',
  'families',
  'alpha',
  'bins',
  'seed',
  'pMethod',
  'replicates',
  'evidence',
  'evidenceOptions',
] as const;
/** Workflow fields (issue 4); any of them routes the request through the core's analyzeDataset. */
const WORKFLOW_FIELDS = [
  'statusColumn',
  'status',
  'subgroupColumn',
  'subgroups',
  'orderColumn',
  'order',
  'grouped',
  'confidence',
  'bLifePercents',
  'boundMethod',
  'reliabilityTimes',
  'lifePlotPositions',
  'returnPeriods',
  'designLife',
  'plottingPosition',
  'lsl',
  'usl',
  'target',
  'withinMethod',
  'trend',
] as const;
const ALL_FIELDS = [...ANALYZE_FIELDS, ...WORKFLOW_FIELDS];
const CSV_OPTION_FIELDS = ['delimiter', 'decimal', 'skipInvalid', 'header'] as const;
const EVIDENCE_OPTION_FIELDS = ['maxPoints', 'gridPoints', 'bandAlpha'] as const;

function describe(v: unknown): string {
  if (v === null) return 'null';
  if (Array.isArray(v)) return 'an array';
  if (typeof v === 'string') return `the text ${JSON.stringify(v.length > 40 ? `${v.slice(0, 40)}…` : v)}`;
  if (typeof v === 'object') return 'an object';
  return `${typeof v} ${String(v)}`;
}

function isPlainObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function checkKeys(obj: Record<string, unknown>, allowed: readonly string[], prefix: string): void {
  for (const key of Object.keys(obj)) {
    if (!allowed.includes(key)) {
      const name = prefix ? `${prefix}.${key}` : key;
      throw badRequest(`Unknown field "${name}". Allowed fields${prefix ? ` in ${prefix}` : ''}: ${allowed.join(', ')}.`, name, 'unknown-field');
    }
  }
}

function num(obj: Record<string, unknown>, key: string, field: string, check: { lo: number; hi: number; integer?: boolean; loOpen?: boolean; hiOpen?: boolean; what: string }): number | undefined {
  const v = obj[key];
  if (v === undefined) return undefined;
  const lo = check.loOpen ? v as number > check.lo : (v as number) >= check.lo;
  const hi = check.hiOpen ? (v as number) < check.hi : (v as number) <= check.hi;
  if (typeof v !== 'number' || !Number.isFinite(v) || (check.integer && !Number.isInteger(v)) || !lo || !hi) {
    throw badRequest(`"${field}" must be ${check.what}; got ${describe(v)}.`, field, 'bad-option');
  }
  return v;
}

function bool(obj: Record<string, unknown>, key: string, field: string): boolean | undefined {
  const v = obj[key];
  if (v === undefined) return undefined;
  if (typeof v !== 'boolean') throw badRequest(`"${field}" must be true or false; got ${describe(v)}.`, field, 'bad-option');
  return v;
}

function parseValues(v: unknown): number[] {
  if (!Array.isArray(v)) throw badRequest(`"values" must be an array of numbers; got ${describe(v)}.`, 'values', 'bad-input');
  if (v.length === 0) throw badRequest('"values" is empty: there is nothing to analyse.', 'values', 'too-few-values');
  for (let i = 0; i < v.length; i++) {
    const x: unknown = v[i];
    if (typeof x !== 'number' || !Number.isFinite(x)) {
      throw badRequest(`"values[${i}]" (value #${i + 1}) is not a finite number; got ${describe(x)}.`, `values[${i}]`, 'not-a-number');
    }
  }
  return v as number[];
}

function parseCsvOptions(v: unknown): CsvOptions {
  if (v === undefined) return {};
  if (!isPlainObject(v)) throw badRequest(`"csvOptions" must be an object; got ${describe(v)}.`, 'csvOptions', 'bad-option');
  checkKeys(v, CSV_OPTION_FIELDS, 'csvOptions');
  const out: { delimiter?: string; decimal?: '.' | ','; skipInvalid?: boolean; header?: boolean } = {};
  if (v.delimiter !== undefined) {
    const d = v.delimiter;
    if (typeof d !== 'string' || [...d].length !== 1 || d === '"' || d === '\n' || d === '\r') {
      throw badRequest(`"csvOptions.delimiter" must be one character (not a quote or line break); got ${describe(d)}.`, 'csvOptions.delimiter', 'bad-option');
    }
    out.delimiter = d;
  }
  if (v.decimal !== undefined) {
    if (v.decimal !== '.' && v.decimal !== ',') throw badRequest(`"csvOptions.decimal" must be "." or ","; got ${describe(v.decimal)}.`, 'csvOptions.decimal', 'bad-option');
    out.decimal = v.decimal;
  }
  const skip = bool(v, 'skipInvalid', 'csvOptions.skipInvalid');
  if (skip !== undefined) out.skipInvalid = skip;
  const header = bool(v, 'header', 'csvOptions.header');
  if (header !== undefined) out.header = header;
  if (out.delimiter !== undefined && out.delimiter === out.decimal) {
    throw badRequest('"csvOptions.delimiter" and "csvOptions.decimal" cannot be the same character.', 'csvOptions.delimiter', 'bad-option');
  }
  return out;
}

function parseEvidenceOptions(v: unknown): EvidenceOptions {
  if (v === undefined) return {};
  if (!isPlainObject(v)) throw badRequest(`"evidenceOptions" must be an object; got ${describe(v)}.`, 'evidenceOptions', 'bad-option');
  checkKeys(v, EVIDENCE_OPTION_FIELDS, 'evidenceOptions');
  const out: { maxPoints?: number; gridPoints?: number; bandAlpha?: number } = {};
  const mp = num(v, 'maxPoints', 'evidenceOptions.maxPoints', { lo: 16, hi: 10_000, integer: true, what: 'a whole number from 16 to 10000' });
  if (mp !== undefined) out.maxPoints = mp;
  const gp = num(v, 'gridPoints', 'evidenceOptions.gridPoints', { lo: 16, hi: 2000, integer: true, what: 'a whole number from 16 to 2000' });
  if (gp !== undefined) out.gridPoints = gp;
  const ba = num(v, 'bandAlpha', 'evidenceOptions.bandAlpha', { lo: 0, hi: 0.5, loOpen: true, what: 'a number above 0 and at most 0.5' });
  if (ba !== undefined) out.bandAlpha = ba;
  return out;
}

function parseFamilies(v: unknown): FamilyName[] | undefined {
  if (v === undefined) return undefined;
  const known = allFamilies().map((f) => f.name as string);
  if (!Array.isArray(v)) throw badRequest(`"families" must be an array of family names (${known.join(', ')}); got ${describe(v)}.`, 'families', 'bad-option');
  if (v.length === 0) throw badRequest(`"families" is empty: name at least one of ${known.join(', ')}.`, 'families', 'bad-option');
  const seen = new Set<string>();
  v.forEach((f: unknown, i) => {
    if (typeof f !== 'string' || !known.includes(f)) {
      throw badRequest(`"families[${i}]" is not a known family; got ${describe(f)}. Known families: ${known.join(', ')}.`, `families[${i}]`, 'bad-option');
    }
    if (seen.has(f)) throw badRequest(`"families" lists "${f}" twice.`, `families[${i}]`, 'bad-option');
    seen.add(f);
  });
  return v as FamilyName[];
}

function columnSelector(body: Record<string, unknown>, key: string): string | number | undefined {
  const c = body[key];
  if (c === undefined) return undefined;
  if (typeof c === 'string' && c.trim() !== '') return c;
  if (typeof c === 'number' && Number.isInteger(c) && c >= 1) return c;
  throw badRequest(`"${key}" must be a header name or a 1-based column number; got ${describe(c)}.`, key, 'no-column');
}

function numberList(body: Record<string, unknown>, key: string, ok: (x: number) => boolean, rule: string, unique: boolean): number[] | undefined {
  const v = body[key];
  if (v === undefined) return undefined;
  if (!Array.isArray(v)) throw badRequest(`"${key}" must be an array of numbers; got ${describe(v)}.`, key, 'bad-option');
  if (v.length === 0) throw badRequest(`"${key}" is empty: give at least one value.`, key, 'bad-option');
  const seen = new Set<number>();
  v.forEach((x: unknown, i) => {
    if (typeof x !== 'number' || !Number.isFinite(x) || !ok(x)) throw badRequest(`"${key}[${i}]" must be ${rule}; got ${describe(x)}.`, `${key}[${i}]`, 'bad-option');
    if (unique && seen.has(x)) throw badRequest(`"${key}" lists ${String(x)} twice.`, `${key}[${i}]`, 'bad-option');
    seen.add(x);
  });
  return v as number[];
}

function choice<T extends string>(body: Record<string, unknown>, key: string, allowed: readonly T[]): T | undefined {
  const v = body[key];
  if (v === undefined) return undefined;
  if (typeof v !== 'string' || !(allowed as readonly string[]).includes(v)) {
    throw badRequest(`"${key}" must be one of ${allowed.map((a) => JSON.stringify(a)).join(', ')}; got ${describe(v)}.`, key, 'bad-option');
  }
  return v as T;
}

function finiteOrNull(body: Record<string, unknown>, key: string): number | null | undefined {
  const v = body[key];
  if (v === undefined || v === null) return v as undefined | null;
  if (typeof v !== 'number' || !Number.isFinite(v)) throw badRequest(`"${key}" must be a finite number (or null); got ${describe(v)}.`, key, 'bad-option');
  return v;
}

function parseGrouped(v: unknown): GroupedClass[] {
  if (!Array.isArray(v) || v.length === 0) throw badRequest(`"grouped" must be a non-empty array of classes {lower, upper, count}; got ${describe(v)}.`, 'grouped', 'bad-input');
  return v.map((c: unknown, i) => {
    const f = `grouped[${i}]`;
    if (!isPlainObject(c)) throw badRequest(`"${f}" must be an object {lower, upper, count}; got ${describe(c)}.`, f, 'bad-input');
    checkKeys(c, ['lower', 'upper', 'count'], f);
    const edge = (key: 'lower' | 'upper', open: number): number => {
      const e = c[key];
      if (e === null) return open;
      if (typeof e !== 'number' || !Number.isFinite(e)) throw badRequest(`"${f}.${key}" must be a finite number, or null for an open class; got ${describe(e)}.`, `${f}.${key}`, 'bad-input');
      return e;
    };
    const count = c.count;
    if (typeof count !== 'number' || !Number.isInteger(count) || count < 0) throw badRequest(`"${f}.count" must be a whole number ≥ 0; got ${describe(count)}.`, `${f}.count`, 'bad-input');
    return { lower: edge('lower', -Infinity), upper: edge('upper', Infinity), count };
  });
}

/** The workflow fields of a body, or null when it has none. */
function parseWorkflow(body: Record<string, unknown>, fromCsv: boolean): WorkflowRequest | null {
  if (!WORKFLOW_FIELDS.some((k) => body[k] !== undefined)) return null;
  const out: { -readonly [K in keyof WorkflowRequest]: WorkflowRequest[K] } = { options: {} };
  const o: Record<string, unknown> = {};
  const pairs = [['statusColumn', 'status'], ['subgroupColumn', 'subgroups'], ['orderColumn', 'order']] as const;
  for (const [col, arr] of pairs) {
    if (fromCsv && body[arr] !== undefined) throw badRequest(`"${arr}" goes with "values"; with "csv" name the column in "${col}".`, arr, 'bad-input');
    if (!fromCsv && body[col] !== undefined) throw badRequest(`"${col}" goes with "csv"; with "values" give "${arr}" as an array.`, col, 'bad-input');
  }
  const sc = columnSelector(body, 'statusColumn');
  if (sc !== undefined) out.statusColumn = sc;
  const gc = columnSelector(body, 'subgroupColumn');
  if (gc !== undefined) out.subgroupColumn = gc;
  const oc = columnSelector(body, 'orderColumn');
  if (oc !== undefined) out.orderColumn = oc;
  const st = numberList(body, 'status', (x) => x === 0 || x === 1, '1 (failed) or 0 (still running or removed unfailed)', false);
  if (st !== undefined) out.status = st;
  if (body.subgroups !== undefined) {
    const g = body.subgroups;
    if (!Array.isArray(g) || g.length === 0) throw badRequest(`"subgroups" must be a non-empty array of labels (strings or numbers); got ${describe(g)}.`, 'subgroups', 'bad-input');
    g.forEach((x: unknown, i) => {
      if (!(typeof x === 'string' || (typeof x === 'number' && Number.isFinite(x)))) throw badRequest(`"subgroups[${i}]" must be a label (string or number); got ${describe(x)}.`, `subgroups[${i}]`, 'bad-input');
    });
    out.subgroups = g as (string | number)[];
  }
  const ord = numberList(body, 'order', () => true, 'a finite number (a time or year)', true);
  if (ord !== undefined) out.order = ord;
  if (body.grouped !== undefined) out.grouped = parseGrouped(body.grouped);
  const conf = num(body, 'confidence', 'confidence', { lo: 0, hi: 1, loOpen: true, hiOpen: true, what: 'a number between 0 and 1 (exclusive), e.g. 0.90' });
  if (conf !== undefined) o.confidence = conf;
  const bl = numberList(body, 'bLifePercents', (x) => x > 0 && x < 100, 'a percent strictly between 0 and 100', true);
  if (bl !== undefined) o.bLifePercents = bl;
  const bm = choice(body, 'boundMethod', ['likelihood-ratio', 'fisher-matrix'] as const);
  if (bm !== undefined) o.boundMethod = bm;
  const rt = numberList(body, 'reliabilityTimes', (x) => x > 0, 'a time > 0', true);
  if (rt !== undefined) o.reliabilityTimes = rt;
  const lp = choice(body, 'lifePlotPositions', ['johnson-benard', 'kaplan-meier'] as const);
  if (lp !== undefined) o.lifePlotPositions = lp;
  const rp = numberList(body, 'returnPeriods', (x) => x > 1, 'a number of years greater than 1', true);
  if (rp !== undefined) o.returnPeriods = rp;
  if (body.designLife !== undefined && body.designLife !== null) {
    o.designLife = num(body, 'designLife', 'designLife', { lo: 0, hi: 1e6, loOpen: true, what: 'a number of years above 0 (at most 1000000)' });
  }
  const pp = choice(body, 'plottingPosition', ['weibull', 'gringorten', 'cunnane'] as const);
  if (pp !== undefined) o.plottingPosition = pp;
  for (const k of ['lsl', 'usl', 'target'] as const) {
    const v = finiteOrNull(body, k);
    if (v !== undefined && v !== null) o[k] = v;
  }
  const wm = choice(body, 'withinMethod', ['pooled', 'range'] as const);
  if (wm !== undefined) o.withinMethod = wm;
  const tr = bool(body, 'trend', 'trend');
  if (tr !== undefined) o.trend = tr;
  out.options = o as WorkflowRequest['options'];
  return out;
}

function parseAnalyzeFields(body: Record<string, unknown>): AnalyzeRequest {
  const hasValues = body.values !== undefined;
  const hasCsv = body.csv !== undefined;
  const hasGrouped = body.grouped !== undefined;
  if (hasValues && hasCsv) throw badRequest('Give either "values" or "csv" (with "column"), not both.', 'csv', 'bad-input');
  if (hasGrouped && (hasValues || hasCsv)) throw badRequest('Grouped counts come alone: give "grouped" without "values" or "csv".', 'grouped', 'bad-input');
  if (hasGrouped) {
    if (body.evidence === true) throw badRequest('"evidence" is drawn from individual values; grouped counts have none.', 'evidence', 'bad-option');
    return { ...parseAnalyzeFields({ ...body, grouped: undefined, values: [0] }), values: [], workflow: parseWorkflow(body, false) };
  }
  if (!hasValues && !hasCsv) throw badRequest('No data: give "values" (an array of numbers) or "csv" (the file text) with "column".', 'values', 'bad-input');
  const out: {
    values?: number[];
    csv?: string;
    column?: string | number;
    csvOptions: CsvOptions;
    families?: FamilyName[];
    alpha?: number;
    bins?: number | null;
    seed?: number;
    pMethod?: PMethod;
    replicates?: number;
    evidence: boolean;
    evidenceOptions: EvidenceOptions;
    workflow: WorkflowRequest | null;
  } = { csvOptions: {}, evidence: false, evidenceOptions: {}, workflow: null };
  if (hasValues) {
    if (body.column !== undefined) throw badRequest('"column" goes with "csv"; with "values" leave it out.', 'column', 'bad-input');
    if (body.csvOptions !== undefined) throw badRequest('"csvOptions" goes with "csv"; with "values" leave it out.', 'csvOptions', 'bad-input');
    out.values = parseValues(body.values);
  } else {
    if (typeof body.csv !== 'string') throw badRequest(`"csv" must be the CSV file's text (a string); got ${describe(body.csv)}.`, 'csv', 'bad-input');
    if (body.csv.trim() === '') throw badRequest('"csv" is empty: the file has no rows.', 'csv', 'bad-input');
    out.csv = body.csv;
    const c = body.column;
    if (c !== undefined) {
      if (typeof c === 'string') {
        if (c.trim() === '') throw badRequest('"column" is empty; give the column\'s header name or its 1-based number.', 'column', 'no-column');
      } else if (typeof c !== 'number' || !Number.isInteger(c) || c < 1) {
        throw badRequest(`"column" must be a header name or a 1-based column number; got ${describe(c)}.`, 'column', 'no-column');
      }
      out.column = c;
    }
    out.csvOptions = parseCsvOptions(body.csvOptions);
  }
  const fam = parseFamilies(body.families);
  if (fam !== undefined) out.families = fam;
  const alpha = num(body, 'alpha', 'alpha', { lo: 0, hi: 1, loOpen: true, hiOpen: true, what: 'a number between 0 and 1 (exclusive), e.g. 0.05' });
  if (alpha !== undefined) out.alpha = alpha;
  if (body.bins === null) out.bins = null;
  else {
    const bins = num(body, 'bins', 'bins', { lo: 2, hi: 1_000_000, integer: true, what: 'a whole number of at least 2 (or null for the automatic rule)' });
    if (bins !== undefined) out.bins = bins;
  }
  const seed = num(body, 'seed', 'seed', { lo: 0, hi: Number.MAX_SAFE_INTEGER, integer: true, what: `a whole number from 0 to ${Number.MAX_SAFE_INTEGER}` });
  if (seed !== undefined) out.seed = seed;
  if (body.pMethod !== undefined) {
    if (body.pMethod !== 'table' && body.pMethod !== 'bootstrap') {
      throw badRequest(`"pMethod" must be "table" or "bootstrap"; got ${describe(body.pMethod)}.`, 'pMethod', 'bad-option');
    }
    out.pMethod = body.pMethod;
  }
  const b = num(body, 'replicates', 'replicates', { lo: MIN_REPLICATES, hi: MAX_REPLICATES, integer: true, what: `a whole number from ${MIN_REPLICATES} to ${MAX_REPLICATES}` });
  if (b !== undefined) out.replicates = b;
  out.evidence = bool(body, 'evidence', 'evidence') ?? false;
  out.evidenceOptions = parseEvidenceOptions(body.evidenceOptions);
  if (body.evidenceOptions !== undefined && !out.evidence) {
    throw badRequest('"evidenceOptions" needs "evidence": true.', 'evidenceOptions', 'bad-option');
  }
  out.workflow = parseWorkflow(body, hasCsv);
  return out;
}

function requireObject(body: unknown): Record<string, unknown> {
  if (body === undefined) {
    throw badRequest('The request has no JSON body. Send {"values": [...]} or {"csv": "...", "column": "..."} with Content-Type: application/json.', undefined, 'bad-request');
  }
  if (!isPlainObject(body)) throw badRequest(`The request body must be a JSON object; got ${describe(body)}.`, undefined, 'bad-request');
  return body;
}

/** Validate a `POST /api/analyze` body. Throws HttpError 400 naming the field at fault. */
export function parseAnalyzeBody(body: unknown): AnalyzeRequest {
  const obj = requireObject(body);
  checkKeys(obj, ALL_FIELDS, '');
  return parseAnalyzeFields(obj);
}

const CLIENT_RE = /^[A-Za-z0-9_-]{1,64}$/;

/** Validate a `POST /api/jobs` body: the analyze fields plus `client`. */
export function parseJobBody(body: unknown): JobRequest {
  const obj = requireObject(body);
  checkKeys(obj, [...ALL_FIELDS, 'client'], '');
  const { client, ...rest } = obj;
  const req = parseAnalyzeFields(rest);
  if (client === undefined) return req;
  if (typeof client !== 'string' || !CLIENT_RE.test(client)) {
    throw badRequest(`"client" must be 1 to 64 characters of letters, digits, "_" or "-"; got ${describe(client)}.`, 'client', 'bad-option');
  }
  return { ...req, client };
}

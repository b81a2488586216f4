/**
 * Strict validation of request bodies. Unknown fields are rejected with a message naming the
 * field; every field's type and range is checked here, before the core sees it, so that a bad
 * request never reaches the numerics. (The core checks its own preconditions again.)
 */
import { allFamilies, type CsvOptions, type EvidenceOptions, type FamilyName, type PMethod } from '../core/index.js';
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
}

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

function parseAnalyzeFields(body: Record<string, unknown>): AnalyzeRequest {
  const hasValues = body.values !== undefined;
  const hasCsv = body.csv !== undefined;
  if (hasValues && hasCsv) throw badRequest('Give either "values" or "csv" (with "column"), not both.', 'csv', 'bad-input');
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
  } = { csvOptions: {}, evidence: false, evidenceOptions: {} };
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
  checkKeys(obj, ANALYZE_FIELDS, '');
  return parseAnalyzeFields(obj);
}

const CLIENT_RE = /^[A-Za-z0-9_-]{1,64}$/;

/** Validate a `POST /api/jobs` body: the analyze fields plus `client`. */
export function parseJobBody(body: unknown): JobRequest {
  const obj = requireObject(body);
  checkKeys(obj, [...ANALYZE_FIELDS, 'client'], '');
  const { client, ...rest } = obj;
  const req = parseAnalyzeFields(rest);
  if (client === undefined) return req;
  if (typeof client !== 'string' || !CLIENT_RE.test(client)) {
    throw badRequest(`"client" must be 1 to 64 characters of letters, digits, "_" or "-"; got ${describe(client)}.`, 'client', 'bad-option');
  }
  return { ...req, client };
}

/**
 * Strict validation of request bodies. Unknown fields are rejected with a message naming the
 * field; every field's type and range is checked here, before the core sees it, so that a bad
 * request never reaches the numerics. (The core checks its own preconditions again.)
 */
import {
  checkCombinations,
  datasetOptionsFrom,
  describeJson,
  isGiven,
  jsonField,
  onSurface,
  optionsOn,
  sectionOf,
  parseJsonOption,
  type CsvOptions,
  type DatasetInput,
  type DatasetOptions,
  type EvidenceOptions,
  type OptionValue,
} from '../core/index.js';
import { badRequest } from './errors.js';

export interface AnalyzeRequest {
  readonly values?: readonly number[];
  readonly csv?: string;
  readonly column?: string | number;
  readonly csvOptions: CsvOptions;
  readonly evidence: boolean;
  readonly evidenceOptions: EvidenceOptions;
  /** The extra data columns (by CSV column or as arrays), or grouped counts; null when none. */
  readonly workflow: WorkflowRequest | null;
  /** Every analysis option given, under the core's names (core/options datasetOptionsFrom). */
  readonly options: DatasetOptions;
  /** Life data as recorded at inspections: the START and END columns of the CSV, and its count column (interval rows). */
  readonly intervalColumns?: readonly [string | number, string | number];
  readonly countColumn?: string | number;
  /** With interval rows: each row's inspection times separated by ';' (core IntervalLifeInput.inspections). */
  readonly inspectionTimesColumn?: string | number;
  /** A dated series (peaks over a threshold): the CSV's date column beside the value column. */
  readonly dateColumn?: string | number;
  /** Several failure modes: the CSV's failure-mode column beside the times and the status column. */
  readonly modeColumn?: string | number;
}

/** The extra data of a request: the status, subgroup and order columns (or their arrays), grouped counts. */
export interface WorkflowRequest {
  readonly statusColumn?: string | number;
  readonly status?: readonly number[];
  readonly subgroupColumn?: string | number;
  readonly subgroups?: readonly (string | number)[];
  readonly orderColumn?: string | number;
  readonly order?: readonly number[];
  readonly grouped?: readonly GroupedClass[];
}

type GroupedClass = NonNullable<DatasetInput['grouped']>[number];

export interface JobRequest extends AnalyzeRequest {
  readonly client?: string;
}

/** The options a request may carry (the table's API options); nested ones sit in their parent object. */
const API_OPTIONS = optionsOn('api');
const TOP_OPTIONS = API_OPTIONS.filter((s) => s.jsonParent === undefined);
const PARENTS = [...new Set(API_OPTIONS.flatMap((s) => (s.jsonParent === undefined ? [] : [s.jsonParent])))];
/** A column option whose data a `values` request sends as an array instead (status, subgroups, order, grouped). */
const DATA_OPTIONS = optionsOn('cli').concat(API_OPTIONS).filter((s, i, all) => s.jsonData !== undefined && all.indexOf(s) === i);
/** The data of a request (not options): the values or the CSV text, and the per-value arrays. */
const DATA_FIELDS = ['values', 'csv', ...DATA_OPTIONS.map((s) => s.jsonData as string)];
const ALL_FIELDS = [...new Set([...DATA_FIELDS, ...TOP_OPTIONS.map((s) => s.name), ...PARENTS])];
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

function parseValues(v: unknown): number[] {
  if (!Array.isArray(v)) throw badRequest(`"values" must be an array of numbers; got ${describeJson(v)}.`, 'values', 'bad-input');
  if (v.length === 0) throw badRequest('"values" is empty: there is nothing to analyse.', 'values', 'too-few-values');
  for (let i = 0; i < v.length; i++) {
    const x: unknown = v[i];
    if (typeof x !== 'number' || !Number.isFinite(x)) {
      throw badRequest(`"values[${i}]" (value #${i + 1}) is not a finite number; got ${describeJson(x)}.`, `values[${i}]`, 'not-a-number');
    }
  }
  return v as number[];
}

/** A per-value data array (status 1/0, subgroup labels, distinct order values): data, not options. */
function dataArray(body: Record<string, unknown>, key: string): (string | number)[] | undefined {
  const v = body[key];
  if (v === undefined) return undefined;
  if (!Array.isArray(v) || v.length === 0) throw badRequest(`"${key}" must be a non-empty array; got ${describeJson(v)}.`, key, 'bad-input');
  const seen = new Set<unknown>();
  v.forEach((x: unknown, i) => {
    const f = `${key}[${i}]`;
    if (key === 'status' && x !== 0 && x !== 1) throw badRequest(`"${f}" must be 1 (failed) or 0 (still running or removed unfailed); got ${describeJson(x)}.`, f, 'bad-input');
    if (key === 'order') {
      if (typeof x !== 'number' || !Number.isFinite(x)) throw badRequest(`"${f}" must be a finite number (a time or year); got ${describeJson(x)}.`, f, 'bad-input');
      if (seen.has(x)) throw badRequest(`"${key}" lists ${String(x)} twice.`, f, 'bad-input');
      seen.add(x);
    }
    if (!(typeof x === 'string' || (typeof x === 'number' && Number.isFinite(x)))) throw badRequest(`"${f}" must be a label (string or number); got ${describeJson(x)}.`, f, 'bad-input');
  });
  return v as (string | number)[];
}

function parseGrouped(v: unknown): GroupedClass[] {
  if (!Array.isArray(v) || v.length === 0) throw badRequest(`"grouped" must be a non-empty array of classes {lower, upper, count}; got ${describeJson(v)}.`, 'grouped', 'bad-input');
  return v.map((c: unknown, i) => {
    const f = `grouped[${i}]`;
    if (!isPlainObject(c)) throw badRequest(`"${f}" must be an object {lower, upper, count}; got ${describeJson(c)}.`, f, 'bad-input');
    checkKeys(c, ['lower', 'upper', 'count'], f);
    const edge = (key: 'lower' | 'upper', open: number): number => {
      const e = c[key];
      if (e === null) return open;
      if (typeof e !== 'number' || !Number.isFinite(e)) throw badRequest(`"${f}.${key}" must be a finite number, or null for an open class; got ${describeJson(e)}.`, `${f}.${key}`, 'bad-input');
      return e;
    };
    const count = c.count;
    if (typeof count !== 'number' || !Number.isInteger(count) || count < 0) throw badRequest(`"${f}.count" must be a whole number ≥ 0; got ${describeJson(count)}.`, `${f}.count`, 'bad-input');
    return { lower: edge('lower', -Infinity), upper: edge('upper', Infinity), count };
  });
}

/** Every option of the body, parsed by the table's JSON rule (400 naming the field), then the combination rules. */
function parseOptions(body: Record<string, unknown>): Map<string, OptionValue> {
  const given = new Map<string, OptionValue>();
  for (const parent of PARENTS) {
    const obj = body[parent];
    if (obj === undefined) continue;
    if (!isPlainObject(obj)) throw badRequest(`"${parent}" must be an object; got ${describeJson(obj)}.`, parent, 'bad-option');
    checkKeys(obj, API_OPTIONS.filter((s) => s.jsonParent === parent).map((s) => s.name), parent);
  }
  for (const spec of API_OPTIONS) {
    const holder = spec.jsonParent === undefined ? body : (body[spec.jsonParent] as Record<string, unknown> | undefined);
    const raw = holder?.[spec.name];
    if (raw === undefined) continue;
    const r = parseJsonOption(spec, raw, jsonField(spec));
    if (!r.ok) throw badRequest(r.message, r.field, spec.kind === 'column' || spec.kind === 'columns' ? 'no-column' : 'bad-option');
    given.set(spec.name, r.value);
  }
  // A column given as its data array counts as given for the combination rules.
  const forRules = new Map(given);
  for (const spec of DATA_OPTIONS) if (body[spec.jsonData as string] !== undefined && !isGiven(spec, forRules.get(spec.name))) forRules.set(spec.name, true);
  const combined = checkCombinations(forRules, 'api');
  if (!combined.ok) throw badRequest(`${combined.message}.`, combined.field, 'bad-option');
  return given;
}

/** The given options of the table's parent object (csvOptions, evidenceOptions). */
function nested(given: ReadonlyMap<string, OptionValue>, parent: string): Record<string, OptionValue> {
  const out: Record<string, OptionValue> = {};
  for (const spec of API_OPTIONS) if (spec.jsonParent === parent && given.has(spec.name)) out[spec.name] = given.get(spec.name) as OptionValue;
  return out;
}

/** The extra data part, or null when the body names no data column and sends no per-value array. */
function workflowOf(body: Record<string, unknown>, given: ReadonlyMap<string, OptionValue>): WorkflowRequest | null {
  const columns = DATA_OPTIONS.filter((s) => onSurface(s, 'api') && given.has(s.name));
  const data = DATA_OPTIONS.filter((s) => body[s.jsonData as string] !== undefined);
  if (columns.length === 0 && data.length === 0) return null;
  const out: Record<string, unknown> = {};
  for (const spec of columns) out[spec.name] = given.get(spec.name);
  for (const spec of data) {
    const key = spec.jsonData as string;
    out[key] = key === 'grouped' ? parseGrouped(body[key]) : dataArray(body, key);
  }
  return out as WorkflowRequest;
}

function parseAnalyzeFields(body: Record<string, unknown>): AnalyzeRequest {
  const hasValues = body.values !== undefined;
  const hasCsv = body.csv !== undefined;
  const hasGrouped = body.grouped !== undefined;
  if (hasValues && hasCsv) throw badRequest('Give either "values" or "csv" (with "column"), not both.', 'csv', 'bad-input');
  if (hasGrouped && (hasValues || hasCsv)) throw badRequest('Grouped counts come alone: give "grouped" without "values" or "csv".', 'grouped', 'bad-input');
  if (hasGrouped && body.evidence === true) throw badRequest('"evidence" is drawn from individual values; grouped counts have none.', 'evidence', 'bad-option');
  if (!hasValues && !hasCsv && !hasGrouped) throw badRequest('No data: give "values" (an array of numbers) or "csv" (the file text) with "column".', 'values', 'bad-input');
  // A column is named in the CSV; with "values" (or grouped counts) its data come as an array.
  for (const spec of DATA_OPTIONS) {
    if (!onSurface(spec, 'api')) continue;
    const arr = spec.jsonData as string;
    if (hasCsv && body[arr] !== undefined) throw badRequest(`"${arr}" goes with "values"; with "csv" name the column in "${spec.name}".`, arr, 'bad-input');
    if (!hasCsv && body[spec.name] !== undefined) throw badRequest(`"${spec.name}" goes with "csv"; with "values" give "${arr}" as an array.`, spec.name, 'bad-input');
  }
  for (const spec of API_OPTIONS) {
    if ((spec.kind !== 'column' && spec.kind !== 'columns') || spec.jsonData !== undefined || hasCsv) continue;
    const field = jsonField(spec);
    if (body[field] !== undefined) throw badRequest(`"${field}" goes with "csv"; with "values" leave it out.`, field, 'bad-input');
  }
  for (const parent of PARENTS) {
    const needsCsv = API_OPTIONS.some((s) => s.jsonParent === parent && sectionOf(s) === 'input');
    if (needsCsv && !hasCsv && body[parent] !== undefined) throw badRequest(`"${parent}" goes with "csv"; with "values" leave it out.`, parent, 'bad-input');
  }
  const given = parseOptions(body);
  const out: Record<string, unknown> = {
    csvOptions: nested(given, 'csvOptions'),
    evidence: given.get('evidence') === true,
    evidenceOptions: nested(given, 'evidenceOptions'),
    options: datasetOptionsFrom(given),
    workflow: workflowOf(body, given),
  };
  if (hasGrouped) out.values = [];
  else if (hasValues) out.values = parseValues(body.values);
  else {
    if (typeof body.csv !== 'string') throw badRequest(`"csv" must be the CSV file's text (a string); got ${describeJson(body.csv)}.`, 'csv', 'bad-input');
    if (body.csv.trim() === '') throw badRequest('"csv" is empty: the file has no rows.', 'csv', 'bad-input');
    out.csv = body.csv;
    if (given.has('column')) out.column = given.get('column');
    if (given.has('dateColumn')) out.dateColumn = given.get('dateColumn');
    if (given.has('modeColumn')) out.modeColumn = given.get('modeColumn');
    const interval = given.get('intervalColumns') as readonly (string | number)[] | undefined;
    if (interval !== undefined) {
      if (interval.length !== 2) throw badRequest(`"intervalColumns" takes two columns, START and END; got ${interval.length}.`, 'intervalColumns', 'bad-option');
      if (given.has('column')) throw badRequest('"column" goes with a value column; interval rows are read from "intervalColumns" (START, END) alone.', 'column', 'bad-option');
      out.intervalColumns = [interval[0], interval[1]];
      if (given.has('countColumn')) out.countColumn = given.get('countColumn');
      if (given.has('inspectionTimesColumn')) out.inspectionTimesColumn = given.get('inspectionTimesColumn');
    }
  }
  return out as unknown as AnalyzeRequest;
}

function requireObject(body: unknown): Record<string, unknown> {
  if (body === undefined) {
    throw badRequest('The request has no JSON body. Send {"values": [...]} or {"csv": "...", "column": "..."} with Content-Type: application/json.', undefined, 'bad-request');
  }
  if (!isPlainObject(body)) throw badRequest(`The request body must be a JSON object; got ${describeJson(body)}.`, undefined, 'bad-request');
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
    throw badRequest(`"client" must be 1 to 64 characters of letters, digits, "_" or "-"; got ${describeJson(client)}.`, 'client', 'bad-option');
  }
  return { ...req, client };
}

/**
 * The two parsers of one option: command-line text and a JSON value. Both end in the same checks
 * (range, whole number, choice, pattern, repeat, list length), so a value is accepted or refused
 * alike wherever it is typed; only the spelling differs (CLI lists are comma-separated text; CLI
 * choices also take their aliases and any case).
 */
import { parseStrictNumber } from '../csv/index.js';
import type { OptionSpec, OptionValue } from './spec.js';
import { itemRuleWords, ruleWords } from './words.js';

export type OptionParse =
  | { readonly ok: true; readonly value: OptionValue }
  | {
      readonly ok: false;
      readonly message: string;
      /** The CLI flag, or the JSON field path (with [i] for a list item). */
      readonly field: string;
      /** The refused text or value, as text. */
      readonly value: string;
    };

const accept = (value: OptionValue): OptionParse => ({ ok: true, value });
const refuse = (message: string, field: string, value: string): OptionParse => ({ ok: false, message, field, value });

function inRange(spec: OptionSpec, x: number): boolean {
  if (!Number.isFinite(x)) return false;
  if (spec.kind === 'integer' && !Number.isSafeInteger(x)) return false;
  if (spec.min !== undefined && (spec.minExclusive ? !(x > spec.min) : !(x >= spec.min))) return false;
  if (spec.max !== undefined && (spec.maxExclusive ? !(x < spec.max) : !(x <= spec.max))) return false;
  return true;
}

function matchesPattern(spec: OptionSpec, s: string): boolean {
  return spec.pattern === undefined || new RegExp(spec.pattern, 'u').test(s);
}

/** A JSON value described for a message: 'the text "abc"', 'number 1.5', 'an array', 'null'. */
export function describeJson(v: unknown): string {
  if (v === null) return 'null';
  if (Array.isArray(v)) return 'an array';
  if (typeof v === 'string') return `the text ${JSON.stringify(v.length > 40 ? `${v.slice(0, 40)}…` : v)}`;
  if (typeof v === 'object') return 'an object';
  return `${typeof v} ${String(v)}`;
}

function isList(spec: OptionSpec): boolean {
  return spec.kind === 'numbers' || spec.kind === 'choices' || spec.kind === 'columns';
}

/** Whether the option is a CLI flag that takes no value. */
export function isCliFlag(spec: OptionSpec): boolean {
  return spec.kind === 'boolean' || spec.cliFlagValue !== undefined;
}

// ---- command line -------------------------------------------------------------------------------

function cliChoice(spec: OptionSpec, text: string): string | undefined {
  const t = text.trim();
  const lower = t.toLowerCase();
  const viaAlias = spec.aliases?.[t] ?? spec.aliases?.[lower];
  if (viaAlias !== undefined) return viaAlias;
  return (spec.choices ?? []).find((c) => c === t || c.toLowerCase() === lower);
}

function cliColumn(text: string): string | undefined {
  const t = text.trim();
  if (t === '') return undefined;
  if (/^[0-9]+$/.test(t) && Number(t) < 1) return undefined;
  return text;
}

/** One item of a CLI value (a whole single value, or one entry of a list). */
function cliItem(spec: OptionSpec, text: string): { ok: true; value: number | string } | { ok: false } {
  switch (spec.kind) {
    case 'number':
    case 'numbers':
    case 'integer': {
      const x = parseStrictNumber(text.trim());
      return inRange(spec, x) ? { ok: true, value: x } : { ok: false };
    }
    case 'choice':
    case 'choices': {
      const c = cliChoice(spec, text);
      return c === undefined ? { ok: false } : { ok: true, value: c };
    }
    case 'column':
    case 'columns': {
      const c = cliColumn(text);
      return c === undefined ? { ok: false } : { ok: true, value: c };
    }
    case 'text': {
      const s = spec.aliases?.[text.toLowerCase()] ?? text;
      return matchesPattern(spec, s) ? { ok: true, value: s } : { ok: false };
    }
    case 'boolean':
      return { ok: false };
  }
}

/**
 * Parse an option's command-line text (`undefined` for a flag given without a value). A flag
 * (boolean, or an option with `cliFlagValue`) takes no text.
 */
export function parseCliOption(spec: OptionSpec, text: string | undefined): OptionParse {
  const flag = spec.cli;
  if (isCliFlag(spec)) {
    if (text !== undefined) return refuse(`${flag} takes no value, got ${JSON.stringify(text)}`, flag, text);
    return accept(spec.cliFlagValue ?? true);
  }
  if (text === undefined) return refuse(`${flag} needs a value: ${ruleWords(spec)}`, flag, '');
  if (!isList(spec)) {
    const r = cliItem(spec, text);
    return r.ok ? accept(r.value) : refuse(`${flag} must be ${ruleWords(spec)}; got ${JSON.stringify(text)}`, flag, text);
  }
  const parts = text.split(',').map((p) => p.trim());
  if (parts.every((p) => p === '')) return refuse(`${flag} needs a comma-separated list, each entry ${itemRuleWords(spec)}`, flag, text);
  if (spec.maxItems !== undefined && parts.length > spec.maxItems) return refuse(`${flag} takes at most ${spec.maxItems} entries; got ${parts.length}`, flag, text);
  const out: (number | string)[] = [];
  for (const p of parts) {
    if (p === '') return refuse(`${flag} has an empty entry in ${JSON.stringify(text)}`, flag, text);
    const r = cliItem(spec, p);
    if (!r.ok) return refuse(`${flag}: ${JSON.stringify(p)} is not ${itemRuleWords(spec)}`, flag, p);
    if (spec.unique && out.includes(r.value)) return refuse(`${flag}: ${JSON.stringify(p)} is listed twice`, flag, p);
    out.push(r.value);
  }
  return accept(spec.kind === 'numbers' ? (out as number[]) : (out as string[]));
}

// ---- JSON ---------------------------------------------------------------------------------------

function jsonItemOk(spec: OptionSpec, v: unknown): boolean {
  switch (spec.kind) {
    case 'number':
    case 'numbers':
    case 'integer':
      return typeof v === 'number' && inRange(spec, v);
    case 'choice':
    case 'choices':
      return typeof v === 'string' && (spec.choices ?? []).includes(v);
    case 'column':
    case 'columns':
      // Text that is a whole number names a column by number, as on the command line: "0" is none.
      return (typeof v === 'string' && v.trim() !== '' && !/^\s*0+\s*$/.test(v)) || (typeof v === 'number' && Number.isSafeInteger(v) && v >= 1);
    case 'text':
      return typeof v === 'string' && matchesPattern(spec, v);
    case 'boolean':
      return typeof v === 'boolean';
  }
}

/**
 * Parse an option's JSON value (present in the body; `field` is its path, e.g. 'csvOptions.delimiter').
 * `null` is accepted, as "off", exactly when the option's default is null.
 */
export function parseJsonOption(spec: OptionSpec, value: unknown, field: string = spec.name): OptionParse {
  const orNull = spec.default === null ? ' (or null)' : '';
  if (value === null) return spec.default === null ? accept(null) : refuse(`"${field}" must be ${ruleWords(spec)}; got null.`, field, 'null');
  if (!isList(spec)) {
    return jsonItemOk(spec, value)
      ? accept(value as OptionValue)
      : refuse(`"${field}" must be ${ruleWords(spec)}${orNull}; got ${describeJson(value)}.`, field, describeJson(value));
  }
  if (!Array.isArray(value)) return refuse(`"${field}" must be an array of values, each ${itemRuleWords(spec)}${orNull}; got ${describeJson(value)}.`, field, describeJson(value));
  if (value.length === 0) return refuse(`"${field}" is empty: give at least one value.`, field, '[]');
  if (spec.maxItems !== undefined && value.length > spec.maxItems) return refuse(`"${field}" holds ${value.length} values; at most ${spec.maxItems} are allowed.`, field, describeJson(value));
  const seen = new Set<unknown>();
  for (let i = 0; i < value.length; i++) {
    const x: unknown = value[i];
    const f = `${field}[${i}]`;
    if (!jsonItemOk(spec, x)) {
      const known = spec.itemNoun !== undefined ? `is not a known ${spec.itemNoun}; got ${describeJson(x)}. Known: ${(spec.choices ?? []).join(', ')}.` : `must be ${itemRuleWords(spec)}; got ${describeJson(x)}.`;
      return refuse(`"${f}" ${known}`, f, describeJson(x));
    }
    if (spec.unique && seen.has(x)) return refuse(`"${field}" lists ${JSON.stringify(x)} twice.`, f, describeJson(x));
    seen.add(x);
  }
  return accept(value as number[] | string[]);
}

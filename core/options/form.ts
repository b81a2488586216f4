/**
 * The page's parser: an option as typed in a form field. The text is read as a person types it (a
 * single number may use a decimal comma; a list may be separated by commas, semicolons or spaces),
 * then judged by the JSON rule (parseJsonOption), so the page refuses exactly what the API refuses.
 * An empty field is "not given" (value null: the default applies).
 */
import type { OptionSpec } from './spec.js';
import { parseJsonOption, type OptionParse } from './parse.js';
import { itemRuleWords, ruleWords } from './words.js';

/** A number as typed: a point or one comma as decimal mark, nothing else (no hex, no Infinity). */
function typedNumber(text: string): number {
  const t = text.trim();
  const normal = t.includes('.') ? t : t.replace(',', '.');
  return /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(normal) ? Number(normal) : Number.NaN;
}

function typed(spec: OptionSpec, text: string): unknown {
  switch (spec.kind) {
    case 'number':
    case 'integer':
      return typedNumber(text);
    case 'numbers':
      return text.split(/[\s,;]+/).filter((p) => p !== '').map((p) => (/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(p) ? Number(p) : Number.NaN));
    case 'choices':
    case 'columns':
      return text.split(/[\s,;]+/).filter((p) => p !== '');
    case 'boolean':
      return text === 'true' ? true : text === 'false' ? false : text;
    case 'column':
      return /^[0-9]+$/.test(text.trim()) ? Number(text.trim()) : text;
    default:
      return text.trim();
  }
}

/** Parse a form field's text; the refusal says the rule in the table's words ("Must be ..."). */
export function parseFormOption(spec: OptionSpec, text: string): OptionParse {
  if (text.trim() === '') return { ok: true, value: null };
  const r = parseJsonOption(spec, typed(spec, text));
  if (r.ok) return r;
  const list = spec.kind === 'numbers' || spec.kind === 'choices' || spec.kind === 'columns';
  const words = list ? `${itemRuleWords(spec)} each${spec.unique ? ', each given once' : ''}` : ruleWords(spec);
  return { ok: false, message: `Must be ${words}.`, field: spec.name, value: text };
}

/**
 * The accept/refuse rule of one option in words, shared by every message of the CLI, the API, the
 * page and the docs: e.g. "a number between 0 and 1, exclusive", "a whole number from 19 to 100000",
 * '"table" or "bootstrap"'.
 */
import type { OptionSpec } from './spec.js';

function quoted(list: readonly string[]): string {
  const q = list.map((c) => JSON.stringify(c));
  if (q.length <= 1) return q.join('');
  return `${q.slice(0, -1).join(', ')} or ${q[q.length - 1] as string}`;
}

/** The range of a number in words ('' when unbounded). */
function rangeWords(spec: OptionSpec): string {
  const { min, max } = spec;
  const lo = min !== undefined ? String(min) : undefined;
  const hi = max !== undefined ? String(max) : undefined;
  if (lo !== undefined && hi !== undefined) {
    if (spec.minExclusive && spec.maxExclusive) return `between ${lo} and ${hi}, exclusive`;
    if (spec.minExclusive) return `above ${lo} and at most ${hi}`;
    if (spec.maxExclusive) return `from ${lo} and below ${hi}`;
    return `from ${lo} to ${hi}`;
  }
  if (lo !== undefined) return spec.minExclusive ? `above ${lo}` : `of at least ${lo}`;
  if (hi !== undefined) return spec.maxExclusive ? `below ${hi}` : `of at most ${hi}`;
  return '';
}

/** One item of the option (the whole value for single-valued kinds), as a noun phrase. */
export function itemRuleWords(spec: OptionSpec): string {
  switch (spec.kind) {
    case 'number':
    case 'numbers': {
      const r = rangeWords(spec);
      return r === '' ? 'a finite number' : `a number ${r}`;
    }
    case 'integer': {
      const r = rangeWords(spec);
      return r === '' ? 'a whole number' : `a whole number ${r}`;
    }
    case 'boolean':
      return 'true or false';
    case 'choice':
    case 'choices':
      return spec.choices && spec.choices.length > 2 ? `one of ${quoted(spec.choices)}` : quoted(spec.choices ?? []);
    case 'column':
    case 'columns':
      return 'a header name or a 1-based column number';
    case 'text':
      return spec.patternWords ?? 'text';
  }
}

/** The whole value's rule as a noun phrase (lists: "a list of ..."). */
export function ruleWords(spec: OptionSpec): string {
  const item = itemRuleWords(spec);
  const list = spec.kind === 'numbers' || spec.kind === 'choices' || spec.kind === 'columns';
  let out = list ? `a list of ${spec.unique ? 'different ' : ''}values, each ${item}` : item;
  if (list && spec.maxItems !== undefined) out += `, at most ${spec.maxItems} of them`;
  return out;
}

/** The CLI spellings of a choice's values (aliases), e.g. 'lr = likelihood-ratio'. */
export function aliasWords(spec: OptionSpec): string {
  const a = spec.aliases;
  if (a === undefined) return '';
  return Object.entries(a)
    .map(([k, v]) => `${JSON.stringify(k)} = ${JSON.stringify(v)}`)
    .join(', ');
}

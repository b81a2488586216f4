/**
 * One accept/refuse answer per option value, wherever it is typed: the CLI (cli/args.ts parseArgs),
 * the API (server/validate.ts parseAnalyzeBody), the page's form parser in the core
 * (parseFormOption) and the page's request builder (client/src/request.ts buildRequest). Every case
 * is generated from the option table: each bound, just past it, just inside it, a bad choice, an
 * empty list and a repeated entry. What is accepted is the table's own rule (the limits and their
 * sources are in core/options/*.ts); this test checks that every surface applies it alike.
 */
import { describe, expect, it } from 'vitest';
import { parseArgs } from '../../cli/args.js';
import { buildRequest } from '../../client/src/request.js';
import { DEFAULT_SETTINGS, type Settings } from '../../client/src/settings.js';
import { INITIAL_STATE, update } from '../../client/src/state.js';
import {
  OPTION_COMBINATIONS,
  OPTION_TABLE,
  jsonField,
  onSurface,
  optionNamed,
  parseFormOption,
  type OptionSpec,
  type OptionValue,
} from '../../core/index.js';
import { parseAnalyzeBody } from '../../server/validate.js';

interface Case {
  readonly label: string;
  /** The value as JSON (lists as arrays). */
  readonly value: OptionValue;
  readonly accept: boolean;
}

/** A number just past b (away from the range when `out`), as text that parses back exactly. */
function beside(spec: OptionSpec, b: number, direction: 1 | -1): number {
  if (spec.kind === 'integer') return b + direction;
  return b + direction * Math.max(Math.abs(b), 1) * 1e-9;
}

/** The boundary cases of one number rule (for lists, each as a one-item list). */
function numberCases(spec: OptionSpec, wrap: (x: number) => OptionValue): Case[] {
  const out: Case[] = [];
  if (spec.min !== undefined) {
    out.push({ label: `min ${spec.min}`, value: wrap(spec.min), accept: !spec.minExclusive });
    out.push({ label: 'just below min', value: wrap(beside(spec, spec.min, -1)), accept: false });
    out.push({ label: 'just above min', value: wrap(beside(spec, spec.min, 1)), accept: spec.max === undefined || beside(spec, spec.min, 1) < spec.max });
  }
  if (spec.max !== undefined) {
    out.push({ label: `max ${spec.max}`, value: wrap(spec.max), accept: !spec.maxExclusive });
    out.push({ label: 'just above max', value: wrap(beside(spec, spec.max, 1)), accept: false });
    out.push({ label: 'just below max', value: wrap(beside(spec, spec.max, -1)), accept: true });
  }
  if (spec.min === undefined && spec.max === undefined) out.push({ label: 'a negative number', value: wrap(-2.5), accept: spec.kind !== 'integer' });
  if (spec.kind === 'integer' && spec.min !== undefined) out.push({ label: 'a fraction', value: wrap(spec.min + 1.5), accept: false });
  return out;
}

function casesOf(spec: OptionSpec): Case[] {
  switch (spec.kind) {
    case 'number':
    case 'integer':
      return numberCases(spec, (x) => x);
    case 'numbers': {
      const ok = (spec.min ?? 0) + 2;
      const list: Case[] = [
        ...numberCases(spec, (x) => [x]),
        { label: 'two different values', value: [ok, ok + 1], accept: spec.max === undefined || ok + 1 < spec.max },
        { label: 'an empty list', value: [], accept: false },
      ];
      if (spec.unique) list.push({ label: 'a repeated value', value: [ok, ok], accept: false });
      return list;
    }
    case 'choice':
      return [
        ...(spec.choices ?? []).map((c) => ({ label: `choice ${c}`, value: c, accept: true })),
        { label: 'a bad choice', value: 'no-such-choice', accept: false },
      ];
    case 'choices': {
      const [a, b] = spec.choices ?? [];
      const list: Case[] = [
        { label: 'two choices', value: [a as string, b as string], accept: true },
        { label: 'a bad choice', value: [a as string, 'no-such-choice'], accept: false },
        { label: 'an empty list', value: [], accept: false },
      ];
      if (spec.unique) list.push({ label: 'a repeated choice', value: [a as string, a as string], accept: false });
      return list;
    }
    case 'column':
      return [
        { label: 'a header name', value: 'c', accept: true },
        { label: 'column 1', value: 1, accept: true },
        { label: 'column 0', value: 0, accept: false },
        { label: 'column "0" as text', value: '0', accept: false },
        { label: 'an empty name', value: ' ', accept: false },
      ];
    case 'text': {
      // Expected from the option's own pattern (data in the table); the values probe a one-character rule.
      const rule = spec.pattern === undefined ? null : new RegExp(spec.pattern, 'u');
      return ['a', ';', ';;', '"', '', '0/4', '4/4'].map((v) => ({ label: `text ${JSON.stringify(v)}`, value: v, accept: rule === null || rule.test(v) }));
    }
    case 'boolean':
      return [
        { label: 'on', value: true, accept: true },
        { label: 'off', value: false, accept: true },
      ];
    case 'columns': {
      const two: Case[] = [
        { label: 'two columns', value: ['a', 'b'], accept: spec.maxItems === undefined || spec.maxItems >= 2 },
        { label: 'an empty list', value: [], accept: false },
        { label: 'column 0 in the list', value: ['a', '0'], accept: false },
      ];
      if (spec.maxItems !== undefined) two.push({ label: `${spec.maxItems + 1} columns`, value: Array.from({ length: spec.maxItems + 1 }, (_, i) => `c${i}`), accept: false });
      if (spec.unique) two.push({ label: 'a repeated column', value: ['a', 'a'], accept: false });
      return two;
    }
  }
}

/** A value that every rule of the option accepts (for the options a tested option needs). */
function validSample(spec: OptionSpec): OptionValue {
  if (spec.kind === 'boolean') return true;
  if (spec.default !== null) return spec.default;
  if (spec.kind === 'number' || spec.kind === 'integer') {
    if (spec.min !== undefined && spec.max !== undefined) return spec.kind === 'integer' ? Math.ceil((spec.min + spec.max) / 2) : (spec.min + spec.max) / 2;
    return (spec.min ?? 0) + 1;
  }
  if (spec.kind === 'numbers') return [(spec.min ?? 0) + 2];
  if (spec.kind === 'column') return 'c';
  if (spec.kind === 'columns') return ['c', 'd'];
  if (spec.kind === 'text') return ';';
  return (spec.choices ?? [])[0] ?? null;
}

/** The options a value of `spec` needs beside it (the table's "needs" rules, followed through), with valid values. */
function context(spec: OptionSpec): OptionSpec[] {
  const out: OptionSpec[] = [];
  const visit = (s: OptionSpec): void => {
    for (const r of OPTION_COMBINATIONS) {
      if (r.kind !== 'needs' || r.option !== s.name) continue;
      const need = optionNamed(r.anyOf[0] as string) as OptionSpec;
      if (need === spec || out.includes(need)) continue;
      out.push(need);
      visit(need);
    }
  };
  visit(spec);
  return out;
}

// ---- the three surfaces ---------------------------------------------------------------------------

/** Whether the CLI can spell the value at all (a flag spells only the value it sets). */
function cliSpells(spec: OptionSpec, value: OptionValue): boolean {
  return !(spec.kind === 'boolean' || spec.cliFlagValue !== undefined) || value === (spec.cliFlagValue ?? true);
}

function cliWords(spec: OptionSpec, value: OptionValue): string[] {
  if (spec.kind === 'boolean' || spec.cliFlagValue !== undefined) return [spec.cli];
  return [spec.cli, Array.isArray(value) ? value.join(',') : String(value)];
}

function cliAccepts(spec: OptionSpec, value: OptionValue): boolean {
  const argv = ['analyze', 'f.csv', ...context(spec).flatMap((c) => cliWords(c, validSample(c))), ...cliWords(spec, value)];
  try {
    parseArgs(argv);
    return true;
  } catch {
    return false;
  }
}

function apiAccepts(spec: OptionSpec, value: OptionValue): boolean {
  const body: Record<string, unknown> = { csv: 'x,c\n1,1\n2,0\n3,1\n' };
  const put = (s: OptionSpec, v: OptionValue): void => {
    if (!onSurface(s, 'api')) return;
    const [parent, name] = jsonField(s).includes('.') ? (jsonField(s).split('.') as [string, string]) : [undefined, s.name];
    if (parent === undefined) body[name] = v;
    else body[parent] = { ...((body[parent] as object | undefined) ?? {}), [name]: v };
  };
  for (const c of context(spec)) put(c, validSample(c));
  put(spec, value);
  try {
    parseAnalyzeBody(body);
    return true;
  } catch {
    return false;
  }
}

function formText(value: OptionValue): string {
  if (Array.isArray(value)) return value.length === 0 ? ' , ' : value.join(', ');
  return String(value);
}

/** The page's typed settings that are options (text fields; the lists of choices cannot send a bad value). */
const PAGE_KEYS = new Set(
  Object.keys(DEFAULT_SETTINGS).filter((k) => typeof (DEFAULT_SETTINGS as unknown as Record<string, unknown>)[k] === 'string' && optionNamed(k)?.kind !== 'choice'),
);
const PAGE_CSV = 'x,status\n120,1\n340,1\n500,0\n220,1\n500,0\n';

function pageAccepts(spec: OptionSpec, value: OptionValue): boolean {
  // The options the table says this one needs (a column role as the page's column number), and the
  // bootstrap chosen, since the page sends B only then.
  const needed = Object.fromEntries(context(spec).map((c) => [c.name, c.kind === 'column' ? 2 : formText(validSample(c))]));
  const patch: Partial<Settings> = { pMethod: 'bootstrap', ...needed, [spec.name]: formText(value) };
  const state = update(update(INITIAL_STATE, { type: 'source-loaded', source: { kind: 'file', name: 'f.csv', csv: PAGE_CSV } }), { type: 'settings-edited', patch });
  const out = buildRequest(state);
  return out.ok;
}

const rows = OPTION_TABLE.flatMap((spec) => casesOf(spec).map((c) => ({ spec, ...c })));

describe('the option contract: one accept/refuse answer on every surface', () => {
  it('covers every option of the table with at least one case', () => {
    const covered = new Set(rows.map((r) => r.spec.name));
    expect(OPTION_TABLE.filter((s) => !covered.has(s.name)).map((s) => s.name)).toEqual([]);
  });

  it.each(rows.filter((r) => onSurface(r.spec, 'cli') && cliSpells(r.spec, r.value)).map((r) => [r.spec.cli, r.label, r.spec, r.value, r.accept] as const))('CLI %s, %s', (_f, _l, spec, value, accept) => {
    expect(cliAccepts(spec, value)).toBe(accept);
  });

  it.each(rows.filter((r) => onSurface(r.spec, 'api')).map((r) => [jsonField(r.spec), r.label, r.spec, r.value, r.accept] as const))('API %s, %s', (_f, _l, spec, value, accept) => {
    expect(apiAccepts(spec, value)).toBe(accept);
  });

  // An empty form field means "not given" (the default), so values that read as empty are not sent to it.
  it.each(rows.filter((r) => onSurface(r.spec, 'api') && r.spec.kind !== 'boolean' && formText(r.value).trim() !== '').map((r) => [r.spec.name, r.label, r.spec, r.value, r.accept] as const))(
    'page form parser %s, %s',
    (_f, _l, spec, value, accept) => {
      expect(parseFormOption(spec, formText(value)).ok).toBe(accept);
    },
  );

  it.each(rows.filter((r) => PAGE_KEYS.has(r.spec.name)).map((r) => [r.spec.name, r.label, r.spec, r.value, r.accept] as const))(
    'page request builder %s, %s',
    (_f, _l, spec, value, accept) => {
      expect(pageAccepts(spec, value)).toBe(accept);
    },
  );
});

// The combination rules (core/options/combinations.ts), each broken once on each surface that has
// every option it names: the CLI and the API must both refuse.
function cliRefusesAll(words: string[]): boolean {
  try {
    parseArgs(['analyze', 'f.csv', ...words]);
    return false;
  } catch {
    return true;
  }
}

function apiRefuses(pairs: readonly (readonly [OptionSpec, OptionValue])[]): boolean {
  const body: Record<string, unknown> = { csv: 'x,c\n1,1\n2,0\n3,1\n' };
  for (const [s, v] of pairs) {
    const field = jsonField(s);
    if (s.jsonParent === undefined) body[field] = v;
    else body[s.jsonParent] = { ...((body[s.jsonParent] as object | undefined) ?? {}), [s.name]: v };
  }
  try {
    parseAnalyzeBody(body);
    return false;
  } catch {
    return true;
  }
}

/** Each rule as the options that break it, with their values. */
const broken = OPTION_COMBINATIONS.map((rule) => {
  const o = (n: string): OptionSpec => optionNamed(n) as OptionSpec;
  let pairs: [OptionSpec, OptionValue][];
  if (rule.kind === 'needs') pairs = [[o(rule.option), validSample(o(rule.option))]];
  else if (rule.kind === 'conflicts') pairs = [[o(rule.option), validSample(o(rule.option))], [o(rule.with[0] as string), validSample(o(rule.with[0] as string))]];
  else if (rule.kind === 'ordered') pairs = [[o(rule.lower), 2], [o(rule.upper), 1]];
  else pairs = [[o(rule.a), ','], [o(rule.b), ',']];
  return { label: `${rule.kind} ${pairs.map(([s]) => s.name).join(' + ')}`, pairs };
});

describe('the combination rules: refused alike by the CLI and the API', () => {
  it.each(broken.map((b) => [b.label, b.pairs] as const))('%s', (_label, pairs) => {
    let checked = 0;
    if (pairs.every(([s, v]) => onSurface(s, 'cli') && cliSpells(s, v))) {
      expect(cliRefusesAll(pairs.flatMap(([s, v]) => cliWords(s, v)))).toBe(true);
      checked++;
    }
    if (pairs.every(([s]) => onSurface(s, 'api'))) {
      expect(apiRefuses(pairs)).toBe(true);
      checked++;
    }
    // Rules about CLI-only grouped columns or API-only evidence settings live on one surface only.
    expect(checked).toBeGreaterThan(0);
  });

  it('the same options in a good combination are accepted (the refusals above are the rule, not the values)', () => {
    expect(cliRefusesAll(['--return-periods', '10', '--design-life', '50', '--lsl', '1', '--usl', '2', '--target', '1.5'])).toBe(false);
    expect(apiRefuses([[optionNamed('returnPeriods') as OptionSpec, [10]], [optionNamed('designLife') as OptionSpec, 50]])).toBe(false);
  });
});

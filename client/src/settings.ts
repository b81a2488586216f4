/**
 * The settings a user makes for one source, as typed (text, so a half-typed value is kept and
 * its problem shown) and keyed by the request field name each becomes (server/API.md). Pure.
 *
 * The settings are the page's form fields (page-options.ts, from the core's option table): every
 * field's text under its option name, the ticked models, and the column roles as 1-based indices.
 * `DEFAULT_SETTINGS` is what every new source starts from; `demoSettings` is a demo's own settings
 * (server/demo.ts DEMO_SETTINGS fields) laid over the defaults. The settings belong to the source
 * they were made for: state.ts replaces them whenever the source changes.
 */
import type { OptionSpec } from '../../core/index.js';
import { FAMILY_CHOICES } from './families.js';
import { PAGE_FIELDS, ROLE_FIELDS } from './page-options.js';

export type PMethodChoice = 'table' | 'bootstrap';

/** Column roles: a 1-based column index, or 0 for none. */
export interface Roles {
  readonly statusColumn: number;
  readonly subgroupColumn: number;
  readonly orderColumn: number;
}

/**
 * Every form field's text by option name (a choice's value, 'true'/'false' for a check box, '' for
 * not given), the models by name, and the roles by index. The fields named here are the ones the
 * page's own code reads; every other option of the form is there too, under its name.
 */
export interface Settings extends Roles {
  readonly families: readonly string[];
  readonly pMethod: PMethodChoice;
  readonly alpha: string;
  /** '' is automatic. */
  readonly bins: string;
  readonly replicates: string;
  /** '' leaves the seed to the server (it reports the one it used). */
  readonly seed: string;
  readonly confidence: string;
  readonly returnPeriods: string;
  readonly lsl: string;
  readonly usl: string;
  readonly [option: string]: string | number | readonly string[];
}

/** The text a field holds for an option's value ('' when off). */
export function valueText(spec: OptionSpec, v: unknown): string | undefined {
  if (v === null) return '';
  if (Array.isArray(v)) return v.every((x) => typeof x === 'number' || typeof x === 'string') ? v.join(', ') : undefined;
  if (typeof v === 'number') return Number.isFinite(v) ? String(v) : undefined;
  if (typeof v === 'boolean') return spec.kind === 'boolean' ? String(v) : undefined;
  if (typeof v === 'string') return spec.kind === 'choice' ? ((spec.choices ?? []).includes(v) ? v : undefined) : v;
  return undefined;
}

/** A field's text in the settings ('' when absent). */
export function settingText(s: Settings, name: string): string {
  const v = s[name];
  return typeof v === 'string' ? v : '';
}

function defaults(): Settings {
  const out: Record<string, string | number | readonly string[]> = {};
  for (const f of PAGE_FIELDS) {
    if (f.control === 'families' || f.control === 'role') continue;
    out[f.name] = valueText(f.spec, f.spec.default) ?? '';
  }
  for (const r of ROLE_FIELDS) out[r.name] = 0;
  out['families'] = FAMILY_CHOICES.filter((f) => f.byDefault).map((f) => f.name as string);
  // The seed is left empty so the server uses (and reports) its own.
  out['seed'] = '';
  return out as unknown as Settings;
}

/**
 * The settings every source starts from: the core option table's defaults (core/options), except
 * the seed, left empty so the server uses (and reports) its own.
 */
export const DEFAULT_SETTINGS: Settings = Object.freeze(defaults());

/**
 * A demo's fields laid over the defaults. Column roles arrive as header names and become indices
 * through `columnIndex` (0 when the file has no such column). A field the option would refuse the
 * form as text keeps the default.
 */
export function demoSettings(fields: Readonly<Record<string, unknown>>, columnIndex: (name: string) => number): Settings {
  const role = (v: unknown): number => (typeof v === 'string' ? columnIndex(v) : typeof v === 'number' && Number.isInteger(v) && v > 0 ? v : 0);
  const out: Record<string, string | number | readonly string[]> = { ...DEFAULT_SETTINGS };
  for (const f of PAGE_FIELDS) {
    if (!(f.name in fields)) continue;
    const v = fields[f.name];
    if (f.control === 'role') out[f.name] = role(v);
    else if (f.control === 'families') out[f.name] = Array.isArray(v) ? v.filter((x): x is string => typeof x === 'string') : DEFAULT_SETTINGS.families;
    else out[f.name] = valueText(f.spec, v) ?? settingText(DEFAULT_SETTINGS, f.name);
  }
  return out as unknown as Settings;
}

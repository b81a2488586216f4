/**
 * The settings form: DOM → settings and settings → DOM, and the problems shown beside the fields.
 * Each field's limits (min, max, step) and its one line of help come from the core's option
 * table (core/options), so the form says what the API accepts. Nothing here decides anything:
 * request.ts checks, state.ts keeps.
 */
import { optionNamed } from '../../core/index.js';
import { clear, el } from './dom.js';
import { FAMILY_CHOICES } from './families.js';
import type { Problem } from './request.js';
import type { ColumnChoice } from './columns.js';
import type { Settings } from './settings.js';
import { styleFor } from '../charts/palette.js';

/** Text and choice settings and the id of the control that holds each. */
const FIELDS = {
  alpha: 'alpha-input',
  bins: 'bins-input',
  replicates: 'replicates-input',
  seed: 'seed-input',
  confidence: 'confidence-input',
  bLifePercents: 'blife-input',
  reliabilityTimes: 'reltime-input',
  boundMethod: 'bounds-select',
  returnPeriods: 'periods-input',
  designLife: 'designlife-input',
  plottingPosition: 'plotpos-select',
  lsl: 'lsl-input',
  usl: 'usl-input',
  target: 'target-input',
} as const satisfies Partial<Record<keyof Settings, string>>;

const ROLES = { statusColumn: 'status-select', subgroupColumn: 'subgroup-select', orderColumn: 'order-select' } as const;

type FieldKey = keyof typeof FIELDS;
type Control = HTMLInputElement | HTMLSelectElement;

const control = (id: string): Control | null => document.getElementById(id) as Control | null;

/** Every control that holds a setting (for wiring change events). */
export function settingControls(): Control[] {
  return [...Object.values(FIELDS), ...Object.values(ROLES)].map(control).filter((c): c is Control => c !== null);
}

/** The settings key a control holds ('families' and 'pMethod' for their groups), or null. */
export function settingKeyOf(node: Element): keyof Settings | null {
  if (node.closest('#family-boxes')) return 'families';
  if (node instanceof HTMLInputElement && node.name === 'pmethod') return 'pMethod';
  const all: Record<string, string> = { ...FIELDS, ...ROLES };
  return (Object.keys(all).find((k) => all[k] === node.id) as keyof Settings | undefined) ?? null;
}

/** Put each option's limits and help from the core's table on its control (once, at start). */
export function applyOptionTable(): void {
  for (const [key, id] of Object.entries(FIELDS)) {
    const spec = optionNamed(key);
    const c = control(id);
    if (!spec || !c) continue;
    c.title = spec.help;
    if (c instanceof HTMLSelectElement && spec.choices) {
      // The choices are the table's: the page's wording is kept for a choice it knows, the name shown for a new one.
      const words = new Map([...c.options].map((o) => [o.value, o.textContent ?? o.value]));
      clear(c);
      for (const v of spec.choices) c.append(el('option', { value: v, selected: v === spec.default }, words.get(v) ?? v.replace(/-/g, ' ')));
    }
    if (c instanceof HTMLInputElement && c.type === 'number') {
      // The table's limits replace whatever the HTML says; a limit the table does not have is removed.
      // (An exclusive limit is shown as the HTML limit; the request check refuses the limit itself.)
      if (spec.min !== undefined && Number.isFinite(spec.min)) c.min = String(spec.min);
      else c.removeAttribute('min');
      if (spec.max !== undefined && Number.isFinite(spec.max) && spec.max < 1e12) c.max = String(spec.max);
      else c.removeAttribute('max');
      // Whole numbers step by 1; any other number is accepted as typed (a step would mark e.g. α = 0.001 invalid).
      c.step = spec.kind === 'integer' ? '1' : 'any';
    }
  }
}

/** The family check boxes, one per model of the core's registry, each with its chart line. */
export function buildFamilyBoxes(box: HTMLElement): void {
  clear(box);
  for (const f of FAMILY_CHOICES) {
    const style = styleFor(f.name);
    const swatch = el('span', { className: 'swatch', 'aria-hidden': 'true' });
    swatch.style.borderTopColor = style.colour;
    swatch.style.borderTopStyle = style.dash ? 'dashed' : 'solid';
    box.append(el('label', {}, el('input', { type: 'checkbox', value: f.name, name: 'family', checked: f.byDefault }), swatch, f.label));
  }
}

/** The settings as the form holds them now. */
export function readForm(): Partial<Settings> {
  const out: Record<string, unknown> = {};
  for (const [key, id] of Object.entries(FIELDS)) {
    const c = control(id);
    if (c) out[key] = c.value;
  }
  for (const [key, id] of Object.entries(ROLES)) {
    const c = control(id);
    if (c) out[key] = Number(c.value) || 0;
  }
  out['families'] = [...document.querySelectorAll<HTMLInputElement>('#family-boxes input[name="family"]:checked')].map((b) => b.value);
  const method = document.querySelector<HTMLInputElement>('input[name="pmethod"]:checked');
  out['pMethod'] = method?.value === 'bootstrap' ? 'bootstrap' : 'table';
  return out as Partial<Settings>;
}

/** Fill a role select with this source's columns (never the value column). */
function fillRole(sel: HTMLSelectElement, columns: readonly ColumnChoice[], valueColumn: number, chosen: number, none: string): void {
  clear(sel);
  sel.append(el('option', { value: '0' }, none));
  for (const c of columns) {
    if (c.index === valueColumn) continue;
    sel.append(el('option', { value: String(c.index), selected: c.index === chosen }, `${c.index}. ${c.label}`));
  }
  sel.value = String(chosen);
  sel.disabled = columns.length <= 1;
}

/** Write the settings into the form (a new source, or a demo's own settings). */
export function showSettings(s: Settings, columns: readonly ColumnChoice[], valueColumn: number): void {
  for (const [key, id] of Object.entries(FIELDS) as [FieldKey, string][]) {
    const c = control(id);
    if (c && c.value !== s[key]) c.value = s[key];
  }
  fillRole(control(ROLES.statusColumn) as HTMLSelectElement, columns, valueColumn, s.statusColumn, 'none (every value is an observed value)');
  fillRole(control(ROLES.subgroupColumn) as HTMLSelectElement, columns, valueColumn, s.subgroupColumn, 'none');
  fillRole(control(ROLES.orderColumn) as HTMLSelectElement, columns, valueColumn, s.orderColumn, 'none');
  for (const b of document.querySelectorAll<HTMLInputElement>('#family-boxes input[name="family"]')) b.checked = s.families.includes(b.value);
  for (const r of document.querySelectorAll<HTMLInputElement>('input[name="pmethod"]')) r.checked = r.value === s.pMethod;
  const reps = control(FIELDS.replicates);
  if (reps) reps.disabled = s.pMethod !== 'bootstrap';
}

/** Show each problem beside its control (and clear the old ones). */
export function showProblems(problems: readonly Problem[]): void {
  for (const old of document.querySelectorAll('.field-error')) old.remove();
  for (const c of document.querySelectorAll('[aria-invalid="true"]')) {
    c.removeAttribute('aria-invalid');
    c.removeAttribute('aria-describedby');
  }
  for (const p of problems) {
    const id = p.field === 'families' ? 'family-boxes' : p.field in FIELDS ? FIELDS[p.field as FieldKey] : null;
    const c = id ? document.getElementById(id) : null;
    if (!c) continue;
    const pid = `${id}-problem`;
    c.setAttribute('aria-invalid', 'true');
    c.setAttribute('aria-describedby', pid);
    (c.closest('.field-row') ?? c).after(el('p', { className: 'field-error', id: pid }, p.message));
  }
}

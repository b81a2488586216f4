/**
 * The settings form, built from the core's option table (page-options.ts, core/options): every
 * field's control, label, limits (min, max, step), choices and one line of help come from the
 * option, so a new option appears on the page with no hand-written HTML, and the form says what the
 * API accepts. DOM → settings and settings → DOM, and the problems shown beside the fields. Nothing
 * here decides anything: request.ts checks, state.ts keeps.
 */
import { clear, el } from './dom.js';
import { FAMILY_CHOICES } from './families.js';
import { DECIDE_LEGENDS, PAGE_FIELDS, ROLE_FIELDS, pageField, type PageField } from './page-options.js';
import type { Problem } from './request.js';
import type { ColumnChoice } from './columns.js';
import { DEFAULT_SETTINGS, settingText, type Settings } from './settings.js';
import { styleFor } from '../charts/palette.js';

type Control = HTMLInputElement | HTMLSelectElement;

/** The id of a field's line of help ('bins-input' → 'bins-hint'). */
const hintId = (f: PageField): string => `${f.id.replace(/-(input|select)$/, '')}-hint`;

/** The control that holds a field's value (the first radio of a radio group), or null. */
export function controlFor(name: string): Control | null {
  const f = pageField(name);
  if (!f) return null;
  if (f.control === 'radio') return document.querySelector<HTMLInputElement>(`input[name="${f.radioName ?? f.name}"]`);
  return document.getElementById(f.id) as Control | null;
}

function numberControl(f: PageField): HTMLInputElement {
  const s = f.spec;
  const c = el('input', { type: 'number', id: f.id, step: s.kind === 'integer' ? '1' : 'any', inputmode: s.kind === 'integer' ? 'numeric' : 'decimal', autocomplete: 'off' });
  // An exclusive limit is shown as the HTML limit; the request check refuses the limit itself.
  if (s.min !== undefined && Number.isFinite(s.min)) c.min = String(s.min);
  if (s.max !== undefined && Number.isFinite(s.max) && s.max < 1e12) c.max = String(s.max);
  return c;
}

/** One field: its label, control and line of help. */
function fieldNode(f: PageField): HTMLElement {
  const hint = f.hint ? el('p', { className: 'hint', id: hintId(f) }, f.hint) : null;
  const described = (c: Element): void => {
    c.setAttribute('data-option', f.name);
    c.setAttribute('title', f.spec.help);
    if (hint) c.setAttribute('aria-describedby', hint.id);
  };
  switch (f.control) {
    case 'families': {
      const box = el('div', { id: f.id, className: 'family-boxes', 'data-option': f.name });
      buildFamilyBoxes(box);
      return el('fieldset', { className: 'families' }, el('legend', {}, f.label), box, hint ? (hint.classList.add('tight'), hint) : null);
    }
    case 'radio': {
      const set = el('fieldset', { className: 'pmethod' }, el('legend', {}, f.label));
      for (const v of f.spec.choices ?? []) {
        const r = el('input', { type: 'radio', name: f.radioName ?? f.name, value: v, checked: v === f.spec.default });
        described(r);
        set.append(el('label', { className: 'radio' }, r, ` ${f.choiceWords[v] ?? v}`));
      }
      for (const inner of PAGE_FIELDS.filter((g) => g.within === f.name)) set.append(fieldNode(inner));
      if (hint) set.append(hint);
      return set;
    }
    case 'checkbox': {
      const c = el('input', { type: 'checkbox', id: f.id });
      described(c);
      return el('div', {}, el('label', { className: 'check' }, c, ` ${f.label}`), hint);
    }
    case 'role': {
      const c = el('select', { id: f.id });
      described(c);
      return el('div', { 'data-role-field': f.name }, el('label', { for: f.id, className: 'field-label' }, f.label), c);
    }
    default: {
      let c: Control;
      if (f.control === 'select') {
        c = el('select', { id: f.id });
        for (const v of f.spec.choices ?? []) c.append(el('option', { value: v, selected: v === f.spec.default }, f.choiceWords[v] ?? v));
      } else if (f.control === 'number') c = numberControl(f);
      else c = el('input', { type: 'text', id: f.id, autocomplete: 'off' });
      if (c instanceof HTMLInputElement && f.placeholder) c.placeholder = f.placeholder;
      described(c);
      const row = el('div', { className: `field-row${f.within ? ' indent' : ''}` }, el('label', { for: f.id, className: 'field-label' }, f.label), c);
      return hint ? el('div', { className: 'field' }, row, hint) : row;
    }
  }
}

/** Fields in order, the secondary ones folded under "More settings". */
function fieldList(fields: readonly PageField[], more: string): Node[] {
  const shown = fields.filter((f) => !f.within);
  const main = shown.filter((f) => !f.secondary).map(fieldNode);
  const folded = shown.filter((f) => f.secondary);
  if (folded.length === 0) return main;
  return [...main, el('details', { className: 'more-settings' }, el('summary', {}, more), ...folded.map(fieldNode))];
}

/**
 * Build every settings control from the option table (once, at start): the models, tests and seed
 * in `#judge-fields`, the decision settings by trade in `#decide-fields`, the column roles in
 * `#role-fields`.
 */
export function buildSettingsForm(): void {
  const judge = document.getElementById('judge-fields');
  const decide = document.getElementById('decide-fields');
  const roles = document.getElementById('role-fields');
  if (judge) {
    clear(judge);
    judge.append(...fieldList(PAGE_FIELDS.filter((f) => f.place === 'judge'), 'More settings'));
  }
  if (roles) {
    clear(roles);
    roles.append(...ROLE_FIELDS.map(fieldNode));
  }
  if (decide) {
    clear(decide);
    const fields = PAGE_FIELDS.filter((f) => f.place === 'decide');
    // Fields of the fitting group (the confidence) stand above the trade fieldsets.
    decide.append(...fieldList(fields.filter((f) => !(f.group in DECIDE_LEGENDS) && (f.group === 'fitting' || f.group === 'tests')), 'More settings'));
    const groups = [...new Set([...Object.keys(DECIDE_LEGENDS), ...fields.map((f) => f.group)])].filter((g) => g !== 'fitting' && g !== 'tests');
    for (const g of groups) {
      const inGroup = fields.filter((f) => f.group === g);
      if (inGroup.length === 0) continue;
      const legend = DECIDE_LEGENDS[g as keyof typeof DECIDE_LEGENDS] ?? `${g[0]!.toUpperCase()}${g.slice(1)}`;
      decide.append(el('fieldset', { className: 'decide', 'data-group': g }, el('legend', {}, legend), ...fieldList(inGroup, `More ${g} settings`)));
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

/** Every control that holds a setting (for wiring change events). */
export function settingControls(): Control[] {
  return [...document.querySelectorAll<Control>('input[data-option], select[data-option], #family-boxes input[name="family"]')];
}

/** The settings key a control holds, or null. */
export function settingKeyOf(node: Element): keyof Settings | null {
  if (node.closest('#family-boxes')) return 'families';
  return (node as HTMLElement).dataset?.['option'] ?? null;
}

/** Whether a control holds a column role (a change re-runs at once). */
export function isRoleControl(node: Element): boolean {
  const key = settingKeyOf(node);
  return key !== null && ROLE_FIELDS.some((r) => r.name === key);
}

/** The settings as the form holds them now. */
export function readForm(): Partial<Settings> {
  const out: Record<string, unknown> = {};
  for (const f of PAGE_FIELDS) {
    if (f.control === 'families') {
      out[f.name] = [...document.querySelectorAll<HTMLInputElement>('#family-boxes input[name="family"]:checked')].map((b) => b.value);
      continue;
    }
    if (f.control === 'radio') {
      const checked = document.querySelector<HTMLInputElement>(`input[name="${f.radioName ?? f.name}"]:checked`);
      if (checked) out[f.name] = checked.value;
      continue;
    }
    const c = document.getElementById(f.id) as Control | null;
    if (!c) continue;
    if (f.control === 'role') out[f.name] = Number(c.value) || 0;
    else if (f.control === 'checkbox') out[f.name] = String((c as HTMLInputElement).checked);
    else out[f.name] = c.value;
  }
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

/** Controls that only matter with another setting: the replicates only for the bootstrap. */
export function syncForm(s: Settings): void {
  for (const f of PAGE_FIELDS.filter((g) => g.within)) {
    const c = document.getElementById(f.id) as Control | null;
    if (c) c.disabled = settingText(s, f.within!) !== 'bootstrap' && f.within === 'pMethod';
  }
}

/** Write the settings into the form (a new source, or a demo's own settings). */
export function showSettings(s: Settings, columns: readonly ColumnChoice[], valueColumn: number): void {
  for (const f of PAGE_FIELDS) {
    const v = s[f.name];
    if (f.control === 'families') {
      for (const b of document.querySelectorAll<HTMLInputElement>('#family-boxes input[name="family"]')) b.checked = s.families.includes(b.value);
    } else if (f.control === 'radio') {
      for (const r of document.querySelectorAll<HTMLInputElement>(`input[name="${f.radioName ?? f.name}"]`)) r.checked = r.value === v;
    } else if (f.control === 'role') {
      const c = document.getElementById(f.id);
      if (c instanceof HTMLSelectElement) fillRole(c, columns, valueColumn, typeof v === 'number' ? v : 0, f.placeholder || 'none');
    } else {
      const c = document.getElementById(f.id) as Control | null;
      if (!c) continue;
      const text = typeof v === 'string' ? v : '';
      if (f.control === 'checkbox') (c as HTMLInputElement).checked = text === 'true';
      else if (c.value !== text) c.value = text;
      // A folded setting that is not at its default is shown.
      const more = c.closest('details.more-settings');
      if (more instanceof HTMLDetailsElement && text !== settingText(DEFAULT_SETTINGS, f.name)) more.open = true;
    }
  }
  syncForm(s);
}

/** The element a problem is shown beside. */
function problemTarget(field: string): HTMLElement | null {
  const f = pageField(field);
  if (!f) return null;
  if (f.control === 'radio') return document.querySelector<HTMLElement>(`input[name="${f.radioName ?? f.name}"]`)?.closest('fieldset') ?? null;
  return document.getElementById(f.id);
}

/** Show each problem beside its control (and clear the old ones). */
export function showProblems(problems: readonly Problem[]): void {
  for (const old of document.querySelectorAll('.field-error')) old.remove();
  for (const c of document.querySelectorAll<HTMLElement>('[aria-invalid="true"]')) {
    c.removeAttribute('aria-invalid');
    const hint = c.dataset['option'] ? pageField(c.dataset['option']) : undefined;
    if (hint?.hint) c.setAttribute('aria-describedby', hintId(hint));
    else c.removeAttribute('aria-describedby');
  }
  for (const p of problems) {
    const c = problemTarget(p.field);
    if (!c) continue;
    const pid = `${c.id || p.field}-problem`;
    c.setAttribute('aria-invalid', 'true');
    c.setAttribute('aria-describedby', pid);
    const more = c.closest('details.more-settings');
    if (more instanceof HTMLDetailsElement) more.open = true;
    (c.closest('.field-row') ?? c).after(el('p', { className: 'field-error', id: pid }, p.message));
  }
}

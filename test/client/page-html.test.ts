// @vitest-environment jsdom
/**
 * The page's HTML works under the server's Content-Security-Policy (`script-src 'self';
 * style-src 'self'`, server/API.md): no inline script, no <style> element, no style attribute,
 * no inline event handler (CSP Level 3, §6.1.3 "script-src" and "style-src" without
 * 'unsafe-inline'); and every form control has a label (WCAG 2.1 SC 1.3.1 / 4.1.2).
 */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

// vitest runs from the repository root (vitest.config.ts); jsdom replaces import.meta.url's scheme.
const html = readFileSync(resolve(process.cwd(), 'client/index.html'), 'utf8');
const doc = new DOMParser().parseFromString(html, 'text/html');

describe('client/index.html', () => {
  it('has no inline script, style or event handler', () => {
    for (const s of doc.querySelectorAll('script')) {
      expect(s.getAttribute('src')).toBeTruthy();
      expect(s.textContent?.trim()).toBe('');
    }
    expect(doc.querySelectorAll('style')).toHaveLength(0);
    expect(doc.querySelectorAll('[style]')).toHaveLength(0);
    const handlers = [...doc.querySelectorAll('*')].flatMap((e) => [...e.attributes].filter((a) => /^on/i.test(a.name)).map((a) => a.name));
    expect(handlers).toEqual([]);
  });

  it('labels every input, select and textarea', () => {
    for (const c of doc.querySelectorAll('input, select, textarea')) {
      const id = c.getAttribute('id');
      const labelled = (id && doc.querySelector(`label[for="${id}"]`)) || c.closest('label') || c.getAttribute('aria-label');
      expect(labelled, `control ${id ?? c.outerHTML} has a label`).toBeTruthy();
    }
  });

  it('carries the safety caution on screen (DEVELOPERS.md, "Safety")', () => {
    expect(doc.getElementById('caution')?.textContent).toMatch(/governing codes.*licensed/s);
  });
});

describe('the settings form is built from the option table (core/options), with no hand-written field', () => {
  const build = async () => {
    const { buildSettingsForm } = await import('../../client/src/form.js');
    document.body.innerHTML = doc.body.innerHTML;
    buildSettingsForm();
  };

  it('the HTML itself holds no settings field: only the places the form is built in', () => {
    expect(doc.getElementById('judge-fields')?.children.length).toBe(0);
    expect(doc.getElementById('decide-fields')?.children.length).toBe(0);
    expect(doc.getElementById('role-fields')?.children.length).toBe(0);
    expect(doc.getElementById('alpha-input')).toBeNull();
  });

  it('every API option that is not a reading or plot-data setting has a control, labelled, with the table\'s limits and choices', async () => {
    const { OPTION_TABLE, onSurface } = await import('../../core/index.js');
    const { PAGE_FIELDS, onForm } = await import('../../client/src/page-options.js');
    await build();
    const expected = OPTION_TABLE.filter((s) => onSurface(s, 'api') && s.jsonParent === undefined && !['input', 'output', 'batch'].includes(s.group)).map((s) => s.name);
    expect(PAGE_FIELDS.map((f) => f.name)).toEqual(expected);
    expect(expected).toEqual(expect.arrayContaining(['transform', 'naturalLowerBound', 'assumedShape', 'withinMethod', 'trend']));
    for (const f of PAGE_FIELDS) {
      expect(onForm(f.spec)).toBe(true);
      const c = f.control === 'radio' ? document.querySelector(`input[name="${f.radioName}"]`) : document.getElementById(f.id);
      expect(c, `control of ${f.name}`).not.toBeNull();
      if (c instanceof HTMLInputElement && c.type === 'number') {
        expect(c.getAttribute('min'), `${f.name} min`).toBe(f.spec.min === undefined ? null : String(f.spec.min));
        expect(c.getAttribute('step')).toBe(f.spec.kind === 'integer' ? '1' : 'any');
      }
      if (c instanceof HTMLSelectElement && f.control === 'select') expect([...c.options].map((o) => o.value)).toEqual(f.spec.choices);
    }
    for (const c of document.querySelectorAll('input, select, textarea')) {
      const id = c.getAttribute('id');
      const labelled = (id && document.querySelector(`label[for="${id}"]`)) || c.closest('label') || c.getAttribute('aria-label');
      expect(labelled, `control ${id ?? c.outerHTML} has a label`).toBeTruthy();
    }
    expect(document.querySelectorAll('[style]').length).toBe(document.querySelectorAll('#family-boxes .swatch').length);
  });

  it('keeps the element ids the browser tests and the capability test use', async () => {
    await build();
    for (const id of ['alpha-input', 'bins-input', 'bins-hint', 'replicates-input', 'seed-input', 'confidence-input', 'blife-input', 'reltime-input', 'bounds-select', 'periods-input', 'designlife-input', 'plotpos-select', 'lsl-input', 'usl-input', 'target-input', 'status-select', 'subgroup-select', 'order-select', 'family-boxes', 'transform-select', 'natural-lower-bound-input']) {
      expect(document.getElementById(id), id).not.toBeNull();
    }
    expect(document.querySelectorAll('input[name="pmethod"]').length).toBe(2);
    expect((document.getElementById('bins-input') as HTMLInputElement).min).toBe('2');
    expect((document.getElementById('replicates-input') as HTMLInputElement).max).toBe('100000');
  });

  it('reads back what it shows: the defaults, a demo-like setting, and a check box', async () => {
    const { readForm, showSettings } = await import('../../client/src/form.js');
    const { DEFAULT_SETTINGS } = await import('../../client/src/settings.js');
    await build();
    const cols = [{ index: 1, label: 'x' }, { index: 2, label: 'g' }];
    showSettings({ ...DEFAULT_SETTINGS, transform: 'boxcox', naturalLowerBound: '0', trend: 'true', subgroupColumn: 2 }, cols, 1);
    const back = readForm();
    expect(back).toMatchObject({ transform: 'boxcox', naturalLowerBound: '0', trend: 'true', subgroupColumn: 2, alpha: '0.05', pMethod: 'table' });
    expect((document.getElementById('replicates-input') as HTMLInputElement).disabled).toBe(true);
    for (const [k, v] of Object.entries(DEFAULT_SETTINGS)) if (!['transform', 'naturalLowerBound', 'trend', 'subgroupColumn'].includes(k)) expect(back[k], k).toEqual(v);
  });
});

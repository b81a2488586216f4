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

describe('the number fields carry the option table\'s limits (core/options), before and after the page starts', () => {
  it('applyOptionTable leaves every number field of the HTML as the HTML already says it, and bins starts at 2 as the table says', async () => {
    const { applyOptionTable } = await import('../../client/src/form.js');
    const { optionNamed } = await import('../../core/index.js');
    document.body.innerHTML = doc.body.innerHTML;
    const attrs = (): Record<string, [string | null, string | null, string | null]> =>
      Object.fromEntries([...document.querySelectorAll<HTMLInputElement>('input[type="number"]')].map((i) => [i.id, [i.getAttribute('min'), i.getAttribute('max'), i.getAttribute('step')]]));
    const before = attrs();
    applyOptionTable();
    expect(attrs()).toEqual(before);
    const bins = optionNamed('bins')!;
    expect(before['bins-input']![0]).toBe(String(bins.min));
    expect(before['replicates-input']).toEqual([String(optionNamed('replicates')!.min), String(optionNamed('replicates')!.max), '1']);
  });
});

/**
 * The page in a real browser (Debian's Chromium driven by playwright-core) against the real
 * server started as one node process: the demo result on opening, a CSV upload with a chosen
 * column, changed α and families, selecting a candidate with the mouse and the keyboard, the
 * exports, a bootstrap run that can be stopped, and screenshots at 1366×768 and 1920×1080 in
 * test-output/ (git-ignored).
 *
 * Run locally: `apt-get install -y chromium`, then `npx vitest run test/browser`.
 * Skipped only when /usr/bin/chromium is absent and CI is not set.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { SKIP_BROWSER, type RunningServer } from './server-process.js';
import { OUT, openSession, waitForStatus, type BrowserSession } from './session.js';

// An invented fatigue test: an identifier, a cycle count in thousands, the load, a note; one
// row with a missing load ("NA") that must be counted as skipped, not silently dropped.
const LOADS = [41.2, 38.7, 44.9, 40.1, 39.5, 42.8, 45.6, 37.9, 43.3, 40.8, 41.9, 39.1, 42.2, 44.1, 38.4, 40.5, 43.7, 41.5, 39.8, 42.6, 46.3, 40.2, 41.1, 43.0];
const CSV =
  'specimen,kcycles,load_kN,note\r\n' +
  LOADS.map((v, i) => `S${i + 1},${(120 + 7 * i) % 97},${v},"batch ${1 + (i % 3)}, ok"`).join('\r\n') +
  '\r\nS99,50,NA,"<b>not measured</b>"\r\n';

describe.skipIf(SKIP_BROWSER)('the page in Chromium', () => {
  let session: BrowserSession;
  let server: RunningServer;
  let page: Page;
  const consoleProblems: string[] = [];

  beforeAll(async () => {
    session = await openSession({ problems: consoleProblems, acceptDownloads: true, csp: true });
    ({ server, page } = session);
  }, 180_000);

  afterAll(async () => {
    await session?.close();
  });

  const waitForDone = (what: RegExp): Promise<void> => waitForStatus(page, what, 60_000);

  const rows = () => page.locator('#ranking-table tr.cand-main');
  /** The model choices (the page's way to select a model; the test-numbers table is on demand). */
  const picks = () => page.locator('#model-choices button.model-pick');

  it('opens with the demo already analysed: the model choices, the four evidence charts, the caution (issue 3, "Start")', async () => {
    await page.goto(server.url);
    await waitForDone(/^Done:/);
    expect(await rows().count()).toBeGreaterThan(0);
    expect(await page.locator('#value-charts svg[role="img"]').count()).toBe(4);
    expect(await picks().count()).toBe(await rows().count());
    expect(await page.locator('#caution').textContent()).toMatch(/licensed/);
    // The best model is selected (in the choices and in the numbers table) and its name heads the evidence.
    const first = rows().first();
    expect(await first.getAttribute('aria-selected')).toBe('true');
    expect(await page.locator(`#model-choices button[data-family="${await first.getAttribute('data-family')}"]`).getAttribute('aria-pressed')).toBe('true');
    const evidenceName = (await page.locator('#evidence-name').textContent()) ?? '';
    expect((await first.locator('td.model').textContent())?.trim()).toContain(evidenceName.trim());
    await page.screenshot({ path: join(OUT, 'page-1366x768.png') });
    await page.screenshot({ path: join(OUT, 'page-1366-full.png'), fullPage: true });
  });

  it('is keyboard reachable: Tab from the top reaches a demo button, the file picker, the settings and a model choice', async () => {
    await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
    const seen = new Set<string>();
    for (let i = 0; i < 120 && !seen.has('row'); i++) {
      await page.keyboard.press('Tab');
      const kind = await page.evaluate(() => {
        const a = document.activeElement as HTMLElement | null;
        if (!a) return '';
        if (a.closest('#demo-list')) return 'demo';
        if (a.id === 'file-input') return 'file';
        if (a.id === 'alpha-input') return 'alpha';
        if (a.id === 'run-button') return 'run';
        if (a.matches('button.model-pick')) return 'row';
        return a.tagName.toLowerCase();
      });
      seen.add(kind);
    }
    for (const k of ['demo', 'file', 'alpha', 'run', 'row']) expect(seen.has(k), `Tab reached ${k}`).toBe(true);
  });

  it('takes a CSV dropped on the drop zone', async () => {
    await page.evaluate((text) => {
      const dt = new DataTransfer();
      dt.items.add(new File([text], 'dropped.csv', { type: 'text/csv' }));
      const zone = document.getElementById('drop-zone')!;
      zone.dispatchEvent(new DragEvent('dragover', { dataTransfer: dt, bubbles: true, cancelable: true }));
      zone.dispatchEvent(new DragEvent('drop', { dataTransfer: dt, bubbles: true, cancelable: true }));
    }, 'strength_MPa\n412\n398\n405\n421\n417\n409\n402\n399\n415\n411\n');
    await waitForDone(/10 values of strength_MPa from dropped\.csv/);
    expect(await page.inputValue('#units-input')).toBe('MPa');
  });

  it('loads a demo from the list with its status column applied; without it, warns and offers to apply it', async () => {
    await page.click('#demo-list button[data-name="bearing-life"]');
    await waitForDone(/values of hours from bearing-life/);
    expect(await page.locator('#demo-list button[data-name="bearing-life"]').getAttribute('aria-pressed')).toBe('true');
    expect(await page.inputValue('#status-select')).toBe('3');
    const note = page.locator('#column-note');
    expect(await note.isVisible()).toBe(false);
    await page.selectOption('#status-select', '0');
    expect(await note.isVisible()).toBe(true);
    expect(await note.textContent()).toMatch(/“status”.*censored/);
    await page.click('#use-status');
    expect(await page.inputValue('#status-select')).toBe('3');
    expect(await note.isVisible()).toBe(false);
    await waitForDone(/values of hours from bearing-life/);
  });

  it('reads an uploaded CSV, offers its columns, analyses the chosen one and counts the skipped row', async () => {
    await page.setInputFiles('#file-input', { name: 'fatigue <test>.csv', mimeType: 'text/csv', buffer: Buffer.from(CSV) });
    await page.waitForFunction(() => (document.getElementById('source-name')?.textContent ?? '').includes('fatigue'));
    const options = await page.locator('#column-select option').allTextContents();
    expect(options).toEqual(['1. specimen', '2. kcycles', '3. load_kN', '4. note']);
    // The file name is shown as text, not markup (OWASP XSS Prevention Cheat Sheet, rule 1).
    expect(await page.locator('#source-name').textContent()).toContain('fatigue <test>.csv');
    expect(await page.locator('#column-note').isVisible()).toBe(false);
    await page.selectOption('#column-select', '3');
    await waitForDone(/values of load_kN from fatigue/);
    const counts = (await page.locator('#counts').textContent()) ?? '';
    expect(counts).toContain(`n = ${LOADS.length} values used`);
    expect(counts).toContain(`${LOADS.length + 1} data rows read`);
    expect(counts).toMatch(/1 row skipped/);
    expect(await page.locator('#skips').textContent()).toMatch(/missing-value marker.*line 26/);
    // Units and quantity suggested from the column name appear on the chart axes.
    expect(await page.inputValue('#units-input')).toBe('kN');
    expect(await page.locator('#chart-histogram svg').textContent()).toContain('Load [kN]');
  });

  it('re-runs when α and the families change', async () => {
    await page.fill('#alpha-input', '0.1');
    await page.press('#alpha-input', 'Tab');
    await page.waitForFunction(() => (document.querySelector('#ranking-table tr.cand-words')?.textContent ?? '').includes('α = 0.1'), undefined, { timeout: 60_000 });
    await page.uncheck('#family-boxes input[value="exponential"]');
    await page.uncheck('#family-boxes input[value="gamma"]');
    await page.waitForFunction(() => document.querySelectorAll('#ranking-table tr.cand-main').length === 3, undefined, { timeout: 60_000 });
    const families = await rows().evaluateAll((rs) => rs.map((r) => r.getAttribute('data-family')));
    expect(families.sort()).toEqual(['lognormal', 'normal', 'weibull']);
  });

  it('selects a candidate by click and by keyboard (Tab to the model, Enter)', async () => {
    const second = picks().nth(1);
    await second.click();
    expect(await second.getAttribute('aria-pressed')).toBe('true');
    expect(await picks().first().getAttribute('aria-pressed')).toBe('false');
    const fam = await second.getAttribute('data-family');
    expect(await page.locator(`#ranking-table tr.cand-main[data-family="${fam}"]`).getAttribute('aria-selected')).toBe('true');
    const title = (await page.locator('#chart-probability svg title').first().textContent()) ?? '';
    expect(title.toLowerCase()).toContain(fam!);
    const third = picks().nth(2);
    await third.focus();
    await page.keyboard.press('Enter');
    expect(await picks().nth(2).getAttribute('aria-pressed')).toBe('true');
    // Focus stays on the choice and is visible (WCAG 2.1 SC 2.4.7): an outline is drawn.
    expect(await page.evaluate(() => (document.activeElement as HTMLElement | null)?.getAttribute('aria-pressed'))).toBe('true');
    const outline = await picks().nth(2).evaluate((r) => getComputedStyle(r).outlineStyle);
    expect(outline).not.toBe('none');
  });

  it('exports a self-contained HTML report with the table and the four SVG charts, and a neutralised CSV', async () => {
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('#export-html')]);
    const file = join(OUT, 'report.html');
    await download.saveAs(file);
    const html = readFileSync(file, 'utf8');
    expect(html).toContain('<table class="ranking">');
    expect(html.match(/<svg/g)?.length).toBe(4);
    expect(html).not.toMatch(/<script/i);
    expect(html).toContain('fatigue &lt;test&gt;.csv');
    expect(html).toContain('load_kN');
    expect(html).toMatch(/Random seed<\/th><td>\d+/);
    const selectedLabel = (await page.locator('#model-choices button[aria-pressed="true"] .model-name').textContent())?.trim() ?? '';
    expect(html.toLowerCase()).toContain(`evidence for ${selectedLabel.toLowerCase()}`);

    const [csvDownload] = await Promise.all([page.waitForEvent('download'), page.click('#export-csv')]);
    const csvFile = join(OUT, 'bins.csv');
    await csvDownload.saveAs(csvFile);
    const csv = readFileSync(csvFile, 'utf8');
    expect(csv.split('\r\n')[0]).toMatch(/^model,source,column,units,bin,lower,upper,(open_edge,)?observed,expected/);

    const [jsonDownload] = await Promise.all([page.waitForEvent('download'), page.click('#export-json')]);
    const jsonFile = join(OUT, 'report.json');
    await jsonDownload.saveAs(jsonFile);
    const json = JSON.parse(readFileSync(jsonFile, 'utf8')) as { n: number; options: { alpha: number } };
    expect(json.n).toBe(LOADS.length);
    expect(json.options.alpha).toBe(0.1);
  });

  it('shows bootstrap progress, keeps the page usable, and stops on request', async () => {
    await page.check('input[name="pmethod"][value="bootstrap"]');
    await page.fill('#replicates-input', '100000');
    await page.press('#replicates-input', 'Tab');
    await page.waitForSelector('#progress-wrap:not([hidden])', { timeout: 30_000 });
    // Usable meanwhile: another candidate can be selected while the bootstrap runs.
    await picks().nth(0).click();
    expect(await picks().nth(0).getAttribute('aria-pressed')).toBe('true');
    // A second analysis replaces the first (the server keeps one job per page).
    await page.fill('#alpha-input', '0.05');
    await page.press('#alpha-input', 'Tab');
    await page.waitForTimeout(1500);
    const health = (await (await fetch(`${server.url}api/health`)).json()) as { jobsRunning: number };
    expect(health.jobsRunning).toBeLessThanOrEqual(1);
    await page.click('#cancel-button');
    await page.waitForSelector('#progress-wrap[hidden]', { state: 'attached', timeout: 10_000 });
    expect(await page.locator('#status').textContent()).toMatch(/stopped/i);
    await page.check('input[name="pmethod"][value="table"]');
    await waitForDone(/^Done:/);
  });

  it('reports bootstrap p-values with B once a bootstrap run finishes', async () => {
    await page.check('input[name="pmethod"][value="bootstrap"]');
    await page.fill('#replicates-input', '199');
    await page.press('#replicates-input', 'Tab');
    await page.waitForFunction(() => (document.getElementById('ranking-table')?.textContent ?? '').includes('bootstrap, B = 199'), undefined, { timeout: 120_000 });
    await page.check('input[name="pmethod"][value="table"]');
    await waitForDone(/^Done:/);
  });

  it('shows the server\'s message when a setting is impossible (too many bins for 5 expected per bin)', async () => {
    await page.fill('#bins-input', '20');
    await page.press('#bins-input', 'Tab');
    await page.waitForSelector('#error:not([hidden])', { timeout: 30_000 });
    expect(await page.locator('#error').textContent()).toMatch(/bin/i);
    await page.fill('#bins-input', '');
    await page.press('#bins-input', 'Tab');
    await page.waitForSelector('#error[hidden]', { state: 'attached', timeout: 30_000 });
  });

  it('analyses a pasted column of numbers', async () => {
    await page.click('#paste-box summary');
    await page.fill('#paste-text', LOADS.slice(0, 12).join('\n'));
    await page.click('#paste-use');
    await waitForDone(/12 values of #1 from Pasted values/);
    expect(await page.locator('#counts').textContent()).toContain('n = 12 values used');
  });

  it('lists the families that cannot be fitted, with the reason (negative values for positive-support families)', async () => {
    for (const f of ['gamma', 'exponential']) await page.check(`#family-boxes input[value="${f}"]`);
    await page.fill('#paste-text', ['-1.5', '0.4', '2.2', '-0.3', '1.1', '0.9', '-2.0', '0.1', '1.7', '-0.8', '0.6', '1.3'].join('\n'));
    await page.click('#paste-use');
    await waitForDone(/12 values of #1 from Pasted values/);
    // The previous test pasted 12 values too, so the status line alone may still be the old one.
    await page.waitForFunction(() => /Not fitted/.test(document.getElementById('not-applicable')?.textContent ?? ''), undefined, { timeout: 60_000 });
    const na = (await page.locator('#not-applicable').textContent()) ?? '';
    expect(na).toMatch(/Not fitted/);
    for (const label of ['Lognormal', 'Gamma', 'Weibull', 'Exponential']) expect(na).toContain(label);
    expect(await rows().count()).toBe(1);
  });

  it('reads well at 1920×1080 (screenshot) and raised no console or CSP errors', async () => {
    await page.setViewportSize({ width: 1920, height: 1080 });
    await page.waitForTimeout(400);
    await page.screenshot({ path: join(OUT, 'page-1920x1080.png') });
    await page.screenshot({ path: join(OUT, 'page-1920-full.png'), fullPage: true });
    // The one 400 is the too-many-bins request provoked above; anything else is a problem.
    expect(consoleProblems.filter((m) => !/status of 400/.test(m))).toEqual([]);
  });
});

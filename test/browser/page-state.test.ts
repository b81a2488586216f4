/**
 * The page on explicit state, in Chromium against the real server: a demo's settings stay with the
 * demo (the next file starts from the defaults and says so), a failed load leaves no stale answer,
 * the answer says when the selected model is rejected or a trend undermines it, a spreadsheet file
 * with a byte-order mark, semicolons, decimal commas and a row-number column is read right, and the
 * glossary is reachable by keyboard. Screenshots at 1366×768 and 800×900 go to test-output/.
 * The data are invented for these checks (common practice, no source).
 */
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { SKIP_BROWSER } from './server-process.js';
import { OUT, openSession, waitForStatus, type BrowserSession } from './session.js';

/** Invented bearing-fatigue lives in hours: a file with no decision settings of its own. */
const FATIGUE = 'specimen,hours\n' + [812, 1290, 655, 1502, 988, 1120, 743, 1377, 904, 1045, 1211, 698, 1333, 876, 1158].map((h, i) => `F${i + 1},${h}`).join('\n') + '\n';
/** Invented annual peaks with a steady rise of 15 a year over 40 years: a trend by construction. */
const DRIFT = 'year,peak\n' + Array.from({ length: 40 }, (_, i) => `${1980 + i},${(300 + 15 * i + 60 * Math.sin(i * 2.3)).toFixed(1)}`).join('\n') + '\n';
/** BOM, semicolons, decimal commas and a row-number column, as a spreadsheet in a decimal-comma locale writes. */
const SPREADSHEET = '\uFEFFNr;Zeit_h;Last\r\n' + Array.from({ length: 50 }, (_, i) => `${i + 1};${(800 + 13.7 * i + 40 * Math.cos(i)).toFixed(1).replace('.', ',')};${(40 + (i % 7) / 10).toFixed(1).replace('.', ',')}`).join('\r\n') + '\r\n';

describe.skipIf(SKIP_BROWSER)('the page on explicit state', () => {
  let session: BrowserSession;
  let page: Page;
  const problems: string[] = [];

  beforeAll(async () => {
    session = await openSession({ problems, open: true });
    page = session.page;
  }, 180_000);

  afterAll(async () => {
    await session?.close();
  });

  const waitDone = (what: RegExp): Promise<void> => waitForStatus(page, what, 120_000);
  const upload = (name: string, text: string) => page.setInputFiles('#file-input', { name, mimeType: 'text/csv', buffer: Buffer.from(text) });
  const cautions = async (): Promise<string> => (await page.locator('#answer-cautions').textContent()) ?? '';

  it('opens with the answer first, the model choices, and the demo\'s settings named as the demo\'s', { timeout: 180_000 }, async () => {
    await waitDone(/^Done: /);
    await expect(page.locator('#headline').textContent()).resolves.toMatch(/B10 life under Weibull/);
    await expect(page.locator('#demo-settings').textContent()).resolves.toMatch(/^Demo settings: .*belong to the bearing-life demo/);
    expect(await page.locator('#model-choices button.model-pick').count()).toBeGreaterThan(1);
    // A censored sample has no bins: the evidence views that need them are not offered, and the page says why.
    expect(await page.locator('.view-pick[data-view="bins"]').isVisible()).toBe(false);
    expect(await page.locator('.view-pick[data-view="probability"]').isVisible()).toBe(true);
    await expect(page.locator('#evidence-note').textContent()).resolves.toMatch(/^No histogram or chi-square bins for this sample: /);
    // The answer is on the first screen at 1366×768.
    const box = await page.locator('#headline').boundingBox();
    expect(box!.y + box!.height).toBeLessThan(768);
    await page.screenshot({ path: join(OUT, 'state-open-1366x768.png') });
    await page.screenshot({ path: join(OUT, 'state-open-1366-full.png'), fullPage: true });
  });

  it('says in the answer when the selected model is rejected by a test', { timeout: 60_000 }, async () => {
    const rejected = page.locator('#model-choices [data-group="rejected"] button.model-pick').first();
    expect(await rejected.count(), 'the bearing demo rejects at least one model').toBe(1);
    await rejected.click();
    expect(await rejected.getAttribute('aria-pressed')).toBe('true');
    await expect(page.locator('#headline').textContent()).resolves.toMatch(/^Not a number to design on as it stands: /);
    expect(await cautions()).toMatch(/is rejected by the (Anderson–Darling|chi-square) test .*do not design on this number/);
    await page.locator('#answer').screenshot({ path: join(OUT, 'state-rejected-answer.png') });
    await page.locator('#model-choices [data-group="usable"] button.model-pick').first().click();
    expect(await cautions()).not.toMatch(/is rejected by/);
  });

  it('a demo\'s settings stay with the demo: the river demo, then an own file, starts from the defaults and says so', { timeout: 180_000 }, async () => {
    await page.click('#demo-list button[data-name="river-peaks"]');
    await waitDone(/^Done: .* 60 values/);
    expect(await page.inputValue('#periods-input')).not.toBe('');
    expect(await page.isChecked('#family-boxes input[value="gev"]')).toBe(true);
    await upload('fatigue.csv', FATIGUE);
    await waitDone(/15 values of hours from fatigue\.csv/);
    expect(await page.inputValue('#periods-input')).toBe('');
    expect(await page.inputValue('#designlife-input')).toBe('');
    expect(await page.inputValue('#order-select')).toBe('0');
    expect(await page.isChecked('#family-boxes input[value="gev"]')).toBe(false);
    await expect(page.locator('#demo-settings').textContent()).resolves.toMatch(/^Default settings for fatigue\.csv \(the settings of river-peaks stay with it\)/);
    expect(await page.locator('#headline').isVisible()).toBe(false);
    expect(await page.locator('#decision-body [data-block="flood"]').count()).toBe(0);
  });

  it('a failed load leaves no answer, no models and no sections of the previous data', { timeout: 120_000 }, async () => {
    await page.click('#demo-list button[data-name="bearing-life"]');
    await waitDone(/^Done: .* 30 values of hours from bearing-life/);
    await expect(page.locator('#headline').textContent()).resolves.toMatch(/B10 life/);
    await upload('empty.csv', '   \n');
    await page.waitForSelector('#error:not([hidden])');
    expect(await page.locator('#error').textContent()).toMatch(/empty\.csv: the file is empty/);
    expect(await page.locator('#headline').isVisible()).toBe(false);
    expect(await page.locator('#model-choices button').count()).toBe(0);
    expect(await page.locator('#decision-body [data-block]').count()).toBe(0);
    // Not even the previous selection's model name in the section heading (it said "The numbers under Weibull").
    expect(await page.locator('#decision-name').textContent()).toBe('the selected model');
    expect(await page.locator('#loaded').isVisible()).toBe(false);
    // A file the server cannot analyse: its name is on screen, nothing of the bearing demo is.
    await page.click('#demo-list button[data-name="bearing-life"]');
    await waitDone(/^Done: .* from bearing-life/);
    await upload('words.csv', 'note\nfine\ngood\nok\n');
    await page.waitForSelector('#error:not([hidden])', { timeout: 60_000 });
    expect(await page.locator('#source-name').textContent()).toContain('words.csv');
    expect(await page.locator('#headline').isVisible()).toBe(false);
    expect(await page.locator('#model-choices button').count()).toBe(0);
  });

  it('names a detected trend next to a return level', { timeout: 120_000 }, async () => {
    await upload('drift.csv', DRIFT);
    await waitDone(/40 values of peak from drift\.csv/);
    await page.selectOption('#order-select', '1');
    await page.fill('#periods-input', '100');
    await page.dispatchEvent('#periods-input', 'change');
    await page.waitForFunction(() => /100-year level/.test(document.getElementById('headline')?.textContent ?? ''), undefined, { timeout: 60_000 });
    expect(await cautions()).toMatch(/A trend was found over time \(Mann–Kendall p = /);
    await page.locator('#answer').screenshot({ path: join(OUT, 'state-trend-answer.png') });
  });

  it('reads a spreadsheet file: BOM, semicolons, decimal commas offered, the row-number column passed over', { timeout: 120_000 }, async () => {
    await upload('messung.csv', SPREADSHEET);
    await waitDone(/50 values of Zeit_h from messung\.csv/);
    expect(await page.inputValue('#decimal-select')).toBe(',');
    expect(await page.locator('#decimal-note').textContent()).toMatch(/decimal comma/);
    expect(await page.inputValue('#column-select')).toBe('2');
    // Offered both ways: reading with a point says why the column no longer reads.
    await page.click('#decimal-switch');
    expect(await page.inputValue('#decimal-select')).toBe('.');
    await page.click('#decimal-switch');
    await waitDone(/50 values of Zeit_h from messung\.csv/);
  });

  it('explains every header and symbol in a glossary reached by keyboard', { timeout: 60_000 }, async () => {
    await page.click('#numbers-detail summary');
    const link = page.locator('#ranking-table thead a[href="#g-aicc"]');
    await link.focus();
    await page.keyboard.press('Enter');
    await page.waitForFunction(() => location.hash === '#g-aicc');
    await expect(page.locator('#g-aicc').textContent()).resolves.toMatch(/AICc/);
    for (const key of ['lnl', 'aicc', 'dof', 'cl', 'ad', 'xi', 'cpm', 'band', 'bounds', 'cap']) expect(await page.locator(`#g-${key}`).count(), key).toBe(1);
    await page.locator('#glossary').screenshot({ path: join(OUT, 'state-glossary.png') });
  });

  it('at 800 px: the page fits the width and the answer is near the top (screenshots)', { timeout: 120_000 }, async () => {
    await page.click('#demo-list button[data-name="shaft-diameter"]');
    await waitDone(/^Done: .* 125 values/);
    await page.setViewportSize({ width: 800, height: 900 });
    await page.waitForTimeout(500);
    const width = await page.evaluate(() => document.documentElement.scrollWidth);
    await page.screenshot({ path: join(OUT, 'state-shaft-800x900.png') });
    await page.screenshot({ path: join(OUT, 'state-shaft-800-full.png'), fullPage: true });
    await page.setViewportSize({ width: 1366, height: 768 });
    await page.waitForTimeout(400);
    await page.locator('#answer').scrollIntoViewIfNeeded();
    await page.screenshot({ path: join(OUT, 'state-shaft-1366x768.png') });
    await page.locator('#decision').scrollIntoViewIfNeeded();
    await page.screenshot({ path: join(OUT, 'state-shaft-decision-1366x768.png') });
    expect(width).toBeLessThanOrEqual(800);
    expect(problems.filter((m) => !/status of 400/.test(m))).toEqual([]);
  });
});

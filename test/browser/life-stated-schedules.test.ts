/**
 * Issue 13 on the page, in Chromium against the real server:
 *  - time + status with 9 failures and the Weibull shape given (2): the life section states the
 *    Weibayes alternative beside the maximum-likelihood B-life, shape said to be ASSUMED, its numbers
 *    equal to Nelson's (1985, J. Quality Technology 17:140-146) closed form with SciPy's chi2.ppf
 *    (test/fixtures/life-weibayes.json); the exported report carries the line;
 *  - interval rows with an inspection-times column (invented, test/helpers/stated-schedules.ts): the
 *    column is a role of interval rows, and the fit test then re-inspects each unit at exactly its
 *    stated times (the goodness-of-fit table says so).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { sig } from '../../client/src/format.js';
import { readFixture } from '../helpers/fixtures.js';
import { STATED_CSV } from '../helpers/stated-schedules.js';
import { SKIP_BROWSER } from './server-process.js';
import { OUT, openSession, waitForStatus, type BrowserSession } from './session.js';

const c = readFixture('life-weibayes.json').weibayes[2];

describe.skipIf(SKIP_BROWSER)('Weibayes beside maximum likelihood, and stated inspection schedules, on the page', () => {
  let session: BrowserSession;
  let page: Page;
  const problems: string[] = [];

  beforeAll(async () => {
    session = await openSession({ problems, open: true, acceptDownloads: true });
    page = session.page;
    await waitForStatus(page, /^Done: /, 240_000);
  }, 300_000);

  afterAll(async () => {
    await session?.close();
  });

  const upload = (name: string, text: string) => page.setInputFiles('#file-input', { name, mimeType: 'text/csv', buffer: Buffer.from(text) });
  const done = (name: string) => waitForStatus(page, new RegExp(`^Done: .*${name.replace(/\./g, '\\.')}`), 180_000);

  it('9 failures, shape 2 assumed: the life section states the Weibayes alternative as SciPy’s closed form; the report has it', { timeout: 400_000 }, async () => {
    await upload('nine-failures.csv', `hours,status\n${c.times.map((t: number, i: number) => `${t},${c.failed[i]}`).join('\n')}\n`);
    await done('nine-failures.csv');
    await page.selectOption('#status-select', '2');
    await done('nine-failures.csv');
    await page.evaluate(() => document.getElementById('assumed-shape-input')?.closest('details')?.setAttribute('open', ''));
    await page.fill('#assumed-shape-input', '2');
    await page.locator('#assumed-shape-input').dispatchEvent('change');
    await page.waitForFunction(() => /Alternative with the Weibull shape ASSUMED/.test(document.querySelector('[data-block="life"]')?.textContent ?? ''), undefined, { timeout: 180_000 });
    await done('nine-failures.csv');
    const text = (await page.locator('[data-block="life"]').textContent()) ?? '';
    const a = Math.sqrt(-Math.log(0.9));
    expect(text).toContain(`Alternative with the Weibull shape ASSUMED at β = 2, not estimated (Weibayes; Nelson 1985; 9 failures in 15 units): scale ${sig(c.scale)}`);
    expect(text).toContain(`at least ${sig(c.scaleLower)}`);
    expect(text).toContain(`B10 ${sig(c.scale * a)}`);
    expect(text).toContain(`at least ${sig(c.scaleLower * a)}`);
    // the maximum-likelihood B-life stays the section's answer
    await expect(page.locator('[data-block="life"] .block-answer').textContent()).resolves.toMatch(/^B10 life under /);
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('#export-html')]);
    const file = join(OUT, 'report-weibayes-beside-ml.html');
    await download.saveAs(file);
    expect(readFileSync(file, 'utf8')).toContain('Alternative with the Weibull shape ASSUMED at β = 2, not estimated');
    await page.locator('[data-block="life"]').scrollIntoViewIfNeeded();
    await page.screenshot({ path: join(OUT, 'weibayes-beside-ml-1366x768.png') });
    expect(problems).toEqual([]);
  });

  it('interval rows with an inspection-times column: the fit test re-inspects each unit at exactly its stated times', { timeout: 400_000 }, async () => {
    await upload('stated.csv', `${STATED_CSV}\n`);
    await waitForStatus(page, /stated\.csv/, 180_000);
    expect(await page.inputValue('#shape-select')).toBe('interval');
    const options = await page.locator('#inspection-times-select option').allTextContents();
    expect(options.some((o) => /seen/.test(o))).toBe(true);
    await page.selectOption('#inspection-times-select', '3');
    await page.waitForFunction(() => /at exactly its stated inspection times/.test(document.querySelector('[data-block="life-recorded"]')?.textContent ?? ''), undefined, { timeout: 180_000 });
    await done('stated.csv');
    await page.locator('[data-block="life-recorded"]').scrollIntoViewIfNeeded();
    await page.screenshot({ path: join(OUT, 'stated-schedules-1366x768.png') });
    expect(problems).toEqual([]);
  });
});

/**
 * Grouped counts on the page (issue 4, "Grouped counts"): open the inspection tally demo, see it read
 * as class limits with counts, the chi-square on the merged classes with k − 1 − m degrees of
 * freedom, the "not offered" Anderson–Darling note instead of A² cells, the observed-vs-expected
 * chart per class; export the HTML report and find the class counts section. Then upload the same
 * file under another name with setInputFiles. Screenshot at 1366×768 into test-output/.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { ROOT, SKIP_BROWSER } from './server-process.js';
import { OUT, openSession, waitForStatus, type BrowserSession } from './session.js';

describe.skipIf(SKIP_BROWSER)('grouped counts on the page', () => {
  let session: BrowserSession;
  let page: Page;
  const problems: string[] = [];

  beforeAll(async () => {
    session = await openSession({ problems, acceptDownloads: true, open: true });
    page = session.page;
  }, 180_000);

  afterAll(async () => {
    await session?.close();
  });

  const waitDone = (what: RegExp): Promise<void> => waitForStatus(page, what, 120_000);

  it('inspection classes demo: grouped fits, chi-square on the merged classes, AD not offered; the report has the section', { timeout: 240_000 }, async () => {
    await waitDone(/^Done: /);
    await page.click('#demo-list button[data-name="inspection-classes"]');
    // datasets/README.md: 180 pits in 12 classes of 0.25 mm.
    await waitDone(/^Done: .* 180 counted in 12 classes/);
    expect(await page.locator('#shape-select').inputValue()).toBe('grouped');
    expect(await page.locator('#grouped-cols').isVisible()).toBe(true);
    expect(await page.locator('#value-cols').isVisible()).toBe(false);
    const table = (await page.locator('#ranking-table').textContent()) ?? '';
    expect(table).toContain('not offered');
    expect(table).not.toMatch(/NaN|undefined/);
    expect(await page.locator('#th-dof').textContent()).toBe('dof k−1−m');
    expect(await page.locator('#grouped-evidence').isVisible()).toBe(true);
    expect(await page.locator('#value-charts').isVisible()).toBe(false);
    await expect(page.locator('#grouped-test').textContent()).resolves.toMatch(/k − 1 − m = \d+ − 1 − \d+ = \d+/);
    // core/grouped GROUPED_AD_NOTE.
    await expect(page.locator('#grouped-ad').textContent()).resolves.toMatch(/Anderson–Darling test is not offered for grouped data/);
    const bars = await page.locator('#chart-grouped rect[data-kind="bar"]').count();
    expect(bars).toBeGreaterThan(2);
    expect(bars).toBe((await page.locator('#grouped-cells tbody tr').count()));
    await page.locator('#ranking').scrollIntoViewIfNeeded();
    await page.screenshot({ path: join(OUT, 'grouped-1366x768.png') });
    await page.locator('#grouped-evidence').scrollIntoViewIfNeeded();
    await page.screenshot({ path: join(OUT, 'grouped-evidence-1366x768.png') });
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('#export-html')]);
    const file = join(OUT, 'report-grouped.html');
    await download.saveAs(file);
    const html = readFileSync(file, 'utf8');
    expect(html).toContain('id="grouped-counts"');
    expect(html).toMatch(/Anderson–Darling not offered/);
    expect(html).toMatch(/k − 1 − m/);
    expect(html).toContain('<svg');
    expect(html).not.toMatch(/NaN|<script/i);
  });

  it('an uploaded lower,upper,count file is recognised and analysed as class counts', { timeout: 120_000 }, async () => {
    const csv = readFileSync(join(ROOT, 'datasets', 'inspection-classes.csv'), 'utf8');
    await page.setInputFiles('#file-input', { name: 'tally.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
    await waitDone(/^Done: .* 180 counted in 12 classes from tally\.csv/);
    expect(await page.locator('#shape-select').inputValue()).toBe('grouped');
    expect(await page.locator('.ad-not-offered').count()).toBeGreaterThan(0);
    // Back to a file of individual values: the value charts and the usual headings return.
    await page.click('#demo-list button[data-name="pump-seal-wear"]');
    await waitDone(/^Done: .* 80 values/);
    expect(await page.locator('#shape-select').inputValue()).toBe('values');
    expect(await page.locator('#value-charts').isVisible()).toBe(true);
    expect(await page.locator('#grouped-evidence').isVisible()).toBe(false);
    expect(await page.locator('#th-dof').textContent()).toBe('dof [k−1]');
    expect(await page.locator('.ad-not-offered').count()).toBe(0);
    expect(problems).toEqual([]);
  });
});

/**
 * The capability section in a real browser: the shaft-diameter demo (invented, 25 subgroups of 5,
 * datasets/README.md) shows the answer first, the passing models with the spread each uses, the
 * rejected models apart, the stability verdict from the subgroup column and the safety caution; the
 * exported HTML report carries the same section.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { SKIP_BROWSER } from './server-process.js';
import { OUT, openSession, waitForStatus, type BrowserSession } from './session.js';

describe.skipIf(SKIP_BROWSER)('capability section on the page', () => {
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

  it('shaft diameter: answer, passing and rejected models apart, stability from the subgroups, caution; the report has them', { timeout: 240_000 }, async () => {
    await waitForStatus(page, /^Done: .* 30 values/, 120_000);
    await page.click('#demo-list button[data-name="shaft-diameter"]');
    await waitForStatus(page, /^Done: .* 125 values/, 120_000);
    const block = page.locator('[data-block="capability"]');
    await block.waitFor();
    await expect(block.locator('h3').textContent()).resolves.toBe('Can it meet the tolerance?');
    const text = (await block.textContent()) ?? '';
    expect(text).toMatch(/Stability \(subgroup means and standard deviations, order from the subgroup column/);
    expect(text).toMatch(/safety-critical/);
    expect(text).toMatch(/Upper side: the 99\.865 % point/);
    // the rejected models' table is folded apart (a details element), never in the passing table
    const captions = await block.locator('caption').allTextContents();
    expect(captions.some((c) => /each model that passes the tests/.test(c))).toBe(true);
    const rejected = block.locator('details', { hasText: 'Models the tests reject' });
    if ((await rejected.count()) > 0) {
      const rejectedModels = await rejected.locator('tbody th').allTextContents();
      const passing = await block.locator('table', { hasText: 'each model that passes' }).locator('tbody th').allTextContents();
      for (const m of rejectedModels) expect(passing).not.toContain(m);
    }
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('#export-html')]);
    const file = join(OUT, 'report-capability-section.html');
    await download.saveAs(file);
    const html = readFileSync(file, 'utf8');
    expect(html).toContain('Can it meet the tolerance?');
    expect(html).toMatch(/Models the tests reject|each model that passes the tests/);
    await block.scrollIntoViewIfNeeded();
    await page.screenshot({ path: join(OUT, 'capability-section-1366x768.png') });
    expect(problems).toEqual([]);
  });
});

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
    // the stability chart: 25 subgroup means and 25 standard deviations
    const cc = block.locator('[data-slot="control-chart"] svg');
    await expect(cc.locator('title').first().textContent()).resolves.toMatch(/^Is the process stable\? Subgroup means and standard deviations/);
    expect(await cc.locator('circle').count()).toBe(50);
    // shaft-diameter: every model is rejected (the gauge's resolution ties the values), so there is no
    // table of passing models and the rejected ones are shown open as what each would say, not an answer
    const captions = await block.locator('caption').allTextContents();
    expect(captions.some((c) => /each model that passes the tests/.test(c))).toBe(false);
    expect(captions.some((c) => /here every one/.test(c))).toBe(true);
    await expect(block.locator('.block-answer').textContent()).resolves.toMatch(/^No model passes the tests/);
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('#export-html')]);
    const file = join(OUT, 'report-capability-section.html');
    await download.saveAs(file);
    const html = readFileSync(file, 'utf8');
    expect(html).toContain('Can it meet the tolerance?');
    expect(html).toMatch(/Models the tests reject — here every one/);
    // The page redraws the decision area shortly after a layout change; scroll to the block once it is
    // settled (a few tries), for the screenshot only.
    for (let tries = 0; tries < 8; tries++) {
      try {
        await block.scrollIntoViewIfNeeded({ timeout: 2000 });
        break;
      } catch {
        await page.waitForTimeout(300);
      }
    }
    await page.screenshot({ path: join(OUT, 'capability-section-1366x768.png') });
    expect(problems).toEqual([]);
  });
});

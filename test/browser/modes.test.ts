/**
 * Several failure modes on the page: the seal demo (datasets/README.md: invented pump seals, 32
 * leaks, 17 cracks, 71 removed unfailed) opens with its status and failure-mode columns
 * (server/demo.ts), the answer states the whole unit's B10 with each mode's, the "Failure modes"
 * section shows each mode's B10 and the reliability chart, the exported report carries it; nothing
 * is wider than the window at 1366 and 800 px; another demo and back leaves nothing stale, and
 * clearing the mode role takes the section away. The numbers are the core's (checked against SciPy
 * in test/server/modes.test.ts). Screenshots into test-output/ (git-ignored).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { SKIP_BROWSER } from './server-process.js';
import { OUT, openSession, waitForStatus, type BrowserSession } from './session.js';

// test/fixtures/life-modes.json (scripts/fixtures/life-modes.py, SciPy): whole unit B10 2892.63 h, crack B10 3930.05 h (exponential), leak B10 4219.37 h (lognormal); printed to 4 significant digits.
const UNIT_B10 = '2893';
const CRACK_B10 = '3930';
const LEAK_B10 = '4219';

async function noSideScroll(page: Page): Promise<void> {
  const widths = await page.evaluate(() => ({ scroll: document.documentElement.scrollWidth, inner: window.innerWidth }));
  expect(widths.scroll, `page ${widths.scroll} px wide in a ${widths.inner} px window`).toBeLessThanOrEqual(widths.inner);
}

async function settleAndScroll(page: Page, selector: string): Promise<void> {
  // The page redraws the decision area shortly after a layout change; scroll once it is settled.
  for (let tries = 0; tries < 8; tries++) {
    try {
      await page.locator(selector).scrollIntoViewIfNeeded({ timeout: 2000 });
      return;
    } catch {
      await page.waitForTimeout(300);
    }
  }
}

async function openSeal(page: Page): Promise<void> {
  await page.click('#demo-list button[data-name="seal-failure-modes"]');
  await waitForStatus(page, /^Done: .* 120 values of hours/, 200_000);
  await page.locator('[data-block="modes"]').waitFor();
}

describe.skipIf(SKIP_BROWSER)('several failure modes on the page', () => {
  let session: BrowserSession;
  let page: Page;
  const problems: string[] = [];

  beforeAll(async () => {
    session = await openSession({ problems, acceptDownloads: true, open: true });
    page = session.page;
    await waitForStatus(page, /^Done: /, 120_000); // the opening demo
  }, 180_000);

  afterAll(async () => {
    await session?.close();
  });

  it('the seal demo opens analysed by modes: the role, the answer, the section with each mode’s B10, the chart, the report', { timeout: 300_000 }, async () => {
    await openSeal(page);
    // The failure-mode column is a column role set by the demo.
    expect(await page.locator('#mode-select option:checked').textContent()).toMatch(/mode/);
    const answer = (await page.locator('#headline').textContent()) ?? '';
    expect(answer).toContain(`B10 life of the whole unit, the 2 failure modes together: ${UNIT_B10} h`);
    expect(answer).toContain(`crack ${CRACK_B10}`);
    expect(answer).toContain(`leak ${LEAK_B10}`);
    expect(answer).toContain('The crack mode limits life at 10 % failed');
    const block = page.locator('[data-block="modes"]');
    expect(await block.isVisible()).toBe(true);
    const text = (await block.textContent()) ?? '';
    expect(text).toContain('Failure modes: which one limits life');
    expect(text).toMatch(new RegExp(`crack: B10Exponential17${CRACK_B10}`));
    expect(text).toMatch(new RegExp(`leak: B10Lognormal32${LEAK_B10}`));
    // Bounds of the whole unit's B10 where the core gives them, else "no bound" (views/modes.ts unitBounds).
    expect(text).toMatch(new RegExp(`whole unit: B10product of the modes49${UNIT_B10}(no boundno bound|\\d+\\d+)`));
    expect(text).toMatch(/two-sided bounds: per mode by likelihood ratio; for the whole unit by likelihood ratio over every mode's parameters at once/);
    expect(text).toMatch(/governing maintenance and safety practice/);
    const chart = block.locator('svg[role="img"]');
    await chart.first().waitFor();
    expect(await chart.first().locator('path[data-kind="system-curve"]').count()).toBe(1);
    expect(await chart.first().locator('path[data-kind="mode-curve"]').count()).toBe(2);
    expect(await chart.first().locator('circle[data-kind="system-blife"]').count()).toBe(2); // B10 and B50
    await noSideScroll(page);
    await settleAndScroll(page, '[data-block="modes"]');
    await page.screenshot({ path: join(OUT, 'modes-1366x768.png') });
    await page.locator('#headline').scrollIntoViewIfNeeded();
    await page.screenshot({ path: join(OUT, 'modes-answer-1366x768.png') });
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('#export-html')]);
    const file = join(OUT, 'report-modes.html');
    await download.saveAs(file);
    const html = readFileSync(file, 'utf8');
    expect(html).toContain('data-block="modes"');
    expect(html).toContain('<th>whole unit: B10</th>');
    expect(html).toContain(`B10 life of the whole unit, the 2 failure modes together: ${UNIT_B10} h`);
    expect(html).toContain('data-kind="system-curve"');
    expect(problems).toEqual([]);
  });

  it('another demo and back: nothing stale; clearing the mode role takes the section away and says so, with a button that applies it again', { timeout: 400_000 }, async () => {
    await page.click('#demo-list button[data-name="bearing-life"]');
    await waitForStatus(page, /^Done: .* 30 values of hours/, 200_000);
    expect(await page.locator('[data-block="modes"]').count()).toBe(0);
    const bearing = (await page.locator('#headline').textContent()) ?? '';
    expect(bearing).toMatch(/^Decision number: B10 life under /);
    expect(bearing).not.toContain('whole unit');
    expect(await page.locator('#mode-select').inputValue()).toBe('0');
    await openSeal(page);
    expect((await page.locator('#headline').textContent()) ?? '').toContain(`B10 life of the whole unit, the 2 failure modes together: ${UNIT_B10} h`);
    expect(await page.locator('[data-block="modes"]').count()).toBe(1);
    // The role cleared: the same seals read as one failure mode, the pooled answer comes back.
    await page.selectOption('#mode-select', '0');
    await page.waitForFunction(() => document.querySelector('[data-block="modes"]') === null, undefined, { timeout: 200_000 });
    await waitForStatus(page, /^Done: .* 120 values of hours/, 200_000);
    const pooled = (await page.locator('#headline').textContent()) ?? '';
    expect(pooled).toMatch(/^Decision number: B10 life under /);
    expect(pooled).not.toContain(UNIT_B10);
    // The column left unused is said beside the answer and beside the data, with a button that applies it.
    const said = (await page.locator('#answer-cautions').textContent()) ?? '';
    expect(said).toContain('Column “mode” may name the failure mode of each failed unit, but every failure is fitted here as one mode');
    expect((await page.locator('#column-note').textContent()) ?? '').toContain('which may name the failure mode of each failed unit');
    await page.locator('#answer-cautions button.use-mode').click();
    await page.locator('[data-block="modes"]').waitFor({ timeout: 200_000 });
    await waitForStatus(page, /^Done: .* 120 values of hours/, 200_000);
    expect((await page.locator('#headline').textContent()) ?? '').toContain(`B10 life of the whole unit, the 2 failure modes together: ${UNIT_B10} h`);
    expect(await page.locator('#answer-cautions button.use-mode').count()).toBe(0);
    expect(await page.locator('#column-note').isHidden()).toBe(true);
    expect(problems).toEqual([]);
  });

  it('at 800 px: nothing wider than the window, the section and its B10 rows readable', { timeout: 300_000 }, async () => {
    await page.setViewportSize({ width: 800, height: 900 });
    await openSeal(page);
    await page.waitForTimeout(600); // the decision area redraws its charts at the new width
    await noSideScroll(page);
    const block = page.locator('[data-block="modes"]');
    expect(await block.isVisible()).toBe(true);
    const text = (await block.textContent()) ?? '';
    expect(text).toContain(`crack: B10`);
    expect(text).toContain(CRACK_B10);
    await settleAndScroll(page, '[data-block="modes"]');
    await page.screenshot({ path: join(OUT, 'modes-800.png') });
    await settleAndScroll(page, '[data-block="modes"] svg[role="img"]');
    await page.screenshot({ path: join(OUT, 'modes-chart-800.png') });
    await noSideScroll(page);
    expect(problems).toEqual([]);
  });
});

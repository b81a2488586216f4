/**
 * Life data as recorded on the page: the recorded-life section on the opening bearing demo (the
 * Weibull mixture ranked beside the single models with the estimator named, the Turnbull boxes and
 * their chart),
 * the test-planning calculator (n = ln(1 - C)/ln R: R = C = 0.9 → 22 units; R = 0.95 → 45), and the
 * section in the exported report. Screenshots into test-output/ (git-ignored).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { SKIP_BROWSER } from './server-process.js';
import { OUT, openSession, waitForStatus, type BrowserSession } from './session.js';

describe.skipIf(SKIP_BROWSER)('life data as recorded on the page', () => {
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

  it('the bearing demo shows the recorded-life section; the exported report carries it', { timeout: 240_000 }, async () => {
    await waitForStatus(page, /^Done: .* 30 (values|units)/, 120_000); // the bearing demo: 30 units (datasets/README.md)
    const block = page.locator('[data-block="life-recorded"]');
    await block.waitFor();
    const text = (await block.textContent()) ?? '';
    expect(text).toContain('Life: other estimators, subpopulations and few failures');
    expect(text).toMatch(/Weibull mixture/);
    expect(text).toMatch(/maximum likelihood/);
    expect(text).toMatch(/licensed practice/);
    // The Turnbull chart slot: boxes where the failures are known to lie, the selected model's line.
    const chart = block.locator('svg[role="img"]');
    await chart.first().waitFor();
    expect(await chart.first().locator('rect[data-kind="box"]').count()).toBeGreaterThan(5);
    expect(await chart.first().locator('path[data-kind="curve"]').count()).toBe(1);
    // The page redraws the decision area shortly after a layout change (a chart drawn at its box's
    // width); scroll once it is settled (a few tries), for the screenshot only.
    for (let tries = 0; tries < 8; tries++) {
      try {
        await block.scrollIntoViewIfNeeded({ timeout: 2000 });
        break;
      } catch {
        await page.waitForTimeout(300);
      }
    }
    await page.screenshot({ path: join(OUT, 'life-recorded-1366x768.png') });
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('#export-html')]);
    const file = join(OUT, 'report-life-recorded.html');
    await download.saveAs(file);
    const html = readFileSync(file, 'utf8');
    expect(html).toContain('data-block="life-recorded"');
    expect(html).toContain('Turnbull');
    expect(html).toContain('Where the failures are known to lie');
  });

  it('the test-planning calculator answers and follows its fields', { timeout: 60_000 }, async () => {
    const calc = page.locator('#plan-calculator');
    await calc.scrollIntoViewIfNeeded();
    await expect(calc.locator('.block-answer').textContent()).resolves.toMatch(/test 22 units for 1000 each/);
    await page.fill('#plan-reliability', '0.95');
    await expect(calc.locator('.block-answer').textContent()).resolves.toMatch(/test 45 units/);
    await page.fill('#plan-shape', '');
    await expect(calc.locator('[role="alert"]').textContent()).resolves.toMatch(/assumed shape must be > 0/);
    await page.fill('#plan-shape', '2');
    await page.screenshot({ path: join(OUT, 'life-plan-1366x768.png') });
    expect(problems).toEqual([]);
  });

  it('the valve inspection demo (interval rows through the API): the goodness-of-fit table by the inspection-scheme bootstrap and the Turnbull chart', { timeout: 240_000 }, async () => {
    await page.click('#demo-list button[data-name="valve-inspections"]');
    await waitForStatus(page, /^Done: .*units found at inspections/, 200_000);
    const block = page.locator('[data-block="life-recorded"]');
    await block.waitFor();
    const text = (await block.textContent()) ?? '';
    expect(text).toMatch(/Does each model fit\? Anderson–Darling on the nonparametric estimate/);
    // datasets/README.md: the valve lives are Weibull; the exponential is rejected (p ≤ 0.05 in test/life/interval-gof.test.ts).
    expect(text).toMatch(/Exponential[^]*rejected: the data contradict it/);
    // the mixture is not fitted to interval rows, and the note names it by its label
    expect(text).toMatch(/The Weibull mixture \(two subpopulations\) not fitted: /);
    expect(await block.locator('svg[role="img"] rect[data-kind="box"]').count()).toBeGreaterThan(5);
    await page.screenshot({ path: join(OUT, 'life-recorded-valves-1366x768.png') });
    expect(problems).toEqual([]);
  });
});

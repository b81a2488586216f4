/**
 * Flood work on the page: the invented river-peaks demo (datasets/README.md) with "expected
 * moments" chosen and a regional skew with its mean square error typed in. The section of the
 * estimators beside maximum likelihood shows log-Pearson III by the expected moments algorithm
 * (the weighted skew, the low-outlier decision, flows with intervals), the L-moment fits and the
 * L-moment ratio diagram, with the design-flood cautions; then L-moments alone; at 1366 and
 * 800 px wide (nothing wider than the window); the exported report carries the section.
 * Then peaks over a threshold on the invented daily-flows demo (date column role, threshold, the
 * generalized Pareto levels per year, both threshold-diagnostics charts, cautions) at 1366 and 800 px.
 * Screenshots into test-output/ (git-ignored).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { SKIP_BROWSER } from './server-process.js';
import { OUT, openSession, waitForStatus, type BrowserSession } from './session.js';

describe.skipIf(SKIP_BROWSER)('flood estimators on the page', () => {
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

  const block = () => page.locator('[data-block="flood-estimators"]');

  /** Scroll the block into view once the decision area has settled (it redraws after layout changes). */
  async function showBlock(): Promise<void> {
    for (let tries = 0; tries < 8; tries++) {
      try {
        await block().scrollIntoViewIfNeeded({ timeout: 2000 });
        return;
      } catch {
        await page.waitForTimeout(300);
      }
    }
  }

  async function setField(id: string, value: string): Promise<void> {
    // Secondary fields sit folded under "More settings": open their disclosure first.
    await page.evaluate((i) => document.getElementById(i)?.closest('details')?.setAttribute('open', ''), id);
    const tag = await page.locator(`#${id}`).evaluate((n) => n.tagName);
    if (tag === 'SELECT') await page.selectOption(`#${id}`, value);
    else {
      await page.fill(`#${id}`, value);
      await page.locator(`#${id}`).dispatchEvent('change');
    }
  }

  it('river peaks by expected moments with a regional skew: EMA levels, L-moment fits, ratio diagram, cautions (1366 and 800 px)', { timeout: 300_000 }, async () => {
    await waitForStatus(page, /^Done: /, 120_000);
    await page.click('#demo-list button[data-name="river-peaks"]');
    await waitForStatus(page, /^Done: .* 60 values/, 120_000);
    await page.waitForSelector('[data-block="flood"]');
    await setField('regional-skew-mse-input', '0.12');
    await setField('regional-skew-input', '-0.1');
    await setField('estimation-select', 'ema');
    await page.waitForFunction(() => /regional −0\.1 \(MSE 0\.12\)/.test(document.querySelector('[data-block="flood-estimators"]')?.textContent ?? ''), undefined, { timeout: 120_000 });
    const text = (await block().textContent()) ?? '';
    // The answer first: the EMA 100... here the largest period of the demo (200 years), with its interval.
    expect(text).toMatch(/200-year flow by log-Pearson III \(expected moments\): [\d.]+ m³\/s, 90 % interval [\d.]+ to [\d.]+/);
    expect(text).toMatch(/Skew weighted by mean square errors: station 0\.548/);
    expect(text).toMatch(/Low outliers: none found/);
    // The EMA interval (after Cohn, Lane & Stedinger 2001) with its equivalent years and the bootstrap beside it;
    // the skew's effective record length is the record's 60 years (no censored year).
    expect(text).toMatch(/Cohn, Lane & Stedinger \(2001\)/);
    expect(text).toMatch(/Equivalent years/);
    expect(text).toMatch(/Bootstrap interval/);
    expect(text).toMatch(/Effective record length of the skew: 60 years of the 60/);
    expect(text).toMatch(/parametric bootstrap of the EMA, percentile interval \(\d+ replicates\)/);
    expect(text).toMatch(/Fits by L-moments/);
    expect(text).toMatch(/generalized logistic/);
    expect(text).toMatch(/governing agency/);
    expect(text).toMatch(/licensed engineer or hydrologist/);
    // The ratio diagram: the sample's point, four family curves and the bound, four family points.
    // Two charts: the EMA levels on the return-period plot, and the ratio diagram.
    const charts = block().locator('svg[role="img"]');
    await charts.nth(1).waitFor();
    expect(await charts.count()).toBe(2);
    expect(await charts.nth(0).locator('path[data-kind="curve"][data-family="logpearson3"]').count()).toBe(1);
    const chart = charts.filter({ hasText: 'L-moment ratios' });
    expect(await chart.locator('circle[data-kind="sample"]').count()).toBe(1);
    expect(await chart.locator('path[data-kind="curve"]').count()).toBe(5);
    expect(await chart.locator('rect[data-kind="family-point"]').count()).toBe(4);
    await showBlock();
    await page.screenshot({ path: join(OUT, 'flood-estimators-1366x768.png') });

    await block().locator('table').first().scrollIntoViewIfNeeded();
    await page.screenshot({ path: join(OUT, 'flood-estimators-ema-table-1366x768.png') });

    await page.setViewportSize({ width: 800, height: 900 });
    await page.waitForTimeout(600);
    await showBlock();
    await page.screenshot({ path: join(OUT, 'flood-estimators-800x900.png') });
    await block().locator('table').first().scrollIntoViewIfNeeded();
    await page.screenshot({ path: join(OUT, 'flood-estimators-ema-table-800x900.png') });
    const wide = await page.evaluate(() => {
      const b = document.querySelector('[data-block="flood-estimators"]') as HTMLElement;
      const svg = b.querySelector('svg') as SVGSVGElement;
      return { page: document.documentElement.scrollWidth, window: window.innerWidth, block: b.getBoundingClientRect().right, svg: svg.getBoundingClientRect().right };
    });
    expect(wide.page).toBeLessThanOrEqual(wide.window);
    expect(wide.block).toBeLessThanOrEqual(wide.window);
    expect(wide.svg).toBeLessThanOrEqual(wide.window);
    await page.setViewportSize({ width: 1366, height: 768 });
    await page.waitForTimeout(400);

    const [download] = await Promise.all([page.waitForEvent('download'), page.click('#export-html')]);
    const file = join(OUT, 'report-flood-estimators.html');
    await download.saveAs(file);
    const html = readFileSync(file, 'utf8');
    expect(html).toContain('data-block="flood-estimators"');
    expect(html).toContain('L-moment ratios');
    expect(html).toMatch(/licensed engineer or hydrologist/);
    expect(html).toMatch(/Cohn, Lane &amp; Stedinger \(2001\)|Cohn, Lane & Stedinger \(2001\)/);
    expect(html).toContain('Equivalent years');
  });

  it('L-moments alone: the five fits as point estimates, no EMA table', { timeout: 200_000 }, async () => {
    await setField('regional-skew-input', '');
    await setField('regional-skew-mse-input', '');
    await setField('estimation-select', 'lmoments');
    await page.waitForFunction(() => /Flood levels by L-moments/.test(document.querySelector('[data-block="flood-estimators"]')?.textContent ?? ''), undefined, { timeout: 120_000 });
    const text = (await block().textContent()) ?? '';
    expect(text).toMatch(/200-year level by L-moment fits: [\d.]+ m³\/s to [\d.]+ m³\/s across the 5 families \(point estimates, no intervals\)/);
    expect(text).not.toMatch(/expected moments:/);
    await showBlock();
    await page.screenshot({ path: join(OUT, 'flood-lmoments-1366x768.png') });
    expect(problems).toEqual([]);
  });

  it('peaks over a threshold on the daily-flows demo: date column, threshold, events, levels per year with intervals, both diagnostics charts, cautions (1366 and 800 px)', { timeout: 300_000 }, async () => {
    const pot = page.locator('[data-block="pot"]');
    // The opening demo must have finished first, or its late result replaces this one.
    await waitForStatus(page, /^Done: /, 120_000);
    await page.click('#demo-list button[data-name="river-daily-flows"]');
    await page.waitForFunction(() => /Peaks over a threshold/.test(document.querySelector('[data-block="pot"]')?.textContent ?? ''), undefined, { timeout: 120_000 });
    const text = (await pot.textContent()) ?? '';
    expect(text).toMatch(/100-year level from the events above 140 m³\/s: [\d.]+ m³\/s by maximum likelihood, 90 % interval [\d.]+ to [\d.]+/);
    expect(text).toMatch(/event peaks in 25 years/);
    expect(text).toMatch(/Generalized Pareto excesses by L-moments/);
    expect(text).toMatch(/governing agency/);
    expect(text).toMatch(/licensed engineer or hydrologist/);
    const charts = pot.locator('svg[role="img"]');
    await charts.nth(1).waitFor();
    expect(await charts.count()).toBe(2);
    expect(await charts.nth(0).locator('circle[data-kind="point"]').count()).toBe(15);
    expect(await charts.nth(1).locator('line[data-kind="chosen"]').count()).toBe(1);
    // The date column is a column role of the data card; a changed threshold re-runs.
    expect(await page.locator('#date-select').inputValue()).not.toBe('0');
    await setField('threshold-input', '160');
    await page.waitForFunction(() => /events above 160 m³\/s/.test(document.querySelector('[data-block="pot"]')?.textContent ?? ''), undefined, { timeout: 120_000 });
    await pot.scrollIntoViewIfNeeded();
    await page.screenshot({ path: join(OUT, 'flood-pot-1366x768.png') });
    await page.screenshot({ path: join(OUT, 'flood-pot-full-1366.png'), fullPage: true });
    await page.setViewportSize({ width: 800, height: 900 });
    await page.waitForTimeout(600);
    await page.waitForSelector('[data-block="pot"] svg');
    await pot.scrollIntoViewIfNeeded();
    await page.screenshot({ path: join(OUT, 'flood-pot-800x900.png') });
    await page.waitForSelector('[data-block="pot"] svg');
    const wide = await page.evaluate(() => {
      const b = document.querySelector('[data-block="pot"]') as HTMLElement;
      const svg = b.querySelector('svg') as SVGSVGElement;
      return { page: document.documentElement.scrollWidth, window: window.innerWidth, block: b.getBoundingClientRect().right, svg: svg.getBoundingClientRect().right };
    });
    expect(wide.page).toBeLessThanOrEqual(wide.window);
    expect(wide.block).toBeLessThanOrEqual(wide.window);
    expect(wide.svg).toBeLessThanOrEqual(wide.window);
    await page.setViewportSize({ width: 1366, height: 768 });
    expect(problems).toEqual([]);
  });
});

/**
 * The trade workflows in a real browser (issue 4): for each demo, open it, see its decision
 * section, change one setting, export the HTML report and find the section there. Screenshots at
 * 1366×768 and 1920×1080 into test-output/ (git-ignored).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { SKIP_BROWSER } from './server-process.js';
import { OUT, openSession, waitForStatus, type BrowserSession } from './session.js';

describe.skipIf(SKIP_BROWSER)('trade workflows on the page', () => {
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

  async function exportReport(name: string): Promise<string> {
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('#export-html')]);
    const file = join(OUT, name);
    await download.saveAs(file);
    return readFileSync(file, 'utf8');
  }

  async function shots(name: string): Promise<void> {
    await page.locator('#decision').scrollIntoViewIfNeeded();
    await page.screenshot({ path: join(OUT, `${name}-1366x768.png`) });
    await page.setViewportSize({ width: 1920, height: 1080 });
    await page.waitForTimeout(400);
    await page.locator('#decision').scrollIntoViewIfNeeded();
    await page.screenshot({ path: join(OUT, `${name}-1920x1080.png`) });
    await page.screenshot({ path: join(OUT, `${name}-1920-full.png`), fullPage: true });
    await page.setViewportSize({ width: 1366, height: 768 });
    await page.waitForTimeout(300);
  }

  it('opens on the bearing life test with its status column applied and B10 shown; B-life percents change; the report has the life section', { timeout: 240_000 }, async () => {
    await waitDone(/^Done: .* 30 values/);
    await page.waitForSelector('[data-block="life"]');
    // datasets/README.md: 22 failed, 8 censored.
    await expect(page.locator('[data-block="life"]').textContent()).resolves.toMatch(/30 units on test: 22 failed, 8 suspended/);
    await expect(page.locator('[data-block="life"] table').first().textContent()).resolves.toContain('B10');
    expect(await page.locator('#status-select').inputValue()).toBe('3');
    // The first decision number is stated above the table, with its bounds.
    await expect(page.locator('#headline').textContent()).resolves.toMatch(/B10 life under Weibull: [\d.]+ h \(two-sided 90 % bounds/);
    await expect(page.locator('#demo-settings').textContent()).resolves.toMatch(/^Demo settings: /);
    expect(await page.locator('[data-slot="life-probability"] circle[data-kind="point"]').count()).toBe(22);
    await page.screenshot({ path: join(OUT, 'life-open-1366x768.png') });
    await page.fill('#blife-input', '1, 10');
    await page.dispatchEvent('#blife-input', 'change');
    await page.waitForFunction(() => [...document.querySelectorAll('[data-block="life"] table th[scope="row"]')].map((t) => t.textContent).join(',') === 'B1,B10', undefined, { timeout: 60_000 });
    await page.selectOption('#life-scale-select', 'lognormal');
    await expect(page.locator('[data-slot="life-probability"] svg > text').first().textContent()).resolves.toMatch(/lognormal/);
    const html = await exportReport('report-life.html');
    expect(html).toContain('data-block="life"');
    expect(html).toContain('B1</th>');
    expect(html).toMatch(/Caution: /);
    expect(html).not.toMatch(/<script/i);
    await shots('life');
  });

  it('river peaks: return levels with intervals, plotting position selector, GEV sign note; the report has the flood section', { timeout: 240_000 }, async () => {
    await page.click('#demo-list button[data-name="river-peaks"]');
    await waitDone(/^Done: .* 60 values/);
    await page.waitForSelector('[data-block="flood"]');
    const text = (await page.locator('[data-block="flood"]').textContent()) ?? '';
    expect(text).toMatch(/ξ > 0/);
    expect(text).toMatch(/Chance in 50 years/);
    expect(text).toMatch(/far beyond/);
    await expect(page.locator('[data-block="trend"]').textContent()).resolves.toMatch(/Mann–Kendall/);
    await page.selectOption('#plotpos-select', 'cunnane');
    await page.waitForFunction(() => /Cunnane/i.test(document.querySelector('[data-block="flood"]')?.textContent ?? ''), undefined, { timeout: 120_000 });
    const html = await exportReport('report-flood.html');
    expect(html).toContain('data-block="flood"');
    expect(html).toContain('data-block="sensitivity"');
    await shots('flood');
  });

  it('shaft diameter: spec limits, indices with intervals, normality gate and resolution warning; changing USL reruns; the report has the capability section', { timeout: 240_000 }, async () => {
    await page.click('#demo-list button[data-name="shaft-diameter"]');
    await waitDone(/^Done: .* 125 values/);
    await page.waitForSelector('[data-block="capability"]');
    const text = (await page.locator('[data-block="capability"]').textContent()) ?? '';
    expect(text).toMatch(/Normality gate/);
    expect(text).toMatch(/Gauge resolution/);
    expect(text).toMatch(/Ppk/);
    expect(text).toMatch(/Cpk/);
    // LSL and USL edge their shaded out-of-tolerance regions; the target is its own dashed line.
    expect(await page.locator('[data-slot="capability-histogram"] line[data-kind="limit"]').count()).toBe(2);
    expect(await page.locator('[data-slot="capability-histogram"] [data-kind="out-of-spec"]').count()).toBe(2);
    expect(await page.locator('[data-slot="capability-histogram"] line[data-kind="target"]').count()).toBe(1);
    await page.fill('#usl-input', '25.012');
    await page.dispatchEvent('#usl-input', 'change');
    await page.waitForFunction(() => /USL 25\.012/.test(document.querySelector('[data-block="capability"]')?.textContent ?? ''), undefined, { timeout: 60_000 });
    const html = await exportReport('report-capability.html');
    expect(html).toContain('data-block="capability"');
    expect(html).toMatch(/lower confidence bound|lower bound/i);
    await shots('capability');
    expect(problems).toEqual([]);
  });
});

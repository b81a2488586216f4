/**
 * Layout in a real browser (Debian's Chromium via playwright-core): on every demo, every chart's
 * axis titles, tick labels, legend entries, chart title and notes keep clear of one another and
 * stay inside their chart (bounding boxes from getBoundingClientRect); the page never scrolls
 * sideways at 360, 800, 1366 and 1920 px (wide tables scroll inside their own box); at 1366×768
 * the answer (the headline) is on the first screen; the exported report, printed, fits A4 portrait
 * and opens with the answer. Screenshots at 800 and 1366 px and the report's PDF go to
 * test-output/ (git-ignored).
 */
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { SKIP_BROWSER } from './server-process.js';
import { collectBoxes, outside, overlaps } from './chart-boxes.js';
import { OUT, openSession, waitForStatus, type BrowserSession } from './session.js';

describe.skipIf(SKIP_BROWSER)('page layout in Chromium', () => {
  let session: BrowserSession;
  let page: Page;
  const problems: string[] = [];

  beforeAll(async () => {
    session = await openSession({ problems, open: true, acceptDownloads: true });
    ({ page } = session);
    // The opening censored demo runs its bootstrap; on a loaded machine that can take minutes.
    await waitForStatus(page, /^Done:/, 240_000);
  }, 300_000);

  afterAll(async () => {
    await session?.close();
  });

  async function demos(): Promise<string[]> {
    return page.locator('#demo-list button[data-name]').evaluateAll((els) => els.map((e) => e.getAttribute('data-name') ?? ''));
  }

  async function openDemo(name: string): Promise<void> {
    await page.click(`#demo-list button[data-name="${name}"]`);
    await page.waitForFunction((n) => document.querySelector(`#demo-list button[data-name="${n}"]`)?.getAttribute('aria-pressed') === 'true', name);
    await waitForStatus(page, /^Done:/, 180_000);
    await page.waitForTimeout(300);
  }

  async function checkCharts(where: string): Promise<number> {
    const charts = await page.evaluate(collectBoxes);
    const found: string[] = [];
    for (const c of charts) {
      for (const o of overlaps(c.boxes)) found.push(`${where}, "${c.title}": ${o}`);
      for (const o of outside(c.svg, c.boxes)) found.push(`${where}, "${c.title}": ${o}`);
    }
    expect(found, found.join('\n')).toEqual([]);
    return charts.length;
  }

  async function pageWidth(): Promise<{ scroll: number; inner: number }> {
    return page.evaluate(() => ({ scroll: document.documentElement.scrollWidth, inner: window.innerWidth }));
  }

  it('no axis title, tick label, legend entry or note overlaps another in any chart of any demo, at 1366 and 800 px', async () => {
    const names = await demos();
    expect(names.length).toBeGreaterThan(3);
    let charts = 0;
    for (const width of [1366, 800]) {
      await page.setViewportSize({ width, height: width === 1366 ? 768 : 900 });
      for (const name of names) {
        await openDemo(name);
        charts += await checkCharts(`${name} at ${width} px`);
      }
    }
    // Every demo draws several charts (the evidence, and decision charts where settings ask for them).
    expect(charts).toBeGreaterThan(names.length * 2 * 3);
  }, 600_000);

  it('never scrolls sideways at 360, 800, 1366 and 1920 px on any demo (wide tables scroll in their own box)', async () => {
    const names = await demos();
    for (const [width, height] of [[360, 740], [800, 900], [1366, 768], [1920, 1080]] as const) {
      await page.setViewportSize({ width, height });
      for (const name of names) {
        await openDemo(name);
        const w = await pageWidth();
        expect(w.scroll, `${name} at ${width} px: page is ${w.scroll} px wide`).toBeLessThanOrEqual(w.inner);
      }
    }
  }, 600_000);

  it('at 1366×768 the answer is on the first screen; screenshots at 800 and 1366 px', async () => {
    await page.setViewportSize({ width: 1366, height: 768 });
    const names = await demos();
    let seen = 0;
    for (const name of names) {
      await openDemo(name);
      const headline = page.locator('#headline');
      if (!(await headline.isVisible())) continue;
      seen++;
      const box = await headline.boundingBox();
      expect(box, `${name}: headline has a box`).not.toBeNull();
      expect(box!.y + Math.min(box!.height, 40), `${name}: headline top at ${box!.y}`).toBeLessThanOrEqual(768);
    }
    // The opening demos carry decision settings, so most have a headline (at least the first).
    expect(seen).toBeGreaterThan(0);
    await openDemo(names[0]!);
    await page.evaluate(() => window.scrollTo(0, 0));
    await page.screenshot({ path: join(OUT, 'layout-1366x768.png') });
    await page.screenshot({ path: join(OUT, 'layout-1366-full.png'), fullPage: true });
    await page.setViewportSize({ width: 800, height: 900 });
    await openDemo(names[0]!);
    await page.evaluate(() => window.scrollTo(0, 0));
    await page.screenshot({ path: join(OUT, 'layout-800x900.png') });
    await page.screenshot({ path: join(OUT, 'layout-800-full.png'), fullPage: true });
    await page.setViewportSize({ width: 360, height: 740 });
    await page.screenshot({ path: join(OUT, 'layout-360-full.png'), fullPage: true });
    expect(problems).toEqual([]);
  }, 300_000);

  it('the censored demo (bearing life: 22 failures, 8 suspensions at 2500 h) shows its suspensions and bins nothing', async () => {
    await page.setViewportSize({ width: 1366, height: 768 });
    await openDemo('bearing-life');
    const seen = await page.evaluate(() => {
      const svgs = [...document.querySelectorAll('svg[role="img"]')];
      const by = (re: RegExp) => svgs.find((s) => re.test(s.querySelector('title')?.textContent ?? ''));
      const prob = by(/points stay on the .* line/);
      const cdf = by(/Kaplan–Meier step/);
      const hist = by(/failures and suspensions fall/);
      const bins = by(/not applicable \(censored\)/);
      const steps = cdf?.querySelector('path[data-kind="ecdf"]')?.getAttribute('d') ?? '';
      const vs = [...steps.matchAll(/V(-?[\d.]+)/g)].map((m) => Number(m[1]));
      return {
        points: prob?.querySelectorAll('circle[data-kind="point"]').length ?? -1,
        suspensionMarks: prob?.querySelector('[data-kind="suspension-marks"]') !== null && prob !== undefined,
        cdfSuspensions: cdf?.querySelector('path[data-kind="suspension"]') !== null && cdf !== undefined,
        topOfStep: vs.length > 0 ? Math.min(...vs) : -1,
        bars: hist?.querySelectorAll('rect[data-kind="bar"]').length ?? -1,
        binsChart: bins !== undefined,
      };
    });
    // Failures only on the probability plot; the 8 suspensions marked by time, never as points.
    expect(seen.points).toBe(22);
    expect(seen.suspensionMarks).toBe(true);
    expect(seen.cdfSuspensions).toBe(true);
    // The Kaplan–Meier step stops below 100 % (y = 0 is the top of the plot): the largest times are suspensions.
    expect(seen.topOfStep).toBeGreaterThan(0);
    expect(seen.bars).toBe(0);
    expect(seen.binsChart).toBe(true);
  }, 120_000);

  it('the exported report of every demo printed on A4 portrait: nothing wider than the page, the answer first and on the first page', async () => {
    await page.setViewportSize({ width: 1366, height: 768 });
    const report = await page.context().newPage();
    // A4 is 210 × 297 mm; less the report's @page margins (12 mm sides, 14 mm top and bottom) the
    // content box is 186 × 269 mm = 703 × 1016 CSS px at 96 px per inch (CSS Values 4, absolute lengths).
    await report.setViewportSize({ width: 703, height: 1016 });
    for (const name of await demos()) {
      await openDemo(name);
      const [download] = await Promise.all([page.waitForEvent('download'), page.click('#export-html')]);
      const file = join(OUT, `layout-report-${name}.html`);
      await download.saveAs(file);
      await report.goto(pathToFileURL(file).href);
      await report.emulateMedia({ media: 'print' });
      const fit = await report.evaluate(() => {
        const wide = [...document.querySelectorAll('body *')]
          .filter((el) => el.closest('svg') === null || el.tagName.toLowerCase() === 'svg')
          .filter((el) => el.getBoundingClientRect().right > window.innerWidth + 0.5)
          .map((el) => `${el.tagName.toLowerCase()}.${el.getAttribute('class') ?? ''} right=${Math.round(el.getBoundingClientRect().right)}`);
        return { scroll: document.documentElement.scrollWidth, wide: wide.slice(0, 10) };
      });
      expect(fit.wide, `${name}: ${fit.wide.join('\n')}`).toEqual([]);
      expect(fit.scroll, name).toBeLessThanOrEqual(703);
      const heads = await report.locator('h2').allTextContents();
      expect(heads[0], name).toBe('The answer');
      const answer = await report.locator('.answer').boundingBox();
      expect(answer, name).not.toBeNull();
      expect(answer!.y + answer!.height, name).toBeLessThanOrEqual(1016);
      if (name === 'bearing-life') {
        expect(await report.locator('.answer').textContent()).toMatch(/B10 life/);
        const pdf = await report.pdf({ path: join(OUT, 'layout-report.pdf'), format: 'A4' });
        expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
      }
    }
    await report.close();
  }, 600_000);
});

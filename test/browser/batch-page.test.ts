/**
 * The many-series page in Chromium: a long table of 10,000 series (invented for this UI test,
 * seeded; not reference data) is split, analysed on Web Workers and summarised without freezing:
 * the headline counts every series, the table keeps only a window of rows in the document while
 * scrolling, filters narrow it, the chart is thinned, a row opens its series in the full view, and
 * nothing overflows at 800 and 1366 px. Screenshots in test-output/.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { createRng } from '../../core/index.js';
import { OUT, openSession, type BrowserSession } from './session.js';

const SERIES = 10_000;
const PER = 12;
let session: BrowserSession;
const problems: string[] = [];
let file = '';

beforeAll(async () => {
  session = await openSession({ problems });
  const rng = createRng(20261204);
  const lines = ['gauge,peak'];
  for (let s = 0; s < SERIES; s++) {
    const bad = s === 17; // one series with a cell that is not a number
    for (let i = 0; i < PER; i++) lines.push(`G${s},${bad && i === 3 ? 'n/a?' : (50 + 10 * s / SERIES + 12 * rng.gamma(3)).toFixed(3)}`);
  }
  file = join(OUT, 'many-series.csv');
  writeFileSync(file, `${lines.join('\n')}\n`);
}, 120_000);

afterAll(async () => {
  await session?.close();
});

describe('the many-series page', () => {
  it('analyses 10,000 series on workers and shows a summary that stays light', async () => {
    const { page, server } = session;
    await page.goto(`${server.url}batch.html`);
    await page.setInputFiles('#b-file', file);
    await page.waitForSelector('#b-layout:not([hidden])', { timeout: 60_000 });
    await page.selectOption('#b-key', '1');
    await page.selectOption('#b-value', '2');
    await page.click('#b-run');
    // While it runs, the page answers (the main thread is not blocked).
    await page.waitForFunction(() => Number((document.getElementById('b-progress') as HTMLProgressElement).value) > 0, undefined, { timeout: 60_000 });
    const responsive = await page.evaluate(() => new Promise<number>((r) => { const t = performance.now(); setTimeout(() => r(performance.now() - t), 0); }));
    expect(responsive).toBeLessThan(500);
    await page.waitForSelector('#b-result:not([hidden])', { timeout: 400_000 });
    const headline = await page.textContent('#b-headline');
    expect(headline).toMatch(/^10000 series/);
    expect(headline).toMatch(/1 could not be analysed/);
    // Virtualised: only a window of rows is in the document.
    const rowsInDom = await page.$$eval('#b-table tbody tr:not(.spacer)', (r) => r.length);
    expect(rowsInDom).toBeGreaterThan(5);
    expect(rowsInDom).toBeLessThan(80);
    await page.$eval('.series-scroll', (s) => { s.scrollTop = 150_000; s.dispatchEvent(new Event('scroll')); });
    await page.waitForTimeout(200);
    const firstShown = await page.$eval('#b-table tbody tr:not(.spacer) th', (th) => th.textContent);
    expect(firstShown).not.toBe('G0');
    // No number was asked for: no empty chart.
    expect(await page.isHidden('#b-chart')).toBe(true);
    // The error filter finds the bad series, with row, column and value in its message.
    await page.selectOption('#b-f-verdict', 'errors');
    await expect.poll(() => page.textContent('#b-shown')).toMatch(/^1 of 10000/);
    const err = await page.textContent('#b-table tbody td.err');
    expect(err).toMatch(/series "G17": row \d+, column "peak": "n\/a\?"/);
    await page.screenshot({ path: join(OUT, 'batch-1366.png'), fullPage: false });
    await page.setViewportSize({ width: 800, height: 900 });
    await page.selectOption('#b-f-verdict', 'all');
    expect(await page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth)).toBe(true);
    await page.screenshot({ path: join(OUT, 'batch-800.png'), fullPage: false });
    await page.setViewportSize({ width: 360, height: 800 });
    expect(await page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth)).toBe(true);
    await page.setViewportSize({ width: 1366, height: 768 });
    // Sorting by the number puts the largest first on a second click.
    await page.click('th button.sort:has-text("Decision number")');
    await page.click('th button.sort:has-text("Decision number")');
    const sortState = await page.getAttribute('th[aria-sort="descending"]', 'aria-sort');
    expect(sortState).toBe('descending');
    expect(problems).toEqual([]);
  }, 600_000);

  it('a return level per series: one mark per series with its interval, sorted', async () => {
    const { page } = session;
    const rng = createRng(7);
    const lines = ['gauge,peak'];
    for (let s = 0; s < 60; s++) for (let i = 0; i < 25; i++) lines.push(`R${s},${(100 + 30 * rng.gamma(2)).toFixed(2)}`);
    const small = join(OUT, 'sixty-gauges.csv');
    writeFileSync(small, `${lines.join('\n')}\n`);
    await page.goto(`${session.server.url}batch.html`);
    await page.setInputFiles('#b-file', small);
    await page.waitForSelector('#b-layout:not([hidden])', { timeout: 60_000 });
    await page.check('input[name="b-decision"][value="return"]');
    await page.fill('#b-period', '100');
    await page.click('#b-run');
    await page.waitForSelector('#b-result:not([hidden])', { timeout: 300_000 });
    expect(await page.$$eval('#b-chart circle', (c) => c.length)).toBe(60);
    expect(await page.$$eval('#b-chart [data-kind="marks"] line', (c) => c.length)).toBeGreaterThan(30);
    expect(await page.textContent('#b-chart')).toMatch(/return level T=100/);
    await page.screenshot({ path: join(OUT, 'batch-return-levels-1366.png'), fullPage: true });
    // Opening a series hands its values to the full view.
    await page.click('#b-table tbody tr:not(.spacer) button.open');
    await page.waitForURL(/index\.html#opened-series/, { timeout: 30_000 });
    // The full view analyses that series' own values, named after it.
    await page.waitForFunction(() => /series R\d+/.test(document.body.textContent ?? ''), undefined, { timeout: 120_000 });
    expect(problems).toEqual([]);
  }, 600_000);
});

/**
 * The hydrologist's run on the page (issue 12): the invented gauge's peak file (datasets/README.md:
 * 78 peaks 1888-2024, historic peaks, a peak known only below and one only above a value, low
 * outliers; demo regional skew −0.10 with MSE 0.12) opened as a demo. The data card says what it
 * read and offers no column roles; the flood-record section shows the make-up, every code with its
 * effect, the weighted skew, the low outliers, the return levels with intervals and their method and
 * the cautions, with the numbers the CLI's --json prints (cli/flood-ema.ts, same core path); the
 * exported HTML report carries the section; an own CSV loaded after it carries none of the gauge's
 * settings. At 1366 and 800 px; screenshots into test-output/.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { parseArgs, type AnalyzeArgs } from '../../cli/args.js';
import { runFloodEmaJson } from '../../cli/flood-ema.js';
import { sig } from '../../client/src/format.js';
import { SKIP_BROWSER } from './server-process.js';
import { OUT, openSession, waitForStatus, type BrowserSession } from './session.js';

const FILE = fileURLToPath(new URL('../../datasets/invented-gauge-peaks.txt', import.meta.url));

describe.skipIf(SKIP_BROWSER)('a peak file on the page', () => {
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

  const block = () => page.locator('[data-block="flood-record"]');

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

  it('the gauge demo: make-up, codes, weighted skew and the CLI\'s return levels; report; then an own CSV carries nothing', { timeout: 400_000 }, async () => {
    const cli = runFloodEmaJson(parseArgs(['analyze', FILE, '--estimation', 'ema', '--regional-skew', '-0.1', '--regional-skew-mse', '0.12']) as AnalyzeArgs).candidates[0]!;
    await waitForStatus(page, /^Done: /, 120_000);
    await page.click('#demo-list button[data-name="invented-gauge-peaks"]');
    await waitForStatus(page, /^Done: log-Pearson III by expected moments on the peak file: 78 peaks 1888-2024/, 200_000);
    expect(await page.locator('#peak-file-note').textContent()).toMatch(/peak file: 78 peaks 1888-2024; systematic record 1950-2024 \(75 peaks\); 3 historic peaks; 1 known only below and 1 only above a value; codes 2 ×7, 4 ×1, 6 ×24, 7 ×3, 8 ×1/);
    expect(await page.locator('#roles').isHidden()).toBe(true);
    // The codes field's "2,6" is not a decimal comma: no decimal-comma note for a peak file.
    expect(await page.locator('#decimal-note').isHidden()).toBe(true);
    await block().waitFor();
    const text = (await block().textContent()) ?? '';
    expect(text).toMatch(/Historical period from 1888: 3 historic peaks above the perception threshold/);
    expect(text).toMatch(/historic peak/);
    expect(text).toMatch(/censored: the peak lies in \(0, value\]/);
    const s = cli.skew;
    expect(text).toContain(`station ${sig(s.stationSkew, 3)} (MSE ${sig(s.stationSkewMse, 3)}) with weight ${sig(s.stationWeight, 3)}, regional ${sig(-0.1, 3)} (MSE ${sig(0.12, 3)}) with weight ${sig(s.regionalWeight, 3)}, giving ${sig(s.weightedSkew, 3)}`);
    expect(text).toContain(`mean ${sig(cli.parameters.mean, 5)}, standard deviation ${sig(cli.parameters.sd, 4)}, skew ${sig(cli.parameters.skew, 3)}`);
    expect(text).toMatch(new RegExp(`Low outliers: ${cli.lowOutliers.count} peaks below`));
    const rows = await block().locator('table').nth(1).locator('tbody tr').allTextContents();
    expect(rows.length).toBe(cli.returnLevels.length);
    cli.returnLevels.forEach((l, i) => {
      expect(rows[i]).toContain(sig(l.estimate));
      expect(rows[i]).toContain(`${sig(l.lower!)} to ${sig(l.upper!)}`);
    });
    expect(text).toMatch(/Cohn, Lane & Stedinger \(2001\)/);
    expect(text).toMatch(/governing agency/);
    expect(text).toMatch(/Bulletin 17C/);
    await showBlock();
    await page.screenshot({ path: join(OUT, 'flood-gauge-1366x768.png') });
    await page.setViewportSize({ width: 800, height: 1000 });
    await page.waitForTimeout(600);
    await showBlock();
    await page.screenshot({ path: join(OUT, 'flood-gauge-800x1000.png') });
    const wide = await page.evaluate(() => ({ page: document.documentElement.scrollWidth, window: window.innerWidth }));
    expect(wide.page).toBeLessThanOrEqual(wide.window);
    await page.setViewportSize({ width: 1366, height: 768 });

    const [download] = await Promise.all([page.waitForEvent('download'), page.click('#export-html')]);
    const file = join(OUT, 'report-flood-gauge.html');
    await download.saveAs(file);
    const html = readFileSync(file, 'utf8');
    expect(html).toContain('data-block="flood-record"');
    expect(html).toContain(sig(cli.returnLevels[cli.returnLevels.length - 1]!.estimate));
    expect(html).toMatch(/governing agency/);

    // An own CSV: nothing of the gauge's settings is carried.
    await page.setInputFiles('#file-input', { name: 'own.csv', mimeType: 'text/csv', buffer: Buffer.from('flow\n12\n15\n11\n19\n14\n13\n17\n16\n12\n18\n') });
    await waitForStatus(page, /^Done: .*10 values/, 120_000);
    expect(await page.locator('#peak-file-note').isHidden()).toBe(true);
    expect(await page.locator('#demo-settings').textContent()).toMatch(/Nothing is carried over/);
    expect(await page.locator('[data-block="flood-record"]').count()).toBe(0);
    for (const id of ['regional-skew-input', 'regional-skew-mse-input', 'periods-input']) {
      expect(await page.locator(`#${id}`).inputValue(), id).toBe('');
    }
    await page.screenshot({ path: join(OUT, 'flood-gauge-own-csv-1366x768.png') });
    expect(problems).toEqual([]);
  });
});

/**
 * Western Electric run rules drawn on the page's stability chart (issue 14): a file of our own with a
 * shift (test/client/invented-runs.ts, invented) shows one filled diamond per point that ends a run,
 * each titled with the rule in words (Western Electric Statistical Quality Control Handbook, 1956,
 * rules 2-4 as core/capability/run-rules.ts words them), a legend entry saying what the diamond means,
 * and no ring (no point is beyond a limit); the same data before the shift show none of it. The
 * chart's labels keep clear of one another at 1366 and 800 px. Screenshots of the chart at both
 * widths go to test-output/.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { individualsChart } from '../../core/capability/control-chart.js';
import { RUN_RULE_WORDS } from '../../core/capability/run-rules.js';
import { SHIFTED, STEADY, runCsv } from '../client/invented-runs.js';
import { collectBoxes, outside, overlaps } from './chart-boxes.js';
import { SKIP_BROWSER } from './server-process.js';
import { OUT, openSession, waitForStatus, type BrowserSession } from './session.js';

describe.skipIf(SKIP_BROWSER)('run rules on the stability chart, in Chromium', () => {
  let session: BrowserSession;
  let page: Page;
  const problems: string[] = [];

  beforeAll(async () => {
    session = await openSession({ problems, open: true, acceptDownloads: true });
    page = session.page;
    await waitForStatus(page, /^Done: /, 240_000);
  }, 300_000);

  afterAll(async () => {
    await session?.close();
  });

  const chart = () => page.locator('[data-block="capability"] [data-slot="control-chart"] svg');

  /** Load `csv` as an own file, with its order column and an invented tolerance 47 to 54 g. */
  async function open(name: string, csv: string): Promise<void> {
    await page.setInputFiles('#file-input', { name, mimeType: 'text/csv', buffer: Buffer.from(csv) });
    await waitForStatus(page, new RegExp(`^Done: .*${name.replace('.', '\\.')}`), 120_000);
    await page.selectOption('#order-select', '1');
    for (const [id, v] of [['lsl-input', '47'], ['usl-input', '54']] as const) {
      await page.fill(`#${id}`, v);
      await page.locator(`#${id}`).dispatchEvent('change');
    }
    await chart().waitFor({ timeout: 120_000 });
    await waitForStatus(page, new RegExp(`^Done: .*${name.replace('.', '\\.')}`), 120_000);
    await page.waitForTimeout(300);
  }

  async function labelsClear(where: string): Promise<void> {
    const charts = (await page.evaluate(collectBoxes)).filter((c) => /^Is the process stable\?/.test(c.title));
    expect(charts.length, `${where}: a stability chart`).toBeGreaterThan(0);
    const found = charts.flatMap((c) => [...overlaps(c.boxes), ...outside(c.svg, c.boxes)]);
    expect(found, `${where}: ${found.join('\n')}`).toEqual([]);
  }

  it('a shift: a diamond on each point that ends a run, titled with its rule; a legend entry in words; no ring', { timeout: 300_000 }, async () => {
    await open('fill-shift.csv', runCsv(SHIFTED));
    // the core's verdict on the same values (as the CSV writes them), in the order column's order
    const expected = individualsChart(SHIFTED.map((v) => Number(v.toFixed(2))), null).location.points.filter((p) => (p.runRules?.length ?? 0) > 0);
    expect(expected.length).toBeGreaterThan(0);
    const diamonds = chart().locator('[data-panel="location"] [data-kind="run-signal"]');
    await expect(diamonds.count()).resolves.toBe(expected.length);
    expect(await chart().locator('[data-kind="beyond"]').count()).toBe(0);
    const titles = await diamonds.locator('title').allTextContents();
    titles.forEach((t, k) => {
      const p = expected[k]!;
      expect(t.startsWith(`${p.label}: `)).toBe(true);
      for (const r of p.runRules ?? []) expect(t).toContain(`rule ${r}: ${RUN_RULE_WORDS[r]}`);
    });
    expect(titles.join(' ')).toContain(RUN_RULE_WORDS[2]);
    const legend = await chart().locator('[data-kind="legend-entry"] text').allTextContents();
    expect(legend).toContain('ends a run (rules 2–4, below)');
    // the section's table lists the same points in words
    await expect(page.locator('[data-block="capability"]').textContent()).resolves.toMatch(/rule 3: four of five successive points beyond 1 sigma on one side/);
    // the exported HTML report carries the same chart: its diamonds with their titles, the legend and the note
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('#export-html')]);
    const file = join(OUT, 'report-run-rules.html');
    await download.saveAs(file);
    const html = readFileSync(file, 'utf8');
    expect(html.match(/data-kind="run-signal"/g)?.length).toBe(expected.length);
    expect(html).toContain('ends a run (rules 2–4, below)');
    expect(html).toContain(`completes rule 2: ${RUN_RULE_WORDS[2]}`);
    expect(html).toContain('Diamonds end a run (Western Electric rules, 1956)');
    for (const [w, h] of [[1366, 768], [800, 900]] as const) {
      await page.setViewportSize({ width: w, height: h });
      await page.waitForTimeout(800);
      await chart().scrollIntoViewIfNeeded();
      await chart().screenshot({ path: join(OUT, `run-rules-shift-${w}.png`) });
      await labelsClear(`shift at ${w} px`);
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(w);
    }
    await page.setViewportSize({ width: 1366, height: 768 });
    expect(problems).toEqual([]);
  });

  it('steady data: no diamond, no ring, no zone lines, and no legend entry for them', { timeout: 300_000 }, async () => {
    await open('fill-steady.csv', runCsv(STEADY));
    expect(individualsChart(STEADY, null).stable).toBe(true);
    await expect(chart().locator('[data-panel="location"] circle[data-kind="point"]').count()).resolves.toBe(STEADY.length);
    expect(await chart().locator('[data-kind="run-signal"]').count()).toBe(0);
    expect(await chart().locator('[data-kind="beyond"]').count()).toBe(0);
    expect(await chart().locator('[data-kind="zone"]').count()).toBe(0);
    expect(await chart().locator('[data-kind="legend-entry"] text').allTextContents()).toEqual(['value']);
    await chart().scrollIntoViewIfNeeded();
    await chart().screenshot({ path: join(OUT, 'run-rules-steady-1366.png') });
    await labelsClear('steady at 1366 px');
    expect(problems).toEqual([]);
  });
});

/**
 * Issue 13 on the page, in Chromium against the real server: interval rows (start, end, units) with a
 * failure-mode column, and the B-life bounds of the whole unit and of the two-subpopulation mixture,
 * each number with the method that made it, and the same in the exported HTML report.
 *  - Interval rows with modes: the rows of test/fixtures/life-modes-interval.json (invented, seeded;
 *    scripts/fixtures/life-modes-interval.py fits each mode with SciPy CensoredData refined by mpmath,
 *    and the whole unit's B10 with likelihood-ratio and Fisher-matrix bounds profiled/derived there):
 *    per-mode and whole-unit B10 and both kinds of bounds as the page shows them (4 significant
 *    digits) equal the fixture's.
 *  - The mixture's Fisher-matrix B10 bounds on test/fixtures/life-mixture-bounds.json (400 invented
 *    units; mpmath delta method, scripts/fixtures/life-mixture-bounds.py), and the "not identified"
 *    reason on invented data whose early subpopulation has about 3 failures (test/client/invented-mixture.ts).
 * Screenshots at 1366 and 800 px go to test-output/.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { sig } from '../../client/src/format.js';
import { readFixture } from '../helpers/fixtures.js';
import { fewEarlyCsv } from '../client/invented-mixture.js';
import { SKIP_BROWSER } from './server-process.js';
import { OUT, openSession, waitForStatus, type BrowserSession } from './session.js';

const ivFx = readFixture('life-modes-interval.json') as {
  rows: { start: number; end: number | null; mode: string | null; count: number }[];
  modes: Record<string, { b10: number }>;
  system: { b10: number; b10LikelihoodRatio90: [number, number]; b10Fisher90: [number, number] };
};
const IV_CSV = `start,end,units,mode\n${ivFx.rows.map((r) => `${r.start === 0 ? '' : r.start},${r.end === null ? '' : r.end},${r.count},${r.mode ?? ''}`).join('\n')}\n`;
const mixFx = readFixture('life-mixture-bounds.json') as { times: number[]; failed: number[]; b10: number; b10Fisher90: [number, number] };
const MIX_CSV = `unit,hours,status\n${mixFx.times.map((t, i) => `U${i + 1},${t},${mixFx.failed[i]}`).join('\n')}\n`;

describe.skipIf(SKIP_BROWSER)('interval rows with failure modes, system and mixture B-life bounds, on the page', () => {
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

  const upload = (name: string, text: string) => page.setInputFiles('#file-input', { name, mimeType: 'text/csv', buffer: Buffer.from(text) });
  const done = (name: string) => waitForStatus(page, new RegExp(`^Done: .*${name.replace(/\./g, '\\.')}`), 180_000);

  /** Only the Weibull model ticked (the fixtures fit Weibull modes). */
  async function weibullOnly(name: string): Promise<void> {
    for (const box of await page.locator('#family-boxes input[name="family"]').all()) {
      const v = await box.getAttribute('value');
      if ((v === 'weibull') !== (await box.isChecked())) await box.click();
    }
    await done(name);
  }

  /** The rows of the block's table whose caption matches, as cell texts. */
  async function tableRows(block: string, caption: RegExp): Promise<string[][]> {
    return page.evaluate(
      ([b, src]) => {
        const t = [...document.querySelectorAll(`[data-block="${b}"] table`)].find((x) => new RegExp(src).test(x.querySelector('caption')?.textContent ?? ''));
        return t ? [...t.querySelectorAll('tbody tr')].map((r) => [...r.querySelectorAll('th, td')].map((c) => (c.textContent ?? '').trim())) : [];
      },
      [block, caption.source] as const,
    );
  }

  async function exportHtml(file: string): Promise<string> {
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('#export-html')]);
    const path = join(OUT, file);
    await download.saveAs(path);
    return readFileSync(path, 'utf8');
  }

  async function show(sel: string): Promise<void> {
    for (let tries = 0; tries < 8; tries++) {
      try {
        await page.locator(sel).scrollIntoViewIfNeeded({ timeout: 2000 });
        return;
      } catch {
        await page.waitForTimeout(300);
      }
    }
  }

  it('interval rows with a mode column: per-mode and whole-unit B10 with likelihood-ratio bounds, then Fisher-matrix, each naming its method; the report has them', { timeout: 600_000 }, async () => {
    await upload('inspections-modes.csv', IV_CSV);
    await done('inspections-modes.csv');
    expect(await page.inputValue('#shape-select')).toBe('interval');
    expect([await page.inputValue('#interval-start-select'), await page.inputValue('#interval-end-select'), await page.inputValue('#interval-count-select')]).toEqual(['1', '2', '3']);
    // the failure-mode role is offered beside the interval columns; the other roles are not
    expect(await page.locator('#mode-select').isVisible()).toBe(true);
    expect(await page.locator('#status-select').isVisible()).toBe(false);
    // the unused mode-like column is pointed out, with a button that applies it
    await page.locator('#use-mode').click();
    await done('inspections-modes.csv');
    expect(await page.inputValue('#mode-select')).toBe('4');
    await weibullOnly('inspections-modes.csv');
    const block = page.locator('[data-block="modes"]');
    await block.waitFor({ timeout: 120_000 });
    // the status can read Done before the run with Weibull alone has been drawn: wait for its table
    await page.waitForFunction(() => {
      const rows = [...document.querySelectorAll('[data-block="modes"] table')].find((t) => /^B-lives by mode/.test(t.querySelector('caption')?.textContent ?? ''))?.querySelectorAll('tbody tr') ?? [];
      const models = [...rows].filter((r) => /^[AB]: B10$/.test(r.firstElementChild?.textContent ?? '')).map((r) => r.children[1]?.textContent);
      return models.length === 2 && models.every((m) => m === 'Weibull');
    }, undefined, { timeout: 180_000 });
    const caption = /^B-lives by mode/;
    let rows = await tableRows('modes', caption);
    const row = (name: string) => rows.find((r) => r[0] === name)!;
    expect(row('A: B10').slice(1, 4)).toEqual(['Weibull', String(ivFx.rows.filter((r) => r.mode === 'A').reduce((a, r) => a + r.count, 0)), sig(ivFx.modes['A']!.b10)]);
    expect(row('B: B10')[3]).toBe(sig(ivFx.modes['B']!.b10));
    const lr = ivFx.system.b10LikelihoodRatio90;
    expect(row('whole unit: B10').slice(3)).toEqual([sig(ivFx.system.b10), sig(lr[0]), sig(lr[1])]);
    const captionText = async (): Promise<string> => page.evaluate(() => [...document.querySelectorAll('[data-block="modes"] caption')].map((c) => c.textContent ?? '').find((t) => /^B-lives by mode/.test(t)) ?? '');
    expect(await captionText()).toMatch(/two-sided bounds: per mode by likelihood ratio; for the whole unit by likelihood ratio over every mode's parameters at once$/);
    // the answer: the whole unit's B10 with its bounds, named by method, and each mode's
    await expect(page.locator('#headline').textContent()).resolves.toContain(`B10 life of the whole unit, the 2 failure modes together: ${sig(ivFx.system.b10)} (90 % likelihood-ratio bounds ${sig(lr[0])} to ${sig(lr[1])})`);
    const text = (await block.textContent()) ?? '';
    expect(text).toContain('whole unit: likelihood ratio (profile likelihood over every mode’s parameters), two-sided.');
    expect(text).toMatch(/counted as still running up to the last inspection it was seen working/);
    expect(text).toMatch(/governing maintenance and safety practice/);
    let html = await exportHtml('report-modes-interval-lr.html');
    expect(html).toContain('Failure modes: which one limits life');
    expect(html).toContain('likelihood ratio (profile likelihood over every mode’s parameters), two-sided');
    expect(html).toMatch(new RegExp(`<th>whole unit: B10</th>.*?${sig(lr[0]).replace('.', '\\.')}.*?${sig(lr[1]).replace('.', '\\.')}`, 's'));
    expect(html).toMatch(/governing maintenance and safety practice/);
    await show('[data-block="modes"]');
    await page.screenshot({ path: join(OUT, 'modes-interval-1366x768.png') });

    // Fisher-matrix bounds: the whole unit's change to the fixture's, and say so
    await page.selectOption('#bounds-select', 'fisher-matrix');
    await page.waitForFunction(() => /for the whole unit by Fisher matrix/.test([...document.querySelectorAll('[data-block="modes"] caption')].map((c) => c.textContent ?? '').join(' ')), undefined, { timeout: 180_000 });
    await done('inspections-modes.csv');
    rows = await tableRows('modes', caption);
    const fm = ivFx.system.b10Fisher90;
    expect(row('whole unit: B10').slice(3)).toEqual([sig(ivFx.system.b10), sig(fm[0]), sig(fm[1])]);
    expect(await captionText()).toMatch(/per mode by Fisher matrix; for the whole unit by Fisher matrix over every mode's parameters/);
    await expect(page.locator('#headline').textContent()).resolves.toContain(`(90 % Fisher-matrix bounds ${sig(fm[0])} to ${sig(fm[1])})`);
    html = await exportHtml('report-modes-interval-fisher.html');
    expect(html).toMatch(new RegExp(`<th>whole unit: B10</th>.*?${sig(fm[0]).replace('.', '\\.')}.*?${sig(fm[1]).replace('.', '\\.')}.*?Fisher matrix`, 's'));
    await page.setViewportSize({ width: 800, height: 900 });
    await page.waitForTimeout(800);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(800);
    await show('[data-block="modes"]');
    await page.screenshot({ path: join(OUT, 'modes-interval-800x900.png') });
    await page.setViewportSize({ width: 1366, height: 768 });
    expect(problems).toEqual([]);
  });

  it('the mixture: Fisher-matrix B10 bounds when identified (mpmath reference); the reason when not; the report has both', { timeout: 600_000 }, async () => {
    await upload('mixture-400.csv', MIX_CSV);
    await done('mixture-400.csv');
    await page.selectOption('#status-select', '3');
    await done('mixture-400.csv');
    const lives = /^B-lives .*bounds where the estimator gives them/;
    await page.locator('[data-block="life-recorded"]').waitFor({ timeout: 180_000 });
    let rows = await tableRows('life-recorded', lives);
    const mix = rows.find((r) => /mixture.*B10$/.test(r[0]!))!;
    expect(mix.slice(1)).toEqual([sig(mixFx.b10), sig(mixFx.b10Fisher90[0]), sig(mixFx.b10Fisher90[1]), expect.stringMatching(/^Fisher matrix \(observed information of the five mixture parameters/)]);
    let html = await exportHtml('report-mixture-identified.html');
    expect(html).toContain('Fisher matrix (observed information of the five mixture parameters');
    expect(html).toContain(sig(mixFx.b10Fisher90[0]));
    await show('[data-block="life-recorded"]');
    await page.screenshot({ path: join(OUT, 'mixture-identified-1366x768.png') });

    await upload('early-failures.csv', fewEarlyCsv());
    await done('early-failures.csv');
    await page.selectOption('#status-select', '3');
    await done('early-failures.csv');
    await page.waitForFunction(() => /not identified/.test(document.querySelector('[data-block="life-recorded"]')?.textContent ?? ''), undefined, { timeout: 180_000 });
    rows = await tableRows('life-recorded', lives);
    const none = rows.find((r) => /mixture.*B10$/.test(r[0]!))!;
    expect(none.slice(2)).toEqual(['—', '—', 'no bound: the mixture’s components are not identified by these data']);
    const block = page.locator('[data-block="life-recorded"]');
    await expect(block.locator('.block-answer').textContent()).resolves.toMatch(/^The Weibull mixture ranks first by AICc .* not identified by these data, so its numbers are not to be used; best single model: /);
    const text = (await block.textContent()) ?? '';
    expect(text).toMatch(/do not use the mixture's numbers/);
    expect(text).toMatch(/licensed practice/);
    html = await exportHtml('report-mixture-not-identified.html');
    expect(html).toContain('no bound: the mixture’s components are not identified by these data');
    await show('[data-block="life-recorded"]');
    await page.screenshot({ path: join(OUT, 'mixture-not-identified-1366x768.png') });
    expect(problems).toEqual([]);
  });
});

/**
 * The one set-up shared by the browser tests: make sure test-output/ exists, build the page if
 * needed, start the real server, launch Chromium with a 1366×768 page, and collect console errors
 * and page errors into the test's own list. `close()` stops the browser, then the server.
 * `waitForStatus` is the one wait on the page's status line.
 */
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import { CHROMIUM, CHROMIUM_ARGS, ROOT, ensureClientBuilt, startServer, type RunningServer } from './server-process.js';

/** Where the browser tests write screenshots and exported reports (git-ignored). */
export const OUT = join(ROOT, 'test-output');

export interface SessionOptions {
  /** Receives console errors and page errors (and Content Security Policy messages if `csp`). */
  readonly problems: string[];
  /** Let the page download files (the report exports). */
  readonly acceptDownloads?: boolean;
  /** Also count console messages that mention the Content Security Policy. */
  readonly csp?: boolean;
  /** Open the server's page before returning. */
  readonly open?: boolean;
}

export interface BrowserSession {
  readonly server: RunningServer;
  readonly browser: Browser;
  readonly page: Page;
  close(): Promise<void>;
}

export async function openSession(opts: SessionOptions): Promise<BrowserSession> {
  const { problems } = opts;
  mkdirSync(OUT, { recursive: true });
  await ensureClientBuilt();
  const server = await startServer();
  const browser = await chromium.launch({ executablePath: CHROMIUM, args: CHROMIUM_ARGS });
  const context = await browser.newContext({
    viewport: { width: 1366, height: 768 },
    ...(opts.acceptDownloads ? { acceptDownloads: true } : {}),
  });
  const page = await context.newPage();
  page.on('console', (m) => {
    if (m.type() === 'error' || (opts.csp === true && /Content.Security.Policy/i.test(m.text()))) problems.push(m.text());
  });
  page.on('pageerror', (e) => problems.push(`page error: ${e.message}`));
  if (opts.open) await page.goto(server.url);
  return {
    server,
    browser,
    page,
    close: async () => {
      await browser.close();
      await server.stop();
    },
  };
}

/** Wait until the page's status line (#status) matches `what` (a pattern without flags). */
export async function waitForStatus(page: Page, what: RegExp, timeoutMs: number): Promise<void> {
  await page.waitForFunction(
    (src) => new RegExp(src).test(document.getElementById('status')?.textContent ?? ''),
    what.source,
    { timeout: timeoutMs },
  );
}

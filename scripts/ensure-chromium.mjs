#!/usr/bin/env node
/**
 * Makes sure Debian's Chromium is installed for the browser tests (run as `pretest`).
 * - /usr/bin/chromium present (or the file named by PLUMBLINE_CHROMIUM): nothing to do.
 * - Missing, running as root with apt-get: `apt-get update && apt-get install -y chromium`,
 *   printing what it does. Never a browser download by an npm tool.
 * - Otherwise: a clear message and exit code 1 (set PLUMBLINE_SKIP_BROWSER=1 to run the other
 *   tests anyway; the browser suites then skip themselves).
 */
import { existsSync } from 'node:fs';
import { spawnSync } from 'node:child_process';

const wanted = process.env.PLUMBLINE_CHROMIUM || '/usr/bin/chromium';
const say = (s) => console.log(`ensure-chromium: ${s}`);

if (existsSync(wanted)) {
  say(`found ${wanted}`);
  process.exit(0);
}
if (process.env.PLUMBLINE_SKIP_BROWSER === '1') {
  say(`${wanted} is missing; PLUMBLINE_SKIP_BROWSER=1, so the browser tests will be skipped`);
  process.exit(0);
}
if (process.env.PLUMBLINE_CHROMIUM) {
  console.error(`ensure-chromium: PLUMBLINE_CHROMIUM is set to ${wanted}, which does not exist`);
  process.exit(1);
}

const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
const apt = '/usr/bin/apt-get';
if (!isRoot || !existsSync(apt)) {
  console.error(
    'ensure-chromium: the browser tests need Chromium at /usr/bin/chromium, which is missing.\n' +
      "  On Debian or Ubuntu install it with: sudo apt-get update && sudo apt-get install -y chromium\n" +
      '  Elsewhere set PLUMBLINE_CHROMIUM=/path/to/chromium, or PLUMBLINE_SKIP_BROWSER=1 to skip the browser tests.',
  );
  process.exit(1);
}

const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
for (const args of [['update'], ['install', '-y', 'chromium']]) {
  say(`running: apt-get ${args.join(' ')}`);
  const started = Date.now();
  const r = spawnSync(apt, args, { stdio: 'inherit', env });
  if (r.status !== 0) {
    console.error(`ensure-chromium: apt-get ${args.join(' ')} failed (exit ${r.status ?? r.signal})`);
    process.exit(1);
  }
  say(`apt-get ${args[0]} took ${((Date.now() - started) / 1000).toFixed(1)} s`);
}
if (!existsSync(wanted)) {
  console.error(`ensure-chromium: apt-get finished but ${wanted} is still missing`);
  process.exit(1);
}
say(`installed ${wanted}`);

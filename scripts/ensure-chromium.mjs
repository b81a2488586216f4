#!/usr/bin/env node
/**
 * Makes sure Debian's Chromium is installed for the browser tests (run as `pretest`).
 * - /usr/bin/chromium present: nothing to do.
 * - Missing, running as root with apt-get: `apt-get update && apt-get install -y chromium`,
 *   printing what it does. Never a browser download by an npm tool.
 * - Otherwise: a clear message saying how to install it. In CI (env CI set) that is a failure
 *   (exit 1), because the browser tests must run there; on a developer machine the other tests
 *   go ahead (exit 0) and the browser suites skip themselves (test/browser/server-process.ts).
 */
import { existsSync } from 'node:fs';
import { spawnSync } from 'node:child_process';

const wanted = '/usr/bin/chromium';
const say = (s) => console.log(`ensure-chromium: ${s}`);

if (existsSync(wanted)) {
  say(`found ${wanted}`);
  process.exit(0);
}

const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
const apt = '/usr/bin/apt-get';
if (!isRoot || !existsSync(apt)) {
  const inCi = Boolean(process.env.CI);
  console.error(
    'ensure-chromium: the browser tests need Chromium at /usr/bin/chromium, which is missing' +
      (isRoot ? ' (and apt-get is not available to install it).\n' : ' (and this user is not root, so it is not installed automatically).\n') +
      '  On Debian or Ubuntu install it with: sudo apt-get update && sudo apt-get install -y chromium\n' +
      (inCi ? '  CI is set, so this is a failure: the browser tests must run in CI.' : '  Going on without it: the browser tests will be skipped on this machine.'),
  );
  process.exit(inCi ? 1 : 0);
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

/**
 * Break each guard of the server once and confirm that a test fails (a guard no test can catch is
 * a guard nobody checks). For every mutation below: the file is changed in one place (the text
 * must occur exactly once), the named test files are run with vitest, and the file is restored
 * whatever happens. A mutation whose tests still pass is a "survivor": the script lists it and
 * exits 1. The named tests must pass on the unmutated tree first (else it stops, exit 2).
 *
 *   node --import tsx scripts/mutation-server.ts            every mutation (a few minutes)
 *   node --import tsx scripts/mutation-server.ts job-limit  only those whose name contains the word
 *
 * It edits files in the working tree while it runs: do not run it while editing server/.
 */
import { spawnSync } from 'node:child_process';
import { readFileSync, writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const ROOT = resolve(fileURLToPath(new URL('.', import.meta.url)), '..');

interface Mutation {
  readonly name: string;
  readonly file: string;
  readonly find: string;
  readonly replace: string;
  readonly tests: readonly string[];
}

const MUTATIONS: readonly Mutation[] = [
  {
    name: 'job-limit: the running-job check switched off',
    file: 'server/jobs.ts',
    find: 'if (this.running + this.planning >= this.maxRunning) {',
    replace: 'if (false) {',
    tests: ['test/server/job-limit.test.ts'],
  },
  {
    name: 'job-limit: no slot reserved before planning is awaited',
    file: 'server/jobs.ts',
    find: '    this.planning++;\n',
    replace: '',
    tests: ['test/server/job-limit.test.ts'],
  },
  {
    name: 'finite-number check on values switched off',
    file: 'server/validate.ts',
    find: "if (typeof x !== 'number' || !Number.isFinite(x)) {\n      throw badRequest(`\"values[${i}]\"",
    replace: "if (typeof x !== 'number') {\n      throw badRequest(`\"values[${i}]\"",
    tests: ['test/server/limits.test.ts'],
  },
  {
    name: 'body size limit lifted',
    file: 'server/app.ts',
    find: "express.raw({ limit: bodyLimit, type: 'application/json' })",
    replace: "express.raw({ limit: Number.MAX_SAFE_INTEGER, type: 'application/json' })",
    tests: ['test/hostile/requests.test.ts', 'test/server/validation.test.ts'],
  },
  {
    name: 'JSON content type not required',
    file: 'server/app.ts',
    find: "if (hasBody(req) && !req.is('application/json')) {",
    replace: 'if (false) {',
    tests: ['test/hostile/requests.test.ts', 'test/server/validation.test.ts'],
  },
  {
    name: 'Host header check skipped',
    file: 'server/app.ts',
    find: 'if (options.allowedHosts !== true) app.use(hostCheck(options.allowedHosts ?? []));',
    replace: '',
    tests: ['test/server/headers-static.test.ts'],
  },
  {
    name: 'security headers not set',
    file: 'server/app.ts',
    find: '  app.use(securityHeaders());\n',
    replace: '',
    tests: ['test/server/headers-static.test.ts'],
  },
  {
    name: 'static files: dot segments allowed',
    file: 'server/static.ts',
    find: "if (s.startsWith('.') || s.includes('\\\\') || s.includes('\\0') || s.includes(':')) return null;",
    replace: "if (s.includes('\\0')) return null;",
    tests: ['test/server/headers-static.test.ts'],
  },
  {
    name: 'Content-Encoding decode failure left as a 500',
    file: 'server/app.ts',
    find: 'if (isDecompressionError(err)) {',
    replace: 'if (false) {',
    tests: ['test/hostile/encoding-params.test.ts'],
  },
  {
    name: 'bad percent-encoding left as a 500',
    file: 'server/errors.ts',
    find: 'if (err instanceof URIError && (err as { status?: unknown }).status === 400) {',
    replace: 'if (false) {',
    tests: ['test/hostile/encoding-params.test.ts'],
  },
  {
    name: 'limit on grouped classes switched off',
    file: 'server/limits.ts',
    find: 'if (dataset.grouped && dataset.grouped.length > limits.classes) {',
    replace: 'if (false) {',
    tests: ['test/server/limits.test.ts'],
  },
  {
    name: 'limit on values switched off',
    file: 'server/limits.ts',
    find: 'if (n > limits.values) {',
    replace: 'if (false) {',
    tests: ['test/server/limits.test.ts'],
  },
  {
    name: 'limit on bootstrap work switched off',
    file: 'server/limits.ts',
    find: 'if (work <= limits.bootstrapValues) return;',
    replace: 'return;',
    tests: ['test/server/limits.test.ts'],
  },
  {
    name: 'limit on censored bootstrap work switched off',
    file: 'server/limits.ts',
    find: 'if (censored > limits.censoredBootstrapValues) {',
    replace: 'if (false) {',
    tests: ['test/server/limits.test.ts'],
  },
  {
    name: 'a disconnected client does not stop its planning',
    file: 'server/app.ts',
    find: 'if (!res.writableFinished) controller.abort();',
    replace: '',
    tests: ['test/server/limits.test.ts'],
  },
  {
    name: 'a dying worker does not cancel the other ranges',
    file: 'server/pool.ts',
    find: '      // One range failed (its worker died): stop the others at once instead of letting them run on.\n      abort();\n',
    replace: '',
    tests: ['test/server/worker-death.test.ts'],
  },
  {
    name: 'a worker failure reported as an internal error',
    file: 'server/errors.ts',
    find: 'if (err instanceof WorkerFailed) {',
    replace: 'if (false) {',
    tests: ['test/server/worker-death.test.ts'],
  },
  {
    name: 'a cancelled job keeps running',
    file: 'server/jobs.ts',
    find: "      j.state = 'cancelled';\n      j.controller.abort();",
    replace: "      j.state = 'cancelled';",
    tests: ['test/server/jobs.test.ts'],
  },
  {
    name: 'busy port: address printed before listening succeeded',
    file: 'server/main.ts',
    find: "if (e.code === 'EADDRINUSE') fail(",
    replace: "if (e.code === 'EADDRINUSE') console.log('Plumbline is running at http://127.0.0.1:1/'), fail(",
    tests: ['test/server/main.test.ts'],
  },
];

function runTests(tests: readonly string[]): { passed: boolean; summary: string } {
  const r = spawnSync('npx', ['vitest', 'run', ...tests], { cwd: ROOT, encoding: 'utf8', timeout: 600_000 });
  const out = `${r.stdout}\n${r.stderr}`.replace(/\x1b\[[0-9;]*m/g, '');
  const summary = /Tests\s+(.*)/.exec(out)?.[1]?.trim() ?? `exit ${r.status}`;
  return { passed: r.status === 0, summary };
}

function main(): void {
  const filter = process.argv[2];
  const chosen = MUTATIONS.filter((m) => filter === undefined || m.name.includes(filter));
  const survivors: string[] = [];
  // A mutation counts as caught only if its tests pass on the unmutated tree.
  const baseline = [...new Set(chosen.flatMap((m) => m.tests))];
  const base = runTests(baseline);
  console.log(`baseline (unmutated): ${base.summary}`);
  if (!base.passed) {
    console.log('The tests fail without any mutation; fix them first (a failing test catches nothing).');
    process.exit(2);
  }
  for (const m of chosen) {
    const path = resolve(ROOT, m.file);
    const original = readFileSync(path, 'utf8');
    const count = original.split(m.find).length - 1;
    if (count !== 1) {
      console.log(`?? ${m.name}: the text to change occurs ${count} times in ${m.file} (update this script)`);
      survivors.push(`${m.name} (not applied)`);
      continue;
    }
    const mutated = original.replace(m.find, m.replace);
    // The tree is shared: if someone saved the file meanwhile, undo only this change in their text.
    const restore = (): void => {
      const now = readFileSync(path, 'utf8');
      if (now === mutated) writeFileSync(path, original);
      else if (now !== original) {
        if (m.replace !== '' && now.split(m.replace).length === 2) writeFileSync(path, now.replace(m.replace, m.find));
        else console.log(`!! ${m.file} changed while mutated; check that "${m.find.trim().slice(0, 60)}" is back`);
      }
    };
    const onInterrupt = (): void => {
      restore();
      process.exit(130);
    };
    process.once('SIGINT', onInterrupt);
    try {
      writeFileSync(path, mutated);
      const { passed, summary } = runTests(m.tests);
      console.log(`${passed ? 'SURVIVED' : 'caught  '}  ${m.name}  [${m.file}; ${summary}]`);
      if (passed) survivors.push(m.name);
    } finally {
      restore();
      process.off('SIGINT', onInterrupt);
    }
  }
  console.log(`\n${chosen.length - survivors.length} of ${chosen.length} mutations caught by a failing test.`);
  if (survivors.length > 0) {
    console.log(`Survivors:\n${survivors.map((s) => `  - ${s}`).join('\n')}`);
    process.exit(1);
  }
}

main();

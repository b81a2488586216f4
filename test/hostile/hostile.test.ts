/**
 * Issue 6's hostile inputs (test/hostile/cases.ts) through all three ways in:
 *  - the core: CSV reader + analyze, in-process;
 *  - the CLI, spawned as a user runs it (`node --import tsx cli/main.ts analyze FILE --json`);
 *  - the API, POST /api/analyze with the CSV text, through supertest on createApp().
 * Each case must give correct handling or one clear error naming what and where; never a stack
 * trace, an internal error (CLI exit 70) or a 5xx (issue 6; exit codes per cli/run.ts, statuses per
 * server/API.md). Nothing may be dropped without being counted: rowsRead = n + Σ skipped.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { InputError, analyze, readColumn, type AnalysisReport, type ErrorPlace } from '../../core/index.js';
import { runCli as runCliInProcess } from '../../cli/run.js';
import { cli } from '../helpers/cli.js';
import { createApp, type PlumblineApp } from '../../server/app.js';
import { CASES, type HostileCase } from './cases.js';

interface InputInfo {
  readonly rowsRead: number;
  readonly skipped: readonly { reason: string; count: number }[];
  readonly blankLines: number;
  readonly warnings: readonly string[];
}
type Outcome =
  | { readonly ok: true; readonly report: AnalysisReport; readonly input: InputInfo; readonly values?: readonly number[] }
  | { readonly ok: false; readonly message: string; readonly place?: ErrorPlace };

function text(c: HostileCase): string {
  // The CLI decodes bytes itself (UTF-8, else Latin-1); the core and the API get a string.
  return typeof c.bytes === 'string' ? c.bytes : Buffer.from(c.bytes).toString('latin1');
}

function csvOptions(c: HostileCase) {
  const o = c.opts ?? {};
  return { ...(o.decimalComma ? { decimal: ',' as const } : {}), ...(o.skipInvalid ? { skipInvalid: true } : {}), ...(o.noHeader ? { header: false } : {}) };
}

/** The checks every channel shares. */
function checkOutcome(channel: string, c: HostileCase, out: Outcome): void {
  const label = `${channel}: ${c.name}`;
  const e = c.expect;
  if (!e.ok) {
    if (out.ok) throw new Error(`${label}: expected an error matching ${String(e.message)}, got a report with n = ${out.report.n}`);
    expect(out.message, label).toMatch(e.message);
    expect(out.message, `${label}: one line`).not.toMatch(/\n/);
    expect(out.message, `${label}: no stack trace`).not.toMatch(/\bat .+:\d+:\d+/);
    if (e.place && out.place !== undefined) {
      if (e.place.row !== undefined) expect(out.place.row, `${label}: row`).toBe(e.place.row);
      if (e.place.column !== undefined) expect(out.place.column, `${label}: column`).toBe(e.place.column);
      if (e.place.value !== undefined) expect(out.place.value, `${label}: value`).toBe(e.place.value);
    }
    if (e.place?.row !== undefined) expect(out.message, `${label}: row in the message`).toContain(`row ${e.place.row}`);
    if (e.place?.column !== undefined) expect(out.message, `${label}: column in the message`).toContain(e.place.column);
    if (e.place?.value) expect(out.message, `${label}: value in the message`).toContain(e.place.value);
    return;
  }
  if (!out.ok) throw new Error(`${label}: expected a report, got the error "${out.message}"`);
  const r = out.report;
  expect(r.n, `${label}: n`).toBe(e.n);
  if (e.values && out.values) expect(out.values, `${label}: values`).toEqual(e.values);
  const skipped = out.input.skipped.reduce((s, x) => s + x.count, 0);
  // Nothing dropped without being counted.
  expect(out.input.rowsRead, `${label}: rowsRead = n + skipped`).toBe(r.n + skipped);
  if (e.rowsRead !== undefined) expect(out.input.rowsRead, `${label}: rowsRead`).toBe(e.rowsRead);
  if (e.skipped) {
    const by = Object.fromEntries(out.input.skipped.map((s) => [s.reason, s.count]));
    expect(by, `${label}: skipped by reason`).toEqual(e.skipped);
  } else expect(skipped, `${label}: nothing skipped`).toBe(0);
  if (e.blankLines !== undefined) expect(out.input.blankLines, `${label}: blank lines`).toBe(e.blankLines);
  if (e.inputWarning) expect(out.input.warnings.join('\n'), `${label}: input warning`).toMatch(e.inputWarning);
  if (e.reportWarning) expect(r.warnings.join('\n'), `${label}: report warning`).toMatch(e.reportWarning);
  if (e.fitted) for (const f of e.fitted) expect(r.candidates.map((x) => x.family), `${label}: ${f} fitted`).toContain(f);
  if (e.notApplicable) {
    for (const [f, count] of Object.entries(e.notApplicable)) {
      const na = r.notApplicable.find((x) => x.family === f);
      expect(na, `${label}: ${f} not applicable`).toBeDefined();
      expect(na?.reason.length, `${label}: ${f} has a reason`).toBeGreaterThan(10);
      if (count !== null) expect(na?.offendingCount, `${label}: ${f} offending count`).toBe(count);
      expect(r.candidates.map((x) => x.family), `${label}: ${f} not also a candidate`).not.toContain(f);
    }
  }
  // Every requested family is accounted for: fitted or not applicable (never silently dropped).
  expect(r.candidates.length + r.notApplicable.length, `${label}: families accounted for`).toBe(r.options.families.length);
  // No NaN smuggled into a report: JSON would turn it into null.
  for (const cand of r.candidates) {
    expect(Number.isFinite(cand.andersonDarling.pValue) && cand.andersonDarling.pValue >= 0 && cand.andersonDarling.pValue <= 1, `${label}: ${cand.family} AD p`).toBe(true);
    expect(Number.isFinite(cand.logLikelihood), `${label}: ${cand.family} logL`).toBe(true);
  }
}

describe('hostile inputs through the core (CSV reader + analyze)', () => {
  for (const c of CASES) {
    it(c.name, () => {
      let out: Outcome;
      try {
        const read = readColumn(text(c), { ...csvOptions(c), ...(c.opts?.column !== undefined ? { column: c.opts.column } : {}) });
        const report = analyze(read.values, c.opts?.families ? { families: c.opts.families } : {});
        out = { ok: true, report, input: read, values: Array.from(read.values) };
      } catch (err) {
        // Only the core's typed input errors are acceptable; anything else is a bug.
        if (!(err instanceof InputError)) throw err;
        out = { ok: false, message: err.message, place: err.place };
      }
      checkOutcome('core', c, out);
    });
  }
});

interface CliRun {
  readonly code: number | null;
  readonly stdout: string;
  readonly stderr: string;
}

/** The spawned CLI (test/helpers/cli.ts), its exit status as `code`. */
async function runCli(args: readonly string[]): Promise<CliRun> {
  const r = await cli(...args);
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** CLI arguments for a case. */
function cliArgs(c: HostileCase, file: string): string[] {
  const o = c.opts ?? {};
  const args = ['analyze', file, '--json'];
  if (o.column !== undefined) args.push('--column', String(o.column));
  if (o.decimalComma) args.push('--decimal-comma');
  if (o.skipInvalid) args.push('--skip-invalid');
  if (o.noHeader) args.push('--no-header');
  if (o.families) args.push('--families', o.families.join(','));
  return args;
}

/** The CLI's contract for one run (cli/run.ts): 0 with a JSON report, or 2 with one line; never 70. */
function checkCliRun(c: HostileCase, run: CliRun): void {
  expect(run.stderr, 'no stack trace').not.toMatch(/\n\s+at /);
  if (run.code === 0) {
    const json = JSON.parse(run.stdout) as AnalysisReport & { input: InputInfo };
    checkOutcome('cli', c, { ok: true, report: json, input: json.input });
    return;
  }
  expect(run.code, `exit code, stderr: ${run.stderr}`).toBe(2);
  expect(run.stdout).toBe('');
  const errLines = run.stderr.split('\n').filter((l) => l !== '');
  expect(errLines, 'exactly one line on stderr').toHaveLength(1);
  expect(errLines[0]).toMatch(/^plumbline: error: /);
  checkOutcome('cli', c, { ok: false, message: (errLines[0] as string).replace(/^plumbline: error: /, '') });
}

describe('hostile inputs through the CLI', () => {
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-hostile-'));
  const files = new Map<string, string>();
  CASES.forEach((c, i) => {
    const file = join(dir, `case-${i}.csv`);
    writeFileSync(file, typeof c.bytes === 'string' ? c.bytes : Buffer.from(c.bytes));
    files.set(c.name, file);
  });
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  // Every case through runCli (cli/run.ts: argument parsing, the file read and decoded from bytes,
  // the report or the one-line error, the exit code), in-process so that the suite stays short.
  for (const c of CASES) {
    it(c.name, () => {
      let stdout = '';
      let stderr = '';
      const code = runCliInProcess(cliArgs(c, files.get(c.name) as string), { out: (s) => (stdout += s), err: (s) => (stderr += s) }) as number;
      checkCliRun(c, { code, stdout, stderr });
    });
  }

  // The readable text report (no --json) for every case that gives a report: exit 0, and no
  // number printed as NaN, Infinity or undefined (common practice, no source: a report must not
  // show placeholders; "NaN" may appear only quoting a skipped cell).
  for (const c of CASES.filter((x) => x.expect.ok)) {
    it(`text report: ${c.name}`, () => {
      let stdout = '';
      let stderr = '';
      const code = runCliInProcess(cliArgs(c, files.get(c.name) as string).filter((a) => a !== '--json'), { out: (s) => (stdout += s), err: (s) => (stderr += s) });
      expect(code, stderr).toBe(0);
      expect(stdout.length).toBeGreaterThan(200);
      expect(stdout).not.toMatch(/undefined|\bInfinity\b|\[object /);
      expect(stdout.replace(/"NaN"|NaN \(not a number\)/g, '')).not.toMatch(/\bNaN\b/);
    });
  }

  // And a spread of cases as a user runs it: a separate node process (main.ts, real stdout/stderr
  // and exit status). Spawning costs about 1.5 s each on this machine, so not all of them.
  const SPAWNED = [
    'empty file',
    'header only',
    'byte-order mark',
    'lone CR line ends',
    'decimal commas without the setting',
    'marker NA',
    'NA, -, n/a, inf, NaN skipped and counted by reason',
    'binary garbage',
    'values near 1e300',
    'negatives and zeros',
    'n = 2',
    'heavy ties from rounding',
  ];
  const runs = new Map<string, CliRun>();
  beforeAll(async () => {
    const queue = CASES.filter((c) => SPAWNED.includes(c.name));
    expect(queue).toHaveLength(SPAWNED.length);
    const worker = async () => {
      for (let c = queue.shift(); c; c = queue.shift()) runs.set(c.name, await runCli(cliArgs(c, files.get(c.name) as string)));
    };
    await Promise.all([worker(), worker(), worker(), worker()]);
  }, 180_000);
  for (const name of SPAWNED) {
    it(`spawned: ${name}`, () => {
      const c = CASES.find((x) => x.name === name) as HostileCase;
      const run = runs.get(name);
      if (!run) throw new Error('not run');
      checkCliRun(c, run);
    });
  }
});

describe('hostile inputs through the API (POST /api/analyze)', () => {
  let app: PlumblineApp;
  beforeAll(() => {
    app = createApp({ demo: null, workers: 1, log: () => {} });
  });
  afterAll(async () => {
    await app.shutdown();
  });

  for (const c of CASES) {
    it(c.name, async () => {
      const body = {
        csv: text(c),
        ...(c.opts?.column !== undefined ? { column: c.opts.column } : {}),
        ...(Object.keys(csvOptions(c)).length > 0 ? { csvOptions: csvOptions(c) } : {}),
        ...(c.opts?.families ? { families: c.opts.families } : {}),
      };
      const res = await request(app).post('/api/analyze').set('Content-Type', 'application/json').send(JSON.stringify(body));
      // Client faults are 4xx with { error: { message } }; a 5xx would be a bug (server/API.md).
      expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBeLessThan(500);
      if (res.status === 200) {
        const json = res.body as AnalysisReport & { input: InputInfo };
        checkOutcome('api', c, { ok: true, report: json, input: json.input });
        return;
      }
      expect(res.status).toBe(400);
      const err = (res.body as { error: { message: string; place?: ErrorPlace } }).error;
      expect(typeof err.message).toBe('string');
      checkOutcome('api', c, { ok: false, message: err.message, ...(err.place ? { place: err.place } : {}) });
    });
  }
});

import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { runCli } from '../../cli/run.js';
import { cli, root, scratchCsv } from '../helpers/cli.js';

const fixtures = join(root, 'test/fixtures/csv');
const tempCsv = scratchCsv('plumbline-cli-');

describe.concurrent('plumbline analyze --json', () => {
  it('prints one JSON report with the required keys for a dataset', async () => {
    // Source: issue 2's required JSON shape; Proschan (1963) data with the SciPy fits in shared/references.md
    // (exponential MLE mean 108.0833, gamma MLE shape 0.7065).
    const r = await cli('analyze', 'datasets/aircondit.csv', '--column', 'hours', '--json', '--families', 'exponential,gamma');
    expect(r.status).toBe(0);
    expect(r.stderr).toBe('');
    const report = JSON.parse(r.stdout);
    expect(report.n).toBe(12);
    for (const key of ['candidates', 'notApplicable', 'warnings', 'methods', 'rankingRule', 'input']) expect(report).toHaveProperty(key);
    expect(report.input).toMatchObject({ file: 'datasets/aircondit.csv', column: 'hours', rowsRead: 12, skipped: [] });
    const byFamily = Object.fromEntries(report.candidates.map((c: { family: string }) => [c.family, c]));
    expect(1 / byFamily.exponential.parameters.rate).toBeCloseTo(108.0833, 4);
    expect(byFamily.gamma.parameters.shape).toBeCloseTo(0.7065, 4);
    for (const c of report.candidates) {
      for (const key of ['family', 'parameters', 'logLikelihood', 'aic', 'aicc', 'bic', 'chiSquare', 'andersonDarling']) expect(c).toHaveProperty(key);
    }
  });

  it('writes infinite bin edges as null', async () => {
    // Source: issue 2 ("Infinite bin edges are null"); the normal's support is the whole line.
    const r = await cli('analyze', 'datasets/shaft-diameter.csv', '--column', 'diameter_mm', '--json', '--families', 'normal');
    expect(r.status).toBe(0);
    const bins = JSON.parse(r.stdout).candidates[0].chiSquare.bins;
    expect(bins[0].lower).toBeNull();
    expect(bins[bins.length - 1].upper).toBeNull();
    expect(bins.reduce((a: number, b: { observed: number }) => a + b.observed, 0)).toBe(125);
  });

  it('reports skipped rows by reason with --skip-invalid', async () => {
    // Source: test/fixtures/csv/README.md (n/a on file line 4).
    const r = await cli('analyze', join(fixtures, 'na-cell.csv'), '--column', 'load_kN', '--json', '--skip-invalid', '--families', 'normal');
    expect(r.status, r.stderr).toBe(0);
    const report = JSON.parse(r.stdout);
    expect(report.n).toBe(5);
    expect(report.input.rowsRead).toBe(6);
    expect(report.input.skipped).toEqual([{ reason: 'missing-marker', count: 1, firstRow: 4, firstColumn: 'load_kN', firstValue: 'n/a' }]);
  });
});

describe.concurrent('plumbline errors', () => {
  it('a bad cell: exit 2 and one stderr line naming row, column and value', async () => {
    // Source: issue 2 ("an error naming the row, column and value"; one line on stderr, non-zero exit).
    const r = await cli('analyze', join(fixtures, 'na-cell.csv'), '--column', 'load_kN');
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    const lines = r.stderr.trimEnd().split('\n');
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatch(/^plumbline: error: /);
    expect(lines[0]).toContain('row 4');
    expect(lines[0]).toContain('"load_kN"');
    expect(lines[0]).toContain('"n/a"');
    expect(lines[0]).toContain('--skip-invalid');
  });

  it('--bins too large: exit 2 with the largest k allowed', async () => {
    // Source: issue 2 ("a clear error says the largest k allowed"); Cochran's 5 per bin gives floor(80/5) = 16.
    const r = await cli('analyze', 'datasets/pump-seal-wear.csv', '--bins', '40');
    expect(r.status).toBe(2);
    expect(r.stderr.trimEnd().split('\n')).toHaveLength(1);
    expect(r.stderr).toContain('16');
  });

  it('usage and file errors: exit 2, one line, no stack trace (spawned)', async () => {
    // Source: common practice, no source (exit 2 for usage errors, as many Unix tools do).
    for (const args of [['analyze', 'no-such-file.csv'], ['analyze', tempCsv('binary.csv', 'x\n\u0000\u0001\u0002')]]) {
      const r = await cli(...args);
      expect(r.status, args.join(' ')).toBe(2);
      expect(r.stderr.trimEnd().split('\n'), args.join(' ')).toHaveLength(1);
      expect(r.stderr).toMatch(/^plumbline: error: /);
      expect(r.stderr).not.toMatch(/\n\s+at /);
    }
  });

  it('usage, option and input errors: exit code 2 and one line (in-process)', () => {
    // Source: common practice, no source (exit 2 for usage errors, as many Unix tools do).
    const cases = [
      ['analyze', 'datasets/river-peaks.csv'],
      ['analyze', 'datasets/river-peaks.csv', '--column', 'width'],
      ['analyze', 'datasets/river-peaks.csv', '--column', '2', '--alpha', '1.5'],
      ['analyze', 'datasets/river-peaks.csv', '--column', '2', '--families', 'cauchy'],
      ['analyze', 'datasets/river-peaks.csv', '--colum', '2'],
      ['analyze', 'datasets/river-peaks.csv', '--column'],
      ['analyze', 'datasets/river-peaks.csv', '--column', '2', '--bins', 'x'],
      ['analyze', 'datasets/river-peaks.csv', '--column', '2', '--p-method', 'guess'],
      ['frobnicate'],
      ['analyze'],
      ['analyze', tempCsv('empty.csv', '')],
      ['analyze', tempCsv('header-only.csv', 'x\n')],
      ['analyze', tempCsv('all-na.csv', 'x\nNA\n-\n'), '--skip-invalid'],
      ['analyze', tempCsv('one-value.csv', 'x\n3.5\n')],
      ['analyze', tempCsv('unterminated.csv', 'x\n1\n"2\n')],
    ];
    for (const args of cases) {
      let out = '';
      let err = '';
      const code = runCli(args, { out: (s) => (out += s), err: (s) => (err += s) });
      expect(code, args.join(' ')).toBe(2);
      expect(out, args.join(' ')).toBe('');
      const lines = err.trimEnd().split('\n');
      expect(lines, args.join(' ')).toHaveLength(1);
      expect(lines[0]).toMatch(/^plumbline: error: \S/);
    }
  });

  it('an unexpected failure: exit 70 and one line, no stack trace', () => {
    // Source: common practice, no source (sysexits.h EX_SOFTWARE = 70 for internal software errors).
    let err = '';
    const code = runCli(['analyze', 'datasets/aircondit.csv', '--json'], {
      out: () => {
        throw new Error('simulated write failure');
      },
      err: (s) => (err += s),
    });
    expect(code).toBe(70);
    expect(err.trimEnd().split('\n')).toHaveLength(1);
    expect(err).toMatch(/^plumbline: internal error: simulated write failure/);
  });

  it('--decimal-comma and --delimiter reach the CSV reader', () => {
    // Source: test/fixtures/csv/README.md (semicolon, decimal-comma fixture: 4.82, 4.79, 4.91, 4.85).
    const file = join(fixtures, 'semicolon-decimal-comma.csv');
    const run = (...extra: string[]): { code: number; out: string; err: string } => {
      let out = '';
      let err = '';
      const code = runCli(['analyze', file, '--column', 'Wanddicke mm', '--json', '--families', 'normal', ...extra], {
        out: (s) => (out += s),
        err: (s) => (err += s),
      });
      return { code: code as number, out, err };
    };
    const ok = run('--decimal-comma', '--delimiter', 'semicolon');
    expect(ok.code, ok.err).toBe(0);
    const report = JSON.parse(ok.out);
    expect(report.summary.mean).toBeCloseTo((4.82 + 4.79 + 4.91 + 4.85) / 4, 12);
    expect(report.input).toMatchObject({ delimiter: ';', decimal: ',', blankLines: 1 });
    const refused = run();
    expect(refused.code).toBe(2);
    expect(refused.err).toContain('--decimal-comma');
  });

  it('--help and --version exit 0', async () => {
    // Source: common practice, no source.
    const help = await cli('--help');
    expect(help.status).toBe(0);
    // The usage lists each command (analyze, merge, plan) with its own line.
    expect(help.stdout).toMatch(/^ {2}plumbline analyze FILE /m);
    expect(help.stdout).toMatch(/^ {2}plumbline merge /m);
    expect(help.stdout).toMatch(/^ {2}plumbline plan /m);
    const version = await cli('--version');
    expect(version.status).toBe(0);
    expect(version.stdout).toMatch(/^plumbline \d+\.\d+\.\d+\n$/);
  });
});

describe.concurrent('plumbline text report', () => {
  it('ranks the candidates and carries the rule, the methods and the caution', async () => {
    // Source: issue 2 (text report contents); DEVELOPERS.md (safety caution).
    const r = await cli('analyze', 'datasets/pump-seal-wear.csv');
    expect(r.status).toBe(0);
    for (const part of ['Ranking (best first)', 'Candidates', 'AICc', 'A² =', 'X² =', 'Ranking rule', 'Methods and sources', 'Caution', 'governing codes']) {
      expect(r.stdout).toContain(part);
    }
  });

  it('lists not-applicable families with the reason', async () => {
    // Source: issue 2 (a family whose support excludes some values is reported with the reason and count).
    const path = tempCsv('with-zero.csv', 'x\n0\n1.5\n2.5\n3\n4.5\n6\n');
    const r = await cli('analyze', path, '--families', 'normal,weibull');
    expect(r.status, r.stderr).toBe(0);
    expect(r.stdout).toContain('Not applicable');
    expect(r.stdout).toContain('weibull:');
  });
});

/**
 * The trade-workflow options of `plumbline analyze` (issue 4), through the spawned CLI on the demo
 * datasets (datasets/README.md: invented scenarios with stated generating models).
 */
import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { runCli } from '../../cli/run.js';
import { cli, root, scratchCsv, type SpawnedCli } from '../helpers/cli.js';

const tempCsv = scratchCsv('plumbline-workflows-');

const ISSUE2_KEYS = ['software', 'n', 'summary', 'options', 'rankingRule', 'candidates', 'notApplicable', 'warnings', 'methods', 'input'];

/** Spawn `plumbline` with JSON output: nothing on stderr but bootstrap progress (cli/progress.ts, for runs past a second), exit 0, and every issue-2 key in the report. */
async function analyzeJson(...args: string[]): Promise<{ r: SpawnedCli; j: any }> {
  const r = await cli(...args);
  expect(r.stderr.replace(/^plumbline: bootstrap \d+ % \([\d,]+ of [\d,]+ replicates; \w+\)\n/gm, '')).toBe('');
  expect(r.status).toBe(0);
  const j = JSON.parse(r.stdout);
  for (const k of ISSUE2_KEYS) expect(j).toHaveProperty(k);
  return { r, j };
}

describe.concurrent('plumbline analyze: trade workflows', () => {
  it('life data: bearing-life.csv with --censor-column status --b-life 10 (datasets/README.md: 30 units, 22 failed, 8 censored at 2500 h)', async () => {
    const { r, j } = await analyzeJson('analyze', 'datasets/bearing-life.csv', '--column', 'hours', '--censor-column', 'status', '--b-life', '10', '--replicates', '19', '--json');
    expect(j.dataKind).toBe('censored');
    expect(j.n).toBe(30);
    expect(j.life.failures).toBe(22);
    expect(j.life.suspensions).toBe(8);
    expect(j.input.otherColumns).toEqual([{ role: 'status', column: 'status' }]);
    const w = j.candidates.find((c: { family: string }) => c.family === 'weibull');
    const b10 = w.bLives[0];
    expect(b10.percent).toBe(10);
    // B10 is the Weibull quantile at 0.10 of the reported fit (closed form).
    const q = w.parameters.scale * Math.pow(-Math.log(0.9), 1 / w.parameters.shape);
    expect(Math.abs(b10.estimate - q) / q).toBeLessThan(1e-12);
    expect(b10.lower).toBeLessThan(b10.estimate);
    expect(b10.upper).toBeGreaterThan(b10.estimate);
    expect(b10.confidence).toBe(0.9);
    expect(w.chiSquare.computable).toBe(false);
    expect(w.andersonDarling.method).toBe('bootstrap');
    expect(j.sensitivity[0].quantity).toBe('B10 life');
  });

  it('life data text report: the life section with its cautions', async () => {
    const r = await cli('analyze', 'datasets/bearing-life.csv', '--column', 'hours', '--censor-column', 'status', '--b-life', '1,10', '--reliability-at', '1000', '--bounds', 'fisher', '--replicates', '19');
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/^Life data$/m);
    expect(r.stdout).toMatch(/22 failed, 8 suspended/);
    expect(r.stdout).toMatch(/Fisher matrix/);
    expect(r.stdout).toMatch(/R\(1000\)/);
    expect(r.stdout).toMatch(/representative/);
    expect(r.stdout).toMatch(/^Model sensitivity/m);
  });

  it('flood: river-peaks.csv with --return-periods and --design-life (datasets/README.md: 60 annual peaks)', async () => {
    const { j } = await analyzeJson('analyze', 'datasets/river-peaks.csv', '--column', 'peak_flow_m3s', '--order-column', 'year', '--return-periods', '2,10,100', '--design-life', '50', '--replicates', '19', '--json');
    expect(j.options.families).toContain('gev');
    expect(j.flood.recordLength).toBe(60);
    for (const c of j.candidates) {
      const levels = c.returnLevels.map((l: { estimate: number }) => l.estimate);
      expect(levels[1]).toBeGreaterThan(levels[0]);
      expect(levels[2]).toBeGreaterThan(levels[1]);
    }
    // 1 - (1 - 1/100)^50 (arithmetic).
    expect(Math.abs(j.flood.designLife.exceedance[2].probability - (1 - Math.pow(0.99, 50)))).toBeLessThan(1e-12);
    expect(j.trend.orderFrom).toBe('column');
    expect(j.trend.n).toBe(60);
  });

  it('flood text report: the return-level table, the GEV sign note and the caution', async () => {
    const r = await cli('analyze', 'datasets/river-peaks.csv', '--column', 'peak_flow_m3s', '--return-periods', '10,500', '--plotting-position', 'cunnane', '--replicates', '19');
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/^Flood frequency$/m);
    expect(r.stdout).toMatch(/Cunnane/);
    expect(r.stdout).toMatch(/heavy upper tail/);
    expect(r.stdout).toMatch(/governing guideline/);
    expect(r.stdout).toMatch(/beyond twice the 60-year record/);
  });

  it('capability: shaft-diameter.csv with --lsl/--usl --subgroup-column (datasets/README.md: 25 subgroups of 5)', async () => {
    const { j } = await analyzeJson('analyze', 'datasets/shaft-diameter.csv', '--column', 'diameter_mm', '--lsl', '24.99', '--usl', '25.01', '--subgroup-column', 'subgroup', '--json');
    const cap = j.capability;
    expect(cap.n).toBe(125);
    expect(cap.within.subgroups).toBe(25);
    const names = [...cap.overall, ...cap.within.indices].map((i: { name: string }) => i.name);
    for (const n of ['Pp', 'Ppk', 'Cp', 'Cpk']) expect(names).toContain(n);
    // Pp = (USL - LSL)/(6 s), s the n - 1 standard deviation (definition, NIST e-Handbook §6.1.6).
    const pp = cap.overall.find((i: { name: string }) => i.name === 'Pp');
    expect(Math.abs(pp.estimate - 0.02 / (6 * cap.sdOverall)) / pp.estimate).toBeLessThan(1e-12);
    for (const c of j.candidates) expect(c.ppmOutOfSpec.total).toBeCloseTo(c.ppmOutOfSpec.belowLsl + c.ppmOutOfSpec.aboveUsl, 9);
    expect(typeof cap.normality.passes).toBe('boolean');
    expect(cap.cautions.join(' ')).toMatch(/safety-critical/);
  });

  it('grouped counts: --grouped reads lower,upper,count', async () => {
    const f = tempCsv('classes.csv', 'lower,upper,count\n0,100,12\n100,200,30\n200,300,25\n300,400,10\n400,600,5\n');
    const r = await cli('analyze', f, '--grouped', '--json');
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(j.dataKind).toBe('grouped');
    expect(j.n).toBe(82);
    for (const c of j.candidates) {
      expect(c.andersonDarling.offered).toBe(false);
      if (c.chiSquare.computable) expect(c.chiSquare.dof).toBe(c.chiSquare.k - 1 - c.estimatedParameters);
    }
    const t = await cli('analyze', f, '--grouped');
    expect(t.status).toBe(0);
    expect(t.stdout).toMatch(/grouped counts/);
    // The dof rule is asymptotic (Cramér 1946, §30.3; from memory): the report must not call it exact.
    expect(t.stdout.replace(/\s+/g, ' ')).toMatch(/k - 1 - m: the parameters are fitted to these cells by maximum likelihood, so the χ² reference distribution holds asymptotically/);
    expect(t.stdout).not.toMatch(/exact here/);
  });

  it('a bad status value → exit 2 naming the row, the column and the value', async () => {
    const f = tempCsv('bad-status.csv', 'hours,status\n100,1\n200,0\n300,2\n400,1\n');
    const r = await cli('analyze', f, '--column', 'hours', '--censor-column', 'status', '--json');
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/row 4/); // the header is line 1
    expect(r.stderr).toMatch(/column "status"/);
    expect(r.stderr).toMatch(/"2"/);
  });

  it('a repeated year in the order column → exit 2 naming the row and the column', async () => {
    const f = tempCsv('dup-year.csv', 'year,peak\n2001,10\n2002,12\n2002,9\n2004,15\n2005,11\n');
    const r = await cli('analyze', f, '--column', 'peak', '--order-column', 'year', '--families', 'normal');
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/row 4, column "year": order value 2002 repeats row 3/);
  });

  it('options are validated with one-line errors (exit 2; in-process through runCli, the function main.ts calls)', () => {
    const cases: [string[], RegExp][] = [
      [['--b-life', '10'], /--b-life needs --censor-column/],
      [['--censor-column', 'status', '--b-life', '0,10'], /--b-life: "0" is not a number between 0 and 100, exclusive/],
      [['--censor-column', 'status', '--bounds', 'exact'], /--bounds must be "likelihood-ratio" or "fisher-matrix"/],
      [['--censor-column', 'status', '--confidence', '1.5'], /--confidence must be a number between 0 and 1, exclusive/],
      [['--return-periods', '1,10'], /--return-periods: "1" is not a number above 1/],
      [['--design-life', '50'], /--design-life needs --return-periods/],
      [['--lsl', '3', '--usl', '2'], /--lsl \(3\) must be below --usl \(2\)/],
      [['--subgroup-column', 'unit'], /--subgroup-column needs --lsl or --usl/],
      [['--censor-column', 'status', '--lsl', '100'], /--censor-column cannot be combined/],
      [['--censor-column', 'nosuch'], /nosuch/],
    ];
    for (const [extra, re] of cases) {
      let stderr = '';
      let stdout = '';
      const status = runCli(['analyze', join(root, 'datasets/bearing-life.csv'), '--column', 'hours', ...extra], { out: (x) => (stdout += x), err: (x) => (stderr += x) });
      const r = { status, stderr, stdout };
      expect(r.stdout, extra.join(' ')).toBe('');
      expect(r.status, extra.join(' ')).toBe(2);
      expect(r.stderr.trim().split('\n'), extra.join(' ')).toHaveLength(1);
      expect(r.stderr, extra.join(' ')).toMatch(re);
    }
  });
});

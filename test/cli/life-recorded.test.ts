import { describe, expect, it } from 'vitest';
import { parseArgs, type AnalyzeArgs } from '../../cli/args.js';
import { isRecordedLife, runRecordedLife } from '../../cli/life-recorded.js';
import { runPlanCommand } from '../../cli/life-plan.js';
import { cli, root, scratchCsv } from '../helpers/cli.js';
import { readFixture, rel } from '../helpers/fixtures.js';

// Fixture: scripts/fixtures/life-interval.py (SciPy CensoredData interval fits refined by mpmath).
const fx = readFixture('life-interval.json');
const csv = scratchCsv('plumbline-life-');

function run(...argv: string[]): { code: number; out: string } {
  const args = parseArgs(['analyze', ...argv]) as AnalyzeArgs;
  expect(isRecordedLife(args)).toBe(true);
  let out = '';
  const code = runRecordedLife(args, { out: (s) => (out += s) });
  return { code, out };
}

/** The fixture's inspection set as a CSV with empty cells for "before the first inspection" and "still running". */
function inspectionCsv(): string {
  const s = fx.inspection;
  const rows = s.start.map((a: number, i: number) => `${a === 0 ? '' : a},${s.end[i] === null ? '' : s.end[i]},${s.count[i]}`);
  return csv('inspection.csv', ['start,end,units', ...rows].join('\n') + '\n');
}

describe('plumbline analyze with life data as recorded', () => {
  it('--interval-columns with --count-column: JSON candidates keep family, parameters, logLikelihood and match the SciPy/mpmath reference', () => {
    const r = run(inspectionCsv(), '--interval-columns', 'start,end', '--count-column', 'units', '--json', '--reliability-at', '1000');
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.dataKind).toBe('recorded-life');
    expect(j.life.n).toBe(80);
    expect([j.life.left, j.life.interval, j.life.exact, j.life.right]).toEqual([15, 48, 8, 9]);
    for (const c of j.life.candidates) {
      for (const k of ['family', 'parameters', 'logLikelihood', 'estimation', 'bLives']) expect(c).toHaveProperty(k);
      if (c.family === 'weibull-mixture') continue;
      for (const [k, v] of Object.entries(fx.inspection.fits[c.family].parameters as Record<string, number>)) expect(rel(c.parameters[k], v)).toBeLessThan(1e-6);
    }
    // The last Turnbull box runs beyond the last inspection: Infinity is written as null.
    expect(j.life.turnbull.intervals.at(-1).upper).toBeNull();
  });

  it('text report: the estimator, bounds, Turnbull boxes and the safety caution are printed', () => {
    const r = run(inspectionCsv(), '--interval-columns', 'start,end', '--count-column', 'units', '--b-life', '1,10', '--replicates', '39');
    expect(r.out).toMatch(/Units: 80 — exact failure times 8, failed before the first inspection 15, found failed at an inspection 48, still running 9/);
    expect(r.out).toMatch(/Estimation: maximum likelihood \(the default\)/);
    expect(r.out).toMatch(/Nonparametric estimate \(Turnbull\)/);
    expect(r.out).toMatch(/B1 .* likelihood ratio/);
    expect(r.out).toMatch(/licensed practice/);
    // The inspection-scheme A² bootstrap, with --replicates read through the option table.
    expect(r.out).toMatch(/Goodness of fit: Anderson–Darling A² on the Turnbull estimate/);
    expect(r.out).toMatch(/Weibull\s+\S+\s+\S+\s+\S+\s+39\s+\d+\s+(not )?rejected/);
  });

  it('the seal demo with --mode-column: each mode and the system; --assumed-shape adds Weibayes', () => {
    const r = run(`${root}datasets/seal-failure-modes.csv`, '--column', 'hours', '--censor-column', 'status', '--mode-column', 'mode', '--assumed-shape', '3', '--json');
    const j = JSON.parse(r.out);
    expect(j.life.modes.modes.map((m: { mode: string }) => m.mode)).toEqual(['crack', 'leak']);
    expect(j.life.modes.modes.map((m: { failures: number }) => m.failures)).toEqual([17, 32]);
    expect(j.life.modes.system.bLives[0].estimate).toBeGreaterThan(0);
    expect(j.life.weibayes.shapeIs).toBe('assumed');
  });

  it('--estimation rank-regression names the estimator; the plan options print the calculator', () => {
    const r = run(`${root}datasets/bearing-life.csv`, '--column', 'hours', '--censor-column', 'status', '--estimation', 'rank-regression', '--plan-reliability', '0.9', '--plan-time', '1000', '--assumed-shape', '1.8');
    expect(r.out).toMatch(/Estimation: rank regression; candidates ranked by correlation/);
    expect(r.out).toMatch(/Test plan: demonstrate R\(1000\) ≥ 0\.9 with 90 % confidence/);
    expect(r.out).toMatch(/rounded up to 22/);
  });

  it('plan alone: JSON with the derivation', () => {
    let out = '';
    runPlanCommand(new Map<string, number | boolean>([['planReliability', 0.95], ['planTime', 500], ['assumedShape', 2], ['planConfidence', 0.95], ['json', true]]), { out: (s) => (out += s) });
    const j = JSON.parse(out);
    expect(j.plan.rows.find((r: { timeRatio: number }) => r.timeRatio === 1).unitsBinomial).toBe(59);
  });

  it('refuses a plan without a shape, and rank regression on interval rows, with the option named', () => {
    expect(() => run(inspectionCsv(), '--interval-columns', 'start,end', '--plan-reliability', '0.9', '--plan-time', '10')).toThrow(/needs --assumed-shape/);
    expect(() => run(inspectionCsv(), '--interval-columns', 'start,end', '--count-column', 'units', '--estimation', 'rank-regression')).toThrow(/Rank regression needs exact failure times/);
  });

  it('the command routes there: plumbline analyze on the valve demo, and plumbline plan', async () => {
    const a = await cli('analyze', 'datasets/valve-inspections.csv', '--interval-columns', 'start_months,end_months', '--count-column', 'valves', '--json');
    expect(a.status).toBe(0);
    const j = JSON.parse(a.stdout);
    expect([j.life.n, j.life.left, j.life.right]).toEqual([150, 1, 29]);
    const p = await cli('plan', '--plan-reliability', '0.9', '--plan-time', '1000', '--assumed-shape', '2');
    expect(p.status).toBe(0);
    expect(p.stdout).toMatch(/rounded up to 22/);
    const bad = await cli('plan', '--plan-reliability', '0.9', '--plan-time', '1000');
    expect(bad.status).toBe(2);
    expect(bad.stderr).toMatch(/needs --assumed-shape/);
  });
});

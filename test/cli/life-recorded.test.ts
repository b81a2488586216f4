import { describe, expect, it } from 'vitest';
import { parseArgs, type AnalyzeArgs } from '../../cli/args.js';
import { isRecordedLife, runRecordedLife } from '../../cli/life-recorded.js';
import { runPlanCommand } from '../../cli/life-plan.js';
import { cli, root, scratchCsv } from '../helpers/cli.js';
import { readFixture, rel } from '../helpers/fixtures.js';
import { STATED_CSV } from '../helpers/stated-schedules.js';

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

/*
 * Issue 13's few-failure and stated-schedule parts on the command line:
 *  - zero failures with --assumed-shape: the caution says what the page says (no shape estimated, the
 *    shape assumed, the numbers bounds not estimates, safety), not "estimates, especially a shape, are
 *    uncertain";
 *  - time + status with r ≥ 2 failures and --assumed-shape: Weibayes beside maximum likelihood, its
 *    numbers equal to Nelson's (1985, J. Quality Technology 17:140-146) closed form with SciPy's
 *    chi2.ppf (test/fixtures/life-weibayes.json, scripts/fixtures/life-weibayes.py);
 *  - --inspection-times-column: every unit inspected at its own stated times in the bootstrap.
 */
const wbFx = readFixture('life-weibayes.json');
const statusCsv = (name: string, times: readonly number[], failed: readonly number[]) => csv(name, `hours,status\n${times.map((t, i) => `${t},${failed[i]}`).join('\n')}\n`);

describe('Weibayes on the command line', () => {
  it('zero failures: the caution says no shape is estimated, the shape is assumed, the numbers are bounds, and safety', () => {
    const c = wbFx.weibayes[0];
    const r = run(statusCsv('zero.csv', c.times, c.failed), '--column', 'hours', '--censor-column', 'status', '--assumed-shape', '2');
    expect(r.code).toBe(0);
    const cautions = r.out.slice(r.out.indexOf('\nCautions\n'), r.out.indexOf('\nMethods\n'));
    expect(cautions).not.toMatch(/especially a shape/);
    expect(cautions).toContain('Only 0 failures among 12 units: no model can be fitted and no shape is estimated; the Weibull shape β = 2 is assumed, so the numbers below are lower bounds (one-sided 90 %) on the scale and the B-lives, not estimates of them');
    expect(cautions).toMatch(/the bound does not cover a wrong β/);
    expect(cautions).toMatch(/licensed practice/);
    // the bound printed is SciPy's (2E / chi2.ppf(0.9, 2))^(1/2)
    expect(r.out).toContain(`lower bound (one-sided 90 %): ${Number(c.scaleLower.toPrecision(5))}`);
  });

  it('r ≥ 2 failures: Weibayes beside the maximum-likelihood fits, as Nelson’s closed form with SciPy chi2.ppf (JSON and text)', () => {
    const c = wbFx.weibayes[2];
    expect(c.failed.reduce((a: number, f: number) => a + f, 0)).toBeGreaterThanOrEqual(2);
    const file = statusCsv('some.csv', c.times, c.failed);
    const j = JSON.parse(run(file, '--column', 'hours', '--censor-column', 'status', '--assumed-shape', String(c.shape), '--json').out);
    const w = j.life.weibayes;
    expect(j.life.candidates.find((x: { family: string }) => x.family === 'weibull').estimation).toBe('ml');
    expect(w.shapeIs).toBe('assumed');
    expect(rel(w.scale, c.scale)).toBeLessThan(1e-13);
    expect(rel(w.scaleLower, c.scaleLower)).toBeLessThan(1e-12);
    expect(w.degreesOfFreedom).toBe(2 * w.failures + 2);
    const ml = j.life.candidates.find((x: { family: string }) => x.family === 'weibull').parameters.shape;
    expect(j.life.cautions).toContain(
      `Weibayes is an alternative beside maximum likelihood, not an estimate of the shape: it assumes β = 2, while maximum likelihood estimates β̂ = ${Number(ml.toPrecision(4))} from these ${w.failures} failures; B10: ${Number(w.bLives[0].estimate.toPrecision(4))} with β assumed, ${Number(j.life.candidates.find((x: { family: string }) => x.family === 'weibull').bLives[0].estimate.toPrecision(4))} by maximum likelihood. A β far from β̂ is not supported by these data.`,
    );
    const text = run(file, '--column', 'hours', '--censor-column', 'status', '--assumed-shape', '2').out;
    expect(text).toMatch(/Weibayes \(shape β = 2 ASSUMED, not estimated\)/);
    expect(text).toMatch(/Weibayes is an alternative beside maximum likelihood/);
  });
});

describe('--inspection-times-column', () => {
  it('the bootstrap inspects each unit at its stated times; the scheme is named; a row its times cannot give is refused by row', () => {
    const file = csv('stated.csv', STATED_CSV + '\n');
    const j = JSON.parse(run(file, '--interval-columns', 'start,end', '--inspection-times-column', 'seen', '--families', 'weibull', '--replicates', '39', '--json').out);
    expect(j.life.candidates[0].goodnessOfFit.scheme).toBe('stated');
    expect(j.life.methods.find((m: { topic: string }) => m.topic === 'goodness of fit').text).toMatch(/exactly the inspection times stated for it/);
    const bad = csv('bad.csv', ['start,end,seen', '45,70,15; 45; 60; 70'].join('\n') + '\n');
    expect(() => run(bad, '--interval-columns', 'start,end', '--inspection-times-column', 'seen')).toThrow(/Row 2: running at 45 and found failed at 70, which must be consecutive inspection times of the unit \(15; 45; 60; 70\)/);
  });
});

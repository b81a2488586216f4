/** The capability contract on the command line: --transform, --natural-lower-bound, --capability-replicates. */
import { describe, expect, it } from 'vitest';
import { cli, scratchCsv } from '../helpers/cli.js';

// datasets/pump-seal-wear.csv: an invented, right-skewed wear characteristic (datasets/README.md), 80 values.
const DATA = 'datasets/pump-seal-wear.csv';

describe('plumbline analyze: capability transformations', () => {
  it('--transform boxcox: JSON capability.transform has kind, lambda with its interval, and the indices computed on it', async () => {
    const r = await cli('analyze', DATA, '--usl', '200', '--natural-lower-bound', '0', '--transform', 'boxcox', '--capability-replicates', '99', '--json');
    expect(r.status).toBe(0); // stderr may carry progress lines
    const c = JSON.parse(r.stdout).capability;
    expect(c.transform.kind).toBe('boxcox');
    expect(typeof c.transform.lambda).toBe('number');
    expect(c.transform.lambdaInterval.lower).toBeLessThan(c.transform.lambda);
    expect(c.transform.indices.map((i: { name: string }) => i.name)).toEqual(['Ppk', 'Ppu']);
    expect(c.transform.percentile.indices.map((i: { name: string }) => i.name)).toEqual(['Ppk', 'Ppu']);
    expect(c.transform.intervals.intervals[0].replicates + c.transform.intervals.intervals[0].failed).toBe(99);
    expect(c.bounds.naturalLowerBound).toBe(0);
    for (const row of [...c.comparison.passing, ...c.comparison.rejected]) expect(row.ppmBelow).toBe(0);
  });
  it('--transform johnson: the Johnson type and parameters; the text report names the curve and the comparison', async () => {
    const j = await cli('analyze', DATA, '--usl', '200', '--transform', 'johnson', '--capability-replicates', '49', '--json');
    const t = JSON.parse(j.stdout).capability.transform;
    expect(['SU', 'SB', 'SL']).toContain(t.type);
    expect(Object.keys(t.parameters).sort()).toEqual(['delta', 'gamma', 'lambda', 'xi']);
    const txt = await cli('analyze', DATA, '--usl', '200', '--transform', 'johnson', '--capability-replicates', '49');
    expect(txt.stdout).toMatch(/Transformation: Johnson S[UBL] by Slifker & Shapiro percentiles/);
    expect(txt.stdout).toMatch(/Models that pass the tests:/);
    // no interval under a Johnson curve (its coverage could not be calibrated: scripts/capability-coverage-calibration.ts), and the report says so
    expect(t.intervals.intervals).toBeNull();
    expect(t.intervals.note).toMatch(/^No bootstrap interval under a Johnson curve: its coverage could not be calibrated/);
    expect(txt.stdout.replace(/\s+/g, ' ')).toMatch(/No bootstrap interval under a Johnson curve: its coverage could not be calibrated/);
  });
  it('when no model passes: no empty table, the rejected models apart (shaft-diameter demo, every model rejected)', async () => {
    const r = await cli('analyze', 'datasets/shaft-diameter.csv', '--column', 'diameter_mm', '--lsl', '24.99', '--usl', '25.01', '--capability-replicates', '19');
    expect(r.stdout).toMatch(/No model passes the tests\.\n  Rejected by a test \(shown apart, not in the spread\):/);
    expect(r.stdout).not.toMatch(/Models that pass the tests:/);
  });
  it('one normal number per report: the sensitivity row gives the comparison\'s normal ppm (overall sd, n - 1) and says so', async () => {
    const r = await cli('analyze', DATA, '--usl', '120', '--transform', 'boxcox', '--capability-replicates', '19', '--json');
    const j = JSON.parse(r.stdout);
    const rows = [...j.capability.comparison.passing, ...j.capability.comparison.rejected];
    const normal = rows.find((x: { kind: string }) => x.kind === 'normal');
    expect(normal.sigma).toMatch(/n - 1/);
    const sens = j.sensitivity.find((s: { quantity: string }) => s.quantity === 'ppm out of spec').values.find((v: { family: string }) => v.family === 'normal');
    expect(sens.estimate).toBe(normal.ppmTotal);
    expect(sens.label).toMatch(/sd n - 1/);
    const txt = await cli('analyze', DATA, '--usl', '120', '--transform', 'boxcox', '--capability-replicates', '19');
    const shown = [...txt.stdout.matchAll(/normal \(sd n - 1\) ([0-9.]+)/g)].map((m) => m[1]);
    expect(shown).toHaveLength(1);
    expect(txt.stdout).toMatch(new RegExp(`normal +sd \\(n - 1\\) +[0-9.]+ +0 +${shown[0]!.replace('.', '\\.')} `));
  });
  it('with a subgroup column the X̄ and R chart is given beside the X̄ and S one, with its factors (shaft-diameter demo, subgroups of 5)', async () => {
    const args = ['analyze', 'datasets/shaft-diameter.csv', '--column', 'diameter_mm', '--subgroup-column', 'subgroup', '--lsl', '24.99', '--usl', '25.01', '--capability-replicates', '19'];
    const j = JSON.parse((await cli(...args, '--json')).stdout).capability;
    expect(j.rangeChart.kind).toBe('subgroup means and ranges');
    expect(j.rangeChart.factors.n).toBe(5);
    expect(j.rangeChart.location.points).toHaveLength(25);
    const t = (await cli(...args)).stdout;
    // Montgomery's table (from memory) prints A2 0.577, D4 2.114 for n = 5
    expect(t).toMatch(/Beside it, subgroup means and ranges:[\s\S]*A2 0\.5768, D3 0, D4 2\.114/);
  });
  it('default is none; an unknown transformation is refused (exit 2) naming the choices', async () => {
    const d = await cli('analyze', DATA, '--usl', '200', '--capability-replicates', '19', '--json');
    expect(JSON.parse(d.stdout).capability.transform).toEqual({ kind: 'none' });
    const bad = await cli('analyze', DATA, '--usl', '200', '--transform', 'logit');
    expect(bad.status).toBe(2);
    expect(bad.stderr).toMatch(/boxcox/);
  });
  it('Box–Cox on data with a zero: the transformation is not fitted, said in the warnings; the rest of the report stands', async () => {
    const file = scratchCsv('plumbline-cap-')('zero.csv', 'x\n' + [0, 1.2, 2.5, 3.1, 0.7, 1.9, 2.2, 4.0, 1.1, 2.8].join('\n') + '\n');
    const r = await cli('analyze', file, '--usl', '6', '--transform', 'boxcox', '--capability-replicates', '19', '--json');
    expect(r.status).toBe(0);
    const c = JSON.parse(r.stdout).capability;
    expect(c.transform).toMatchObject({ kind: 'none', requested: 'boxcox' });
    expect(c.transform.reason).toMatch(/positive/);
    expect(c.warnings.join(' ')).toMatch(/Box–Cox transformation could not be fitted: .*positive/);
  });
});

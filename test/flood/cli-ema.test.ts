/**
 * The hydrologist's run end to end on the invented gauge (datasets/invented-gauge-peaks.txt):
 * CLI options through the option contract (parseArgs), EMA with historic peaks, low outliers and a
 * regional skew; JSON contract names (family, parameters {mean, sd, skew}, logLikelihood null,
 * returnLevels [{period, estimate, lower, upper, method}]) and the text report's cautions.
 */
import { describe, expect, it } from 'vitest';
import { fileURLToPath } from 'node:url';
import { parseArgs, type AnalyzeArgs } from '../../cli/args.js';
import { floodEmaText, isFloodEma, runFloodEmaJson } from '../../cli/flood-ema.js';

const FILE = fileURLToPath(new URL('../../datasets/invented-gauge-peaks.txt', import.meta.url));

function args(extra: string[]): AnalyzeArgs {
  return parseArgs(['analyze', FILE, '--estimation', 'ema', '--return-periods', '10,100', '--replicates', '60', ...extra]) as AnalyzeArgs;
}

describe('plumbline analyze GAUGE --estimation ema', () => {
  it('JSON: logpearson3 by EMA with station and regional skews, weights and return levels', () => {
    const a = args(['--regional-skew', '-0.1', '--regional-skew-mse', '0.12']);
    expect(isFloodEma(a)).toBe(true);
    const j = runFloodEmaJson(a);
    const c = j.candidates[0]!;
    expect(c.family).toBe('logpearson3');
    expect(c.logLikelihood).toBeNull();
    expect(Object.keys(c.parameters).sort()).toEqual(['mean', 'sd', 'skew']);
    expect(c.skew.regionalSkew).toBe(-0.1);
    expect(c.skew.stationWeight + c.skew.regionalWeight).toBeCloseTo(1, 14);
    expect(c.parameters.skew).toBe(c.skew.weightedSkew);
    expect(c.returnLevels.map((r) => r.period)).toEqual([10, 100]);
    for (const r of c.returnLevels) {
      expect(Object.keys(r).sort()).toEqual(['bootstrap', 'equivalentYears', 'estimate', 'lower', 'method', 'period', 'upper']);
      expect(r.lower).not.toBeNull();
      expect(r.method).toMatch(/Cohn, Lane & Stedinger 2001/);
      expect(r.bootstrap!.method).toMatch(/parametric bootstrap/);
    }
    expect(c.lowOutliers.count).toBeGreaterThanOrEqual(2);
    expect(j.input.codes.map((x) => x.code)).toEqual(['2', '4', '6', '7', '8']);
  });
  it('text: the skews, the codes, the return levels and the cautions deferring to the governing agency', () => {
    const text = floodEmaText(runFloodEmaJson(args(['--regional-skew', '-0.1', '--regional-skew-mse', '0.12'])));
    expect(text).toMatch(/weighted skew/);
    expect(text).toMatch(/Qualification codes found/);
    expect(text).toMatch(/governing agency/);
    expect(text).toMatch(/Low outliers: \d+ peaks below/);
  });
  it('a regional skew without its MSE is refused', () => {
    expect(() => runFloodEmaJson(args(['--regional-skew', '-0.1']))).toThrow(/go together/);
  });
});

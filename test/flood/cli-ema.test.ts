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
import type { DatasetReport } from '../../core/index.js';
import type { FloodEmaBlock } from '../../core/workflow/flood-estimators.js';
import { EMA_CAUTIONS, emaCautions } from '../../core/flood/ema-cautions.js';

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
    // The skew's effective record length: 83.6 of the 137 years (73 systematic with 3 low outliers censored, 2 interval
    // years counted as systematic, 62 historical years mostly below the threshold; 90.3 before the station skew's MSE
    // used it, which moved the weighted skew). It is the n of the station skew's MSE. Holding the interval years fixed
    // in the covariance gave 11.8, fewer than the systematic peaks alone — the guard against that.
    expect(c.effectiveRecordLength!).toBeGreaterThan(c.counts.peaks - c.counts.lowOutliers);
    expect(c.effectiveRecordLength!).toBeLessThan(c.counts.years);
    expect(c.skew.mseYears).toBe(c.effectiveRecordLength);
    expect(j.input.codes.map((x) => x.code)).toEqual(['2', '4', '6', '7', '8']);
  });
  it('text: the skews, the codes, the return levels and the cautions deferring to the governing agency', () => {
    const text = floodEmaText(runFloodEmaJson(args(['--regional-skew', '-0.1', '--regional-skew-mse', '0.12'])));
    expect(text).toMatch(/weighted skew/);
    expect(text).toMatch(/Qualification codes found/);
    expect(text).toMatch(/governing agency/);
    expect(text).toMatch(/Low outliers: \d+ peaks below/);
  });
  it('the record-specific caution: the gauge alone (station skew -1.60, 3 low outliers censored) gets it; weighted with a regional skew (station skew -0.84) it does not', () => {
    const alone = runFloodEmaJson(args([]));
    expect(alone.candidates[0]!.skew.stationSkew).toBeLessThan(-1.5);
    expect(alone.cautions.join(' ')).toMatch(/strongly skewed \(station skew -1\.6\d?\) and has 3 low years censored/);
    const weighted = runFloodEmaJson(args(['--regional-skew', '-0.1', '--regional-skew-mse', '0.12']));
    expect(weighted.cautions.join(' ')).not.toMatch(/strongly skewed/);
    expect(weighted.cautions.length).toBe(alone.cautions.length - 1);
  });
  it('the caution\'s condition: |station skew| ≥ 1 and at least one low year censored (a low outlier or a zero flow)', () => {
    const f = (g: number, low: number, zeros: number) => emaCautions({ skew: { stationSkew: g }, counts: { lowOutliers: low, zeros } });
    expect(f(-1, 1, 0)).toHaveLength(EMA_CAUTIONS.length + 1);
    expect(f(1.2, 0, 2)).toHaveLength(EMA_CAUTIONS.length + 1);
    expect(f(-0.999, 3, 0)).toBe(EMA_CAUTIONS);
    expect(f(-1.6, 0, 0)).toBe(EMA_CAUTIONS);
  });
  it('a regional skew without its MSE is refused', () => {
    expect(() => runFloodEmaJson(args(['--regional-skew', '-0.1']))).toThrow(/go together/);
  });
});

describe('one default seed for the EMA bootstrap on the CLI and through the API/page pipeline', () => {
  it('a CSV column of annual peaks gives the same bootstrap interval both ways with no --seed (the option table default, stream 12)', async () => {
    const { writeFileSync, mkdtempSync } = await import('node:fs');
    const { tmpdir } = await import('node:os');
    const { join } = await import('node:path');
    const { analyzeDataset } = await import('../../core/index.js');
    const peaks = [412, 655, 1020, 388, 790, 2140, 560, 933, 1210, 475, 690, 1580, 820, 505, 1340, 720, 980, 610, 1750, 845, 530, 1100];
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-ema-seed-'));
    const file = join(dir, 'peaks.csv');
    writeFileSync(file, `peak\n${peaks.join('\n')}\n`);
    const cli = runFloodEmaJson(parseArgs(['analyze', file, '--estimation', 'ema', '--column', 'peak', '--return-periods', '10,100']) as AnalyzeArgs);
    const api = analyzeDataset({ values: peaks }, { returnPeriods: [10, 100], families: ['gumbel'], estimation: 'ema' }) as DatasetReport;
    const ema = api.flood!.estimators!.ema as FloodEmaBlock;
    const a = cli.candidates[0]!.returnLevels;
    const b = ema.returnLevels;
    a.forEach((r, i) => {
      expect(r.bootstrap!.lower).toBe(b[i]!.bootstrapLower);
      expect(r.bootstrap!.upper).toBe(b[i]!.bootstrapUpper);
      expect(r.lower).toBe(b[i]!.lower);
    });
  });
});

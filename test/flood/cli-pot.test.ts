/**
 * plumbline analyze FILE --threshold U --date-column D --column V: the peaks-over-threshold run
 * through the option contract, on the invented seeded daily series of test/fixtures/flood-pot.json
 * written as a dated CSV; JSON contract names and the SciPy reference values of that fixture.
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseArgs, type AnalyzeArgs } from '../../cli/args.js';
import { floodPotText, isFloodPot, runFloodPotJson } from '../../cli/flood-pot.js';

const FIX = JSON.parse(readFileSync(new URL('../fixtures/flood-pot.json', import.meta.url), 'utf8')) as { values: number[]; clusters: number; tight: { shape: number }; returnLevels: Record<string, number> };
const dir = mkdtempSync(join(tmpdir(), 'plumbline-pot-'));
const file = join(dir, 'daily.csv');
const day0 = Date.UTC(2001, 0, 1);
writeFileSync(file, `date,flow\n${FIX.values.map((v, i) => `${new Date(day0 + i * 86_400_000).toISOString().slice(0, 10)},${v}`).join('\n')}\n`);

describe('plumbline analyze --threshold', () => {
  it('JSON: genpareto candidate with threshold, scale, shape, log-likelihood and return levels with intervals', () => {
    const a = parseArgs(['analyze', file, '--threshold', '25', '--min-separation', '3', '--date-column', 'date', '--column', 'flow', '--return-periods', '10,100']) as AnalyzeArgs;
    expect(isFloodPot(a)).toBe(true);
    const j = runFloodPotJson(a);
    expect(j.clusters).toBe(FIX.clusters);
    const c = j.candidates[0]!;
    expect(c.family).toBe('genpareto');
    expect(c.parameters.shape).toBeCloseTo(FIX.tight.shape, 5);
    expect(c.returnLevels[0]!.estimate).toBeCloseTo(FIX.returnLevels['10'] as number, 3);
    for (const r of c.returnLevels) expect(Object.keys(r).sort()).toEqual(['estimate', 'lower', 'method', 'period', 'upper']);
    expect(j.diagnostics.length).toBe(15);
    expect(floodPotText(j)).toMatch(/Threshold diagnostics/);
  });
  it('L-moments: no likelihood, no interval, said so', () => {
    const a = parseArgs(['analyze', file, '--threshold', '25', '--date-column', 'date', '--column', 'flow', '--estimation', 'lmoments']) as AnalyzeArgs;
    const c = runFloodPotJson(a).candidates[0]!;
    expect(c.logLikelihood).toBeNull();
    expect(c.returnLevels[0]!.lower).toBeNull();
    expect(c.returnLevels[0]!.method).toMatch(/L-moment/);
  });
});

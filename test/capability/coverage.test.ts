import { describe, expect, it } from 'vitest';
import { COVERAGE_SETUP, JOHNSON_SETUP, simulateOne } from '../../scripts/capability-coverage.js';
import { readFixture } from '../helpers/fixtures.js';

// The committed seeded simulation (scripts/capability-coverage.ts → test/fixtures/capability-coverage.json):
// 1000 simulated samples per n, each with the report's 999-replicate BCa interval (expanded levels).
const fx = readFixture('capability-coverage.json');

describe('coverage of the capability bootstrap interval (committed simulation)', () => {
  it('the committed setup is the script\'s (nominal 95 %, 999 replicates, 1000 samples) and covers n = 50 and 125', () => {
    expect(fx.setup).toEqual(JSON.parse(JSON.stringify(COVERAGE_SETUP)));
    expect(fx.setup.alpha).toBe(0.05);
    expect(fx.setup.replicates).toBe(999);
    expect(fx.results.map((r: { n: number }) => r.n)).toEqual(expect.arrayContaining([50, 125]));
  });
  for (const r of fx.results as { n: number; coverage: Record<string, { covered: number; simulations: number; coverage: number; standardError: number }> }[]) {
    it(`n = ${r.n}: coverage of Pp, Ppk, Ppu, Ppl within 1.5 points of 95 % (Monte Carlo se about 0.7 point)`, () => {
      expect(Object.keys(r.coverage).sort()).toEqual(['Pp', 'Ppk', 'Ppl', 'Ppu']);
      for (const c of Object.values(r.coverage)) {
        expect(c.simulations).toBe(1000);
        expect(c.coverage).toBeCloseTo(c.covered / c.simulations, 12);
        expect(Math.abs(c.coverage - 0.95)).toBeLessThanOrEqual(0.015);
        expect(c.standardError).toBeCloseTo(Math.sqrt((c.coverage * (1 - c.coverage)) / 1000), 12);
      }
    });
  }
  it('the committed numbers come from the committed code: the first simulated sample at n = 50 is reproduced exactly', () => {
    const r50 = fx.results.find((r: { n: number }) => r.n === 50);
    const again = simulateOne(50, 0);
    expect(again).toEqual(r50.firstSamples[0]);
  });
});

// The Johnson setup (scripts/capability-coverage.ts --johnson → test/fixtures/capability-coverage-johnson.json):
// reported as measured. At n = 125 it is within 1.5 points; at n = 50 the Slifker–Shapiro refit is so
// coarse that the intervals are wide and over-cover by up to 2.8 points (conservative, never short).
const jx = readFixture('capability-coverage-johnson.json');

describe('coverage with the Johnson curve (committed simulation, reported)', () => {
  it('the committed setup is the script\'s and the first sample at n = 125 is reproduced exactly', () => {
    expect(jx.setup).toEqual(JSON.parse(JSON.stringify(JOHNSON_SETUP)));
    const r125 = jx.results.find((r: { n: number }) => r.n === 125);
    expect(simulateOne(125, 0, JOHNSON_SETUP)).toEqual(r125.firstSamples[0]);
  });
  it('n = 125 within 1.5 points of 95 %; n = 50 never more than 1.5 points short (over-coverage allowed and stated)', () => {
    for (const r of jx.results as { n: number; coverage: Record<string, { coverage: number; simulations: number }> }[]) {
      for (const c of Object.values(r.coverage)) {
        expect(c.simulations).toBe(1000);
        expect(c.coverage).toBeGreaterThanOrEqual(0.935);
        if (r.n === 125) expect(c.coverage).toBeLessThanOrEqual(0.965);
      }
    }
  });
});

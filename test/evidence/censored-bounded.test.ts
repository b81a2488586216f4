/**
 * Censored evidence draws a thinned set of failures, and only those get their band computed: the
 * work is bounded by the plot's point cap, not by the number of units. The drawn bands are the
 * numbers the life report states for the same failures (core/life plotPositions, whose Johnson band
 * is the Beta(j, n + 1 - j) rank distribution and whose Kaplan–Meier band is Greenwood's; both
 * checked against SciPy in test/life/positions.test.ts and test/evidence/censored.test.ts).
 * The sample is invented: seeded Weibull lives with random and fixed censoring.
 */
import { describe, expect, it } from 'vitest';
import { getFamily } from '../../core/index.js';
import { drawingPositions, plotPositions, prepareLifeData } from '../../core/life/index.js';
import { censoredProbabilityPlot } from '../../core/evidence/censored.js';

function sample(n: number, seed: number): { times: number[]; failed: number[] } {
  let s = seed >>> 0;
  const u = (): number => {
    s ^= s << 13;
    s >>>= 0;
    s ^= s >>> 17;
    s ^= s << 5;
    s >>>= 0;
    return (s + 0.5) / 4294967296;
  };
  const times: number[] = [];
  const failed: number[] = [];
  for (let i = 0; i < n; i++) {
    const life = 1000 * (-Math.log(u())) ** (1 / 1.8);
    const c = Math.min(1500, 3000 * u());
    times.push(Math.min(life, c));
    failed.push(life <= c ? 1 : 0);
  }
  return { times, failed };
}

describe('censored evidence: bands only where drawn, equal to the report\'s', () => {
  const small = prepareLifeData(sample(400, 11));

  it.each(['johnson-benard', 'kaplan-meier'] as const)('%s: every band on demand equals plotPositions\' band for the same failure', (method) => {
    const all = plotPositions(small, method, 0.9).points;
    const d = drawingPositions(small, method, 0.9);
    expect(d.count).toBe(all.length);
    for (let i = 0; i < d.count; i++) {
      const p = all[i]!;
      expect([d.time[i], d.F[i], d.rank[i]]).toEqual([p.time, p.F, p.rank]);
      expect(d.band(i)).toEqual({ lower: p.lower, upper: p.upper });
    }
  });

  it('20,000 units, a cap of 300 points: at most one band per drawn point is computed, however many failures', () => {
    const life = prepareLifeData(sample(20_000, 5));
    const d = drawingPositions(life, 'johnson-benard', 0.9);
    let asked = 0;
    const counted = { ...d, band: (i: number) => (asked++, d.band(i)) };
    const weibull = getFamily('weibull').make({ shape: 1.8, scale: 1000 });
    const plot = censoredProbabilityPlot(weibull, life, counted, 'johnson-benard', 300, 0.9);
    expect(life.failures).toBeGreaterThan(10_000);
    expect(plot.thinned).toBe(true);
    expect(plot.total).toBe(life.failures);
    expect(asked).toBe(plot.points.x.length + plot.omitted);
    expect(asked).toBeLessThanOrEqual(2 * 300);
  });
});

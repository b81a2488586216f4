import { describe, expect, it } from 'vitest';
import { floodFrequency } from '../../core/flood/index.js';
import { readFixture } from '../helpers/fixtures.js';

// Reference values: scripts/fixtures/flood.py (mpmath-refined GEV and Gumbel log-likelihoods of
// the Port Pirie series, Coles 2001 Example 3.4.1).
const fx = readFixture('flood.json');

describe('floodFrequency on Port Pirie annual maxima, 1923-1987', () => {
  const gevRef = fx.fits.find((x: { name: string }) => x.name === 'port-pirie');
  const gumRef = fx.fits.find((x: { name: string }) => x.name === 'port-pirie-gumbel');
  const years = Array.from({ length: 65 }, (_, i) => 1923 + i);
  const a = floodFrequency(gevRef.values, { periods: [10, 100], designLife: 50, years, plotting: 'gringorten' });
  it('Gumbel vs GEV likelihood-ratio deviance from the fixture log-likelihoods; Gumbel retained (as Coles 2001 §3.4 concludes, from memory)', () => {
    const dev = 2 * (gevRef.logLikelihood - gumRef.logLikelihood);
    expect(a.gumbelVersusGev).not.toBeNull();
    expect(Math.abs(a.gumbelVersusGev!.deviance - dev)).toBeLessThan(1e-8);
    expect(a.gumbelVersusGev!.gumbelRetained).toBe(true);
    expect(a.gumbelVersusGev!.pValue).toBeGreaterThan(0.5);
  });
  it('carries both candidates with return levels, plotting positions, design-life risk, trend check and cautions', () => {
    expect(a.candidates.map((c) => c.fit.family)).toEqual(['gumbel', 'gev']);
    for (const c of a.candidates) expect(c.returnLevels!.levels).toHaveLength(2);
    expect(a.plotting.formula).toBe('gringorten');
    expect(a.plotting.points).toHaveLength(65);
    // 1 - 0.99^50 (arithmetic)
    expect(a.designLifeRisk[1]!.risk).toBeCloseTo(1 - Math.pow(0.99, 50), 13);
    expect(a.trend).not.toBeNull();
    expect(a.trend!.n).toBe(65);
    expect(a.cautions.join(' ')).toMatch(/governing guideline/);
    expect(a.cautions.join(' ')).toMatch(/opposite sign/);
    // 100 > 2·65? No: 100 < 130, so no beyond-record warning here
    expect(a.warnings.join(' ')).not.toMatch(/twice the/);
  });
});

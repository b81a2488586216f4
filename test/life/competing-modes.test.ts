import { describe, expect, it } from 'vitest';
import { getFamily } from '../../core/families/index.js';
import { createRng } from '../../core/random/index.js';
import { analyzeModes, fitCensored, prepareLifeData } from '../../core/life/index.js';

/** Seeded two-mode data: each unit fails at the earlier of a wear-out and an early mode; test stopped at `stop`. */
function twoModes(n: number, seed: number, stop: number) {
  const rng = createRng(seed, 0);
  const wear = getFamily('weibull').random({ shape: 3, scale: 1000 }, rng, n);
  const early = getFamily('weibull').random({ shape: 0.8, scale: 4000 }, rng, n);
  const times: number[] = [];
  const failed: number[] = [];
  const modes: (string | null)[] = [];
  for (let i = 0; i < n; i++) {
    const w = wear[i] as number;
    const e = early[i] as number;
    const t = Math.min(w, e, stop);
    times.push(t);
    failed.push(t < stop ? 1 : 0);
    modes.push(t >= stop ? null : w < e ? 'wear' : 'early');
  }
  return { times, failed, modes };
}

describe('several failure modes (competing risks)', () => {
  it("each mode is the right-censored fit with the other modes' failures as suspensions, and the joint likelihood is the sum (Meeker & Escobar 1998 §15.3)", () => {
    const d = twoModes(300, 5, 1200);
    const rep = analyzeModes(d, { family: 'weibull' });
    expect(rep.modes.map((m) => m.mode)).toEqual(['early', 'wear']);
    const dists = rep.modes.map((m) => getFamily('weibull').make(m.parameters!));
    // Joint log-likelihood from its definition: a failure by mode m contributes ln f_m + Σ_{other} ln S; a survivor Σ ln S.
    const joint = (ds: typeof dists) =>
      d.times.reduce((s, t, i) => {
        let v = 0;
        ds.forEach((dist, k) => (v += d.failed[i] && d.modes[i] === rep.modes[k]!.mode ? dist.logPdf(t) : dist.logSf(t)));
        return s + v;
      }, 0);
    const sumOfModes = rep.modes.reduce((s, m) => s + m.candidates[0]!.logLikelihood, 0);
    expect(Math.abs(joint(dists) - sumOfModes)).toBeLessThan(1e-8 * Math.abs(sumOfModes));
    // The per-mode estimates maximise the joint likelihood: nudging any parameter lowers it.
    for (let k = 0; k < 2; k++) {
      for (const key of ['shape', 'scale']) {
        for (const f of [0.99, 1.01]) {
          const p = { ...rep.modes[k]!.parameters!, [key]: rep.modes[k]!.parameters![key]! * f };
          const nudged = dists.map((x, j) => (j === k ? getFamily('weibull').make(p) : x));
          expect(joint(nudged)).toBeLessThan(joint(dists));
        }
      }
    }
    // And each mode equals fitCensored on the mode's own status column.
    const wearOnly = prepareLifeData({ times: d.times, failed: d.failed.map((f, i) => (f && d.modes[i] === 'wear' ? 1 : 0)) });
    const direct = fitCensored('weibull', wearOnly);
    expect(direct.ok && direct.parameters.shape).toBe(rep.modes[1]!.parameters!.shape);
  });

  it('recovers the seeded modes (n = 3000; tolerance ≈ 4 standard errors, se(β̂)/β ≈ 0.78/√r, from memory)', () => {
    const rep = analyzeModes(twoModes(3000, 17, 1500), { family: 'weibull' });
    const [early, wear] = rep.modes;
    expect(wear!.parameters!.shape).toBeGreaterThan(3 * (1 - 4 * 0.78 / Math.sqrt(wear!.failures)));
    expect(wear!.parameters!.shape).toBeLessThan(3 * (1 + 4 * 0.78 / Math.sqrt(wear!.failures)));
    expect(early!.parameters!.shape).toBeGreaterThan(0.8 * (1 - 4 * 0.78 / Math.sqrt(early!.failures)));
    expect(early!.parameters!.shape).toBeLessThan(0.8 * (1 + 4 * 0.78 / Math.sqrt(early!.failures)));
    expect(Math.abs(wear!.parameters!.scale! / 1000 - 1)).toBeLessThan(0.05);
  });

  it('system = product of mode reliabilities; two exponential modes give an exponential system with the summed rate (closed form)', () => {
    const d = twoModes(200, 3, 900);
    const rep = analyzeModes(d, { family: 'exponential', bLifePercents: [10, 50], reliabilityTimes: [300] });
    const rates = rep.modes.map((m) => m.parameters!.rate!);
    const total = rates[0]! + rates[1]!;
    expect(rep.system).not.toBeNull();
    const sys = rep.system!;
    expect(Math.abs(sys.bLives[0]!.estimate / (-Math.log(0.9) / total) - 1)).toBeLessThan(1e-11);
    expect(Math.abs(sys.bLives[1]!.estimate / (Math.LN2 / total) - 1)).toBeLessThan(1e-11);
    expect(Math.abs(sys.reliability[0]!.estimate - Math.exp(-300 * total))).toBeLessThan(1e-14);
    sys.curve.time.forEach((t, i) => expect(sys.curve.system[i]).toBeCloseTo(sys.curve.modes[0]![i]! * sys.curve.modes[1]![i]!, 14));
    // Each mode's B10 carries likelihood-ratio bounds around its estimate.
    for (const m of rep.modes) expect(m.bLives[0]!.lower).toBeLessThan(m.bLives[0]!.estimate);
    expect(rep.cautions.join(' ')).toMatch(/independent/);
  });

  it('ranks the families per mode when none is fixed', () => {
    const rep = analyzeModes(twoModes(400, 9, 1500));
    for (const m of rep.modes) {
      expect(m.candidates[0]!.rank).toBe(1);
      expect(m.family).toBe(m.candidates[0]!.family);
      for (let i = 1; i < m.candidates.length; i++) expect(m.candidates[i]!.aicc).toBeGreaterThanOrEqual(m.candidates[i - 1]!.aicc);
    }
  });

  it('a failed unit without a mode is refused, naming the unit', () => {
    expect(() => analyzeModes({ times: [1, 2, 3], failed: [1, 1, 0], modes: ['a', '', null] })).toThrow(/Unit #2 failed but has no failure mode/);
  });
});

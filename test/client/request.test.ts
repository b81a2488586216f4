/**
 * Settings + source → API request (client/src/request.ts), without a browser: only the fields that
 * apply are sent, limits match server/validate.ts (bins ≥ 2, replicates 19–100000, 0 < α < 1), and
 * every problem names its setting.
 */
import { describe, expect, it } from 'vitest';
import { optionNamed, parseJsonOption } from '../../core/index.js';
import { buildRequest } from '../../client/src/request.js';
import type { Settings } from '../../client/src/settings.js';
import { INITIAL_STATE, update, type PageState } from '../../client/src/state.js';

const LIFE_CSV = 'unit,hours,status\nU1,120,1\nU2,340,1\nU3,500,0\nU4,220,1\nU5,500,0\n';
const loaded = (csv: string, patch: Partial<Settings> = {}): PageState =>
  update(update(INITIAL_STATE, { type: 'source-loaded', source: { kind: 'file', name: 'f.csv', csv } }), { type: 'settings-edited', patch });

describe('buildRequest', () => {
  it('no source: one problem, no request', () => {
    const out = buildRequest(INITIAL_STATE);
    expect(out.ok).toBe(false);
  });

  it('defaults: the value column (not the unit identifier), the decimal mark read from the text, no trade fields', () => {
    const out = buildRequest(loaded(LIFE_CSV));
    if (!out.ok || out.built.kind !== 'values') throw new Error('expected a values request');
    const r = out.built.request;
    expect(r.column).toBe(2);
    expect(r.csvOptions).toEqual({ decimal: '.', header: true, skipInvalid: true });
    expect(r.alpha).toBe(0.05);
    expect(r.bins).toBeNull();
    expect(r.families).toEqual(['normal', 'lognormal', 'gamma', 'weibull', 'exponential']);
    for (const k of ['statusColumn', 'returnPeriods', 'lsl', 'confidence', 'seed', 'replicates']) expect(r).not.toHaveProperty(k);
  });

  it('with a status column: the life fields only; return periods and a tolerance typed before are not sent', () => {
    const out = buildRequest(loaded(LIFE_CSV, { statusColumn: 3, bLifePercents: '1, 10', returnPeriods: '100', lsl: '5' }));
    if (!out.ok || out.built.kind !== 'values') throw new Error('expected a values request');
    const r = out.built.request;
    expect(r.statusColumn).toBe(3);
    expect(r.bLifePercents).toEqual([1, 10]);
    expect(r.boundMethod).toBe('likelihood-ratio');
    expect(r.confidence).toBe(0.9);
    expect(r).not.toHaveProperty('returnPeriods');
    expect(r).not.toHaveProperty('lsl');
  });

  it('flood and capability fields without a status column, with the confidence', () => {
    const out = buildRequest(loaded(LIFE_CSV, { returnPeriods: '10 100', designLife: '50', lsl: '100', usl: '600' }));
    if (!out.ok || out.built.kind !== 'values') throw new Error('expected a values request');
    expect(out.built.request).toMatchObject({ returnPeriods: [10, 100], designLife: 50, plottingPosition: 'weibull', lsl: 100, usl: 600, confidence: 0.9 });
  });

  it.each([
    ['alpha', '0', 'alpha'],
    ['alpha', '1', 'alpha'],
    ['alpha', '0x1', 'alpha'],
    ['bins', '1', 'bins'],
    ['bins', '2.5', 'bins'],
    ['seed', '-1', 'seed'],
    ['confidence', '1', 'confidence'],
    ['returnPeriods', '1, 10', 'returnPeriods'],
    ['returnPeriods', '10, 10', 'returnPeriods'],
    ['bLifePercents', '100', 'bLifePercents'],
  ] as const)('refuses %s = %s and names the setting', (key, value, field) => {
    const out = buildRequest(loaded(LIFE_CSV, { [key]: value }));
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.problems.map((p) => p.field)).toContain(field);
  });

  it.each([
    ['bins', '2'],
    ['alpha', '0,1'],
    ['seed', '0'],
    ['replicates', '5'], // not read while the p-value method is the published formula
  ] as const)('accepts %s = %s', (key, value) => {
    expect(buildRequest(loaded(LIFE_CSV, { [key]: value })).ok).toBe(true);
  });

  it('replicates are checked (19 to 100000) only for the bootstrap', () => {
    expect(buildRequest(loaded(LIFE_CSV, { pMethod: 'bootstrap', replicates: '18' })).ok).toBe(false);
    expect(buildRequest(loaded(LIFE_CSV, { pMethod: 'bootstrap', replicates: '100001' })).ok).toBe(false);
    const ok = buildRequest(loaded(LIFE_CSV, { pMethod: 'bootstrap', replicates: '19' }));
    expect(ok.ok && ok.built.kind === 'values' && ok.built.request.replicates).toBe(19);
  });

  it('an upper limit not above the lower one, and no model ticked, are problems', () => {
    const out = buildRequest(loaded(LIFE_CSV, { lsl: '5', usl: '5', families: [] }));
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.problems.map((p) => p.field).sort()).toEqual(['families', 'usl']);
  });

  it('class limits with counts become a grouped request read with the core CSV reader', () => {
    const s = loaded('lower,upper,count\n0,1,5\n1,2,9\n2,3,4\n');
    expect(s.reading.shape).toBe('grouped');
    const out = buildRequest(s);
    if (!out.ok || out.built.kind !== 'grouped') throw new Error('expected a grouped request');
    expect(out.built.request.grouped).toEqual([{ lower: 0, upper: 1, count: 5 }, { lower: 1, upper: 2, count: 9 }, { lower: 2, upper: 3, count: 4 }]);
  });
});

describe('the page refuses exactly what the API refuses (core/options table, parseJsonOption)', () => {
  const keys = ['alpha', 'bins', 'replicates', 'seed', 'confidence', 'designLife', 'bLifePercents', 'reliabilityTimes', 'returnPeriods'] as const;
  for (const key of keys) {
    const spec = optionNamed(key)!;
    const list = spec.kind === 'numbers';
    // Each end of the range, just inside and just outside (a whole step for integers).
    const step = spec.kind === 'integer' ? 1 : 1e-9;
    const probes = [spec.min, spec.max].filter((x): x is number => x !== undefined && Number.isFinite(x) && Math.abs(x) < 1e9).flatMap((x) => [x - step, x, x + step]);
    for (const x of probes) {
      it(`${key} = ${x}: same answer as the API`, () => {
        const api = parseJsonOption(spec, list ? [x] : x).ok;
        // Settings that apply only with a status column or only with the bootstrap are given the context they need.
        const context: Partial<Settings> = key === 'replicates' ? { pMethod: 'bootstrap' } : key === 'bLifePercents' || key === 'reliabilityTimes' ? { statusColumn: 3 } : key === 'designLife' ? { returnPeriods: '100' } : {};
        expect(buildRequest(loaded(LIFE_CSV, { ...context, [key]: String(x) })).ok).toBe(api);
      });
    }
  }
});

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
    // At its table default the bound method is not sent: the server applies the same default.
    expect(r).not.toHaveProperty('boundMethod');
    expect(r.confidence).toBe(0.9);
    expect(r).not.toHaveProperty('returnPeriods');
    expect(r).not.toHaveProperty('lsl');
  });

  it('flood and capability fields without a status column, with the confidence', () => {
    const out = buildRequest(loaded(LIFE_CSV, { returnPeriods: '10 100', designLife: '50', lsl: '100', usl: '600' }));
    if (!out.ok || out.built.kind !== 'values') throw new Error('expected a values request');
    expect(out.built.request).toMatchObject({ returnPeriods: [10, 100], designLife: 50, lsl: 100, usl: 600, confidence: 0.9 });
    expect(out.built.request).not.toHaveProperty('plottingPosition');
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

  // The trade fields are the option table's (client/src/page-options.ts): sent where they apply,
  // not at their default, and only with what their option needs (core/options/combinations.ts).
  it('a capability field the table added (transform, natural lower bound) goes with the tolerance, not with a status column', () => {
    const out = buildRequest(loaded(LIFE_CSV, { usl: '600', transform: 'boxcox', naturalLowerBound: '0', withinMethod: 'pooled' }));
    if (!out.ok || out.built.kind !== 'values') throw new Error('expected a values request');
    expect(out.built.request).toMatchObject({ usl: 600, transform: 'boxcox', naturalLowerBound: 0 });
    // 'pooled' is the table's default: not sent.
    expect(out.built.request).not.toHaveProperty('withinMethod');
    const life = buildRequest(loaded(LIFE_CSV, { statusColumn: 3, usl: '600', transform: 'boxcox' }));
    if (!life.ok || life.built.kind !== 'values') throw new Error('expected a values request');
    expect(life.built.request).not.toHaveProperty('transform');
    expect(life.built.request).not.toHaveProperty('usl');
  });

  it('a field given without the option it needs is a problem that names both', () => {
    const out = buildRequest(loaded(LIFE_CSV, { designLife: '50' }));
    expect(out.ok).toBe(false);
    if (!out.ok) {
      expect(out.problems.map((p) => p.field)).toEqual(['designLife']);
      expect(out.problems[0]!.message).toMatch(/Design life.*needs.*Return periods/);
    }
    const plan = buildRequest(loaded(LIFE_CSV, { statusColumn: 3, planTime: '500' }));
    expect(!plan.ok && plan.problems.map((p) => p.field)).toEqual(['planTime']);
    // A changed choice needs its section too: Gringorten positions without return periods.
    expect(buildRequest(loaded(LIFE_CSV, { plottingPosition: 'gringorten' })).ok).toBe(false);
  });

  it('the rules between options are the API\'s: a file-order trend check with an order column is refused', () => {
    const out = buildRequest(loaded('year,x\n1,5\n2,6\n3,7\n4,9\n', { orderColumn: 1, trend: 'true' }));
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.problems[0]!.field).toBe('trend');
    const alone = buildRequest(loaded('year,x\n1,5\n2,6\n3,7\n4,9\n', { trend: 'true' }));
    expect(alone.ok && alone.built.kind === 'values' && alone.built.request.trend).toBe(true);
  });

  it('a bad value in a field that does not apply to these data is still shown as a problem', () => {
    const out = buildRequest(loaded(LIFE_CSV, { bLifePercents: '150' }));
    expect(!out.ok && out.problems.map((p) => p.field)).toEqual(['bLifePercents']);
  });

  // Life data found at inspections, in the layout of datasets/valve-inspections.csv (invented rows).
  const VALVES = 'start_months,end_months,valves\n,6,1\n1.4,1.4,1\n6,12,5\n12,,40\n';
  it('inspection intervals: the shape is guessed from start/end headers, and the request names the columns, the count and the life fields', () => {
    const st = loaded(VALVES, { bLifePercents: '1, 10', statusColumn: 2 });
    expect(st.reading.shape).toBe('interval');
    expect(st.reading.interval).toEqual({ start: 1, end: 2, count: 3 });
    const out = buildRequest(st);
    if (!out.ok || out.built.kind !== 'values') throw new Error('expected a request');
    const r = out.built.request;
    expect(r).toMatchObject({ intervalColumns: [1, 2], countColumn: 3, bLifePercents: [1, 10], confidence: 0.9 });
    // No value column, no bins, and never a status column beside interval rows (the API refuses the pair).
    for (const k of ['column', 'bins', 'statusColumn']) expect(r).not.toHaveProperty(k);
    // No failure points to plot: no evidence asked (the life section draws the Turnbull boxes).
    expect(r.evidence).toBe(false);
    const same = buildRequest(update(st, { type: 'reading-changed', interval: { end: 1 } }));
    expect(!same.ok && same.problems.map((p) => p.field)).toEqual(['intervals']);
    const noCount = buildRequest(update(st, { type: 'reading-changed', interval: { count: 0 } }));
    expect(noCount.ok && noCount.built.request).not.toHaveProperty('countColumn');
  });

  // Interval rows with a failure-mode column (issue 13), in the layout of test/fixtures/life-modes-interval.json's rows.
  const MODES_IV = 'start,end,units,mode\n,25,1,B\n8.04,8.04,1,B\n25,50,3,A\n50,75,14,A\n150,,4,\n';
  it('interval rows with a failure-mode column: the request sends modeColumn beside the interval columns, and no other role', () => {
    const st = loaded(MODES_IV, { modeColumn: 4, statusColumn: 2, orderColumn: 3, subgroupColumn: 2 });
    expect(st.reading.shape).toBe('interval');
    const out = buildRequest(st);
    if (!out.ok || out.built.kind !== 'values') throw new Error('expected a request');
    const r = out.built.request;
    expect(r).toMatchObject({ intervalColumns: [1, 2], countColumn: 3, modeColumn: 4 });
    for (const k of ['statusColumn', 'orderColumn', 'subgroupColumn', 'column']) expect(r).not.toHaveProperty(k);
    // the API takes the same pair (core/options/combinations.ts: modeColumn needs statusColumn or intervalColumns)
    expect(parseJsonOption(optionNamed('modeColumn')!, 4).ok).toBe(true);
    // a mode column that is one of the interval columns is refused beside the mode field
    const clash = buildRequest(update(st, { type: 'settings-edited', patch: { modeColumn: 3 } }));
    expect(!clash.ok && clash.problems.map((p) => p.field)).toEqual(['modeColumn']);
    // without the mode column nothing of it is sent
    const none = buildRequest(update(st, { type: 'settings-edited', patch: { modeColumn: 0 } }));
    expect(none.ok && none.built.request).not.toHaveProperty('modeColumn');
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

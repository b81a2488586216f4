// @vitest-environment jsdom
/**
 * The many-series page's pure parts: sorting and filtering the summary rows, the window of a
 * virtualised table, the settings judged by the option table, and the chart's thinning.
 */
import { describe, expect, it } from 'vitest';
import type { SeriesSummary } from '../../core/index.js';
import { drawSeriesDecisions } from '../../client/charts/series-decisions.js';
import { optionsFrom, seriesCsv } from '../../client/src/batch/settings.js';
import { DEFAULT_VIEW, modelsOf, sortBy, tally, visibleRows, windowOf } from '../../client/src/batch/state.js';

function row(series: string, over: Partial<SeriesSummary> = {}): SeriesSummary {
  return { series, status: 'ok', n: 20, dataKind: 'complete', best: 'Weibull', bestFamily: 'weibull', chiSquare: 'not rejected', andersonDarling: 'not rejected', quantity: 'B10 life', estimate: 1, lower: 0.5, upper: 2, warnings: 0, message: null, ...over };
}

describe('many-series state', () => {
  const rows = [
    row('G10', { estimate: 5 }),
    row('G2', { estimate: null }),
    row('G1', { estimate: 3, andersonDarling: 'rejected', best: 'gamma' }),
    row('bad', { status: 'error', best: null, estimate: null, n: null, message: 'row 4' }),
    row('G3', { estimate: 9, warnings: 2 }),
  ];
  it('sorts series names numerically and numbers with missing ones last in both directions', () => {
    expect(visibleRows(rows, DEFAULT_VIEW).map((i) => rows[i]?.series)).toEqual(['bad', 'G1', 'G2', 'G3', 'G10']);
    const byNumber = sortBy(DEFAULT_VIEW, 'estimate');
    expect(visibleRows(rows, byNumber).map((i) => rows[i]?.series)).toEqual(['G1', 'G10', 'G3', 'G2', 'bad']);
    const desc = sortBy(byNumber, 'estimate');
    expect(desc.descending).toBe(true);
    expect(visibleRows(rows, desc).map((i) => rows[i]?.series)).toEqual(['G3', 'G10', 'G1', 'G2', 'bad']);
  });

  it('filters by verdict, model, warnings and name', () => {
    const v = (f: Partial<typeof DEFAULT_VIEW.filters>) => visibleRows(rows, { ...DEFAULT_VIEW, filters: { ...DEFAULT_VIEW.filters, ...f } }).map((i) => rows[i]?.series);
    expect(v({ verdict: 'rejected' })).toEqual(['G1']);
    expect(v({ verdict: 'errors' })).toEqual(['bad']);
    expect(v({ model: 'gamma' })).toEqual(['G1']);
    expect(v({ warningsOnly: true })).toEqual(['G3']);
    expect(v({ text: 'g1' })).toEqual(['G1', 'G10']);
    expect(tally(rows)).toEqual({ total: 5, ok: 3, rejected: 1, errors: 1, warned: 1 });
    expect(modelsOf(rows)).toEqual(['gamma', 'Weibull']);
  });

  it('a scrolled window covers the visible rows plus an overscan, never past the ends', () => {
    expect(windowOf(10_000, 30, 0, 600)).toEqual({ first: 0, last: 28 });
    expect(windowOf(10_000, 30, 150_000, 600)).toEqual({ first: 4992, last: 5028 });
    expect(windowOf(10, 30, 0, 600)).toEqual({ first: 0, last: 10 });
  });
});

describe('many-series settings', () => {
  it('are judged by the option table (return periods > 1, limits ordered, B-life needs status)', () => {
    const base = { decision: 'return' as const, period: '100', percent: '10', lsl: '', usl: '', withStatus: false };
    expect(optionsFrom(base)).toEqual({ ok: true, options: { returnPeriods: [100] } });
    expect(optionsFrom({ ...base, period: '1' }).ok).toBe(false);
    expect(optionsFrom({ ...base, decision: 'blife' }).ok).toBe(false);
    expect(optionsFrom({ ...base, decision: 'blife', withStatus: true })).toEqual({ ok: true, options: { bLifePercents: [10] } });
    expect(optionsFrom({ ...base, decision: 'ppm', lsl: '5', usl: '4' }).ok).toBe(false);
    expect(optionsFrom({ ...base, decision: 'ppm', usl: '4' })).toEqual({ ok: true, options: { usl: 4 } });
  });

  it('hands a series to the full view as the CSV the main page reads', () => {
    expect(seriesCsv([1.5, 2], null)).toBe('value\n1.5\n2\n');
    expect(seriesCsv([10, 20], [1, 0])).toBe('time,status\n10,1\n20,0\n');
  });
});

describe('the decision-number chart', () => {
  it('is thinned to at most maxMarks marks, the largest kept, and says so', () => {
    const many = Array.from({ length: 5000 }, (_, i) => row(`S${i}`, { estimate: i, lower: i - 1, upper: i + 1 }));
    const div = document.createElement('div');
    const r = drawSeriesDecisions(div, many, { width: 800, height: 320 }, 1000);
    expect(r.drawn).toBe(1000);
    expect(div.querySelectorAll('circle').length).toBe(1000);
    expect(div.textContent).toMatch(/5000 series with a number; every 5\.0th/);
    expect([...div.querySelectorAll('circle title')].some((t) => t.textContent === 'S4999: 4999')).toBe(true);
  });
});

describe('handing a series to the full view', () => {
  it('is taken once from storage and refused when malformed', async () => {
    const { takeOpenedSeries, OPENED_SERIES_KEY } = await import('../../client/src/opened-series.js');
    const store = new Map<string, string>();
    const storage = { getItem: (k: string) => store.get(k) ?? null, removeItem: (k: string) => void store.delete(k) };
    store.set(OPENED_SERIES_KEY, JSON.stringify({ name: 'f.csv: series G1', csv: 'value\n1\n2\n' }));
    expect(takeOpenedSeries(storage)).toEqual({ name: 'f.csv: series G1', csv: 'value\n1\n2\n' });
    expect(takeOpenedSeries(storage)).toBeNull();
    store.set(OPENED_SERIES_KEY, '{not json');
    expect(takeOpenedSeries(storage)).toBeNull();
    store.set(OPENED_SERIES_KEY, JSON.stringify({ name: 3, csv: 'x' }));
    expect(takeOpenedSeries(storage)).toBeNull();
  });
});

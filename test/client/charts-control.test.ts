// @vitest-environment jsdom
/**
 * The stability chart draws the Western Electric run rules (Statistical Quality Control Handbook,
 * 1956, rules 2-4, as computed by core/capability/run-rules.ts) apart from points beyond a limit:
 * a filled diamond for a point that ends a run, a hollow ring for a point beyond a 3-sigma limit,
 * each with a title naming what it signals, a legend entry saying so in words, and the rules present
 * written out in the chart's notes. The data are invented (./invented-runs.ts: an oscillating noise,
 * then a shift of about one sigma); which points signal is the core's answer, checked against the rule definitions
 * in test/capability/run-rules.test.ts. The page's browser check is test/browser/run-rules.test.ts.
 */
import { beforeEach, describe, expect, it } from 'vitest';
import { individualsChart, subgroupChart } from '../../core/capability/control-chart.js';
import { RUN_RULE_WORDS } from '../../core/capability/run-rules.js';
import { controlChart } from '../../client/charts/control-chart.js';
import { resetIds } from '../../client/charts/frame.js';
import { SHIFTED, STEADY } from './invented-runs.js';

const OPTS = { width: 640, height: 420, units: 'g', quantity: 'Fill weight' };
const host = (): HTMLElement => document.body.appendChild(document.createElement('div'));
const legend = (svg: SVGSVGElement): string[] => [...svg.querySelectorAll('[data-kind="legend-entry"] text')].map((t) => t.textContent ?? '');
const notes = (svg: SVGSVGElement): string => [...svg.querySelectorAll('[data-kind="notes"] text')].map((t) => t.textContent ?? '').join(' ');

beforeEach(() => {
  document.body.innerHTML = '';
  resetIds();
});

describe('run rules on the stability chart', () => {
  it('a shifted series: one diamond per point that ends a run, titled with the rule in words; no ring (nothing beyond a limit)', () => {
    const chart = individualsChart(SHIFTED, null);
    // the core's verdict on the invented series (rules 2, 3 and 4 all fire; no point beyond 3 sigma)
    expect(chart.pointsBeyond).toBe(0);
    expect(chart.runSignals).toBeGreaterThan(0);
    const signalled = chart.location.points.filter((p) => (p.runRules?.length ?? 0) > 0);
    expect(new Set(signalled.flatMap((p) => p.runRules ?? []))).toEqual(new Set([2, 3, 4]));
    const svg = controlChart(host(), chart, OPTS);
    const diamonds = [...svg.querySelectorAll('[data-panel="location"] [data-kind="run-signal"]')];
    expect(diamonds).toHaveLength(chart.runSignals);
    expect(svg.querySelectorAll('[data-kind="beyond"]')).toHaveLength(0);
    // each diamond sits on its point (the series path passes through the same x) and names its rules in words
    diamonds.forEach((d, k) => {
      const p = signalled[k]!;
      expect(d.getAttribute('data-rules')).toBe((p.runRules ?? []).join(' '));
      const title = d.querySelector('title')?.textContent ?? '';
      for (const r of p.runRules ?? []) expect(title).toContain(`completes rule ${r}: ${RUN_RULE_WORDS[r]}`);
      expect(title.startsWith(`${p.label}: `)).toBe(true);
    });
    // the plain points are the others: every location point has exactly one mark
    expect(svg.querySelectorAll('[data-panel="location"] circle[data-kind="point"]')).toHaveLength(SHIFTED.length - chart.runSignals);
    expect(legend(svg)).toContain('ends a run (rules 2–4, below)');
    expect(legend(svg)).toContain('1σ and 2σ lines');
    expect(legend(svg).some((t) => /beyond/.test(t))).toBe(false);
    expect(svg.querySelectorAll('[data-panel="location"] [data-kind="zone"]')).toHaveLength(4);
    expect(svg.querySelectorAll('[data-panel="dispersion"] [data-kind="zone"]')).toHaveLength(0);
    const n = notes(svg);
    expect(n).toContain('Western Electric');
    for (const r of [2, 3, 4] as const) expect(n).toContain(RUN_RULE_WORDS[r]);
  });

  it('the 2-sigma zone line lies two thirds of the way from the centre line to the 3-sigma limit', () => {
    const chart = individualsChart(SHIFTED, null);
    const svg = controlChart(host(), chart, OPTS);
    const g = svg.querySelector('[data-panel="location"]')!;
    const yOf = (d: string | null): number => Number(/^M[-\d.]+,([-\d.]+)/.exec(d ?? '')?.[1]);
    const centre = Number(g.querySelector('[data-kind="centre"]')!.getAttribute('y1'));
    const upper = yOf(g.querySelector('[data-kind="limit-upper"]')!.getAttribute('d'));
    const zones = [...g.querySelectorAll('[data-kind="zone"]')].map((z) => yOf(z.getAttribute('d')));
    // zones in order -2, -1, +1, +2 sigma
    expect(zones[3]! - centre).toBeCloseTo((2 / 3) * (upper - centre), 0);
    expect(zones[2]! - centre).toBeCloseTo((1 / 3) * (upper - centre), 0);
  });

  it('a steady series: no diamond, no ring, no zone lines, and the legend names only the plain point', () => {
    const chart = individualsChart(STEADY, null);
    expect(chart.stable).toBe(true);
    const svg = controlChart(host(), chart, OPTS);
    expect(svg.querySelectorAll('[data-kind="run-signal"]')).toHaveLength(0);
    expect(svg.querySelectorAll('[data-kind="beyond"]')).toHaveLength(0);
    expect(svg.querySelectorAll('[data-kind="zone"]')).toHaveLength(0);
    expect(legend(svg)).toEqual(['value']);
    expect(notes(svg)).not.toContain('Diamonds');
  });

  it('a point beyond a limit that also ends a run carries both marks, each titled; the legend names both', () => {
    // the shifted series with one wild value at the end, above the upper limit and also the eighth
    // successive value above the centre line (rule 4)
    const chart = individualsChart([...SHIFTED, 60], null);
    const last = chart.location.points[chart.location.points.length - 1]!;
    expect(last.beyond).toBe('above');
    expect(last.runRules ?? []).toContain(4);
    const svg = controlChart(host(), chart, OPTS);
    const g = svg.querySelector('[data-panel="location"]')!;
    const ring = [...g.querySelectorAll('circle[data-kind="beyond"]')];
    expect(ring).toHaveLength(1);
    expect(ring[0]!.querySelector('title')?.textContent).toMatch(/above the upper limit .* \(rule 1: a point beyond 3 sigma\)/);
    const lastDiamond = [...g.querySelectorAll('[data-kind="run-signal"]')].pop()!;
    expect(lastDiamond.getAttribute('data-rules')).toBe('4');
    expect(lastDiamond.querySelector('title')?.textContent).toMatch(/above the upper limit .*; completes rule 4: eight successive points/);
    expect(legend(svg)).toContain('beyond a 3σ limit (rule 1)');
    expect(legend(svg)).toContain('ends a run (rules 2–4, below)');
  });

  it('subgroup means: the zone lines follow each subgroup size (sigma / sqrt(n) per point)', () => {
    // invented: subgroups of 2 and 5 alternating, the means drifting upward (rule 4 fires)
    const groups = Array.from({ length: 14 }, (_, i) => {
      const size = i % 2 === 0 ? 2 : 5;
      const base = 10 + (i < 6 ? 0 : 0.6);
      return { label: i + 1, values: Array.from({ length: size }, (_, j) => base + (j % 2 === 0 ? 0.3 : -0.3) + 0.05 * ((i * 7 + j) % 3)) };
    });
    const chart = subgroupChart(groups);
    expect(chart.runSignals).toBeGreaterThan(0);
    const svg = controlChart(host(), chart, OPTS);
    const g = svg.querySelector('[data-panel="location"]')!;
    const ys = (d: string | null): number[] => [...(d ?? '').matchAll(/[ML][-\d.]+,([-\d.]+)/g)].map((m) => Number(m[1]));
    const centre = Number(g.querySelector('[data-kind="centre"]')!.getAttribute('y1'));
    const upper = ys(g.querySelector('[data-kind="limit-upper"]')!.getAttribute('d'));
    const plus2 = ys([...g.querySelectorAll('[data-kind="zone"]')][3]!.getAttribute('d'));
    expect(plus2).toHaveLength(upper.length);
    plus2.forEach((y, i) => expect(y - centre).toBeCloseTo((2 / 3) * (upper[i]! - centre), 0));
    // the two subgroup sizes give two different zone heights
    expect(new Set(plus2.map((y) => Math.round(y))).size).toBeGreaterThan(1);
  });

  it('in a narrow slot with the legend and notes, the chart grows taller rather than squeezing its two panels', () => {
    // the page's capability slot at 1366 px is about 460 × 285 (client/src/render.ts chartSize)
    const svg = controlChart(host(), individualsChart(SHIFTED, null), { ...OPTS, width: 460, height: 285 });
    const height = Number(svg.getAttribute('height'));
    expect(height).toBeGreaterThan(285);
    expect(svg.getAttribute('viewBox')).toBe(`0 0 460 ${height}`);
    expect(Number(svg.querySelector('rect')!.getAttribute('height'))).toBe(height);
    // the plot's two centre lines are at least one 90 px panel apart
    const centres = [...svg.querySelectorAll('[data-kind="centre"]')].map((c) => Number(c.getAttribute('y1')));
    expect(Math.abs(centres[1]! - centres[0]!)).toBeGreaterThanOrEqual(90);
    // a roomy chart keeps the size it was given
    expect(controlChart(host(), individualsChart(SHIFTED, null), { ...OPTS, width: 900, height: 600 }).getAttribute('height')).toBe('600');
  });
});

// @vitest-environment jsdom
/** The stability chart's SVG: what it shows is what the core's StabilityChart says (meaning first). */
import { describe, expect, it } from 'vitest';
import { individualsChart, subgroupChart, subgroupRangeChart } from '../../core/capability/index.js';
import { controlChart } from '../../client/charts/control-chart.js';

const opts = { width: 640, height: 420, units: 'mm' };

describe('control chart SVG', () => {
  it('individuals: one point per value, one per moving range, the point beyond its limit marked with the limit in its title', () => {
    const x = [5, 5.2, 4.9, 5.1, 5.0, 4.95, 5.05, 9, 5.1, 4.9];
    const chart = individualsChart(x, null);
    const host = document.createElement('div');
    const svg = controlChart(host, chart, opts);
    const beyond = svg.querySelectorAll('[data-kind="beyond"]');
    expect(svg.querySelectorAll('[data-kind="point"], [data-kind="beyond"]').length).toBe(x.length + x.length - 1);
    expect(beyond.length).toBe(chart.pointsBeyond);
    expect(chart.pointsBeyond).toBeGreaterThan(0);
    expect(beyond[0]!.querySelector('title')!.textContent).toMatch(/^8: 9 — above the upper limit/);
    expect(svg.querySelectorAll('[data-kind="limit-upper"]').length).toBe(2);
    // the moving range i (|x_i - x_{i-1}|) sits under value i: the panels share x positions
    const cx = (panel: string, i: number) => svg.querySelectorAll(`[data-panel="${panel}"] circle`)[i]!.getAttribute('cx');
    expect(cx('dispersion', 0)).toBe(cx('location', 1));
    expect(svg.querySelector("desc")!.textContent).toMatch(/point\(s\) lie beyond the 3-sigma limits/);
    expect(svg.querySelector("title")!.textContent).toMatch(/^Is the process stable\? Individual values and moving ranges/);
  });
  it('subgroups: panel labels name the statistics; a stable chart has no marked point', () => {
    const groups = Array.from({ length: 8 }, (_, i) => ({ label: `S${i + 1}`, values: [10 + (i % 3) * 0.01, 10.02, 9.99, 10.01] }));
    const chart = subgroupChart(groups);
    const svg = controlChart(document.createElement('div'), chart, opts);
    const text = [...svg.querySelectorAll('text')].map((t) => t.textContent).join(' | ');
    expect(svg.querySelector('rect')!.getAttribute('fill')).not.toBe('white');
    expect(text).toMatch(/subgroup mean/);
    expect(text).toMatch(/subgroup standard deviation/);
    expect(svg.querySelectorAll('[data-kind="beyond"]').length).toBe(chart.pointsBeyond);
  });
  it('subgroup means and ranges: its own title, the range panel, the subgroup beyond D4·R̄ marked', () => {
    const groups = Array.from({ length: 8 }, (_, i) => ({ label: `S${i + 1}`, values: i === 5 ? [9.9, 10.0, 10.01, 10.1] : [10 + (i % 3) * 0.01, 10.02, 9.99, 10.01] }));
    const chart = subgroupRangeChart(groups);
    const svg = controlChart(document.createElement('div'), chart, opts);
    expect(svg.querySelector('title')!.textContent).toMatch(/^Is the process stable\? Subgroup means and ranges/);
    const text = [...svg.querySelectorAll('text')].map((t) => t.textContent).join(' | ');
    expect(text).toMatch(/subgroup range/);
    const marked = [...svg.querySelectorAll('[data-panel="dispersion"] [data-kind="beyond"] title')].map((t) => t.textContent);
    expect(marked.some((t) => /^S6: .* above the upper limit/.test(t ?? ''))).toBe(true);
  });
});

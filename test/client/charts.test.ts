// @vitest-environment jsdom
/**
 * Rendering tests of the chart functions in jsdom: structure, labels with units, geometry
 * that follows the data, accessibility attributes, and SVG snapshots with rounded decimals.
 */
import { beforeEach, describe, expect, it } from 'vitest';
import { histogramChart } from '../../client/charts/histogram.js';
import { probabilityPlotChart } from '../../client/charts/probability-plot.js';
import { binCountsChart, MIN_EXPECTED } from '../../client/charts/bin-counts.js';
import { cdfChart } from '../../client/charts/cdf.js';
import { resetIds } from '../../client/charts/frame.js';
import { normaliseSvg } from './svg-normalise.js';
import { EVIDENCE } from './fixture-evidence.js';

const OPTS = { width: 640, height: 400, units: 'h', quantity: 'Life' };

function host(): HTMLElement {
  const d = document.createElement('div');
  document.body.append(d);
  return d;
}

function texts(svg: SVGSVGElement): string[] {
  return [...svg.querySelectorAll('text')].map((t) => t.textContent ?? '');
}

/** Axis titles (x first, then y without its leading arrow). */
function axisTitles(svg: SVGSVGElement): string[] {
  return [...svg.querySelectorAll('[data-kind="axis-title"]')].map((t) => (t.textContent ?? '').replace(/^↑ /, ''));
}

const weibull = EVIDENCE.candidates[0]!;
const normal = EVIDENCE.candidates[1]!;

beforeEach(() => {
  document.body.innerHTML = '';
  resetIds();
});

describe('histogram on the equal-probability bins', () => {
  const draw = () =>
    histogramChart(host(), { histogram: weibull.histogram, densities: EVIDENCE.densities, xDomain: EVIDENCE.xDomain, selected: 'weibull', selectedLabel: 'Weibull' }, OPTS);

  it('draws one bar per bin, with heights in proportion to the density the core computed', () => {
    // Density-scale histogram: bar height = count / (n · width), so bar area is the share of
    // the data (common practice, no source).
    const svg = draw();
    const rects = [...svg.querySelectorAll('rect[data-kind="bar"]')];
    expect(rects).toHaveLength(4);
    const heights = rects.map((r) => Number(r.getAttribute('height')));
    const densities = weibull.histogram.bars.map((b) => b.density);
    const ratio = heights[1]! / heights[2]!;
    expect(ratio).toBeCloseTo(densities[1]! / densities[2]!, 2);
    // Open outer bins are dashed to show they are drawn to a display edge.
    expect(rects[0]!.getAttribute('stroke-dasharray')).toBe('3 2');
    expect(rects[1]!.getAttribute('stroke-dasharray')).toBeNull();
  });

  it('labels the axes with the units and emphasises the selected curve', () => {
    const svg = draw();
    const t = texts(svg);
    expect(axisTitles(svg)).toEqual(['Life [h]', 'Density [per h]']);
    expect(t).toContain('Weibull (selected)');
    const sel = svg.querySelector('path[data-kind="curve"][data-family="weibull"]');
    const other = svg.querySelector('path[data-kind="curve"][data-family="normal"]');
    expect(sel?.getAttribute('stroke-width')).toBe('3');
    expect(other?.getAttribute('stroke-width')).toBe('1.6');
    expect(sel?.getAttribute('stroke')).toBe('#8b3a86'); // the Weibull colour of client/charts/palette.ts
  });

  it('is an accessible image: role img, labelled by its title and description (WAI-ARIA 1.2, role "img")', () => {
    const svg = draw();
    expect(svg.getAttribute('role')).toBe('img');
    const ids = (svg.getAttribute('aria-labelledby') ?? '').split(' ');
    expect(ids).toHaveLength(2);
    for (const id of ids) expect(svg.querySelector(`#${id}`)?.textContent?.length ?? 0).toBeGreaterThan(10);
  });

  it('matches its snapshot (decimals rounded)', () => {
    expect(normaliseSvg(draw().outerHTML)).toMatchSnapshot();
  });
});

describe('probability plot', () => {
  it('puts one marker per point and labels the probability axis from the core ticks', () => {
    const svg = probabilityPlotChart(host(), { plot: normal.probabilityPlot, family: 'normal', label: 'Normal' }, OPTS);
    expect(svg.querySelectorAll('circle[data-kind="point"]')).toHaveLength(10);
    const t = texts(svg);
    for (const label of ['5%', '10%', '50%', '90%', '95%']) expect(t).toContain(label);
    expect(axisTitles(svg)).toEqual(['Life [h]', 'Cumulative probability']);
  });

  it('on a ln scale labels the horizontal axis in data units, placing each value at ln(value)', () => {
    const svg = probabilityPlotChart(host(), { plot: weibull.probabilityPlot, family: 'weibull', label: 'Weibull' }, OPTS);
    const t = texts(svg);
    expect(t).toContain('Life (log scale) [h]');
    // d3's log ticks over [~10, ~110] include 20 and 50 (d3-scale scaleLog.ticks documentation).
    expect(t).toContain('20');
    expect(t).toContain('50');
  });

  it('draws the band as one filled path that skips the undefined (null) end', () => {
    const svg = probabilityPlotChart(host(), { plot: weibull.probabilityPlot, family: 'weibull', label: 'Weibull' }, OPTS);
    const band = [...svg.querySelectorAll('path[data-kind="band"]')];
    expect(band).toHaveLength(1);
    const d = band[0]!.getAttribute('d') ?? '';
    expect(d.startsWith('M')).toBe(true);
    expect(d).not.toMatch(/NaN/);
  });

  it('matches its snapshot (decimals rounded)', () => {
    const svg = probabilityPlotChart(host(), { plot: weibull.probabilityPlot, family: 'weibull', label: 'Weibull' }, OPTS);
    expect(normaliseSvg(svg.outerHTML)).toMatchSnapshot();
  });
});

describe('observed against expected counts', () => {
  it('shows a bar and an expected mark per bin and the 5-expected line (Cochran 1954, "Some methods for strengthening the common χ² tests")', () => {
    const svg = binCountsChart(host(), { bins: weibull.bins, family: 'weibull', label: 'Weibull' }, OPTS);
    expect(MIN_EXPECTED).toBe(5);
    expect(svg.querySelectorAll('rect[data-kind="bar"]')).toHaveLength(4);
    const marks = [...svg.querySelectorAll('line[data-kind="expected"]')];
    expect(marks).toHaveLength(4);
    expect(svg.querySelectorAll('line[data-kind="reference"]')).toHaveLength(1);
    expect(texts(svg)).toContain('5 expected (minimum)');
    // Every expected mark sits at the same height (equal-probability bins, expected = n/k each).
    const ys = new Set(marks.map((m) => m.getAttribute('y1')));
    expect(ys.size).toBe(1);
  });

  it('matches its snapshot (decimals rounded)', () => {
    const svg = binCountsChart(host(), { bins: weibull.bins, family: 'weibull', label: 'Weibull' }, OPTS);
    expect(normaliseSvg(svg.outerHTML)).toMatchSnapshot();
  });
});

describe('empirical CDF against fitted CDFs', () => {
  it('draws the steps from 0 to 1 and one curve per candidate', () => {
    const svg = cdfChart(host(), { cdf: EVIDENCE.cdf, xDomain: EVIDENCE.xDomain, selected: 'normal' }, OPTS);
    const steps = svg.querySelector('path[data-kind="ecdf"]');
    const d = steps?.getAttribute('d') ?? '';
    // An ECDF is right-continuous and rises n/n = 1 at the largest value (common practice, no source).
    const vs = [...d.matchAll(/V(-?[\d.]+)/g)].map((m) => Number(m[1]));
    expect(vs).toHaveLength(10);
    expect(Math.min(...vs)).toBe(0); // y(1) is the top of the plot area
    expect(svg.querySelectorAll('path[data-kind="curve"]')).toHaveLength(2);
    expect(axisTitles(svg)).toEqual(['Life [h]', 'Share at or below']);
  });

  it('matches its snapshot (decimals rounded)', () => {
    const svg = cdfChart(host(), { cdf: EVIDENCE.cdf, xDomain: EVIDENCE.xDomain, selected: 'normal' }, OPTS);
    expect(normaliseSvg(svg.outerHTML)).toMatchSnapshot();
  });
});

describe('coarse curve grids', () => {
  it('leaves the curves out and says so when the grid has fewer than 12 points in the drawn range (common practice, no source)', () => {
    const sparse = { x: [0, 500, 1000], curves: EVIDENCE.densities.curves.map((c) => ({ ...c, y: [0.01, 0.01, 0.01] })) };
    const svg = histogramChart(host(), { histogram: weibull.histogram, densities: sparse, xDomain: EVIDENCE.xDomain, selected: 'weibull', selectedLabel: 'Weibull' }, OPTS);
    expect(svg.querySelectorAll('path[data-kind="curve"]')).toHaveLength(0);
    expect(svg.querySelector('[data-kind="notes"]')?.textContent).toMatch(/not drawn: only 0 curve points/);
    const fine = histogramChart(host(), { histogram: weibull.histogram, densities: EVIDENCE.densities, xDomain: EVIDENCE.xDomain, selected: 'weibull', selectedLabel: 'Weibull' }, OPTS);
    expect(fine.querySelector('[data-kind="notes"]')).toBeNull();
  });
});

describe('bars cut at the drawn range', () => {
  it('say where they really start and end, in notes under the axis and never on the curves (common practice, no source)', () => {
    const svg = histogramChart(host(), { histogram: weibull.histogram, densities: EVIDENCE.densities, xDomain: [30, 80], selected: 'weibull', selectedLabel: 'Weibull' }, OPTS);
    const notes = [...svg.querySelectorAll('[data-kind="notes"] text')].map((n) => n.textContent);
    expect(notes.slice(0, 2)).toEqual(['◂ The first bar starts at 5, left of the drawn range.', '▸ The last bar ends at 105, right of the drawn range.']);
    // Nothing but marks and curves inside the plotting area: every text is outside the plot group.
    const plot = svg.querySelector('[data-kind="plot"]')!;
    const inPlot = [...plot.querySelectorAll(':scope > text')].map((t) => t.getAttribute('data-kind'));
    expect(inPlot).toEqual(['axis-title']);
  });
});

describe('user text in charts', () => {
  it('keeps units and names as text: markup in them cannot become elements (OWASP XSS Prevention Cheat Sheet, rule 1)', () => {
    const hostile = { ...OPTS, units: '<img src=x onerror=alert(1)>', quantity: '<script>alert(1)</script>' };
    const svg = cdfChart(host(), { cdf: EVIDENCE.cdf, xDomain: EVIDENCE.xDomain, selected: 'normal' }, hostile);
    expect(svg.querySelector('script, img')).toBeNull();
    expect(svg.outerHTML).not.toContain('<script');
    expect(svg.outerHTML).toContain('&lt;script&gt;');
  });
});

describe('snapshot normaliser', () => {
  it('rounds decimals to one place and leaves integers alone (common practice, no source)', () => {
    expect(normaliseSvg('<path d="M1.234,5.678L10,-0.04"/>')).toBe('<path d="M1.2,5.7L10,0"/>');
  });
});

describe('layout helpers (common practice, no source)', () => {
  it('keepApart drops tick values whose labels would touch a kept neighbour, keeping the leftmost', async () => {
    const { keepApart } = await import('../../client/charts/frame.js');
    // Labels '100', '200', '500' centred at 0, 10 and 60 px: 200 is too close to 100 and is dropped.
    expect(keepApart([100, 200, 500], (v) => ({ 100: 0, 200: 10, 500: 60 })[v] as number, String)).toEqual([100, 500]);
    expect(keepApart([1, 2], (v) => v * 100, String)).toEqual([1, 2]);
  });

  it('wrapText breaks at spaces so that no line is estimated wider than the room, and keeps every word', async () => {
    const { textWidth, wrapText } = await import('../../client/charts/text.js');
    const title = 'Where do failures and suspensions fall under the Weibull density?';
    const lines = wrapText(title, 200, 14, true);
    expect(lines.length).toBeGreaterThan(1);
    for (const l of lines) expect(textWidth(l, 14, true)).toBeLessThanOrEqual(200);
    expect(lines.join(' ')).toBe(title);
    // Upper case and m/w are wider than lower case; bold wider than regular.
    expect(textWidth('MW', 12)).toBeGreaterThan(textWidth('ab', 12));
    expect(textWidth('ab', 12, true)).toBeGreaterThan(textWidth('ab', 12));
  });
});

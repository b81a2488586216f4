// @vitest-environment jsdom
/**
 * The L-moment ratio diagram chart (client/charts/lmoment-diagram.ts) in jsdom: one path per core
 * curve, the family points, the sample point placed by its (τ3, τ4), titles for screen readers.
 * The SVG is written to test-output/ for a look.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { beforeEach, describe, expect, it } from 'vitest';
import { lmomentDiagramChart } from '../../client/charts/lmoment-diagram.js';
import { resetIds } from '../../client/charts/frame.js';
import { ratioDiagram } from '../../core/lmoments/ratio-diagram.js';

const OPTS = { width: 640, height: 460, units: 'm³/s', quantity: 'Annual peak' };

beforeEach(() => {
  document.body.innerHTML = '';
  resetIds();
});

describe('L-moment ratio diagram chart', () => {
  it('draws every curve and point the core gives, and the sample where its ratios put it', () => {
    const peaks = [112, 87, 143, 96, 205, 131, 78, 164, 119, 101, 256, 92, 138, 177, 84, 125, 310, 107, 149, 99, 186, 121, 91, 134, 228];
    const data = ratioDiagram(peaks);
    const host = document.createElement('div');
    document.body.append(host);
    const svg = lmomentDiagramChart(host, data, OPTS);
    expect(svg.querySelectorAll('[data-kind="curve"]')).toHaveLength(data.curves.length);
    expect(svg.querySelectorAll('[data-kind="family-point"]')).toHaveLength(data.points.length);
    const dot = svg.querySelector('[data-kind="sample"]')!;
    expect(dot.querySelector('title')!.textContent).toContain(`τ3 = ${data.sample.t3.toFixed(4)}`);
    // x grows with τ3: the sample (τ3 ≈ 0.32) lies right of the normal point (τ3 = 0).
    const normal = svg.querySelector('[data-family="normal"]')!;
    expect(Number(dot.getAttribute('cx'))).toBeGreaterThan(Number(normal.getAttribute('x')));
    expect([...svg.querySelectorAll('[data-kind="axis-title"]')].map((t) => t.textContent)).toEqual(expect.arrayContaining(['L-skewness τ3']));
    mkdirSync('test-output', { recursive: true });
    writeFileSync('test-output/lmoment-diagram.svg', svg.outerHTML);
  });
});

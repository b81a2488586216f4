// @vitest-environment jsdom
/**
 * Threshold diagnostic charts (client/charts/threshold-*.ts) in jsdom, drawing the core's
 * thresholdDiagnostics of the invented seeded daily series (test/fixtures/flood-pot.json): one
 * point per threshold with data, the chosen threshold marked; SVGs written to test-output/.
 */
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { beforeEach, describe, expect, it } from 'vitest';
import { resetIds } from '../../client/charts/frame.js';
import { thresholdMeanExcessChart } from '../../client/charts/threshold-mean-excess.js';
import { thresholdStabilityChart } from '../../client/charts/threshold-stability.js';
import { thresholdDiagnostics } from '../../core/flood/pot.js';

const FIX = JSON.parse(readFileSync('test/fixtures/flood-pot.json', 'utf8')) as { values: number[] };
const times = FIX.values.map((_, i) => i);
const diagnostics = thresholdDiagnostics(times, FIX.values, [10, 14, 18, 22, 25, 28, 32, 36, 40, 45, 55, 65], 3);
const OPTS = { width: 600, height: 380, units: 'm³/s', quantity: 'Flow' };

beforeEach(() => {
  document.body.innerHTML = '';
  resetIds();
});

describe('threshold diagnostic charts', () => {
  it('mean excess: one point per threshold, the chosen threshold marked', () => {
    const host = document.createElement('div');
    document.body.append(host);
    const svg = thresholdMeanExcessChart(host, { diagnostics, chosen: 25 }, OPTS);
    expect(svg.querySelectorAll('[data-kind="point"]')).toHaveLength(diagnostics.length);
    expect(svg.querySelectorAll('[data-kind="chosen"]')).toHaveLength(1);
    mkdirSync('test-output', { recursive: true });
    writeFileSync('test-output/threshold-mean-excess.svg', svg.outerHTML);
  });
  it('stability: only thresholds with a fitted shape (≥ 10 events)', () => {
    const host = document.createElement('div');
    document.body.append(host);
    const svg = thresholdStabilityChart(host, { diagnostics, chosen: 25 }, OPTS);
    expect(svg.querySelectorAll('[data-kind="point"]')).toHaveLength(diagnostics.filter((d) => d.shape !== null).length);
    expect(diagnostics.some((d) => d.shape === null)).toBe(true);
    writeFileSync('test-output/threshold-stability.svg', svg.outerHTML);
  });
  it('the chart descriptions print the chosen threshold through core/format (no float noise: 0.1 + 0.2 shows as 0.3)', () => {
    for (const draw of [thresholdMeanExcessChart, thresholdStabilityChart]) {
      const host = document.createElement('div');
      document.body.append(host);
      const svg = draw(host, { diagnostics, chosen: 0.1 + 0.2 }, OPTS);
      const desc = svg.querySelector('desc')!.textContent!;
      expect(desc).toMatch(/the chosen threshold 0\.3 is marked/);
      expect(desc).not.toMatch(/0\.30000000000000004/);
    }
  });
});

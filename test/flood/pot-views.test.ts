// @vitest-environment jsdom
/**
 * Peaks over a threshold on screen: the page section (client/src/views/flood-pot.ts, registered in
 * views/sections.ts) and its two chart slots ('threshold-mean-excess', 'threshold-stability', drawn
 * by drawSlot), from the API's report on the invented daily-flows demo (datasets/river-daily-flows.csv,
 * scripts/make-pot-dataset.ts) through the JSON round trip the page receives. The numbers are
 * checked against SciPy genpareto in pot-pipeline.test.ts; here: what is on screen says which
 * estimator gave each level, the intervals and their level, and the safety cautions.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { DatasetReport } from '../../core/index.js';
import { blockHtml, blockNode } from '../../client/src/views/block.js';
import { floodPotSection } from '../../client/src/views/flood-pot.js';
import { SECTIONS } from '../../client/src/views/sections.js';
import { drawSlot } from '../../client/src/decision-charts.js';
import { resetIds } from '../../client/charts/frame.js';
import { finishRequest, planRequest } from '../../server/analysis.js';
import { parseAnalyzeBody } from '../../server/validate.js';
import { DEMO_SETTINGS } from '../../server/demo.js';

const csv = readFileSync('datasets/river-daily-flows.csv', 'utf8');
const demo = DEMO_SETTINGS['river-daily-flows']!;
const planned = planRequest(parseAnalyzeBody({ csv, column: demo.column, ...demo.fields }));
const report = JSON.parse(JSON.stringify(finishRequest(planned, []))) as DatasetReport;
const ctx = { report, selected: '', lifeScale: 'weibull' as const };
const size = { width: 640, height: 400, units: 'm³/s' };

describe('peaks over a threshold on the page', () => {
  it('is a registered section, shown only for a dated series', () => {
    expect(SECTIONS.map((s) => s.key)).toContain('pot');
    expect(floodPotSection({ report: { ...report, pot: undefined } as DatasetReport, selected: undefined, units: '' })).toBeNull();
  });

  it('answer: the 100-year level by maximum likelihood with its 90 % interval; both estimators in one table; cautions defer to the governing agency', () => {
    const b = floodPotSection({ report, selected: undefined, units: 'm³/s' })!;
    const z = report.pot!.candidates[0]!.returnLevels.at(-1)!;
    expect(b.answer).toBe(`100-year level from the events above 140 m³/s: ${Number(z.estimate.toPrecision(4))} m³/s by maximum likelihood, 90 % interval ${Number(z.lower!.toPrecision(4))} to ${Number(z.upper!.toPrecision(4))}.`);
    expect(b.tables[0]!.head).toEqual(['Return period T [years]', 'Maximum likelihood [m³/s]', 'Lower', 'Upper', 'L-moments [m³/s]']);
    expect(b.tables[0]!.rows.map((r) => r[0])).toEqual(['2', '10', '50', '100']);
    const text = b.lines.map((l) => l.text).join(' ');
    expect(text).toMatch(/event peaks in 25 years/);
    expect(text).toMatch(/by maximum likelihood: scale .* log-likelihood/);
    expect(text).toMatch(/by L-moments: scale/);
    expect(b.lines.filter((l) => l.kind === 'caution').map((l) => l.text).join(' ')).toMatch(/governing agency.*licensed engineer/);
    const node = blockNode(b, () => document.createElement('div'));
    expect(node.textContent).toContain('Peaks over a threshold');
    expect(blockHtml(b, () => '')).toContain('data-block="pot"');
    expect(b.charts).toEqual(['threshold-mean-excess', 'threshold-stability']);
  });

  it('draws the mean excess and the parameter stability across the 15 thresholds, the chosen one marked', () => {
    resetIds();
    const me = drawSlot('threshold-mean-excess', document.createElement('div'), ctx, size)!;
    expect(me.querySelectorAll('[data-kind="point"]').length).toBe(report.pot!.diagnostics.length);
    expect(me.querySelectorAll('[data-kind="chosen"]').length).toBe(1);
    const st = drawSlot('threshold-stability', document.createElement('div'), ctx, size)!;
    expect(st.querySelectorAll('[data-kind="point"]').length).toBe(report.pot!.diagnostics.filter((d) => d.shape !== null).length);
    const plain = { ...report, pot: undefined } as DatasetReport;
    expect(drawSlot('threshold-mean-excess', document.createElement('div'), { ...ctx, report: plain }, size)).toBeNull();
  });
});

// @vitest-environment jsdom
/**
 * Interval rows with a failure-mode column, as the page draws them (issue 13), from the core's report
 * on the rows of test/fixtures/life-modes-interval.json (invented, seeded; scripts/fixtures/
 * life-modes-interval.py: SciPy CensoredData fits per mode refined by mpmath, the whole unit's B10
 * with likelihood-ratio and Fisher-matrix bounds). The life section says how each failure is known
 * (not "treated as right-censored" alone), the probability paper has no "Failures (0)" entry but a
 * note, and the modes section names the method of every bound, which equal the fixture's.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeEach, describe, expect, it } from 'vitest';
import { analyzeDataset, type DatasetReport } from '../../core/index.js';
import { resetIds } from '../../client/charts/frame.js';
import { drawSlot } from '../../client/src/decision-charts.js';
import { sig } from '../../client/src/format.js';
import { lifeSection } from '../../client/src/views/life.js';
import { modesSection } from '../../client/src/views/modes.js';

const fx = JSON.parse(readFileSync(join(process.cwd(), 'test', 'fixtures', 'life-modes-interval.json'), 'utf8')) as {
  rows: { start: number; end: number | null; mode: string | null; count: number }[];
  system: { b10: number; b10LikelihoodRatio90: [number, number]; b10Fisher90: [number, number] };
};
const interval = { start: fx.rows.map((r) => r.start), end: fx.rows.map((r) => (r.end === null ? Number.POSITIVE_INFINITY : r.end)), counts: fx.rows.map((r) => r.count) };
const modes = fx.rows.map((r) => r.mode);
/** The report as the page receives it (JSON: NaN and Infinity become null). */
const report = (boundMethod: 'likelihood-ratio' | 'fisher-matrix'): DatasetReport =>
  JSON.parse(JSON.stringify(analyzeDataset({ interval, modes }, { families: ['weibull'], bLifePercents: [10], boundMethod, bootstrapReplicates: 19, seed: 1 }))) as DatasetReport;
const LR = report('likelihood-ratio');

beforeEach(() => {
  document.body.innerHTML = '';
  resetIds();
});

describe('interval rows with failure modes on the page', () => {
  it('the life section says how the failures are known: exact, before the first inspection, within an interval, still running', () => {
    const rec = LR.life!.recorded!.report!;
    expect(rec.interval).toBeGreaterThan(0);
    const life = lifeSection({ report: LR, selected: LR.candidates[0], units: '' })!;
    const facts = life.lines.map((l) => l.text);
    expect(facts).toContain(`${rec.n} units found at inspections: ${rec.failures} failed (${rec.exact} at a known time, ${rec.left} before the first inspection, ${rec.interval} within an inspection interval), ${rec.right} still running at their last inspection (right-censored).`);
    expect(facts.some((t) => /treated as right-censored/.test(t))).toBe(false);
  });

  it('the probability paper has no "Failures (0)" legend entry, and a note says why no failure is plotted', () => {
    const svg = drawSlot('life-probability', document.body.appendChild(document.createElement('div')), { report: LR, selected: 'weibull', lifeScale: 'weibull' }, { width: 640, height: 400, units: '', quantity: 'Time' });
    expect(svg).not.toBeNull();
    const legend = [...svg!.querySelectorAll('[data-kind="legend-entry"] text')].map((t) => t.textContent ?? '');
    expect(legend.some((t) => /^Failures \(/.test(t))).toBe(false);
    expect(legend).toContain('Weibull (selected)');
    expect([...svg!.querySelectorAll('[data-kind="notes"] text')].map((t) => t.textContent).join(' ')).toMatch(/^No failure is plotted/);
    expect(LR.life!.plot.weibull).toHaveLength(0);
  });

  it('the modes section: interval wording, each bound with its method, the whole unit equal to the SciPy/mpmath fixture (LR and Fisher)', () => {
    for (const [method, rep, ends, name] of [
      ['likelihood-ratio', LR, fx.system.b10LikelihoodRatio90, /whole unit: likelihood ratio \(profile likelihood over every mode’s parameters\), two-sided\.$/],
      ['fisher-matrix', report('fisher-matrix'), fx.system.b10Fisher90, /whole unit: Fisher matrix .*two-sided\.$/],
    ] as const) {
      const b = modesSection({ report: rep, selected: undefined, units: '' })!;
      expect(b.lines[0]!.text).toMatch(/counted as still running up to the last inspection it was seen working/);
      const unit = b.tables[0]!.rows.find((r) => r[0] === 'whole unit: B10')!;
      expect(unit.slice(3), method).toEqual([sig(fx.system.b10), sig(ends[0]), sig(ends[1])]);
      const words = method === 'likelihood-ratio' ? 'likelihood ratio' : 'Fisher matrix';
      expect(b.tables[0]!.caption).toMatch(new RegExp(`two-sided bounds: per mode by ${words}; for the whole unit by ${words} over every mode's parameters at once$`));
      expect(b.lines.find((l) => /^Bounds on the B-lives, /.test(l.text))!.text).toMatch(name);
      expect(b.answer).toContain(`(90 % ${method === 'likelihood-ratio' ? 'likelihood-ratio' : 'Fisher-matrix'} bounds ${sig(ends[0])} to ${sig(ends[1])})`);
    }
  });
});

/**
 * One decision for "which model answers" (core/capability/answer.ts), read by the page's headline,
 * its capability section, the exported report and the command line. Data: the pump-seal-wear demo
 * (invented, right-skewed, 80 values, datasets/README.md) with an invented USL of 120 µm and the
 * natural lower bound 0. The rule is the project's own (issue 14: a transformation the user asks
 * for answers when its transformed values pass the normality test); no outside source.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyzeDataset, type DatasetReport } from '../../core/index.js';
import { capabilityAnswer, noIntervalNote } from '../../core/capability/answer.js';
import { capabilityAnswerLine } from '../../cli/capability-text.js';

const csv = readFileSync(join(process.cwd(), 'datasets', 'pump-seal-wear.csv'), 'utf8');
const values = csv.trim().split('\n').slice(1).map(Number);
const run = (transform: 'none' | 'boxcox' | 'johnson'): DatasetReport =>
  JSON.parse(JSON.stringify(analyzeDataset({ values }, { usl: 120, naturalLowerBound: 0, transform, confidence: 0.9, capabilityReplicates: 199, seed: 3 }))) as DatasetReport;

describe('capabilityAnswer: the model the capability answer stands on', () => {
  const box = run('boxcox');
  const cap = box.capability!;
  const t = cap.transform;

  it('a Box–Cox transformation asked for and passing answers whatever model is selected, with its own interval; the JSON says so for the best-ranked one', () => {
    expect(t.kind).toBe('boxcox');
    if (t.kind === 'none') return;
    expect(t.normality.passes).toBe(true);
    const row = cap.comparison.passing.find((r) => r.kind === 'transformation')!;
    expect(row.model).toMatch(/^Box–Cox normal \(λ = /);
    for (const c of [...box.candidates.map((x) => x.family), null]) {
      const a = capabilityAnswer(cap, box.candidates, c);
      expect(a.basis).toBe('transformation');
      expect(a.row).toEqual(row);
      expect(a.intervals).toEqual(t.intervals);
    }
    expect(cap.answer.basis).toBe('transformation');
    expect(cap.answer.selected).toBe(box.candidates[0]!.family);
    expect(cap.answer.row!.model).toBe(row.model);
  });

  it('the same transformation failing its test (its row moved among the rejected): the selected model answers, with no interval borrowed from the transformation', () => {
    const row = cap.comparison.passing.find((r) => r.kind === 'transformation')!;
    const failed = { ...cap, comparison: { ...cap.comparison, passing: cap.comparison.passing.filter((r) => r !== row), rejected: [...cap.comparison.rejected, { ...row, passes: false }] } };
    const a = capabilityAnswer(failed, box.candidates, 'weibull');
    expect(a.basis).toBe('selected model');
    expect(a.row!.model).toBe('Weibull');
    expect(a.family).toBe('weibull');
    expect(a.intervals).toBeNull();
  });

  it('without a transformation: the selected row, else the normal when it passes; with every row rejected, none', () => {
    const none = run('none');
    const c = none.capability!;
    const w = capabilityAnswer(c, none.candidates, 'weibull');
    expect([w.basis, w.row!.model]).toEqual(['selected model', 'Weibull']);
    const n = capabilityAnswer(c, none.candidates, null);
    expect([n.basis, n.row!.kind]).toEqual(['normal', 'normal']);
    const all = capabilityAnswer({ ...c, comparison: { ...c.comparison, passing: [], rejected: [...c.comparison.passing, ...c.comparison.rejected] } }, none.candidates, 'weibull');
    expect([all.basis, all.row]).toEqual(['no passing model', null]);
  });

  it('a Ppk with no interval says why (the safety caution asks for a lower bound): a fitted family the bootstrap did not run for, a Johnson curve; none for the normal row or an interval given', () => {
    const none = run('none');
    const w = capabilityAnswer(none.capability!, none.candidates, 'weibull');
    expect(w.intervals).toBeNull(); // the normal passes here, so no percentile-method bootstrap ran
    expect(w.intervalNote).toBe(noIntervalNote('Weibull'));
    expect(capabilityAnswer(none.capability!, none.candidates, 'normal').intervalNote).toBeNull();
    expect(capabilityAnswer(cap, box.candidates, 'weibull').intervalNote).toBeNull();
    const j = run('johnson').capability!;
    expect(j.answer.intervalNote).toMatch(/^No bootstrap interval under a Johnson curve/);
    expect(j.answer.intervalNote).toBe(j.transform.kind !== 'none' ? j.transform.intervals.note : 'none');
    // the command line says it under the answer (not twice for the Johnson curve, whose note follows its block)
    expect(capabilityAnswerLine(none.capability!).replace(/\s+/g, ' ')).toContain(`(no interval); ppm out of spec 404.3 under Weibull (the best-ranked model). ${noIntervalNote('Weibull')}`);
    expect(capabilityAnswerLine(j)).not.toMatch(/No bootstrap interval under a Johnson curve/);
  });

  it('the command line states the answer first, under the transformation, with its Ppk, interval and ppm', () => {
    if (t.kind === 'none') return;
    const line = capabilityAnswerLine(cap).replace(/\s+/g, ' ');
    const row = cap.answer.row!;
    const ppk = row.indices.find((i) => i.name === 'Ppk')!.estimate;
    const iv = t.intervals.intervals!.find((i) => i.name === 'Ppk')!;
    expect(line).toContain(`Answer: Ppk ${Number(ppk.toPrecision(4))} (90 % BCa bootstrap ${Number(iv.lower.toPrecision(4))} … ${Number(iv.upper.toPrecision(4))}`);
    expect(line).toContain(`ppm out of spec ${Number(row.ppmTotal.toPrecision(4))} under ${row.model} (the transformation asked for`);
  });

  it('under a Johnson curve the command line says the interval is withheld rather than quoting none silently', () => {
    const j = run('johnson').capability!;
    expect(j.answer.basis).toBe('transformation');
    expect(capabilityAnswerLine(j).replace(/\s+/g, ' ')).toMatch(/Answer: Ppk [0-9.]+ \(no interval, see below\); ppm out of spec [0-9.]+ under Johnson S[UBL]/);
  });
});

import { describe, expect, it } from 'vitest';
import { analyzeDataset } from '../../core/index.js';
import { createRng } from '../../core/random/index.js';
import { capabilitySection, shareWords } from '../../client/src/views/capability.js';
import { blockHtml } from '../../client/src/views/block.js';

// Invented data (seeded): a right-skewed characteristic near a natural bound of 0 (lognormal),
// an upper limit only, and a step-shifted series for the stability check.
const rng = createRng(2024, 0);
const skewed = Array.from({ length: 120 }, () => Math.exp(1 + 0.45 * rng.normal()));
const order = skewed.map((_, i) => i + 1);

describe('capability page section', () => {
  const r = analyzeDataset({ values: skewed, order }, { usl: 12, naturalLowerBound: 0, transform: 'boxcox', families: ['normal', 'lognormal', 'gamma', 'exponential'], capabilityReplicates: 199, seed: 3 });
  const b = capabilitySection({ report: r, selected: undefined, units: 'µm' })!;
  it('with a Johnson curve: the indices without an interval, and a warning line saying why (the Box–Cox section above has none)', () => {
    const j = analyzeDataset({ values: skewed }, { usl: 12, transform: 'johnson', families: ['normal', 'lognormal'], capabilityReplicates: 49, seed: 3 });
    const jb = capabilitySection({ report: j, selected: undefined, units: 'µm' })!;
    expect(j.capability!.transform.kind).toBe('johnson');
    expect(jb.answer).not.toMatch(/bootstrap interval/);
    expect(jb.lines.filter((l) => l.kind === 'warning' && /^No bootstrap interval under a Johnson curve/.test(l.text))).toHaveLength(1);
    expect(b.lines.some((l) => /^No bootstrap interval/.test(l.text))).toBe(false);
  });
  it('answers under the transformation when it passes, with its bootstrap interval; one-sided statement; no lower side', () => {
    const t = r.capability!.transform;
    expect(t.kind).toBe('boxcox');
    expect(b.answer).toMatch(/^About .* outside the tolerance under Box–Cox normal \(λ = /);
    expect(b.answer).toMatch(/bootstrap interval/);
    expect(b.lines.some((l) => /Upper limit only, with a natural lower bound at 0/.test(l.text))).toBe(true);
    expect(b.lines.some((l) => /^Lower side/.test(l.text))).toBe(false);
    expect(b.lines.some((l) => /^Upper side: the 99\.865 % point/.test(l.text))).toBe(true);
  });
  it('rejected models sit in their own folded table, never in the passing table or the spread', () => {
    const cmp = r.capability!.comparison;
    const rejected = cmp.rejected.map((x) => x.model);
    expect(rejected).toContain('exponential');
    const passingTable = b.tables.find((x) => /each model that passes/.test(x.caption))!;
    expect(passingTable.folded).toBeFalsy();
    // The page shows each model by its one label with a capital (client/src/families.ts capital).
    const shown = rejected.map((m) => m[0]!.toUpperCase() + m.slice(1));
    for (const row of passingTable.rows) expect(shown).not.toContain(row[0]);
    const rejTable = b.tables.find((x) => /reject/.test(x.caption))!;
    expect(rejTable.folded).toBe(true);
    expect(rejTable.rows.map((x) => x[0])).toEqual(shown);
    if (cmp.spread) expect(rejected).not.toContain(cmp.spread.highestModel);
    // exactly one normal row
    expect([...cmp.passing, ...cmp.rejected].filter((x) => x.kind === 'normal')).toHaveLength(1);
  });
  it('shows the stability verdict from the order column and the safety caution', () => {
    expect(b.lines.some((l) => /^Stability \(individuals and moving range, order from the order column, on the Box–Cox transformed \(λ = [0-9.-]+\) scale\): No point/.test(l.text))).toBe(true);
    expect(b.lines.some((l) => l.kind === 'caution' && /safety-critical/.test(l.text))).toBe(true);
    expect(blockHtml(b, () => '')).toContain('Can it meet the tolerance?');
    expect(b.charts).toEqual(['capability-histogram', 'control-chart']);
  });
  it('an unstable process: the answer says so first', () => {
    const shifted = skewed.map((v, i) => (i >= 80 ? v + 6 : v));
    const r2 = analyzeDataset({ values: shifted, order }, { usl: 30, families: ['normal', 'lognormal'], capabilityReplicates: 99, seed: 3 });
    const b2 = capabilitySection({ report: r2, selected: undefined, units: '' })!;
    expect(r2.capability!.stability!.stable).toBe(false);
    expect(b2.answer).toMatch(/^Not yet answerable with confidence — the process is not shown to be stable/);
    expect(b2.lines.some((l) => l.kind === 'warning' && /do not predict its future/.test(l.text))).toBe(true);
  });
  it('share in words', () => {
    expect(shareWords(0)).toBe('none expected');
    expect(shareWords(12)).toMatch(/^12 ppm, about 1 part in 83/);
  });
});

describe('capability page section: run rules', () => {
  it('a shifted series with no point beyond the limits: the stability line warns, the folded table lists the points completing a run with the rule in words', () => {
    // invented: a fast oscillation around 10, then the same around 10.15 (no point beyond 3 sigma)
    const x = Array.from({ length: 42 }, (_, i) => (i >= 30 ? 10.15 : 10) + 0.1 * Math.sin(2.1 * i));
    const rr = analyzeDataset({ values: x, order: x.map((_, i) => i + 1) }, { lsl: 9, usl: 11, families: ['normal'], capabilityReplicates: 19, seed: 1 });
    const st = rr.capability!.stability!;
    expect(st.pointsBeyond).toBe(0);
    expect(st.runSignals).toBeGreaterThan(0);
    const bb = capabilitySection({ report: rr, selected: undefined, units: '' })!;
    expect(bb.lines.some((l) => l.kind === 'warning' && /^Stability \(individuals and moving range.*complete a run signal \(rule/.test(l.text))).toBe(true);
    const table = bb.tables.find((t) => /^Points that signal/.test(t.caption))!;
    expect(table.rows).toHaveLength(st.runSignals);
    expect(table.rows.every((r) => /^rule [234]: /.test(r[4]!))).toBe(true);
    expect(bb.answer).toMatch(/^Not yet answerable with confidence/);
  });
});

describe('capability page section when no model passes', () => {
  it('no empty passing table; the rejected table is shown open, and the room to the limits says its model is rejected', () => {
    const rng = createRng(77, 0);
    // a two-peaked mixture no single family fits (invented)
    const mix = Array.from({ length: 300 }, (_, i) => (i % 2 === 0 ? 10 : 14) + 0.5 * rng.normal());
    const r = analyzeDataset({ values: mix }, { lsl: 8, usl: 16, families: ['normal', 'lognormal', 'gamma'], capabilityReplicates: 19, seed: 1 });
    expect(r.capability!.comparison.passing).toHaveLength(0);
    const b = capabilitySection({ report: r, selected: undefined, units: '' })!;
    expect(b.tables.some((t) => /each model that passes/.test(t.caption))).toBe(false);
    const rej = b.tables.find((t) => /here every one/.test(t.caption))!;
    expect(rej.folded).toBe(false);
    expect(b.answer).toMatch(/^No model passes the tests/);
    expect(b.lines.filter((l) => /^(Upper|Lower) side/.test(l.text)).every((l) => /rejected by a test/.test(l.text))).toBe(true);
  });
  it('with subgroups: the means-and-ranges chart slot beside the stability chart, and its line with Montgomery\'s factors', () => {
    const subgroups = skewed.map((_, i) => Math.floor(i / 5));
    const r3 = analyzeDataset({ values: skewed, subgroups }, { usl: 12, families: ['normal', 'lognormal'], capabilityReplicates: 19, seed: 3 });
    const b3 = capabilitySection({ report: r3, selected: undefined, units: '' })!;
    expect(b3.charts).toEqual(['capability-histogram', 'control-chart', 'range-chart']);
    // factors for subgroups of 5: A2 0.5768 and D4 2.114 (Montgomery prints 0.577 and 2.114, from memory)
    expect(b3.lines.some((l) => /^Beside it, subgroup means and ranges: .*A2 0\.5768, D3 0, D4 2\.114 /.test(l.text))).toBe(true);
  });
});

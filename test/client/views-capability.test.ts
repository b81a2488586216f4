/**
 * The capability section's words (client/src/views/capability.ts) from the core's reports: with an
 * order column the stability verdict and its run signals (Western Electric rules, core/capability
 * run-rules.ts) and never "Stability not checked" beside the chart; without one, "not checked"; with
 * a natural lower bound, a model reaching below it flagged with the share it puts there (the core's
 * ppmBelowNaturalBound). Data: invented (./invented-runs.ts) and the pump-seal-wear demo (invented,
 * datasets/README.md).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyzeDataset, type DatasetReport } from '../../core/index.js';
import { RUN_RULE_WORDS } from '../../core/capability/run-rules.js';
import { capabilitySection, shareWords } from '../../client/src/views/capability.js';
import { answerFor } from '../../client/src/views/answer.js';
import { sig } from '../../client/src/format.js';
import { capital } from '../../client/src/families.js';
import { SHIFTED } from './invented-runs.js';

describe('the capability section with an order column (individuals chart, no range chart)', () => {
  const report = (order: boolean): DatasetReport =>
    JSON.parse(JSON.stringify(analyzeDataset({ values: SHIFTED, ...(order ? { order: SHIFTED.map((_, i) => i + 1) } : {}) }, { families: ['normal'], lsl: 47, usl: 54, seed: 1 }))) as DatasetReport;
  it('says the stability verdict and its run signals, and never "Stability not checked" beside the chart', () => {
    const r = report(true);
    expect(r.capability?.stability?.kind).toBe('individuals and moving range');
    expect(r.capability?.rangeChart ?? null).toBeNull();
    const b = capabilitySection({ report: r, selected: undefined, units: 'g' })!;
    const texts = b.lines.map((l) => l.text);
    expect(texts.some((t) => /^Stability \(individuals and moving range, order from the order column\): .*complete a run signal/.test(t))).toBe(true);
    expect(texts.some((t) => /Stability not checked/.test(t))).toBe(false);
    expect(b.answer).toMatch(/^Not yet answerable with confidence — the process is not shown to be stable\./);
    expect(b.charts).toContain('control-chart');
    // the signalled points in words, rule by rule
    const signal = b.tables.find((t) => /^Points that signal/.test(t.caption))!;
    expect(signal.rows.length).toBe(r.capability!.stability!.runSignals);
    expect(signal.rows.some((row) => row[4] === `rule 2: ${RUN_RULE_WORDS[2]}`)).toBe(true);
  });
  it('without an order or subgroup column it says stability was not checked', () => {
    const b = capabilitySection({ report: report(false), selected: undefined, units: 'g' })!;
    expect(b.lines.some((l) => /^Stability not checked/.test(l.text))).toBe(true);
  });
});

describe('the capability comparison with a natural lower bound', () => {
  it('a model reaching below the bound is flagged in its row with the share it puts there (pump-seal-wear demo, USL 120, bound 0)', () => {
    const csv = readFileSync(join(process.cwd(), 'datasets', 'pump-seal-wear.csv'), 'utf8');
    const values = csv.trim().split('\n').slice(1).map(Number);
    const r = JSON.parse(JSON.stringify(analyzeDataset({ values }, { families: ['normal', 'weibull'], usl: 120, naturalLowerBound: 0, seed: 1 }))) as DatasetReport;
    const rows = [...r.capability!.comparison.passing, ...r.capability!.comparison.rejected];
    const normal = rows.find((x) => x.kind === 'normal')!;
    // mean 41.1 µm, sd 20.2 µm: the normal puts about 2 % below 0 (datasets/README.md, invented gamma data)
    expect(normal.ppmBelowNaturalBound).toBeGreaterThan(1e4);
    const b = capabilitySection({ report: r, selected: undefined, units: 'µm' })!;
    const cells = b.tables.flatMap((t) => t.rows).filter((row) => row[0] === 'Normal').map((row) => row[4]);
    expect(cells).toHaveLength(1);
    expect(cells[0]).toBe(`all real x; below the natural bound 0: ${shareWords(normal.ppmBelowNaturalBound!)}`);
    // the Weibull lives on x > 0: nothing below the bound, no flag
    const weib = b.tables.flatMap((t) => t.rows).find((row) => row[0] === 'Weibull')!;
    expect(weib[4]).toBe('x > 0');
  });
});

describe('the capability section answers under the model the headline quotes (the selected one)', () => {
  // Pump-seal-wear demo (invented gamma data, datasets/README.md), USL 120 µm: the normal and the Weibull both pass,
  // so the section once answered under the normal (45.6 ppm, Ppk 1.30) while the headline quoted the selected Weibull (404 ppm, Ppk 1.12).
  const csv = readFileSync(join(process.cwd(), 'datasets', 'pump-seal-wear.csv'), 'utf8');
  const values = csv.trim().split('\n').slice(1).map(Number);
  const r = JSON.parse(JSON.stringify(analyzeDataset({ values }, { families: ['normal', 'weibull'], usl: 120, seed: 1 }))) as DatasetReport;
  const rows = [...r.capability!.comparison.passing, ...r.capability!.comparison.rejected];
  it('with the Weibull selected: its ppm and Ppk in the section answer and in the headline, the normal only as a labelled comparison', () => {
    const weibull = r.candidates.find((c) => c.family === 'weibull')!;
    const row = rows.find((x) => x.model.toLowerCase() === weibull.label.toLowerCase())!;
    const normal = rows.find((x) => x.kind === 'normal')!;
    expect(row.passes && normal.passes).toBe(true);
    const ppk = sig(row.indices.find((i) => i.name === 'Ppk')!.estimate, 3);
    const normalPpk = sig(normal.indices.find((i) => i.name === 'Ppk')!.estimate, 3);
    expect(ppk).not.toBe(normalPpk); // the case can tell the two models apart
    const b = capabilitySection({ report: r, selected: weibull, units: 'µm' })!;
    expect(b.answer).toContain(`under Weibull; Ppk ${ppk}`);
    expect(b.answer).toContain(`${sig(row.ppmTotal, 3)} ppm`);
    expect(b.answer).not.toMatch(/Normal/);
    const head = answerFor(r, 'weibull', 'µm')!.sentence;
    expect(head).toContain(`Ppk ${ppk}`);
    expect(head).toContain(`${sig(weibull.ppmOutOfSpec!.total, 3)} ppm out of tolerance under Weibull`);
    expect(sig(weibull.ppmOutOfSpec!.total, 3)).toBe(sig(row.ppmTotal, 3));
    // the room to the limits from the Weibull's own 0.135 % / 99.865 % points, not mean ± 3 sd
    expect(b.lines.find((l) => /^Upper side/.test(l.text))!.text).toContain(`(${sig(row.upperQuantile, 5)} µm)`);
    expect(b.lines.find((l) => /^Upper side/.test(l.text))!.text).toContain('under Weibull');
    const cmp = b.lines.filter((l) => /^For comparison only, under the normal model/.test(l.text));
    expect(cmp).toHaveLength(1);
    expect(cmp[0]!.text).toContain(`Ppk ${normalPpk}`);
  });
  it('with the Weibull selected and no bootstrap run for it: the section and the headline say its Ppk has no interval (the safety caution asks for a lower bound)', () => {
    const weibull = r.candidates.find((c) => c.family === 'weibull')!;
    const b = capabilitySection({ report: r, selected: { ...weibull, label: 'Weibull' }, units: 'µm' })!;
    expect(b.lines.filter((l) => l.kind === 'warning' && l.text.startsWith('No interval for the Ppk under Weibull:'))).toHaveLength(1);
    expect(answerFor(r, 'weibull', 'µm')!.cautions.some((w) => w.startsWith('No interval for the Ppk under Weibull:') && w.endsWith('the Ppk above is a point estimate (more in “Can it meet the tolerance?”).'))).toBe(true);
    // the normal answer has its normal-theory bounds: no such line
    expect(answerFor(r, 'normal', 'µm')!.cautions.some((w) => /^No interval/.test(w))).toBe(false);
  });
  it('with the normal selected: the normal answer and no comparison line for it', () => {
    const normal = r.candidates.find((c) => c.family === 'normal')!;
    const b = capabilitySection({ report: r, selected: normal, units: 'µm' })!;
    expect(b.answer).toMatch(/under Normal; Ppk/);
    expect(b.lines.some((l) => /^For comparison only/.test(l.text))).toBe(false);
  });
});

describe('a transformation the user asks for answers in the headline as in the section (issue 14; core/capability/answer.ts)', () => {
  // Pump-seal-wear demo (invented, datasets/README.md), USL 120 µm, natural lower bound 0, Box–Cox asked for: its
  // transformed values pass Anderson–Darling, so the section answered under it while the headline still quoted the
  // selected Weibull (Ppk 1.12, 404 ppm) or, with a rejected model selected, that model.
  const csv = readFileSync(join(process.cwd(), 'datasets', 'pump-seal-wear.csv'), 'utf8');
  const values = csv.trim().split('\n').slice(1).map(Number);
  const run = (transform: 'boxcox' | 'johnson'): DatasetReport =>
    JSON.parse(JSON.stringify(analyzeDataset({ values }, { usl: 120, naturalLowerBound: 0, transform, confidence: 0.9, capabilityReplicates: 199, seed: 5 }))) as DatasetReport;
  const r = run('boxcox');
  const cap = r.capability!;
  const row = cap.comparison.passing.find((x) => x.kind === 'transformation')!;
  const ppk = sig(row.indices.find((i) => i.name === 'Ppk')!.estimate, 3);
  it.each(['weibull', 'gamma', 'normal'])('with %s selected: the same Ppk, interval, ppm and model name in the headline and the section; the spread over the section\'s rows', (family) => {
    const c = r.candidates.find((x) => x.family === family)!;
    const b = capabilitySection({ report: r, selected: { ...c, label: capital(c.label) }, units: 'µm' })!;
    const a = answerFor(r, family, 'µm')!;
    expect(b.answer).toContain(`under ${row.model}; Ppk ${ppk} (90 % bootstrap interval `);
    const interval = /interval ([^ ]+) to ([^ )]+)\)/.exec(b.answer ?? "")!;
    expect(a.sentence).toMatch(new RegExp(`^Ppk ${ppk} \\(90 % interval ${interval[1]} to ${interval[2]}\\) under ${row.model.replace(/[()]/g, '\\$&')}, the transformation asked for`));
    expect(a.sentence).toContain(`${sig(row.ppmTotal, 3)} ppm out of tolerance under ${row.model}`);
    expect(b.answer).toContain(`${sig(row.ppmTotal, 3)} ppm`);
    // the selected model's own rejection is not the answer's caution (gamma is rejected by chi-square here)
    expect(a.cautions.some((w) => /is rejected by/.test(w))).toBe(false);
    const ppm = cap.comparison.passing.map((x) => x.ppmTotal);
    // ... and points to the section that lists them (the sensitivity table lists fitted models only)
    expect(a.cautions.some((w) => w.includes(`from ${sig(Math.min(...ppm))} to ${sig(Math.max(...ppm))}`) && w.includes('see “Can it meet the tolerance?”'))).toBe(true);
  });
  it('under a Johnson curve the headline quotes the section\'s point estimate and says why it has no interval', () => {
    const j = run('johnson');
    const jr = j.capability!.comparison.passing.find((x) => x.kind === 'transformation')!;
    const a = answerFor(j, 'weibull', 'µm')!;
    const b = capabilitySection({ report: j, selected: j.candidates.find((x) => x.family === 'weibull'), units: 'µm' })!;
    const jp = sig(jr.indices.find((i) => i.name === 'Ppk')!.estimate, 3);
    expect(b.answer).toContain(`under ${jr.model}; Ppk ${jp}.`);
    expect(a.sentence).toMatch(new RegExp(`^Ppk ${jp} under ${jr.model}, the transformation asked for`));
    expect(a.cautions.some((w) => /^No bootstrap interval under a Johnson curve/.test(w))).toBe(true);
  });
});

/**
 * The answer at the top of the page (client/src/views/answer.ts) and the trade sections of the
 * registry (views/sections.ts), from real reports of the core on the demo data (datasets/README.md:
 * invented scenarios). The answer must say when the selected model is rejected, when a trend was
 * found, and when the number lies beyond the record.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyzeDataset, pValueText, readColumns, type DatasetReport, type NumberColumn, type TextColumn } from '../../core/index.js';
import { answerFor } from '../../client/src/views/answer.js';
import { SECTIONS, sectionBlocks } from '../../client/src/views/sections.js';
import { modelLabel } from '../../client/src/families.js';

const read = (f: string, cols: string[]) => readColumns(readFileSync(join(process.cwd(), 'datasets', f), 'utf8'), cols.map((select) => ({ select, kind: select === 'status' ? ('text' as const) : ('number' as const) })));

const bt = read('bearing-life.csv', ['hours', 'status']);
const LIFE = analyzeDataset(
  { values: (bt.columns[0] as NumberColumn).values, status: (bt.columns[1] as TextColumn).texts.map(Number) },
  { families: ['weibull', 'lognormal', 'exponential'], bLifePercents: [10], bootstrapReplicates: 99, seed: 1 },
) as DatasetReport;
const rv = read('river-peaks.csv', ['peak_flow_m3s', 'year']);
// The river peaks with an added drift of 12 m³/s a year (invented), so the Mann–Kendall test finds a trend.
const peaks = (rv.columns[0] as NumberColumn).values;
const years = (rv.columns[1] as NumberColumn).values;
const FLOOD = analyzeDataset(
  { values: peaks.map((v, i) => v + 12 * (years[i]! - years[0]!)), order: years },
  { families: ['gumbel', 'gev'], returnPeriods: [10, 100, 200], seed: 1 },
) as DatasetReport;

describe('the answer', () => {
  it('states the first B-life under the selected model with its bounds', () => {
    const a = answerFor(LIFE, 'weibull', 'h')!;
    expect(a.sentence).toMatch(/^B10 life under Weibull: [\d.]+ h \(two-sided 90 % bounds/);
  });

  it('says so when the selected model is rejected by a test, and names the best model no test rejects', () => {
    const rejected = LIFE.candidates.find((c) => c.rejectedBy.length > 0);
    expect(rejected, 'the bearing data reject at least one model (exponential)').toBeDefined();
    const a = answerFor(LIFE, rejected!.family, 'h')!;
    expect(a.undermined).toBe(true);
    expect(a.cautions[0]).toMatch(new RegExp(`^${modelLabel(rejected!.family)} is rejected by the (Anderson–Darling|chi-square) test \\(p [=<]`));
    expect(a.cautions[0]).toMatch(/do not design on this number/);
    const passing = LIFE.candidates.find((c) => c.rejectedBy.length === 0);
    if (passing) expect(a.cautions[0]).toContain(`best model no test rejects is ${modelLabel(passing.family)}`);
  });

  it('a model no test rejects carries no rejection caution', () => {
    const ok = LIFE.candidates.find((c) => c.rejectedBy.length === 0)!;
    expect(answerFor(LIFE, ok.family, 'h')!.cautions.join(' ')).not.toMatch(/rejected by/);
  });

  it('names a detected trend next to a return level, and the level beyond the record', () => {
    expect(FLOOD.trend?.trendDetected, 'the drift added above is found').toBe(true);
    const a = answerFor(FLOOD, 'gumbel', 'm³/s')!;
    expect(a.sentence).toMatch(/^200-year level under Gumbel/);
    expect(a.undermined).toBe(true);
    expect(a.cautions.join(' ')).toMatch(/A trend was found over time \(Mann–Kendall p = /);
    // The flood section's own warning about the record (core/workflow) is said once, beside the number.
    expect(a.cautions.filter((x) => /record/.test(x))).toHaveLength(1);
  });

  it('carries the life section\'s own warnings (suspensions beyond the last failure), not those about other models', () => {
    // The wording of core/life/analyze.ts and core/workflow/life.ts; the demo itself raises none of them.
    const own = '8 of 30 units are suspensions: the upper tail is extrapolated beyond the last failure at 2400.';
    const warned = { ...LIFE, life: { ...LIFE.life!, warnings: [own, 'exponential: a warning about another model', 'Every candidate is rejected at α = 0.05: none of these models describes the data well.'] } } as DatasetReport;
    const a = answerFor(warned, 'weibull', 'h')!;
    expect(a.cautions).toContain(own);
    expect(a.cautions.join(' ')).not.toMatch(/another model|Every candidate/);
  });

  it('capability: the Ppk and the ppm in the sentence belong to the same model (the normal-theory Ppk named as such)', () => {
    // The pump-seal-wear demo with its demo settings (server/demo.ts): an upper limit of 120 µm and a
    // natural lower bound of 0. The Ppk under a fitted model is its comparison row's (ISO 22514-2
    // percentile method, core/capability/comparison.ts); the check is that the answer quotes that row.
    const wear = read('pump-seal-wear.csv', ['wear_um']);
    const cap = analyzeDataset({ values: (wear.columns[0] as NumberColumn).values }, { families: ['weibull', 'normal', 'gamma'], usl: 120, naturalLowerBound: 0, seed: 1 }) as DatasetReport;
    const rows = [...(cap.capability?.comparison?.passing ?? []), ...(cap.capability?.comparison?.rejected ?? [])];
    const weibullPpk = rows.find((x) => x.model === 'Weibull')?.indices.find((x) => x.name === 'Ppk')?.estimate;
    const normalPpk = cap.capability?.overall.find((x) => x.name === 'Ppk')?.estimate;
    expect(weibullPpk).toBeDefined();
    expect(Math.abs(weibullPpk! - normalPpk!)).toBeGreaterThan(0.05); // the two differ enough to tell apart at 3 digits
    const w = answerFor(cap, 'weibull', 'µm')!;
    expect(w.sentence.startsWith(`Ppk ${Number(weibullPpk!.toPrecision(3))} under Weibull by its percentiles (ISO 22514-2); `)).toBe(true);
    expect(w.sentence).toMatch(/ppm out of tolerance under Weibull\. Normal theory gives Ppk /);
    const n = answerFor(cap, 'normal', 'µm')!;
    expect(n.sentence.startsWith(`Ppk ${Number(normalPpk!.toPrecision(3))} (lower bound `)).toBe(true);
    expect(n.sentence).toMatch(/under the normal model; .* ppm out of tolerance under Normal\.$/);
  });

  it('every model rejected (shaft-diameter demo): no spread is drawn from rejected models, in the answer or in "what would change it"; the capability table names models and tests in words', () => {
    // Issue 14 item 4: rejected models never enter the spread (the 999,700 ppm exponential gave "463×").
    const shaft = read('shaft-diameter.csv', ['diameter_mm', 'subgroup']);
    const r = analyzeDataset(
      { values: (shaft.columns[0] as NumberColumn).values, subgroups: [...(shaft.columns[1] as NumberColumn).values] },
      { lsl: 24.99, usl: 25.01, target: 25, confidence: 0.9, seed: 1 },
    ) as DatasetReport;
    expect(r.candidates.every((c) => c.rejectedBy.length > 0), 'the demo rejects every model').toBe(true);
    for (const c of r.candidates) expect(answerFor(r, c.family, 'mm')!.cautions.join(' ')).not.toMatch(/runs from|factor of/);
    const c = r.candidates[0]!;
    const blocks = sectionBlocks({ report: r, selected: { ...c, label: modelLabel(c.family) }, units: 'mm' });
    const sens = blocks.find((b) => b.id === 'sensitivity')!;
    expect(sens.lines.map((l) => l.text).join(' ')).not.toMatch(/factor of|across \d+ models/);
    expect(sens.lines[0]!.text).toMatch(/^No model passes every test, so no spread is drawn/);
    const capBlock = blocks.find((b) => b.id === 'capability')!;
    const cells = capBlock.tables.flatMap((t) => t.rows.flat()).join(' | ');
    expect(cells).not.toMatch(/anderson-darling|chi-square, /);
    expect(cells).toMatch(/Anderson–Darling/);
    expect(cells).not.toMatch(/(^| \| )(normal|lognormal|gamma|exponential) \|/);
  });

  it('no decision number asked for: no answer', () => {
    const plain = analyzeDataset({ values: (rv.columns[0] as NumberColumn).values }, { families: ['gumbel'], seed: 1 }) as DatasetReport;
    expect(answerFor(plain, 'gumbel', '')).toBeNull();
  });
});

describe('the section registry', () => {
  it('maps each report section key to one view, in screen order', () => {
    const keys = SECTIONS.map((s) => s.key);
    expect(new Set(keys).size).toBe(keys.length);
    // Trades add their own sections; these keep their order, "what would change the answer" last of them.
    const core = keys.filter((k) => ['life', 'flood', 'capability', 'trend', 'sensitivity'].includes(k));
    expect(core).toEqual(['life', 'flood', 'capability', 'trend', 'sensitivity']);
  });

  it('shows only the sections the report carries; each leads with its answer where it has one', () => {
    const c = FLOOD.candidates[0]!;
    const blocks = sectionBlocks({ report: FLOOD, selected: { ...c, label: modelLabel(c.family) }, units: 'm³/s' });
    expect(blocks.map((b) => b.id)).toEqual(['flood', 'trend', 'sensitivity']);
    expect(blocks[0]!.answer).toMatch(/^200-year level under/);
    expect(blocks[1]!.answer).toBe(FLOOD.trend!.decision);
    // What would change it: a range across the acceptable models, in words.
    const sens = blocks[2]!.lines.map((l) => l.text).join(' ');
    expect(sens).toMatch(/return level T=200: from [\d.]+ \(.+\) to [\d.]+ \(.+\) across 2 models|only .+ gives it/);
  });
});

describe('the answer names the chi-square p that decided the rejection', () => {
  it('below n = 50 the core decides by the parametric bootstrap: "(bootstrap p = X)", not the asymptotic p', () => {
    // The 30 bearing hours read as a plain sample, with a return period asked so that the answer has a number.
    const hours = (read('bearing-life.csv', ['hours']).columns[0] as NumberColumn).values;
    const r = analyzeDataset({ values: hours }, { families: ['weibull', 'exponential'], returnPeriods: [10], seed: 1 }) as DatasetReport;
    const exp = r.candidates.find((c) => c.family === 'exponential')!;
    const chi = exp.chiSquare as unknown as { decidedBy?: string; bootstrap?: { pValue: number } };
    expect(exp.rejectedBy).toContain('chi-square');
    expect(chi.decidedBy).toBe('bootstrap');
    const a = answerFor(r, 'exponential', 'h')!;
    expect(a.cautions[0]).toContain(`chi-square test (bootstrap p = ${pValueText(chi.bootstrap!.pValue)})`);
  });
});

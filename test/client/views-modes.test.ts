/**
 * The failure-modes section (client/src/views/modes.ts), its answer (views/answer-modes.ts through
 * answerFor) and its block in the exported report, from the core's real report on the invented seal
 * demo (datasets/README.md: 32 leaks, 17 cracks, 71 removed). The numbers shown must be the report's
 * (checked against SciPy in test/server/modes.test.ts with test/fixtures/life-modes.json), printed
 * by the one formatter; the answer must never quote a candidate fitted to all failures alike.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyzeDataset, readColumns, readFailureModes, type DatasetReport, type NumberColumn, type TextColumn } from '../../core/index.js';
import { blockHtml } from '../../client/src/views/block.js';
import { answerFor } from '../../client/src/views/answer.js';
import { firstToReach, modesSection } from '../../client/src/views/modes.js';
import { sectionBlocks } from '../../client/src/views/sections.js';
import { sig } from '../../client/src/format.js';
import { readFixture } from '../helpers/fixtures.js';

// Fixture: scripts/fixtures/life-modes.py (SciPy per-mode fits; system quantiles by brentq).
const fx = readFixture('life-modes.json');
const t = readColumns(readFileSync(join(process.cwd(), 'datasets', 'seal-failure-modes.csv'), 'utf8'), [
  { select: 'hours', kind: 'number' },
  { select: 'status', kind: 'text' },
  { select: 'mode', kind: 'text', keepBlank: true },
]);
const status = (t.columns[1] as TextColumn).texts.map(Number);
const modes = readFailureModes((t.columns[2] as TextColumn).texts, status, { row: (i) => i + 2, cell: (i) => `Row ${i + 2}`, column: 'mode' }).modes;
const input = { values: (t.columns[0] as NumberColumn).values, status, modes };
const REPORT = analyzeDataset(input, { bLifePercents: [10, 50], reliabilityTimes: [3000], bootstrapReplicates: 19, seed: 1 }) as DatasetReport;
const PLAIN = analyzeDataset({ values: input.values, status }, { bLifePercents: [10, 50], bootstrapReplicates: 19, seed: 1 }) as DatasetReport;
const block = modesSection({ report: REPORT, selected: undefined, units: 'h' })!;
const m = REPORT.life!.modes!;
/** The whole unit's B-life bounds when the core gives them (a BLife), else none (a point value). */
const ends = (b: { estimate: number }): { lower: number; upper: number } | null => {
  const x = b as { lower?: number; upper?: number };
  return Number.isFinite(x.lower) && Number.isFinite(x.upper) ? { lower: x.lower!, upper: x.upper! } : null;
};
/** The method's short name as the page writes it beside a bound (the core's method text: core/life bounds.ts, competing-modes-bounds.ts). */
const shortName = (b: { method?: string }): string => (/^likelihood ratio/.test(b.method ?? '') ? 'likelihood-ratio ' : /^Fisher matrix/.test(b.method ?? '') ? 'Fisher-matrix ' : '');
const unitWords = (b: { estimate: number; method?: string }): string => {
  const e = ends(b);
  return `${sig(b.estimate)} h (${e ? `90 % ${shortName(b)}bounds ${sig(e.lower)} to ${sig(e.upper)}` : 'point estimate'})`;
};
/** The report with the whole unit's B-lives given bounds (as a core that bounds them reports them). */
const WITH_BOUNDS = {
  ...REPORT,
  life: { ...REPORT.life!, modes: { ...m, system: { ...m.system!, bLives: m.system!.bLives.map((b) => ({ ...b, lower: b.estimate * 0.8, upper: b.estimate * 1.2, confidence: 0.9, method: 'test', boundsFound: true })) } } },
} as unknown as DatasetReport;

describe('the failure-modes section', () => {
  it('is in the registry right after the life section, and absent without a mode column', () => {
    const ids = sectionBlocks({ report: REPORT, selected: undefined, units: 'h' }).map((b) => b.id);
    expect(ids.indexOf('modes')).toBe(ids.indexOf('life') + 1);
    expect(modesSection({ report: PLAIN, selected: undefined, units: 'h' })).toBeNull();
  });

  it('says which mode comes first at each percent: crack at 10 % (3930 vs 4219 h), leak at 50 % (9002 vs 25855 h) — the SciPy fixture orders them the same way', () => {
    const crack = fx.modes.find((x: { mode: string }) => x.mode === 'crack').families;
    const leak = fx.modes.find((x: { mode: string }) => x.mode === 'leak').families;
    expect(crack.exponential.b10).toBeLessThan(leak.lognormal.b10);
    expect(leak.lognormal.b50).toBeLessThan(crack.exponential.b50);
    expect(firstToReach(m, 0)!.first.mode).toBe('crack');
    expect(firstToReach(m, 1)!.first.mode).toBe('leak');
    const text = block.lines.map((l) => l.text).join('\n');
    expect(text).toContain(`At 10 % failed the crack mode comes first: B10 ${sig(m.modes[0]!.bLives[0]!.estimate)} h, against ${sig(m.modes[1]!.bLives[0]!.estimate)} h for leak.`);
    expect(text).toContain('At 50 % failed the leak mode comes first');
  });

  it('tables each mode’s B-lives and the whole unit’s with their bounds, naming the bound method of each row and the level', () => {
    const table = block.tables[0]!;
    expect(table.caption).toMatch(/; 90 % two-sided bounds: per mode by likelihood ratio; for the whole unit by likelihood ratio over every mode's parameters at once$/);
    const crack10 = m.modes[0]!.bLives[0]!;
    expect(table.rows[0]).toEqual(['crack: B10', 'Exponential', '17', sig(crack10.estimate), sig(crack10.lower), sig(crack10.upper)]);
    expect(crack10.method).toMatch(/^likelihood ratio/);
    // the full method texts once, in a note (the cell names the method in two words)
    expect(block.lines.find((l) => /^Bounds on the B-lives, /.test(l.text))!.text).toBe(`Bounds on the B-lives, per mode: ${crack10.method}; whole unit: ${m.system!.bLives[0]!.method}.`);
    const unit = table.rows.find((r) => r[0] === 'whole unit: B10')!;
    const e = ends(m.system!.bLives[0]!);
    expect(e).not.toBeNull();
    expect(unit).toEqual(['whole unit: B10', 'product of the modes', '49', sig(m.system!.bLives[0]!.estimate), sig(e!.lower), sig(e!.upper)]);
    expect(m.system!.bLives[0]!.method).toMatch(/^likelihood ratio \(profile likelihood over every mode’s parameters\)/);
    // The whole unit's B10 is the fixture's (SciPy brentq on the product of the mode reliabilities), to the digits shown.
    expect(unit[3]).toBe(sig(fx.systemBest.b10));
    const rel = block.tables.find((x) => x.caption.startsWith('Reliability at the times'))!;
    expect(rel.rows[0]![0]).toBe('R(3000)');
    expect(rel.rows[0]!.at(-1)).toBe(sig(fx.systemBest.reliabilityAt3000, 4));
  });

  it('prints the whole unit’s bounds when the report carries them, and "no bound" with "point estimates" when it does not', () => {
    const withB = modesSection({ report: WITH_BOUNDS, selected: undefined, units: 'h' })!;
    const b10 = WITH_BOUNDS.life!.modes!.system!.bLives[0]!;
    expect(withB.tables[0]!.rows.find((r) => r[0] === 'whole unit: B10')).toEqual(['whole unit: B10', 'product of the modes', '49', sig(b10.estimate), sig(0.8 * b10.estimate), sig(1.2 * b10.estimate)]);
    expect(withB.tables[0]!.caption).toMatch(/for the whole unit by test over every mode's parameters at once$/);
    expect(withB.answer).toContain(`Whole unit B10: ${sig(b10.estimate)} h (90 % bounds ${sig(0.8 * b10.estimate)} to ${sig(1.2 * b10.estimate)}) from 2 modes`);
    const none = { ...REPORT, life: { ...REPORT.life!, modes: { ...m, system: { ...m.system!, bLives: m.system!.bLives.map((b) => ({ percent: b.percent, estimate: b.estimate })) } } } } as unknown as DatasetReport;
    const noB = modesSection({ report: none, selected: undefined, units: 'h' })!;
    expect(noB.tables[0]!.rows.find((r) => r[0] === 'whole unit: B10')!.slice(4)).toEqual(['no bound', 'no bound']);
    expect(noB.tables[0]!.caption).toMatch(/the whole unit's B-lives are point estimates \(no bound\)$/);
    expect(noB.answer).toMatch(/^Whole unit B10: [\d.]+ h \(point estimate\) from 2 modes/);
  });

  it('carries the modes’ cautions and defers a maintenance or safety decision to its governing practice; draws the reliability chart', () => {
    const cautions = block.lines.filter((l) => l.kind === 'caution').map((l) => l.text);
    expect(cautions).toEqual(expect.arrayContaining([...m.cautions]));
    expect(cautions.some((c) => /governing maintenance and safety practice/.test(c) && /licensed review/.test(c))).toBe(true);
    expect(block.charts).toEqual(['modes-reliability']);
  });

  it('the life section (all failures pooled) says it pools the modes and points to this section; without a mode column it does not', () => {
    const life = sectionBlocks({ report: REPORT, selected: REPORT.candidates[0], units: 'h' }).find((b) => b.id === 'life')!;
    expect(life.lines[0]).toEqual({ kind: 'warning', text: 'Every failure is fitted here as one mode, whatever its cause (crack, leak); the life of the whole unit from each mode\'s own fit is under “Failure modes: which one limits life”.' });
    const plain = sectionBlocks({ report: PLAIN, selected: PLAIN.candidates[0], units: 'h' }).find((b) => b.id === 'life')!;
    expect(plain.lines.some((l) => /one mode/.test(l.text))).toBe(false);
  });

  it('is printed in the exported report (escaped HTML with the same rows)', () => {
    const html = blockHtml(block, () => '<svg></svg>');
    expect(html).toContain('data-block="modes"');
    expect(html).toContain('Failure modes: which one limits life');
    expect(html).toContain(`<th>whole unit: B10</th><td class="num">product of the modes</td>`);
    expect(html).toContain('<figure><svg></svg></figure>');
  });
});

describe('the answer with a failure-mode column', () => {
  it('states the whole unit’s B10 with each mode’s B10 under its own model and bounds, and the limiting mode', () => {
    const a = answerFor(REPORT, null, 'h')!;
    const [crack, leak] = m.modes;
    const b = (x: typeof crack) => x!.bLives[0]!;
    expect(a.sentence).toBe(
      `B10 life of the whole unit, the 2 failure modes together: ${unitWords(m.system!.bLives[0]!)}, from crack ${sig(b(crack).estimate)} h (Exponential; 90 % likelihood-ratio bounds ${sig(b(crack).lower)} to ${sig(b(crack).upper)}); leak ${sig(b(leak).estimate)} h (Lognormal; 90 % likelihood-ratio bounds ${sig(b(leak).lower)} to ${sig(b(leak).upper)}). The crack mode limits life at 10 % failed.`,
    );
    expect(a.cautions).toEqual(expect.arrayContaining([...m.cautions]));
  });

  it('with the whole unit’s bounds in the report, the answer quotes them', () => {
    const b10 = WITH_BOUNDS.life!.modes!.system!.bLives[0]!;
    expect(answerFor(WITH_BOUNDS, null, 'h')!.sentence).toMatch(new RegExp(`^B10 life of the whole unit, the 2 failure modes together: ${sig(b10.estimate)} h \\(90 % bounds ${sig(0.8 * b10.estimate)} to ${sig(1.2 * b10.estimate)}\\), from crack `));
  });

  it('never quotes a number of the models fitted to all failures alike, whichever is selected', () => {
    for (const c of REPORT.candidates) {
      const a = answerFor(REPORT, c.family, 'h')!;
      for (const b of c.bLives ?? []) expect(a.sentence).not.toContain(sig(b.estimate));
    }
    // Without the mode column the same data get the pooled answer.
    expect(answerFor(PLAIN, 'weibull', 'h')!.sentence).toMatch(/^B10 life under Weibull/);
  });

  it('when a mode could not be fitted there is no whole-unit number, and it says which mode', () => {
    const broken = { ...REPORT, life: { ...REPORT.life!, modes: { ...m, system: null, modes: m.modes.map((x, i) => (i === 0 ? { ...x, family: null, parameters: null, bLives: [], reliability: [] } : x)) } } } as unknown as DatasetReport;
    const a = answerFor(broken, null, 'h')!;
    expect(a.sentence).toBe('No life for the whole unit: a failure mode could not be fitted (crack); see “Failure modes”.');
    expect(a.undermined).toBe(true);
    const blk = modesSection({ report: broken, selected: undefined, units: 'h' })!;
    expect(blk.charts).toEqual([]);
    expect(blk.tables[0]!.rows.some((r) => r[0] === 'crack' && r[1] === 'not fitted')).toBe(true);
  });
});

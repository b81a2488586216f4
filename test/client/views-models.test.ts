// @vitest-environment jsdom
/**
 * The model choices (client/src/views/models.ts), the test-number rows (views/ranking-table.ts), the
 * glossary (views/glossary.ts) and a block's links to it (views/block.ts), rendered with jsdom from a
 * real report of the core on the bearing demo (datasets/README.md: invented).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyzeDataset, pValueText, readColumns, type NumberColumn } from '../../core/index.js';
import { candidateCells, chiSquareDecidingP } from '../../client/src/candidate-cells.js';
import { sig } from '../../client/src/format.js';
import type { AnalyzeResponse } from '../../client/src/api.js';
import { modelChoices, modelSentence } from '../../client/src/views/models.js';
import { rankingRows } from '../../client/src/views/ranking-table.js';
import { GLOSSARY, glossaryNode } from '../../client/src/views/glossary.js';
import { blockNode } from '../../client/src/views/block.js';

const t = readColumns(readFileSync(join(process.cwd(), 'datasets', 'bearing-life.csv'), 'utf8'), [{ select: 'hours', kind: 'number' }]);
const REPORT = analyzeDataset({ values: (t.columns[0] as NumberColumn).values }, { families: ['normal', 'weibull', 'exponential', 'lognormal3'], seed: 1 }) as unknown as AnalyzeResponse;

describe('which models can you design on', () => {
  const node = modelChoices(REPORT, REPORT.candidates[0]!.family);
  const buttons = [...node.querySelectorAll<HTMLButtonElement>('button.model-pick')];

  it('one choice per fitted model, the selected one pressed, no pass/fail chips', () => {
    expect(buttons.map((b) => b.dataset['family']).sort()).toEqual(REPORT.candidates.map((c) => c.family).sort());
    expect(buttons.filter((b) => b.getAttribute('aria-pressed') === 'true').map((b) => b.dataset['family'])).toEqual([REPORT.candidates[0]!.family]);
    expect(node.textContent).not.toMatch(/[✓✗]/);
  });

  it('sorts models into those no test rejects and those rejected, in words', () => {
    const usable = [...node.querySelectorAll<HTMLButtonElement>('[data-group="usable"] button')].map((b) => b.dataset['family']);
    const rejected = [...node.querySelectorAll<HTMLButtonElement>('[data-group="rejected"] button')].map((b) => b.dataset['family']);
    expect(usable).toEqual(REPORT.candidates.filter((c) => c.rejectedBy.length === 0).map((c) => c.family));
    expect(rejected).toEqual(REPORT.candidates.filter((c) => c.rejectedBy.length > 0).map((c) => c.family));
    for (const c of REPORT.candidates.filter((x) => x.rejectedBy.length > 0)) expect(modelSentence(c, 0.05, false)).toMatch(/^Rejected by the (chi-square|Anderson–Darling) test/);
  });

  it('says how much less a passing model is supported than the best (Burnham & Anderson 2002: Δ up to about 2 is substantial support)', () => {
    const c = { ...REPORT.candidates[0]!, rejectedBy: [], deltaAicc: 1.5, fit: { ...REPORT.candidates[0]!.fit, converged: true } };
    expect(modelSentence(c, 0.05, false)).toMatch(/about as well supported as the best/);
    expect(modelSentence({ ...c, deltaAicc: 12 }, 0.05, false)).toMatch(/much less supported/);
  });

  it('lists the models not fitted with their reason', () => {
    const na = REPORT.notApplicable;
    if (na.length === 0) return;
    expect(node.querySelector('#not-applicable')?.textContent).toContain(na[0]!.reason);
  });

  it('the test numbers: one row per model, the selected row marked, no verdict chips', () => {
    const rows = rankingRows(REPORT, REPORT.candidates[1]!.family);
    expect(rows).toHaveLength(REPORT.candidates.length);
    expect(rows[1]!.querySelector('tr.cand-main')?.getAttribute('aria-selected')).toBe('true');
    expect(rows[0]!.querySelectorAll('.verdict')).toHaveLength(0);
  });
});

describe('glossary', () => {
  it('every entry has a unique id that headers link to', () => {
    const dl = glossaryNode();
    const ids = [...dl.querySelectorAll('dt')].map((d) => d.id);
    expect(new Set(ids).size).toBe(GLOSSARY.length);
    for (const key of ['lnl', 'aicc', 'dof', 'cl', 'ad', 'xi', 'cpm', 'band', 'bounds']) expect(ids).toContain(`g-${key}`);
  });

  it('index.html links each table header to an entry that exists', () => {
    const html = readFileSync(join(process.cwd(), 'client', 'index.html'), 'utf8');
    const links = [...html.matchAll(/href="#g-([a-z]+)"/g)].map((m) => m[1]);
    expect(links.length).toBeGreaterThan(5);
    for (const k of links) expect(GLOSSARY.some((g) => g.key === k), k).toBe(true);
  });

  it('a block links the symbols it uses', () => {
    const sec = blockNode({ id: 'flood', title: 'T', lead: 'L', lines: [], tables: [], charts: [], terms: ['xi', 'return', 'nonexistent'] }, () => document.createElement('div'));
    expect([...sec.querySelectorAll('a.term')].map((a) => a.getAttribute('href'))).toEqual(['#g-xi', '#g-return']);
  });
});

describe('the chi-square p that decides: the parametric bootstrap below n = 50 (core decidedBy)', () => {
  // Bearing demo, n = 30: the core decides the normal's and the exponential's chi-square by bootstrap
  // (B = 999, seed 1); the asymptotic pair (dof k − 1 − m and k − 1) stands beside it.
  type Chi = { pValue: number; pValueUpper: number; decidedBy?: string; bootstrap?: { pValue: number; monteCarloStandardError: number } };
  const chiOf = (c: AnalyzeResponse['candidates'][number]): Chi => c.chiSquare as unknown as Chi;
  const boot = REPORT.candidates.filter((c) => c.chiSquare.computable && chiOf(c).decidedBy === 'bootstrap');

  it('the test-number row leads with "bootstrap p = X" and keeps the asymptotic pair beside it', () => {
    expect(boot.map((c) => c.family)).toContain('normal');
    const normal = boot.find((c) => c.family === 'normal')!;
    const chi = chiOf(normal);
    const cells = candidateCells(normal);
    expect(cells.chiPMain).toBe(`bootstrap p = ${pValueText(chi.bootstrap!.pValue)}`);
    expect(cells.chiPBracket).toBe(`asymptotic ${pValueText(chi.pValue)} [${pValueText(chi.pValueUpper)}]; bootstrap ± ${sig(chi.bootstrap!.monteCarloStandardError, 2)}, B = 999`);
    const row = rankingRows(REPORT, null).find((r) => r.dataset['family'] === 'normal')!;
    expect(row.textContent).toContain(`bootstrap p = ${pValueText(chi.bootstrap!.pValue)}asymptotic ${pValueText(chi.pValue)} [`);
  });

  it('the model choices and the answer name the bootstrap p as the deciding one', () => {
    const normal = boot.find((c) => c.family === 'normal')!;
    const chi = chiOf(normal);
    const text = modelChoices(REPORT, null).querySelector('button[data-family="normal"]')!.textContent ?? '';
    expect(text).toContain(`χ² bootstrap p = ${pValueText(chi.bootstrap!.pValue)} (asymptotic ${pValueText(chi.pValue)} to ${pValueText(chi.pValueUpper)})`);
    expect(chiSquareDecidingP(normal.chiSquare)).toBe(`bootstrap p = ${pValueText(chi.bootstrap!.pValue)}`);
  });

  it('where the asymptotic reference decides, no bootstrap p is shown', () => {
    const normal = boot.find((c) => c.family === 'normal')!;
    const asym = { ...normal, chiSquare: { ...normal.chiSquare, decidedBy: 'asymptotic' as const } } as typeof normal;
    const cells = candidateCells(asym);
    expect(cells.chiPMain).not.toMatch(/bootstrap/);
    expect(cells.chiPBracket).toMatch(/^\[.+\]$/);
    const report = { ...REPORT, candidates: REPORT.candidates.map((c) => (c.family === 'normal' ? asym : c)) } as AnalyzeResponse;
    expect(modelChoices(report, null).querySelector('button[data-family="normal"]')!.textContent).toMatch(/χ² p = [^(]+ to /);
  });
});

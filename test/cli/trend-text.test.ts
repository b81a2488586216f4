/**
 * The trend check prints its p-value once, through the one formatter (core/format formatPValue),
 * in the CLI text and on the page: before, the CLI line gave "p = 0.637" and then the core's
 * sentence "p = 0.6369" for the same test. Common practice, no source (one number, one rendering).
 * The series is invented: a drift of +0.2 a year on a seeded-looking fixed pattern.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { analyzeDataset, formatPValue, hamedRaoMannKendall } from '../../core/index.js';
import { workflowSections } from '../../cli/workflow-text.js';
import { trendSection } from '../../client/src/views/trend.js';

const years = Array.from({ length: 30 }, (_, i) => 1990 + i);
const values = years.map((y, i) => 100 + 0.2 * (y - 1990) + ((i * 37) % 11) - 5);

describe('trend text', () => {
  const report = analyzeDataset({ values, order: years }, { families: ['normal'], seed: 1 });
  const t = report.trend!;
  const text = workflowSections(report).join('\n');
  const block = text.slice(text.indexOf('Trend check'));

  it('the CLI prints the p-value once, as formatPValue writes it', () => {
    expect(t).toBeDefined();
    const ps = block.replace(/\s+/g, ' ').match(/\bp [=<>] [^\s);,]+/g) ?? [];
    expect(ps).toEqual([formatPValue(t.pValue)]);
    // The same test's S appears once too.
    expect(block.match(/S = -?\d+/g)).toHaveLength(1);
  });

  it('the core sentence (read by the page as the answer) and the page table give the same digits', () => {
    expect(t.decision).toContain(formatPValue(t.pValue));
    const view = trendSection({ report } as Parameters<typeof trendSection>[0]);
    const cell = view?.tables?.[0]?.rows[0]?.[3] ?? '';
    expect(`p = ${cell.split(' (')[0]}`).toBe(formatPValue(t.pValue));
  });

  it('the Hamed–Rao sentence uses the same formatter (the autocorrelated series of test/fixtures/hamed-rao.json)', () => {
    const fix = JSON.parse(readFileSync(new URL('../fixtures/hamed-rao.json', import.meta.url), 'utf8')) as { cases: { values: number[] }[] };
    const r = hamedRaoMannKendall(fix.cases[0]!.values);
    expect(r.decisionUses).toBe('hamed-rao');
    expect(r.decision).toContain(`(${formatPValue(r.corrected!.pValue)}; plain test ${formatPValue(r.plain.pValue)})`);
  });
});

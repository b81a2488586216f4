/**
 * Peaks over a threshold through the one pipeline (server/validate.ts parseAnalyzeBody →
 * server/analysis.ts planRequest/finishRequest → core/workflow route 'pot' → flood-pot.ts): a
 * dated CSV (date column + value column) gives `report.pot`, which must equal what the CLI
 * (cli/flood-pot.ts runFloodPotJson) gives on the same file and settings; the numbers are those of
 * SciPy `genpareto` on the invented seeded daily series of test/fixtures/flood-pot.json
 * (scripts/fixtures/flood-pot.py); the option table's rules reach the API as 400s naming the field.
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseArgs, type AnalyzeArgs } from '../../cli/args.js';
import { runFloodPotJson } from '../../cli/flood-pot.js';
import { analyzeDataset, isoDayNumber, type DatasetReport, type InputSummary } from '../../core/index.js';
import { finishRequest, planRequest } from '../../server/analysis.js';
import { parseAnalyzeBody } from '../../server/validate.js';

const FIX = JSON.parse(readFileSync(new URL('../fixtures/flood-pot.json', import.meta.url), 'utf8')) as {
  values: number[];
  clusters: number;
  rate: number;
  tight: { shape: number; scale: number; logLikelihood: number };
  returnLevels: Record<string, number>;
  profile100: { lower: number; upper: number };
};
const day0 = Date.UTC(2001, 0, 1);
const CSV = `date,flow\n${FIX.values.map((v, i) => `${new Date(day0 + i * 86_400_000).toISOString().slice(0, 10)},${v}`).join('\n')}\n`;
const dir = mkdtempSync(join(tmpdir(), 'plumbline-pot-api-'));
const file = join(dir, 'daily.csv');
writeFileSync(file, CSV);

function analyze(body: Record<string, unknown>) {
  const planned = planRequest(parseAnalyzeBody(body));
  if (planned.plan.kind !== 'done') throw new Error('a dated series is analysed at planning');
  return finishRequest(planned, []) as DatasetReport & { readonly input: InputSummary; readonly evidence?: unknown };
}

function status(body: Record<string, unknown>): { status: number; field?: string; message: string } {
  try {
    analyze(body);
    return { status: 200, message: '' };
  } catch (e) {
    const x = e as { status?: number; field?: string; message: string; code?: string };
    return { status: x.status ?? (x.code ? 400 : 500), ...(x.field !== undefined ? { field: x.field } : {}), message: x.message };
  }
}

const rel = (a: number, b: number): number => Math.abs(a / b - 1);

describe('peaks over a threshold through the API', () => {
  const r = analyze({ csv: CSV, column: 'flow', dateColumn: 'date', threshold: 25, minSeparation: 3, returnPeriods: [10, 50, 100], confidence: 0.95, evidence: true });
  const pot = r.pot!;

  it('equals the CLI on the same file and settings (cli/flood-pot.ts runFloodPotJson)', () => {
    const a = parseArgs(['analyze', file, '--threshold', '25', '--min-separation', '3', '--date-column', 'date', '--column', 'flow', '--return-periods', '10,50,100', '--confidence', '0.95']) as AnalyzeArgs;
    const { dataKind: _k, input: _i, ...cli } = runFloodPotJson(a);
    expect(JSON.parse(JSON.stringify(pot))).toEqual(JSON.parse(JSON.stringify(cli)));
    // and the core's analyzeDataset on the arrays gives the same section
    const direct = analyzeDataset({ values: FIX.values, dates: FIX.values.map((_, i) => i) }, { threshold: 25, minSeparation: 3, returnPeriods: [10, 50, 100], confidence: 0.95 });
    expect(JSON.parse(JSON.stringify(direct.pot!.candidates))).toEqual(JSON.parse(JSON.stringify(pot.candidates)));
  });

  it('SciPy genpareto: clusters, rate, the ML fit (1e-6), return levels (1e-6), the 95 % profile interval of z_100 (1e-5)', () => {
    expect(pot.clusters).toBe(FIX.clusters);
    expect(pot.ratePerYear).toBeCloseTo(FIX.rate, 12);
    const ml = pot.candidates[0]!;
    expect(ml.estimation).toBe('ml');
    expect(rel(ml.parameters.scale, FIX.tight.scale)).toBeLessThan(1e-6);
    expect(Math.abs(ml.parameters.shape - FIX.tight.shape)).toBeLessThan(1e-6);
    expect(rel(ml.logLikelihood as number, FIX.tight.logLikelihood)).toBeLessThan(1e-9);
    for (const l of ml.returnLevels) expect(rel(l.estimate, FIX.returnLevels[String(l.period)] as number)).toBeLessThan(1e-6);
    const z100 = ml.returnLevels.find((l) => l.period === 100)!;
    expect(rel(z100.lower as number, FIX.profile100.lower)).toBeLessThan(1e-5);
    expect(rel(z100.upper as number, FIX.profile100.upper)).toBeLessThan(1e-5);
  });

  it('both estimators: L-moments beside ML, no likelihood and no interval for it; diagnostics; cautions defer to governing guidance', () => {
    const lm = pot.candidates[1]!;
    expect(lm.estimation).toBe('lmoments');
    expect(lm.logLikelihood).toBeNull();
    expect(lm.returnLevels.every((l) => l.lower === null && l.upper === null)).toBe(true);
    expect(pot.diagnostics.length).toBe(15);
    expect(pot.cautions.some((c) => /licensed engineer/.test(c))).toBe(true);
  });

  it('the frame: no ranked candidates, no evidence (the values are not what is modelled), the date column named in input', () => {
    expect(r.dataKind).toBe('complete');
    expect(r.candidates).toEqual([]);
    expect(r.evidence).toBeUndefined();
    expect(r.n).toBe(FIX.values.length);
    expect(r.input).toMatchObject({ source: 'csv', column: 'flow', otherColumns: [{ role: 'date', column: 'date' }] });
    expect(r.flood).toBeUndefined();
  });

  it('estimation lmoments puts the L-moment fit first', () => {
    const x = analyze({ csv: CSV, column: 'flow', dateColumn: 'date', threshold: 25, estimation: 'lmoments' });
    expect(x.pot!.candidates.map((c) => c.estimation)).toEqual(['lmoments', 'ml']);
  });

  it('refuses what the option table refuses, naming the field', () => {
    expect(status({ csv: CSV, column: 'flow', threshold: 25 })).toMatchObject({ status: 400, field: 'threshold' });
    expect(status({ csv: CSV, column: 'flow', dateColumn: 'date' })).toMatchObject({ status: 400, field: 'dateColumn' });
    expect(status({ values: [1, 2, 3], threshold: 2, dateColumn: 'date' }).status).toBe(400);
    expect(status({ csv: CSV, column: 'flow', dateColumn: 'date', threshold: 25, usl: 3 })).toMatchObject({ status: 400 });
    expect(status({ csv: CSV, column: 'flow', dateColumn: 'date', threshold: 25, estimation: 'ema' }).message).toMatch(/ml or lmoments/);
    expect(status({ csv: CSV, column: 'flow', dateColumn: 'flow', threshold: 25 }).message).toMatch(/requested twice/);
    // a threshold with so few events is refused with what to do
    expect(status({ csv: CSV, column: 'flow', dateColumn: 'date', threshold: 1e6 }).message).toMatch(/lower the threshold/);
  });

  it('dates: YYYY-MM-DD calendar dates only; the bad row is named', () => {
    expect(isoDayNumber('1970-01-02')).toBe(1);
    expect(isoDayNumber('2024-02-29T06:00')).toBe(Date.UTC(2024, 1, 29) / 86_400_000);
    expect(isoDayNumber('2023-02-29')).toBeNull();
    expect(isoDayNumber('03/04/2023')).toBeNull();
    const bad = CSV.replace('2001-01-05', '2001-02-30');
    expect(status({ csv: bad, column: 'flow', dateColumn: 'date', threshold: 25 }).message).toMatch(/Row 6, column "date".*2001-02-30/);
  });

  it('the core refuses a threshold without dates', () => {
    expect(() => analyzeDataset({ values: FIX.values }, { threshold: 25 })).toThrow(/date column/);
  });
});

describe('work limit of a dated series', () => {
  it(`more than POT_MAX_VALUES values (200 000, ~550 years of daily values) are refused before any work, with a message asking for daily maxima`, async () => {
    const { POT_MAX_VALUES, potSection } = await import('../../core/workflow/flood-pot.js');
    expect(POT_MAX_VALUES).toBe(200_000);
    const n = POT_MAX_VALUES + 1;
    const days = Float64Array.from({ length: n }, (_, i) => i);
    const values = Float64Array.from({ length: n }, (_, i) => 50 + (i % 97));
    const t0 = process.cpuUsage();
    expect(() => potSection(days, values, { threshold: 120, confidence: 0.9 })).toThrow(/at most 200000 values .*this one has 200001\. Reduce it to one value a day/);
    const used = process.cpuUsage(t0);
    expect((used.user + used.system) / 1e6).toBeLessThan(0.2);
  });
});

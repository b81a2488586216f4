/**
 * Several failure modes through the API (modeColumn beside the times and the status column): the
 * report's life.modes is the object the CLI's --mode-column prints in life.modes (same numbers), the
 * fits agree with SciPy (test/fixtures/life-modes.json, scripts/fixtures/life-modes.py), and bad
 * mode cells are refused or noted naming the row, the column and the cell.
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { parseArgs, type AnalyzeArgs } from '../../cli/args.js';
import { runRecordedLife } from '../../cli/life-recorded.js';
import { readFailureModes } from '../../core/index.js';
import { DEMO_SETTINGS } from '../../server/demo.js';
import { checkDatasetSize, REQUEST_LIMITS } from '../../server/limits.js';
import { readFixture } from '../helpers/fixtures.js';
import { testApp } from './helpers.js';

const { app, logged } = testApp();
afterAll(async () => {
  await app.shutdown();
  expect(logged).toEqual([]);
});

const path = new URL('../../datasets/seal-failure-modes.csv', import.meta.url);
const seal = readFileSync(path, 'utf8');
// Fixture: scripts/fixtures/life-modes.py (SciPy CensoredData fits per mode, refined by brentq / Newton; system quantiles by brentq).
const fx = readFixture('life-modes.json');

const body = { csv: seal, column: 'hours', statusColumn: 'status', modeColumn: 'mode', bLifePercents: [10, 50], confidence: 0.9, replicates: 19 };

function cliJson(...extra: string[]): { life: { modes: unknown } } {
  const args = parseArgs(['analyze', path.pathname, '--column', 'hours', '--censor-column', 'status', '--mode-column', 'mode', '--b-life', '10,50', '--confidence', '0.9', ...extra, '--json']) as AnalyzeArgs;
  let out = '';
  expect(runRecordedLife(args, { out: (s) => (out += s) })).toBe(0);
  return JSON.parse(out);
}

/** Relative difference. */
const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);

interface ModeJson {
  mode: string;
  failures: number;
  suspensions: number;
  family: string;
  parameters: Record<string, number>;
  candidates: { family: string; parameters: Record<string, number>; logLikelihood: number }[];
  bLives: { percent: number; estimate: number; lower: number; upper: number }[];
}

describe('failure modes through the API', () => {
  it('the seal demo: life.modes equals the CLI --mode-column JSON (life.modes), key for key', async () => {
    const res = await request(app).post('/api/analyze').send(body);
    expect(res.status).toBe(200);
    expect(res.body.dataKind).toBe('censored');
    expect(res.body.input.otherColumns).toEqual([
      { role: 'status', column: 'status' },
      { role: 'failure mode', column: 'mode' },
    ]);
    expect(res.body.life.modes).toEqual(JSON.parse(JSON.stringify(cliJson().life.modes)));
    // The counts of datasets/README.md: 32 leaks, 17 cracks, 71 removed.
    expect(res.body.life.modes.modes.map((m: ModeJson) => [m.mode, m.failures, m.suspensions])).toEqual([
      ['crack', 17, 103],
      ['leak', 32, 88],
    ]);
  });

  it('the demo opens analysed by modes: its settings (server/demo.ts) give life.modes with both modes and the system', async () => {
    const d = DEMO_SETTINGS['seal-failure-modes']!;
    expect(d.fields).toEqual({ statusColumn: 'status', modeColumn: 'mode', bLifePercents: [10, 50], confidence: 0.9 });
    const res = await request(app).post('/api/analyze').send({ csv: seal, column: d.column, ...d.fields, replicates: 19 });
    expect(res.status).toBe(200);
    expect(res.body.life.modes.modes.map((m: ModeJson) => m.mode)).toEqual(['crack', 'leak']);
    expect(rel(res.body.life.modes.system.bLives[0].estimate, fx.systemBest.b10)).toBeLessThan(1e-7);
  });

  it('per-mode fits with the other modes as suspensions equal SciPy CensoredData refined tightly (parameters 1e-8, ln L 1e-9 relative), and so do the B-lives and the system (1e-7)', async () => {
    const res = await request(app).post('/api/analyze').send({ ...body, families: ['weibull', 'lognormal', 'exponential'], reliabilityTimes: [3000] });
    expect(res.status).toBe(200);
    const modes: ModeJson[] = res.body.life.modes.modes;
    for (const ref of fx.modes) {
      const m = modes.find((x) => x.mode === ref.mode)!;
      expect(m.failures).toBe(ref.failures);
      expect(m.suspensions).toBe(ref.suspensions);
      for (const [family, r] of Object.entries(ref.families) as [string, { parameters: Record<string, number>; logLikelihood: number; b10: number; b50: number }][]) {
        const c = m.candidates.find((x) => x.family === family)!;
        // Our solver stops at relative 1e-10 on the likelihood equation; the fixture's root is solved to 1e-13 or better (DEVELOPERS.md tolerance policy: ≤ 1e-8).
        for (const [k, v] of Object.entries(r.parameters)) expect(rel(c.parameters[k]!, v)).toBeLessThan(1e-8);
        expect(Math.abs(c.logLikelihood - r.logLikelihood)).toBeLessThan(1e-9 * Math.abs(r.logLikelihood));
      }
      // The family used for the mode is the one the fixture finds best by AICc (n = 120 units), and its B-lives are SciPy's quantiles there.
      expect(m.family).toBe(fx.bestByAicc[ref.mode]);
      const best = ref.families[m.family];
      expect(rel(m.bLives[0]!.estimate, best.b10)).toBeLessThan(1e-7);
      expect(rel(m.bLives[1]!.estimate, best.b50)).toBeLessThan(1e-7);
      for (const b of m.bLives) expect(b.lower < b.estimate && b.estimate < b.upper).toBe(true);
    }
    const sys = res.body.life.modes.system;
    expect(rel(sys.bLives[0].estimate, fx.systemBest.b10)).toBeLessThan(1e-7);
    expect(rel(sys.bLives[1].estimate, fx.systemBest.b50)).toBeLessThan(1e-7);
    expect(rel(sys.reliability[0].estimate, fx.systemBest.reliabilityAt3000)).toBeLessThan(1e-7);
  });

  it('every mode Weibull (families: weibull): the system B10/B50 equal SciPy weibull_min with brentq', async () => {
    const res = await request(app).post('/api/analyze').send({ ...body, families: ['weibull'] });
    expect(res.status).toBe(200);
    const sys = res.body.life.modes.system;
    expect(rel(sys.bLives[0].estimate, fx.systemAllWeibull.b10)).toBeLessThan(1e-7);
    expect(rel(sys.bLives[1].estimate, fx.systemAllWeibull.b50)).toBeLessThan(1e-7);
  });

  it('a failed unit without a mode is a 400 naming the file row, the column and the empty cell', async () => {
    const lines = seal.split('\n');
    // Row 3 of the file (S002) failed by crack: blank its mode.
    expect(lines[2]).toBe('S002,5707,1,crack');
    lines[2] = 'S002,5707,1,';
    const res = await request(app).post('/api/analyze').send({ ...body, csv: lines.join('\n') });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/^Row 3, column "mode": the unit failed \(status 1\) but its failure mode is empty/);
    expect(res.body.error.place).toEqual({ row: 3, column: 'mode', value: '' });
  });

  it('a mode on a unit that did not fail, and a mode with no failure, are notes in input.warnings naming the rows', async () => {
    const lines = seal.split('\n');
    expect(lines[1]).toBe('S001,4409,0,');
    lines[1] = 'S001,4409,0,leak';
    lines[3] = lines[3]!.replace(/,0,$/, ',0,seize');
    expect(lines[3]).toBe('S003,3198,0,seize');
    const res = await request(app).post('/api/analyze').send({ ...body, csv: lines.join('\n') });
    expect(res.status).toBe(200);
    const w: string[] = res.body.input.warnings;
    expect(w).toContain('Column "mode": 2 units that did not fail (status 0) carry a mode: Row 2 ("leak"), Row 4 ("seize"). A unit that did not fail counts as a suspension for every mode, so its mode is not used.');
    expect(w).toContain('Mode "seize" (column "mode") has no failed unit, only 1 that did not fail: it has nothing to fit and is left out of the modes.');
    // Nothing changes in the numbers: those units were suspensions for every mode already.
    const plain = await request(app).post('/api/analyze').send(body);
    expect(res.body.life.modes).toEqual(plain.body.life.modes);
  });

  it('modeColumn without a status column, with "values", or naming a column the file lacks is a 400', async () => {
    const noStatus = await request(app).post('/api/analyze').send({ csv: seal, column: 'hours', modeColumn: 'mode' });
    expect(noStatus.status).toBe(400);
    expect(noStatus.body.error.field).toBe('modeColumn');
    expect(noStatus.body.error.message).toMatch(/"modeColumn" needs "statusColumn"/);
    const values = await request(app).post('/api/analyze').send({ values: [1, 2, 3], status: [1, 0, 1], modeColumn: 'mode' });
    expect(values.status).toBe(400);
    expect(values.body.error.field).toBe('modeColumn');
    const missing = await request(app).post('/api/analyze').send({ ...body, modeColumn: 'nope' });
    expect(missing.status).toBe(400);
    expect(missing.body.error.message).toMatch(/nope/);
  });
});

describe('the work of failure modes is bounded (server/limits.ts)', () => {
  // Invented labels and times; the limits are the server's choice (common practice, no source).
  const data = (modes: number, units: number) => ({
    values: Array.from({ length: units }, (_, i) => 100 + i),
    status: Array.from({ length: units }, (_, i) => (i < 2 * modes ? 1 : 0)),
    modes: Array.from({ length: units }, (_, i) => (i < 2 * modes ? `m${i % modes}` : null)),
  });
  it('at most 20 distinct modes, modes³ × units at most 600,000 and modes × units × families at most 2,000,000: the boundaries exactly', () => {
    expect(REQUEST_LIMITS.failureModes).toBe(20);
    expect(() => checkDatasetSize(data(20, 75), { families: ['exponential'] })).not.toThrow(); // 8000 × 75 = 600,000
    expect(() => checkDatasetSize(data(21, 75), { families: ['exponential'] })).toThrow(/^Too many failure modes: 21 different labels in the failure-mode column; the server fits at most 20/);
    expect(() => checkDatasetSize(data(20, 76), { families: ['exponential'] })).toThrow(/^The failure modes asked for are too much work: the bounds of the whole unit's B-lives cost modes³ × units = 608,000; the server's limit is 600,000\. With 20 modes send at most 75 units/);
    // Two modes: the system bound allows 75,000 units; five families then pass 2,000,000 fits first.
    expect(() => checkDatasetSize(data(2, 75_000), { bootstrapReplicates: 1 })).not.toThrow(); // 8 × 75,000 = 600,000; 2 × 75,000 × 5 = 750,000
    expect(() => checkDatasetSize(data(2, 75_001), { bootstrapReplicates: 1 })).toThrow(/modes³ × units = 600,008;/);
    expect(() => checkDatasetSize(data(1, 400_001), { bootstrapReplicates: 1 })).toThrow(/^The failure modes asked for are too much work: modes × units × families = 2,000,005; the server's limit is 2,000,000/);
    expect(() => checkDatasetSize(data(1, 400_000), { bootstrapReplicates: 1 })).not.toThrow();
  });
  it('through the API: a 422 naming modeColumn before any fit', async () => {
    const rows = ['t,status,mode', ...Array.from({ length: 42 }, (_, i) => `${100 + i},1,m${i % 21}`)];
    const many = await request(app).post('/api/analyze').send({ csv: rows.join('\n'), column: 't', statusColumn: 'status', modeColumn: 'mode' });
    expect(many.status).toBe(422);
    expect(many.body.error).toMatchObject({ field: 'modeColumn', code: 'too-much-work' });
  });
});

describe('failure modes on interval rows through the API', () => {
  // Fixture: scripts/fixtures/life-modes-interval.py (another engineer's: invented seeded inspection rows with modes A and B, SciPy fits per mode refined by mpmath).
  const fi = readFixture('life-modes-interval.json');
  const rows: { start: number; end: number | null; mode: string | null; count: number }[] = fi.rows;
  const lines = ['start,end,units,mode', ...rows.map((r) => `${r.start === 0 ? '' : r.start},${r.end === null ? '' : r.end},${r.count},${r.mode ?? ''}`)];
  const csvText = `${lines.join('\n')}\n`;
  const ivBody = { csv: csvText, intervalColumns: ['start', 'end'], countColumn: 'units', modeColumn: 'mode', families: ['weibull'], bLifePercents: [10], reliabilityTimes: [50, 100], replicates: 19 };

  it('life.modes equals the CLI --interval-columns --mode-column JSON key for key, and the SciPy reference (1e-6)', async () => {
    const res = await request(app).post('/api/analyze').send(ivBody);
    expect(res.status, JSON.stringify(res.body.error ?? null)).toBe(200);
    expect(res.body.input.otherColumns).toEqual([
      { role: 'interval end', column: 'end' },
      { role: 'count', column: 'units' },
      { role: 'failure mode', column: 'mode' },
    ]);
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-modes-'));
    const file = join(dir, 'inspections.csv');
    writeFileSync(file, csvText);
    const args = parseArgs(['analyze', file, '--interval-columns', 'start,end', '--count-column', 'units', '--mode-column', 'mode', '--families', 'weibull', '--b-life', '10', '--reliability-at', '50,100', '--json']) as AnalyzeArgs;
    let out = '';
    expect(runRecordedLife(args, { out: (x) => (out += x) })).toBe(0);
    expect(res.body.life.modes).toEqual(JSON.parse(out).life.modes);
    const m = res.body.life.modes;
    for (const name of ['A', 'B']) {
      const got = m.modes.find((x: ModeJson) => x.mode === name) as ModeJson;
      const ref = fi.modes[name];
      expect(got.failures).toBe(ref.failures);
      expect(rel(got.parameters.shape!, ref.parameters.shape)).toBeLessThan(1e-6);
      expect(rel(got.parameters.scale!, ref.parameters.scale)).toBeLessThan(1e-6);
      expect(rel(got.bLives[0]!.estimate, ref.b10)).toBeLessThan(1e-6);
    }
    expect(rel(m.system.bLives[0].estimate, fi.system.b10)).toBeLessThan(1e-6);
    expect(rel(m.system.reliability[1].estimate, fi.system.reliabilityAt100)).toBeLessThan(1e-6);
  });

  it('a failed interval row without a mode is a 400 naming its row; a mode on a running row is a note', async () => {
    const bad = csvText.replace(/\n25,50,3,A\n/, '\n25,50,3,\n');
    expect(bad).not.toBe(csvText);
    const res = await request(app).post('/api/analyze').send({ ...ivBody, csv: bad });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/^Row 5, column "mode": the unit failed \(status 1\) but its failure mode is empty/);
    const noted = csvText.replace(/\n150,,4,\n/, '\n150,,4,A\n');
    expect(noted).not.toBe(csvText);
    const ok = await request(app).post('/api/analyze').send({ ...ivBody, csv: noted });
    expect(ok.status).toBe(200);
    expect(ok.body.input.warnings.join(' ')).toMatch(/1 unit that did not fail \(status 0\) carries a mode: Row 27 \("A"\)/);
  });
});

describe('readFailureModes (the reader the server uses)', () => {
  const place = { row: (i: number) => i + 2, cell: (i: number) => `Row ${i + 2}`, column: 'mode' };
  it('trims the labels, keeps null for empty cells, lists at most five rows then counts the rest', () => {
    const r = readFailureModes([' a ', '', 'b', 'x', 'x', 'x', 'x', 'x', 'x'], [1, 0, 1, 0, 0, 0, 0, 0, 0], place);
    expect(r.modes).toEqual(['a', null, 'b', 'x', 'x', 'x', 'x', 'x', 'x']);
    expect(r.notes[0]).toBe('Column "mode": 6 units that did not fail (status 0) carry a mode: Row 5 ("x"), Row 6 ("x"), Row 7 ("x"), Row 8 ("x"), Row 9 ("x") and 1 more. A unit that did not fail counts as a suspension for every mode, so its mode is not used.');
    expect(r.notes[1]).toMatch(/^Mode "x" \(column "mode"\) has no failed unit, only 6/);
  });
  it('a mode seen on failed units is not called "no failure" when it also sits on a running unit', () => {
    const r = readFailureModes(['a', 'a'], [1, 0], place);
    expect(r.notes).toHaveLength(1);
    expect(r.notes[0]).toMatch(/1 unit that did not fail \(status 0\) carries a mode: Row 3 \("a"\)/);
  });
  it('a whitespace-only mode on a failed unit is empty', () => {
    expect(() => readFailureModes(['a', '  '], [1, 1], place)).toThrow(/Row 3, column "mode": the unit failed/);
  });
});

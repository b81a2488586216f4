/**
 * Batch runs: every series gets the report a single run gives the same values (same numbers), a
 * series with a bad cell gets an error line and the others are still analysed, and the merge of
 * shard outputs equals the whole run. Series values come from the project's seeded generator (these
 * are properties of the batch machinery, not reference values).
 */
import { describe, expect, it } from 'vitest';
import { runBatch, type BatchArgs } from '../../cli/batch.js';
import { runMerge } from '../../cli/merge.js';
import { analyzeDataset, createRng, summarizeSeries, type SeriesLine } from '../../core/index.js';
import { scratchCsv } from '../helpers/cli.js';

const temp = scratchCsv('plumbline-batch-');

function longCsv(series: Record<string, number[]>): string {
  const lines = ['gauge,peak'];
  for (const [k, vs] of Object.entries(series)) for (const v of vs) lines.push(`${k},${v}`);
  return `${lines.join('\n')}\n`;
}

function seeded(count: number, n: number): Record<string, number[]> {
  const rng = createRng(20261204);
  const out: Record<string, number[]> = {};
  for (let s = 0; s < count; s++) out[`G${s}`] = Array.from({ length: n }, () => Math.round((50 + 20 * rng.normal()) * 1000) / 1000);
  return out;
}

async function batch(args: Partial<BatchArgs> & { file: string }): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const code = await runBatch({ json: true, shard: null, csv: {}, options: {}, ...args }, { out: (s) => (out += s), err: (s) => (err += s) });
  return { code, out, err };
}

const lines = (out: string): SeriesLine[] => out.trim().split('\n').map((l) => JSON.parse(l) as SeriesLine);

describe('plumbline batch (--by / --columns)', () => {
  it('each series gets exactly the single run\'s report for its values', async () => {
    const data = seeded(4, 30);
    const file = temp('long.csv', longCsv(data));
    const options = { families: ['normal', 'lognormal', 'weibull'] as const, seed: 7 };
    const r = await batch({ file, by: 'gauge', column: 'peak', options: { ...options, families: [...options.families] } });
    expect(r.code).toBe(0);
    const got = lines(r.out);
    expect(got.map((l) => l.series).sort()).toEqual(Object.keys(data).sort());
    for (const l of got) {
      if (!('report' in l)) throw new Error(`series ${l.series} failed`);
      const single = analyzeDataset({ values: Float64Array.from(data[l.series] as number[]) }, { ...options, families: [...options.families] });
      // JSON round trip on both sides: the batch line is JSON text.
      expect(l.report).toEqual(JSON.parse(JSON.stringify(single)));
    }
  });

  it("a bad cell faults only its series: an error line naming row, column and value, the rest analysed", async () => {
    const data = seeded(3, 20);
    const text = longCsv(data).replace(/^G1,([0-9.]+)$/m, 'G1,12;5');
    const file = temp('bad.csv', text);
    const r = await batch({ file, by: 'gauge', column: 'peak' });
    expect(r.code).toBe(0);
    const got = lines(r.out);
    const bad = got.find((l) => l.series === 'G1');
    expect(bad && 'error' in bad ? bad.error : null).toMatchObject({ column: 'peak', value: '12;5', row: 22 });
    expect(got.filter((l) => 'report' in l).map((l) => l.series).sort()).toEqual(['G0', 'G2']);
  });

  it('wide tables: one column per series; all-numeric skips text and row-number columns', async () => {
    const file = temp('wide.csv', 'Nr,part,d1,d2\n1,a,10.1,5.2\n2,b,10.3,5.1\n3,c,9.8,\n4,d,10.0,5.3\n5,e,10.2,5.0\n6,f,9.9,5.4\n7,g,10.4,5.2\n8,h,10.1,5.1\n');
    const r = await batch({ file, columns: 'all-numeric', options: { families: ['normal'] } });
    expect(r.code).toBe(0);
    const got = lines(r.out);
    expect(got.map((l) => l.series)).toEqual(['d1', 'd2']);
    expect(got.every((l) => 'report' in l)).toBe(true);
    expect(r.err).toMatch(/"Nr" holds the row numbers/);
    const d2 = got[1] as { report: { n: number } };
    expect(d2.report.n).toBe(7); // the blank cell is no value, not an error
  });

  it('shards partition the series and their merge equals the whole run', async () => {
    const data = seeded(12, 15);
    const file = temp('shards.csv', longCsv(data));
    const whole = await batch({ file, by: 'gauge', column: 'peak', options: { families: ['normal', 'gamma'] } });
    const parts: string[] = [];
    for (let i = 0; i < 3; i++) {
      const r = await batch({ file, by: 'gauge', column: 'peak', options: { families: ['normal', 'gamma'] }, shard: { index: i, count: 3 } });
      parts.push(temp(`part${i}.jsonl`, r.out));
    }
    let merged = '';
    expect(await runMerge({ files: parts, format: 'csv' }, { out: (s) => (merged += s) })).toBe(0);
    const wholeRows = lines(whole.out).map(summarizeSeries).sort((a, b) => (a.series < b.series ? -1 : 1));
    let expected = '';
    await runMerge({ files: [temp('whole.jsonl', whole.out)], format: 'csv' }, { out: (s) => (expected += s) });
    expect(merged).toBe(expected);
    expect(merged.trim().split('\r\n')).toHaveLength(wholeRows.length + 1);
  });

  it('merge refuses a series found twice (overlapping shards)', async () => {
    const data = seeded(2, 12);
    const file = temp('dup.csv', longCsv(data));
    const r = await batch({ file, by: 'gauge', column: 'peak', options: { families: ['normal'] } });
    const a = temp('a.jsonl', r.out);
    await expect(runMerge({ files: [a, a], format: 'text' }, { out: () => {} })).rejects.toThrow(/again in .*overlap/);
  });
});

describe('plumbline analyze --by … --shard I/N as separate processes, joined by plumbline merge', () => {
  it('the union of N shard processes equals the single batch run', async () => {
    const { cli } = await import('../helpers/cli.js');
    const data = seeded(9, 12);
    const file = temp('procs.csv', longCsv(data));
    const common = ['analyze', file, '--by', 'gauge', '--column', 'peak', '--families', 'normal,weibull', '--json'];
    const whole = await cli(...common);
    expect(whole.status, whole.stderr).toBe(0);
    const shards = await Promise.all([0, 1, 2].map((i) => cli(...common, '--shard', `${i}/3`)));
    const files = shards.map((r, i) => {
      expect(r.status, r.stderr).toBe(0);
      return temp(`proc-part${i}.jsonl`, r.stdout);
    });
    const merged = await cli('merge', '--csv', ...files);
    const single = await cli('merge', '--csv', temp('proc-whole.jsonl', whole.stdout));
    expect(merged.status, merged.stderr).toBe(0);
    expect(merged.stdout).toBe(single.stdout);
    // Each series' report is the same object whichever process analysed it.
    const byKey = new Map(lines(whole.stdout).map((l) => [l.series, l]));
    for (const r of shards) for (const l of lines(r.stdout)) expect(l).toEqual(byKey.get(l.series));
  });

  it('refuses a shard index that is not below the count', async () => {
    const { cli } = await import('../helpers/cli.js');
    const file = temp('refuse.csv', longCsv(seeded(2, 10)));
    const r = await cli('analyze', file, '--by', 'gauge', '--shard', '3/3');
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/shard index must be below/);
  });
});

describe('plumbline analyze --by … --regional', () => {
  it('adds the region as one last JSON line that merge passes over, and refuses --shard', async () => {
    const data = seeded(6, 20);
    // Shift to positive flows (the index-flood method scales by the site mean).
    for (const k of Object.keys(data)) data[k] = (data[k] as number[]).map((v) => Math.abs(v) + 10);
    const file = temp('region.csv', longCsv(data));
    const r = await batch({ file, by: 'gauge', column: 'peak', options: { families: ['normal'], returnPeriods: [10, 100] }, regional: true });
    expect(r.code).toBe(0);
    const all = r.out.trim().split('\n').map((l) => JSON.parse(l) as Record<string, unknown>);
    const last = all[all.length - 1] as { region: { sites: unknown[]; growthCurve: { rows: { period: number }[] } } };
    expect(last.region.sites).toHaveLength(6);
    expect(last.region.growthCurve.rows.map((g) => g.period)).toEqual([10, 100]);
    let merged = '';
    expect(await runMerge({ files: [temp('region.jsonl', r.out)], format: 'csv' }, { out: (s) => (merged += s) })).toBe(0);
    expect(merged.trim().split('\r\n')).toHaveLength(7);
    const { cli } = await import('../helpers/cli.js');
    const refused = await cli('analyze', file, '--by', 'gauge', '--regional', '--shard', '0/2');
    expect(refused.status).toBe(2);
    expect(refused.stderr).toMatch(/--regional cannot be combined with --shard/);
  });
});

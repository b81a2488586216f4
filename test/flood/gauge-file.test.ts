/**
 * The peak-file reader (core/gauge/peak-file.ts) on a file written here by hand from the layout
 * description ('#' comments, header, column-format line, tab-separated rows, several codes per
 * field), and end to end on the invented demo gauge (datasets/invented-gauge-peaks.txt).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { readPeakFile } from '../../core/gauge/peak-file.js';
import { fitEma } from '../../core/flood/index.js';

const TEXT = [
  '# made up for this test',
  '#',
  'agency_cd\tsite_no\tpeak_dt\tpeak_tm\tpeak_va\tpeak_cd',
  '5s\t15s\t10d\t6s\t8s\t27s',
  'XX\t1\t1902-04-00\t\t900\t7',
  'XX\t1\t1950-03-12\t\t410\t',
  'XX\t1\t1951-05-02\t\t380\t2,C',
  'XX\t1\t1952-00-00\t\t120\t4',
  'XX\t1\t1953-02-11\t\t1200\t8,Z9',
  'XX\t1\t1954-01-30\t\t\t',
  'XX\t1\t1955-07-19\t\t520\t5,6',
  '',
].join('\n');

describe('peak-file reader', () => {
  const f = readPeakFile(TEXT);
  it('skips comments and the column-format line; reads dates with unknown month/day; a row without a peak is no observation', () => {
    expect(f.comments).toEqual(['made up for this test', '']);
    expect(f.columns).toEqual(['agency_cd', 'site_no', 'peak_dt', 'peak_tm', 'peak_va', 'peak_cd']);
    expect(f.rows.map((r) => r.year)).toEqual([1902, 1950, 1951, 1952, 1953, 1955]);
    expect(f.rows[2]!.codes).toEqual(['2', 'C']);
  });
  it('lists every code found with its count, unknown codes included', () => {
    expect(f.codes.map((c) => `${c.code}:${c.count}`)).toEqual(['2:1', '4:1', '5:1', '6:1', '7:1', '8:1', 'C:1', 'Z9:1']);
    expect(f.codes.find((c) => c.code === 'Z9')!.effect).toMatch(/ignored/);
  });
  it('maps codes to the EMA inputs: 7 historic, 4 below, 8 above; 5, 6, C warn', () => {
    expect(f.record.peaks).toEqual([410, 380, 520]);
    expect(f.record.historicalPeaks).toEqual([900]);
    expect(f.record.intervals).toEqual([
      { lower: 0, upper: 120 },
      { lower: 1200, upper: Infinity },
    ]);
    // Historical period 1902–1949 (48 years), one peak recorded, 47 below its threshold 900.
    expect(f.record.historicalYearsBelow).toEqual({ years: 47, threshold: 900 });
    expect(f.historicalPeriod!.assumed).toBe(true);
    expect(f.warnings.join(' ')).toMatch(/code 5 .*code 6 .*code C/);
  });
  it('a stated perception threshold and start replace the assumption', () => {
    const g = readPeakFile(TEXT, { perceptionThreshold: 800, historicalStart: 1890 });
    expect(g.record.historicalYearsBelow).toEqual({ years: 59, threshold: 800 });
    expect(g.historicalPeriod!.assumed).toBe(false);
  });
  it('refuses a file without the peak column, naming the columns it has', () => {
    expect(() => readPeakFile('a\tb\n1\t2\n')).toThrow(/peak_dt.*peak_va.*a, b/);
  });
});

describe('the invented demo gauge end to end', () => {
  const f = readPeakFile(readFileSync(new URL('../../datasets/invented-gauge-peaks.txt', import.meta.url), 'utf8'));
  it('historic peaks, low outliers (the planted drought years) and a regional skew', () => {
    expect(f.record.historicalPeaks).toHaveLength(3);
    const fit = fitEma({ ...f.record, regionalSkew: { skew: -0.1, mse: 0.12 } });
    expect(fit.converged).toBe(true);
    expect(fit.counts.lowOutliers).toBeGreaterThanOrEqual(2);
    expect(fit.lowOutlierThreshold).toBeGreaterThan(131);
    expect(fit.skew.regionalWeight).toBeGreaterThan(0);
    expect(fit.counts.years).toBe(75 + 62);
  });
});

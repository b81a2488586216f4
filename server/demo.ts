/**
 * The demo datasets: the `*.csv` files directly in `datasets/`, and its tab-separated peak files
 * (`*.txt`, read as flood records) (invented scenarios, documented in
 * datasets/README.md). Only names found by listing that folder are served, so a request can never
 * reach another file (no path traversal). Files are read on request; nothing is written.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { PEAK_COLUMN, looksLikePeakFile, readColumn, readFloodRecord, type DemoEntry, type DemoSettings } from '../core/index.js';

/** The shapes of the demo endpoints are the shared contract (core/api-types.ts). */
export type { DemoEntry, DemoSettings };

/**
 * Chosen for the invented scenarios of datasets/README.md: the bearing test's status column and
 * B10 (the usual bearing rating life), reliability at 1000 h; the river's years, common design
 * return periods including one far beyond the 60-year record; the shaft's drawing tolerance
 * 25 ± 0.010 mm (an invented tolerance) with its subgroups of five; the inspection tally is read as
 * class limits with counts (the page recognises the lower, upper and count columns; no request fields);
 * the seal test opens with its status and failure-mode columns, so it is read as two competing modes.
 */
export const DEMO_SETTINGS: Readonly<Record<string, DemoSettings>> = {
  'bearing-life': {
    column: 'hours',
    fields: { statusColumn: 'status', bLifePercents: [10, 50], reliabilityTimes: [1000], confidence: 0.9 },
    description: 'column hours; status column status (1 = failed, 0 = still running at 2500 h); B10 and B50 lives; reliability at 1000 h; two-sided 90 % bounds',
  },
  'river-peaks': {
    column: 'peak_flow_m3s',
    fields: { families: ['normal', 'lognormal', 'gamma', 'weibull', 'exponential', 'gumbel', 'gev'], orderColumn: 'year', returnPeriods: [2, 10, 50, 100, 200], designLife: 50, plottingPosition: 'gringorten', confidence: 0.9 },
    description: 'column peak_flow_m3s; the five general models plus Gumbel and GEV; year column year (trend check); return periods 2, 10, 50, 100, 200 years; design life 50 years; Gringorten plotting positions; 90 % intervals',
  },
  'inspection-classes': {
    column: 'count',
    fields: {},
    description: 'class limits with counts: lower limit column lower, upper limit column upper, count column count (pit depths in mm); the five general models; the chi-square runs on the classes given',
  },
  'river-daily-flows': {
    column: 'flow_m3s',
    fields: { dateColumn: 'date', threshold: 140, minSeparation: 5, returnPeriods: [2, 10, 50, 100], confidence: 0.9 },
    description: 'column flow_m3s by date column date: peaks over a threshold of 140 m³/s, events at least 5 days apart; return periods 2, 10, 50, 100 years; 90 % intervals',
  },
  'seal-failure-modes': {
    column: 'hours',
    fields: { statusColumn: 'status', modeColumn: 'mode', bLifePercents: [10, 50], confidence: 0.9 },
    description: 'column hours; status column status (1 = failed, 0 = removed unfailed); failure-mode column mode (leak or crack): each mode fitted with the other as suspensions, the seal as the earlier of the two; B10 and B50 lives per mode and for the seal; two-sided 90 % bounds',
  },
  'invented-gauge-peaks': {
    column: PEAK_COLUMN,
    fields: { regionalSkew: -0.1, regionalSkewMse: 0.12, returnPeriods: [2, 5, 10, 25, 50, 100, 200, 500], confidence: 0.9 },
    description:
      'a peak file (tab-separated, # comments, qualification codes) read as one flood record: log-Pearson III by expected moments with the historic peaks, the peaks known only below or above a value and the low outliers; invented regional skew −0.10 with mean square error 0.12; return periods 2 to 500 years; 90 % intervals',
  },
  'pump-seal-wear': {
    column: 'wear_um',
    fields: { usl: 120, naturalLowerBound: 0, confidence: 0.9 },
    description: 'column wear_um; invented wear limit 120 µm, an upper limit only, and a natural lower bound of 0 µm (wear cannot be negative); 90 % intervals',
  },
  'shaft-diameter': {
    column: 'diameter_mm',
    fields: { subgroupColumn: 'subgroup', lsl: 24.99, usl: 25.01, target: 25, confidence: 0.9 },
    description: 'column diameter_mm; subgroup column subgroup (five parts each); invented tolerance 25 ± 0.010 mm (LSL 24.99, USL 25.01, target 25); 90 % intervals',
  },
};

export interface DemoFile extends DemoEntry {
  readonly csv: string;
}

const NAME_RE = /^[A-Za-z0-9_-]+$/;
/** Largest demo file served (the demos are small; this only guards against a stray big file). */
const MAX_DEMO_BYTES = 20 * 1024 * 1024;

/**
 * The value column of a demo file: the rightmost numeric column that looks like a measurement,
 * i.e. is neither a counter or index (its distinct values are consecutive whole numbers: unit
 * numbers, years in sequence, subgroup numbers) nor a flag (at most two distinct values, e.g. a
 * censoring status). Falls back to the rightmost numeric column, then the first. Common practice,
 * no source.
 */
export function guessValueColumn(csv: string): { columns: string[]; defaultColumn: string } {
  const first = readColumn(csv, { column: 1, skipInvalid: true });
  const columns = first.header.length > 0 ? [...first.header] : [first.column];
  let measurement: string | null = null;
  let numeric: string | null = null;
  columns.forEach((name, j) => {
    const label = name === '' ? `#${j + 1}` : name;
    let distinct: number[];
    try {
      const r = readColumn(csv, { column: j + 1, skipInvalid: true });
      // A column that is mostly not numbers is not a value column.
      if (r.values.length === 0 || r.values.length < r.rowsRead / 2) return;
      distinct = [...new Set(r.values)].sort((a, b) => a - b);
    } catch {
      return;
    }
    numeric = label;
    const counter = distinct.every((v, i) => Number.isInteger(v) && (i === 0 || v === (distinct[i - 1] as number) + 1));
    if (!counter && distinct.length > 2) measurement = label;
  });
  return { columns, defaultColumn: measurement ?? numeric ?? columns[0] ?? '#1' };
}

export class DemoStore {
  readonly dir: string;
  constructor(dir: string) {
    this.dir = dir;
  }

  private names(): Map<string, string> {
    const out = new Map<string, string>();
    let files: string[];
    try {
      files = readdirSync(this.dir);
    } catch {
      return out;
    }
    for (const f of files.sort()) {
      // CSV files, and the tab-separated peak files (.txt) of a flood record.
      if (!f.endsWith('.csv') && !f.endsWith('.txt')) continue;
      const name = f.slice(0, -4);
      if (out.has(name)) continue;
      if (!NAME_RE.test(name)) continue;
      try {
        const st = statSync(join(this.dir, f));
        if (st.isFile() && st.size <= MAX_DEMO_BYTES) out.set(name, f);
      } catch {
        // vanished between listing and stat: skip it
      }
    }
    return out;
  }

  list(): DemoEntry[] {
    const out: DemoEntry[] = [];
    for (const name of this.names().keys()) {
      const d = this.get(name);
      if (d) out.push({ name: d.name, file: d.file, bytes: d.bytes, columns: d.columns, defaultColumn: d.defaultColumn, ...(d.settings ? { settings: d.settings } : {}) });
    }
    return out;
  }

  /** The dataset called `name` (file name without .csv), or null when there is none. */
  get(name: string): DemoFile | null {
    if (!NAME_RE.test(name)) return null;
    const file = this.names().get(name);
    if (file === undefined) return null;
    let csv: string;
    try {
      csv = readFileSync(join(this.dir, file), 'utf8');
    } catch {
      return null;
    }
    let meta: { columns: string[]; defaultColumn: string };
    try {
      if (looksLikePeakFile(csv)) meta = { columns: [...readFloodRecord(csv).file.columns], defaultColumn: PEAK_COLUMN };
      else if (file.endsWith('.txt')) return null; // a text file that is not a peak file is not a demo
      else meta = guessValueColumn(csv);
    } catch {
      meta = { columns: [], defaultColumn: '#1' };
    }
    const settings = DEMO_SETTINGS[name];
    return { name, file, bytes: Buffer.byteLength(csv), columns: meta.columns, defaultColumn: meta.defaultColumn, ...(settings ? { settings } : {}), csv };
  }
}

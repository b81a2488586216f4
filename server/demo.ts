/**
 * The demo datasets: the `*.csv` files directly in `datasets/` (invented scenarios, documented in
 * datasets/README.md). Only names found by listing that folder are served, so a request can never
 * reach another file (no path traversal). Files are read on request; nothing is written.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { readColumn } from '../core/index.js';

export interface DemoEntry {
  readonly name: string;
  readonly file: string;
  readonly bytes: number;
  readonly columns: readonly string[];
  readonly defaultColumn: string;
}

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
      if (!f.endsWith('.csv')) continue;
      const name = f.slice(0, -4);
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
      if (d) out.push({ name: d.name, file: d.file, bytes: d.bytes, columns: d.columns, defaultColumn: d.defaultColumn });
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
      meta = guessValueColumn(csv);
    } catch {
      meta = { columns: [], defaultColumn: '#1' };
    }
    return { name, file, bytes: Buffer.byteLength(csv), columns: meta.columns, defaultColumn: meta.defaultColumn, csv };
  }
}

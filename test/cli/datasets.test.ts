import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { readColumn, readColumns } from '../../core/index.js';

const root = fileURLToPath(new URL('../../', import.meta.url));
const datasets = join(root, 'datasets');

describe('datasets/', () => {
  it('the committed files are exactly what the seeded generator writes', () => {
    // Source: DEVELOPERS.md (demo data come from a committed seeded script); byte comparison, no tolerance.
    const out = mkdtempSync(join(tmpdir(), 'plumbline-datasets-'));
    const r = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/make-datasets.ts', out], { cwd: root, encoding: 'utf8' });
    expect(r.status, r.stderr).toBe(0);
    const written = readdirSync(out).sort();
    expect(written).toEqual(readdirSync(datasets).filter((f) => f.endsWith('.csv')).sort());
    for (const f of written) expect(readFileSync(join(out, f), 'utf8'), f).toBe(readFileSync(join(datasets, f), 'utf8'));
  });

  it('aircondit.csv holds the 12 published Proschan (1963) intervals', () => {
    // Source: Proschan (1963) Technometrics 5:375-383, values as listed in shared/references.md.
    const r = readColumn(readFileSync(join(datasets, 'aircondit.csv'), 'utf8'), { column: 'hours' });
    expect([...r.values]).toEqual([3, 5, 7, 18, 43, 85, 91, 98, 100, 130, 230, 487]);
  });

  it('the documented columns are there and read without skipping', () => {
    // Source: datasets/README.md (columns, sizes, status coding 1 = failed, 0 = running).
    const read = (f: string, cols: string[]) =>
      readColumns(
        readFileSync(join(datasets, f), 'utf8'),
        cols.map((c) => ({ select: c, kind: 'number' as const })),
      );
    const bearing = read('bearing-life.csv', ['hours', 'status']);
    expect(bearing.rowsRead).toBe(30);
    const status = bearing.columns[1];
    expect(status?.kind === 'number' && [...status.values].every((s) => s === 0 || s === 1)).toBe(true);
    expect(read('river-peaks.csv', ['year', 'peak_flow_m3s']).rowsRead).toBe(60);
    expect(read('shaft-diameter.csv', ['subgroup', 'diameter_mm']).rowsRead).toBe(125);
    expect(read('pump-seal-wear.csv', ['wear_um']).rowsRead).toBe(80);
    for (const t of [bearing]) expect(t.skipped).toEqual([]);
  });
});

/**
 * Times the CSV reader on a 10^6-row, two-column text (about 19 MB) built in memory from a
 * seeded generator, and checks the values against `Number()` of the same cells.
 * Run: node --import tsx scripts/bench-csv.ts [rows]
 */
import { createRng } from '../core/random/index.js';
import { readColumn, readColumns } from '../core/csv/index.js';

const rows = Number(process.argv[2] ?? 1_000_000);
const rng = createRng(20261201);
const parts: string[] = ['part_id,diameter_mm\n'];
const expected = new Float64Array(rows);
for (let r = 0; r < rows; r++) {
  const v = 25 + 0.004 * rng.normal();
  const s = v.toFixed(6 + (r % 5)); // 6 to 10 decimals: fast path and the fallback both exercised
  expected[r] = Number(s);
  parts.push(`P${r + 1},${s}\n`);
}
const text = parts.join('');
console.log(`text: ${rows} rows, ${(text.length / 1e6).toFixed(1)} MB`);

/** Median wall and CPU time of `reps` runs (CPU time is less disturbed by other processes). */
function time(label: string, f: () => void, reps = 7): void {
  const wall: number[] = [];
  const cpu: number[] = [];
  for (let k = 0; k < reps; k++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    f();
    wall.push(performance.now() - t0);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1000);
  }
  const median = (xs: number[]): string => (xs.sort((a, b) => a - b)[reps >> 1] as number).toFixed(1);
  console.log(`${label}: median wall ${median(wall)} ms, median CPU ${median(cpu)} ms (${reps} runs)`);
}

let result = readColumn(text, { column: 'diameter_mm' });
let mismatches = 0;
for (let r = 0; r < rows; r++) if (!Object.is(result.values[r], expected[r])) mismatches++;
console.log(`values: ${result.values.length}, mismatches against Number(): ${mismatches}`);

time('readColumn (one numeric column)', () => {
  result = readColumn(text, { column: 'diameter_mm' });
});
time('readColumns (number + text)', () => {
  readColumns(text, [
    { select: 'diameter_mm', kind: 'number' },
    { select: 'part_id', kind: 'text' },
  ]);
});
time('baseline: split lines + Number()', () => {
  const lines = text.split('\n');
  const out = new Float64Array(lines.length);
  for (let k = 1; k < lines.length; k++) out[k] = Number(lines[k]!.split(',')[1]);
});

/**
 * Reads test/fixtures/special.json (made by scripts/fixtures/special.py from SciPy 1.17.1 and
 * mpmath 1.3.0 at 50 digits; each case names its source) and measures relative errors.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

export type Case = [number, ...(number | string)[]];
export interface Section {
  source: string;
  cases: (number | string)[][];
}

const path = fileURLToPath(new URL('../fixtures/special.json', import.meta.url));
export const fixtures = JSON.parse(readFileSync(path, 'utf8')) as Record<string, Section>;

export function section(name: string): Section {
  const s = fixtures[name];
  if (!s) throw new Error(`fixture section ${name} missing: regenerate test/fixtures/special.json`);
  return s;
}

/** Relative error |got − want| / |want| (absolute when want is 0); Infinity when got is NaN. */
export function relErr(got: number, want: number): number {
  if (Number.isNaN(got)) return Number.POSITIVE_INFINITY;
  if (got === want) return 0;
  return want === 0 ? Math.abs(got) : Math.abs(got - want) / Math.abs(want);
}

/** Worst relative error over a list of [label, got, want, tol] and the offending rows. */
export function worst(rows: { label: string; got: number; want: number; tol: number }[]): {
  max: number;
  failures: string[];
} {
  let max = 0;
  const failures: string[] = [];
  for (const r of rows) {
    const e = relErr(r.got, r.want);
    if (e > max) max = e;
    if (!(e <= r.tol)) failures.push(`${r.label}: got ${r.got}, want ${r.want}, rel ${e.toExponential(2)} > ${r.tol}`);
  }
  return { max, failures };
}

/** DEVELOPERS.md tolerance policy: 1e-12 relative where the value is well conditioned. */
export const TOL = 1e-12;

/**
 * prepareSample's radix sort (n >= 4096) gives exactly the order of Float64Array.prototype.sort
 * (ECMA-262 §23.2.3.29: numeric, −0 before +0), element for element, on awkward data.
 */
import { describe, expect, it } from 'vitest';
import { createRng, prepareSample } from '../../core/index.js';

function check(values: Float64Array): void {
  const expected = Float64Array.from(values).sort();
  const got = prepareSample(values).sorted;
  expect(got.length).toBe(expected.length);
  for (let i = 0; i < got.length; i++) if (!Object.is(got[i], expected[i])) throw new Error(`index ${i}: ${got[i]} vs ${expected[i]}`);
}

describe('prepareSample sorts like the built-in sort', () => {
  it('mixed signs, ±0, ties, subnormals, huge values (n = 5000 and 100000)', () => {
    const rng = createRng(11);
    for (const n of [5000, 100_000]) {
      const v = new Float64Array(n);
      for (let i = 0; i < n; i++) {
        const u = rng.uniform();
        v[i] =
          u < 0.1 ? 0 : u < 0.15 ? -0 : u < 0.2 ? 5e-324 * Math.floor(1 + 10 * rng.uniform()) : u < 0.25 ? -1.7e308 * rng.uniform() : u < 0.5 ? Math.round(rng.normal() * 3) : rng.normal() * 1e6;
      }
      check(v);
    }
  });

  it('does not change the caller’s values', () => {
    const rng = createRng(12);
    const v = Float64Array.from({ length: 6000 }, () => rng.normal());
    const copy = Float64Array.from(v);
    prepareSample(v);
    expect(v).toEqual(copy);
  });
});

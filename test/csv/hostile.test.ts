import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { InputError, readColumn } from '../../core/index.js';

// Text made mostly of the characters that matter to a CSV scanner, plus anything else.
const csvChar = fc.oneof(
  { weight: 6, arbitrary: fc.constantFrom(',', ';', '\t', '"', '\n', '\r', ' ', '.', '-', 'e', 'N', 'A', '0', '1', '5', '9') },
  { weight: 1, arbitrary: fc.string({ unit: 'binary', minLength: 1, maxLength: 1 }) },
);
const csvText = fc.array(csvChar, { maxLength: 200 }).map((cs) => cs.join(''));

describe('hostile input', () => {
  it('never crashes: any text gives a result or an InputError with a message', () => {
    // Source: issue 6 (never crash; one clear error); common practice, no source.
    fc.assert(
      fc.property(csvText, fc.boolean(), fc.constantFrom<'.' | ','>('.', ','), (text, skipInvalid, decimal) => {
        try {
          const r = readColumn(text, { column: 1, skipInvalid, decimal });
          for (const v of r.values) if (!Number.isFinite(v)) return false;
          const dropped = r.skipped.reduce((a, s) => a + s.count, 0);
          // Nothing dropped without being counted.
          return r.values.length + dropped === r.rowsRead && (skipInvalid || dropped === 0);
        } catch (e) {
          return e instanceof InputError && e.message.length > 0;
        }
      }),
      { seed: 6, numRuns: 3000 },
    );
  });

  it('keeps extreme magnitudes exactly and refuses what overflows', () => {
    // Source: IEEE 754 binary64 (1e-300 and 1e300 are normal numbers; 1e309 overflows).
    const r = readColumn('x\n1e-300\n1e300\n-2.5e-308\n1.7976931348623157e308\n');
    expect([...r.values]).toEqual([1e-300, 1e300, -2.5e-308, 1.7976931348623157e308]);
    expect(() => readColumn('x\n1e309\n')).toThrow(InputError);
  });
});

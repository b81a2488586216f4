import { describe, expect, it } from 'vitest';
import { OPTION_COMBINATIONS, OPTION_TABLE, checkCombinations, optionTableProblems, parseJsonOption, type OptionSpec } from '../../core/index.js';

// The table's own soundness: common practice, no source (one name and one flag per option; a
// default that its own rule refuses would make the docs lie).
describe('the option table', () => {
  it('has no repeated name or flag and every entry is well formed', () => {
    expect(optionTableProblems()).toEqual([]);
  });

  it('finds a repeated name and a choice without choices (the check can fail)', () => {
    const a = OPTION_TABLE[0] as OptionSpec;
    const broken: OptionSpec[] = [a, { ...a, cli: '--other' }, { ...a, name: 'pick', cli: '--pick', kind: 'choice' }];
    const problems = optionTableProblems(broken);
    expect(problems.some((p) => /declared twice/.test(p))).toBe(true);
    expect(problems.some((p) => /needs choices/.test(p))).toBe(true);
  });

  it('every default passes its own JSON rule', () => {
    for (const spec of OPTION_TABLE) {
      const r = parseJsonOption(spec, spec.default);
      expect(r.ok, `${spec.name}: ${r.ok ? '' : r.message}`).toBe(true);
    }
  });

  it('every combination rule names options of the table', () => {
    expect(() => checkCombinations(new Map(), 'cli')).not.toThrow();
    expect(() => checkCombinations(new Map(), 'api')).not.toThrow();
    expect(OPTION_COMBINATIONS.length).toBeGreaterThan(10);
  });
});

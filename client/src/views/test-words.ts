/** The goodness-of-fit tests in words (the report carries their ids: 'chi-square', 'anderson-darling'). */
const WORDS: Readonly<Record<string, string>> = { 'chi-square': 'the chi-square test', 'anderson-darling': 'the Anderson–Darling test' };

/** "the chi-square test and the Anderson–Darling test" for a candidate's rejectedBy list. */
export function testWords(tests: readonly string[]): string {
  return tests.map((t) => WORDS[t] ?? t).join(' and ');
}

/** The tests' short names for a table cell ("chi-square and Anderson–Darling"): the core's words. */
export { testNames } from '../../../core/format/index.js';

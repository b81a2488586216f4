/** The goodness-of-fit tests in words (the report carries their ids: 'chi-square', 'anderson-darling'). */
const WORDS: Readonly<Record<string, string>> = { 'chi-square': 'the chi-square test', 'anderson-darling': 'the Anderson–Darling test' };

/** "the chi-square test and the Anderson–Darling test" for a candidate's rejectedBy list. */
export function testWords(tests: readonly string[]): string {
  return tests.map((t) => WORDS[t] ?? t).join(' and ');
}

/** The tests' short names for a table cell: "chi-square and Anderson–Darling". */
const NAMES: Readonly<Record<string, string>> = { 'chi-square': 'chi-square', 'anderson-darling': 'Anderson–Darling' };
export function testNames(tests: readonly string[]): string {
  return tests.map((t) => NAMES[t] ?? t).join(' and ');
}

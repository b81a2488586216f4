/**
 * The goodness-of-fit tests by name, for people: the report carries their ids ('chi-square',
 * 'anderson-darling'); the CLI, the page and the printed report say them with these words.
 */
const NAMES: Readonly<Record<string, string>> = { 'chi-square': 'chi-square', 'anderson-darling': 'Anderson–Darling' };

/** "chi-square and Anderson–Darling" for a list of test ids (an unknown id is kept as it is). */
export function testNames(tests: readonly string[]): string {
  return tests.map((t) => NAMES[t] ?? t).join(' and ');
}

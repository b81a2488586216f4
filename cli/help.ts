/** The text of `plumbline --help`. */
import { DEFAULT_FAMILIES, allFamilies } from '../core/index.js';

export function helpText(): string {
  const known = allFamilies().map((f) => f.name).join(', ');
  return `plumbline: fit continuous probability models to a column of measurements, test each fit,
and rank the candidates.

Usage
  plumbline analyze FILE.csv [--column NAME|INDEX] [options]
  plumbline --help
  plumbline --version

FILE is a CSV file with a header row (comma, semicolon or tab separated, detected), or - to read
standard input.

Options
  --column NAME|INDEX    the value column: a header name (exact, then ignoring case; quote names
                         with spaces) or a 1-based index. May be left out for a one-column file.
  --json                 print one JSON report on standard output instead of the text report
  --families LIST        candidate models, comma-separated (default: ${DEFAULT_FAMILIES.join(',')});
                         known: ${known}
  --alpha A              significance level of the fit tests, 0 < A < 1 (default 0.05)
  --bins K               number of equiprobable chi-square bins (default: chosen by rule); refused
                         with the largest allowed K if some bin would expect fewer than 5 values
  --p-method METHOD      Anderson-Darling p-values: table (published tables, the default) or
                         bootstrap (parametric bootstrap, refitting every replicate)
  --replicates B         bootstrap replicates (default 999)
  --seed S               bootstrap seed, a whole number (default fixed, so runs repeat exactly)
  --skip-invalid         drop rows whose value is blank, a missing-value marker (NA, n/a, -),
                         NaN, infinite or not a number, and report how many were dropped and why;
                         without it such a cell stops the run with its row, column and value
  --decimal-comma        numbers use a decimal comma (1,5); never guessed
  --delimiter X          field delimiter: one character, or tab, comma, semicolon
  --no-header            the first line is data; columns are then #1, #2, ...

Exit status
  0 success, 2 a problem with the input or the options (one line on standard error),
  70 an internal error (please report it).

Results that feed safety decisions (a part's life, a design flood, a critical dimension) need review
by a qualified person under the governing codes and standards.
`;
}

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

Life data (a status column: 1 = failed, 0 = still running or removed unfailed)
  --censor-column NAME   the status column; the value column holds the times. Fits by censored
                         maximum likelihood; n counts all units
  --b-life LIST          B-lives to report, percents, e.g. 1,10,50 (default 10)
  --reliability-at LIST  times at which to report the reliability with its bounds, e.g. 500,1000
  --bounds lr|fisher     likelihood-ratio (default) or Fisher-matrix bounds
  --confidence C         two-sided level of every interval, 0 < C < 1 (default 0.90)

Flood frequency (annual maxima)
  --return-periods LIST  return periods in years, each > 1, e.g. 2,10,100; adds gumbel and gev to
                         the default models
  --design-life L        years: the chance of at least one exceedance of each return level
  --plotting-position P  weibull (i/(n+1), default), gringorten or cunnane

Process capability
  --lsl A, --usl B       specification limits (one or both)
  --target T             target value (Cpm, with both limits)
  --subgroup-column NAME subgroup labels: Cp and Cpk from the within-subgroup sigma

Trend
  --order-column NAME    time or year of each value (distinct): Mann-Kendall test and Sen's slope
  --trend                the same on the rows in their file order

Grouped counts
  --grouped              the file holds classes: columns lower, upper, count (by default), or
  --lower-column NAME, --upper-column NAME, --count-column NAME

Exit status
  0 success, 2 a problem with the input or the options (one line on standard error),
  70 an internal error (please report it).

Results that feed safety decisions (a part's life, a design flood, a critical dimension) need review
by a qualified person under the governing codes and standards.
`;
}

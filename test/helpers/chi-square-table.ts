/**
 * Upper critical values of chi-square at α = 0.10, 0.05, 0.01, from ../shared/references.md
 * (SciPy chi2.ppf, agreeing with NIST/SEMATECH e-Handbook §1.3.6.7.4), printed to 4 decimals.
 * Rows: [degrees of freedom, c(0.10), c(0.05), c(0.01)].
 */
export const CHI_SQUARE_UPPER_CRITICAL: readonly (readonly [number, number, number, number])[] = [
  [1, 2.7055, 3.8415, 6.6349],
  [2, 4.6052, 5.9915, 9.2103],
  [3, 6.2514, 7.8147, 11.3449],
  [5, 9.2364, 11.0705, 15.0863],
  [6, 10.6446, 12.5916, 16.8119],
  [10, 15.9872, 18.307, 23.2093],
  [29, 39.0875, 42.557, 49.5879],
];

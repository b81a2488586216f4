/** Formatting numbers and p-values for people (the CLI, the page, the report strings): one formatter. */
export { formatNumber } from './number.js';
export { formatPValue, pValueText } from './p-value.js';
export type { PValueKind, PValueResult } from './p-value.js';
export { testNames } from './test-names.js';

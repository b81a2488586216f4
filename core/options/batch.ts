/** Batch options (several columns or files in one run). None yet: the batch work adds them here. */
import type { OptionSpec } from './spec.js';

export const BATCH_OPTIONS: readonly OptionSpec[] = [];

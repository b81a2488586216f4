/**
 * core/csv: the CSV reader's one public entry. Pure: works on a string already in memory.
 */
export { readColumn, readColumns } from './column.js';
export { parseStrictNumber } from './number.js';
export { delimiterName } from './delimiter.js';
export { REASON_WORDS as SKIP_REASON_WORDS } from './classify.js';
export type * from './types.js';
export { ColumnPieces, lastRecordEnd } from './pieces.js';

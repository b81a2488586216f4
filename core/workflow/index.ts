/** core/workflow: one call that composes the trade workflows into one report (issue 4). */
export type * from './types.js';

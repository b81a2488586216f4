/**
 * The decision area for the selected model: the trade sections of the registry (views/sections.ts)
 * as blocks, and the answer sentence for the top of the page (views/answer.ts). A facade kept so
 * the page, the report and the tests have one entry.
 */
import type { DatasetReport } from '../../core/index.js';
import { capital } from './families.js';
import { answerFor } from './views/answer.js';
import type { SectionBlock } from './views/block.js';
import { sectionBlocks } from './views/sections.js';

export { capital };
export { blockHtml, blockNode } from './views/block.js';
export type { BlockLine as DecisionLine, BlockTable as DecisionTable, ChartSlot, SectionBlock as DecisionBlock } from './views/block.js';

/** The blocks to show, in registry order, for the selected candidate. Empty when the report has no trade section. */
export function decisionBlocks(r: DatasetReport, selected: string | null, units: string): SectionBlock[] {
  const found = r.candidates.find((x) => x.family === selected) ?? r.candidates[0];
  return sectionBlocks({ report: r, selected: found ? { ...found, label: capital(found.label) } : undefined, units: units.trim() });
}

/** The answer sentence alone (null when the report has no decision number). */
export function headline(r: DatasetReport, selected: string | null, units: string): string | null {
  return answerFor(r, selected, units)?.sentence ?? null;
}

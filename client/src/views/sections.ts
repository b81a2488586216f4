/**
 * The registry of trade sections on the page and in the exported report: a report section key
 * mapped to its pure view (views/block.ts SectionView). To add a section: write one file
 * views/<key>.ts exporting a SectionView and add one line here. The order here is the order on
 * screen; "what would change the answer" (sensitivity) comes after the sections it compares.
 */
import type { SectionBlock, SectionInput, SectionView } from './block.js';
import { capabilitySection } from './capability.js';
import { floodSection } from './flood.js';
import { floodEstimatorsSection } from './flood-estimators.js';
import { floodPotSection } from './flood-pot.js';
import { floodRecordSection } from './flood-record.js';
import { lifeSection } from './life.js';
import { lifeRecordedSection } from './life-recorded.js';
import { modesSection } from './modes.js';
import { sensitivitySection } from './sensitivity.js';
import { trendSection } from './trend.js';

export const SECTIONS: readonly { readonly key: string; readonly view: SectionView }[] = [
  { key: 'life', view: lifeSection },
  { key: 'modes', view: modesSection },
  { key: 'life-recorded', view: lifeRecordedSection },
  { key: 'flood', view: floodSection },
  { key: 'flood-estimators', view: floodEstimatorsSection },
  { key: 'pot', view: floodPotSection },
  { key: 'flood-record', view: floodRecordSection },
  { key: 'capability', view: capabilitySection },
  { key: 'trend', view: trendSection },
  { key: 'sensitivity', view: sensitivitySection },
];

/** Every section the report carries, in registry order. */
export function sectionBlocks(input: SectionInput): SectionBlock[] {
  return SECTIONS.map((s) => s.view(input)).filter((b): b is SectionBlock => b !== null);
}

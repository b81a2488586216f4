/**
 * Parsed options → the core's DatasetOptions: every option of an analysis section (not the input,
 * the output or the batch orchestration) that is not a column, under its core name (`coreName`, e.g. replicates →
 * bootstrapReplicates). The one place where an option's name and the core's key may differ.
 */
import type { DatasetOptions } from '../workflow/index.js';
import type { OptionValue } from './spec.js';
import { OPTION_TABLE, sectionOf } from './table.js';

export function datasetOptionsFrom(given: ReadonlyMap<string, OptionValue>): DatasetOptions {
  const out: Record<string, OptionValue> = {};
  for (const spec of OPTION_TABLE) {
    const section = sectionOf(spec);
    if (section === 'input' || section === 'output' || section === 'batch' || spec.kind === 'column' || spec.kind === 'columns') continue;
    const v = given.get(spec.name);
    if (v === undefined || v === null) continue;
    if (spec.kind === 'boolean' && v === false) continue;
    out[spec.coreName ?? spec.name] = v;
  }
  return out as DatasetOptions;
}

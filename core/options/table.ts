/**
 * The table of every analysis option: the section files concatenated. Each trade adds its options
 * to its own section file; nothing else lists options or their limits.
 */
import { CAPABILITY_OPTIONS } from './capability.js';
import { BATCH_OPTIONS } from './batch.js';
import { FITTING_OPTIONS } from './fitting.js';
import { FLOOD_OPTIONS } from './flood.js';
import { INPUT_OPTIONS } from './input.js';
import { LIFE_OPTIONS } from './life.js';
import { OUTPUT_OPTIONS } from './output.js';
import type { OptionSpec, OptionSurface } from './spec.js';
import { TREND_OPTIONS } from './trend.js';

/** The sections, in the order --help and the docs list them. */
export const OPTION_SECTIONS = {
  input: INPUT_OPTIONS,
  fitting: FITTING_OPTIONS,
  life: LIFE_OPTIONS,
  flood: FLOOD_OPTIONS,
  capability: CAPABILITY_OPTIONS,
  trend: TREND_OPTIONS,
  batch: BATCH_OPTIONS,
  output: OUTPUT_OPTIONS,
} as const;

export type OptionSection = keyof typeof OPTION_SECTIONS;

/** Every option, section by section. */
export const OPTION_TABLE: readonly OptionSpec[] = Object.values(OPTION_SECTIONS).flat();

const BY_NAME = new Map(OPTION_TABLE.map((s) => [s.name, s]));

/** The option called `name`, or undefined. */
export function optionNamed(name: string): OptionSpec | undefined {
  return BY_NAME.get(name);
}

/** Whether the option exists on the CLI or the API (both unless `surfaces` says otherwise). */
export function onSurface(spec: OptionSpec, surface: OptionSurface): boolean {
  return spec.surfaces === undefined || spec.surfaces.includes(surface);
}

/** The options of one surface, in table order. */
export function optionsOn(surface: OptionSurface): readonly OptionSpec[] {
  return OPTION_TABLE.filter((s) => onSurface(s, surface));
}

/** The option's JSON field path, e.g. 'alpha' or 'csvOptions.delimiter'. */
export function jsonField(spec: OptionSpec): string {
  return spec.jsonParent === undefined ? spec.name : `${spec.jsonParent}.${spec.name}`;
}

/** The section an option is declared in. */
export function sectionOf(spec: OptionSpec): OptionSection {
  for (const [section, list] of Object.entries(OPTION_SECTIONS)) if (list.includes(spec)) return section as OptionSection;
  throw new Error(`option ${spec.name} is in no section`);
}

/**
 * Problems with the table itself (a repeated name or flag, a default its own rule refuses, a choice
 * option without choices...), in words; empty when the table is sound. Checked by a test.
 */
export function optionTableProblems(table: readonly OptionSpec[] = OPTION_TABLE): string[] {
  const problems: string[] = [];
  const names = new Set<string>();
  const flags = new Set<string>();
  for (const s of table) {
    if (!/^[a-z][A-Za-z0-9]*$/.test(s.name)) problems.push(`${s.name}: the name is not camelCase`);
    if (!/^--[a-z][a-z0-9-]*$/.test(s.cli)) problems.push(`${s.name}: the flag ${s.cli} is not --lower-case-words`);
    if (names.has(s.name)) problems.push(`${s.name}: the name is declared twice`);
    if (flags.has(s.cli)) problems.push(`${s.name}: the flag ${s.cli} is declared twice`);
    names.add(s.name);
    flags.add(s.cli);
    if ((s.kind === 'choice' || s.kind === 'choices') && (s.choices === undefined || s.choices.length === 0)) problems.push(`${s.name}: a ${s.kind} option needs choices`);
    if (s.cliFlagValue !== undefined && s.kind !== 'boolean' && s.kind !== 'choice') problems.push(`${s.name}: only a boolean or a choice can be a CLI flag`);
    if (s.help.trim() === '') problems.push(`${s.name}: no help`);
  }
  return problems;
}

/**
 * The models the page offers, with their one label: the core family registry's own label
 * (core/families), capitalised only where it starts a sentence or a cell. Nothing here restates a
 * model's name by hand, so the page, the report and the CLI name a model the same way.
 */
import { allFamilies, DEFAULT_FAMILIES } from '../../core/index.js';
import type { FamilyName } from './types.js';

/** A label with a capital first letter (it starts a cell, a heading or a sentence). */
export const capital = (label: string): string => (label ? label[0]!.toUpperCase() + label.slice(1) : label);

export const FAMILY_CHOICES: readonly { readonly name: FamilyName; readonly label: string; readonly byDefault: boolean }[] = allFamilies().map((f) => ({
  name: f.name,
  label: capital(f.label),
  byDefault: DEFAULT_FAMILIES.includes(f.name),
}));

/** The one label of a model by its family name (capitalised), or the name itself for an unknown one. */
export function modelLabel(family: string): string {
  return FAMILY_CHOICES.find((f) => f.name === family)?.label ?? family;
}

/** Families ticked when return periods are first given (the flood section's own models). */
export const FLOOD_FAMILIES: readonly FamilyName[] = ['gumbel', 'gev'];

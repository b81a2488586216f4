/**
 * The family registry: the one public entry of core/families.
 */
import type { Family, FamilyName } from './types.js';

export type * from './types.js';

const registry = new Map<FamilyName, Family>();

/** Register a family (called once by each family module's import below). */
export function registerFamily(f: Family): void {
  registry.set(f.name, f);
}

export function getFamily(name: FamilyName): Family {
  const f = registry.get(name);
  if (!f) throw new Error(`unknown family ${name}`);
  return f;
}

export function allFamilies(): Family[] {
  return [...registry.values()];
}

/** The default candidate set for a complete sample. */
export const DEFAULT_FAMILIES: readonly FamilyName[] = ['normal', 'lognormal', 'gamma', 'weibull', 'exponential'];

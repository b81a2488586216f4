/**
 * Display names of the families the page offers (the report carries each candidate's own
 * label; this list is only for the check boxes before any report exists).
 */
import type { FamilyName } from './types.js';

export const FAMILY_CHOICES: readonly { readonly name: FamilyName; readonly label: string; readonly byDefault: boolean }[] = [
  { name: 'normal', label: 'Normal', byDefault: true },
  { name: 'lognormal', label: 'Lognormal', byDefault: true },
  { name: 'gamma', label: 'Gamma', byDefault: true },
  { name: 'weibull', label: 'Weibull', byDefault: true },
  { name: 'exponential', label: 'Exponential', byDefault: true },
  // Trade families (issue 4): extreme-value ones for annual maxima, threshold ones for life data.
  { name: 'gumbel', label: 'Gumbel', byDefault: false },
  { name: 'gev', label: 'GEV', byDefault: false },
  { name: 'weibull3', label: 'Weibull, threshold', byDefault: false },
  { name: 'lognormal3', label: 'Lognormal, threshold', byDefault: false },
];

/** Families ticked when return periods are first given (the flood section's own models). */
export const FLOOD_FAMILIES: readonly FamilyName[] = ['gumbel', 'gev'];

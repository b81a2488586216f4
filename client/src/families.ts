/**
 * Display names of the families the page offers (the report carries each candidate's own
 * label; this list is only for the check boxes before any report exists).
 */
import type { FamilyName } from './types.js';

export const FAMILY_CHOICES: readonly { readonly name: FamilyName; readonly label: string }[] = [
  { name: 'normal', label: 'Normal' },
  { name: 'lognormal', label: 'Lognormal' },
  { name: 'gamma', label: 'Gamma' },
  { name: 'weibull', label: 'Weibull' },
  { name: 'exponential', label: 'Exponential' },
];
